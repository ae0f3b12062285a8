import { constants, existsSync, promises as fs } from "node:fs";
import path from "node:path";
import SQLite from "better-sqlite3";
import { TRASH } from "../storage/file-store";

/*
 * Backup and restore of a data folder while the app keeps serving and writing.
 * The database is copied with `VACUUM INTO` (https://sqlite.org/lang_vacuum.html#vacuuminto):
 * one read transaction, so the copy is a consistent snapshot even under WAL with writers busy,
 * and — unlike the online backup API — it does not restart when another connection writes.
 * Copying the .sqlite file (and its -wal) while it is open is the classic way to lose data.
 */

export const DB_FILE = "blendwell.sqlite";
const MANIFEST = "manifest.json";
const FILES = "files";

/** Columns that hold storage keys of image files (keys are paths under DATA_DIR). */
const KEY_COLUMNS = { uploads: ["original_key", "display_key", "thumb_key"] } as const;

function referencedKeys(db: SQLite.Database): Set<string> {
  const keys = new Set<string>();
  for (const [table, columns] of Object.entries(KEY_COLUMNS)) {
    for (const column of columns) {
      const rows = db.prepare(`select "${column}" as k from "${table}" where "${column}" is not null`).all() as { k: string }[];
      for (const r of rows) keys.add(r.k);
    }
  }
  return keys;
}

const safeKey = (key: string) => /^[a-z0-9][a-z0-9/_.-]*$/i.test(key) && !key.includes("..");

/** Copies one file, as a copy-on-write clone where the file system can. false: it was not there. */
async function copyKey(fromRoot: string, toRoot: string, key: string, fromFile = path.join(fromRoot, key)): Promise<boolean> {
  if (!safeKey(key)) throw new Error(`Unsafe storage key in the database: ${key}`);
  const target = path.join(toRoot, key);
  await fs.mkdir(path.dirname(target), { recursive: true });
  try {
    await fs.copyFile(fromFile, target, constants.COPYFILE_FICLONE);
    return true;
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === "ENOENT") return false;
    throw err;
  }
}

/**
 * A file removed after the snapshot was taken still waits in DATA_DIR/trash/<batch>/<key>
 * (server/storage/file-store.ts keeps removed files an hour), newest batch first.
 */
async function copyFromTrash(dataDir: string, toRoot: string, key: string): Promise<boolean> {
  const trash = path.join(dataDir, TRASH);
  const batches = (await fs.readdir(trash).catch(() => [] as string[])).sort().reverse();
  for (const batch of batches) if (await copyKey(dataDir, toRoot, key, path.join(trash, batch, key))) return true;
  return false;
}

export type Checks = { integrity: string; foreignKeyProblems: number; missingFiles: string[] };

/** PRAGMA integrity_check does not look at foreign keys; foreign_key_check does (sqlite.org/pragma.html). */
export function checkDatabase(file: string, filesRoot: string): Checks {
  const db = new SQLite(file, { readonly: true, fileMustExist: true });
  try {
    const integrity = (db.pragma("integrity_check") as { integrity_check: string }[]).map((r) => r.integrity_check).join("; ");
    const foreignKeyProblems = (db.pragma("foreign_key_check") as unknown[]).length;
    const missingFiles = [...referencedKeys(db)].filter((k) => !existsSync(path.join(filesRoot, k)));
    return { integrity, foreignKeyProblems, missingFiles };
  } finally {
    db.close();
  }
}

async function isEmptyFolder(dir: string) {
  if (!existsSync(dir)) return true;
  const entries = (await fs.readdir(dir)).filter((n) => n !== ".gitkeep");
  return entries.length === 0;
}

export type BackupResult = { dir: string; files: number; bytes: number; startedAt: string; finishedAt: string; checks: Checks };

/**
 * Backs up DATA_DIR's database and the image files it references into `dest` (a new or empty
 * folder): dest/blendwell.sqlite, dest/files/<key>, dest/manifest.json.
 */
export async function backupDataDir(dataDir: string, dest: string): Promise<BackupResult> {
  const source = path.join(dataDir, DB_FILE);
  if (!existsSync(source)) throw new Error(`No database at ${source}`);
  if (!(await isEmptyFolder(dest))) throw new Error(`The backup folder ${dest} is not empty`);
  const filesDir = path.join(dest, FILES);
  await fs.mkdir(filesDir, { recursive: true });
  const startedAt = new Date().toISOString();

  const live = new SQLite(source, { readonly: true, fileMustExist: true });
  live.pragma("busy_timeout = 10000");
  let copiedBefore: Set<string>;
  try {
    // 1. Copy what is referenced now: a strip deleted while we work takes its files with it,
    //    and the snapshot taken next may still reference them.
    copiedBefore = new Set<string>();
    for (const key of referencedKeys(live)) if (await copyKey(dataDir, filesDir, key)) copiedBefore.add(key);
    // 2. The consistent snapshot.
    live.prepare("vacuum into ?").run(path.join(dest, DB_FILE));
  } finally {
    live.close();
  }

  // 3. Files the snapshot references that appeared after step 1; 4. drop what it no longer references.
  const snapshot = new SQLite(path.join(dest, DB_FILE), { readonly: true });
  const wanted = referencedKeys(snapshot);
  snapshot.close();
  for (const key of wanted) {
    if (copiedBefore.has(key)) continue;
    if (!(await copyKey(dataDir, filesDir, key))) await copyFromTrash(dataDir, filesDir, key);
  }
  for (const key of copiedBefore) if (!wanted.has(key)) await fs.rm(path.join(filesDir, key), { force: true });

  const checks = checkDatabase(path.join(dest, DB_FILE), filesDir);
  let bytes = (await fs.stat(path.join(dest, DB_FILE))).size;
  for (const key of wanted) bytes += (await fs.stat(path.join(filesDir, key)).catch(() => ({ size: 0 }))).size;
  const result: BackupResult = { dir: dest, files: wanted.size - checks.missingFiles.length, bytes, startedAt, finishedAt: new Date().toISOString(), checks };
  await fs.writeFile(path.join(dest, MANIFEST), JSON.stringify({ kind: "blendwell-backup", version: 1, ...result }, null, 2) + "\n");
  return result;
}

/**
 * Restores a backup into an empty data folder, then checks it: integrity, foreign keys, and
 * every referenced image present. Throws (leaving the folder for inspection) when a check fails.
 */
export async function restoreDataDir(backupDir: string, dataDir: string): Promise<Checks> {
  const manifest = JSON.parse(await fs.readFile(path.join(backupDir, MANIFEST), "utf8")) as { kind?: string };
  if (manifest.kind !== "blendwell-backup") throw new Error(`${backupDir} is not a Blendwell backup`);
  if (!(await isEmptyFolder(dataDir))) throw new Error(`Restore only into an empty data folder; ${dataDir} is not empty`);
  await fs.mkdir(dataDir, { recursive: true });
  await fs.cp(path.join(backupDir, FILES), dataDir, { recursive: true });
  // The database arrives last, under its own name only when complete.
  const partial = path.join(dataDir, `${DB_FILE}.restoring`);
  await fs.copyFile(path.join(backupDir, DB_FILE), partial);
  await fs.rename(partial, path.join(dataDir, DB_FILE));
  const checks = checkDatabase(path.join(dataDir, DB_FILE), dataDir);
  if (checks.integrity !== "ok" || checks.foreignKeyProblems || checks.missingFiles.length) {
    throw new Error(`The restored data does not pass its checks: ${JSON.stringify(checks)}`);
  }
  return checks;
}
