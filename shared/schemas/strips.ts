import { z } from "zod";
import { idParam, plainText, type LabValue } from "./common";
import { MAX_STRIPS } from "./outlines";
import type { Outline } from "./uploads";

export const papers = ["smooth-cardstock", "hot-press", "cold-press", "mixed-media", "other"] as const;
export const paperLabels: Record<(typeof papers)[number], string> = {
  "smooth-cardstock": "Smooth white cardstock",
  "hot-press": "Hot-press watercolour",
  "cold-press": "Cold-press watercolour",
  "mixed-media": "Mixed-media",
  other: "Other paper",
};
export const tools = ["blending-brush", "foam", "dauber", "sponge", "other"] as const;
export const toolLabels: Record<(typeof tools)[number], string> = {
  "blending-brush": "Blending brush",
  foam: "Foam",
  dauber: "Dauber",
  sponge: "Sponge",
  other: "Other tool",
};
export const stripStatuses = ["pending", "published", "hidden", "returned", "rejected"] as const;
export type StripStatus = (typeof stripStatuses)[number];
export const statusLabels: Record<StripStatus, string> = {
  pending: "Waiting for review",
  published: "Published",
  hidden: "Hidden by a moderator",
  returned: "Returned for edits",
  rejected: "Not accepted",
};

export const MAX_INKS = 8;
export const MAX_NOTES = 5000;

const videoUrl = z
  .string()
  .trim()
  .max(500, "must be at most 500 characters")
  .refine((s) => {
    try {
      const u = new URL(s);
      return (u.protocol === "http:" || u.protocol === "https:") && !!u.hostname;
    } catch {
      return false;
    }
  }, "must be an http or https link");

const inkOrder = z
  .array(idParam, { error: "must be a list of ink ids" })
  .min(1, "name at least one ink")
  .max(MAX_INKS, `at most ${MAX_INKS} inks`)
  .refine((ids) => new Set(ids).size === ids.length, "an ink is listed twice");

const stripFields = {
  title: plainText(3, 100),
  notes: z.string().max(MAX_NOTES, `must be at most ${MAX_NOTES} characters`).default(""),
  paper: z.enum(papers, { error: "choose a paper from the list" }),
  tools: z
    .array(z.enum(tools, { error: "choose tools from the list" }))
    .max(tools.length)
    .refine((t) => new Set(t).size === t.length, "a tool is listed twice")
    .default([]),
  videoUrl: z.union([videoUrl, z.literal("").transform(() => undefined)]).optional(),
  inks: inkOrder,
};

export const stripInput = z.strictObject({
  uploadId: z.string().uuid("is not an upload id"),
  /** Which strip of the photo (analysis.strips[stripIndex]); a one-strip photo has only 0. */
  stripIndex: z
    .number({ error: "must be a number" })
    .int("must be a whole number")
    .min(0, "must be 0 or more")
    .max(MAX_STRIPS - 1, `a photo holds at most ${MAX_STRIPS} strips`)
    .default(0),
  ...stripFields,
});
export type StripInput = z.input<typeof stripInput>;

export const stripPatch = z
  .strictObject({
    title: stripFields.title.optional(),
    notes: z.string().max(MAX_NOTES, `must be at most ${MAX_NOTES} characters`).optional(),
    paper: stripFields.paper.optional(),
    tools: stripFields.tools.optional(),
    videoUrl: z.union([videoUrl, z.literal("")]).nullable().optional(),
    inks: inkOrder.optional(),
    /** The version the editor started from; a stale one gets 409. */
    expectedVersion: z.number().int().positive().optional(),
  })
  .refine((v) => Object.keys(v).filter((k) => k !== "expectedVersion").length > 0, { message: "nothing to change" });
export type StripPatch = z.input<typeof stripPatch>;

export const stripSorts = ["newest", "saves"] as const;

const repeatable = <T extends z.ZodType>(item: T, max: number, what: string) =>
  z.preprocess(
    (v) => (v === undefined ? undefined : Array.isArray(v) ? v : [v]),
    z.array(item).max(max, `at most ${max} ${what}`).optional(),
  );

export const stripListQuery = z.strictObject({
  ink: repeatable(idParam, 8, "inks"),
  author: z.string().uuid().optional(),
  sort: z.enum(stripSorts).default("newest"),
  cursor: z.string().max(200, "is not a valid cursor").optional(),
  limit: z.coerce.number().int().min(1).max(50).default(20),
});
export type StripListQuery = z.infer<typeof stripListQuery>;

export const stripIdParams = z.strictObject({ id: idParam });

export type StripInk = { id: number; name: string; brand: string; hex: string; lab: LabValue };
export type StripBand = {
  index: number;
  start: number;
  end: number;
  hex: string;
  lab: LabValue;
  /** The tagged ink this band is nearest to, and how far (ΔE2000). */
  inkId: number | null;
  deltaE: number | null;
};
export type StripImages = { display: string; thumb: string; placeholder: string; width: number; height: number };

export type Strip = {
  id: number;
  title: string;
  status: StripStatus;
  statusReason: string | null;
  author: { id: string; name: string };
  inks: StripInk[];
  bands: StripBand[];
  orientation: "horizontal" | "vertical";
  /** Which strip of its photo this is (0 for a one-strip photo). */
  stripIndex: number;
  /** The strip's corners as fractions of its own display image (see Outline), when known. */
  outline: Outline | null;
  images: StripImages;
  paper: (typeof papers)[number];
  tools: (typeof tools)[number][];
  videoUrl: string | null;
  /** Cleaned HTML (paragraphs, bold, italic, lists, links). */
  notes: string;
  saves: number;
  version: number;
  createdAt: string;
  updatedAt: string;
  publishedAt: string | null;
};

export type StripList = { items: Strip[]; nextCursor: string | null };

export type MemberProfile = {
  id: string;
  name: string;
  bio: string;
  standing: "new" | "trusted";
  joinedAt: string;
  strips: Strip[];
};
