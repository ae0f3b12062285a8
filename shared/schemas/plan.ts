import { z } from "zod";

/** A blend preview takes two to six inks in order. */
export const MIN_PLAN_INKS = 2;
export const MAX_PLAN_INKS = 6;

/** One ink as a plan or a bridge names it. */
export type PlanInk = { id: number; name: string; brand: string; hex: string };

/**
 * "12,5,7": ink ids in order, as the plan's address and the practice card take them. An ink may
 * come back later in the strip (a symmetric strip), but not twice in a row.
 */
export const planInksParam = z
  .string({ error: "give the inks as ids separated by commas, e.g. 12,5,7" })
  .trim()
  .regex(/^\d{1,10}(,\d{1,10}){0,20}$/, "give the inks as ids separated by commas, e.g. 12,5,7")
  .transform((s) => s.split(",").map(Number))
  .pipe(
    z
      .array(z.number().int().positive("ink ids are positive").max(Number.MAX_SAFE_INTEGER))
      .min(MIN_PLAN_INKS, `a plan needs at least ${MIN_PLAN_INKS} inks`)
      .max(MAX_PLAN_INKS, `a plan takes at most ${MAX_PLAN_INKS} inks`)
      .refine((ids) => ids.every((id, i) => i === 0 || ids[i - 1] !== id), "the same ink cannot sit next to itself"),
  );
