// Bridge finder benchmark (issue 16): `npm run bench:bridges`.
// Builds a temporary database with the project's migrations and a generated catalogue of 2 000
// invented inks (20 invented brands, colours uniform over 8-bit sRGB), then times
// GET /api/bridges' service call: the first call (which builds the join matrix for the
// catalogue), then warm calls between random pairs of inks — any ink, and same brand only.
// Prints figures; the last line is one JSON object.
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { labToHex, srgbToLab } from "../shared/colour";
import { bridgeQuery } from "../shared/schemas/plan";
import { nowIso, openDatabase } from "../server/db/client";
import { migrateToLatest } from "../server/db/migrate";
import { seededRandom } from "../server/demo/seeded-random";
import { createPlanService } from "../server/modules/plan/plan.service";

const INKS = Number(process.env.BENCH_INKS ?? 2000);
const BRANDS = 20;
const QUERIES = Number(process.env.BENCH_QUERIES ?? 200);
const rnd = seededRandom(16_2026);

const dir = mkdtempSync(path.join(os.tmpdir(), "blendwell-bench-bridges-"));
const db = openDatabase(path.join(dir, "bench.sqlite"));
try {
  await migrateToLatest(db);
  const now = nowIso();
  for (let b = 0; b < BRANDS; b++) {
    await db.insertInto("brands").values({ slug: `bench-brand-${b}`, name: `Bench Brand ${b}`, created_at: now }).execute();
  }
  const brandIds = (await db.selectFrom("brands").select("id").execute()).map((r) => r.id);
  const rows = Array.from({ length: INKS }, (_, i) => {
    const lab = srgbToLab(Math.floor(rnd() * 256), Math.floor(rnd() * 256), Math.floor(rnd() * 256));
    return {
      brand_id: brandIds[i % BRANDS]!,
      name: `Bench Ink ${i}`,
      type: "dye" as const,
      hex: labToHex(lab),
      lab_l: lab.l,
      lab_a: lab.a,
      lab_b: lab.b,
      created_at: now,
      updated_at: now,
    };
  });
  for (let i = 0; i < rows.length; i += 200) await db.insertInto("inks").values(rows.slice(i, i + 200)).execute();
  const ids = (await db.selectFrom("inks").select("id").execute()).map((r) => r.id);
  const plan = createPlanService({ db });
  const pick = () => ids[Math.floor(rnd() * ids.length)]!;
  const pair = () => {
    const from = pick();
    let to = pick();
    while (to === from) to = pick();
    return { from, to };
  };

  let t = performance.now();
  await plan.findBridges(bridgeQuery.parse({ ...pair() }), null);
  const firstMs = performance.now() - t;

  const time = async (sameBrand: boolean) => {
    const ms: number[] = [];
    let found = 0;
    for (let i = 0; i < QUERIES; i++) {
      const q = bridgeQuery.parse({ ...pair(), sameBrand: String(sameBrand), limit: "5" });
      t = performance.now();
      const r = await plan.findBridges(q, null);
      ms.push(performance.now() - t);
      found += r.bridges.length;
    }
    ms.sort((a, b) => a - b);
    const q = (p: number) => Math.round(ms[Math.min(ms.length - 1, Math.floor(p * ms.length))]! * 10) / 10;
    return { p50: q(0.5), p95: q(0.95), max: q(1), bridgesPerQuery: Math.round((found / QUERIES) * 10) / 10 };
  };
  const any = await time(false);
  const sameBrand = await time(true);
  console.log(`catalogue: ${INKS} generated inks in ${BRANDS} brands`);
  console.log(`first call (builds the join matrix, ${INKS}² pairs): ${Math.round(firstMs)} ms`);
  console.log(`any ink, 5 bridges, ${QUERIES} random pairs: p50 ${any.p50} ms, p95 ${any.p95} ms, max ${any.max} ms, ${any.bridgesPerQuery} bridges per query`);
  console.log(`same brand, 5 bridges: p50 ${sameBrand.p50} ms, p95 ${sameBrand.p95} ms, max ${sameBrand.max} ms`);
  console.log(`target: p95 ≤ 200 ms for any ink — ${any.p95 <= 200 ? "met" : "NOT met"}`);
  console.log(JSON.stringify({ p95Ms: any.p95, inks: INKS, p50Ms: any.p50, sameBrandP95Ms: sameBrand.p95, firstCallMs: Math.round(firstMs), queries: QUERIES }));
} finally {
  await db.destroy();
  rmSync(dir, { recursive: true, force: true });
}
