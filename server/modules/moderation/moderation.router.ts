import { Router } from "express";
import { z } from "zod";
import {
  bulkDecisionInput,
  decisionInput,
  inkCorrectionInput,
  moderationLogQuery,
  reportInput,
  roleInput,
  standingInput,
  suspensionInput,
} from "../../../shared/schemas/moderation";
import { stripIdParams } from "../../../shared/schemas/strips";
import { requireRole, requireUser } from "../../auth/current-user";
import { memberLimit } from "../../middleware/member-limits";
import { validate } from "../../middleware/validate";
import type { ModerationService } from "./moderation.service";

const memberParams = z.strictObject({ id: z.string().uuid("is not a member id") });

export function moderationRouter(moderation: ModerationService, limitScale = 1): Router {
  const router = Router();
  const reportLimit = memberLimit({ windowMs: 60 * 60 * 1000, newMember: 5, trusted: 20, message: "You have sent many reports in the last hour. Please wait a while.", scale: limitScale });

  router.get("/review-queue", requireRole("moderator"), async (_req, res) => {
    res.set("Cache-Control", "no-store").json({ items: await moderation.queue() });
  });

  router.get("/review-queue/count", requireRole("moderator"), async (_req, res) => {
    res.set("Cache-Control", "no-store").json({ count: await moderation.queueCount() });
  });

  router.post("/strips/:id/decisions", requireRole("moderator"), validate({ params: stripIdParams, body: decisionInput }), async (req, res) => {
    res.json(await moderation.decide(res.locals.user!, Number(req.params.id), req.body));
  });

  router.post("/review-queue/decisions", requireRole("moderator"), validate({ body: bulkDecisionInput }), async (req, res) => {
    res.json(await moderation.decideMany(res.locals.user!, req.body));
  });

  router.put("/strips/:id/inks", requireRole("moderator"), validate({ params: stripIdParams, body: inkCorrectionInput }), async (req, res) => {
    res.json(await moderation.correctInks(res.locals.user!, Number(req.params.id), req.body));
  });

  router.post("/strips/:id/reports", requireUser, reportLimit, validate({ params: stripIdParams, body: reportInput }), async (req, res) => {
    res.status(201).json(await moderation.report(res.locals.user!, Number(req.params.id), req.body));
  });

  router.get("/moderation/log", requireRole("moderator"), validate({ query: moderationLogQuery }), async (req, res) => {
    res.set("Cache-Control", "no-store").json(await moderation.log(req.query as never));
  });

  router.put("/members/:id/standing", requireRole("moderator"), validate({ params: memberParams, body: standingInput }), async (req, res) => {
    res.json(await moderation.setStanding(res.locals.user!, String(req.params.id), req.body));
  });

  router.put("/members/:id/suspension", requireRole("moderator"), validate({ params: memberParams, body: suspensionInput }), async (req, res) => {
    res.json(await moderation.suspend(res.locals.user!, String(req.params.id), req.body));
  });

  router.put("/members/:id/role", requireRole("admin"), validate({ params: memberParams, body: roleInput }), async (req, res) => {
    res.json(await moderation.setRole(res.locals.user!, String(req.params.id), req.body));
  });

  router.get("/notices", requireUser, async (_req, res) => {
    res.set("Cache-Control", "no-store").json({ items: await moderation.notices(res.locals.user!.id) });
  });

  router.post("/notices/read", requireUser, async (_req, res) => {
    await moderation.markNoticesRead(res.locals.user!.id);
    res.status(204).end();
  });

  return router;
}
