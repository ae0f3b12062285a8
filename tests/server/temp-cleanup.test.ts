import { existsSync, mkdirSync, mkdtempSync, readdirSync, rmSync, utimesSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterEach, describe, expect, it } from "vitest";
import { boot, TEMP_MAX_AGE_MS } from "../../server/boot";
import { loadConfig } from "../../server/config";
import { createLocalFileStore, TRASH } from "../../server/storage/file-store";

let dir = "";
afterEach(() => rmSync(dir, { recursive: true, force: true }));

/** A half-received upload as a crash leaves it, last written `ageMs` ago. */
function leftover(tmp: string, name: string, ageMs: number) {
  const file = path.join(tmp, name);
  writeFileSync(file, Buffer.alloc(1024, 7));
  const when = new Date(Date.now() - ageMs);
  utimesSync(file, when, when);
  return file;
}

describe("temp upload files left by a crash", () => {
  it("files older than an hour are removed; newer ones (uploads still arriving) stay", async () => {
    dir = mkdtempSync(path.join(os.tmpdir(), "blendwell-tmp-"));
    const store = createLocalFileStore(dir);
    const old = leftover(store.tmpDir, "upload-old", 2 * 60 * 60 * 1000);
    const fresh = leftover(store.tmpDir, "upload-fresh", 5 * 60 * 1000);
    mkdirSync(path.join(store.tmpDir, "a-folder"));
    expect(await store.removeStaleTemp(TEMP_MAX_AGE_MS)).toBe(1);
    expect(existsSync(old)).toBe(false);
    expect(existsSync(fresh)).toBe(true);
    expect(existsSync(path.join(store.tmpDir, "a-folder"))).toBe(true);
  });

  it("removed files wait in the trash for an hour (for a backup running meanwhile), then go", async () => {
    dir = mkdtempSync(path.join(os.tmpdir(), "blendwell-tmp-"));
    const store = createLocalFileStore(dir);
    mkdirSync(path.join(dir, "images", "u1"), { recursive: true });
    writeFileSync(path.join(dir, "images", "u1", "thumb.webp"), "x");
    await store.removeFolder("images/u1");
    await store.remove("originals/never-existed.jpg");
    expect(existsSync(path.join(dir, "images", "u1"))).toBe(false);
    const batches = readdirSync(path.join(dir, TRASH));
    expect(batches).toHaveLength(1);
    expect(existsSync(path.join(dir, TRASH, batches[0]!, "images", "u1", "thumb.webp"))).toBe(true);
    expect(await store.emptyTrash(TEMP_MAX_AGE_MS)).toBe(0);
    expect(await store.emptyTrash(TEMP_MAX_AGE_MS, Date.now() + TEMP_MAX_AGE_MS + 1000)).toBe(1);
    expect(readdirSync(path.join(dir, TRASH))).toEqual([]);
  });

  it("are removed when the server starts", async () => {
    dir = mkdtempSync(path.join(os.tmpdir(), "blendwell-tmp-"));
    mkdirSync(path.join(dir, "tmp"));
    const old = leftover(path.join(dir, "tmp"), "upload-crashed", 3 * 60 * 60 * 1000);
    const config = loadConfig({ DATA_DIR: dir, NODE_ENV: "test", DEMO_MODE: "false", PORT: "0", LOG_LEVEL: "silent" });
    const running = await boot(config);
    try {
      expect(existsSync(old)).toBe(false);
    } finally {
      await running.close();
    }
  });
});
