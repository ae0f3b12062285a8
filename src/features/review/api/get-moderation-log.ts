import { infiniteQueryOptions, queryOptions, useInfiniteQuery, useQuery } from "@tanstack/react-query";
import type { ModerationLogEntry } from "../../../../shared/schemas/moderation";
import { api } from "../../../lib/api-client";
import type { LogFilters } from "../log-filters";
import { reviewKeys } from "./keys";

export type ModerationLogPage = { items: ModerationLogEntry[]; nextBefore: number | null };

export const LOG_PAGE_SIZE = 50;

/** GET /api/moderation/log, newest first; `before` continues from an earlier page's `nextBefore`. */
export function getModerationLog(filters: LogFilters & { before?: number; limit?: number }, signal?: AbortSignal): Promise<ModerationLogPage> {
  return api.get<ModerationLogPage>("/api/moderation/log", { query: filters, signal });
}

export const moderationLogInfiniteOptions = (filters: LogFilters) =>
  infiniteQueryOptions({
    queryKey: reviewKeys.logPages(filters),
    queryFn: ({ pageParam, signal }) => getModerationLog({ ...filters, before: pageParam, limit: LOG_PAGE_SIZE }, signal),
    initialPageParam: undefined as number | undefined,
    getNextPageParam: (last) => last.nextBefore ?? undefined,
  });

export function useModerationLog(filters: LogFilters) {
  return useInfiniteQuery({ ...moderationLogInfiniteOptions(filters), meta: { errorsShownInline: true } });
}

export const latestModerationOptions = (filters: LogFilters, limit: number) =>
  queryOptions({
    queryKey: reviewKeys.logLatest(filters, limit),
    queryFn: ({ signal }) => getModerationLog({ ...filters, limit }, signal),
  });

/** The latest few entries (a member's panel shows what was last decided about them). */
export function useLatestModeration(filters: LogFilters, limit = 5) {
  return useQuery({ ...latestModerationOptions(filters, limit), meta: { errorsShownInline: true } });
}
