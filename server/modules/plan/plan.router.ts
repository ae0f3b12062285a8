import { Router } from "express";
import { bridgeQuery } from "../../../shared/schemas/plan";
import { validate } from "../../middleware/validate";
import type { BridgeOptions, PlanService } from "./plan.service";

/** GET /bridges (mounted under /api). */
export function planRouter(plan: PlanService): Router {
  const router = Router();
  router.get("/bridges", validate({ query: bridgeQuery }), async (req, res) => {
    const user = res.locals.user ?? null;
    const q = req.query as unknown as BridgeOptions;
    if (q.inks !== "any") res.set("Cache-Control", "private, no-store");
    res.json(await plan.findBridges(q, user?.id ?? null));
  });
  return router;
}
