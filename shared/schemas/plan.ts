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

/** Which inks a bridge may use between the two ends. */
export const bridgeInkChoices = ["any", "stash", "oneToBuy"] as const;
export type BridgeInkChoice = (typeof bridgeInkChoices)[number];
export const MAX_BRIDGES = 10;

const single = <T extends z.ZodType>(schema: T) =>
  z.preprocess((v, ctx) => {
    if (!Array.isArray(v)) return v;
    ctx.addIssue({ code: "custom", message: "give this only once", input: v });
    return z.NEVER;
  }, schema);

const inkId = z.coerce.number({ error: "must be an ink id" }).int("must be an ink id").positive("must be an ink id").max(Number.MAX_SAFE_INTEGER);

/**
 * GET /api/bridges: up to `limit` bridges of one to three inks between `from` and `to`, best
 * first. `inks`: any catalogue ink, only inks in my stash, or at most one ink I would have to buy.
 * `sameBrand`: the inks between come from the end inks' brand(s) only.
 */
export const bridgeQuery = z
  .strictObject({
    from: single(inkId),
    to: single(inkId),
    inks: single(z.enum(bridgeInkChoices, { error: "must be any, stash or oneToBuy" }).default("any")),
    sameBrand: single(z.enum(["true", "false"], { error: "must be true or false" }).default("false")).transform((v) => v === "true"),
    limit: single(z.coerce.number({ error: "must be a number" }).int("must be a whole number").min(1, "must be at least 1").max(MAX_BRIDGES, `must be at most ${MAX_BRIDGES}`).default(5)),
  })
  .refine((q) => q.from !== q.to, { path: ["to"], message: "choose two different inks" });
export type BridgeQueryInput = z.input<typeof bridgeQuery>;

export type BridgeStep = {
  /** ΔE2000 of the join, two decimals. */
  deltaE: number;
  words: string;
  /** Always false for a bridge's own steps (muddy joins are never used); kept so a client can show any join. */
  muddy: boolean;
  /** Published strips with these two inks side by side. */
  strips: number;
};

export type Bridge = {
  /** The end inks included, in order. */
  inks: PlanInk[];
  steps: BridgeStep[];
  maxStepDeltaE: number;
  /** With inks=oneToBuy: the one ink of the bridge not in the stash, if any. */
  toBuy?: PlanInk | null;
};

export type BridgeList = {
  bridges: Bridge[];
  /** The join being bridged, as it stands. */
  direct: BridgeStep;
  /** Inks the search looked through (after the options). */
  searched: number;
};

export const besideQuery = z.strictObject({
  limit: single(z.coerce.number({ error: "must be a number" }).int("must be a whole number").min(1, "must be at least 1").max(24, "must be at most 24").default(8)),
});

/** An ink often blended directly next to another, from published strips. */
export type BesideInk = {
  ink: PlanInk;
  /** Published strips with the two side by side. */
  strips: number;
  /** A few of those strips, newest first. */
  examples: { id: number; title: string }[];
};

export type BesideList = { inkId: number; items: BesideInk[] };

export const sheetPapers = ["a4", "letter"] as const;
const paperParam = single(z.enum(sheetPapers, { error: "must be a4 or letter" }).default("a4"));

/** GET /api/plan/card.pdf: a practice card for a plan. */
export const practiceCardQuery = z.strictObject({ inks: single(planInksParam), paper: paperParam });

/** GET /api/stash/chart.pdf: the signed-in member's stash chart. */
export const stashChartQuery = z.strictObject({ paper: paperParam });

/** A binder holds at most this many planned strips. */
export const MAX_BINDER_PLANS = 200;

/** POST /api/binders/:id/plans */
export const binderPlanInput = z.strictObject({
  inks: z
    .array(z.number().int().positive("ink ids are positive").max(Number.MAX_SAFE_INTEGER))
    .min(MIN_PLAN_INKS, `a plan needs at least ${MIN_PLAN_INKS} inks`)
    .max(MAX_PLAN_INKS, `a plan takes at most ${MAX_PLAN_INKS} inks`)
    .refine((ids) => ids.every((id, i) => i === 0 || ids[i - 1] !== id), "the same ink cannot sit next to itself"),
});
export const binderPlanParams = z.strictObject({ id: z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER), planId: z.coerce.number().int().positive().max(Number.MAX_SAFE_INTEGER) });

/** A planned strip saved in a binder. Inks removed from the catalogue since are left out of `inks`. */
export type BinderPlan = { id: number; binderId: number; inkIds: number[]; inks: PlanInk[]; addedAt: string };
export type BinderPlanList = { items: BinderPlan[]; canEdit: boolean };
