import type { DecisionAction } from "../../../shared/schemas/moderation";

export type QueueCommand = "next" | "previous" | Exclude<DecisionAction, "restore">;

/** The review queue's single-key shortcuts (documented on the page). */
export const queueShortcuts: { key: string; command: QueueCommand; label: string }[] = [
  { key: "j", command: "next", label: "next strip" },
  { key: "k", command: "previous", label: "previous strip" },
  { key: "a", command: "approve", label: "approve" },
  { key: "r", command: "return", label: "return for edits" },
  { key: "h", command: "hide", label: "hide" },
  { key: "x", command: "reject", label: "reject" },
];

type TargetLike = { tagName?: string; type?: string; isContentEditable?: boolean; closest?: (selector: string) => unknown } | null;

const notTyping = new Set(["checkbox", "radio", "button", "submit", "reset"]);

/** True when a key press is meant as text: inside a text box, a select, or editable content. */
export function isTypingTarget(target: TargetLike): boolean {
  if (!target) return false;
  if (target.isContentEditable) return true;
  const tag = target.tagName?.toUpperCase();
  if (tag === "TEXTAREA" || tag === "SELECT") return true;
  if (tag === "INPUT") return !notTyping.has((target.type ?? "text").toLowerCase());
  return false;
}

type KeyLike = { key: string; ctrlKey: boolean; metaKey: boolean; altKey: boolean; shiftKey: boolean; target: unknown };

/**
 * The command for a key press, or null. Shortcuts stay quiet while someone types, while a
 * decision form or dialog has focus, and whenever a modifier key is held (those belong to the
 * browser and to screen readers).
 */
export function queueCommandFor(e: KeyLike): QueueCommand | null {
  if (e.ctrlKey || e.metaKey || e.altKey || e.shiftKey) return null;
  const target = e.target as TargetLike;
  if (isTypingTarget(target)) return null;
  if (target?.closest && target.closest("form, dialog, [role='dialog'], [role='listbox'], [data-no-shortcuts]")) return null;
  return queueShortcuts.find((s) => s.key === e.key)?.command ?? null;
}
