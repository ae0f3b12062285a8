import { Router } from "express";
import { idParams } from "../../../shared/schemas/common";
import { besideQuery, binderPlanInput, binderPlanParams, bridgeQuery, practiceCardQuery, stashChartQuery } from "../../../shared/schemas/plan";
import { requireUser } from "../../auth/current-user";
import { validate } from "../../middleware/validate";
import type { BridgeOptions, PlanService } from "./plan.service";

/** The planning routes, mounted under /api: bridges, inks beside an ink, printable sheets, planned strips in binders. */
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
  router.get("/plan/card.pdf", validate({ query: practiceCardQuery }), async (req, res) => {
    const q = req.query as unknown as { inks: number[]; paper: "a4" | "letter" };
    const pdf = await plan.practiceCard(q.inks, q.paper);
    res.type("application/pdf").set("Content-Disposition", `attachment; filename="blendwell-practice-card-${q.paper}.pdf"`).send(pdf);
  });

  router.get("/stash/chart.pdf", requireUser, validate({ query: stashChartQuery }), async (req, res) => {
    const q = req.query as unknown as { paper: "a4" | "letter" };
    const pdf = await plan.stashChart(res.locals.user!.id, q.paper);
    res
      .type("application/pdf")
      .set("Cache-Control", "private, no-store")
      .set("Content-Disposition", `attachment; filename="blendwell-stash-chart-${q.paper}.pdf"`)
      .send(pdf);
  });
  router.get("/binders/:id/plans", validate({ params: idParams }), async (req, res) => {
    res.set("Cache-Control", "no-store").json(await plan.binderPlans(Number(req.params.id), res.locals.user?.id ?? null));
  });
  router.post("/binders/:id/plans", requireUser, validate({ params: idParams, body: binderPlanInput }), async (req, res) => {
    res.status(201).json(await plan.savePlan(res.locals.user!.id, Number(req.params.id), req.body.inks));
  });
  router.delete("/binders/:id/plans/:planId", requireUser, validate({ params: binderPlanParams }), async (req, res) => {
    await plan.removePlan(res.locals.user!.id, Number(req.params.id), Number(req.params.planId));
    res.status(204).end();
  });
  return router;
}
