import { randomUUID } from "node:crypto";
import { mkdirSync, promises as fs } from "node:fs";
import path from "node:path";

/**
 * Where uploaded and generated files live: keys like "originals/<id>.jpg" under DATA_DIR.
 * One machine keeps them on local disk; object storage can stand behind the same interface.
 */
export type FileStore = {
  /** Absolute path of a key (local disk). */
  pathOf(key: string): string;
  /** Moves a finished local file into the store under `key`. */
  adopt(localPath: string, key: string): Promise<void>;
  exists(key: string): Promise<boolean>;
  /**
   * Removes a key. The file goes to DATA_DIR/trash for an hour first: a backup running at that
   * moment may hold a snapshot of the database that still references it (server/db/backup.ts).
   */
  remove(key: string): Promise<void>;
  /** Removes every key under a folder prefix such as "images/<id>" (through the trash too). */
  removeFolder(prefix: string): Promise<void>;
  /** Deletes trashed files older than `maxAgeMs`; returns how many trash batches went. */
  emptyTrash(maxAgeMs: number, now?: number): Promise<number>;
  /** A private scratch folder for files still being received. */
  tmpDir: string;
  /**
   * Removes files in the scratch folder older than `maxAgeMs` (uploads cut off by a crash leave
   * them behind); returns how many were removed.
   */
  removeStaleTemp(maxAgeMs: number, now?: number): Promise<number>;
};

const safeKey = /^[a-z0-9][a-z0-9/_.-]*$/i;

/** Folder under DATA_DIR where removed files wait an hour before they are deleted. */
export const TRASH = "trash";

export function createLocalFileStore(dataDir: string): FileStore {
  const root = path.resolve(dataDir);
  const tmpDir = path.join(root, "tmp");
  mkdirSync(tmpDir, { recursive: true });
  const pathOf = (key: string) => {
    if (!safeKey.test(key) || key.includes("..")) throw new Error(`Unsafe storage key: ${key}`);
    return path.join(root, key);
  };
  const trashDir = path.join(root, TRASH);
  /** Moves a key (file or folder) to trash/<epoch ms>-<random>/<key>: one rename, same disk. */
  const toTrash = async (key: string) => {
    const from = pathOf(key);
    const batch = path.join(trashDir, `${Date.now()}-${randomUUID()}`);
    const to = path.join(batch, key);
    await fs.mkdir(path.dirname(to), { recursive: true });
    try {
      await fs.rename(from, to);
    } catch (err) {
      await fs.rm(batch, { recursive: true, force: true });
      if ((err as NodeJS.ErrnoException).code !== "ENOENT") throw err; // already gone is fine
    }
  };
  return {
    pathOf,
    tmpDir,
    async adopt(localPath, key) {
      const target = pathOf(key);
      await fs.mkdir(path.dirname(target), { recursive: true });
      await fs.rename(localPath, target);
    },
    async exists(key) {
      try {
        await fs.access(pathOf(key));
        return true;
      } catch {
        return false;
      }
    },
    async remove(key) {
      await toTrash(key);
    },
    async removeFolder(prefix) {
      await toTrash(prefix);
    },
    async emptyTrash(maxAgeMs, now = Date.now()) {
      let removed = 0;
      for (const name of await fs.readdir(trashDir).catch(() => [] as string[])) {
        const stamp = Number(name.split("-")[0]);
        if (Number.isFinite(stamp) && now - stamp <= maxAgeMs) continue;
        await fs.rm(path.join(trashDir, name), { recursive: true, force: true });
        removed++;
      }
      return removed;
    },
    async removeStaleTemp(maxAgeMs, now = Date.now()) {
      let removed = 0;
      for (const entry of await fs.readdir(tmpDir, { withFileTypes: true })) {
        if (!entry.isFile()) continue;
        const file = path.join(tmpDir, entry.name);
        try {
          // An upload still arriving keeps writing, so its mtime stays fresh.
          if (now - (await fs.stat(file)).mtimeMs <= maxAgeMs) continue;
          await fs.rm(file, { force: true });
          removed++;
        } catch {
          /* gone meanwhile: finished or removed by its own request */
        }
      }
      return removed;
    },
  };
}
