import { z } from "zod";

export const idParam = z.coerce
  .number({ error: "must be a number" })
  .int("must be a whole number")
  .positive("must be positive")
  .max(Number.MAX_SAFE_INTEGER);

export const idParams = z.strictObject({ id: idParam });

export const labSchema = z.strictObject({
  l: z.number().min(0).max(100),
  a: z.number().min(-128).max(128),
  b: z.number().min(-128).max(128),
});
export type LabValue = z.infer<typeof labSchema>;

export const hexSchema = z
  .string()
  .trim()
  .regex(/^#?([0-9a-fA-F]{3}|[0-9a-fA-F]{6})$/, "must be a hex colour such as #3a6f8c")
  .transform((s) => {
    let h = s.replace(/^#/, "").toLowerCase();
    if (h.length === 3) h = [...h].map((c) => c + c).join("");
    return `#${h}`;
  });

/** Plain text a person typed: trimmed, no control characters. */
export const plainText = (min: number, max: number) =>
  z
    .string()
    .trim()
    .min(min, min <= 1 ? "is required" : `needs at least ${min} characters`)
    .max(max, `must be at most ${max} characters`)
    // eslint-disable-next-line no-control-regex -- control characters are exactly what we refuse
    .refine((s) => !/[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/.test(s), "contains control characters");
