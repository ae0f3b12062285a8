import type { DbOrTx } from "../../db/client";
import type { UploadRow } from "../../db/schema";

export function findUpload(db: DbOrTx, id: string) {
  return db.selectFrom("uploads").selectAll().where("id", "=", id).executeTakeFirst();
}

export async function insertUpload(
  db: DbOrTx,
  row: Pick<UploadRow, "id" | "owner_id" | "original_key" | "mime" | "byte_size" | "white_x" | "white_y" | "created_at">,
) {
  await db
    .insertInto("uploads")
    .values({ ...row, status: "processing", updated_at: row.created_at })
    .execute();
}

export async function markProcessing(db: DbOrTx, id: string, white: { x: number; y: number } | null, now: string) {
  await db
    .updateTable("uploads")
    .set({ status: "processing", white_x: white?.x ?? null, white_y: white?.y ?? null, error_code: null, error_message: null, updated_at: now })
    .where("id", "=", id)
    .execute();
}

export async function startAttempt(db: DbOrTx, id: string) {
  await db
    .updateTable("uploads")
    .set((eb) => ({ attempts: eb("attempts", "+", 1) }))
    .where("id", "=", id)
    .execute();
}

export async function markReady(
  db: DbOrTx,
  id: string,
  r: Pick<UploadRow, "analysis_json" | "display_key" | "thumb_key" | "placeholder" | "phash" | "width" | "height">,
  now: string,
) {
  await db
    .updateTable("uploads")
    .set({ ...r, status: "ready", attempts: 0, error_code: null, error_message: null, updated_at: now })
    .where("id", "=", id)
    .execute();
}

export async function markFailed(db: DbOrTx, id: string, code: string, message: string, now: string) {
  await db
    .updateTable("uploads")
    .set({
      status: "failed",
      error_code: code,
      error_message: message,
      original_key: null,
      analysis_json: null,
      display_key: null,
      thumb_key: null,
      placeholder: null,
      updated_at: now,
    })
    .where("id", "=", id)
    .execute();
}

/** A re-run that failed keeps the photo and files, so the member can try another white point. */
export async function markRerunFailed(db: DbOrTx, id: string, code: string, message: string, now: string) {
  await db
    .updateTable("uploads")
    .set({ status: "failed", error_code: code, error_message: message, updated_at: now })
    .where("id", "=", id)
    .execute();
}

export function listProcessing(db: DbOrTx) {
  return db.selectFrom("uploads").selectAll().where("status", "=", "processing").orderBy("created_at").execute();
}

export async function loadCatalogue(db: DbOrTx) {
  const rows = await db
    .selectFrom("inks")
    .innerJoin("brands", "brands.id", "inks.brand_id")
    .select(["inks.id", "inks.name", "inks.hex", "inks.lab_l", "inks.lab_a", "inks.lab_b", "brands.name as brand"])
    .execute();
  return rows.map((r) => ({ id: r.id, name: r.name, brand: r.brand, hex: r.hex, lab: { l: r.lab_l, a: r.lab_a, b: r.lab_b } }));
}

/** Uploads never posted as a strip, last touched before the cutoff. */
export function listStaleDrafts(db: DbOrTx, cutoff: string) {
  return db
    .selectFrom("uploads")
    .select(["id", "original_key"])
    .where("updated_at", "<", cutoff)
    .where("status", "!=", "processing")
    .where(({ not, exists, selectFrom }) =>
      not(exists(selectFrom("strips").select("strips.id").whereRef("strips.upload_id", "=", "uploads.id"))),
    )
    .execute();
}

export async function deleteUpload(db: DbOrTx, id: string) {
  await db.deleteFrom("uploads").where("id", "=", id).execute();
}

/** Which strips of this upload are posted (strip_index), lowest first. */
export async function postedStripIndexes(db: DbOrTx, uploadId: string): Promise<number[]> {
  const rows = await db.selectFrom("strips").select("strip_index").where("upload_id", "=", uploadId).orderBy("strip_index").execute();
  return rows.map((r) => r.strip_index);
}

/** After strip `removed` is taken out of the analysis, posted strips after it move up one. */
export async function renumberPostedAfterRemoval(db: DbOrTx, uploadId: string, removed: number) {
  // Through a parking range far above any strip number (a photo holds at most a dozen), so
  // unique (upload_id, strip_index) and strip_index >= 0 hold after every row.
  const PARK = 1_000_000;
  await db
    .updateTable("strips")
    .set((eb) => ({ strip_index: eb("strip_index", "+", PARK) }))
    .where("upload_id", "=", uploadId)
    .where("strip_index", ">", removed)
    .execute();
  await db
    .updateTable("strips")
    .set((eb) => ({ strip_index: eb("strip_index", "-", PARK + 1) }))
    .where("upload_id", "=", uploadId)
    .where("strip_index", ">=", PARK)
    .execute();
}

export async function saveAnalysis(db: DbOrTx, id: string, analysisJson: string, now: string) {
  await db.updateTable("uploads").set({ analysis_json: analysisJson, updated_at: now }).where("id", "=", id).execute();
}

/** The strips posted from this upload: number in the analysis, id, status. */
export function postedStrips(db: DbOrTx, uploadId: string) {
  return db.selectFrom("strips").select(["strip_index", "id", "status"]).where("upload_id", "=", uploadId).orderBy("strip_index").execute();
}
