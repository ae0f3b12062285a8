// The strip analysis on phone photos of strips on desks (issue 11), on a fixed held-out subset of
// the scene generator: held-out seeds 100001–100006 of every class (chosen by seed, not by
// outcome), rendered at ≤ 1200 px (the analysis reads an 800 px copy; rendering is this file's
// cost, and the whole split at full size — up to 48 MP — is the eval script's job). The analysis's constants are chosen on the tuning split
// (seeds 1–50) only; the whole held-out split is scored by `npm run eval:scenes -- --split heldout`.
//
// The truth is made from published models, not from the analysis: CIELAB (CIE 15:2004) relative
// to the strip's own paper, sRGB encoding (IEC 61966-2-1), ink as optical density on paper with
// blends interpolating density (Beer–Lambert; decision 002), a pinhole camera over the table
// (Hartley & Zisserman), a CAT02 cast (CIE 159:2004; the analysis corrects with Bradford).
// ΔE2000 is shared/colour's, itself checked against Sharma, Wu & Dalal (2005) in colour.test.ts.
// The targets are issue 11's: right band count on ≥ 97 % of single-strip photos (here: all but
// at most one strip per class of six), band ΔE2000 median ≤ 1.0 and p95 ≤ 2.5, join error median
// ≤ 2 % of the strip's length, several strips ≥ 95 % found, none invented or merged, desk or card
// never read as a band.
import { mkdtemp, readFile, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { deltaE2000 } from "../../shared/colour/index";
import { analyzeStripImage, NoStripError } from "../../server/analysis/index";
import { labToLinear, syntheticCatalogue } from "../../server/demo/synthetic-photo";
import { linearToLab } from "./scenes/colour";
import { applyH, inv3, squareToQuad, type Pt, type Quad } from "./scenes/geometry";
import { CLASSES, CLASS_NAMES, makeScene, renderScene, sceneToJpeg, sceneTruth, type SceneClass, type SceneTruth } from "./scenes/index";
import { makeSpec } from "./scenes/layout";
import { aggregate, scoreFailure, scoreScene, type Reported, type SceneScore } from "./scenes/score";

const SEEDS = [100001, 100002, 100003, 100004, 100005, 100006];
const MAX_EDGE = 1200;
const catalogue = syntheticCatalogue();
const FIXTURES = join(dirname(fileURLToPath(import.meta.url)), "../fixtures/scenes");
let dir: string;

beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), "blendwell-scenes-test-"));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

async function scoreClass(cls: SceneClass): Promise<SceneScore[]> {
  const out: SceneScore[] = [];
  for (const seed of SEEDS) {
    const scene = makeScene(seed, cls, { maxLongEdge: MAX_EDGE });
    const path = join(dir, `c${cls}-${seed}.jpg`);
    await writeFile(path, await sceneToJpeg(scene));
    try {
      const res = await analyzeStripImage(path, { catalogue });
      out.push(scoreScene(scene.truth, { strips: res.strips as Reported["strips"] }));
    } catch (e) {
      if (e instanceof NoStripError) out.push(scoreFailure(scene.truth, e.code, null));
      else throw e;
    }
  }
  return out;
}

/**
 * Targets issue 11 sets that the analysis does not meet yet on these held-out scenes (figures in
 * docs/decisions/009 and the issue's note). Each is run as `it.fails`: it stays red-for-green —
 * the day a change meets one, its test fails and must move back to a plain `it`. Nothing here is
 * a pass: an unmet target is listed, never loosened.
 */
type Check = "count" | "colour" | "found" | "desk";
const UNMET: Record<SceneClass, Check[]> = {
  1: ["found", "desk"],
  2: ["count", "colour", "found", "desk"],
  3: ["found"],
  4: ["count", "found"],
  5: ["found"],
  6: ["count", "colour", "found", "desk"],
  7: ["colour"],
  8: ["count", "colour", "found"],
};

describe.each(CLASSES)("scene class %i", (cls) => {
  const target = (check: Check) => (UNMET[cls].includes(check) ? it.fails : it);
  let scores: SceneScore[] = [];
  beforeAll(async () => {
    scores = await scoreClass(cls);
  }, 120_000);

  const where = () => scores.map((s) => `seed ${s.seed}: ${s.refused ?? s.error ?? `${s.found}/${s.trueStrips} found, bands ${s.strips.map((x) => `${x.bands ?? "-"}/${x.inks}`).join(" ")}`}`).join("; ");

  target("count")(`${CLASS_NAMES[cls]}: the right number of bands on all strips but at most one`, () => {
    const strips = scores.flatMap((s) => s.strips);
    expect(strips.filter((s) => !s.rightCount).length, where()).toBeLessThanOrEqual(1);
  });

  target("colour")(`${CLASS_NAMES[cls]}: band colours within ΔE2000 1.0 (median) and 2.5 (p95) of the truth`, () => {
    const f = aggregate(scores);
    expect(f.deltaEMedian, where()).not.toBeNull();
    expect(f.deltaEMedian!).toBeLessThanOrEqual(1.0);
    expect(f.deltaEP95!).toBeLessThanOrEqual(2.5);
  });

  it(`${CLASS_NAMES[cls]}: joins within 2 % of the strip's length (median)`, () => {
    const f = aggregate(scores);
    expect(f.joinErrorMedianPct, where()).not.toBeNull();
    expect(f.joinErrorMedianPct!).toBeLessThanOrEqual(2);
  });

  target("found")(`${CLASS_NAMES[cls]}: every strip found (≥ 95 % with several), none invented, none merged`, () => {
    const f = aggregate(scores);
    expect(f.found / f.trueStrips, where()).toBeGreaterThanOrEqual(cls === 6 ? 0.95 : 1);
    expect(f.invented).toBe(0);
    expect(f.merged).toBe(0);
  });

  target("desk")(`${CLASS_NAMES[cls]}: the desk or the card is never read as a band`, () => {
    expect(aggregate(scores).deskBands, where()).toBe(0);
  });
});

// The generator's own truth, checked on its pixels (no analysis involved): with mottle, grain and
// noise turned off, the colour at the middle of each ink's flat stretch — found through the
// truth's own corners and fractions — relative to the card beside the strip, is the truth's
// media-relative CIELAB; at each join it is the density half-way between the two inks.
// Decoding follows IEC 61966-2-1; the camera matrix is undone exactly.
describe("the scene generator tells the truth", () => {
  const decode = (v: number) => (v <= 0.04045 ? v / 12.92 : Math.pow((v + 0.055) / 1.055, 2.4));
  // The first held-out seed of each single-strip class whose strip lies on a card (the reference white).
  const cases = ([1, 3, 4, 5, 7, 8] as SceneClass[]).map((cls) => {
    let seed = 100001;
    while (!makeSpec(seed, cls, { maxLongEdge: 1200 }).card) seed++;
    return [cls, seed] as const;
  });
  it.each(cases)("class %i (seed %i): ink colours and joins are where the truth says", (cls, seed) => {
    const spec = makeSpec(seed, cls, { maxLongEdge: 1200 });
    const clean = { ...spec, noise: 0, blurPx: 0, sharpen: null, light: { ...spec.light, shadows: [], glares: [], vignette: 0 }, strips: spec.strips.map((s) => ({ ...s, mottle: 0, grain: 0, curl: 0, edgeInk: 0 })) };
    const img = renderScene(clean);
    const truth = sceneTruth(seed, cls, { maxLongEdge: 1200 }).strips[0];
    const s = spec.strips[0];
    const camInv = inv3(spec.light.camera);
    // Bilinear sample of linear camera RGB at an image point, the camera matrix undone.
    const sample = ([x, y]: Pt): number[] => {
      x -= 0.5;
      y -= 0.5;
      const x0 = Math.floor(x);
      const y0 = Math.floor(y);
      const acc = [0, 0, 0];
      for (const [dx, dy, wgt] of [
        [0, 0, (1 - (x - x0)) * (1 - (y - y0))],
        [1, 0, (x - x0) * (1 - (y - y0))],
        [0, 1, (1 - (x - x0)) * (y - y0)],
        [1, 1, (x - x0) * (y - y0)],
      ]) {
        const o = ((y0 + dy) * img.width + x0 + dx) * 3;
        for (let c = 0; c < 3; c++) acc[c] += decode(img.data[o + c] / 255) * wgt;
      }
      return [0, 1, 2].map((i) => camInv[i * 3] * acc[0] + camInv[i * 3 + 1] * acc[1] + camInv[i * 3 + 2] * acc[2]);
    };
    // (t along the inked part, v across) → image, through the truth's inked-part corners: the quad
    // is the projection of a rectangle, so v outside 0–1 lands exactly that far off the strip.
    const toImage = squareToQuad(truth.inkedCorners.map(([x, y]) => [x * img.width, y * img.height]) as Quad);
    const at = (t: number, v: number) => sample(applyH(toImage, [t, v]));
    // Paper: the card 2.2 mm off both long edges (past the strip's thin contact shadow, short of
    // any neighbour), averaged so the window falloff cancels, scaled from the card's white to the strip's.
    const off = 2.2 / s.width;
    const paperAt = (t: number): number[] => {
      const a = at(t, -off);
      const b = at(t, 1 + off);
      return a.map((v, i) => ((v + b[i]) / 2) * (s.paper[i] / spec.card!.paper[i]));
    };
    const errors: number[] = [];
    for (const ink of truth.inks) {
      const t = (ink.start + ink.end) / 2;
      const p = paperAt(t);
      errors.push(deltaE2000(linearToLab(at(t, 0.5).map((v, c) => v / p[c])), ink.lab));
    }
    truth.joins.forEach((t, i) => {
      const [a, b] = [truth.inks[i].lab, truth.inks[i + 1].lab].map((lab) => labToLinear(lab).map((v) => -Math.log(v)));
      const p = paperAt(t);
      errors.push(deltaE2000(linearToLab(at(t, 0.5).map((v, c) => v / p[c])), linearToLab(a.map((d, c) => Math.exp(-(d + b[c]) / 2)))));
    });
    expect(errors.length).toBe(2 * truth.inks.length - 1);
    // 8-bit quantisation and the falloff's curvature over a few mm leave a few tenths.
    expect(Math.max(...errors), errors.map((e) => e.toFixed(2)).join(" ")).toBeLessThan(1.0);
  });
});

// The committed fixtures (tests/fixtures/scenes/*.jpg, made by makeScene(seed, cls, { maxLongEdge:
// 1600 }) and sceneToJpeg) still describe what the generator makes from their seeds: a change to
// the generator that moves them must regenerate them.
describe("committed scene fixtures", () => {
  it.each(["three-strips-desk", "card-on-mat-angle", "strip-on-desk-no-card"])("%s: its truth is the generator's for its seed", async (name) => {
    const saved = JSON.parse(await readFile(join(FIXTURES, `${name}.json`), "utf8")) as SceneTruth;
    expect(saved.split).toBe("heldout");
    expect(JSON.parse(JSON.stringify(sceneTruth(saved.seed, saved.cls, { maxLongEdge: 1600 })))).toEqual(saved);
  });
});
