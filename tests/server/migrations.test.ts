import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { sql } from "kysely";
import { afterEach, describe, expect, it } from "vitest";
import { migrations } from "../../migrations";
import { openDatabase, type Db } from "../../server/db/client";
import { migrateDown, migrateToLatest } from "../../server/db/migrate";

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
});
