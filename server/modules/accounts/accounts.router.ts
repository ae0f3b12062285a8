import { Router } from "express";
import { passwordInput, profilePatch } from "../../../shared/schemas/accounts";
import { requireUser } from "../../auth/current-user";
import type { Db } from "../../db/client";
import { validate } from "../../middleware/validate";
import * as repo from "./accounts.repository";
import * as service from "./accounts.service";

export function accountsRouter(db: Db): Router {
  const router = Router();

  router.get("/me", requireUser, (_req, res) => {
    res.json(res.locals.user);
  });

  router.patch("/me", requireUser, validate({ body: profilePatch }), async (req, res) => {
    const me = res.locals.user!;
    await service.updateMe(db, me.id, req.body);
    res.json(await service.loadMe(db, me.id));
  });

  router.put("/me/password", requireUser, validate({ body: passwordInput }), async (req, res) => {
    const me = res.locals.user!;
    const profile = await repo.findProfile(db, me.id);
    await service.setPassword(db, me.id, req.body, { isDemoAccount: profile?.is_demo === 1 });
    res.status(204).end();
  });

  return router;
}
