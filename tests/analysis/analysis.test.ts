import { mkdtemp, readdir, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { deltaE2000, hexToLab, srgbToLab } from "../../shared/colour/index";
import {
  NoStripError,
  analyzePixels,
  analyzeStripImage,
  confidenceFor,
  loadVision,
  processStripPhoto,
  segmentProfile,
  suggestInks,
  type CatalogueInk,
} from "../../server/analysis/index";
import { toCorrectedLab } from "../../server/analysis/corrected-lab";
import { noPaper } from "../../server/analysis/paper-white";
import { interquartileMean } from "../../server/analysis/read-profile";
import { PrefixSums } from "../../server/analysis/segment-profile";
import processUpload from "../../server/modules/uploads/upload-worker";
import { renderScene, sceneToJpeg, seededRandom, syntheticCatalogue, type SceneSpec } from "../../server/demo/synthetic-photo";

let dir: string;
beforeAll(async () => {
  await loadVision();
  dir = await mkdtemp(join(tmpdir(), "blendwell-analysis-"));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

const lab = (hex: string) => hexToLab(hex);
const ink = (id: number, hex: string, name = `Ink ${id}`): CatalogueInk => ({ id, name, brand: "Oddacre Studio", lab: lab(hex), hex });

function scene(overrides: Partial<SceneSpec> = {}): SceneSpec {
  return {
    width: 1000,
    height: 750,
    orientation: "horizontal",
    tiltDeg: 3,
    lengthShare: 0.75,
    thicknessShare: 0.16,
    bands: [
      { start: 0, end: 0.3, lab: lab("#2f5d8a") },
      { start: 0.36, end: 0.62, lab: lab("#d8b43a") },
      { start: 0.68, end: 1, lab: lab("#a33a52") },
    ],
    blend: "soft",
    illuminant: "F2",
    exposure: 0.9,
    vignette: 0.15,
    noise: 1.5,
    seed: 42,
    ...overrides,
  };
}

describe("pixel reading", () => {
  it("takes the interquartile mean exactly as the sorted definition does, ties and all", () => {
    const g = seededRandom(31);
    for (const n of [4, 5, 9, 100, 1001]) {
      const values = Array.from({ length: n }, () => Math.round(g() * 40) / 4); // many ties
      const sorted = [...values].sort((a, b) => a - b);
      const lo = Math.floor(n / 4);
      const expected = sorted.slice(lo, n - lo).reduce((s, v) => s + v, 0) / (n - 2 * lo);
      expect(interquartileMean(values)).toBeCloseTo(expected, 10);
    }
    expect(interquartileMean([3, 1, 2])).toBe(2);
  });

  it("converts an uncorrected photo to the same CIELAB as shared/colour (culori), pixel by pixel", () => {
    const g = seededRandom(32);
    const w = 64;
    const h = 16;
    const data = Buffer.from(Array.from({ length: w * h * 3 }, () => Math.floor(g() * 256)));
    const lab = toCorrectedLab({ width: w, height: h, data }, noPaper());
    for (let p = 0; p < w * h; p++) {
      const ref = srgbToLab(data[p * 3], data[p * 3 + 1], data[p * 3 + 2]);
      expect(lab.lab[p * 3]).toBeCloseTo(ref.l, 3);
      expect(lab.lab[p * 3 + 1]).toBeCloseTo(ref.a, 3);
      expect(lab.lab[p * 3 + 2]).toBeCloseTo(ref.b, 3);
    }
  });
});

describe("segmentation (dynamic programming with a penalty)", () => {
  function profileOf(levels: { len: number; lab: [number, number, number] }[], noise: number, seed: number) {
    const g = seededRandom(seed);
    const values: number[] = [];
    for (const { len, lab: c } of levels) for (let i = 0; i < len; i++) values.push(...c.map((v) => v + (g() - 0.5) * 2 * noise));
    return { lab: Float64Array.from(values), n: values.length / 3 };
  }

  it("finds a staircase of flat bands at the right places, choosing the count itself", () => {
    const p = profileOf(
      [
        { len: 80, lab: [40, 20, -30] },
        { len: 60, lab: [70, -10, 40] },
        { len: 100, lab: [55, 45, 10] },
        { len: 60, lab: [30, 0, -5] },
      ],
      0.5,
      1,
    );
    const r = segmentProfile(p.lab, p.n);
    expect(r.bands.map((b) => [b.from, b.to])).toEqual([
      [0, 80],
      [80, 140],
      [140, 240],
      [240, 300],
    ]);
    // The chosen count is the cheapest penalised one, not the most bands allowed.
    const best = r.costByCount.indexOf(Math.min(...r.costByCount)) + 1;
    expect(best).toBe(4);
  });

  it("keeps one band when the profile is one colour with noise", () => {
    const p = profileOf([{ len: 300, lab: [60, 10, 10] }], 1, 2);
    expect(segmentProfile(p.lab, p.n).bands).toEqual([{ from: 0, to: 300 }]);
  });

  it("treats a straight blend between two inks as a transition, not as extra bands", () => {
    const values: number[] = [];
    const a = [80, -20, 60];
    const b = [35, 30, -40];
    for (let i = 0; i < 300; i++) {
      const t = Math.min(1, Math.max(0, (i - 120) / 40));
      values.push(...a.map((v, c) => v + (b[c] - v) * t));
    }
    const r = segmentProfile(Float64Array.from(values), 300);
    expect(r.bands).toHaveLength(2);
    expect(r.bands[0].to).toBeGreaterThanOrEqual(118);
    expect(r.bands[1].from).toBeLessThanOrEqual(162);
  });

  it("computes the straight-blend cost in O(1) exactly as the sum it stands for", () => {
    const n = 60;
    const g = seededRandom(9);
    const labs = Float64Array.from({ length: n * 3 }, () => g() * 100 - 50);
    const ps = new PrefixSums(labs, n);
    for (const [i, j, w] of [
      [5, 20, 3],
      [10, 11, 2],
      [30, 55, 4],
    ]) {
      let sse = 0;
      for (let c = 0; c < 3; c++) {
        let A = 0;
        for (let t = i - w; t < i; t++) A += labs[t * 3 + c] / w;
        let B = 0;
        for (let t = j; t < j + w; t++) B += labs[t * 3 + c] / w;
        for (let t = i; t < j; t++) sse += (labs[t * 3 + c] - (A + ((t - i + 1) / (j - i + 1)) * (B - A))) ** 2;
      }
      expect(ps.bridge(i, j, n, w)).toBeCloseTo(sse, 6);
    }
  });
});

describe("ink suggestions", () => {
  const catalogue = [ink(1, "#2f5d8a"), ink(2, "#305e8c"), ink(3, "#3a6a99"), ink(4, "#d8b43a"), ink(5, "#a33a52"), ink(6, "#2b5580"), ink(7, "#111111")];

  it("lists the five closest inks by CIEDE2000, closest first", () => {
    const { suggestions, confidence } = suggestInks(lab("#2f5d8a"), catalogue);
    expect(suggestions).toHaveLength(5);
    expect(suggestions[0].inkId).toBe(1);
    expect(suggestions[0].deltaE).toBe(0);
    for (let i = 1; i < suggestions.length; i++) expect(suggestions[i].deltaE).toBeGreaterThanOrEqual(suggestions[i - 1].deltaE);
    const expected = catalogue.map((c) => deltaE2000(lab("#2f5d8a"), c.lab)).sort((a, b) => a - b).slice(0, 5);
    expect(suggestions.map((s) => s.deltaE)).toEqual(expected.map((d) => Math.round(d * 100) / 100));
    expect(confidence).toBe("match");
  });

  it("puts a stash ink first when it is within 1.0 of the best, and not when it is further", () => {
    const measured = lab("#2f5d8a");
    const near = catalogue.find((c) => c.id === 2)!;
    expect(deltaE2000(measured, near.lab)).toBeLessThan(1);
    expect(suggestInks(measured, catalogue, new Set([2])).suggestions[0].inkId).toBe(2);
    const far = catalogue.find((c) => c.id === 5)!;
    expect(deltaE2000(measured, far.lab)).toBeGreaterThan(1);
    expect(suggestInks(measured, catalogue, new Set([5])).suggestions[0].inkId).toBe(1);
  });

  it("says how sure it is in words (our thresholds: 3 and 8)", () => {
    expect(confidenceFor(2.99)).toBe("match");
    expect(confidenceFor(3.01)).toBe("close");
    expect(confidenceFor(8)).toBe("close");
    expect(confidenceFor(8.01)).toBe("no close ink");
    expect(suggestInks(lab("#00ff00"), catalogue).confidence).toBe("no close ink");
    expect(suggestInks(lab("#00ff00"), [])).toEqual({ suggestions: [], confidence: "no close ink" });
  });
});

describe("analyzeStripImage", () => {
  const catalogue = [...syntheticCatalogue(), ink(1001, "#2f5d8a", "Harbour Night"), ink(1002, "#d8b43a", "Mustard Field"), ink(1003, "#a33a52", "Bramble Wine")];

  it("returns exactly the API shape, reading a tilted strip from the left end", async () => {
    const path = join(dir, "three.jpg");
    await writeFile(path, await sceneToJpeg(renderScene(scene()), 85));
    const r = await analyzeStripImage(path, { catalogue });
    expect(Object.keys(r).sort()).toEqual(["bands", "notices", "orientation", "paper", "strip", "strips", "transitions"]);
    // strips[0] is the same strip as the single-strip fields, with its four corners.
    expect(r.strips).toHaveLength(1);
    expect(r.strips[0].bands).toEqual(r.bands);
    expect(r.strips[0].outline).toHaveLength(4);
    expect(r.notices).toEqual([]);
    expect(r.orientation).toBe("horizontal");
    expect(Object.keys(r.strip!).sort()).toEqual(["end", "start", "thickness"]);
    expect(r.strip!.start.x).toBeLessThan(r.strip!.end.x);
    expect(Object.keys(r.paper).sort()).toEqual(["found", "hex", "lab"]);
    expect(r.paper.found).toBe(true);
    expect(r.bands.map((b) => b.suggestions[0].inkId)).toEqual([1001, 1002, 1003]);
    for (const b of r.bands) {
      expect(Object.keys(b).sort()).toEqual(["confidence", "end", "hex", "index", "lab", "spread", "start", "suggestions"]);
      expect(b.hex).toMatch(/^#[0-9a-f]{6}$/);
      expect(b.confidence).toBe("match");
      expect(Object.keys(b.suggestions[0]).sort()).toEqual(["brand", "deltaE", "hex", "inkId", "lab", "name"]);
      // The suggested ink's own reference colour comes along, for showing it beside the band.
      const ink = catalogue.find((c) => c.id === b.suggestions[0].inkId)!;
      expect([b.suggestions[0].hex, b.suggestions[0].lab]).toEqual([ink.hex, ink.lab]);
    }
    expect(r.transitions).toHaveLength(2);
    // Under a cool-white fluorescent cast the paper looks tinted as photographed, and is reported so.
    expect(deltaE2000(r.paper.lab, { l: 100, a: 0, b: 0 })).toBeGreaterThan(2);
  });

  it("ignores dust specks and a blown-out glare spot on the strip", async () => {
    const path = join(dir, "glare.jpg");
    await writeFile(path, await sceneToJpeg(renderScene(scene({ glare: true, specks: 25, seed: 8 })), 85));
    const r = await analyzeStripImage(path, { catalogue });
    expect(r.bands.map((b) => b.suggestions[0].inkId)).toEqual([1001, 1002, 1003]);
    for (const b of r.bands) expect(b.suggestions[0].deltaE).toBeLessThanOrEqual(3);
  });

  it("reads a vertical strip from the top", async () => {
    const path = join(dir, "vertical.jpg");
    await writeFile(path, await sceneToJpeg(renderScene(scene({ width: 750, height: 1000, orientation: "vertical", tiltDeg: -9 })), 85));
    const r = await analyzeStripImage(path, { catalogue });
    expect(r.orientation).toBe("vertical");
    expect(r.bands.map((b) => b.suggestions[0].inkId)).toEqual([1001, 1002, 1003]);
  });

  it("uses a white point the member picks on the paper", async () => {
    const path = join(dir, "warm.jpg");
    await writeFile(path, await sceneToJpeg(renderScene(scene({ illuminant: "A" })), 90));
    const onPaper = await analyzeStripImage(path, { catalogue, white: { x: 0.04, y: 0.05 } });
    expect(onPaper.paper.found).toBe(true);
    expect(onPaper.bands.map((b) => b.suggestions[0].inkId)).toEqual([1001, 1002, 1003]);
    await expect(analyzeStripImage(path, { catalogue, white: { x: 2, y: 0.5 } })).rejects.toThrow(RangeError);
  });

  it("refuses a photo of blank paper with a reason a member understands", async () => {
    const path = join(dir, "blank.jpg");
    await writeFile(path, await sceneToJpeg(renderScene(scene({ bands: [{ start: 0, end: 1, lab: { l: 100, a: 0, b: 0 } }] })), 85));
    const err = await analyzeStripImage(path, { catalogue }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(NoStripError);
    expect((err as NoStripError).code).toBe("no_ink");
    expect((err as NoStripError).message).toMatch(/could not find a blended strip/);
  });

  it("refuses a photo that is colour everywhere but no strip", async () => {
    const w = 800;
    const h = 600;
    const data = Buffer.alloc(w * h * 3);
    for (let y = 0; y < h; y++)
      for (let x = 0; x < w; x++) data.set([Math.round((x / w) * 200), 90, Math.round((y / h) * 200)], (y * w + x) * 3);
    const path = join(dir, "gradient.jpg");
    await writeFile(path, await sharp(data, { raw: { width: w, height: h, channels: 3 } }).jpeg().toBuffer());
    const err = await analyzeStripImage(path, { catalogue }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(NoStripError);
    expect((err as NoStripError).code).toBe("not_strip_shaped");
  });

  it("reads a tight crop of the strip itself (no paper: no correction, paper not found)", async () => {
    const w = 900;
    const h = 200;
    const rgb = ["#2f5d8a", "#d8b43a"].map((hex) => [1, 3, 5].map((k) => parseInt(hex.slice(k, k + 2), 16)));
    const data = Buffer.alloc(w * h * 3);
    for (let y = 0; y < h; y++) for (let x = 0; x < w; x++) data.set(rgb[x < w / 2 ? 0 : 1], (y * w + x) * 3);
    const r = analyzePixels({ width: w, height: h, data }, { catalogue });
    expect(r.paper.found).toBe(false);
    expect(r.bands.map((b) => b.suggestions[0].inkId)).toEqual([1001, 1002]);
    // A white point picked by the member is used even here (it makes the blue half the white).
    const picked = analyzePixels({ width: w, height: h, data }, { catalogue, white: { x: 0.25, y: 0.5 } });
    expect(picked.paper.found).toBe(true);
    expect(picked.bands.some((b) => b.suggestions[0]?.inkId === 1001)).toBe(false);
  });
});

describe("the upload pipeline (processStripPhoto, run by the upload worker)", () => {
  it("analyses exactly as analyzeStripImage does, and writes the derivatives of the corrected photo", async () => {
    const path = join(dir, "pipeline.jpg");
    await writeFile(path, await sceneToJpeg(renderScene(scene({ illuminant: "A" })), 88));
    const catalogue = syntheticCatalogue(30);
    const out = { displayPath: join(dir, "pipe", "display.webp"), thumbPath: join(dir, "pipe", "thumb.webp") };
    const done = await processStripPhoto(path, out, { catalogue });
    expect(done.analysis).toEqual(await analyzeStripImage(path, { catalogue }));
    expect([done.derivatives.display.width, done.derivatives.display.height]).toEqual([1000, 750]);
    expect(done.derivatives.thumb.width).toBe(480);
    expect(done.derivatives.phash).toMatch(/^[0-9a-f]{16}$/);
    expect((await readdir(join(dir, "pipe"))).sort()).toEqual(["display.webp", "thumb.webp"]);
    for (const k of ["decodeMs", "analysisMs", "analysisReadyMs", "totalMs"] as const) expect(done.timings[k]).toBeGreaterThan(0);
    // Under incandescent light (CIE A) the paper was photographed orange; the display photo is
    // adapted to D65 (Bradford), so the paper near a corner now reads neutral: a*, b* within 2.
    const { data, info } = await sharp(out.displayPath).raw().toBuffer({ resolveWithObject: true });
    const at = (x: number, y: number) => {
      const i = (y * info.width + x) * info.channels;
      return srgbToLab(data[i], data[i + 1], data[i + 2]);
    };
    const photographed = done.analysis.paper.lab;
    expect(Math.hypot(photographed.a, photographed.b)).toBeGreaterThan(10);
    const shown = at(Math.round(info.width * 0.06), Math.round(info.height * 0.08));
    expect(Math.hypot(shown.a, shown.b)).toBeLessThan(2);
  });

  it("writes nothing when the photo has no strip", async () => {
    const path = join(dir, "blank-pipe.jpg");
    await writeFile(path, await sceneToJpeg(renderScene(scene({ bands: [{ start: 0, end: 1, lab: { l: 100, a: 0, b: 0 } }] })), 85));
    const out = { displayPath: join(dir, "none", "display.webp"), thumbPath: join(dir, "none", "thumb.webp") };
    await expect(processStripPhoto(path, out, { catalogue: [] })).rejects.toBeInstanceOf(NoStripError);
    await expect(readdir(join(dir, "none"))).rejects.toThrow(/ENOENT/);
  });
});

describe("upload worker entry (for piscina)", () => {
  it("takes a plain job and returns a plain, cloneable result with the files it wrote", async () => {
    const path = join(dir, "worker.jpg");
    await writeFile(path, await sceneToJpeg(renderScene(scene()), 85));
    const catalogue = syntheticCatalogue(20);
    const result = await processUpload({ originalPath: path, outDir: join(dir, "w-out"), catalogue, stash: [3] });
    expect(structuredClone(result)).toEqual(result);
    expect(result.ok).toBe(true);
    if (result.ok) {
      expect(result.analysis.bands).toHaveLength(3);
      expect(result.images).toMatchObject({ display: "display.webp", thumb: "thumb.webp", width: 1000, height: 750 });
      expect(result.images.phash).toMatch(/^[0-9a-f]{16}$/);
      expect((await readdir(join(dir, "w-out"))).sort()).toEqual(["display.webp", "thumb.webp"]);
    }
  });

  it("returns member mistakes as data (a cloned Error would lose its code)", async () => {
    const path = join(dir, "notes.jpg");
    await writeFile(path, "not a photo");
    const result = await processUpload({ originalPath: path, outDir: join(dir, "n-out"), catalogue: [], stash: [] });
    expect(result).toEqual({ ok: false, code: "unsupported_type", message: expect.stringMatching(/not a photo we can read \(text\)/) });
  });
});
