import { sql, type Kysely } from "kysely";

// The colour index for search: every strip band, filed under a cell of (L*, C*ab, h_ab) in a
// table clustered by cell (WITHOUT ROWID, primary key (cell, band)), with its exact L*a*b*, C*
// and h beside it. A colour search reads a few contiguous runs of cells and never touches
// strip_bands. Triggers keep it in step with strip_bands, so nothing that writes bands needs to
// know it exists. Why this shape: docs/decisions/004-colour-search-index.md.
//
// Cells: L* in steps of 5 (0–120, outside clamped), C* in steps of 5 (0–320, above clamped),
// h in steps of 5° (0–360); cell = (lIdx * 64 + cIdx) * 72 + hIdx, so within one (L*, C*) cell
// the hues are contiguous. server/modules/search/colour-cells.ts has the same numbers.
// band = strip_id * 1024 + position (a strip has a handful of bands; a position outside
// 0–1023 is refused rather than filed under a clashing key).
// Chroma and hue use SQLite's math functions (compiled into better-sqlite3).

type Row = "new" | "old" | "b";
const c = (p: Row) => `sqrt(${p}.lab_a * ${p}.lab_a + ${p}.lab_b * ${p}.lab_b)`;
const h = (p: Row) =>
  `(case when ${p}.lab_a = 0 and ${p}.lab_b = 0 then 0.0 ` +
  `when atan2(${p}.lab_b, ${p}.lab_a) < 0 then degrees(atan2(${p}.lab_b, ${p}.lab_a)) + 360.0 ` +
  `else degrees(atan2(${p}.lab_b, ${p}.lab_a)) end)`;
const cell = (p: Row) =>
  `((min(max(cast(${p}.lab_l / 5 as integer), 0), 23) * 64 + min(cast(${c(p)} / 5 as integer), 63)) * 72 + ` +
  `min(cast(${h(p)} / 5 as integer), 71))`;
const band = (p: Row) => `(${p}.strip_id * 1024 + ${p}.position)`;
const values = (p: Row) => `${cell(p)}, ${band(p)}, ${p}.strip_id, ${p}.position, ${p}.lab_l, ${p}.lab_a, ${p}.lab_b, ${c(p)}, ${h(p)}`;
const columns = "cell, band, strip_id, position, l, a, b, c, h";
const guard = `select raise(abort, 'a band position must be between 0 and 1023') where new.position < 0 or new.position > 1023;`;

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table strip_band_colours (
      cell integer not null,
      band integer not null,
      strip_id integer not null,
      position integer not null,
      l real not null,
      a real not null,
      b real not null,
      c real not null,
      h real not null,
      primary key (cell, band)
    ) without rowid`.execute(db);
  // One entry per band whatever happens: "insert or replace" below then also clears an entry left
  // under an old cell (with REPLACE conflict handling on strip_bands the delete trigger fires only
  // when recursive triggers are on).
  await sql`create unique index strip_band_colours_band on strip_band_colours (band)`.execute(db);
  const odd = await sql<{ n: number }>`select count(*) as n from strip_bands where position < 0 or position > 1023`.execute(db);
  if (Number(odd.rows[0]?.n ?? 0) > 0) throw new Error("strip_bands has positions outside 0–1023; the colour index cannot key them");
  // Search looks strips up by id only to learn whether they are published and their sort keys:
  // this partial index answers that from a few compact pages instead of the wide table rows.
  await sql`create index strips_search_visible on strips (id, published_at, saves) where status = 'published'`.execute(db);
  await sql.raw(`insert into strip_band_colours (${columns}) select ${values("b")} from strip_bands b`).execute(db);
  await sql
    .raw(
      `create trigger strip_bands_colour_insert after insert on strip_bands begin
         ${guard}
         insert or replace into strip_band_colours (${columns}) values (${values("new")});
       end`,
    )
    .execute(db);
  await sql
    .raw(
      `create trigger strip_bands_colour_update after update of strip_id, position, lab_l, lab_a, lab_b on strip_bands begin
         ${guard}
         delete from strip_band_colours where band = ${band("old")};
         insert or replace into strip_band_colours (${columns}) values (${values("new")});
       end`,
    )
    .execute(db);
  await sql
    .raw(
      `create trigger strip_bands_colour_delete after delete on strip_bands begin
         delete from strip_band_colours where band = ${band("old")};
       end`,
    )
    .execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop trigger if exists strip_bands_colour_delete`.execute(db);
  await sql`drop trigger if exists strip_bands_colour_update`.execute(db);
  await sql`drop trigger if exists strip_bands_colour_insert`.execute(db);
  await sql`drop table if exists strip_band_colours`.execute(db);
  await sql`drop index if exists strips_search_visible`.execute(db);
}
