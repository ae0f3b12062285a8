import { readFileSync } from "node:fs";
import { converter, differenceCiede2000 } from "culori";
import { describe, expect, it } from "vitest";
import {
  deltaE2000,
  describeDeltaE,
  hexToLab,
  hueName,
  isHex,
  labToHex,
  labToLch,
  labToSrgb,
  normalizeHex,
  srgbToLab,
  type Lab,
} from "../../shared/colour/index";
import { BRADFORD, BRADFORD_INVERSE, bradfordMatrix } from "../../server/analysis/bradford";
import {
  D65_WHITE,
  SRGB8_TO_LINEAR,
  SRGB_TO_XYZ,
  XYZ_TO_SRGB,
  cbrtFast,
  labFFast,
  mulVec3,
  srgbDecode,
  srgbEncode,
  xyzToLabInto,
} from "../../server/analysis/srgb-lab";
import { correctToPaperWhite } from "../../server/analysis/correct-photo";
import { seededRandom } from "../../server/demo/synthetic-photo";

const sharma = JSON.parse(readFileSync(new URL("../fixtures/analysis/ciede2000-sharma-2005.json", import.meta.url), "utf8")) as {
  pairs: number[][];
};

describe("CIEDE2000", () => {
  // Sharma, Wu & Dalal (2005), Color Res. Appl. 30(1), Table 1: 34 pairs, ΔE00 to 4 decimals.
  it.each(sharma.pairs.map((p) => [p[0], p] as const))("matches Sharma, Wu & Dalal (2005) pair %i", (_n, p) => {
    const a: Lab = { l: p[1], a: p[2], b: p[3] };
    const b: Lab = { l: p[4], a: p[5], b: p[6] };
    expect(Math.abs(deltaE2000(a, b) - p[7])).toBeLessThan(1e-4);
    expect(Math.abs(deltaE2000(b, a) - p[7])).toBeLessThan(1e-4); // the formula is symmetric
  });

  it("has all 34 pairs of the published table", () => {
    expect(sharma.pairs).toHaveLength(34);
  });

  it("agrees with culori's independent implementation on random pairs", () => {
    // culori's differenceCiede2000 is a port of Sharma's own MATLAB code (reference library).
    const ref = differenceCiede2000();
    const rand = seededRandom(7);
    for (let i = 0; i < 2000; i++) {
      const a = { l: rand() * 100, a: rand() * 200 - 100, b: rand() * 200 - 100 };
      const b = { l: rand() * 100, a: rand() * 200 - 100, b: rand() * 200 - 100 };
      const expected = ref({ mode: "lab65", ...a }, { mode: "lab65", ...b });
      expect(deltaE2000(a, b)).toBeCloseTo(expected, 9);
    }
  });

  it("describes differences in plain words (bands are common practice, not a standard)", () => {
    expect(describeDeltaE(0.4)).toBe("indistinguishable");
    expect(describeDeltaE(1)).toBe("indistinguishable");
    expect(describeDeltaE(1.5)).toBe("barely different");
    expect(describeDeltaE(4.9)).toBe("similar");
    expect(describeDeltaE(7)).toBe("noticeably different");
    expect(describeDeltaE(25)).toBe("very different");
  });
});

describe("sRGB transfer function (IEC 61966-2-1:1999)", () => {
  it("switches from the linear to the power segment at V = 0.04045 / L = 0.0031308", () => {
    // IEC 61966-2-1: V ≤ 0.04045 → L = V / 12.92; else L = ((V + 0.055) / 1.055)^2.4.
    expect(srgbDecode(0.04045)).toBeCloseTo(0.04045 / 12.92, 12);
    expect(srgbDecode(0.04046)).toBeCloseTo(((0.04046 + 0.055) / 1.055) ** 2.4, 12);
    expect(srgbDecode(0.04045)).toBeCloseTo(0.0031308, 6);
    expect(srgbEncode(0.0031308)).toBeCloseTo(0.04045, 5);
    expect(srgbEncode(0.0031307)).toBeCloseTo(0.0031307 * 12.92, 12);
    expect(srgbDecode(1)).toBeCloseTo(1, 12);
    expect(srgbDecode(0)).toBe(0);
  });

  it("inverts itself over the whole 8-bit range", () => {
    for (let i = 0; i < 256; i++) expect(Math.round(srgbEncode(SRGB8_TO_LINEAR[i]) * 255)).toBe(i);
  });

  it("uses the standard's RGB → XYZ matrix (published to 4 decimals)", () => {
    // IEC 61966-2-1:1999, sRGB (linear) → CIE XYZ (D65).
    const iec = [0.4124, 0.3576, 0.1805, 0.2126, 0.7152, 0.0722, 0.0193, 0.1192, 0.9505];
    SRGB_TO_XYZ.forEach((v, i) => expect(Math.abs(v - iec[i])).toBeLessThan(6e-5));
    // and culori (reference library) converts the primaries to the same XYZ.
    const toXyz = converter("xyz65");
    const red = toXyz({ mode: "rgb", r: 1, g: 0, b: 0 });
    expect(red.x).toBeCloseTo(SRGB_TO_XYZ[0], 9);
    expect(red.y).toBeCloseTo(SRGB_TO_XYZ[3], 9);
    expect(red.z).toBeCloseTo(SRGB_TO_XYZ[6], 9);
  });

  it("maps sRGB white to the D65 white, L* = 100 and a* = b* = 0", () => {
    const w = srgbToLab(255, 255, 255);
    expect(w.l).toBeCloseTo(100, 6);
    expect(w.a).toBeCloseTo(0, 6);
    expect(w.b).toBeCloseTo(0, 6);
    const out = [0, 0, 0];
    const xyz = mulVec3(SRGB_TO_XYZ, [1, 1, 1]);
    xyzToLabInto(xyz[0], xyz[1], xyz[2], out, 0);
    expect(out[0]).toBeCloseTo(100, 6);
    expect(out[1]).toBeCloseTo(0, 6);
    expect(out[2]).toBeCloseTo(0, 6);
    // D65 chromaticity (0.3127, 0.3290), CIE 15 / IEC 61966-2-1.
    expect(xyz[0] / (xyz[0] + xyz[1] + xyz[2])).toBeCloseTo(0.3127, 4);
    expect(xyz[1] / (xyz[0] + xyz[1] + xyz[2])).toBeCloseTo(0.329, 4);
  });

  it("puts the sRGB primaries at their CIELAB (D65) values", () => {
    // Widely tabulated CIELAB D65 coordinates of the sRGB primaries and mid grey (from memory).
    const cases: [number, number, number, number, number, number][] = [
      [255, 0, 0, 53.24, 80.09, 67.2],
      [0, 255, 0, 87.73, -86.18, 83.18],
      [0, 0, 255, 32.3, 79.19, -107.86],
      [128, 128, 128, 53.59, 0, 0],
    ];
    for (const [r, g, b, L, A, B] of cases) {
      const lab = srgbToLab(r, g, b);
      expect(Math.abs(lab.l - L)).toBeLessThanOrEqual(0.01);
      expect(Math.abs(lab.a - A)).toBeLessThanOrEqual(0.01);
      expect(Math.abs(lab.b - B)).toBeLessThanOrEqual(0.01);
    }
  });

  it("converts pixels the same way in the fast analysis path and in shared/colour", () => {
    const rand = seededRandom(11);
    const out = [0, 0, 0];
    for (let i = 0; i < 3000; i++) {
      const rgb = [0, 1, 2].map(() => Math.floor(rand() * 256));
      const xyz = mulVec3(SRGB_TO_XYZ, rgb.map((v) => SRGB8_TO_LINEAR[v]));
      xyzToLabInto(xyz[0], xyz[1], xyz[2], out, 0);
      const ref = srgbToLab(rgb[0], rgb[1], rgb[2]);
      expect(out[0]).toBeCloseTo(ref.l, 6);
      if (!(rgb[0] === rgb[1] && rgb[1] === rgb[2])) {
        expect(out[1]).toBeCloseTo(ref.a, 6);
        expect(out[2]).toBeCloseTo(ref.b, 6);
      }
    }
  });
});

describe("fast cube root of the per-pixel CIELAB conversion", () => {
  it("agrees with Math.cbrt to 1e-8 (relative) over the range pixels reach, and falls back outside it", () => {
    let worst = 0;
    for (let t = 216 / 24389; t < 3; t *= 1.0007) worst = Math.max(worst, Math.abs(cbrtFast(t) - Math.cbrt(t)) / Math.cbrt(t));
    expect(worst).toBeLessThan(1e-8);
    expect(cbrtFast(27)).toBe(3);
    expect(cbrtFast(0)).toBe(0);
  });

  it("gives CIE 15's f(t): the cube root above ε = (6/29)³, the straight line (κt + 16)/116 below", () => {
    const eps = (6 / 29) ** 3;
    const kappa = (29 / 3) ** 3;
    expect(labFFast(eps / 2)).toBeCloseTo((kappa * (eps / 2) + 16) / 116, 12);
    expect(labFFast(0.5)).toBeCloseTo(Math.cbrt(0.5), 9);
    // The two pieces meet at ε: f(ε) = 6/29 either way.
    expect(labFFast(eps)).toBeCloseTo(6 / 29, 9);
  });
});

describe("hex and CIELAB", () => {
  it("round-trips every tested hex colour exactly", () => {
    const rand = seededRandom(3);
    for (let i = 0; i < 2000; i++) {
      const hex = "#" + Math.floor(rand() * 0xffffff).toString(16).padStart(6, "0");
      expect(labToHex(hexToLab(hex))).toBe(hex);
    }
  });

  it("clips colours outside the sRGB gamut into it", () => {
    expect(labToSrgb({ l: 50, a: 0, b: -150 }).every((v) => v >= 0 && v <= 255)).toBe(true);
    expect(labToHex({ l: 120, a: 0, b: 0 })).toBe("#ffffff");
    expect(labToHex({ l: -5, a: 0, b: 0 })).toBe("#000000");
  });

  it("accepts #rgb and #rrggbb in any case, and nothing else", () => {
    expect(isHex("#abc")).toBe(true);
    expect(isHex("#A1b2C3")).toBe(true);
    expect(isHex("abc")).toBe(false);
    expect(isHex("#abcd")).toBe(false);
    expect(isHex("#ggg")).toBe(false);
    expect(normalizeHex("#ABC")).toBe("#aabbcc");
    expect(normalizeHex(" #A1B2C3 ")).toBe("#a1b2c3");
    expect(() => normalizeHex("red")).toThrow(RangeError);
    expect(() => hexToLab("#12")).toThrow(RangeError);
  });

  it("gives LCh with the hue in degrees", () => {
    const lch = labToLch({ l: 50, a: 0, b: 10 });
    expect(lch.c).toBeCloseTo(10, 9);
    expect(lch.h).toBeCloseTo(90, 9);
    expect(labToLch({ l: 50, a: 0, b: -10 }).h).toBeCloseTo(270, 9);
    expect(labToLch({ l: 50, a: 0, b: 0 }).h).toBe(0);
  });

  it("names CSS Color 4 named colours with the plain word people use", () => {
    // Keyword → sRGB values from W3C CSS Color Module Level 4, §6.1 named colours.
    const cases: [string, string][] = [
      ["#ff0000", "red"],
      ["#b22222", "red"], // firebrick
      ["#ffa500", "orange"],
      ["#ffff00", "yellow"],
      ["#008000", "green"],
      ["#00ff00", "green"], // lime
      ["#008080", "teal"],
      ["#00ffff", "teal"], // cyan
      ["#0000ff", "blue"],
      ["#000080", "blue"], // navy
      ["#87ceeb", "blue"], // skyblue
      ["#800080", "purple"],
      ["#4b0082", "purple"], // indigo
      ["#9370db", "purple"], // mediumpurple (h ≈ 306°, the angle of sRGB blue itself)
      ["#663399", "purple"], // rebeccapurple
      ["#6a5acd", "purple"], // slateblue (a violet despite its name)
      ["#4169e1", "blue"], // royalblue
      ["#6495ed", "blue"], // cornflowerblue
      ["#191970", "blue"], // midnightblue
      ["#ffc0cb", "pink"],
      ["#ff69b4", "pink"], // hotpink
      ["#8b4513", "brown"], // saddlebrown
      ["#d2b48c", "beige"], // tan
      ["#808080", "grey"],
      ["#ffffff", "white"],
      ["#000000", "black"],
    ];
    for (const [hex, word] of cases) expect(`${hex} ${hueName(hexToLab(hex))}`).toBe(`${hex} ${word}`);
  });
});

describe("Bradford chromatic adaptation", () => {
  // Lindbloom, "Chromatic Adaptation" (brucelindbloom.com), tabulating Lam (1985); from memory.
  const D50 = [0.96422, 1, 0.82521];
  const D65 = [0.95047, 1, 1.08883];

  it("uses the published cone-response matrix and its published inverse", () => {
    expect(BRADFORD).toEqual([0.8951, 0.2664, -0.1614, -0.7502, 1.7135, 0.0367, 0.0389, -0.0685, 1.0296]);
    const inverse = [0.9869929, -0.1470543, 0.1599627, 0.4323053, 0.5183603, 0.0492912, -0.0085287, 0.0400428, 0.9684867];
    BRADFORD_INVERSE.forEach((v, i) => expect(Math.abs(v - inverse[i])).toBeLessThan(1e-6));
  });

  it("builds the published D50 → D65 and D65 → D50 adaptation matrices", () => {
    const d50to65 = [0.9555766, -0.0230393, 0.0631636, -0.0282895, 1.0099416, 0.0210077, 0.0122982, -0.020483, 1.3299098];
    const d65to50 = [1.0478112, 0.0228866, -0.050127, 0.0295424, 0.9904844, -0.0170491, -0.0092345, 0.0150436, 0.7521316];
    bradfordMatrix(D50, D65).forEach((v, i) => expect(Math.abs(v - d50to65[i])).toBeLessThan(2e-6));
    bradfordMatrix(D65, D50).forEach((v, i) => expect(Math.abs(v - d65to50[i])).toBeLessThan(2e-6));
  });

  it("agrees with culori's Bradford D50 → D65 (CSS Color 4 whites)", () => {
    const d50 = [0.3457 / 0.3585, 1, (1 - 0.3457 - 0.3585) / 0.3585];
    const toXyz65 = converter("xyz65");
    const m = bradfordMatrix(d50, D65_WHITE);
    const rand = seededRandom(5);
    for (let i = 0; i < 100; i++) {
      const v = [rand(), rand(), rand()];
      const ours = mulVec3(m, v);
      const ref = toXyz65({ mode: "xyz50", x: v[0], y: v[1], z: v[2] });
      expect(ours[0]).toBeCloseTo(ref.x, 6);
      expect(ours[1]).toBeCloseTo(ref.y, 6);
      expect(ours[2]).toBeCloseTo(ref.z, 6);
    }
  });

  it("corrects a photo so its paper white reads white, and leaves a photo of D65-white paper as it is", () => {
    // A photo of paper lit by D50 (sRGB of the D50 white point), corrected against that paper.
    const d50Lab = { l: 100, a: 0, b: 0 };
    const lit = mulVec3(bradfordMatrix(D65_WHITE, D50), D65_WHITE);
    const rgb = mulVec3(XYZ_TO_SRGB, lit).map((v) => Math.round(srgbEncode(Math.min(1, v)) * 255));
    const photo = { width: 2, height: 1, data: Buffer.from([...rgb, ...rgb]) };
    const paper = srgbToLab(rgb[0], rgb[1], rgb[2]);
    expect(Math.hypot(paper.a, paper.b)).toBeGreaterThan(5); // D50 paper looks warm as photographed
    const fixed = correctToPaperWhite(photo, paper);
    for (const v of fixed.data) expect(v).toBeGreaterThanOrEqual(254);
    const same = correctToPaperWhite({ width: 1, height: 1, data: Buffer.from([200, 120, 40]) }, d50Lab);
    expect([...same.data]).toEqual([200, 120, 40]);
  });

  it("turns a white lit by D50 into a neutral under D65", () => {
    const adapted = mulVec3(bradfordMatrix(D50, D65_WHITE), D50);
    const lab = [0, 0, 0];
    xyzToLabInto(adapted[0], adapted[1], adapted[2], lab, 0);
    expect(lab[0]).toBeCloseTo(100, 6);
    expect(Math.abs(lab[1])).toBeLessThan(1e-6);
    expect(Math.abs(lab[2])).toBeLessThan(1e-6);
  });
});
