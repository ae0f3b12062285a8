import { createRequire } from "node:module";
import { existsSync, mkdirSync, mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { Worker } from "node:worker_threads";
import SQLite from "better-sqlite3";
import { afterAll, describe, expect, it } from "vitest";
import { backupDataDir, checkDatabase, DB_FILE, restoreDataDir } from "../../server/db/backup";
import { openDatabase } from "../../server/db/client";
import { migrateToLatest } from "../../server/db/migrate";
import { seedDemo } from "../../server/demo/seed";

// The claim under test: a backup taken while the app writes holds every row acknowledged
// before it began, and restores clean (PRAGMA integrity_check and foreign_key_check, see
// https://sqlite.org/pragma.html; VACUUM INTO, https://sqlite.org/lang_vacuum.html#vacuuminto).

const root = mkdtempSync(path.join(os.tmpdir(), "blendwell-backup-"));
afterAll(() => rmSync(root, { recursive: true, force: true }));

// A second writer on its own thread and connection, like the app's: each upload row is
// inserted after its files are written, and acknowledged only once committed. Every fifth
// time a recent row is deleted again, files after the row, as the app removes a discarded draft.
const writerCode = `
const { parentPort, workerData } = require("node:worker_threads");
const fs = require("node:fs");
const path = require("node:path");
const SQLite = require(workerData.sqlitePath);
const db = new SQLite(workerData.dbFile);
db.pragma("journal_mode = WAL");
db.pragma("foreign_keys = ON");
db.pragma("busy_timeout = 10000");
db.pragma("synchronous = FULL");
const insert = db.prepare("insert into uploads (id, owner_id, status, original_key, mime, byte_size, display_key, thumb_key, created_at, updated_at) values (?, ?, 'ready', ?, 'image/jpeg', 3, ?, ?, ?, ?)");
const remove = db.prepare("delete from uploads where id = ?");
let stop = false;
parentPort.on("message", (m) => { if (m === "stop") stop = true; });
(async () => {
  for (let n = 0; !stop; n++) {
    const id = "bk-" + n;
    const keys = ["originals/" + id + ".jpg", "images/" + id + "/display.webp", "images/" + id + "/thumb.webp"];
    for (const k of keys) {
      fs.mkdirSync(path.dirname(path.join(workerData.dataDir, k)), { recursive: true });
      fs.writeFileSync(path.join(workerData.dataDir, k), "img" + n);
    }
    const now = new Date().toISOString();
    insert.run(id, workerData.ownerId, keys[0], keys[1], keys[2], now, now);
    parentPort.postMessage({ inserted: id });
    if (n % 5 === 4) {
      const gone = "bk-" + (n - 2);
      remove.run(gone);
      // As the app's file store removes: into trash/<epoch ms>-<id>/<key>, deleted an hour later.
      for (const k of ["originals/" + gone + ".jpg", "images/" + gone]) {
        const to = path.join(workerData.dataDir, "trash", Date.now() + "-" + gone + "-" + k.length, k);
        fs.mkdirSync(path.dirname(to), { recursive: true });
        fs.renameSync(path.join(workerData.dataDir, k), to);
      }
      parentPort.postMessage({ deleted: gone });
    }
    await new Promise((r) => setImmediate(r));
  }
  db.close();
  parentPort.postMessage({ done: true });
})();
`;

describe("backup and restore while the app writes", () => {
  it("keeps every row acknowledged before the backup began, with clean checks and every image", async () => {
    const dataDir = path.join(root, "live");
    mkdirSync(dataDir, { recursive: true });
    const db = openDatabase(path.join(dataDir, DB_FILE));
    await migrateToLatest(db);
    await seedDemo(db);
    const ownerId = (await db.selectFrom("User").select("id").where("email", "=", "mara@blendwell.test").executeTakeFirstOrThrow()).id;
    await db.destroy();

    const live = new Set<string>();
    const deleted: string[] = [];
    const worker = new Worker(writerCode, {
      eval: true,
      workerData: { sqlitePath: createRequire(import.meta.url).resolve("better-sqlite3"), dbFile: path.join(dataDir, DB_FILE), dataDir, ownerId },
    });
    const done = new Promise<void>((resolve, reject) => {
      worker.on("message", (m: { inserted?: string; deleted?: string; done?: boolean }) => {
        if (m.inserted) live.add(m.inserted);
        if (m.deleted) {
          live.delete(m.deleted);
          deleted.push(m.deleted);
        }
        if (m.done) resolve();
      });
      worker.on("error", reject);
    });
    while (live.size < 200) await new Promise((r) => setTimeout(r, 5));

    const acknowledgedBefore = new Set(live);
    const deletedBefore = new Set(deleted);
    const dest = path.join(root, "backup");
    const result = await backupDataDir(dataDir, dest);
    // The writer went on during the backup (its acknowledgements arrive while we waited on files).
    const duringOrAfter = live.size;
    await new Promise((r) => setTimeout(r, 100));
    worker.postMessage("stop");
    await done;
    expect(live.size).toBeGreaterThan(acknowledgedBefore.size);
    expect(duringOrAfter).toBeGreaterThanOrEqual(acknowledgedBefore.size);
    expect(result.checks).toEqual({ integrity: "ok", foreignKeyProblems: 0, missingFiles: [] });

    const restored = path.join(root, "restored");
    const checks = await restoreDataDir(dest, restored);
    expect(checks).toEqual({ integrity: "ok", foreignKeyProblems: 0, missingFiles: [] });

    const copy = new SQLite(path.join(restored, DB_FILE), { readonly: true });
    const ids = new Set((copy.prepare("select id from uploads where id like 'bk-%'").all() as { id: string }[]).map((r) => r.id));
    const keys = copy.prepare("select original_key, display_key, thumb_key from uploads where id like 'bk-%'").all() as Record<string, string>[];
    const members = (copy.prepare("select count(*) as n from profiles").get() as { n: number }).n;
    copy.close();
    // A row may be missing only if the writer deleted it after the backup began (as a member
    // discarding a draft would); rows deleted before it began must not come back.
    const deletedAfterStart = new Set(deleted.filter((id) => !deletedBefore.has(id)));
    const lost = [...acknowledgedBefore].filter((id) => !ids.has(id) && !deletedAfterStart.has(id));
    expect(lost).toEqual([]);
    expect(acknowledgedBefore.size).toBeGreaterThanOrEqual(200);
    expect([...deletedBefore].filter((id) => ids.has(id))).toEqual([]);
    expect(members).toBeGreaterThan(0);
    for (const row of keys) for (const k of Object.values(row)) expect(existsSync(path.join(restored, k)), k).toBe(true);
  }, 60_000);

  it("refuses to restore into a folder that is not empty, and leaves it as it was", async () => {
    const dataDir = path.join(root, "live");
    await expect(restoreDataDir(path.join(root, "backup"), dataDir)).rejects.toThrow(/empty data folder/);
    expect(checkDatabase(path.join(dataDir, DB_FILE), dataDir).integrity).toBe("ok");
  });

  it("refuses to write a backup into a folder that is not empty", async () => {
    await expect(backupDataDir(path.join(root, "live"), path.join(root, "backup"))).rejects.toThrow(/not empty/);
  });
});
