import { z } from "zod";
import { hexSchema, idParam, labSchema, plainText, type LabValue } from "./common";

export const inkTypes = ["dye", "pigment", "hybrid"] as const;
export const inkTypeSchema = z.enum(inkTypes, { error: "must be dye, pigment or hybrid" });
export type InkType = z.infer<typeof inkTypeSchema>;

export const inkListQuery = z.strictObject({
  q: z.string().trim().max(100, "must be at most 100 characters").optional(),
  brand: z
    .string()
    .trim()
    .regex(/^[a-z0-9-]{1,60}$/, "must be a brand slug")
    .optional(),
  type: inkTypeSchema.optional(),
  discontinued: z.enum(["include", "exclude", "only"]).default("include"),
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(48),
});
export type InkListQuery = z.infer<typeof inkListQuery>;

export type Brand = { id: number; slug: string; name: string; inkCount: number };

export type Ink = {
  id: number;
  name: string;
  brand: { id: number; slug: string; name: string };
  type: InkType;
  hex: string;
  /** CIELAB, D65 white, L* 0–100. */
  lab: LabValue;
  discontinued: boolean;
  createdAt: string;
  updatedAt: string;
};

export type InkList = { items: Ink[]; page: number; pageSize: number; total: number };

/** Create or edit an ink. The reference colour is given as hex, as L*a*b* (D65), or both. */
export const inkInput = z
  .strictObject({
    name: plainText(1, 80),
    brandId: idParam,
    type: inkTypeSchema,
    hex: hexSchema.optional(),
    lab: labSchema.optional(),
    discontinued: z.boolean().default(false),
  })
  .refine((v) => v.hex !== undefined || v.lab !== undefined, {
    message: "give the reference colour as hex or as L*a*b*",
    path: ["hex"],
  });
export type InkInput = z.input<typeof inkInput>;

export const inkPatch = z
  .strictObject({
    name: plainText(1, 80).optional(),
    brandId: idParam.optional(),
    type: inkTypeSchema.optional(),
    hex: hexSchema.optional(),
    lab: labSchema.optional(),
    discontinued: z.boolean().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: "nothing to change" });
export type InkPatch = z.input<typeof inkPatch>;

export const brandInput = z.strictObject({ name: plainText(2, 60) });

export type InkImportResult = { created: number; updated: number; brandsCreated: number };

/** Columns of our catalogue CSV, in order (documented in the README). */
export const catalogueCsvColumns = ["brand", "name", "type", "hex", "l", "a", "b", "discontinued"] as const;
