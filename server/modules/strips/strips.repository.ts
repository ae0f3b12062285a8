import { sql } from "kysely";
import type { DbOrTx } from "../../db/client";
import type { StripRow } from "../../db/schema";

export function findStrip(db: DbOrTx, id: number) {
  return db.selectFrom("strips").selectAll().where("id", "=", id).executeTakeFirst();
}

/** The strip posted from this strip of an upload, if any. */
export function findStripByUpload(db: DbOrTx, uploadId: string, stripIndex: number) {
  return db.selectFrom("strips").select(["id"]).where("upload_id", "=", uploadId).where("strip_index", "=", stripIndex).executeTakeFirst();
}

/** Which strips of an upload are posted (their strip_index), lowest first. */
export async function postedStripIndexes(db: DbOrTx, uploadId: string): Promise<number[]> {
  const rows = await db.selectFrom("strips").select("strip_index").where("upload_id", "=", uploadId).orderBy("strip_index").execute();
  return rows.map((r) => r.strip_index);
}

export function findUploadOf(db: DbOrTx, uploadId: string) {
  return db.selectFrom("uploads").selectAll().where("id", "=", uploadId).executeTakeFirst();
}

export async function deleteUploadRow(db: DbOrTx, uploadId: string) {
  await db.deleteFrom("uploads").where("id", "=", uploadId).execute();
}

export async function insertStrip(db: DbOrTx, row: Omit<StripRow, "id" | "version" | "saves">) {
  const r = await db.insertInto("strips").values(row).returning("id").executeTakeFirstOrThrow();
  return r.id;
}

export async function replaceInks(db: DbOrTx, stripId: number, inkIds: number[]) {
  await db.deleteFrom("strip_inks").where("strip_id", "=", stripId).execute();
  await db
    .insertInto("strip_inks")
    .values(inkIds.map((ink_id, position) => ({ strip_id: stripId, position, ink_id })))
    .execute();
}

export async function replaceBands(
  db: DbOrTx,
  stripId: number,
  bands: { start: number; end: number; lab: { l: number; a: number; b: number }; hex: string; inkId: number | null; deltaE: number | null }[],
) {
  await db.deleteFrom("strip_bands").where("strip_id", "=", stripId).execute();
  if (!bands.length) return;
  await db
    .insertInto("strip_bands")
    .values(
      bands.map((b, position) => ({
        strip_id: stripId,
        position,
        start_frac: b.start,
        end_frac: b.end,
        lab_l: b.lab.l,
        lab_a: b.lab.a,
        lab_b: b.lab.b,
        hex: b.hex,
        ink_id: b.inkId,
        delta_e: b.deltaE,
      })),
    )
    .execute();
}

export function findInksByIds(db: DbOrTx, ids: number[]) {
  if (!ids.length) return Promise.resolve([]);
  return db
    .selectFrom("inks")
    .innerJoin("brands", "brands.id", "inks.brand_id")
    .select(["inks.id", "inks.name", "inks.hex", "inks.lab_l", "inks.lab_a", "inks.lab_b", "brands.name as brand"])
    .where("inks.id", "in", ids)
    .execute();
}

export type ListFilter = {
  inks?: number[];
  authorId?: string;
  statuses: StripRow["status"][];
  sort: "newest" | "saves";
  after?: { key: string | number; id: number };
  limit: number;
};

export function listStrips(db: DbOrTx, f: ListFilter) {
  let q = db.selectFrom("strips").selectAll("strips").where("strips.status", "in", f.statuses);
  if (f.authorId) q = q.where("strips.author_id", "=", f.authorId);
  for (const inkId of f.inks ?? []) {
    q = q.where((eb) =>
      eb.exists(
        eb.selectFrom("strip_inks").select(sql`1`.as("one")).whereRef("strip_inks.strip_id", "=", "strips.id").where("strip_inks.ink_id", "=", inkId),
      ),
    );
  }
  if (f.sort === "saves") {
    if (f.after) {
      const saves = Number(f.after.key);
      q = q.where((eb) => eb.or([eb("strips.saves", "<", saves), eb.and([eb("strips.saves", "=", saves), eb("strips.id", "<", f.after!.id)])]));
    }
    q = q.orderBy("strips.saves", "desc").orderBy("strips.id", "desc");
  } else {
    // Published strips sort by when they were published; others (a member's own page) by creation.
    const when = sql<string>`coalesce(strips.published_at, strips.created_at)`;
    if (f.after) {
      const key = String(f.after.key);
      q = q.where((eb) => eb.or([eb(when, "<", key), eb.and([eb(when, "=", key), eb("strips.id", "<", f.after!.id)])]));
    }
    q = q.orderBy(when, "desc").orderBy("strips.id", "desc");
  }
  return q.limit(f.limit).execute();
}

/** Everything needed to show these strips: authors, inks in order, bands, image keys. */
export async function loadStripParts(db: DbOrTx, strips: StripRow[]) {
  const ids = strips.map((s) => s.id);
  if (!ids.length) return { authors: [], inks: [], bands: [], uploads: [] };
  const [authors, inks, bands, uploads] = await Promise.all([
    db
      .selectFrom("profiles")
      .select(["user_id", "name"])
      .where("user_id", "in", [...new Set(strips.map((s) => s.author_id))])
      .execute(),
    db
      .selectFrom("strip_inks")
      .innerJoin("inks", "inks.id", "strip_inks.ink_id")
      .innerJoin("brands", "brands.id", "inks.brand_id")
      .select(["strip_inks.strip_id", "strip_inks.position", "inks.id", "inks.name", "inks.hex", "inks.lab_l", "inks.lab_a", "inks.lab_b", "brands.name as brand"])
      .where("strip_inks.strip_id", "in", ids)
      .orderBy("strip_inks.strip_id")
      .orderBy("strip_inks.position")
      .execute(),
    db.selectFrom("strip_bands").selectAll().where("strip_id", "in", ids).orderBy("strip_id").orderBy("position").execute(),
    db
      .selectFrom("uploads")
      .select(["id", "display_key", "thumb_key", "placeholder", "width", "height"])
      .where("id", "in", strips.map((s) => s.upload_id))
      .execute(),
  ]);
  return { authors, inks, bands, uploads };
}

export async function updateStrip(db: DbOrTx, id: number, patch: Partial<Omit<StripRow, "id">>) {
  await db.updateTable("strips").set(patch).where("id", "=", id).execute();
}

export async function deleteStrip(db: DbOrTx, id: number) {
  await db.deleteFrom("strips").where("id", "=", id).execute();
}

/** Strips sharing the most inks with this one (published only), most shared first. */
export function relatedStripIds(db: DbOrTx, stripId: number, limit: number) {
  return db
    .selectFrom("strip_inks as mine")
    .innerJoin("strip_inks as theirs", "theirs.ink_id", "mine.ink_id")
    .innerJoin("strips", "strips.id", "theirs.strip_id")
    .select(["theirs.strip_id", (eb) => eb.fn.countAll<number>().as("shared")])
    .where("mine.strip_id", "=", stripId)
    .where("theirs.strip_id", "!=", stripId)
    .where("strips.status", "=", "published")
    .groupBy("theirs.strip_id")
    .orderBy("shared", "desc")
    .orderBy("theirs.strip_id", "desc")
    .limit(limit)
    .execute();
}

/** Perceptual hashes of other strips, for duplicate checks (a scan: fine at one machine's scale). */
export function listPhashes(db: DbOrTx) {
  return db.selectFrom("strips").select(["id", "phash"]).where("phash", "is not", null).execute();
}
