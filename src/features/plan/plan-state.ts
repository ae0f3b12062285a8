import { MAX_PLAN_INKS } from "../../../shared/schemas/plan";

const idPattern = /^[1-9]\d{0,9}$/;

/**
 * The plan's inks from its address (`/plan?inks=12,5,7`), in order. A hand-edited link still
 * opens something: unreadable ids, an ink repeated next to itself and inks past the sixth are
 * left out rather than refused.
 */
export function parsePlanInks(params: URLSearchParams): number[] {
  const raw = params.get("inks") ?? "";
  const ids: number[] = [];
  for (const part of raw.split(",")) {
    const v = part.trim();
    if (!idPattern.test(v)) continue;
    const id = Number(v);
    if (ids[ids.length - 1] === id) continue;
    ids.push(id);
    if (ids.length === MAX_PLAN_INKS) break;
  }
  return ids;
}

/** The address of a plan (an empty plan is just /plan). */
export function planToParams(ids: readonly number[]): URLSearchParams {
  const p = new URLSearchParams();
  if (ids.length) p.set("inks", ids.join(","));
  return p;
}

/** The list with item `from` moved one place left (-1) or right (+1). */
export function moveInk(ids: readonly number[], from: number, step: -1 | 1): number[] {
  const to = from + step;
  if (to < 0 || to >= ids.length) return [...ids];
  const next = [...ids];
  [next[from], next[to]] = [next[to]!, next[from]!];
  return next;
}

/** True when no ink sits next to itself (moving can create that; the plan refuses it). */
export function noRepeatsSideBySide(ids: readonly number[]): boolean {
  return ids.every((id, i) => i === 0 || ids[i - 1] !== id);
}
