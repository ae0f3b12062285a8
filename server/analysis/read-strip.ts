// Reads one strip through its four corners: the strip is straightened by the homography of its
// outline (so bands and joins are placed along the real strip, not its perspective image), its
// photographed colours are corrected to the paper white, evened out against the paper just beside
// it where there is paper, and summarised as a colour profile along it.
import { evaluateField, type PaperEstimate } from "./paper-white";
import { interquartileMean } from "./read-profile";
import { xyzToLabInto, labToXyz } from "./srgb-lab";
import { stripMap, type Point, type StripMap } from "./strip-quad";
import type { FoundStrip } from "./find-strips";

/** Share of the thickness read at each position (the middle; the edges blend into the surround). */
const INNER = [0.2, 0.8] as const;

export type StripGrid = {
  /** Rows along the strip (2 per profile position) and samples across. */
  rows: number;
  cols: number;
  /** Linear sRGB per sample, row-major, interleaved. */
  rgb: Float32Array;
  /** Normalised photo position per sample (x, y in −0.5…0.5), for the brightness field. */
  pos: Float32Array;
  clipped: Uint8Array;
  /** Samples just outside each long side, `sideCols` per row per side. */
  side: Float32Array;
  sidePos: Float32Array;
  sideClipped: Uint8Array;
  sideCols: number;
  map: StripMap;
};

function bilinear(raw: Float32Array, w: number, h: number, x: number, y: number, out: Float32Array, o: number): boolean {
  if (x < 0 || y < 0 || x > w - 1 || y > h - 1) return false;
  const x0 = Math.min(w - 2, Math.floor(x));
  const y0 = Math.min(h - 2, Math.floor(y));
  const fx = x - x0;
  const fy = y - y0;
  for (let c = 0; c < 3; c++) {
    const a = raw[(y0 * w + x0) * 3 + c];
    const b = raw[(y0 * w + x0 + 1) * 3 + c];
    const d = raw[((y0 + 1) * w + x0) * 3 + c];
    const e = raw[((y0 + 1) * w + x0 + 1) * 3 + c];
    out[o + c] = (1 - fy) * ((1 - fx) * a + fx * b) + fy * ((1 - fx) * d + fx * e);
  }
  return true;
}

export function sampleStrip(raw: Float32Array, clippedMap: Uint8Array, w: number, h: number, strip: { corners: readonly Point[]; length: number; thickness: number }, positions: number): StripGrid {
  const map = stripMap(strip.corners);
  const rows = positions * 2;
  const cols = Math.max(5, Math.min(31, Math.round((0.6 * strip.thickness) / 1.2)));
  const sideCols = 3;
  const rgb = new Float32Array(rows * cols * 3).fill(NaN);
  const pos = new Float32Array(rows * cols * 2);
  const clipped = new Uint8Array(rows * cols);
  const side = new Float32Array(rows * sideCols * 2 * 3).fill(NaN);
  const sidePos = new Float32Array(rows * sideCols * 2 * 2);
  const sideClipped = new Uint8Array(rows * sideCols * 2);
  // Paper beside the strip: from 2 px (or 15 % of the thickness) to 5 px (or half of it) off the edge.
  const near = Math.max(2, 0.15 * strip.thickness) / strip.thickness;
  const far = Math.max(5, 0.5 * strip.thickness) / strip.thickness;
  const clipAt = (x: number, y: number) => clippedMap[Math.min(h - 1, Math.max(0, Math.round(y))) * w + Math.min(w - 1, Math.max(0, Math.round(x)))];
  for (let r = 0; r < rows; r++) {
    const s = (r + 0.5) / rows;
    for (let c = 0; c < cols; c++) {
      const t = INNER[0] + ((INNER[1] - INNER[0]) * (c + 0.5)) / cols;
      const [x, y] = map(s, t);
      const k = r * cols + c;
      if (bilinear(raw, w, h, x, y, rgb, k * 3)) clipped[k] = clipAt(x, y);
      pos[k * 2] = x / w - 0.5;
      pos[k * 2 + 1] = y / h - 0.5;
    }
    for (let side0 = 0; side0 < 2; side0++) {
      for (let c = 0; c < sideCols; c++) {
        const off = near + ((far - near) * c) / (sideCols - 1);
        const t = side0 === 0 ? -off : 1 + off;
        const [x, y] = map(s, t);
        const k = (r * 2 + side0) * sideCols + c;
        if (bilinear(raw, w, h, x, y, side, k * 3)) sideClipped[k] = clipAt(x, y);
        sidePos[k * 2] = x / w - 0.5;
        sidePos[k * 2 + 1] = y / h - 0.5;
      }
    }
  }
  return { rows, cols, rgb, pos, clipped, side, sidePos, sideClipped, sideCols, map };
}

/** CIELAB (D65) of one linear sample under the paper correction, with an extra brightness divisor. */
function correctedLab(p: PaperEstimate, r: number, g: number, b: number, x: number, y: number, extra: number, out: Float32Array | number[], o: number) {
  const k = 1 / Math.max(1e-4, evaluateField(p.field, x, y) * extra);
  const m = p.correction;
  xyzToLabInto(k * (m[0] * r + m[1] * g + m[2] * b), k * (m[3] * r + m[4] * g + m[5] * b), k * (m[6] * r + m[7] * g + m[8] * b), out, o);
}

function runningMedian(v: Float64Array, half: number): Float64Array {
  const out = new Float64Array(v.length);
  for (let i = 0; i < v.length; i++) {
    const win: number[] = [];
    for (let j = Math.max(0, i - half); j <= Math.min(v.length - 1, i + half); j++) if (!Number.isNaN(v[j])) win.push(v[j]);
    win.sort((a, b) => a - b);
    out[i] = win.length ? win[win.length >> 1] : NaN;
  }
  return out;
}

/**
 * Per row, how bright the paper beside the strip is after the correction (1 = as white as the
 * paper's field says). A soft shadow or light falling off faster than the fitted field shows up
 * here first, so the strip is divided by it. Null when too little paper lies beside the strip.
 */
export function sideWhite(grid: StripGrid, paper: PaperEstimate): Float64Array | null {
  const { rows, sideCols } = grid;
  const level = new Float64Array(rows).fill(NaN);
  const lab = [0, 0, 0];
  let found = 0;
  for (let r = 0; r < rows; r++) {
    const vals: number[] = [];
    for (let k = r * 2 * sideCols; k < (r + 1) * 2 * sideCols; k++) {
      if (grid.sideClipped[k] || Number.isNaN(grid.side[k * 3])) continue;
      correctedLab(paper, grid.side[k * 3], grid.side[k * 3 + 1], grid.side[k * 3 + 2], grid.sidePos[k * 2], grid.sidePos[k * 2 + 1], 1, lab, 0);
      // Paper: nearly neutral and not far below the field's white.
      if (Math.hypot(lab[1], lab[2]) < 6 && lab[0] > 55) vals.push(labToXyz(lab[0], 0, 0)[1]);
    }
    if (vals.length >= 2) {
      vals.sort((a, b) => a - b);
      level[r] = vals[vals.length >> 1];
      found++;
    }
  }
  if (found < 0.3 * rows) return null;
  const smooth = runningMedian(level, Math.max(2, Math.round(rows / 40)));
  // Fill gaps (glare, a neighbouring strip) by carrying the nearest known level.
  let last = NaN;
  for (let r = 0; r < rows; r++) if (Number.isNaN(smooth[r])) smooth[r] = last;
  else last = smooth[r];
  last = NaN;
  for (let r = rows - 1; r >= 0; r--) if (Number.isNaN(smooth[r])) smooth[r] = last;
  else last = smooth[r];
  for (let r = 0; r < rows; r++) smooth[r] = Math.min(1.3, Math.max(0.4, Number.isNaN(smooth[r]) ? 1 : smooth[r]));
  return smooth;
}

export type StripLab = {
  rows: number;
  cols: number;
  /** Corrected CIELAB per sample; NaN where the sample fell outside the photo. */
  lab: Float32Array;
  clipped: Uint8Array;
};

export function correctGrid(grid: StripGrid, paper: PaperEstimate, rowWhite: Float64Array | null): StripLab {
  const { rows, cols } = grid;
  const lab = new Float32Array(rows * cols * 3).fill(NaN);
  for (let r = 0; r < rows; r++) {
    const extra = rowWhite ? rowWhite[r] : 1;
    for (let c = 0; c < cols; c++) {
      const k = r * cols + c;
      if (Number.isNaN(grid.rgb[k * 3])) continue;
      correctedLab(paper, grid.rgb[k * 3], grid.rgb[k * 3 + 1], grid.rgb[k * 3 + 2], grid.pos[k * 2], grid.pos[k * 2 + 1], extra, lab, k * 3);
    }
  }
  return { rows, cols, lab, clipped: grid.clipped };
}

/** Robust CIELAB over rows [r0, r1): interquartile mean per channel, glare skipped when possible. */
export function robustRows(s: StripLab, r0: number, r1: number): [number, number, number] {
  const ch: number[][] = [[], [], []];
  const glare: number[][] = [[], [], []];
  for (let r = Math.max(0, r0); r < Math.min(s.rows, r1); r++) {
    for (let c = 0; c < s.cols; c++) {
      const k = r * s.cols + c;
      if (Number.isNaN(s.lab[k * 3])) continue;
      const into = s.clipped[k] ? glare : ch;
      into[0].push(s.lab[k * 3]);
      into[1].push(s.lab[k * 3 + 1]);
      into[2].push(s.lab[k * 3 + 2]);
    }
  }
  const use = ch[0].length >= 3 ? ch : [ch[0].concat(glare[0]), ch[1].concat(glare[1]), ch[2].concat(glare[2])];
  return [interquartileMean(use[0]), interquartileMean(use[1]), interquartileMean(use[2])];
}

/** The profile: one robust colour per pair of rows. */
export function profileOf(s: StripLab): { n: number; lab: Float64Array } {
  const n = s.rows / 2;
  const lab = new Float64Array(n * 3);
  for (let i = 0; i < n; i++) {
    const m = robustRows(s, 2 * i, 2 * i + 2);
    if (Number.isNaN(m[0])) {
      if (i > 0) lab.copyWithin(i * 3, (i - 1) * 3, i * 3);
      continue;
    }
    lab[i * 3] = m[0];
    lab[i * 3 + 1] = m[1];
    lab[i * 3 + 2] = m[2];
  }
  return { n, lab };
}

/** Profile positions for a strip of this length in pixels. */
export function positionsFor(length: number): number {
  return Math.max(60, Math.min(300, Math.round(length / 2)));
}

export type { FoundStrip };

/** ΔE*ab between a strip's middle and the paper beside it above which the strip goes on. */
const STILL_STRIP = 2.5;

/**
 * A strip found on the card stops where its ink does; a near-white band at an end (a white chart
 * patch, a very pale ink) is paper-coloured enough to be taken for the card. Walk on from each end,
 * a pixel at a time, while the middle of the strip stays distinct from the paper just beside it.
 */
export function extendAlong(raw: Float32Array, w: number, h: number, strip: FoundStrip, paper: PaperEstimate): FoundStrip {
  const map = stripMap(strip.corners);
  const ds = 1 / Math.max(1, strip.length);
  const maxSteps = Math.round(0.3 * strip.length);
  const off = Math.max(2, 0.2 * strip.thickness) / strip.thickness + 0.1;
  const rgb = new Float32Array(3);
  const lab = [0, 0, 0];
  const median = (vals: number[][]) => [0, 1, 2].map((c) => vals.map((v) => v[c]).sort((a, b) => a - b)[vals.length >> 1]);
  const colourAt = (s: number, ts: number[]) => {
    const vals: number[][] = [];
    for (const t of ts) {
      const [x, y] = map(s, t);
      if (!bilinear(raw, w, h, x, y, rgb, 0)) continue;
      correctedLab(paper, rgb[0], rgb[1], rgb[2], x / w - 0.5, y / h - 0.5, 1, lab, 0);
      vals.push([lab[0], lab[1], lab[2]]);
    }
    return vals.length >= Math.max(2, ts.length / 2) ? median(vals) : null;
  };
  const inner = Array.from({ length: 9 }, (_, i) => 0.25 + (0.5 * i) / 8);
  const sides = [-off, -off - 0.1, 1 + off, 1 + off + 0.1];
  const walk = (edge: number, dir: 1 | -1) => {
    let last = edge;
    let misses = 0;
    for (let k = 1; k <= maxSteps; k++) {
      const s = edge + dir * k * ds;
      const a = colourAt(s, inner);
      const b = colourAt(s, sides);
      if (!a || !b) break;
      if (Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]) >= STILL_STRIP) {
        last = s;
        misses = 0;
      } else if (++misses >= 3) break;
    }
    return last;
  };
  const s0 = walk(0, -1);
  const s1 = walk(1, 1);
  if (s0 === 0 && s1 === 1) return strip;
  const corners = [map(s0, 0), map(s1, 0), map(s1, 1), map(s0, 1)] as [Point, Point, Point, Point];
  return { ...strip, corners, length: strip.length * (s1 - s0) };
}
