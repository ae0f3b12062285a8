import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { sql } from "kysely";
import { afterEach, describe, expect, it } from "vitest";
import { migrations } from "../../migrations";
import { openDatabase, type Db } from "../../server/db/client";
import { createMigrator, migrateDown, migrateToLatest } from "../../server/db/migrate";

let db: Db | undefined;
let dir: string | undefined;
afterEach(async () => {
  await db?.destroy();
  if (dir) rmSync(dir, { recursive: true, force: true });
});

const tables = async (d: Db) =>
  (await sql<{ name: string }>`select name from sqlite_master where type = 'table' and name not like 'kysely_%' and name not like 'sqlite_%'`.execute(d)).rows
    .map((r) => r.name)
    .sort();

describe("migrations", () => {
  it("run up to the latest, all the way down, and up again", async () => {
    dir = mkdtempSync(path.join(os.tmpdir(), "blendwell-migrate-"));
    db = openDatabase(path.join(dir, "m.sqlite"));
    await migrateToLatest(db);
    const up = await tables(db);
    expect(up).toEqual(expect.arrayContaining(["User", "Account", "Session", "VerificationToken", "profiles", "passwords", "brands", "inks"]));
    for (let i = 0; i < Object.keys(migrations).length; i++) await migrateDown(db);
    expect(await tables(db)).toEqual([]);
    await migrateToLatest(db);
    expect(await tables(db)).toEqual(up);
  });

  it("open the database with WAL, foreign keys and a busy timeout", async () => {
    dir = mkdtempSync(path.join(os.tmpdir(), "blendwell-migrate-"));
    db = openDatabase(path.join(dir, "m.sqlite"));
    const mode = await sql<{ journal_mode: string }>`pragma journal_mode`.execute(db);
    const fk = await sql<{ foreign_keys: number }>`pragma foreign_keys`.execute(db);
    const busy = await sql<{ timeout: number }>`pragma busy_timeout`.execute(db);
    expect(mode.rows[0]!.journal_mode).toBe("wal");
    expect(fk.rows[0]!.foreign_keys).toBe(1);
    expect(busy.rows[0]!.timeout).toBeGreaterThan(0);
  });

  it("keep migration names in the order they run", () => {
    const names = Object.keys(migrations);
    expect(names).toEqual([...names].sort());
  });

  it("0008 rebuilds strips keeping every row, id and link; several strips may then share one upload", async () => {
    dir = mkdtempSync(path.join(os.tmpdir(), "blendwell-migrate-"));
    db = openDatabase(path.join(dir, "m.sqlite"));
    const result = await createMigrator(db).migrateTo("20261202_0007_binders_and_stash");
    expect(result.error).toBeUndefined();
    const now = new Date().toISOString();
    await sql`insert into "User" (id, name, email) values ('u1', 'A', 'a@blendwell.test')`.execute(db);
    for (const id of ["up1", "up2"]) {
      await sql`insert into uploads (id, owner_id, status, mime, byte_size, created_at, updated_at) values (${id}, 'u1', 'ready', 'image/jpeg', 1, ${now}, ${now})`.execute(db);
    }
    // Ids 1 and 5 (2–4 were deleted), so AUTOINCREMENT must not hand out 2 again.
    for (const [id, up] of [[1, "up1"], [5, "up2"]] as const) {
      await sql`insert into strips (id, author_id, upload_id, title, paper, status, orientation, ink_count, created_at, updated_at)
        values (${id}, 'u1', ${up}, 'T', 'other', 'published', 'horizontal', 1, ${now}, ${now})`.execute(db);
      await sql`insert into strip_bands (strip_id, position, start_frac, end_frac, lab_l, lab_a, lab_b, hex) values (${id}, 0, 0, 1, 50, 10, 10, '#886655')`.execute(db);
    }
    await sql`update sqlite_sequence set seq = 9 where name = 'strips'`.execute(db);
    await sql`insert into binders (id, owner_id, name, visibility, created_at, updated_at) values (1, 'u1', 'B', 'private', ${now}, ${now})`.execute(db);
    await sql`insert into binder_items (binder_id, strip_id, position, added_at) values (1, 5, 0, ${now})`.execute(db);

    await migrateToLatest(db);
    const rows = await sql<{ id: number; upload_id: string; strip_index: number }>`select id, upload_id, strip_index from strips order by id`.execute(db);
    expect(rows.rows).toEqual([
      { id: 1, upload_id: "up1", strip_index: 0 },
      { id: 5, upload_id: "up2", strip_index: 0 },
    ]);
    // The colour index (kept by triggers on strip_bands) and binder items still point at them.
    expect((await sql<{ n: number }>`select count(*) as n from strip_band_colours`.execute(db)).rows[0]!.n).toBe(2);
    expect((await sql`pragma foreign_key_check`.execute(db)).rows).toEqual([]);
    expect((await sql<{ foreign_keys: number }>`pragma foreign_keys`.execute(db)).rows[0]!.foreign_keys).toBe(1);

    const insert = (index: number) =>
      sql`insert into strips (author_id, upload_id, strip_index, title, paper, status, orientation, ink_count, created_at, updated_at)
        values ('u1', 'up1', ${index}, 'T', 'other', 'pending', 'horizontal', 1, ${now}, ${now}) returning id`.execute(db!);
    const second = await insert(1);
    expect((second.rows[0] as { id: number }).id).toBe(10);
    await expect(insert(1)).rejects.toThrow(/UNIQUE/);
    await expect(insert(-1)).rejects.toThrow(/CHECK/);
    // Deleting a strip still cascades to its bands, colour index entries and binder items.
    await sql`delete from strips where id = 5`.execute(db);
    expect((await sql<{ n: number }>`select count(*) as n from binder_items`.execute(db)).rows[0]!.n).toBe(0);
    expect((await sql<{ n: number }>`select count(*) as n from strip_band_colours`.execute(db)).rows[0]!.n).toBe(1);
    // Going back down past 0008 is refused while a photo has several strips, and says why
    // (the migrations after it step down first).
    await createMigrator(db).migrateTo("20261210_0008_strips_per_upload");
    await expect(migrateDown(db)).rejects.toThrow(/several strips/);
  });
});
