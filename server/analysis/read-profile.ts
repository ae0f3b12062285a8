// Reads the strip's colour profile: at each position along the strip, the per-channel
// interquartile mean of CIELAB over its inner width. Like a median it ignores specks and glare
// (they fall in the outer quarters), but it does not snap to one 8-bit step on dark colours.
import type { LabImage } from "./corrected-lab";
import type { StripGeometry } from "./find-strip";

export type Profile = {
  /** Number of positions along the strip. */
  n: number;
  /** L, a, b interleaved per position. */
  lab: Float64Array;
};

/** Share of the thickness read at each position (the middle; the edges blend into paper). */
const INNER_SHARE = 0.6;

/** Moves the k-th smallest of a[lo..hi] to a[k], smaller ones before it, larger after (Hoare's quickselect). */
function selectInPlace(a: Float64Array, k: number, lo: number, hi: number): void {
  while (hi > lo) {
    const pivot = a[(lo + hi) >> 1]!;
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (a[i]! < pivot) i++;
      while (a[j]! > pivot) j--;
      if (i <= j) {
        const t = a[i]!;
        a[i] = a[j]!;
        a[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return;
  }
}

/**
 * Mean of the values between the 25th and 75th percentiles. Two selections instead of a sort:
 * after them a[lo..hi) holds exactly the values a sort would put there.
 */
export function interquartileMean(values: number[]): number {
  const a = Float64Array.from(values);
  const n = a.length;
  if (n === 0) return NaN;
  if (n < 4) return a.sort()[n >> 1]!;
  const lo = Math.floor(n / 4);
  const hi = n - lo;
  selectInPlace(a, lo, 0, n - 1);
  selectInPlace(a, hi - 1, lo, n - 1);
  let s = 0;
  for (let i = lo; i < hi; i++) s += a[i]!;
  return s / (hi - lo);
}

/** Collects corrected Lab samples over [u0, u1) × inner width, skipping clipped (glare) pixels when possible. */
export function collectSamples(img: LabImage, g: StripGeometry, u0: number, u1: number, stepU = 1, stepV = 1): number[][] {
  const half = (INNER_SHARE * g.thickness) / 2;
  const ls: number[] = [];
  const as: number[] = [];
  const bs: number[] = [];
  const glare: number[][] = [[], [], []];
  for (let u = u0; u < u1; u += stepU) {
    for (let v = -half; v <= half; v += stepV) {
      const x = Math.round(g.origin[0] + g.along[0] * u + g.across[0] * v);
      const y = Math.round(g.origin[1] + g.along[1] * u + g.across[1] * v);
      if (x < 0 || y < 0 || x >= img.width || y >= img.height) continue;
      const p = y * img.width + x;
      const i = p * 3;
      if (img.clipped[p]) {
        glare[0].push(img.lab[i]);
        glare[1].push(img.lab[i + 1]);
        glare[2].push(img.lab[i + 2]);
      } else {
        ls.push(img.lab[i]);
        as.push(img.lab[i + 1]);
        bs.push(img.lab[i + 2]);
      }
    }
  }
  return ls.length >= 3 ? [ls, as, bs] : [ls.concat(glare[0]), as.concat(glare[1]), bs.concat(glare[2])];
}

export function robustLab(samples: number[][]): [number, number, number] {
  return [interquartileMean(samples[0]), interquartileMean(samples[1]), interquartileMean(samples[2])];
}

export function readProfile(img: LabImage, g: StripGeometry): Profile {
  const n = Math.max(60, Math.min(300, Math.round(g.length / 2)));
  const lab = new Float64Array(n * 3);
  const step = g.length / n;
  const stepV = Math.max(1, (INNER_SHARE * g.thickness) / 31);
  for (let i = 0; i < n; i++) {
    const u = i * step;
    const s = collectSamples(img, g, u, u + step, Math.max(1, step / 2), stepV);
    if (s[0].length === 0) {
      if (i > 0) lab.copyWithin(i * 3, (i - 1) * 3, i * 3);
      continue;
    }
    const m = robustLab(s);
    lab[i * 3] = m[0];
    lab[i * 3 + 1] = m[1];
    lab[i * 3 + 2] = m[2];
  }
  return { n, lab };
}
