import { Router } from "express";
import { z } from "zod";
import { stripSearchQuery } from "../../../shared/schemas/search";
import { stripIdParams, stripInput, stripPatch } from "../../../shared/schemas/strips";
import { requireUser } from "../../auth/current-user";
import type { AnonymousCache } from "../../middleware/anonymous-cache";
import { memberLimit } from "../../middleware/member-limits";
import { validate } from "../../middleware/validate";
import type { StripsService } from "./strips.service";

const imageParams = z.strictObject({ id: stripIdParams.shape.id, variant: z.enum(["display", "thumb"]) });
const memberParams = z.strictObject({ id: z.string().uuid() });

export function stripsRouter(strips: StripsService, limitScale = 1, cache?: AnonymousCache): Router {
  const router = Router();

  const search: Parameters<AnonymousCache["cached"]>[0] = (req, res) => strips.search(req.query as never, res.locals.user ?? null);
  router.get(
    "/strips",
    ...(cache ? [cache.lookup] : []),
    validate({ query: stripSearchQuery }),
    cache
      ? cache.cached(search)
      : async (req, res) => {
          res.json(await search(req, res));
        },
  );

  const postLimit = memberLimit({ windowMs: 60 * 60 * 1000, newMember: 10, trusted: 60, message: "You have posted many strips in the last hour. Please wait a while.", scale: limitScale });

  router.post("/strips", requireUser, postLimit, validate({ body: stripInput }), async (req, res) => {
    res.status(201).json(await strips.create(res.locals.user!, req.body));
  });

  router.get("/strips/:id", validate({ params: stripIdParams }), async (req, res) => {
    res.set("Cache-Control", "no-store").json(await strips.get(Number(req.params.id), res.locals.user));
  });

  router.get("/strips/:id/related", validate({ params: stripIdParams }), async (req, res) => {
    res.json({ items: await strips.related(Number(req.params.id), res.locals.user) });
  });

  router.patch("/strips/:id", requireUser, validate({ params: stripIdParams, body: stripPatch }), async (req, res) => {
    res.json(await strips.edit(Number(req.params.id), res.locals.user!, req.body));
  });

  router.delete("/strips/:id", requireUser, validate({ params: stripIdParams }), async (req, res) => {
    await strips.remove(Number(req.params.id), res.locals.user!);
    res.status(204).end();
  });

  router.get("/strips/:id/images/:variant", validate({ params: imageParams }), async (req, res) => {
    const variant = req.params.variant as "display" | "thumb";
    const image = await strips.imagePath(Number(req.params.id), variant, res.locals.user);
    // Never let a shared cache keep an image that only its author and moderators may see.
    res.set("Cache-Control", image.isPublic ? "public, max-age=300" : "private, no-store");
    res.type("image/webp").sendFile(image.path);
  });

  router.get("/members/:id", validate({ params: memberParams }), async (req, res) => {
    res.set("Cache-Control", "no-store").json(await strips.memberProfile(String(req.params.id), res.locals.user));
  });

  return router;
}
