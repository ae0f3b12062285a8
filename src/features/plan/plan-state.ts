import { MAX_PLAN_INKS, type BridgeInkChoice } from "../../../shared/schemas/plan";
import type { BridgeRequest } from "./api/keys";

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

const bridgeChoices: readonly BridgeInkChoice[] = ["any", "stash", "oneToBuy"];

/** The bridge finder's part of the address: `from`, `to`, `bridgeInks`, `sameBrand=true`. */
export function parseBridgeRequest(params: URLSearchParams): { from: number | null; to: number | null; request: BridgeRequest | null } {
  const id = (v: string | null) => (v !== null && idPattern.test(v) ? Number(v) : null);
  const from = id(params.get("from"));
  const to = id(params.get("to"));
  const raw = params.get("bridgeInks");
  const inks = bridgeChoices.find((c) => c === raw) ?? "any";
  const sameBrand = params.get("sameBrand") === "true";
  const request = from !== null && to !== null && from !== to ? { from, to, inks, sameBrand, limit: 5 } : null;
  return { from, to, request };
}

/**
 * A bridge put into the plan: when the plan already has the bridge's two ends side by side,
 * the bridge's inks go between them; otherwise the bridge becomes the plan.
 */
export function planWithBridge(plan: readonly number[], bridge: readonly number[]): number[] {
  const from = bridge[0]!;
  const to = bridge[bridge.length - 1]!;
  const middle = bridge.slice(1, -1);
  for (let i = 1; i < plan.length; i++) {
    const a = plan[i - 1]!;
    const b = plan[i]!;
    if (a === from && b === to) return [...plan.slice(0, i), ...middle, ...plan.slice(i)];
    if (a === to && b === from) return [...plan.slice(0, i), ...[...middle].reverse(), ...plan.slice(i)];
  }
  return [...bridge];
}
