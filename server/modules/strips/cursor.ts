import { z } from "zod";
import type { StripRow } from "../../db/schema";
import { AppError } from "../../middleware/errors";

const cursorSchema = z.strictObject({ k: z.union([z.string().max(40), z.number().int()]), i: z.number().int().positive() });

/** An opaque cursor: the sort key and id of the last strip on the page. */
export function encodeCursor(sort: "newest" | "saves", row: StripRow): string {
  const k = sort === "saves" ? row.saves : (row.published_at ?? row.created_at);
  return Buffer.from(JSON.stringify({ k, i: row.id })).toString("base64url");
}

export function decodeCursor(cursor: string, sort: "newest" | "saves") {
  try {
    const parsed = cursorSchema.parse(JSON.parse(Buffer.from(cursor, "base64url").toString("utf8")));
    if ((sort === "saves") !== (typeof parsed.k === "number")) throw new Error("cursor of another sort");
    return { key: parsed.k, id: parsed.i };
  } catch {
    throw new AppError("invalid_request", "Some fields are not right.", 400, { cursor: ["is not a valid cursor"] });
  }
}
