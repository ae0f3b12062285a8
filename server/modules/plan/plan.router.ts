import { Router } from "express";
import { idParams } from "../../../shared/schemas/common";
import { besideQuery, bridgeQuery } from "../../../shared/schemas/plan";
import { validate } from "../../middleware/validate";
import type { BridgeOptions, PlanService } from "./plan.service";

/** GET /bridges and GET /inks/:id/beside (mounted under /api). */
export function planRouter(plan: PlanService): Router {
  const router = Router();
  router.get("/bridges", validate({ query: bridgeQuery }), async (req, res) => {
    const user = res.locals.user ?? null;
    const q = req.query as unknown as BridgeOptions;
    if (q.inks !== "any") res.set("Cache-Control", "private, no-store");
    res.json(await plan.findBridges(q, user?.id ?? null));
  });
  router.get("/inks/:id/beside", validate({ params: idParams, query: besideQuery }), async (req, res) => {
    const q = req.query as unknown as { limit: number };
    res.json(await plan.inksBeside(Number(req.params.id), q.limit));
  });
  return router;
}
