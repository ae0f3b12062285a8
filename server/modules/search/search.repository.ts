import { sql, type RawBuilder } from "kysely";
import type { InkType } from "../../../shared/schemas/inks";
import type { papers } from "../../../shared/schemas/strips";
import type { StripRow } from "../../db/schema";
import type { ColourBox } from "./colour-bounds";
import { cellRuns } from "./colour-cells";
import type { SearchDb } from "./search-tables";

/** What narrows a search besides colour. Every strip is also required to be published. */
export type StripFilter = {
  /** All of these inks are in the strip. */
  inks: number[];
  /** None of these inks is in the strip. */
  notInks: number[];
  /** For each brand, at least one ink of that brand. */
  brandIds: number[];
  /** At least one ink of this type. */
  inkType?: InkType;
  inkCount?: number;
  paper?: (typeof papers)[number];
  authorId?: string;
  /** These two inks directly next to each other in the ink order (either way round). */
  adjacent?: [number, number];
  /** Strips blendable from this member's stash ("all"), or missing exactly one ink of it. */
  stash?: { userId: string; mode: "all" | "missingOne" };
};

export type KeysetSort = "newest" | "saves";
export type Keyset = { key: string | number; id: number };

/**
 * Conditions on the strip's inks, written against an id expression: the strip's own id, or the
 * outer row it comes from (a driving ink, a list of ids), so SQLite checks them before it reads
 * the strip at all.
 */
function inkConditions(f: StripFilter, id: RawBuilder<unknown>, requiredDone = false): RawBuilder<unknown>[] {
  const has = (inkId: number) => sql`exists (select 1 from strip_inks fi where fi.strip_id = ${id} and fi.ink_id = ${inkId})`;
  const c: RawBuilder<unknown>[] = [];
  if (!requiredDone) for (const inkId of f.inks) c.push(has(inkId));
  for (const inkId of f.notInks) c.push(sql`not ${has(inkId)}`);
  for (const brandId of f.brandIds) {
    c.push(sql`exists (select 1 from strip_inks fb join inks ib on ib.id = fb.ink_id where fb.strip_id = ${id} and ib.brand_id = ${brandId})`);
  }
  if (f.inkType) {
    c.push(sql`exists (select 1 from strip_inks ft join inks it on it.id = ft.ink_id where ft.strip_id = ${id} and it.type = ${f.inkType})`);
  }
  if (f.adjacent) {
    const [a, b] = f.adjacent;
    c.push(sql`exists (select 1 from strip_inks fa join strip_inks fn on fn.strip_id = fa.strip_id and abs(fn.position - fa.position) = 1
      where fa.strip_id = ${id} and fa.ink_id = ${a} and fn.ink_id = ${b})`);
  }
  if (f.stash) {
    const notOwned = sql`select count(*) from strip_inks fs where fs.strip_id = ${id}
      and fs.ink_id not in (select ink_id from stash_items where user_id = ${f.stash.userId})`;
    c.push(sql`(${notOwned}) = ${f.stash.mode === "all" ? 0 : 1}`);
  }
  return c;
}

/** Conditions on `strips as s`; the first is always the visibility rule. */
function stripConditions(f: StripFilter): RawBuilder<unknown>[] {
  const c: RawBuilder<unknown>[] = [sql`s.status = 'published'`];
  if (f.inkCount !== undefined) c.push(sql`s.ink_count = ${f.inkCount}`);
  if (f.paper) c.push(sql`s.paper = ${f.paper}`);
  if (f.authorId) c.push(sql`s.author_id = ${f.authorId}`);
  return c;
}

/**
 * `strips as s` for looking strips up by id. When only visibility and the sort keys are needed,
 * through the partial index strips_search_visible (id, published_at, saves) of published strips:
 * a few megabytes that stay in the page cache, where the table's wide rows do not.
 */
function stripsById(f: StripFilter) {
  const needsRow = f.inkCount !== undefined || !!f.paper || !!f.authorId;
  return needsRow ? sql`strips s` : sql`strips s indexed by strips_search_visible`;
}

const and = (parts: RawBuilder<unknown>[]) => sql.join(parts, sql` and `);

export async function findKnownInks(db: SearchDb, ids: number[]) {
  if (!ids.length) return [];
  return db.selectFrom("inks").select("id").where("id", "in", ids).execute();
}

export async function findBrandsBySlug(db: SearchDb, slugs: string[]) {
  if (!slugs.length) return [];
  return db.selectFrom("brands").select(["id", "slug"]).where("slug", "in", slugs).execute();
}

/** An upper estimate of the number of strips, without counting them. */
export async function stripCountEstimate(db: SearchDb) {
  const row = await db.selectFrom("strips").select((eb) => eb.fn.max("id").as("n")).executeTakeFirst();
  return Number(row?.n ?? 0);
}

const sortKey = (sort: KeysetSort) => (sort === "saves" ? sql`s.saves` : sql`s.published_at`);

/**
 * A page of published strips matching the filter, newest or most saved first (keyset paging),
 * walking strips in that order (index strips_status_published / strips_status_saves); quick
 * when matches are common.
 */
export async function listStrips(db: SearchDb, f: StripFilter, sort: KeysetSort, after: Keyset | undefined, limit: number) {
  const where = [...stripConditions(f), ...inkConditions(f, sql`s.id`)];
  const key = sortKey(sort);
  if (after) where.push(sql`(${key}, s.id) < (${after.key}, ${after.id})`);
  const result = await sql<StripRow>`select s.* from strips s where ${and(where)} order by ${key} desc, s.id desc limit ${limit}`.execute(db);
  return result.rows;
}

/**
 * Strips holding every required ink: the inks' runs of index strip_inks_ink (sorted by strip id)
 * merged by INTERSECT, then each strip looked up once; CROSS JOIN keeps SQLite to that order.
 */
function fromRequiredInks(f: StripFilter) {
  const runs = sql.join(
    f.inks.map((inkId) => sql`select strip_id from strip_inks where ink_id = ${inkId}`),
    sql` intersect `,
  );
  return sql`(${runs}) d cross join ${stripsById(f)} on s.id = d.strip_id`;
}

/** How many published strips match; with required inks, counted from their strips. */
export async function countStrips(db: SearchDb, f: StripFilter) {
  const query = f.inks.length
    ? sql<{ n: number }>`select count(*) as n from ${fromRequiredInks(f)} where ${and([...inkConditions(f, sql`d.strip_id`, true), ...stripConditions(f)])}`
    : sql<{ n: number }>`select count(*) as n from strips s where ${and([...stripConditions(f), ...inkConditions(f, sql`s.id`)])}`;
  const result = await query.execute(db);
  return Number(result.rows[0]?.n ?? 0);
}

/** Ids and sort keys of every published strip matching the filter (which has required inks). */
export async function matchingKeys(db: SearchDb, f: StripFilter, sort: KeysetSort) {
  const result = await sql<{ id: number; k: string | number | null }>`
    select s.id, ${sortKey(sort)} as k from ${fromRequiredInks(f)}
    where ${and([...inkConditions(f, sql`d.strip_id`, true), ...stripConditions(f)])}`.execute(db);
  return result.rows;
}

export type BandCandidate = { strip_id: number; position: number; l: number; a: number; b: number };

/**
 * Every band whose index entry lies in one of the boxes (and a few more: each box is read as
 * runs of whole cells, then trimmed to the box by its own limits). Any status: visibility is
 * checked on the strips that match. A band on the edge of two boxes comes back twice, which
 * the caller's "best band per strip" ignores.
 */
export async function bandsInBoxes(db: SearchDb, boxes: ColourBox[]) {
  const runs: number[][] = [];
  for (const b of boxes) {
    for (const [lo, hi] of cellRuns(b)) runs.push([lo, hi, b.lMin, b.lMax, b.cMin, b.cMax, b.hMin, b.hMax]);
  }
  if (!runs.length) return [];
  const result = await sql<BandCandidate>`
    with r (lo, hi, l0, l1, c0, c1, h0, h1) as materialized (
      select value ->> 0, value ->> 1, value ->> 2, value ->> 3, value ->> 4, value ->> 5, value ->> 6, value ->> 7
      from json_each(${JSON.stringify(runs)})
    )
    select x.strip_id, x.position, x.l, x.a, x.b
    from r cross join strip_band_colours x on x.cell between r.lo and r.hi
    where x.l between r.l0 and r.l1 and x.c between r.c0 and r.c1 and x.h between r.h0 and r.h1`.execute(db);
  return result.rows;
}

/** Of these strips, the ones a visitor may see that match the filter, with their sort keys. */
export async function visibleStrips(db: SearchDb, ids: number[], f: StripFilter) {
  if (!ids.length) return [];
  const sorted = [...ids].sort((a, b) => a - b);
  const result = await sql<{ id: number; published_at: string | null; saves: number }>`
    select s.id, s.published_at, s.saves
    from json_each(${JSON.stringify(sorted)}) j cross join ${stripsById(f)} on s.id = j.value
    where ${and([...inkConditions(f, sql`j.value`), ...stripConditions(f)])}`.execute(db);
  return result.rows;
}

/** The bands (exact L*a*b*) of these strips, by strip. */
export async function bandsOfStrips(db: SearchDb, ids: number[]) {
  const out = new Map<number, { position: number; l: number; a: number; b: number }[]>();
  if (!ids.length) return out;
  const rows = await db
    .selectFrom("strip_bands")
    .select(["strip_id", "position", "lab_l", "lab_a", "lab_b"])
    .where("strip_id", "in", ids)
    .orderBy("strip_id")
    .orderBy("position")
    .execute();
  for (const r of rows) {
    const list = out.get(r.strip_id) ?? [];
    list.push({ position: r.position, l: r.lab_l, a: r.lab_a, b: r.lab_b });
    out.set(r.strip_id, list);
  }
  return out;
}

export async function findStripsByIds(db: SearchDb, ids: number[]) {
  if (!ids.length) return [];
  return db.selectFrom("strips").selectAll().where("id", "in", ids).where("status", "=", "published").execute();
}
