import { Router } from "express";
import { passwordInput, profilePatch } from "../../../shared/schemas/accounts";
import { requireUser } from "../../auth/current-user";
import { endSessionsOf } from "../../auth/sessions";
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
    // A new password ends every other session (ASVS 5.0 V7.4.3); this one stays signed in.
    await endSessionsOf(db, me.id, "password changed", res.locals.sessionId ?? undefined);
    res.status(204).end();
  });

  /** "Sign out everywhere": ends every session of the member, this one too. */
  router.post("/me/sign-out-everywhere", requireUser, async (_req, res) => {
    const ended = await endSessionsOf(db, res.locals.user!.id, "signed out everywhere");
    res.json({ ended });
  });

  return router;
}
