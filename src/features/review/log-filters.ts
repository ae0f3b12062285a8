/** The moderation log's filters as they live in the address, so /moderation/log?strip=12 works. */
export type LogFilters = { strip?: number; member?: string; moderator?: string; action?: string };

const uuid = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export function isMemberId(value: string): boolean {
  return uuid.test(value);
}

function stripId(raw: string | null): number | undefined {
  if (!raw || !/^[1-9]\d{0,15}$/.test(raw.trim())) return undefined;
  const n = Number(raw.trim());
  return Number.isSafeInteger(n) ? n : undefined;
}

function memberId(raw: string | null): string | undefined {
  const v = raw?.trim();
  return v && isMemberId(v) ? v.toLowerCase() : undefined;
}

/** Reads filters from the address, dropping anything the server would refuse. */
export function logFiltersFromSearchParams(params: URLSearchParams): LogFilters {
  const action = params.get("action")?.trim().slice(0, 30) || undefined;
  return {
    strip: stripId(params.get("strip")),
    member: memberId(params.get("member")),
    moderator: memberId(params.get("moderator")),
    action,
  };
}

export function logFiltersToSearchParams(filters: LogFilters): URLSearchParams {
  const params = new URLSearchParams();
  if (filters.strip) params.set("strip", String(filters.strip));
  if (filters.member) params.set("member", filters.member);
  if (filters.moderator) params.set("moderator", filters.moderator);
  if (filters.action) params.set("action", filters.action);
  return params;
}

/** Problems with what someone typed into the filter boxes, by field; empty when all is usable. */
export function logFilterProblems(input: { strip: string; member: string }): { strip?: string; member?: string } {
  const problems: { strip?: string; member?: string } = {};
  if (input.strip.trim() && stripId(input.strip) === undefined) problems.strip = "must be a strip number such as 12";
  if (input.member.trim() && memberId(input.member) === undefined) problems.member = "must be a member id (from a member's page or a log link)";
  return problems;
}
