import { z } from "zod";
import { idParam, plainText } from "./common";
import type { Strip } from "./strips";

export const MAX_BINDER_ITEMS = 1000;
export const visibilities = ["private", "public"] as const;

const description = z.string().trim().max(500, "must be at most 500 characters");
const itemNote = z.string().trim().max(300, "must be at most 300 characters");

export const binderInput = z.strictObject({
  name: plainText(1, 80),
  description: description.default(""),
  visibility: z.enum(visibilities, { error: "must be private or public" }).default("private"),
});
export const binderPatch = z
  .strictObject({ name: plainText(1, 80).optional(), description: description.optional(), visibility: z.enum(visibilities).optional() })
  .refine((v) => Object.keys(v).length > 0, { message: "nothing to change" });

export const binderItemInput = z.strictObject({ stripId: idParam, note: itemNote.default("") });
export const binderItemPatch = z.strictObject({ note: itemNote });
export const binderOrderInput = z.strictObject({
  stripIds: z
    .array(idParam)
    .max(MAX_BINDER_ITEMS, `at most ${MAX_BINDER_ITEMS} items`)
    .refine((ids) => new Set(ids).size === ids.length, "a strip is listed twice"),
});
export const binderItemParams = z.strictObject({ id: idParam, stripId: idParam });

export type BinderSummary = {
  id: number;
  name: string;
  description: string;
  visibility: "private" | "public";
  itemCount: number;
  owner: { id: string; name: string };
  /** Swatches of the first few strips' inks, for a quick look. */
  cover: string[];
  createdAt: string;
  updatedAt: string;
};

export type BinderItem =
  | { stripId: number; position: number; note: string; addedAt: string; available: true; strip: Strip }
  | { stripId: number; position: number; note: string; addedAt: string; available: false; strip: null };

export type Binder = BinderSummary & { items: BinderItem[]; isOwner: boolean };
