import { z } from "zod";
import { hexSchema, idParam } from "./common";
import { inkTypeSchema, type Ink } from "./inks";
import { papers, stripListQuery, type Strip } from "./strips";

export const MAX_SEARCH_INKS = 8;
export const MAX_SEARCH_COLOURS = 3;
export const MAX_SEARCH_BRANDS = 4;
export const DEFAULT_MAX_DELTA_E = 10;
export const MIN_MAX_DELTA_E = 0.5;
export const MAX_MAX_DELTA_E = 30;
/** Look-alikes: catalogue inks within this ΔE2000 of an ink. */
export const LOOK_ALIKE_DELTA_E = 5;

export const searchSorts = ["newest", "saves", "closest"] as const;
export type SearchSort = (typeof searchSorts)[number];
/** By my stash: strips whose inks I all own, or strips missing exactly one of mine. */
export const stashModes = ["all", "missingOne"] as const;
export type StashMode = (typeof stashModes)[number];

// A query parameter given once arrives as a string, given twice as an array.
const repeatable = <T extends z.ZodType>(item: T, max: number, what: string) =>
  z.preprocess(
    (v) => (v === undefined ? undefined : Array.isArray(v) ? v : [v]),
    z.array(item).max(max, `at most ${max} ${what}`).optional(),
  );

/** A parameter that may be given only once (a second copy is an error, not silently dropped). */
const one = <T extends z.ZodType>(schema: T) =>
  z.preprocess((v, ctx) => {
    if (!Array.isArray(v)) return v;
    ctx.addIssue({ code: "custom", message: "give this only once", input: v });
    return z.NEVER;
  }, schema);

const unique = <T>(list: T[] | undefined) => (list ? [...new Set(list)] : undefined);

const brandSlug = z
  .string()
  .trim()
  .regex(/^[a-z0-9-]{1,60}$/, "must be a brand slug");

/**
 * GET /api/strips: the gallery list plus search filters. Every filter narrows: several inks
 * must all be in a strip, several colours must all be found among its bands (one band may
 * answer two colours), several brands must all be represented.
 * Sort defaults to "closest" when a colour is given, else "newest"; "closest" needs a colour.
 * `adjacent=true` with two inks: the two sit side by side in the ink order (either way round).
 */
export const stripSearchQuery = stripListQuery
  .extend({
    ink: repeatable(idParam, MAX_SEARCH_INKS, "inks"),
    notInk: repeatable(idParam, MAX_SEARCH_INKS, "excluded inks"),
    color: repeatable(hexSchema, MAX_SEARCH_COLOURS, "colours"),
    maxDeltaE: one(
      z.coerce
        .number({ error: "must be a number" })
        .min(MIN_MAX_DELTA_E, `must be at least ${MIN_MAX_DELTA_E}`)
        .max(MAX_MAX_DELTA_E, `must be at most ${MAX_MAX_DELTA_E}`)
        .default(DEFAULT_MAX_DELTA_E),
    ),
    brand: repeatable(brandSlug, MAX_SEARCH_BRANDS, "brands"),
    type: one(inkTypeSchema.optional()),
    inkCount: one(
      z.coerce.number({ error: "must be a number" }).int("must be a whole number").min(1, "must be at least 1").max(MAX_SEARCH_INKS, `must be at most ${MAX_SEARCH_INKS}`).optional(),
    ),
    paper: one(z.enum(papers, { error: "choose a paper from the list" }).optional()),
    stash: one(z.enum(stashModes, { error: "must be all or missingOne" }).optional()),
    /** With exactly two required inks: they sit directly next to each other in the ink order. */
    adjacent: one(z.enum(["true", "false"], { error: "must be true or false" }).optional()).transform((v) => v === "true"),
    sort: one(z.enum(searchSorts, { error: "must be newest, saves or closest" }).optional()),
    cursor: one(z.string().max(200, "is not a valid cursor").optional()),
    limit: one(z.coerce.number({ error: "must be a number" }).int("must be a whole number").min(1, "must be at least 1").max(50, "must be at most 50").default(20)),
  })
  .superRefine((q, ctx) => {
    if (q.sort === "closest" && !q.color?.length) {
      ctx.addIssue({ code: "custom", path: ["sort"], message: "closest needs a colour to be close to" });
    }
    if (q.adjacent && new Set(q.ink ?? []).size !== 2) {
      ctx.addIssue({ code: "custom", path: ["adjacent"], message: "next to each other needs exactly two inks" });
    }
    const both = (q.ink ?? []).filter((id) => q.notInk?.includes(id));
    if (both.length) {
      ctx.addIssue({ code: "custom", path: ["notInk"], message: `an ink cannot be both required and excluded: ${[...new Set(both)].join(", ")}` });
    }
  })
  .transform((q) => ({
    ...q,
    ink: unique(q.ink),
    notInk: unique(q.notInk),
    color: unique(q.color),
    brand: unique(q.brand),
    sort: q.sort ?? (q.color?.length ? ("closest" as const) : ("newest" as const)),
  }));
export type StripSearchQuery = z.output<typeof stripSearchQuery>;
export type StripSearchQueryInput = z.input<typeof stripSearchQuery>;

/** For a colour search, where each asked-for colour was found on a strip. */
export type ColourMatch = {
  /** The colour asked for, "#rrggbb". */
  color: string;
  /** The band (StripBand.index) closest to it. */
  bandIndex: number;
  /** ΔE2000 between the two, two decimals. */
  deltaE: number;
};

export type StripSearchResult = Strip & {
  match?: ColourMatch[];
  /** With stash=missingOne: the one ink of this strip that the member does not own. */
  missingInkId?: number;
  /** …and the member's own ink closest to it, when one is within ΔE2000 5 (a look-alike). */
  ownedLookAlike?: { inkId: number; name: string; brand: string; hex: string; deltaE: number; words: string };
};

export type StripSearchList = {
  items: StripSearchResult[];
  nextCursor: string | null;
  /**
   * How many strips match in all, given on the first page when it is known exactly. Colour
   * searches that settle their first page early leave it out: "closest" when a page was found
   * well inside the threshold, newest / most saved when matches are so common that walking the
   * strips in order found a page sooner than gathering them all.
   */
  total?: number;
};

/** A catalogue ink that is hard to tell from another. */
export type LookAlike = {
  ink: Ink;
  /** ΔE2000 between the two reference colours, two decimals. */
  deltaE: number;
  /** "indistinguishable" (≤ 1), "barely different" (≤ 2) or "similar" (≤ 5). */
  words: string;
  /** Present when the viewer's stash is known: whether they own this one. */
  owned?: boolean;
};

export type LookAlikeList = {
  ink: Ink;
  /** Closest first. */
  items: LookAlike[];
  maxDeltaE: number;
  /** Where the words come from, to show beside them. */
  scale: string;
  /** Present when the viewer's stash is known: a look-alike they already own, closest first. */
  ownedLookAlike?: LookAlike | null;
};
