import { describeDeltaE } from "../../../shared/colour";
import type { DecisionAction, QueueReason } from "../../../shared/schemas/moderation";
import { stripStatuses, type StripStatus } from "../../../shared/schemas/strips";
import { formatDateTime, formatNumber } from "../../lib/format";

const MINUTE = 60_000;
const HOUR = 60 * MINUTE;
const DAY = 24 * HOUR;

/** "less than a minute", "1 minute", "3 hours", "2 days": a span of time, rounded down. */
export function durationWords(ms: number): string {
  if (!Number.isFinite(ms) || ms < MINUTE) return "less than a minute";
  const unit = ms >= DAY ? { size: DAY, one: "day" } : ms >= HOUR ? { size: HOUR, one: "hour" } : { size: MINUTE, one: "minute" };
  const n = Math.floor(ms / unit.size);
  return `${n} ${unit.one}${n === 1 ? "" : "s"}`;
}

/** "waiting 3 hours" since an ISO time; an unreadable time falls back to the date as given. */
export function waitingWords(since: string, now: number): string {
  const at = Date.parse(since);
  if (Number.isNaN(at)) return `waiting since ${since}`;
  return `waiting ${durationWords(now - at)}`;
}

/** "3 hours ago" */
export function agoWords(at: string, now: number): string {
  const t = Date.parse(at);
  if (Number.isNaN(t)) return at;
  return now - t < MINUTE ? "just now" : `${durationWords(now - t)} ago`;
}

/** ΔE2000 as number and words: "ΔE 12.4, very different". */
export function deltaEText(deltaE: number): string {
  return `ΔE ${formatNumber(deltaE)}, ${describeDeltaE(deltaE)}`;
}

/** "0–21 % along the strip" */
export function spanWords(start: number, end: number): string {
  const pct = (f: number) => Math.round(Math.min(1, Math.max(0, f)) * 100);
  return `${pct(start)}–${pct(end)} % along the strip`;
}

/** Why a strip is in the queue, as a sentence start; the risky reasons are marked for attention. */
export const queueReasonText: Record<QueueReason, { label: string; urgent: boolean }> = {
  "new member": { label: "New member", urgent: false },
  "edited, back to review": { label: "Edited, back for review", urgent: false },
  "possible duplicate": { label: "Possible duplicate", urgent: true },
  "held: reports": { label: "Held automatically: reports", urgent: true },
  reported: { label: "Reported", urgent: true },
};

/** What the queue says after a decision: "approved", "returned for edits"… */
export const actionDone: Record<DecisionAction, string> = {
  approve: "approved",
  return: "returned for edits",
  hide: "hidden",
  reject: "rejected",
  restore: "restored",
};

/** The audit trail's action names, as the log filter offers them, and how the log shows them. */
export const logActions: { value: string; label: string }[] = [
  { value: "approve", label: "Approved" },
  { value: "return", label: "Returned for edits" },
  { value: "hide", label: "Hidden" },
  { value: "reject", label: "Rejected" },
  { value: "restore", label: "Restored" },
  { value: "correct inks", label: "Ink tags corrected" },
  { value: "hold", label: "Held automatically" },
  { value: "trust", label: "Made trusted" },
  { value: "untrust", label: "Made new (trust removed)" },
  { value: "suspend", label: "Suspended" },
  { value: "lift suspension", label: "Suspension lifted" },
  { value: "change role", label: "Role changed" },
];

export function logActionLabel(action: string): string {
  return logActions.find((a) => a.value === action)?.label ?? action;
}

const isStatus = (v: string): v is StripStatus => (stripStatuses as readonly string[]).includes(v);
// Plainer than the strip page's labels: in the log a hidden strip may have been held automatically.
const logStatusWords: Record<StripStatus, string> = {
  pending: "Waiting for review",
  published: "Published",
  hidden: "Hidden",
  returned: "Returned for edits",
  rejected: "Not accepted",
};
const roleWords: Record<string, string> = { member: "Member", moderator: "Moderator", admin: "Admin" };
const standingWords: Record<string, string> = { new: "New member", trusted: "Trusted member" };

/** One side of a log entry's "before → after", in words. */
export function stateWords(action: string, value: string | null): string {
  if (action === "suspend" || action === "lift suspension") {
    if (value === null) return "not suspended";
    return `suspended until ${formatDateTime(value)}`;
  }
  if (value === null) return "—";
  if (action === "change role") return roleWords[value] ?? value;
  if (action === "trust" || action === "untrust") return standingWords[value] ?? value;
  if (isStatus(value)) return logStatusWords[value];
  return value;
}

/** The server's 409 text without its "Reload" hint: the queue refreshes by itself. */
export function withoutReloadHint(message: string): string {
  return message.replace(/\s*Reload to see the latest\.?\s*$/, "");
}
