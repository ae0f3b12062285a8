// Scores the real strip analysis on generated phone photos with known truth (issue 11).
//
//   npm run eval:scenes -- --split tuning|heldout [--class N[,M…]] [--limit K] [--seeds a-b]
//                          [--max-edge PX] [--save DIR] [--json]
//
// For every scene: render it (tests/analysis/scenes), write its JPEG to a temp folder, run
// analyzeStripImage(path, { catalogue }) from server/analysis — the same decode and analysis an
// upload runs — and score the result against the truth. A NoStripError is a "refused" outcome
// (counted, with its code); any other exception is an "error" (counted, message kept).
//
// SPLITS (tests/analysis/scenes/index.ts): tuning = seeds 1–50 of each class, heldout = seeds
// 100001–100050 of each class. Choose analysis constants on the tuning split only.
//
// FIGURES per class, then totals, then one JSON line with everything:
// - scenes; strips true; found / missed / invented / merged — a reported outline is MERGED when
//   ≥ 2 true strips each have ≥ 50 % of their area inside it; otherwise it matches a true strip
//   when its polygon IoU with the whole strip or with the inked part is ≥ 0.3 (or each centroid
//   lies inside the other and the areas are within 2×), greedily by IoU, one to one; unmatched
//   true strips are MISSED, unmatched outlines INVENTED;
// - right band count %: true strips whose reading has as many bands as the strip has inks
//   (a missed strip or a refused photo counts as wrong);
// - band ΔE2000 median / p95: on strips with the right count, bands in order along the real strip
//   against the true inks (media-relative CIELAB D65, paper = L* 100);
// - join error median / p95: |reported transition centre − true join| in % of the inked part's
//   length, positions mapped through both outlines' homographies onto the real strip;
// - refused (with codes) and errors;
// - desk/card read as a band: a band of a matched strip lying outside the true inked part
//   (beyond 3 % of its length past either end, or off the strip across it), or whose colour is
//   within ΔE2000 6 of the desk's main colours or of the card (media-relative truth) while
//   ≥ 10 from every true ink of that strip; plus every band of an invented outline within 6 of the
//   desk or card. Printed as bands (scenes);
// - order: several-strip scenes whose found strips are numbered in the truth's reading order.
// Full definitions: tests/analysis/scenes/score.ts.
import { mkdir, mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { syntheticCatalogue } from "../server/demo/synthetic-photo";
import { CLASSES, CLASS_NAMES, makeScene, sceneToJpeg, splitSeeds, type SceneClass, type Split } from "../tests/analysis/scenes/index";
import { aggregate, scoreFailure, scoreScene, type ClassFigures, type Reported, type SceneScore } from "../tests/analysis/scenes/score";

type Args = { split: Split; classes: SceneClass[]; limit?: number; seeds?: [number, number]; save?: string; json: boolean; maxEdge?: number };

function parseArgs(argv: string[]): Args {
  const a: Args = { split: "tuning", classes: CLASSES, json: false };
  for (let i = 0; i < argv.length; i++) {
    const k = argv[i];
    const v = () => {
      const x = argv[++i];
      if (x === undefined) throw new Error(`${k} needs a value`);
      return x;
    };
    if (k === "--split") {
      const s = v();
      if (s !== "tuning" && s !== "heldout") throw new Error("--split is tuning or heldout");
      a.split = s;
    } else if (k === "--class") a.classes = v().split(",").map((c) => Number(c) as SceneClass);
    else if (k === "--limit") a.limit = Number(v());
    else if (k === "--seeds") {
      const m = /^(\d+)-(\d+)$/.exec(v());
      if (!m) throw new Error("--seeds a-b");
      a.seeds = [Number(m[1]), Number(m[2])];
    } else if (k === "--save") a.save = v();
    else if (k === "--max-edge") a.maxEdge = Number(v());
    else if (k === "--json") a.json = true;
    else throw new Error(`unknown option ${k}`);
  }
  if (a.classes.some((c) => !CLASSES.includes(c))) throw new Error("--class takes 1–8");
  return a;
}

/** The analysis result as the scoring reads it; older results without `strips` give one strip from `strip`. */
type LooseResult = {
  strips?: Reported["strips"];
  strip?: { start: { x: number; y: number }; end: { x: number; y: number }; thickness: number };
  bands?: Reported["strips"][number]["bands"];
  transitions?: Reported["strips"][number]["transitions"];
};
function toReported(res: LooseResult): Reported {
  if (Array.isArray(res.strips) && res.strips.length) return { strips: res.strips };
  if (res.strip && Array.isArray(res.bands)) {
    const { start, end, thickness } = res.strip;
    const dx = end.x - start.x;
    const dy = end.y - start.y;
    const n = Math.hypot(dx, dy) || 1;
    const t = thickness / 2;
    const nx = (-dy / n) * t;
    const ny = (dx / n) * t;
    const outline: Reported["strips"][number]["outline"] = [
      [start.x + nx, start.y + ny],
      [end.x + nx, end.y + ny],
      [end.x - nx, end.y - ny],
      [start.x - nx, start.y - ny],
    ];
    return { strips: [{ index: 0, outline, bands: res.bands, transitions: res.transitions ?? [] }] };
  }
  return { strips: [] };
}

const fmt = (x: number | null, d = 2) => (x === null ? "—" : x.toFixed(d));

function row(name: string, f: ClassFigures): string {
  const codes = Object.entries(f.refusedCodes)
    .map(([c, n]) => `${c}×${n}`)
    .join(" ");
  return [
    name.padEnd(24),
    String(f.scenes).padStart(6),
    String(f.trueStrips).padStart(6),
    `${f.found}/${f.missed}/${f.invented}/${f.merged}`.padStart(14),
    `${f.rightCountPct.toFixed(1)}%`.padStart(7),
    `${fmt(f.deltaEMedian)} / ${fmt(f.deltaEP95)}`.padStart(13),
    `${fmt(f.joinErrorMedianPct)} / ${fmt(f.joinErrorP95Pct)}`.padStart(13),
    `${f.refused}${codes ? ` (${codes})` : ""}${f.errors ? ` err×${f.errors}` : ""}`.padEnd(26),
    `${f.deskBands} (${f.deskBandScenes})`.padStart(9),
    f.orderRightPct === null ? "" : `${f.orderRightPct.toFixed(0)}%`,
  ].join(" ");
}

async function main() {
  const args = parseArgs(process.argv.slice(2));
  // Imported here so a half-rewritten analysis fails with a clear message, not at load.
  const { analyzeStripImage, NoStripError } = await import("../server/analysis/index");
  const catalogue = syntheticCatalogue();
  const dir = await mkdtemp(join(tmpdir(), "blendwell-scenes-"));
  if (args.save) await mkdir(args.save, { recursive: true });
  const seeds = args.seeds ? Array.from({ length: args.seeds[1] - args.seeds[0] + 1 }, (_, i) => args.seeds![0] + i) : splitSeeds(args.split).slice(0, args.limit);
  const byClass = new Map<SceneClass, SceneScore[]>();
  const started = performance.now();
  let renderMs = 0;
  let analysisMs = 0;
  try {
    for (const cls of args.classes) {
      const scores: SceneScore[] = [];
      for (const seed of seeds) {
        let t = performance.now();
        const scene = makeScene(seed, cls, { maxLongEdge: args.maxEdge });
        const jpeg = await sceneToJpeg(scene);
        renderMs += performance.now() - t;
        const name = `c${cls}-s${seed}`;
        const path = join(dir, `${name}.jpg`);
        await writeFile(path, jpeg);
        t = performance.now();
        let score: SceneScore;
        let result: unknown = null;
        try {
          result = await analyzeStripImage(path, { catalogue });
          score = scoreScene(scene.truth, toReported(result as LooseResult));
        } catch (e) {
          if (e instanceof NoStripError) score = scoreFailure(scene.truth, e.code, null);
          else score = scoreFailure(scene.truth, null, e instanceof Error ? e.message : String(e));
        }
        analysisMs += performance.now() - t;
        await rm(path, { force: true });
        scores.push(score);
        if (args.save) {
          await writeFile(join(args.save, `${name}.jpg`), jpeg);
          await writeFile(join(args.save, `${name}.json`), JSON.stringify({ truth: scene.truth, score, analysis: result }, null, 1));
        }
        if (!args.json) process.stderr.write(`\r${name}  ${scores.length}/${seeds.length} (class ${cls})     `);
      }
      byClass.set(cls, scores);
    }
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
  if (!args.json) process.stderr.write("\n");

  const perClass: Record<string, ClassFigures> = {};
  for (const [cls, scores] of byClass) perClass[cls] = aggregate(scores);
  const all = [...byClass.values()].flat();
  const totals = aggregate(all);
  const single = aggregate(all.filter((s) => s.trueStrips === 1));
  if (!args.json) {
    console.log(`Scenes: split ${args.seeds ? `seeds ${args.seeds.join("–")}` : args.split}${args.maxEdge ? `, rendered ≤ ${args.maxEdge} px` : ""}`);
    console.log(
      ["class".padEnd(24), "scenes".padStart(6), "strips".padStart(6), "fnd/mis/inv/mrg".padStart(14), "count".padStart(7), "ΔE med / p95".padStart(13), "join% md/p95".padStart(13), "refused".padEnd(26), "desk-band".padStart(9), "order"].join(" "),
    );
    for (const [cls, f] of Object.entries(perClass)) console.log(row(`${cls} ${CLASS_NAMES[Number(cls) as SceneClass]}`, f));
    console.log(row("single-strip scenes", single));
    console.log(row("totals", totals));
    console.log(`render ${(renderMs / 1000).toFixed(1)} s, analysis ${(analysisMs / 1000).toFixed(1)} s, wall ${((performance.now() - started) / 1000).toFixed(1)} s`);
  }
  console.log(
    JSON.stringify({
      split: args.seeds ? null : args.split,
      seeds: args.seeds ?? [seeds[0], seeds[seeds.length - 1]],
      maxEdge: args.maxEdge ?? null,
      perClass,
      singleStrip: single,
      totals,
      renderMs: Math.round(renderMs),
      analysisMs: Math.round(analysisMs),
    }),
  );
}

main().catch((e) => {
  console.error(e instanceof Error ? e.message : e);
  process.exitCode = 1;
});
