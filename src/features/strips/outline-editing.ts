// Pure helpers for the member's own strip outlines on the posting page.
import { outlineProblem } from "../../../shared/schemas/outlines";
import type { Outline } from "../../../shared/schemas/uploads";

export type Corner = 0 | 1 | 2 | 3;

/** Arrow keys move a corner this far (a fraction of the photo); Shift moves five times as far. */
export const CORNER_STEP = 0.004;
export const CORNER_BIG_STEP = 0.02;

const clamp = (v: number) => Math.min(1, Math.max(0, Math.round(v * 10_000) / 10_000));

/** The outline with one corner put at (x, y), kept inside the photo. */
export function withCorner(outline: Outline, corner: Corner, x: number, y: number): Outline {
  return outline.map((p, k) => (k === corner ? [clamp(x), clamp(y)] : p)) as Outline;
}

/** The middle of an outline (for its number). */
export function centreOf(outline: Outline): [number, number] {
  return [outline.reduce((s, p) => s + p[0], 0) / 4, outline.reduce((s, p) => s + p[1], 0) / 4];
}

/** Corner names a member can follow: the strip's start is its left end (or top end, standing up). */
export const cornerNames = ["start, first edge", "far end, first edge", "far end, second edge", "start, second edge"] as const;

/**
 * A new strip's outline for the member to drag into place: a horizontal band in the largest
 * empty-looking stretch between the strips already outlined (or the middle of the photo).
 */
export function newStripOutline(existing: Outline[]): Outline {
  const spans = existing.map((o) => [Math.min(...o.map((p) => p[1])), Math.max(...o.map((p) => p[1]))] as const).sort((a, b) => a[0] - b[0]);
  let best: [number, number] = [0, 1];
  let bestGap = -1;
  let from = 0;
  for (const [top, bottom] of [...spans, [1, 1] as const]) {
    if (top - from > bestGap) {
      bestGap = top - from;
      best = [from, top];
    }
    from = Math.max(from, bottom);
  }
  const mid = (best[0] + best[1]) / 2;
  const half = Math.min(0.06, Math.max(0.03, (best[1] - best[0]) / 4));
  const top = clamp(mid - half);
  const bottom = clamp(mid + half);
  return [
    [0.15, top],
    [0.85, top],
    [0.85, bottom],
    [0.15, bottom],
  ];
}

/** Why these corners cannot be read, in a sentence for the member; null when they are fine. */
export function outlineTrouble(outline: Outline, stripNumber: number): string | null {
  const problem = outlineProblem(outline);
  return problem ? `Strip ${stripNumber}: ${problem}.` : null;
}

type Readable = { outline: Outline | null; bands: unknown[] };
const bandWords = (n: number) => `${n} band${n === 1 ? "" : "s"}`;

/** What changed between two readings of the photo's strips, in words ("Strip 2 now has 4 bands."). */
export function changeWords(before: Readable[], after: Readable[], action: { kind: "read" | "add" | "remove"; index: number }): string {
  const n = action.index + 1;
  if (action.kind === "remove") {
    const rest = after.length === 1 ? "1 strip is left" : `${after.length} strips are left`;
    return `Strip ${n} removed; ${rest}${action.index < after.length ? ", numbered again from the top" : ""}.`;
  }
  const now = after[action.index];
  if (!now) return "The photo's strips changed.";
  if (action.kind === "add") return `Strip ${n} added: ${bandWords(now.bands.length)} found.`;
  const was = before[action.index]?.bands.length;
  return was === now.bands.length ? `Strip ${n} read again: still ${bandWords(now.bands.length)}.` : `Strip ${n} now has ${bandWords(now.bands.length)} (it had ${was ?? 0}).`;
}
