import { randomUUID } from "node:crypto";
import { promises as fs } from "node:fs";
import type { Logger } from "pino";
import type { Me } from "../../../shared/schemas/accounts";
import { centreLineOf, MAX_STRIPS, stripReadings, type OutlineCorrection } from "../../../shared/schemas/outlines";
import type { Analysis, StripReading, Upload } from "../../../shared/schemas/uploads";
import { nowIso, type Db } from "../../db/client";
import type { UploadRow } from "../../db/schema";
import type { WorkerPool } from "../../jobs/worker-pool";
import { AppError, notFound } from "../../middleware/errors";
import type { FileStore } from "../../storage/file-store";
import { stashInkIds } from "../stash/stash.service";
import * as repo from "./uploads.repository";
import type { OutlineJob, OutlineJobResult, UploadJob, UploadJobResult } from "./upload-job";

export type UploadPool = WorkerPool<UploadJob | OutlineJob, UploadJobResult | OutlineJobResult>;

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

const stripWord = (i: number) => `Strip ${i + 1}`;

/**
 * The analysis with its strips replaced; the one-strip fields (bands, transitions, orientation,
 * strip) follow the new strips[0], so clients that read only those keep working.
 */
function withStrips(analysis: Analysis, strips: StripReading[], size: { width: number; height: number } | null): Analysis {
  const renumbered = strips.map((s, index) => ({ ...s, index }));
  const first = renumbered[0]!;
  return {
    ...analysis,
    orientation: first.orientation,
    bands: first.bands,
    transitions: first.transitions,
    ...(size ? { strip: centreLineOf(first.outline, size.width, size.height) } : {}),
    strips: renumbered,
  };
}

/** The upload's strips, if this correction may be made to them now; otherwise a member-facing error. */
function editable(row: UploadRow, posted: number[], input: OutlineCorrection) {
  if (row.status === "processing") throw new AppError("still_processing", "This photo is still being analysed. Try again in a moment.", 409);
  if (row.status !== "ready" || !row.analysis_json || !row.original_key) {
    throw new AppError("upload_not_ready", "This photo could not be analysed, so there are no strips to adjust. Upload it again.", 409);
  }
  const analysis = JSON.parse(row.analysis_json) as Analysis;
  const size = row.width && row.height ? { width: row.width, height: row.height } : undefined;
  const readings = stripReadings(analysis, size);
  if (readings.some((r) => !r.outline)) {
    throw new AppError("no_outline", "This photo was analysed before strips had outlines. Upload it again to adjust them.", 409);
  }
  const strips = readings as StripReading[];
  const { stripIndex, outline } = input;
  const count = strips.length;
  const range = count === 1 ? "0 (its one strip)" : `0–${count - 1}`;
  if (stripIndex > count || (stripIndex === count && outline === null)) {
    throw new AppError("unknown_strip", `This photo has ${count} strip${count === 1 ? "" : "s"}: change one of ${range}, or add one as ${count}.`, 422, {
      stripIndex: [`must be ${range}, or ${count} to add a strip`],
    });
  }
  if (stripIndex === count && count >= MAX_STRIPS) {
    throw new AppError("too_many_strips", `A photo can hold at most ${MAX_STRIPS} strips.`, 422, { stripIndex: [`at most ${MAX_STRIPS} strips`] });
  }
  if (posted.includes(stripIndex)) {
    throw new AppError("already_posted", `${stripWord(stripIndex)} is already posted, so its outline cannot change. Delete the posted strip first if it is wrong.`, 409);
  }
  if (outline === null && count === 1) {
    throw new AppError("last_strip", "This is the photo's only strip, so it cannot be removed. Drag its corners onto the strip, or choose another photo.", 409);
  }
  return { analysis, strips };
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
      result = (await pool.run({
        originalPath: store.pathOf(row.original_key),
        outDir: store.pathOf(`images/${id}`),
        catalogue: await repo.loadCatalogue(db),
        // Suggestions prefer the member's own inks on near-ties.
        stash: await stashInkIds(db, row.owner_id),
        white,
      })) as UploadJobResult;
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

  /** The upload as its owner sees it, with the strips already posted from it. */
  async function view(row: UploadRow): Promise<Upload> {
    const posted = await repo.postedStrips(db, row.id);
    return { ...toUpload(row), posted: posted.map((p) => ({ stripIndex: p.strip_index, stripId: p.id, status: p.status })) };
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

    view,

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
      // A fresh reading may find the strips in another order and recolours the photo posted strips show.
      if ((await repo.postedStripIndexes(db, id)).length) {
        throw new AppError("already_posted", "Strips from this photo are already posted, so it cannot be analysed again. You can still adjust the outlines of the strips not yet posted.", 409);
      }
      await repo.markProcessing(db, id, white ?? null, nowIso());
      enqueue(id);
      return { id, status: "processing" as const };
    },

    /**
     * The member's own correction of one strip's outline: reads that strip again exactly there
     * (through the worker pool, with the paper white the photo was analysed with) and puts it in
     * place of strips[stripIndex]; stripIndex = the count adds a strip; outline null removes one
     * (the rest move up). Posted strips keep their outline. Answers the upload as it now is.
     */
    async correctOutline(id: string, viewer: Me, input: OutlineCorrection) {
      const row = await repo.findUpload(db, id);
      if (!row || !canSeeUpload(row, viewer)) throw notFound("That upload");
      editable(row, await repo.postedStripIndexes(db, id), input);
      let reading: StripReading | null = null;
      if (input.outline) {
        if (pool.isFull()) throw new AppError("busy", "Many photos are being analysed right now. Please try again in a minute.", 503);
        const white = row.white_x !== null && row.white_y !== null ? { x: row.white_x, y: row.white_y } : undefined;
        let result: OutlineJobResult;
        try {
          result = (await pool.run({
            kind: "outline",
            originalPath: store.pathOf(row.original_key!),
            catalogue: await repo.loadCatalogue(db),
            stash: await stashInkIds(db, row.owner_id),
            white,
            outlines: [input.outline],
          })) as OutlineJobResult;
        } catch (err) {
          logger.error({ err, uploadId: id }, "outline analysis crashed");
          throw new AppError("analysis_crashed", "We could not read the strip at that outline. Please try again.", 500);
        }
        if (!result.ok) throw new AppError(result.code, `${stripWord(input.stripIndex)}: ${result.message}`, 422);
        const found = stripReadings(result.analysis)[0];
        if (!found?.outline) throw new AppError("no_strip", `${stripWord(input.stripIndex)}: we could not read a strip inside that outline.`, 422);
        reading = { ...found, outline: found.outline, index: input.stripIndex };
      }
      // Written against the photo as it is now: someone may have changed it while the strip was read.
      const saved = await db.transaction().execute(async (tx) => {
        const now = await repo.findUpload(tx, id);
        if (!now) throw notFound("That upload");
        const current = editable(now, await repo.postedStripIndexes(tx, id), input);
        const strips = [...current.strips];
        if (reading) strips.splice(input.stripIndex, input.stripIndex === strips.length ? 0 : 1, reading);
        else {
          strips.splice(input.stripIndex, 1);
          await repo.renumberPostedAfterRemoval(tx, id, input.stripIndex);
        }
        const size = now.width && now.height ? { width: now.width, height: now.height } : null;
        await repo.saveAnalysis(tx, id, JSON.stringify(withStrips(current.analysis, strips, size)), nowIso());
        return (await repo.findUpload(tx, id))!;
      });
      return view(saved);
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
