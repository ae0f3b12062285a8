// Finds the unblended white cardstock around the strip and builds the correction that maps it to
// the D65 white: a smooth brightness field (vignetting, uneven light) and a Bradford adaptation.
import { bradfordMatrix } from "./bradford";
import { D65_WHITE, SRGB8_TO_LINEAR, SRGB_TO_XYZ, mul3, mulVec3, srgbEncode } from "./srgb-lab";
import type { RgbImage, WhitePoint } from "./types";

/** Brightness of the paper across the image: Y(x, y) on normalised coordinates, up to quadratic. */
export type PaperField = { coefficients: number[] };

export type PaperEstimate = {
  found: boolean;
  /** Median linear-sRGB colour of the paper pixels as photographed (not normalised). */
  measuredLinear: [number, number, number];
  /** Brightness field of the paper (luminance Y, linear); constant 1 when nothing was found. */
  field: PaperField;
  /** Linear sRGB → XYZ(D65) after adaptation, for a pixel already divided by the field. */
  correction: number[];
  /** How many sample points were taken as paper (for diagnostics). */
  paperSamples: number;
};

// Sampling and acceptance thresholds. They are our own, chosen on synthetic photos (see
// docs/decisions/003-paper-white-and-adaptation.md), not from a standard.
const TARGET_SAMPLES = 60_000;
const BRIGHT_FRACTION = 0.45; // paper may sit in a vignette corner at ~half the peak brightness
const CHROMA_BIN = 0.004; // linear-rgb chromaticity histogram bin
const CHROMA_TOLERANCE = 0.014; // how far from the modal chromaticity a paper pixel may be
const FIELD_BAND = [0.9, 1.08] as const; // a paper sample lies within this ratio of the fitted field
const MIN_BORDER_PAPER = 0.3; // share of the image border that must be paper …
const MIN_TOTAL_PAPER = 0.25; // … or share of the whole image

const Y_ROW = [SRGB_TO_XYZ[3], SRGB_TO_XYZ[4], SRGB_TO_XYZ[5]];

type Sample = { x: number; y: number; r: number; g: number; b: number; lum: number; border: boolean; clipped: boolean };

function takeSamples(img: RgbImage): Sample[] {
  const { width: w, height: h, data } = img;
  const step = Math.max(1, Math.floor(Math.sqrt((w * h) / TARGET_SAMPLES)));
  const bw = 0.08 * w;
  const bh = 0.08 * h;
  const out: Sample[] = [];
  for (let y = Math.floor(step / 2); y < h; y += step) {
    for (let x = Math.floor(step / 2); x < w; x += step) {
      const i = (y * w + x) * 3;
      const r8 = data[i];
      const g8 = data[i + 1];
      const b8 = data[i + 2];
      const r = SRGB8_TO_LINEAR[r8];
      const g = SRGB8_TO_LINEAR[g8];
      const b = SRGB8_TO_LINEAR[b8];
      out.push({
        x: x / w - 0.5,
        y: y / h - 0.5,
        r,
        g,
        b,
        lum: Y_ROW[0] * r + Y_ROW[1] * g + Y_ROW[2] * b,
        border: x < bw || x >= w - bw || y < bh || y >= h - bh,
        clipped: r8 >= 254 || g8 >= 254 || b8 >= 254,
      });
    }
  }
  return out;
}

function quantile(values: number[], q: number): number {
  if (values.length === 0) return NaN;
  const s = Float64Array.from(values).sort();
  const pos = Math.min(s.length - 1, Math.max(0, q * (s.length - 1)));
  const lo = Math.floor(pos);
  const hi = Math.ceil(pos);
  return s[lo] + (s[hi] - s[lo]) * (pos - lo);
}

function chromaticity(s: { r: number; g: number; b: number }): [number, number] {
  const sum = s.r + s.g + s.b;
  return sum > 1e-6 ? [s.r / sum, s.g / sum] : [1 / 3, 1 / 3];
}

/** The most common chromaticity among bright samples (the paper is the largest bright area). */
function modalChromaticity(bright: Sample[]): [number, number] {
  const n = Math.round(1 / CHROMA_BIN);
  const hist = new Float64Array(n * n);
  for (const s of bright) {
    const [cr, cg] = chromaticity(s);
    const i = Math.min(n - 1, Math.max(0, Math.floor(cr / CHROMA_BIN)));
    const j = Math.min(n - 1, Math.max(0, Math.floor(cg / CHROMA_BIN)));
    hist[i * n + j] += 1;
  }
  let best = -1;
  let bi = 0;
  let bj = 0;
  for (let i = 1; i < n - 1; i++) {
    for (let j = 1; j < n - 1; j++) {
      let v = 0;
      for (let di = -1; di <= 1; di++) for (let dj = -1; dj <= 1; dj++) v += hist[(i + di) * n + j + dj];
      if (v > best) {
        best = v;
        bi = i;
        bj = j;
      }
    }
  }
  // Refine to the mean chromaticity of samples in the winning 3×3 neighbourhood.
  let sr = 0;
  let sg = 0;
  let cnt = 0;
  for (const s of bright) {
    const [cr, cg] = chromaticity(s);
    if (Math.abs(cr - (bi + 0.5) * CHROMA_BIN) <= 1.5 * CHROMA_BIN && Math.abs(cg - (bj + 0.5) * CHROMA_BIN) <= 1.5 * CHROMA_BIN) {
      sr += cr;
      sg += cg;
      cnt++;
    }
  }
  return cnt > 0 ? [sr / cnt, sg / cnt] : [(bi + 0.5) * CHROMA_BIN, (bj + 0.5) * CHROMA_BIN];
}

function basis(x: number, y: number, order: 0 | 1 | 2): number[] {
  if (order === 0) return [1];
  if (order === 1) return [1, x, y];
  return [1, x, y, x * x, x * y, y * y];
}

/** Least squares via normal equations with partial pivoting; tiny systems only. */
function solveLeastSquares(rows: number[][], targets: number[]): number[] | null {
  const k = rows[0].length;
  const a = Array.from({ length: k }, () => new Array<number>(k + 1).fill(0));
  for (let r = 0; r < rows.length; r++) {
    const row = rows[r];
    for (let i = 0; i < k; i++) {
      for (let j = 0; j < k; j++) a[i][j] += row[i] * row[j];
      a[i][k] += row[i] * targets[r];
    }
  }
  for (let c = 0; c < k; c++) {
    let p = c;
    for (let r = c + 1; r < k; r++) if (Math.abs(a[r][c]) > Math.abs(a[p][c])) p = r;
    if (Math.abs(a[p][c]) < 1e-12) return null;
    [a[c], a[p]] = [a[p], a[c]];
    for (let r = 0; r < k; r++) {
      if (r === c) continue;
      const f = a[r][c] / a[c][c];
      for (let j = c; j <= k; j++) a[r][j] -= f * a[c][j];
    }
  }
  return a.map((row, i) => row[k] / row[i]);
}

export function evaluateField(field: PaperField, x: number, y: number): number {
  const c = field.coefficients;
  if (c.length === 1) return c[0];
  if (c.length === 3) return c[0] + c[1] * x + c[2] * y;
  return c[0] + c[1] * x + c[2] * y + c[3] * x * x + c[4] * x * y + c[5] * y * y;
}

/** Fits the paper brightness field, rejecting shadows, glare and pale inks as outliers. */
function fitField(paper: Sample[]): { field: PaperField; kept: Sample[] } {
  let kept = paper;
  const xs = paper.map((s) => s.x);
  const ys = paper.map((s) => s.y);
  const spanX = quantile(xs, 0.98) - quantile(xs, 0.02);
  const spanY = quantile(ys, 0.98) - quantile(ys, 0.02);
  const order: 0 | 1 | 2 = paper.length >= 400 && spanX > 0.6 && spanY > 0.6 ? 2 : paper.length >= 100 && (spanX > 0.4 || spanY > 0.4) ? 1 : 0;
  let field: PaperField = { coefficients: [quantile(paper.map((s) => s.lum), 0.5)] };
  for (let iter = 0; iter < 4; iter++) {
    const coef = order === 0 ? null : solveLeastSquares(kept.map((s) => basis(s.x, s.y, order)), kept.map((s) => s.lum));
    field = coef ? { coefficients: coef } : { coefficients: [quantile(kept.map((s) => s.lum), 0.5)] };
    const next = paper.filter((s) => {
      const f = evaluateField(field, s.x, s.y);
      const ratio = f > 0 ? s.lum / f : 0;
      return ratio >= FIELD_BAND[0] && ratio <= FIELD_BAND[1];
    });
    if (next.length < Math.max(20, kept.length * 0.5)) break;
    kept = next;
  }
  return { field, kept };
}

function medianRgb(samples: { r: number; g: number; b: number }[]): [number, number, number] {
  return [quantile(samples.map((s) => s.r), 0.5), quantile(samples.map((s) => s.g), 0.5), quantile(samples.map((s) => s.b), 0.5)];
}

function correctionFor(whiteLinear: [number, number, number]): number[] {
  const whiteXyz = mulVec3(SRGB_TO_XYZ, whiteLinear);
  return mul3(bradfordMatrix(whiteXyz, D65_WHITE), SRGB_TO_XYZ);
}

/** No correction: the photo is taken as already balanced, sRGB white = paper white. */
export function noPaper(): PaperEstimate {
  return { found: false, measuredLinear: [1, 1, 1], field: { coefficients: [1] }, correction: [...SRGB_TO_XYZ], paperSamples: 0 };
}

/** Median linear colour in a small disc around a point given as fractions of the image. */
function sampleAt(img: RgbImage, at: WhitePoint): [number, number, number] {
  const { width: w, height: h, data } = img;
  const cx = Math.min(w - 1, Math.max(0, Math.round(at.x * (w - 1))));
  const cy = Math.min(h - 1, Math.max(0, Math.round(at.y * (h - 1))));
  const radius = Math.max(2, Math.round(0.012 * Math.max(w, h)));
  const pts: { r: number; g: number; b: number }[] = [];
  for (let y = Math.max(0, cy - radius); y <= Math.min(h - 1, cy + radius); y++) {
    for (let x = Math.max(0, cx - radius); x <= Math.min(w - 1, cx + radius); x++) {
      if ((x - cx) ** 2 + (y - cy) ** 2 > radius * radius) continue;
      const i = (y * w + x) * 3;
      pts.push({ r: SRGB8_TO_LINEAR[data[i]], g: SRGB8_TO_LINEAR[data[i + 1]], b: SRGB8_TO_LINEAR[data[i + 2]] });
    }
  }
  return medianRgb(pts);
}

/**
 * Estimates the paper white. Without `white`, the paper is the modal chromaticity among bright
 * samples, accepted only if it covers enough of the image border (paper surrounds a strip) or of
 * the image. With `white`, that point's colour is the paper, and pixels like it refine the field.
 */
export function findPaperWhite(img: RgbImage, white?: WhitePoint): PaperEstimate {
  const samples = takeSamples(img);
  if (samples.length === 0) return noPaper();
  const peak = quantile(samples.map((s) => s.lum), 0.98);
  if (!(peak > 0.02)) return noPaper();

  let target: [number, number];
  let pointColour: [number, number, number] | null = null;
  if (white) {
    pointColour = sampleAt(img, white);
    target = chromaticity({ r: pointColour[0], g: pointColour[1], b: pointColour[2] });
  } else {
    let bright = samples.filter((s) => s.lum >= BRIGHT_FRACTION * peak && !s.clipped);
    // An over-exposed sheet of paper is all clipped: then clipped samples are the paper.
    if (bright.length < 0.05 * samples.length) bright = samples.filter((s) => s.lum >= BRIGHT_FRACTION * peak);
    if (bright.length < 50) return noPaper();
    target = modalChromaticity(bright);
  }

  const refLum = pointColour ? Y_ROW[0] * pointColour[0] + Y_ROW[1] * pointColour[1] + Y_ROW[2] * pointColour[2] : peak;
  const candidates = samples.filter((s) => {
    if (s.lum < BRIGHT_FRACTION * refLum) return false;
    const [cr, cg] = chromaticity(s);
    return Math.hypot(cr - target[0], cg - target[1]) <= CHROMA_TOLERANCE;
  });

  if (!white) {
    const borderTotal = samples.filter((s) => s.border).length;
    const borderPaper = candidates.filter((s) => s.border).length;
    const enough = (borderTotal > 0 && borderPaper / borderTotal >= MIN_BORDER_PAPER) || candidates.length / samples.length >= MIN_TOTAL_PAPER;
    if (!enough) return noPaper();
  }

  let field: PaperField;
  let kept: Sample[];
  if (candidates.length >= 20) {
    ({ field, kept } = fitField(candidates));
  } else if (pointColour) {
    const lum = Y_ROW[0] * pointColour[0] + Y_ROW[1] * pointColour[1] + Y_ROW[2] * pointColour[2];
    field = { coefficients: [lum] };
    kept = [];
  } else {
    return noPaper();
  }
  if (pointColour && white) {
    // Anchor the field to the chosen point so the member's white becomes exactly white there.
    const lum = Y_ROW[0] * pointColour[0] + Y_ROW[1] * pointColour[1] + Y_ROW[2] * pointColour[2];
    const f = evaluateField(field, white.x - 0.5, white.y - 0.5);
    if (f > 1e-6 && lum > 1e-6) field = { coefficients: field.coefficients.map((c) => (c * lum) / f) };
  }

  // Paper colour normalised to Y = 1 by the field, so only its chromaticity drives the adaptation.
  const normalised = kept.length > 0
    ? medianRgb(kept.map((s) => {
        const f = Math.max(1e-6, evaluateField(field, s.x, s.y));
        return { r: s.r / f, g: s.g / f, b: s.b / f };
      }))
    : (() => {
        const c = pointColour!;
        const lum = Y_ROW[0] * c[0] + Y_ROW[1] * c[1] + Y_ROW[2] * c[2];
        return [c[0] / lum, c[1] / lum, c[2] / lum] as [number, number, number];
      })();
  const measured = pointColour ?? medianRgb(kept);
  return { found: true, measuredLinear: measured, field, correction: correctionFor(normalised), paperSamples: kept.length };
}

/** The photographed paper colour as 8-bit sRGB. */
export function paperSrgb8(p: PaperEstimate): [number, number, number] {
  return p.measuredLinear.map((v) => Math.max(0, Math.min(255, Math.round(srgbEncode(Math.max(0, v)) * 255)))) as [number, number, number];
}
