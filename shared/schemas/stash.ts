import { z } from "zod";
import { idParam } from "./common";
import type { Ink } from "./inks";

export const MAX_STASH = 2000;

export const stashPut = z.strictObject({
  items: z
    .array(z.strictObject({ inkId: idParam, runningLow: z.boolean().default(false) }))
    .max(MAX_STASH, `at most ${MAX_STASH} inks`)
    .refine((items) => new Set(items.map((i) => i.inkId)).size === items.length, "an ink is listed twice"),
});
export const stashItemInput = z.strictObject({ inkId: idParam, runningLow: z.boolean().default(false) });
export const stashItemPatch = z.strictObject({ runningLow: z.boolean() });
export const stashInkParams = z.strictObject({ inkId: idParam });

export type StashItem = { ink: Ink; runningLow: boolean; addedAt: string };

/** Columns of our stash CSV (header row required; running_low optional). */
export const stashCsvColumns = ["brand", "name", "running_low"] as const;

export type StashImportRow = {
  line: number;
  brand: string;
  name: string;
  runningLow: boolean;
  status: "matched" | "ambiguous" | "unmatched";
  ink: Ink | null;
  /** For ambiguous rows: the inks it could be. */
  candidates: Ink[];
};
export type StashImportPreview = { rows: StashImportRow[]; matched: number; ambiguous: number; unmatched: number };
