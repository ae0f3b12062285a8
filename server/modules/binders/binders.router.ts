import { Router } from "express";
import { z } from "zod";
import { binderInput, binderItemInput, binderItemParams, binderItemPatch, binderOrderInput, binderPatch } from "../../../shared/schemas/binders";
import { idParams } from "../../../shared/schemas/common";
import { requireUser } from "../../auth/current-user";
import { validate } from "../../middleware/validate";
import type { BindersService } from "./binders.service";

const memberParams = z.strictObject({ id: z.string().uuid("is not a member id") });

export function bindersRouter(binders: BindersService): Router {
  const router = Router();

  router.get("/binders", requireUser, async (_req, res) => {
    res.set("Cache-Control", "no-store").json({ items: await binders.mine(res.locals.user!) });
  });
  router.post("/binders", requireUser, validate({ body: binderInput }), async (req, res) => {
    res.status(201).json(await binders.create(res.locals.user!, req.body));
  });
  router.get("/binders/:id", validate({ params: idParams }), async (req, res) => {
    res.set("Cache-Control", "no-store").json(await binders.get(Number(req.params.id), res.locals.user));
  });
  router.patch("/binders/:id", requireUser, validate({ params: idParams, body: binderPatch }), async (req, res) => {
    res.json(await binders.update(Number(req.params.id), res.locals.user!, req.body));
  });
  router.delete("/binders/:id", requireUser, validate({ params: idParams }), async (req, res) => {
    await binders.remove(Number(req.params.id), res.locals.user!);
    res.status(204).end();
  });
  router.post("/binders/:id/items", requireUser, validate({ params: idParams, body: binderItemInput }), async (req, res) => {
    res.status(201).json(await binders.addItem(Number(req.params.id), res.locals.user!, req.body));
  });
  router.patch("/binders/:id/items/:stripId", requireUser, validate({ params: binderItemParams, body: binderItemPatch }), async (req, res) => {
    await binders.updateItem(Number(req.params.id), Number(req.params.stripId), res.locals.user!, req.body.note);
    res.status(204).end();
  });
  router.delete("/binders/:id/items/:stripId", requireUser, validate({ params: binderItemParams }), async (req, res) => {
    await binders.removeItem(Number(req.params.id), Number(req.params.stripId), res.locals.user!);
    res.status(204).end();
  });
  router.put("/binders/:id/order", requireUser, validate({ params: idParams, body: binderOrderInput }), async (req, res) => {
    res.json(await binders.reorder(Number(req.params.id), res.locals.user!, req.body));
  });
  router.get("/strips/:id/saved-in", requireUser, validate({ params: idParams }), async (req, res) => {
    res.set("Cache-Control", "no-store").json({ binderIds: await binders.savedIn(res.locals.user!, Number(req.params.id)) });
  });
  router.get("/members/:id/binders", validate({ params: memberParams }), async (req, res) => {
    res.json({ items: await binders.publicOf(String(req.params.id), res.locals.user) });
  });
  return router;
}
