import { Router } from "express";
import multer from "multer";
import { idParams } from "../../../shared/schemas/common";
import { brandInput, inkInput, inkListQuery, inkPatch } from "../../../shared/schemas/inks";
import { requireRole } from "../../auth/current-user";
import type { Db } from "../../db/client";
import { AppError, multipartErrorsAre400 } from "../../middleware/errors";
import { validate } from "../../middleware/validate";
import { parseCatalogueCsv } from "./catalogue-csv";
import * as service from "./inks.service";

const csvUpload = multipartErrorsAre400(multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: 2 * 1024 * 1024, files: 1, fields: 5, parts: 6 },
}).single("file"));

export function inksRouter(db: Db): Router {
  const router = Router();

  router.get("/brands", async (_req, res) => {
    res.json(await service.listBrands(db));
  });

  router.post("/brands", requireRole("moderator"), validate({ body: brandInput }), async (req, res) => {
    res.status(201).json(await service.createBrand(db, req.body.name));
  });

  router.get("/inks", validate({ query: inkListQuery }), async (req, res) => {
    res.json(await service.listInks(db, req.query as never));
  });

  router.post("/inks", requireRole("moderator"), validate({ body: inkInput }), async (req, res) => {
    res.status(201).json(await service.createInk(db, req.body));
  });

  router.post("/inks/import", requireRole("admin"), csvUpload, async (req, res) => {
    if (!req.file) throw new AppError("no_file", "Choose a CSV file to import (form field \"file\").", 400);
    const rows = parseCatalogueCsv(req.file.buffer);
    res.json(await service.importCatalogue(db, rows));
  });

  router.get("/inks/:id", validate({ params: idParams }), async (req, res) => {
    res.json(await service.getInk(db, Number(req.params.id)));
  });

  router.patch(
    "/inks/:id",
    requireRole("moderator"),
    validate({ params: idParams, body: inkPatch }),
    async (req, res) => {
      res.json(await service.editInk(db, Number(req.params.id), req.body));
    },
  );

  return router;
}
