// Synthetic strip photos with known truth: 2–5 invented inks, soft blends (or hard edges), tilt up
// to ±15°, sensor noise, vignetting, dust specks, JPEG quality 70–95, warm to cool casts
// (simulated with CAT02, CIE 159:2004), horizontal and vertical, some stored turned with an EXIF
// orientation tag. Seeds 1–48 here; the segmentation constants were chosen on seeds 1000–1239
// (docs/decisions/002-strip-segmentation.md), so these cases were not used for tuning.
import { mkdtemp, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { deltaE2000 } from "../../shared/colour/index";
import { analyzeStripImage, type AnalysisResult } from "../../server/analysis/index";
import { randomStripCase, renderScene, sceneToJpeg, syntheticCatalogue, type StripCase } from "../../server/demo/synthetic-photo";

const SEEDS = Array.from({ length: 48 }, (_, i) => i + 1);
const catalogue = syntheticCatalogue();

type Outcome = { seed: number; c: StripCase; result: AnalysisResult | null; error: string | null };
const outcomes: Outcome[] = [];
let dir: string;

beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), "blendwell-strips-"));
  for (const seed of SEEDS) {
    const c = randomStripCase(seed, catalogue);
    const jpg = await sceneToJpeg(renderScene(c.spec), c.quality, c.exifOrientation);
    const path = join(dir, `${seed}.jpg`);
    await writeFile(path, jpg);
    try {
      outcomes.push({ seed, c, result: await analyzeStripImage(path, { catalogue }), error: null });
    } catch (e) {
      outcomes.push({ seed, c, result: null, error: (e as Error).message });
    }
  }
}, 240_000);

afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

function figures() {
  const counted = outcomes.filter((o) => o.result && o.result.bands.length === o.c.truth.length && o.result.orientation === o.c.spec.orientation);
  const des: number[] = [];
  const boundaryErrors: number[] = [];
  let bands = 0;
  let top3 = 0;
  for (const o of counted) {
    o.result!.bands.forEach((b, i) => {
      const t = o.c.truth[i];
      des.push(deltaE2000(b.lab, t.lab));
      bands++;
      if (b.suggestions.slice(0, 3).some((s) => s.inkId === t.inkId)) top3++;
      if (i > 0) boundaryErrors.push(Math.abs(b.start - t.start));
      if (i < o.c.truth.length - 1) boundaryErrors.push(Math.abs(b.end - t.end));
    });
  }
  des.sort((a, b) => a - b);
  boundaryErrors.sort((a, b) => a - b);
  return { counted: counted.length, des, boundaryErrors, bands, top3 };
}

describe("synthetic strips with known truth", () => {
  it("prints the figures", () => {
    const f = figures();
    const q = (a: number[], p: number) => a[Math.min(a.length - 1, Math.floor(p * a.length))];
    console.log(
      [
        `synthetic strips: ${outcomes.length} photos, ${outcomes.reduce((s, o) => s + o.c.truth.length, 0)} bands`,
        `  band count and orientation right: ${f.counted}/${outcomes.length}`,
        `  band colour ΔE2000: median ${q(f.des, 0.5).toFixed(2)}, 90th pct ${q(f.des, 0.9).toFixed(2)}, max ${f.des[f.des.length - 1].toFixed(2)}`,
        `  boundary error (share of length): median ${q(f.boundaryErrors, 0.5).toFixed(3)}, max ${f.boundaryErrors[f.boundaryErrors.length - 1].toFixed(3)}`,
        `  true ink in top 3 suggestions: ${f.top3}/${f.bands}`,
        ...outcomes
          .filter((o) => !o.result || o.result.bands.length !== o.c.truth.length)
          .map((o) => `  miss: seed ${o.seed}: ${o.c.truth.length} inks → ${o.result ? `${o.result.bands.length} bands` : o.error}`),
      ].join("\n"),
    );
    expect(outcomes).toHaveLength(SEEDS.length);
  });

  it("covers what the brief asks for: both orientations, EXIF turns, casts, 2–5 inks", () => {
    expect(new Set(outcomes.map((o) => o.c.spec.orientation))).toEqual(new Set(["horizontal", "vertical"]));
    expect(outcomes.some((o) => o.c.exifOrientation)).toBe(true);
    expect(new Set(outcomes.map((o) => o.c.spec.illuminant)).size).toBeGreaterThanOrEqual(4);
    expect(new Set(outcomes.map((o) => o.c.truth.length))).toEqual(new Set([2, 3, 4, 5]));
    expect(Math.max(...outcomes.map((o) => Math.abs(o.c.spec.tiltDeg)))).toBeGreaterThan(12);
  });

  it("finds the right number of bands on at least 95% of photos", () => {
    expect(figures().counted / outcomes.length).toBeGreaterThanOrEqual(0.95);
  });

  it("reads band colours within a median ΔE2000 of 1.5", () => {
    const { des } = figures();
    expect(des[Math.floor(des.length / 2)]).toBeLessThanOrEqual(1.5);
  });

  it("puts every band boundary within 4% of the strip's length", () => {
    const { boundaryErrors } = figures();
    expect(boundaryErrors.length).toBeGreaterThan(0);
    expect(boundaryErrors[boundaryErrors.length - 1]).toBeLessThanOrEqual(0.04);
  });

  it("has the true ink among the top three suggestions for at least 95% of bands", () => {
    const { top3, bands } = figures();
    expect(top3 / bands).toBeGreaterThanOrEqual(0.95);
  });

  it("reports fractions in order from the left or top end, with transitions between bands", () => {
    for (const o of outcomes) {
      if (!o.result) continue;
      const { bands, transitions } = o.result;
      expect(bands[0].start).toBe(0);
      expect(bands[bands.length - 1].end).toBe(1);
      expect(transitions).toHaveLength(bands.length - 1);
      transitions.forEach((t, i) => {
        expect(t.start).toBe(bands[i].end);
        expect(t.end).toBe(bands[i + 1].start);
        expect(t.end).toBeGreaterThanOrEqual(t.start);
      });
      expect(o.result.paper.found).toBe(true);
    }
  });
});
