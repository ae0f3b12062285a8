// Synthetic strip photos with known truth, for the demo seed, tests and the benchmark. Everything is seeded.
import sharp from "sharp";
import { labToLch, deltaE2000, type Lab } from "../../shared/colour/index";
import { D65_WHITE, SRGB_TO_XYZ, XYZ_TO_SRGB, invert3, labToXyz, mul3, mulVec3, srgbEncode } from "../analysis/srgb-lab";
import type { CatalogueInk } from "../analysis/types";
import { seededRandom } from "./seeded-random";

export { seededRandom } from "./seeded-random";

export function gaussian(rand: () => number): () => number {
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const s = spare;
      spare = null;
      return s;
    }
    let u = 0;
    while (u === 0) u = rand();
    const v = rand();
    const r = Math.sqrt(-2 * Math.log(u));
    spare = r * Math.sin(2 * Math.PI * v);
    return r * Math.cos(2 * Math.PI * v);
  };
}

/** Linear sRGB of a CIELAB (D65) colour, unclipped. */
export function labToLinear(lab: Lab): [number, number, number] {
  return mulVec3(XYZ_TO_SRGB, labToXyz(lab.l, lab.a, lab.b));
}

// ---------------------------------------------------------------------------------------------
// An invented ink catalogue (names and brands are made up for Blendwell's tests).

const BRANDS = ["Wrenmoor Inks", "Pellowick", "Oddacre Studio", "Mistle & Vane"];
const FIRST = ["Quiet", "Dusk", "Copper", "Meadow", "Harbour", "Ember", "Moss", "Tidal", "Velvet", "Thistle", "Saffron", "Frost", "Bramble", "Cinder", "Lagoon", "Plum", "Sorrel", "Kelp", "Amber", "Slate"];
const SECOND = ["Lantern", "Feather", "Orchard", "Ribbon", "Pebble", "Hollow", "Kettle", "Sparrow", "Willow", "Thread"];

export function syntheticCatalogue(count = 100, seed = 20240601): CatalogueInk[] {
  const rand = seededRandom(seed);
  const inks: CatalogueInk[] = [];
  const used = new Set<string>();
  while (inks.length < count) {
    const l = 28 + rand() * 60;
    const c = 8 + rand() * 67;
    const h = rand() * 360;
    const lab = { l, a: c * Math.cos((h * Math.PI) / 180), b: c * Math.sin((h * Math.PI) / 180) };
    const lin = labToLinear(lab);
    if (lin.some((v) => v < 0.002 || v > 0.98)) continue; // keep inside the sRGB gamut
    let name = `${FIRST[Math.floor(rand() * FIRST.length)]} ${SECOND[Math.floor(rand() * SECOND.length)]}`;
    for (let k = 2; used.has(name); k++) name = `${name.replace(/ \d+$/, "")} ${k}`;
    used.add(name);
    const hex = "#" + lin.map((v) => Math.round(srgbEncode(v) * 255).toString(16).padStart(2, "0")).join("");
    const id = inks.length + 1;
    inks.push({ id, name, brand: BRANDS[id % BRANDS.length], lab, hex });
  }
  return inks;
}

// ---------------------------------------------------------------------------------------------
// Light: a cast is a whole-scene chromatic adaptation from D65 to another illuminant, simulated
// with CAT02 (CIE 159:2004, CIECAM02) — a different published transform from the Bradford one
// the analysis corrects with, so the test is not the inverse of the code under test.

/** CAT02 matrix, CIE 159:2004 (from memory). */
const CAT02 = [0.7328, 0.4296, -0.1624, -0.7036, 1.6975, 0.0061, 0.003, 0.0136, 0.9834];

/** CIE 1931 2° chromaticities of CIE illuminants (CIE 15:2004, from memory). */
export const ILLUMINANTS: Record<string, [number, number]> = {
  A: [0.44757, 0.40745], // incandescent, ~2856 K
  F2: [0.37208, 0.37529], // cool white fluorescent
  D50: [0.34567, 0.3585],
  D65: [0.31271, 0.32902],
  D75: [0.29902, 0.31485],
};

function xyToXyz([x, y]: [number, number]): number[] {
  return [x / y, 1, (1 - x - y) / y];
}

/** Linear-sRGB → linear-sRGB matrix of a D65 scene seen under `illuminant` (full adaptation). */
export function castMatrix(illuminant: keyof typeof ILLUMINANTS | [number, number]): number[] {
  const xy = typeof illuminant === "string" ? ILLUMINANTS[illuminant] : illuminant;
  const s = mulVec3(CAT02, D65_WHITE as unknown as number[]);
  const d = mulVec3(CAT02, xyToXyz(xy));
  const diag = [d[0] / s[0], 0, 0, 0, d[1] / s[1], 0, 0, 0, d[2] / s[2]];
  const cat = mul3(invert3(CAT02), mul3(diag, CAT02));
  return mul3(XYZ_TO_SRGB, mul3(cat, SRGB_TO_XYZ));
}

// ---------------------------------------------------------------------------------------------
// Scene rendering.

export type TruthBand = { start: number; end: number; lab: Lab; inkId?: number };

export type SceneSpec = {
  width: number;
  height: number;
  orientation: "horizontal" | "vertical";
  tiltDeg: number;
  /** Strip length as a share of the image's extent along the strip's axis. */
  lengthShare: number;
  /** Strip thickness as a share of its length. */
  thicknessShare: number;
  /** Centre offset as fractions of width/height. */
  offset?: [number, number];
  bands: TruthBand[];
  /** Soft blends (smoothstep, mixed in log reflectance) or hard edges between bands. */
  blend: "soft" | "hard";
  illuminant: keyof typeof ILLUMINANTS | [number, number];
  /** Paper brightness as photographed, 0–1 of full scale for the brightest channel. */
  exposure: number;
  /** Brightness loss at the image corners, 0–1 (1 − k·r²). */
  vignette: number;
  /** Sensor noise, standard deviation in 8-bit steps. */
  noise: number;
  seed: number;
  /** Paper colour (linear reflectance); default a perfect white. */
  paper?: [number, number, number];
  /** Optional specks of dark dust and a glare spot on the strip. */
  specks?: number;
  glare?: boolean;
};

export type Scene = { width: number; height: number; data: Buffer };

/** Colour along the strip, t in [0, 1], as linear reflectance. */
function stripColourAt(t: number, bands: TruthBand[], blend: "soft" | "hard"): [number, number, number] {
  const lin = bands.map((b) => labToLinear(b.lab).map((v) => Math.max(1e-4, v)) as [number, number, number]);
  for (let k = 0; k < bands.length; k++) {
    if (t <= bands[k].end || k === bands.length - 1) {
      if (t >= bands[k].start || k === 0) return lin[k];
      const a = bands[k - 1].end;
      const b = bands[k].start;
      let s = (t - a) / Math.max(1e-9, b - a);
      s = Math.min(1, Math.max(0, s));
      if (blend === "soft") s = s * s * (3 - 2 * s);
      else s = s < 0.5 ? 0 : 1;
      return [0, 1, 2].map((c) => Math.exp((1 - s) * Math.log(lin[k - 1][c]) + s * Math.log(lin[k][c]))) as [number, number, number];
    }
  }
  return lin[lin.length - 1];
}

export function renderScene(spec: SceneSpec): Scene {
  const { width: w, height: h } = spec;
  const rand = seededRandom(spec.seed);
  const gauss = gaussian(rand);
  // A table of normal deviates, drawn per pixel by index: much faster than Box–Muller per pixel.
  const NORMALS = 1 << 16;
  const normals = new Float64Array(NORMALS);
  for (let i = 0; i < NORMALS; i++) normals[i] = gauss();
  const t = (spec.tiltDeg * Math.PI) / 180;
  const along = spec.orientation === "horizontal" ? [Math.cos(t), Math.sin(t)] : [-Math.sin(t), Math.cos(t)];
  const across = [-along[1], along[0]];
  const axisExtent = spec.orientation === "horizontal" ? w : h;
  const len = spec.lengthShare * axisExtent;
  const thick = spec.thicknessShare * len;
  const cx = w / 2 + (spec.offset?.[0] ?? 0) * w;
  const cy = h / 2 + (spec.offset?.[1] ?? 0) * h;

  const LUT = 2048;
  const lut = new Float64Array(LUT * 3);
  for (let i = 0; i < LUT; i++) {
    const c = stripColourAt((i + 0.5) / LUT, spec.bands, spec.blend);
    lut.set(c, i * 3);
  }
  const m = castMatrix(spec.illuminant);
  const paper = spec.paper ?? [1, 1, 1];
  const paperCam = mulVec3(m, paper);
  const expo = spec.exposure / Math.max(...paperCam);
  const enc = new Float64Array(4097);
  for (let i = 0; i <= 4096; i++) enc[i] = srgbEncode(i / 4096) * 255;

  // Specks (dust) and glare in strip coordinates.
  const specks: { u: number; v: number; r: number }[] = [];
  for (let i = 0; i < (spec.specks ?? 0); i++) specks.push({ u: (rand() - 0.5) * len, v: (rand() - 0.5) * thick * 0.8, r: 1 + rand() * 2.5 });
  const glare = spec.glare ? { u: (rand() - 0.5) * len * 0.6, v: 0, r: thick * 0.12 } : null;

  const data = Buffer.alloc(w * h * 3);
  const noise = spec.noise;
  const put = (c: number) => {
    const e = enc[c <= 0 ? 0 : c >= 1 ? 4096 : Math.round(c * 4096)] + noise * normals[(rand() * NORMALS) | 0];
    return e <= 0 ? 0 : e >= 255 ? 255 : Math.round(e);
  };
  const halfDiag2 = (w * w + h * h) / 4;
  const half = len / 2;
  const halfT = thick / 2;
  for (let y = 0; y < h; y++) {
    for (let x = 0; x < w; x++) {
      const dx = x + 0.5 - cx;
      const dy = y + 0.5 - cy;
      const u = dx * along[0] + dy * along[1];
      const v = dx * across[0] + dy * across[1];
      const cu = Math.min(1, Math.max(0, half + 0.5 - Math.abs(u)));
      const cv = Math.min(1, Math.max(0, halfT + 0.5 - Math.abs(v)));
      const cov = cu * cv;
      let r = paper[0];
      let g = paper[1];
      let b = paper[2];
      if (cov > 0) {
        const li = Math.min(LUT - 1, Math.max(0, Math.floor(((u + half) / len) * LUT))) * 3;
        r = r * (1 - cov) + lut[li] * cov;
        g = g * (1 - cov) + lut[li + 1] * cov;
        b = b * (1 - cov) + lut[li + 2] * cov;
        for (const s of specks) {
          if ((u - s.u) ** 2 + (v - s.v) ** 2 <= s.r * s.r) {
            r *= 0.08;
            g *= 0.08;
            b *= 0.08;
          }
        }
      }
      const vig = 1 - spec.vignette * ((dx * dx + dy * dy) / halfDiag2);
      const k = expo * vig;
      let cr = (m[0] * r + m[1] * g + m[2] * b) * k;
      let cg = (m[3] * r + m[4] * g + m[5] * b) * k;
      let cb = (m[6] * r + m[7] * g + m[8] * b) * k;
      if (glare && (u - glare.u) ** 2 + (v - glare.v) ** 2 <= glare.r * glare.r) {
        cr = cg = cb = 1.2; // blown out: every channel clips
      }
      const o = (y * w + x) * 3;
      data[o] = put(cr);
      data[o + 1] = put(cg);
      data[o + 2] = put(cb);
    }
  }
  return { width: w, height: h, data };
}

/** JPEG of an upright scene. With `orientation` 6 or 8 the pixels are stored turned and the EXIF tag turns them back. */
export async function sceneToJpeg(scene: Scene, quality: number, orientation?: 1 | 3 | 6 | 8): Promise<Buffer> {
  let p = sharp(scene.data, { raw: { width: scene.width, height: scene.height, channels: 3 } });
  if (orientation && orientation !== 1) {
    // Stored pixels = upright turned the opposite way of what the tag says to apply.
    const undo = { 3: 180, 6: 270, 8: 90 }[orientation];
    const turned = await p.rotate(undo).raw().toBuffer({ resolveWithObject: true });
    p = sharp(turned.data, { raw: { width: turned.info.width, height: turned.info.height, channels: 3 } });
    return p.jpeg({ quality }).withMetadata({ orientation }).toBuffer();
  }
  return p.jpeg({ quality }).toBuffer();
}

// ---------------------------------------------------------------------------------------------
// Random strip cases.

export type StripCase = { spec: SceneSpec; quality: number; exifOrientation?: 6 | 8; truth: TruthBand[] };

/** True if the ink, lit by the cast, stays inside what an 8-bit sRGB camera file can hold. */
export function survivesCast(lab: Lab, cast: number[]): boolean {
  const cam = mulVec3(cast, labToLinear(lab));
  return cam.every((v) => v > 0.0005);
}

function pickInks(rand: () => number, catalogue: CatalogueInk[], k: number, cast: number[]): CatalogueInk[] {
  const white = { l: 100, a: 0, b: 0 };
  for (let attempt = 0; attempt < 500; attempt++) {
    const chosen: CatalogueInk[] = [];
    let tries = 0;
    while (chosen.length < k && tries++ < 200) {
      const ink = catalogue[Math.floor(rand() * catalogue.length)];
      const lch = labToLch(ink.lab);
      const ab = Math.hypot(100 - ink.lab.l, lch.c);
      if (ab < 20) continue; // too pale to be a separate ink on white in a test of band counting
      if (chosen.includes(ink)) continue;
      if (!survivesCast(ink.lab, cast)) continue; // a clipped channel cannot be recovered by anyone
      if (chosen.length && deltaE2000(chosen[chosen.length - 1].lab, ink.lab) < 15) continue;
      if (deltaE2000(white, ink.lab) < 15) continue;
      chosen.push(ink);
    }
    if (chosen.length === k) return chosen;
  }
  throw new Error("could not pick inks");
}

/** Band layout: k bands with soft blends 3–8% of the length wide (or hard edges) between them. */
function layout(rand: () => number, k: number, soft: boolean): { start: number; end: number }[] {
  const blends = Array.from({ length: k - 1 }, () => (soft ? 0.03 + rand() * 0.05 : 0.004));
  const free = 1 - blends.reduce((s, b) => s + b, 0);
  const weights = Array.from({ length: k }, () => 0.7 + rand() * 0.6);
  const total = weights.reduce((s, x) => s + x, 0);
  const out: { start: number; end: number }[] = [];
  let pos = 0;
  for (let i = 0; i < k; i++) {
    const len = (weights[i] / total) * free;
    out.push({ start: pos, end: pos + len });
    pos += len + (blends[i] ?? 0);
  }
  out[k - 1].end = 1;
  return out;
}

export function randomStripCase(seed: number, catalogue: CatalogueInk[]): StripCase {
  const rand = seededRandom(seed);
  const k = 2 + Math.floor(rand() * 4); // 2–5 inks
  const illuminants: (keyof typeof ILLUMINANTS)[] = ["A", "F2", "D50", "D65", "D75"];
  const illuminant = illuminants[Math.floor(rand() * illuminants.length)];
  const inks = pickInks(rand, catalogue, k, castMatrix(illuminant));
  const lay = layout(rand, k, rand() < 0.85);
  const truth = lay.map((b, i) => ({ ...b, lab: inks[i].lab, inkId: inks[i].id }));
  const vertical = rand() < 0.4;
  const spec: SceneSpec = {
    width: vertical ? 900 : 1200,
    height: vertical ? 1200 : 900,
    orientation: vertical ? "vertical" : "horizontal",
    tiltDeg: (rand() * 2 - 1) * 15,
    lengthShare: 0.62 + rand() * 0.18,
    thicknessShare: 0.12 + rand() * 0.1,
    offset: [(rand() - 0.5) * 0.06, (rand() - 0.5) * 0.06],
    bands: truth,
    blend: "soft",
    illuminant,
    exposure: 0.82 + rand() * 0.12,
    vignette: rand() * 0.3,
    noise: 1 + rand() * 2,
    seed: seed * 7919,
    specks: Math.floor(rand() * 6),
  };
  spec.blend = lay.length > 1 && lay[1].start - lay[0].end < 0.01 ? "hard" : "soft";
  const quality = 70 + Math.floor(rand() * 26);
  const exifOrientation = rand() < 0.15 ? (rand() < 0.5 ? 6 : 8) : undefined;
  return { spec, quality, exifOrientation, truth };
}

