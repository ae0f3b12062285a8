import { converter } from "culori";
import { describe, expect, it } from "vitest";
import { deltaE2000, hexToLab, hueName, labToLch, type Lab } from "../../shared/colour/index";
import { blendLab, blendResidual, labToDensity } from "../../shared/colour/blend";
import { previewGradient, previewLayout } from "../../shared/colour/blend-preview";
import { joinFacts, MUDDY_CHROMA_RATIO } from "../../shared/colour/joins";

const toLrgb = converter("lrgb");
const toLab65 = converter("lab65");

/**
 * Beer–Lambert, worked independently through culori (a reference colour library): optical
 * densities add, so half of each dye gives the geometric mean of the two reflectances per
 * linear-sRGB channel.
 */
function geometricMiddle(a: Lab, b: Lab): Lab {
  const ra = toLrgb({ mode: "lab65", l: a.l, a: a.a, b: a.b });
  const rb = toLrgb({ mode: "lab65", l: b.l, a: b.a, b: b.b });
  // The model floors reflectance at 1e-4 so that a channel at 0 (a gamut-clipped ink) has a finite density.
  const gm = (x: number, y: number) => Math.sqrt(Math.max(1e-4, x) * Math.max(1e-4, y));
  const m = toLab65({ mode: "lrgb", r: gm(ra.r, rb.r), g: gm(ra.g, rb.g), b: gm(ra.b, rb.b) });
  return { l: m.l, a: m.a, b: m.b };
}

const straightLab = (a: Lab, b: Lab): Lab => ({ l: (a.l + b.l) / 2, a: (a.a + b.a) / 2, b: (a.b + b.b) / 2 });

// sRGB renderings of process (CMYK) yellow and cyan as commonly quoted (#fff200, #00aeef —
// from memory), and a dye-like purple, orange and blue of our own.
const yellow = hexToLab("#fff200");
const cyan = hexToLab("#00aeef");

describe("the blend model (straight in optical density, Beer–Lambert)", () => {
  it("puts the middle of a blend at the geometric mean of the two reflectances, as culori computes it", () => {
    for (const [x, y] of [["#fff200", "#00aeef"], ["#7b3fa0", "#f2d22e"], ["#c2352f", "#3e5f74"], ["#efc5c8", "#1d2a4a"]] as const) {
      const a = hexToLab(x);
      const b = hexToLab(y);
      expect(deltaE2000(blendLab(a, b, 0.5), geometricMiddle(a, b))).toBeLessThan(0.05);
    }
  });

  it("is straight in density: a quarter of the way is a quarter of the density change", () => {
    const dA = labToDensity(yellow);
    const dB = labToDensity(cyan);
    const q = labToDensity(blendLab(yellow, cyan, 0.25));
    for (let c = 0; c < 3; c++) expect(q[c]).toBeCloseTo(dA[c]! + 0.25 * (dB[c]! - dA[c]!), 3);
  });

  it("gives the analysis the same blend the preview draws (one implementation)", () => {
    // Samples laid exactly on the model's blend have no residual.
    const m = 9;
    const lab: number[] = [];
    for (let k = 1; k <= m; k++) {
      const c = blendLab(yellow, cyan, k / (m + 1));
      lab.push(c.l, c.a, c.b);
    }
    expect(blendResidual(labToDensity(yellow), labToDensity(cyan), m, lab, 0)).toBeLessThan(1e-3);
    // …and a straight CIELAB blend is far from it.
    const straight: number[] = [];
    for (let k = 1; k <= m; k++) {
      const f = k / (m + 1);
      straight.push(yellow.l + f * (cyan.l - yellow.l), yellow.a + f * (cyan.a - yellow.a), yellow.b + f * (cyan.b - yellow.b));
    }
    expect(blendResidual(labToDensity(yellow), labToDensity(cyan), m, straight, 0)).toBeGreaterThan(100);
  });
});

describe("facts of the trade (common practice)", () => {
  it("blends a yellow and a cyan dye through green, not grey", () => {
    const mid = blendLab(yellow, cyan, 0.5);
    expect(hueName(mid)).toBe("green");
    expect(labToLch(mid).c).toBeGreaterThan(0.8 * Math.min(labToLch(yellow).c, labToLch(cyan).c));
    expect(joinFacts(yellow, cyan).muddy).toBe(false);
    // A straight line in CIELAB would pass much closer to grey: the density model is what says green.
    expect(labToLch(straightLab(yellow, cyan)).c).toBeLessThan(labToLch(mid).c / 2);
  });

  it.each([
    ["purple and yellow", "#7b3fa0", "#f2d22e"],
    ["red and green", "#c2352f", "#3f8f4a"],
    ["orange and blue", "#d9782f", "#3f5fb0"],
  ])("calls the join of complementary %s muddy: the middle loses chroma below both ends", (_name, x, y) => {
    const j = joinFacts(hexToLab(x), hexToLab(y));
    expect(j.muddy).toBe(true);
    expect(j.chroma.middle).toBeLessThan(MUDDY_CHROMA_RATIO * Math.min(j.chroma.first, j.chroma.second));
  });

  it.each([
    ["yellow and orange", "#efc53a", "#d9782f"],
    ["blue and teal", "#3f5fb0", "#2f8f94"],
    ["pink and purple", "#e07fa8", "#7b3fa0"],
  ])("keeps neighbouring hues (%s) clean", (_name, x, y) => {
    expect(joinFacts(hexToLab(x), hexToLab(y)).muddy).toBe(false);
  });

  it("warns that a far darker ink takes over a pale one, and not between two mid inks", () => {
    expect(joinFacts(hexToLab("#f6eeb0"), hexToLab("#1d2a4a")).takeover).toBe("second");
    expect(joinFacts(hexToLab("#1d2a4a"), hexToLab("#f6eeb0")).takeover).toBe("first");
    expect(joinFacts(hexToLab("#d9782f"), hexToLab("#c2352f")).takeover).toBeNull();
  });

  it("states the step in ΔE2000 and plain words", () => {
    const j = joinFacts(hexToLab("#efc53a"), hexToLab("#d9782f"));
    expect(j.deltaE).toBeCloseTo(deltaE2000(hexToLab("#efc53a"), hexToLab("#d9782f")), 2);
    expect(j.words).toBe("very different");
  });
});

describe("the blend preview layout", () => {
  it("lays flat bands with predicted joins between them, in order", () => {
    const labs = [yellow, cyan, hexToLab("#3f5fb0")];
    const p = previewLayout(labs, 8);
    expect(p.bands).toHaveLength(3);
    expect(p.joins).toHaveLength(2);
    expect(p.bands[0]!.from).toBe(0);
    expect(p.bands[2]!.to).toBeCloseTo(1, 10);
    for (let i = 1; i < p.stops.length; i++) expect(p.stops[i]!.at).toBeGreaterThanOrEqual(p.stops[i - 1]!.at);
    expect(p.stops[0]!.hex).toBe("#fff200");
    // The middle stop of the first join is the model's middle.
    const midStops = p.stops.filter((s) => s.at > p.joins[0]!.from && s.at < p.joins[0]!.to);
    expect(midStops).toHaveLength(7);
    expect(deltaE2000(hexToLab(midStops[3]!.hex), blendLab(yellow, cyan, 0.5))).toBeLessThan(1);
    expect(previewGradient(p)).toMatch(/^linear-gradient\(to right, #fff200 0\.00%/);
  });
});
