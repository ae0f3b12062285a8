import { describeDeltaE, type Lab } from "../../../shared/colour";
import { joinFacts } from "../../../shared/colour/joins";
import { MAX_BINDER_PLANS, type BesideList, type BinderPlan, type BinderPlanList, type Bridge, type BridgeList, type BridgeStep, type PlanInk } from "../../../shared/schemas/plan";
import { nowIso } from "../../db/client";
import type { z } from "zod";
import type { bridgeQuery } from "../../../shared/schemas/plan";
import type { Db } from "../../db/client";
import { AppError, notFound } from "../../middleware/errors";
import { buildJoinMatrix, findBestBridges, type BridgeQuery, type JoinMatrix } from "./bridge-search";
import * as repo from "./plan.repository";
import { practiceCardPdf, stashChartPdf, type PaperSize, type SheetInk } from "./sheets";

export type BridgeOptions = z.output<typeof bridgeQuery>;

type Catalogue = {
  version: string;
  inks: repo.CatalogueInkRow[];
  labs: Lab[];
  indexOf: Map<number, number>;
  matrix: JoinMatrix;
};

const round2 = (n: number) => Math.round(n * 100) / 100;
const planInk = (r: repo.CatalogueInkRow): PlanInk => ({ id: r.id, name: r.name, brand: r.brand, hex: r.hex });

export function createPlanService(deps: { db: Db }) {
  const { db } = deps;
  // The join matrix costs about a second for 2 000 inks: built once per catalogue version and
  // shared by every request until a moderator changes the catalogue.
  let cached: Promise<Catalogue> | null = null;
  let cachedVersion = "";

  async function catalogue(): Promise<Catalogue> {
    const version = await repo.catalogueVersion(db);
    if (!cached || version !== cachedVersion) {
      cachedVersion = version;
      cached = repo.catalogueInks(db).then((inks) => {
        const labs = inks.map((r) => ({ l: r.lab_l, a: r.lab_a, b: r.lab_b }));
        return { version, inks, labs, indexOf: new Map(inks.map((r, i) => [r.id, i])), matrix: buildJoinMatrix(labs) };
      });
      cached.catch(() => {
        cached = null;
      });
    }
    return cached;
  }

  async function findBridges(q: BridgeOptions, viewerId: string | null): Promise<BridgeList> {
    if (q.inks !== "any" && !viewerId) throw new AppError("sign_in_required", "Sign in to look for bridges among the inks you own.", 401);
    const cat = await catalogue();
    const from = cat.indexOf.get(q.from);
    const to = cat.indexOf.get(q.to);
    const fields: Record<string, string[]> = {};
    if (from === undefined) fields.from = [`unknown ink id: ${q.from}`];
    if (to === undefined) fields.to = [`unknown ink id: ${q.to}`];
    if (from === undefined || to === undefined) throw new AppError("unknown_inks", "That ink is not in the catalogue.", 422, fields);

    const owned = viewerId && q.inks !== "any" ? new Set(await repo.stashInkIds(db, viewerId)) : null;
    const ownsIndex = (i: number) => !!owned?.has(cat.inks[i]!.id);
    const brands = new Set([cat.inks[from]!.brand_id, cat.inks[to]!.brand_id]);
    const allowed = (i: number) => {
      const ink = cat.inks[i]!;
      if (q.sameBrand && !brands.has(ink.brand_id)) return false;
      if (q.inks === "stash") return ownsIndex(i);
      // A discontinued ink can stand in a bridge only if it is already on the member's desk.
      return !ink.discontinued || ownsIndex(i);
    };
    const query: BridgeQuery = {
      from,
      to,
      allowed,
      k: q.limit,
      ...(q.inks === "oneToBuy" && { mustBuy: (i: number) => !ownsIndex(i), maxBuys: 1 }),
    };
    const found = findBestBridges(cat.matrix, query);

    const pairs: [number, number][] = [[q.from, q.to]];
    for (const b of found) for (let i = 1; i < b.nodes.length; i++) pairs.push([cat.inks[b.nodes[i - 1]!]!.id, cat.inks[b.nodes[i]!]!.id]);
    const counts = await repo.besideCounts(db, pairs);
    const step = (a: number, b: number): BridgeStep => {
      const facts = joinFacts(cat.labs[a]!, cat.labs[b]!);
      return { deltaE: facts.deltaE, words: describeDeltaE(facts.deltaE), muddy: facts.muddy, strips: counts.get(repo.pairKey(cat.inks[a]!.id, cat.inks[b]!.id)) ?? 0 };
    };
    let searched = 0;
    for (let i = 0; i < cat.inks.length; i++) if (i !== from && i !== to && allowed(i)) searched++;
    const bridges: Bridge[] = found.map((b) => {
      const steps = b.nodes.slice(1).map((v, i) => step(b.nodes[i]!, v));
      const buy = q.inks === "oneToBuy" ? b.nodes.slice(1, -1).find((v) => !ownsIndex(v)) : undefined;
      return {
        inks: b.nodes.map((v) => planInk(cat.inks[v]!)),
        steps,
        maxStepDeltaE: round2(b.maxStep),
        ...(q.inks === "oneToBuy" && { toBuy: buy === undefined ? null : planInk(cat.inks[buy]!) }),
      };
    });
    return { bridges, direct: step(from, to), searched };
  }

  /** What the community blends directly next to an ink: neighbours by count, with example strips. */
  async function inksBeside(inkId: number, limit: number): Promise<BesideList> {
    if (!(await repo.inkExists(db, inkId))) throw notFound("That ink");
    const rows = await repo.inksBeside(db, inkId, limit);
    const cat = await catalogue();
    const examples = await repo.besideExamples(db, inkId, rows.map((r) => r.ink_id), 3);
    const items = rows.flatMap((r) => {
      const i = cat.indexOf.get(r.ink_id);
      if (i === undefined) return [];
      return [{ ink: planInk(cat.inks[i]!), strips: r.n, examples: examples.filter((e) => e.neighbour === r.ink_id).map((e) => ({ id: e.id, title: e.title })) }];
    });
    return { inkId, items };
  }

  /** A practice card (PDF) for inks in order; every ink must be in the catalogue. */
  async function practiceCard(inkIds: number[], paper: PaperSize): Promise<Buffer> {
    const cat = await catalogue();
    const missing = inkIds.filter((id) => !cat.indexOf.has(id));
    if (missing.length) throw new AppError("unknown_inks", "Some inks of this plan are not in the catalogue.", 422, { inks: [`unknown ink id${missing.length > 1 ? "s" : ""}: ${missing.join(", ")}`] });
    const inks: SheetInk[] = inkIds.map((id) => {
      const i = cat.indexOf.get(id)!;
      return { ...planInk(cat.inks[i]!), lab: cat.labs[i]! };
    });
    return practiceCardPdf(inks, paper);
  }

  /** The member's stash chart (PDF). */
  async function stashChart(userId: string, paper: PaperSize): Promise<Buffer> {
    const { name, inks } = await repo.stashForChart(db, userId);
    return stashChartPdf(
      name,
      inks.map((r) => ({ id: r.id, name: r.name, brand: r.brand, hex: r.hex, lab: { l: r.lab_l, a: r.lab_a, b: r.lab_b } })),
      paper,
    );
  }

  // Planned strips in binders. A private binder is not found by anyone but its owner.
  async function visibleBinder(binderId: number, viewerId: string | null) {
    const b = await repo.binderById(db, binderId);
    if (!b || (b.visibility === "private" && b.owner_id !== viewerId)) throw notFound("That binder");
    return b;
  }

  async function ownBinder(binderId: number, userId: string) {
    const b = await visibleBinder(binderId, userId);
    if (b.owner_id !== userId) throw new AppError("forbidden", "Only the owner can change this binder.", 403);
    return b;
  }

  function toBinderPlan(cat: Catalogue, row: { id: number; binder_id: number; ink_ids: string; added_at: string }): BinderPlan {
    const inkIds = (JSON.parse(row.ink_ids) as number[]).filter((id) => Number.isSafeInteger(id));
    const inks = inkIds.flatMap((id) => {
      const i = cat.indexOf.get(id);
      return i === undefined ? [] : [planInk(cat.inks[i]!)];
    });
    return { id: row.id, binderId: row.binder_id, inkIds, inks, addedAt: row.added_at };
  }

  async function binderPlans(binderId: number, viewerId: string | null): Promise<BinderPlanList> {
    const b = await visibleBinder(binderId, viewerId);
    const cat = await catalogue();
    return { items: (await repo.binderPlans(db, binderId)).map((r) => toBinderPlan(cat, r)), canEdit: b.owner_id === viewerId };
  }

  async function savePlan(userId: string, binderId: number, inkIds: number[]): Promise<BinderPlan> {
    await ownBinder(binderId, userId);
    const cat = await catalogue();
    const missing = inkIds.filter((id) => !cat.indexOf.has(id));
    if (missing.length) throw new AppError("unknown_inks", "Some inks of this plan are not in the catalogue.", 422, { inks: [`unknown ink id${missing.length > 1 ? "s" : ""}: ${missing.join(", ")}`] });
    if ((await repo.countBinderPlans(db, binderId)) >= MAX_BINDER_PLANS) {
      throw new AppError("binder_full", `A binder holds at most ${MAX_BINDER_PLANS} planned strips.`, 409);
    }
    return toBinderPlan(cat, await repo.insertBinderPlan(db, binderId, inkIds, nowIso()));
  }

  async function removePlan(userId: string, binderId: number, planId: number): Promise<void> {
    await ownBinder(binderId, userId);
    if (!(await repo.deleteBinderPlan(db, binderId, planId))) throw notFound("That planned strip");
  }

  return { findBridges, inksBeside, practiceCard, stashChart, binderPlans, savePlan, removePlan, catalogue };
}

export type PlanService = ReturnType<typeof createPlanService>;
