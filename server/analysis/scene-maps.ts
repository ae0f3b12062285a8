// Per-pixel maps of the photo that the strip finder works on: smoothed linear colour, the paper
// candidates (bright, the paper's chromaticity, bright for their neighbourhood) and a colour
// model of the desk seen at the photo's border. Thresholds are ours, chosen on the tuning split
// of the scene generator (tests/analysis/scenes, seeds listed in docs/decisions/009).
import { MAX_CONE_GAIN_RATIO, coneGainRatio } from "./paper-white";
import { SRGB8_TO_LINEAR, SRGB_TO_XYZ } from "./srgb-lab";
import type { RgbImage } from "./types";

export type SceneMaps = {
  width: number;
  height: number;
  /** Linear sRGB as photographed (not smoothed), interleaved: what colours are read from. */
  raw: Float32Array;
  /** Smoothed linear sRGB, interleaved. */
  rgb: Float32Array;
  /** Smoothed luminance Y (linear). */
  lum: Float32Array;
  /** Rough CIELAB of the smoothed pixels, white = the paper's chromaticity at the local white level. */
  lab: Float32Array;
  /** 1 where any 8-bit channel is clipped (glare, or a bright ink pushed past the file's range). */
  clipped: Uint8Array;
  /**
   * 1 on a glare spot and its halo: a blown-out white core (every channel near 255) and the ring
   * around it where the specular reflection still adds light. Colours are never read there.
   */
  glare: Uint8Array;
  /** The paper's chromaticity (r/(r+g+b), g/(r+g+b)), or null when no bright neutral area exists. */
  paperChroma: [number, number] | null;
  /** Paper candidates: 1 where the pixel looks like paper for its neighbourhood. */
  paper: Uint8Array;
  /** Local texture: |luminance − smoothed luminance| / smoothed, averaged nearby (paper ≈ 0.005, wood grain ≈ 0.03). */
  texture: Float32Array;
};

/**
 * White paper under light from CIE D75 to CIE A, photographed in sRGB, has linear chromaticity
 * (r, g) close to the segment between these two points (measured on our CAT02-rendered white; from
 * our own rendering, not a standard). Fluorescent greens and magentas sit off it by up to ≈ 0.03.
 */
const LOCUS: [[number, number], [number, number]] = [
  [0.3, 0.336],
  [0.64, 0.284],
];
export const LOCUS_TOL = 0.04;

export function offLocus(r: number, g: number): number {
  const [[x0, y0], [x1, y1]] = LOCUS;
  const dx = x1 - x0;
  const dy = y1 - y0;
  const t = Math.max(-0.1, Math.min(1.1, ((r - x0) * dx + (g - y0) * dy) / (dx * dx + dy * dy)));
  return Math.hypot(r - (x0 + t * dx), g - (y0 + t * dy));
}

/** Cardstock is smooth: a region whose median local texture is above this is a desk, not paper. */
export const PAPER_MAX_TEXTURE = 0.015;

const Y_ROW = [SRGB_TO_XYZ[3], SRGB_TO_XYZ[4], SRGB_TO_XYZ[5]];
const CHROMA_BIN = 0.004;
/** How far from the paper's chromaticity a paper pixel may be (r, g chromaticity units). */
export const PAPER_CHROMA_TOL = 0.016;
/** A paper pixel is at least this share of the local white level. */
export const PAPER_LOCAL_BRIGHTNESS = 0.8;
/** Tiles across the long edge for the local white level. */
const WHITE_TILES = 24;

/** Separable box blur of `channels` interleaved channels, radius r, edges clamped. */
export function boxBlur(src: Float32Array, w: number, h: number, channels: number, r: number): Float32Array {
  if (r < 1) return src.slice();
  const tmp = new Float32Array(src.length);
  const out = new Float32Array(src.length);
  const n = 2 * r + 1;
  for (let y = 0; y < h; y++) {
    for (let c = 0; c < channels; c++) {
      let s = 0;
      for (let k = -r; k <= r; k++) s += src[(y * w + Math.min(w - 1, Math.max(0, k))) * channels + c];
      for (let x = 0; x < w; x++) {
        tmp[(y * w + x) * channels + c] = s / n;
        const add = Math.min(w - 1, x + r + 1);
        const drop = Math.max(0, x - r);
        s += src[(y * w + add) * channels + c] - src[(y * w + drop) * channels + c];
      }
    }
  }
  for (let x = 0; x < w; x++) {
    for (let c = 0; c < channels; c++) {
      let s = 0;
      for (let k = -r; k <= r; k++) s += tmp[(Math.min(h - 1, Math.max(0, k)) * w + x) * channels + c];
      for (let y = 0; y < h; y++) {
        out[(y * w + x) * channels + c] = s / n;
        const add = Math.min(h - 1, y + r + 1);
        const drop = Math.max(0, y - r);
        s += tmp[(add * w + x) * channels + c] - tmp[(drop * w + x) * channels + c];
      }
    }
  }
  return out;
}

function quantile(values: Float32Array | number[], q: number): number {
  const a = Float64Array.from(values).sort();
  if (a.length === 0) return NaN;
  return a[Math.min(a.length - 1, Math.max(0, Math.round(q * (a.length - 1))))];
}

/** The most common chromaticity among the given pixels (3×3-bin neighbourhood), refined to a mean. */
function modalChroma(cr: Float32Array, cg: Float32Array, idx: Int32Array): [number, number] | null {
  if (idx.length === 0) return null;
  const n = Math.round(1 / CHROMA_BIN);
  const hist = new Float64Array(n * n);
  for (const p of idx) {
    const i = Math.min(n - 1, Math.max(0, Math.floor(cr[p] / CHROMA_BIN)));
    const j = Math.min(n - 1, Math.max(0, Math.floor(cg[p] / CHROMA_BIN)));
    hist[i * n + j]++;
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
  let sr = 0;
  let sg = 0;
  let cnt = 0;
  for (const p of idx) {
    if (Math.abs(cr[p] - (bi + 0.5) * CHROMA_BIN) <= 1.5 * CHROMA_BIN && Math.abs(cg[p] - (bj + 0.5) * CHROMA_BIN) <= 1.5 * CHROMA_BIN) {
      sr += cr[p];
      sg += cg[p];
      cnt++;
    }
  }
  return cnt ? [sr / cnt, sg / cnt] : null;
}

/**
 * The local white level: per tile, a high percentile of the luminance of paper-coloured pixels;
 * tiles without paper borrow from their neighbours; bilinear between tile centres. Light falling
 * off across the card and soft shadows are slower than a tile, so paper stays "bright for its place".
 */
function localWhite(lum: Float32Array, chromaOk: Uint8Array, w: number, h: number, floor: number): Float32Array {
  const ts = Math.max(8, Math.ceil(Math.max(w, h) / WHITE_TILES));
  const tw = Math.ceil(w / ts);
  const th = Math.ceil(h / ts);
  const level = new Float64Array(tw * th).fill(NaN);
  for (let ty = 0; ty < th; ty++) {
    for (let tx = 0; tx < tw; tx++) {
      const vals: number[] = [];
      for (let y = ty * ts; y < Math.min(h, (ty + 1) * ts); y += 2) {
        for (let x = tx * ts; x < Math.min(w, (tx + 1) * ts); x += 2) {
          const p = y * w + x;
          if (chromaOk[p] && lum[p] >= floor) vals.push(lum[p]);
        }
      }
      if (vals.length >= 6) level[ty * tw + tx] = quantile(vals, 0.9);
    }
  }
  // Fill empty tiles from filled neighbours, ring by ring.
  for (let pass = 0; pass < tw + th; pass++) {
    let missing = 0;
    const next = level.slice();
    for (let ty = 0; ty < th; ty++) {
      for (let tx = 0; tx < tw; tx++) {
        if (!Number.isNaN(level[ty * tw + tx])) continue;
        let s = 0;
        let c = 0;
        for (let dy = -1; dy <= 1; dy++) {
          for (let dx = -1; dx <= 1; dx++) {
            const x = tx + dx;
            const y = ty + dy;
            if (x < 0 || y < 0 || x >= tw || y >= th) continue;
            const v = level[y * tw + x];
            if (!Number.isNaN(v)) {
              s += v;
              c++;
            }
          }
        }
        if (c) next[ty * tw + tx] = s / c;
        else missing++;
      }
    }
    level.set(next);
    if (missing === 0) break;
  }
  const out = new Float32Array(w * h);
  for (let y = 0; y < h; y++) {
    const fy = Math.min(th - 1, Math.max(0, (y + 0.5) / ts - 0.5));
    const y0 = Math.floor(fy);
    const y1 = Math.min(th - 1, y0 + 1);
    const wy = fy - y0;
    for (let x = 0; x < w; x++) {
      const fx = Math.min(tw - 1, Math.max(0, (x + 0.5) / ts - 0.5));
      const x0 = Math.floor(fx);
      const x1 = Math.min(tw - 1, x0 + 1);
      const wx = fx - x0;
      const v =
        (1 - wy) * ((1 - wx) * level[y0 * tw + x0] + wx * level[y0 * tw + x1]) + wy * ((1 - wx) * level[y1 * tw + x0] + wx * level[y1 * tw + x1]);
      out[y * w + x] = Number.isNaN(v) ? floor : v;
    }
  }
  return out;
}

/**
 * Glare spots: connected blown-out whitish cores, each grown to a disc of GLARE_HALO × its own
 * radius (+ 3 px): a glossy highlight's halo fades over a few times its core's radius (ours, from
 * the tuning scenes).
 */
const GLARE_HALO = 3.5;
function glareMask(data: Uint8Array, w: number, h: number, paperChroma: [number, number] | null): Uint8Array {
  const out = new Uint8Array(w * h);
  const seen = new Uint8Array(w * h);
  const stack: number[] = [];
  // Blown out in at least one channel and whitish in all (a yellow ink clips red but not blue).
  const core = (p: number) => {
    const r = data[p * 3];
    const g = data[p * 3 + 1];
    const b = data[p * 3 + 2];
    if (Math.max(r, g, b) < 250) return false;
    if (!paperChroma) return Math.min(r, g, b) >= 200;
    // The highlight has the light's colour, which is the paper's colour as photographed.
    const lr = SRGB8_TO_LINEAR[r];
    const lg = SRGB8_TO_LINEAR[g];
    const lb = SRGB8_TO_LINEAR[b];
    const s = lr + lg + lb;
    return Math.hypot(lr / s - paperChroma[0], lg / s - paperChroma[1]) < 0.08;
  };
  for (let start = 0; start < w * h; start++) {
    if (seen[start] || !core(start)) continue;
    let n = 0;
    let sx = 0;
    let sy = 0;
    seen[start] = 1;
    stack.push(start);
    while (stack.length) {
      const p = stack.pop()!;
      const x = p % w;
      const y = (p - x) / w;
      n++;
      sx += x;
      sy += y;
      for (const q of [x > 0 ? p - 1 : -1, x < w - 1 ? p + 1 : -1, y > 0 ? p - w : -1, y < h - 1 ? p + w : -1]) {
        if (q >= 0 && !seen[q] && core(q)) {
          seen[q] = 1;
          stack.push(q);
        }
      }
    }
    // Tiny specks are noise; a huge "spot" is an over-exposed sheet, not a highlight.
    if (n < 4 || n > 0.02 * w * h) continue;
    const cx = sx / n;
    const cy = sy / n;
    const r = GLARE_HALO * Math.sqrt(n / Math.PI) + 3;
    for (let y = Math.max(0, Math.floor(cy - r)); y <= Math.min(h - 1, Math.ceil(cy + r)); y++) {
      for (let x = Math.max(0, Math.floor(cx - r)); x <= Math.min(w - 1, Math.ceil(cx + r)); x++) {
        if ((x - cx) ** 2 + (y - cy) ** 2 <= r * r) out[y * w + x] = 1;
      }
    }
  }
  return out;
}

const EPS = 216 / 24389;
const KAPPA = 24389 / 27;
const f = (t: number) => (t > EPS ? Math.cbrt(t) : (KAPPA * t + 16) / 116);

export function sceneMaps(img: RgbImage): SceneMaps {
  const { width: w, height: h, data } = img;
  const n = w * h;
  const raw = new Float32Array(n * 3);
  const clipped = new Uint8Array(n);
  for (let p = 0; p < n; p++) {
    const i = p * 3;
    raw[i] = SRGB8_TO_LINEAR[data[i]];
    raw[i + 1] = SRGB8_TO_LINEAR[data[i + 1]];
    raw[i + 2] = SRGB8_TO_LINEAR[data[i + 2]];
    if (data[i] >= 254 || data[i + 1] >= 254 || data[i + 2] >= 254) clipped[p] = 1;
  }
  // Smooth away sensor noise and paper grain (≈ 0.6 % of the long edge).
  const rgb = boxBlur(raw, w, h, 3, Math.max(1, Math.round(Math.max(w, h) / 320)));
  const lum = new Float32Array(n);
  const cr = new Float32Array(n);
  const cg = new Float32Array(n);
  for (let p = 0; p < n; p++) {
    const r = rgb[p * 3];
    const g = rgb[p * 3 + 1];
    const b = rgb[p * 3 + 2];
    lum[p] = Y_ROW[0] * r + Y_ROW[1] * g + Y_ROW[2] * b;
    const s = r + g + b;
    cr[p] = s > 1e-6 ? r / s : 1 / 3;
    cg[p] = s > 1e-6 ? g / s : 1 / 3;
  }
  const rawTex = new Float32Array(n);
  for (let p = 0; p < n; p++) {
    const y = Y_ROW[0] * raw[p * 3] + Y_ROW[1] * raw[p * 3 + 1] + Y_ROW[2] * raw[p * 3 + 2];
    rawTex[p] = Math.abs(y - lum[p]) / Math.max(1e-4, lum[p]);
  }
  const texture = boxBlur(rawTex, w, h, 1, Math.max(1, Math.round(Math.max(w, h) / 270)));
  const peak = quantile(lum.filter((_, i) => i % 7 === 0 && !clipped[i]), 0.99);
  // The paper's colour: the commonest among bright, smooth pixels whose colour could be white
  // paper under some light (near the daylight–incandescent locus in chromaticity, and a plausible
  // Bradford correction, decision 003). A wood or coloured desk is textured or off the locus.
  const brightIdx: number[] = [];
  for (let p = 0; p < n; p += 3) {
    if (lum[p] < 0.6 * peak || clipped[p] || texture[p] > 0.02 || offLocus(cr[p], cg[p]) > LOCUS_TOL) continue;
    brightIdx.push(p);
  }
  let paperChroma = peak > 0.02 ? modalChroma(cr, cg, Int32Array.from(brightIdx)) : null;
  if (paperChroma && coneGainRatio([paperChroma[0], paperChroma[1], 1 - paperChroma[0] - paperChroma[1]]) > MAX_CONE_GAIN_RATIO) paperChroma = null;

  const chromaOk = new Uint8Array(n);
  const paper = new Uint8Array(n);
  let white: Float32Array;
  if (paperChroma) {
    const tol2 = PAPER_CHROMA_TOL * PAPER_CHROMA_TOL;
    for (let p = 0; p < n; p++) {
      if ((cr[p] - paperChroma[0]) ** 2 + (cg[p] - paperChroma[1]) ** 2 <= tol2) chromaOk[p] = 1;
    }
    white = localWhite(lum, chromaOk, w, h, 0.3 * peak);
    for (let p = 0; p < n; p++) if (chromaOk[p] && lum[p] >= PAPER_LOCAL_BRIGHTNESS * white[p]) paper[p] = 1;
  } else {
    white = new Float32Array(n).fill(Math.max(1e-3, peak));
  }

  // A rough CIELAB for finding things: each pixel divided by the local white, with the paper's
  // chromaticity as white (a von Kries scaling in sRGB: good enough to tell ink from paper).
  const pc = paperChroma ?? [1 / 3, 1 / 3];
  const wr = pc[0] * 3;
  const wg = pc[1] * 3;
  const wb = (1 - pc[0] - pc[1]) * 3;
  const lab = new Float32Array(n * 3);
  for (let p = 0; p < n; p++) {
    const k = 1 / Math.max(1e-4, white[p]);
    const r = (rgb[p * 3] * k) / wr;
    const g = (rgb[p * 3 + 1] * k) / wg;
    const b = (rgb[p * 3 + 2] * k) / wb;
    const X = (0.4124 * r + 0.3576 * g + 0.1805 * b) / 0.9505;
    const Y = 0.2126 * r + 0.7152 * g + 0.0722 * b;
    const Z = (0.0193 * r + 0.1192 * g + 0.9505 * b) / 1.089;
    const fy = f(Y);
    lab[p * 3] = 116 * fy - 16;
    lab[p * 3 + 1] = 500 * (f(X) - fy);
    lab[p * 3 + 2] = 200 * (fy - f(Z));
  }
  return { width: w, height: h, raw, rgb, lum, lab, clipped, paperChroma, paper, texture, glare: glareMask(data, w, h, paperChroma) };
}
