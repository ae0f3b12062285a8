// Seeded procedural noise (lattice value noise and its fractal sum) for desks, paper grain and
// mottled ink. The lattice values come from one 1024×1024 table of hashed randoms (period 1024
// cells, far beyond any feature's visible extent at its scale), offset per seed: a table read is
// several times faster than hashing every corner, and rendering is the evaluator's bottleneck.

/** 32-bit integer hash of a lattice point (a variant of the "lowbias32" mixer); result in [0, 1). */
export function hash2(ix: number, iy: number, seed: number): number {
  let h = (Math.imul(ix | 0, 0x27d4eb2d) ^ Math.imul(iy | 0, 0x165667b1) ^ Math.imul(seed | 0, 0x9e3779b1)) >>> 0;
  h ^= h >>> 16;
  h = Math.imul(h, 0x7feb352d);
  h ^= h >>> 15;
  h = Math.imul(h, 0x846ca68b);
  h ^= h >>> 16;
  return (h >>> 0) / 4294967296;
}

const N = 1024;
const MASK = N - 1;
const TABLE = (() => {
  const t = new Float32Array(N * N);
  for (let y = 0; y < N; y++) for (let x = 0; x < N; x++) t[y * N + x] = 2 * hash2(x, y, 0x51ab) - 1;
  return t;
})();

/** Value noise in [-1, 1], smooth (quintic fade), one lattice cell per unit. */
export function valueNoise(x: number, y: number, seed: number): number {
  const fx0 = Math.floor(x);
  const fy0 = Math.floor(y);
  const fx = x - fx0;
  const fy = y - fy0;
  const ix = (fx0 + Math.imul(seed, 7919)) & MASK;
  const iy = (fy0 + Math.imul(seed, 104729)) & MASK;
  const ix1 = (ix + 1) & MASK;
  const r0 = iy * N;
  const r1 = ((iy + 1) & MASK) * N;
  const ux = fx * fx * fx * (fx * (fx * 6 - 15) + 10);
  const uy = fy * fy * fy * (fy * (fy * 6 - 15) + 10);
  const a = TABLE[r0 + ix];
  const b = TABLE[r0 + ix1];
  const c = TABLE[r1 + ix];
  const d = TABLE[r1 + ix1];
  const top = a + (b - a) * ux;
  return top + (c + (d - c) * ux - top) * uy;
}

/** Fractal sum of `octaves` value noises, each ~twice the frequency and `gain` times the amplitude; roughly in [-1, 1]. */
export function fbm(x: number, y: number, seed: number, octaves = 4, gain = 0.5): number {
  let s = 0;
  let amp = 1;
  let norm = 0;
  let f = 1;
  for (let o = 0; o < octaves; o++) {
    s += amp * valueNoise(x * f, y * f, seed + o * 101);
    norm += amp;
    amp *= gain;
    f *= 2.03;
  }
  return s / norm;
}
