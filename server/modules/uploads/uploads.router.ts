import { randomUUID } from "node:crypto";
import { mkdirSync } from "node:fs";
import { open } from "node:fs/promises";
import { Router } from "express";
import multer from "multer";
import { outlineCorrectionInput } from "../../../shared/schemas/outlines";
import { reanalyseInput, uploadFields, uploadIdParams } from "../../../shared/schemas/uploads";
import { requireUser } from "../../auth/current-user";
import { DEFAULT_MAX_BYTES, DEFAULT_MAX_PIXELS, ImageError, readHeaderInfo, sniffImageBytes } from "../../images";
import { AppError, fieldsFromZod, multipartErrorsAre400, notFound } from "../../middleware/errors";
import { memberLimit } from "../../middleware/member-limits";
import { validate } from "../../middleware/validate";
import type { FileStore } from "../../storage/file-store";
import type { UploadsService } from "./uploads.service";

const mimeOf = { jpeg: "image/jpeg", png: "image/png", webp: "image/webp", heif: "image/heic" } as const;

const statusOf: Partial<Record<ImageError["code"], number>> = {
  empty: 400,
  too_large: 413,
  too_many_pixels: 413,
  unsupported_type: 415,
};

/** Enough of the file to identify it and read its dimensions without decoding pixels. */
async function readHead(file: string, bytes = 256 * 1024) {
  const fh = await open(file, "r");
  try {
    const buf = Buffer.alloc(bytes);
    const { bytesRead } = await fh.read(buf, 0, bytes, 0);
    return buf.subarray(0, bytesRead);
  } finally {
    await fh.close();
  }
}

/** Type and size checks before a photo is queued; throws a member-facing AppError. */
async function checkPhoto(file: string) {
  try {
    const head = await readHead(file);
    const { type } = sniffImageBytes(head);
    const info = readHeaderInfo(head, type);
    if (info?.animated) throw new ImageError("animated", "This is an animated image. Please upload a single still photo of your strip.");
    if (info && info.width * info.height > DEFAULT_MAX_PIXELS) {
      throw new ImageError(
        "too_many_pixels",
        `This photo is too large (${info.width} × ${info.height} pixels). Please upload a photo of at most ${DEFAULT_MAX_PIXELS / 1e6} megapixels.`,
      );
    }
    return mimeOf[type];
  } catch (err) {
    if (err instanceof ImageError) throw new AppError(err.code, err.message, statusOf[err.code] ?? 422);
    throw err;
  }
}

export function uploadsRouter(deps: { uploads: UploadsService; store: FileStore; limitScale?: number }): Router {
  const { uploads, store } = deps;
  const router = Router();
  mkdirSync(store.tmpDir, { recursive: true });
  const receive = multipartErrorsAre400(multer({
    storage: multer.diskStorage({
      destination: store.tmpDir,
      filename: (_req, _file, cb) => cb(null, `upload-${randomUUID()}`),
    }),
    limits: { fileSize: DEFAULT_MAX_BYTES, files: 1, fields: 4, parts: 5, fieldSize: 1024 },
  }).single("image"));

  const uploadLimit = memberLimit({ windowMs: 60 * 60 * 1000, newMember: 20, trusted: 120, message: "You have uploaded many photos in the last hour. Please wait a while.", scale: deps.limitScale });

  router.post(
    "/uploads",
    requireUser,
    uploadLimit,
    (_req, res, next) => {
      if (uploads.isBusy()) {
        res.set("Retry-After", "30");
        throw new AppError("busy", "Many photos are being analysed right now. Please try again in a minute.", 503);
      }
      next();
    },
    receive,
    async (req, res) => {
      const file = req.file;
      if (!file) throw new AppError("no_file", 'Choose a photo to upload (form field "image").', 400);
      try {
        const fields = uploadFields.safeParse(req.body ?? {});
        if (!fields.success) throw new AppError("invalid_request", "Some fields are not right.", 400, fieldsFromZod(fields.error));
        const mime = await checkPhoto(file.path);
        const { whiteX, whiteY } = fields.data;
        const white = whiteX !== undefined && whiteY !== undefined ? { x: whiteX, y: whiteY } : undefined;
        res.status(202).json(await uploads.accept(res.locals.user!.id, { path: file.path, size: file.size, mime }, white));
      } finally {
        await uploads.removeTemp(file.path);
      }
    },
  );

  router.get("/uploads/:id", validate({ params: uploadIdParams }), async (req, res) => {
    const row = await uploads.get(String(req.params.id), res.locals.user);
    res.set("Cache-Control", "no-store").json(await uploads.view(row));
  });

  router.post(
    "/uploads/:id/analysis",
    requireUser,
    validate({ params: uploadIdParams, body: reanalyseInput }),
    async (req, res) => {
      if (uploads.isBusy()) {
        res.set("Retry-After", "30");
        throw new AppError("busy", "Many photos are being analysed right now. Please try again in a minute.", 503);
      }
      res.status(202).json(await uploads.reanalyse(String(req.params.id), res.locals.user!, req.body.white));
    },
  );

  router.post("/uploads/:id/outline", requireUser, validate({ params: uploadIdParams }), async (req, res) => {
    if (!req.is("application/json")) throw new AppError("unsupported_media_type", "Send the request body as application/json.", 415);
    const parsed = outlineCorrectionInput.safeParse(req.body);
    if (!parsed.success) {
      const fields = fieldsFromZod(parsed.error);
      // Name the first thing wrong in the message itself: "the outline: the four corners must…".
      const [where, problems] = Object.entries(fields)[0]!;
      const what = where.startsWith("outline") ? "The outline is not right" : where === "stripIndex" ? "The strip number is not right" : "Some fields are not right";
      throw new AppError("invalid_outline", `${what}: ${problems[0]}.`, 400, fields);
    }
    res.set("Cache-Control", "no-store").json(await uploads.correctOutline(String(req.params.id), res.locals.user!, parsed.data));
  });

  router.get("/uploads/:id/images/:variant", async (req, res) => {
    const parsed = uploadIdParams.safeParse({ id: req.params.id });
    const variant = req.params.variant;
    if (!parsed.success || (variant !== "display" && variant !== "thumb")) throw notFound("That image");
    const row = await uploads.get(parsed.data.id, res.locals.user);
    const key = variant === "display" ? row.display_key : row.thumb_key;
    if (!key || row.status === "processing") throw notFound("That image");
    res.set("Cache-Control", "private, max-age=3600");
    res.type("image/webp").sendFile(store.pathOf(key));
  });

  return router;
}
