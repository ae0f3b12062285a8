import { z } from "zod";
import type { SearchSort } from "../../../shared/schemas/search";
import { AppError } from "../../middleware/errors";

/**
 * Opaque keyset cursors: the sort, the sort key of the last strip on the page and its id.
 * newest → published_at (ISO text), saves → saves, closest → the strip's colour distance
 * (the largest of its per-colour best ΔE2000, full precision so no strip is skipped or repeated).
 */
const cursorSchema = z.discriminatedUnion("s", [
  z.strictObject({ s: z.literal("newest"), k: z.string().max(40), i: z.number().int().positive() }),
  z.strictObject({ s: z.literal("saves"), k: z.number().int().min(0), i: z.number().int().positive() }),
  z.strictObject({ s: z.literal("closest"), k: z.number().min(0).max(1000), i: z.number().int().positive() }),
]);
export type SearchCursor = z.infer<typeof cursorSchema>;

export function encodeSearchCursor(c: SearchCursor): string {
  return Buffer.from(JSON.stringify(c)).toString("base64url");
}

export function decodeSearchCursor(cursor: string, sort: SearchSort): SearchCursor {
  try {
    const parsed = cursorSchema.parse(JSON.parse(Buffer.from(cursor, "base64url").toString("utf8")));
    if (parsed.s !== sort) throw new Error("a cursor of another sort");
    return parsed;
  } catch {
    throw new AppError("invalid_request", "Some fields are not right.", 400, { cursor: ["is not a valid cursor for this search"] });
  }
}
