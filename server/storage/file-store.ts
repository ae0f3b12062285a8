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
  remove(key: string): Promise<void>;
  /** Removes every key under a folder prefix such as "images/<id>". */
  removeFolder(prefix: string): Promise<void>;
  /** A private scratch folder for files still being received. */
  tmpDir: string;
  /**
   * Removes files in the scratch folder older than `maxAgeMs` (uploads cut off by a crash leave
   * them behind); returns how many were removed.
   */
  removeStaleTemp(maxAgeMs: number, now?: number): Promise<number>;
};

const safeKey = /^[a-z0-9][a-z0-9/_.-]*$/i;

export function createLocalFileStore(dataDir: string): FileStore {
  const root = path.resolve(dataDir);
  const tmpDir = path.join(root, "tmp");
  mkdirSync(tmpDir, { recursive: true });
  const pathOf = (key: string) => {
    if (!safeKey.test(key) || key.includes("..")) throw new Error(`Unsafe storage key: ${key}`);
    return path.join(root, key);
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
      await fs.rm(pathOf(key), { force: true });
    },
    async removeFolder(prefix) {
      await fs.rm(pathOf(prefix), { recursive: true, force: true });
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
