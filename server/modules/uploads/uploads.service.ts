import { randomUUID } from "node:crypto";
import { promises as fs } from "node:fs";
import type { Logger } from "pino";
import type { Me } from "../../../shared/schemas/accounts";
import type { Upload } from "../../../shared/schemas/uploads";
import { nowIso, type Db } from "../../db/client";
import type { UploadRow } from "../../db/schema";
import type { WorkerPool } from "../../jobs/worker-pool";
import { AppError, notFound } from "../../middleware/errors";
import type { FileStore } from "../../storage/file-store";
import { stashInkIds } from "../stash/stash.service";
import * as repo from "./uploads.repository";
import type { UploadJob, UploadJobResult } from "./upload-job";

export type UploadPool = WorkerPool<UploadJob, UploadJobResult>;

/** Tries per upload before a crash-looping photo is marked failed. */
const MAX_ATTEMPTS = 3;
export const DRAFT_DAYS = 7;

const extensionOf: Record<string, string> = {
  "image/jpeg": "jpg",
  "image/png": "png",
  "image/webp": "webp",
  "image/heic": "heic",
  "image/heif": "heif",
};

export function imageUrl(id: string, variant: "display" | "thumb") {
  return `/api/uploads/${id}/images/${variant}`;
}

export function toUpload(row: UploadRow): Upload {
  const view: Upload = { id: row.id, status: row.status, createdAt: row.created_at };
  if (row.status === "failed") view.error = { code: row.error_code ?? "failed", message: row.error_message ?? "The photo could not be read." };
  if (row.status === "ready" && row.analysis_json) view.analysis = JSON.parse(row.analysis_json);
  // A failed re-run keeps the photo, so its images stay available for another try.
  if (row.status !== "processing" && row.display_key) {
    view.images = { display: imageUrl(row.id, "display"), thumb: imageUrl(row.id, "thumb"), placeholder: row.placeholder ?? "" };
  }
  return view;
}

export function canSeeUpload(row: UploadRow, viewer: Me | null) {
  return !!viewer && (row.owner_id === viewer.id || viewer.role !== "member");
}

export function createUploadsService(deps: { db: Db; store: FileStore; pool: UploadPool; logger: Logger }) {
  const { db, store, pool, logger } = deps;
  const running = new Set<Promise<void>>();

  async function discardFiles(row: Pick<UploadRow, "id" | "original_key">) {
    if (row.original_key) await store.remove(row.original_key);
    await store.removeFolder(`images/${row.id}`);
  }

  async function process(id: string) {
    const row = await repo.findUpload(db, id);
    if (!row || row.status !== "processing" || !row.original_key) return;
    await repo.startAttempt(db, id);
    const white = row.white_x !== null && row.white_y !== null ? { x: row.white_x, y: row.white_y } : undefined;
    let result: UploadJobResult;
    // Work queued in-process (a restart's recovery, the demo seed) waits for room in the pool.
    while (pool.isFull()) await new Promise((r) => setTimeout(r, 200));
    try {
      result = await pool.run({
        originalPath: store.pathOf(row.original_key),
        outDir: store.pathOf(`images/${id}`),
        catalogue: await repo.loadCatalogue(db),
        // Suggestions prefer the member's own inks on near-ties.
        stash: await stashInkIds(db, row.owner_id),
        white,
      });
    } catch (err) {
      logger.error({ err, uploadId: id }, "analysis worker crashed");
      result = { ok: false, code: "analysis_crashed", message: "We could not analyse this photo. Please try another photo." };
    }
    // The member may have deleted it meanwhile.
    const current = await repo.findUpload(db, id);
    if (!current) {
      await discardFiles(row);
      return;
    }
    if (result.ok) {
      await repo.markReady(
        db,
        id,
        {
          analysis_json: JSON.stringify(result.analysis),
          display_key: `images/${id}/${result.images.display}`,
          thumb_key: `images/${id}/${result.images.thumb}`,
          placeholder: result.images.placeholder,
          phash: result.images.phash,
          width: result.images.width,
          height: result.images.height,
        },
        nowIso(),
      );
    } else if (row.display_key) {
      await repo.markRerunFailed(db, id, result.code, result.message, nowIso());
    } else {
      await discardFiles(row);
      await repo.markFailed(db, id, result.code, result.message, nowIso());
    }
  }

  function enqueue(id: string) {
    const job = process(id)
      .catch((err) => logger.error({ err, uploadId: id }, "upload processing failed"))
      .finally(() => running.delete(job));
    running.add(job);
  }

  return {
    isBusy: () => pool.isFull(),

    /** Takes a received file (already type-checked) into the store and starts its analysis. */
    async accept(ownerId: string, file: { path: string; size: number; mime: string }, white?: { x: number; y: number }) {
      const id = randomUUID();
      const key = `originals/${id}.${extensionOf[file.mime] ?? "bin"}`;
      await store.adopt(file.path, key);
      try {
        await repo.insertUpload(db, {
          id,
          owner_id: ownerId,
          original_key: key,
          mime: file.mime,
          byte_size: file.size,
          white_x: white?.x ?? null,
          white_y: white?.y ?? null,
          created_at: nowIso(),
        });
      } catch (err) {
        await store.remove(key);
        throw err;
      }
      enqueue(id);
      return { id, status: "processing" as const };
    },

    async get(id: string, viewer: Me | null): Promise<UploadRow> {
      const row = await repo.findUpload(db, id);
      if (!row || !canSeeUpload(row, viewer)) throw notFound("That upload");
      return row;
    },

    async reanalyse(id: string, viewer: Me, white?: { x: number; y: number }) {
      const row = await repo.findUpload(db, id);
      if (!row || row.owner_id !== viewer.id) throw notFound("That upload");
      if (row.status === "processing") throw new AppError("still_processing", "This photo is still being analysed.", 409);
      if (!row.original_key) throw new AppError("upload_failed", "This upload failed; please upload the photo again.", 409);
      await repo.markProcessing(db, id, white ?? null, nowIso());
      enqueue(id);
      return { id, status: "processing" as const };
    },

    /** After a crash or restart: re-run unfinished uploads, or fail the ones that keep failing. */
    async recover() {
      const rows = await repo.listProcessing(db);
      for (const row of rows) {
        const hasOriginal = row.original_key ? await store.exists(row.original_key) : false;
        if (hasOriginal && row.attempts < MAX_ATTEMPTS) {
          enqueue(row.id);
        } else {
          await discardFiles(row);
          await repo.markFailed(db, row.id, "interrupted", "The analysis was interrupted. Please upload the photo again.", nowIso());
        }
      }
      return rows.length;
    },

    /** Drafts (analysed photos never posted) are kept for a week, then removed with their files. */
    async cleanupDrafts(now = new Date(), keepDays = DRAFT_DAYS) {
      const cutoff = new Date(now.getTime() - keepDays * 24 * 60 * 60 * 1000).toISOString();
      const stale = await repo.listStaleDrafts(db, cutoff);
      for (const row of stale) {
        await repo.deleteUpload(db, row.id);
        await discardFiles(row);
      }
      return stale.length;
    },

    /** Waits for every analysis in flight (tests and shutdown). */
    async idle() {
      while (running.size) await Promise.all([...running]);
    },

    async removeTemp(path: string | undefined) {
      if (path) await fs.rm(path, { force: true });
    },
  };
}
export type UploadsService = ReturnType<typeof createUploadsService>;
