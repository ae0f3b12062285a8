// Finds the unblended white cardstock around the strip and builds the correction that maps it to
// the D65 white: a smooth brightness field (vignetting, uneven light) and a Bradford adaptation.
import { BRADFORD, bradfordMatrix } from "./bradford";
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
const TARGET_SAMPLES = 25_000;
const BRIGHT_FRACTION = 0.45; // paper may sit in a vignette corner at ~half the peak brightness
const CHROMA_BIN = 0.004; // linear-rgb chromaticity histogram bin
const CHROMA_TOLERANCE = 0.014; // how far from the modal chromaticity a paper pixel may be
const FIELD_BAND = [0.9, 1.08] as const; // a paper sample lies within this ratio of the fitted field
const MIN_BORDER_PAPER = 0.3; // share of the image border that must be paper …
const MIN_TOTAL_PAPER = 0.25; // … or share of the whole image
// Largest spread of Bradford cone gains (max/min) a detected paper may need. CIE illuminant A
// (incandescent) needs about 4.05; a saturated yellow ink would need 6 or more.
export const MAX_CONE_GAIN_RATIO = 5;

const Y_ROW = [SRGB_TO_XYZ[3], SRGB_TO_XYZ[4], SRGB_TO_XYZ[5]];

/** Sample points on a regular grid, as parallel typed arrays. */
type Samples = {
  n: number;
  x: Float64Array; // normalised position, -0.5…0.5
  y: Float64Array;
  r: Float64Array; // linear sRGB
  g: Float64Array;
  b: Float64Array;
  lum: Float64Array;
  cr: Float64Array; // chromaticity r/(r+g+b), g/(r+g+b)
  cg: Float64Array;
  border: Uint8Array;
  clipped: Uint8Array;
};

function takeSamples(img: RgbImage): Samples {
  const { width: w, height: h, data } = img;
  const step = Math.max(1, Math.floor(Math.sqrt((w * h) / TARGET_SAMPLES)));
  const cols = Math.ceil((w - Math.floor(step / 2)) / step);
  const rows = Math.ceil((h - Math.floor(step / 2)) / step);
  const cap = Math.max(0, cols * rows);
  const s: Samples = {
    n: 0,
    x: new Float64Array(cap),
    y: new Float64Array(cap),
    r: new Float64Array(cap),
    g: new Float64Array(cap),
    b: new Float64Array(cap),
    lum: new Float64Array(cap),
    cr: new Float64Array(cap),
    cg: new Float64Array(cap),
    border: new Uint8Array(cap),
    clipped: new Uint8Array(cap),
  };
  const bw = 0.08 * w;
  const bh = 0.08 * h;
  let k = 0;
  for (let y = Math.floor(step / 2); y < h; y += step) {
    for (let x = Math.floor(step / 2); x < w; x += step) {
      const i = (y * w + x) * 3;
      const r8 = data[i];
      const g8 = data[i + 1];
      const b8 = data[i + 2];
      const r = SRGB8_TO_LINEAR[r8];
      const g = SRGB8_TO_LINEAR[g8];
      const b = SRGB8_TO_LINEAR[b8];
      const sum = r + g + b;
      s.x[k] = x / w - 0.5;
      s.y[k] = y / h - 0.5;
      s.r[k] = r;
      s.g[k] = g;
      s.b[k] = b;
      s.lum[k] = Y_ROW[0] * r + Y_ROW[1] * g + Y_ROW[2] * b;
      s.cr[k] = sum > 1e-6 ? r / sum : 1 / 3;
      s.cg[k] = sum > 1e-6 ? g / sum : 1 / 3;
      s.border[k] = x < bw || x >= w - bw || y < bh || y >= h - bh ? 1 : 0;
      s.clipped[k] = r8 >= 254 || g8 >= 254 || b8 >= 254 ? 1 : 0;
      k++;
    }
  }
  s.n = k;
  return s;
}

/** k-th smallest value (0-based) of v, reordering v in place (Hoare's quickselect). */
function selectKth(v: Float64Array, k: number): number {
  let lo = 0;
  let hi = v.length - 1;
  while (hi > lo) {
    const pivot = v[(lo + hi) >> 1];
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (v[i] < pivot) i++;
      while (v[j] > pivot) j--;
      if (i <= j) {
        const t = v[i];
        v[i] = v[j];
        v[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return v[k];
  }
  return v[k];
}

/** Quantile (nearest rank) of arr[idx[...]], or of all of arr. */
function quantileOf(arr: Float64Array, q: number, idx?: Int32Array): number {
  const n = idx ? idx.length : arr.length;
  if (n === 0) return NaN;
  const v = new Float64Array(n);
  for (let i = 0; i < n; i++) v[i] = idx ? arr[idx[i]] : arr[i];
  return selectKth(v, Math.min(n - 1, Math.max(0, Math.round(q * (n - 1)))));
}

function select(n: number, keep: (i: number) => boolean): Int32Array {
  const out = new Int32Array(n);
  let k = 0;
  for (let i = 0; i < n; i++) if (keep(i)) out[k++] = i;
  return out.slice(0, k);
}

/** The most common chromaticity among bright samples (the paper is the largest bright area). */
function modalChromaticity(s: Samples, bright: Int32Array): [number, number] {
  const n = Math.round(1 / CHROMA_BIN);
  const hist = new Float64Array(n * n);
  for (const k of bright) {
    const i = Math.min(n - 1, Math.max(0, Math.floor(s.cr[k] / CHROMA_BIN)));
    const j = Math.min(n - 1, Math.max(0, Math.floor(s.cg[k] / CHROMA_BIN)));
    hist[i * n + j] += 1;
  }
  // 3×3 neighbourhood counts as two 3-wide sums (counts are whole numbers, so the order of the
  // additions cannot change them).
  const rows = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 1; j < n - 1; j++) rows[i * n + j] = hist[i * n + j - 1]! + hist[i * n + j]! + hist[i * n + j + 1]!;
  let best = -1;
  let bi = 0;
  let bj = 0;
  for (let i = 1; i < n - 1; i++) {
    for (let j = 1; j < n - 1; j++) {
      const v = rows[(i - 1) * n + j]! + rows[i * n + j]! + rows[(i + 1) * n + j]!;
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
  for (const k of bright) {
    if (Math.abs(s.cr[k] - (bi + 0.5) * CHROMA_BIN) <= 1.5 * CHROMA_BIN && Math.abs(s.cg[k] - (bj + 0.5) * CHROMA_BIN) <= 1.5 * CHROMA_BIN) {
      sr += s.cr[k];
      sg += s.cg[k];
      cnt++;
    }
  }
  return cnt > 0 ? [sr / cnt, sg / cnt] : [(bi + 0.5) * CHROMA_BIN, (bj + 0.5) * CHROMA_BIN];
}

/** Weighted least squares of lum on the basis, via normal equations with partial pivoting. */
function fitCoefficients(s: Samples, idx: Int32Array, order: 1 | 2): number[] | null {
  const k = order === 1 ? 3 : 6;
  // The normal equations' sums for the full quadratic basis (1, x, y, x², xy, y²), in scalars:
  // the linear fit uses the first three rows and columns of the same sums.
  let s01 = 0, s02 = 0, s03 = 0, s04 = 0, s05 = 0;
  let s11 = 0, s12 = 0, s13 = 0, s14 = 0, s15 = 0;
  let s22 = 0, s23 = 0, s24 = 0, s25 = 0;
  let s33 = 0, s34 = 0, s35 = 0, s44 = 0, s45 = 0, s55 = 0;
  let t0 = 0, t1 = 0, t2 = 0, t3 = 0, t4 = 0, t5 = 0;
  const n = idx.length;
  const { x: xs, y: ys, lum } = s;
  for (let q = 0; q < n; q++) {
    const p = idx[q]!;
    const x = xs[p]!;
    const y = ys[p]!;
    const xx = x * x;
    const xy = x * y;
    const yy = y * y;
    const t = lum[p]!;
    s01 += x; s02 += y; s03 += xx; s04 += xy; s05 += yy;
    s11 += x * x; s12 += x * y; s13 += x * xx; s14 += x * xy; s15 += x * yy;
    s22 += y * y; s23 += y * xx; s24 += y * xy; s25 += y * yy;
    s33 += xx * xx; s34 += xx * xy; s35 += xx * yy;
    s44 += xy * xy; s45 += xy * yy; s55 += yy * yy;
    t0 += t; t1 += x * t; t2 += y * t; t3 += xx * t; t4 += xy * t; t5 += yy * t;
  }
  const full = [
    [n, s01, s02, s03, s04, s05, t0],
    [s01, s11, s12, s13, s14, s15, t1],
    [s02, s12, s22, s23, s24, s25, t2],
    [s03, s13, s23, s33, s34, s35, t3],
    [s04, s14, s24, s34, s44, s45, t4],
    [s05, s15, s25, s35, s45, s55, t5],
  ];
  const a = full.slice(0, k).map((r) => Float64Array.from([...r.slice(0, k), r[6]!]));
  for (let c = 0; c < k; c++) {
    let p = c;
    for (let r = c + 1; r < k; r++) if (Math.abs(a[r]![c]!) > Math.abs(a[p]![c]!)) p = r;
    if (Math.abs(a[p]![c]!) < 1e-12) return null;
    [a[c], a[p]] = [a[p]!, a[c]!];
    for (let r = 0; r < k; r++) {
      if (r === c) continue;
      const f = a[r]![c]! / a[c]![c]!;
      for (let j = c; j <= k; j++) a[r]![j]! -= f * a[c]![j]!;
    }
  }
  return a.map((r, i) => r[k]! / r[i]!);
}

export function evaluateField(field: PaperField, x: number, y: number): number {
  const c = field.coefficients;
  if (c.length === 1) return c[0];
  if (c.length === 3) return c[0] + c[1] * x + c[2] * y;
  return c[0] + c[1] * x + c[2] * y + c[3] * x * x + c[4] * x * y + c[5] * y * y;
}

/** Fits the paper brightness field, rejecting shadows, glare and pale inks as outliers. */
function fitField(s: Samples, paper: Int32Array): { field: PaperField; kept: Int32Array } {
  let kept = paper;
  const spanX = quantileOf(s.x, 0.98, paper) - quantileOf(s.x, 0.02, paper);
  const spanY = quantileOf(s.y, 0.98, paper) - quantileOf(s.y, 0.02, paper);
  const order: 0 | 1 | 2 = paper.length >= 400 && spanX > 0.6 && spanY > 0.6 ? 2 : paper.length >= 100 && (spanX > 0.4 || spanY > 0.4) ? 1 : 0;
  let field: PaperField = { coefficients: [quantileOf(s.lum, 0.5, paper)] };
  for (let iter = 0; iter < 4; iter++) {
    const coef = order === 0 ? null : fitCoefficients(s, kept, order);
    field = coef ? { coefficients: coef } : { coefficients: [quantileOf(s.lum, 0.5, kept)] };
    const f = field;
    const next = select(paper.length, (i) => {
      const p = paper[i];
      const v = evaluateField(f, s.x[p], s.y[p]);
      const ratio = v > 0 ? s.lum[p] / v : 0;
      return ratio >= FIELD_BAND[0] && ratio <= FIELD_BAND[1];
    }).map((i) => paper[i]);
    if (next.length < Math.max(20, kept.length * 0.5)) break;
    kept = next;
  }
  return { field, kept };
}

/** max/min of the Bradford cone gains that take this white to D65. */
export function coneGainRatio(whiteLinear: [number, number, number]): number {
  const xyz = mulVec3(SRGB_TO_XYZ, whiteLinear);
  const s = mulVec3(BRADFORD, xyz.map((v) => v / Math.max(1e-9, xyz[1])));
  const d = mulVec3(BRADFORD, D65_WHITE);
  const g = [d[0] / s[0], d[1] / s[1], d[2] / s[2]];
  if (g.some((v) => !(v > 0))) return Infinity;
  return Math.max(...g) / Math.min(...g);
}

function correctionFor(whiteLinear: [number, number, number]): number[] {
  const whiteXyz = mulVec3(SRGB_TO_XYZ, whiteLinear);
  return mul3(bradfordMatrix(whiteXyz, D65_WHITE), SRGB_TO_XYZ);
}

/** No correction: the photo is taken as already balanced, sRGB white = paper white. */
export function noPaper(): PaperEstimate {
  return { found: false, measuredLinear: [1, 1, 1], field: { coefficients: [1] }, correction: [...SRGB_TO_XYZ], paperSamples: 0 };
}

function medianRgb(samples: { r: number; g: number; b: number }[]): [number, number, number] {
  const q = (f: (p: { r: number; g: number; b: number }) => number) => quantileOf(Float64Array.from(samples, f), 0.5);
  return [q((p) => p.r), q((p) => p.g), q((p) => p.b)];
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
  const s = takeSamples(img);
  if (s.n === 0) return noPaper();
  const peak = quantileOf(s.lum, 0.98);
  if (!(peak > 0.02)) return noPaper();

  let target: [number, number];
  let pointColour: [number, number, number] | null = null;
  if (white) {
    pointColour = sampleAt(img, white);
    const sum = pointColour[0] + pointColour[1] + pointColour[2];
    target = sum > 1e-6 ? [pointColour[0] / sum, pointColour[1] / sum] : [1 / 3, 1 / 3];
  } else {
    let bright = select(s.n, (i) => s.lum[i] >= BRIGHT_FRACTION * peak && !s.clipped[i]);
    // An over-exposed sheet of paper is all clipped: then clipped samples are the paper.
    if (bright.length < 0.05 * s.n) bright = select(s.n, (i) => s.lum[i] >= BRIGHT_FRACTION * peak);
    if (bright.length < 50) return noPaper();
    target = modalChromaticity(s, bright);
  }

  const refLum = pointColour ? Y_ROW[0] * pointColour[0] + Y_ROW[1] * pointColour[1] + Y_ROW[2] * pointColour[2] : peak;
  const minLum = BRIGHT_FRACTION * refLum;
  const tol2 = CHROMA_TOLERANCE * CHROMA_TOLERANCE;
  const candidates = select(s.n, (i) => s.lum[i] >= minLum && (s.cr[i] - target[0]) ** 2 + (s.cg[i] - target[1]) ** 2 <= tol2);

  if (!white) {
    let borderTotal = 0;
    for (let i = 0; i < s.n; i++) borderTotal += s.border[i];
    let borderPaper = 0;
    for (const i of candidates) borderPaper += s.border[i];
    const enough = (borderTotal > 0 && borderPaper / borderTotal >= MIN_BORDER_PAPER) || candidates.length / s.n >= MIN_TOTAL_PAPER;
    if (!enough) return noPaper();
  }

  let field: PaperField;
  let kept: Int32Array;
  if (candidates.length >= 20) {
    ({ field, kept } = fitField(s, candidates));
  } else if (pointColour) {
    field = { coefficients: [refLum] };
    kept = new Int32Array(0);
  } else {
    return noPaper();
  }
  if (pointColour && white) {
    // Anchor the field to the chosen point so the member's white becomes exactly white there.
    const f = evaluateField(field, white.x - 0.5, white.y - 0.5);
    if (f > 1e-6 && refLum > 1e-6) field = { coefficients: field.coefficients.map((c) => (c * refLum) / f) };
  }

  // Paper colour normalised to Y = 1 by the field, so only its chromaticity drives the adaptation.
  let normalised: [number, number, number];
  let measured: [number, number, number];
  if (kept.length > 0) {
    normalised = fieldNormalisedMedian(s, field, kept);
    measured = pointColour ?? [quantileOf(s.r, 0.5, kept), quantileOf(s.g, 0.5, kept), quantileOf(s.b, 0.5, kept)];
  } else {
    const c = pointColour!;
    normalised = [c[0] / refLum, c[1] / refLum, c[2] / refLum];
    measured = c;
  }
  // A "paper" that would need an extreme correction is a pale ink filling the frame, not paper.
  if (!white && coneGainRatio(normalised) > MAX_CONE_GAIN_RATIO) return noPaper();
  return { found: true, measuredLinear: measured, field, correction: correctionFor(normalised), paperSamples: kept.length };
}

/** Median paper colour after dividing each sample by the brightness field (so Y ≈ 1). */
function fieldNormalisedMedian(s: Samples, field: PaperField, kept: Int32Array): [number, number, number] {
  const nr = new Float64Array(kept.length);
  const ng = new Float64Array(kept.length);
  const nb = new Float64Array(kept.length);
  kept.forEach((p, i) => {
    const f = Math.max(1e-6, evaluateField(field, s.x[p], s.y[p]));
    nr[i] = s.r[p] / f;
    ng[i] = s.g[p] / f;
    nb[i] = s.b[p] / f;
  });
  return [quantileOf(nr, 0.5), quantileOf(ng, 0.5), quantileOf(nb, 0.5)];
}

/** The photographed paper colour as 8-bit sRGB. */
export function paperSrgb8(p: PaperEstimate): [number, number, number] {
  return p.measuredLinear.map((v) => Math.max(0, Math.min(255, Math.round(srgbEncode(Math.max(0, v)) * 255)))) as [number, number, number];
}

/**
 * The paper white measured on the pixels of a known paper region (the card the strip lies on),
 * with the brightness field fitted to them. Null when the region's colour would need an
 * implausible correction (then it is not white paper; see MAX_CONE_GAIN_RATIO).
 */
export function paperFromRegion(img: RgbImage, isPaper: (x: number, y: number) => boolean): PaperEstimate | null {
  const s = takeSamples(img);
  const { width: w, height: h } = img;
  const idx = select(s.n, (i) => !s.clipped[i] && isPaper(Math.round((s.x[i] + 0.5) * w), Math.round((s.y[i] + 0.5) * h)));
  if (idx.length < 20) return null;
  const { field, kept } = fitField(s, idx);
  const normalised = fieldNormalisedMedian(s, field, kept);
  if (coneGainRatio(normalised) > MAX_CONE_GAIN_RATIO) return null;
  const measured: [number, number, number] = [quantileOf(s.r, 0.5, kept), quantileOf(s.g, 0.5, kept), quantileOf(s.b, 0.5, kept)];
  return { found: true, measuredLinear: measured, field, correction: correctionFor(normalised), paperSamples: kept.length };
}

/** The paper white from one measured colour (a strip's own un-inked margin): a flat field at its brightness. */
export function paperFromColour(linear: [number, number, number]): PaperEstimate | null {
  const lum = Y_ROW[0] * linear[0] + Y_ROW[1] * linear[1] + Y_ROW[2] * linear[2];
  if (!(lum > 1e-4)) return null;
  const normalised: [number, number, number] = [linear[0] / lum, linear[1] / lum, linear[2] / lum];
  if (coneGainRatio(normalised) > MAX_CONE_GAIN_RATIO) return null;
  return { found: true, measuredLinear: linear, field: { coefficients: [lum] }, correction: correctionFor(normalised), paperSamples: 0 };
}
