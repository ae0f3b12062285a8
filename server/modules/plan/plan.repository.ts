import { sql } from "kysely";
import type { DbOrTx } from "../../db/client";

export type CatalogueInkRow = {
  id: number;
  name: string;
  brand_id: number;
  brand: string;
  hex: string;
  lab_l: number;
  lab_a: number;
  lab_b: number;
  discontinued: 0 | 1;
};

/** Changes whenever an ink is added, edited or removed: the bridge finder's cache key. */
export async function catalogueVersion(db: DbOrTx): Promise<string> {
  const row = await db
    .selectFrom("inks")
    .select((eb) => [eb.fn.countAll<number>().as("n"), eb.fn.max("id").as("top"), eb.fn.max("updated_at").as("at")])
    .executeTakeFirst();
  return `${row?.n ?? 0}:${row?.top ?? 0}:${row?.at ?? ""}`;
}

export function catalogueInks(db: DbOrTx): Promise<CatalogueInkRow[]> {
  return db
    .selectFrom("inks as i")
    .innerJoin("brands as b", "b.id", "i.brand_id")
    .select(["i.id", "i.name", "i.brand_id", "b.name as brand", "i.hex", "i.lab_l", "i.lab_a", "i.lab_b", "i.discontinued"])
    .orderBy("i.id")
    .execute();
}

export async function stashInkIds(db: DbOrTx, userId: string): Promise<number[]> {
  const rows = await db.selectFrom("stash_items").select("ink_id").where("user_id", "=", userId).execute();
  return rows.map((r) => r.ink_id);
}

/**
 * For each pair of inks (either order), how many published strips have them side by side in
 * their ink order.
 */
export async function besideCounts(db: DbOrTx, pairs: [number, number][]): Promise<Map<string, number>> {
  const out = new Map<string, number>();
  if (!pairs.length) return out;
  const result = await sql<{ a: number; b: number; n: number }>`
    with p (a, b) as (select value ->> 0, value ->> 1 from json_each(${JSON.stringify(pairs)}))
    select p.a, p.b, count(distinct x.strip_id) as n
    from p
    join strip_inks x on x.ink_id = p.a
    join strip_inks y on y.strip_id = x.strip_id and y.ink_id = p.b and abs(y.position - x.position) = 1
    join strips s on s.id = x.strip_id and s.status = 'published'
    group by p.a, p.b`.execute(db);
  for (const r of result.rows) out.set(pairKey(r.a, r.b), Number(r.n));
  return out;
}

export const pairKey = (a: number, b: number) => (a < b ? `${a}-${b}` : `${b}-${a}`);

export type BesideRow = { ink_id: number; n: number };

/** The inks most often directly next to this one in published strips, most strips first. */
export async function inksBeside(db: DbOrTx, inkId: number, limit: number): Promise<BesideRow[]> {
  const result = await sql<BesideRow>`
    select nb.ink_id, count(*) as n
    from strip_inks a
    join strip_inks nb on nb.strip_id = a.strip_id and abs(nb.position - a.position) = 1
    join strips s on s.id = a.strip_id and s.status = 'published'
    where a.ink_id = ${inkId}
    group by nb.ink_id
    order by n desc, nb.ink_id
    limit ${limit}`.execute(db);
  return result.rows.map((r) => ({ ink_id: r.ink_id, n: Number(r.n) }));
}

export type BesideExample = { neighbour: number; id: number; title: string };

/** Up to `per` newest published strips with the ink beside each of these neighbours. */
export async function besideExamples(db: DbOrTx, inkId: number, neighbours: number[], per: number): Promise<BesideExample[]> {
  if (!neighbours.length) return [];
  const result = await sql<BesideExample>`
    select neighbour, id, title from (
      select nb.ink_id as neighbour, s.id, s.title,
        row_number() over (partition by nb.ink_id order by s.published_at desc, s.id desc) as rn
      from strip_inks a
      join strip_inks nb on nb.strip_id = a.strip_id and abs(nb.position - a.position) = 1
      join strips s on s.id = a.strip_id and s.status = 'published'
      where a.ink_id = ${inkId} and nb.ink_id in (select value from json_each(${JSON.stringify(neighbours)}))
    ) where rn <= ${per}
    order by neighbour, rn`.execute(db);
  return result.rows;
}

export async function inkExists(db: DbOrTx, inkId: number): Promise<boolean> {
  return !!(await db.selectFrom("inks").select("id").where("id", "=", inkId).executeTakeFirst());
}

/** The member's stash with each ink's colour, and the member's name. */
export async function stashForChart(db: DbOrTx, userId: string) {
  const inks = await db
    .selectFrom("stash_items as s")
    .innerJoin("inks as i", "i.id", "s.ink_id")
    .innerJoin("brands as b", "b.id", "i.brand_id")
    .select(["i.id", "i.name", "b.name as brand", "i.hex", "i.lab_l", "i.lab_a", "i.lab_b"])
    .where("s.user_id", "=", userId)
    .orderBy("i.name")
    .execute();
  const profile = await db.selectFrom("profiles").select("name").where("user_id", "=", userId).executeTakeFirst();
  return { name: profile?.name ?? "", inks };
}

export function binderById(db: DbOrTx, id: number) {
  return db.selectFrom("binders").select(["id", "owner_id", "visibility"]).where("id", "=", id).executeTakeFirst();
}

export function binderPlans(db: DbOrTx, binderId: number) {
  return db.selectFrom("binder_plans").selectAll().where("binder_id", "=", binderId).orderBy("id", "desc").execute();
}

export async function countBinderPlans(db: DbOrTx, binderId: number): Promise<number> {
  const row = await db.selectFrom("binder_plans").select((eb) => eb.fn.countAll<number>().as("n")).where("binder_id", "=", binderId).executeTakeFirst();
  return Number(row?.n ?? 0);
}

export function insertBinderPlan(db: DbOrTx, binderId: number, inkIds: number[], at: string) {
  return db.insertInto("binder_plans").values({ binder_id: binderId, ink_ids: JSON.stringify(inkIds), added_at: at }).returningAll().executeTakeFirstOrThrow();
}

export async function deleteBinderPlan(db: DbOrTx, binderId: number, planId: number): Promise<boolean> {
  const r = await db.deleteFrom("binder_plans").where("binder_id", "=", binderId).where("id", "=", planId).executeTakeFirst();
  return Number(r.numDeletedRows) > 0;
}
