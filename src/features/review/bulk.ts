import { actionFrom } from "../../../shared/schemas/moderation";
import type { StripStatus } from "../../../shared/schemas/strips";

export type BulkAction = "approve" | "hide";
export type Picked = { id: number; title: string; status: StripStatus; expectedVersion: number };

/** Splits a selection into the strips this action may be given now and those it may not. */
export function splitForBulk(action: BulkAction, picked: Picked[]): { fit: Picked[]; unfit: Picked[] } {
  const allowed = actionFrom[action];
  return {
    fit: picked.filter((p) => allowed.includes(p.status)),
    unfit: picked.filter((p) => !allowed.includes(p.status)),
  };
}
