import { Router } from "express";
import multer from "multer";
import { stashInkParams, stashItemInput, stashItemPatch, stashPut } from "../../../shared/schemas/stash";
import { requireUser } from "../../auth/current-user";
import { AppError, multipartErrorsAre400 } from "../../middleware/errors";
import { validate } from "../../middleware/validate";
import type { StashService } from "./stash.service";

const csvUpload = multipartErrorsAre400(multer({ storage: multer.memoryStorage(), limits: { fileSize: 1024 * 1024, files: 1, fields: 2, parts: 3 } }).single("file"));

export function stashRouter(stash: StashService): Router {
  const router = Router();
  router.use("/stash", requireUser);

  router.get("/stash", async (_req, res) => {
    res.set("Cache-Control", "no-store").json({ items: await stash.list(res.locals.user!) });
  });
  router.put("/stash", validate({ body: stashPut }), async (req, res) => {
    res.json({ items: await stash.replace(res.locals.user!, req.body) });
  });
  router.post("/stash/items", validate({ body: stashItemInput }), async (req, res) => {
    res.status(201).json({ items: await stash.add(res.locals.user!, req.body.inkId, req.body.runningLow) });
  });
  router.patch("/stash/items/:inkId", validate({ params: stashInkParams, body: stashItemPatch }), async (req, res) => {
    res.json({ items: await stash.setRunningLow(res.locals.user!, Number(req.params.inkId), req.body.runningLow) });
  });
  router.delete("/stash/items/:inkId", validate({ params: stashInkParams }), async (req, res) => {
    await stash.remove(res.locals.user!, Number(req.params.inkId));
    res.status(204).end();
  });
  router.post("/stash/import", csvUpload, async (req, res) => {
    if (!req.file) throw new AppError("no_file", 'Choose a CSV file (form field "file").', 400);
    res.json(await stash.preview(req.file.buffer));
  });
  router.get("/stash/export", async (_req, res) => {
    res.type("text/csv").attachment("blendwell-stash.csv").send(await stash.exportCsv(res.locals.user!));
  });
  return router;
}
