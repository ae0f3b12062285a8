import { sql } from "kysely";
import type { InkListQuery } from "../../../shared/schemas/inks";
import type { DbOrTx } from "../../db/client";
import type { InkUpdate, NewInk } from "../../db/schema";

const inkColumns = [
  "inks.id",
  "inks.name",
  "inks.type",
  "inks.hex",
  "inks.lab_l",
  "inks.lab_a",
  "inks.lab_b",
  "inks.discontinued",
  "inks.created_at",
  "inks.updated_at",
  "brands.id as brand_id",
  "brands.slug as brand_slug",
  "brands.name as brand_name",
] as const;

function inksWithBrand(db: DbOrTx) {
  return db.selectFrom("inks").innerJoin("brands", "brands.id", "inks.brand_id");
}

function escapeLike(s: string) {
  return s.replace(/[\\%_]/g, (c) => `\\${c}`);
}

export async function listInks(db: DbOrTx, q: InkListQuery) {
  let query = inksWithBrand(db);
  if (q.q) {
    const like = `%${escapeLike(q.q)}%`;
    query = query.where((eb) =>
      eb.or([
        sql<boolean>`inks.name like ${like} escape '\\'`,
        sql<boolean>`brands.name like ${like} escape '\\'`,
        eb("inks.hex", "=", q.q!.toLowerCase().startsWith("#") ? q.q!.toLowerCase() : `#${q.q!.toLowerCase()}`),
      ]),
    );
  }
  if (q.brand) query = query.where("brands.slug", "=", q.brand);
  if (q.type) query = query.where("inks.type", "=", q.type);
  if (q.discontinued === "exclude") query = query.where("inks.discontinued", "=", 0);
  if (q.discontinued === "only") query = query.where("inks.discontinued", "=", 1);

  const { total } = await query.select((eb) => eb.fn.countAll<number>().as("total")).executeTakeFirstOrThrow();
  const rows = await query
    .select(inkColumns)
    .orderBy(sql`inks.name collate nocase`)
    .orderBy("brands.name")
    .orderBy("inks.id")
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize)
    .execute();
  return { rows, total: Number(total) };
}
export type InkJoinedRow = Awaited<ReturnType<typeof listInks>>["rows"][number];

export function findInk(db: DbOrTx, id: number) {
  return inksWithBrand(db).select(inkColumns).where("inks.id", "=", id).executeTakeFirst();
}

export function findInkByBrandAndName(db: DbOrTx, brandId: number, name: string) {
  return db
    .selectFrom("inks")
    .select(["id"])
    .where("brand_id", "=", brandId)
    .where(sql<boolean>`name = ${name} collate nocase`)
    .executeTakeFirst();
}

export async function insertInk(db: DbOrTx, ink: NewInk): Promise<number> {
  const row = await db.insertInto("inks").values(ink).returning("id").executeTakeFirstOrThrow();
  return row.id;
}

export async function updateInk(db: DbOrTx, id: number, patch: InkUpdate) {
  await db.updateTable("inks").set(patch).where("id", "=", id).execute();
}

export function listBrands(db: DbOrTx) {
  return db
    .selectFrom("brands")
    .leftJoin("inks", "inks.brand_id", "brands.id")
    .select(["brands.id", "brands.slug", "brands.name", (eb) => eb.fn.count<number>("inks.id").as("ink_count")])
    .groupBy("brands.id")
    .orderBy(sql`brands.name collate nocase`)
    .execute();
}

export function findBrand(db: DbOrTx, id: number) {
  return db.selectFrom("brands").selectAll().where("id", "=", id).executeTakeFirst();
}

export function findBrandByName(db: DbOrTx, name: string) {
  return db
    .selectFrom("brands")
    .selectAll()
    .where(sql<boolean>`name = ${name} collate nocase`)
    .executeTakeFirst();
}

export function findBrandBySlug(db: DbOrTx, slug: string) {
  return db.selectFrom("brands").selectAll().where("slug", "=", slug).executeTakeFirst();
}

export async function insertBrand(db: DbOrTx, brand: { slug: string; name: string; created_at: string }) {
  const row = await db.insertInto("brands").values(brand).returning("id").executeTakeFirstOrThrow();
  return row.id;
}
