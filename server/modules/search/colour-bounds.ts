import type { Lab } from "../../../shared/colour";

/**
 * The pre-filter of the colour index: for a query colour q and a threshold T, boxes in
 * (L*, C*ab, h_ab) that contain every colour p with ΔE2000(q, p) ≤ T. A box may hold colours
 * farther than T (exact ΔE2000 then decides); it must never leave one out.
 *
 * Symbols follow Sharma, Wu & Dalal (2005), "The CIEDE2000 color-difference formula:
 * implementation notes, supplementary test data and mathematical observations", Color Res.
 * Appl. 30(1) 21–30, eqs. (1)–(22), with kL = kC = kH = 1:
 *   ΔE² = (ΔL'/SL)² + y² + z² + RT·y·z,   y = ΔC'/SC,  z = ΔH'/SH,
 *   a' = s·a with s = 1 + G the same for both colours (G from the mean unprimed chroma C̄),
 *   SC = 1 + 0.045·C̄',  SH = 1 + 0.015·C̄'·T(h̄'),  RT = −sin(2Δθ)·RC,
 *   Δθ = 30·exp(−((h̄' − 275)/25)²) degrees,  RC = 2·√(C̄'⁷ / (C̄'⁷ + 25⁷)).
 * The derivation is written out in docs/decisions/004-colour-search-index.md; in short:
 *
 * (1) y² + z² + RT·y·z = (z + RT·y/2)² + (1 − RT²/4)·y² ≥ (1 − ρ²/4)·y² whenever |RT| ≤ ρ < 2,
 *     and the same with y and z swapped. So ΔE ≤ T gives |ΔL'| ≤ T·SL, |ΔC'| ≤ κT·SC and
 *     |ΔH'| ≤ κT·SH with κ = 1/√(1 − ρ²/4). Everywhere |RT| < 2·sin 60° = √3, so κ ≤ 2; far from
 *     the blue region (h̄' ≈ 275°) Δθ is tiny and κ is close to 1.
 * (2) Lightness: |L₂ − L₁| ≤ T·SL((L₁ + L₂)/2); the left side minus the right is increasing in L₂
 *     for T ≤ 30 (SL' < 0.0165 per unit), so the limits are the two roots, found by bisection.
 * (3) Chroma: with SC = 1 + 0.0225·(C₁' + C₂'), |C₂' − C₁'| ≤ κT·SC solves to
 *     C₂' ≤ (C₁'(1 + β) + κT)/(1 − β) and C₂' ≥ (C₁'(1 − β) − κT)/(1 + β), β = 0.0225·κT.
 *     Primed and unprimed chroma: C ≤ C' = C·√(s²cos²h + sin²h) ≤ s·C.
 * (4) Hue: |ΔH'| = 2√(C₁'C₂')·|sin(Δh'/2)| ≤ κT·SH gives |Δh'| ≤ 2·asin(κT·SH / (2√(C₁'C₂'))).
 *     The map h → h' (stretching a by s ≥ 1) has slope between 1/s and s, so the unprimed hue
 *     difference is at most s·|Δh'|.
 * (5) G, RC, SH and ρ depend on the pair; each is bounded over the current chroma and hue
 *     intervals, and the intervals are narrowed again with the new bounds a few times. Every
 *     step uses only facts that hold for any colour within T, so every narrowing is sound.
 * Finally the chroma interval is cut into rings: the hue limit of a ring uses that ring's
 * smallest chroma and largest mean chroma, which hugs the fan shape of the true region.
 */

export type ColourBox = { lMin: number; lMax: number; cMin: number; cMax: number; hMin: number; hMax: number };

const RAD = Math.PI / 180;
const POW25_7 = 25 ** 7;
/** Absolute slack added to every limit: covers rounding differences between SQLite and JS. */
const SLACK = 1e-6;

const chroma = (a: number, b: number) => Math.sqrt(a * a + b * b);
const hueDeg = (a: number, b: number) => {
  if (a === 0 && b === 0) return 0;
  const h = Math.atan2(b, a) / RAD;
  return h < 0 ? h + 360 : h;
};

/** s = 1 + G for a mean unprimed chroma; decreasing in C̄, 1.5 at 0, → 1 at ∞. */
function sOf(cMean: number) {
  if (!Number.isFinite(cMean)) return 1;
  const c7 = cMean ** 7;
  return 1 + 0.5 * (1 - Math.sqrt(c7 / (c7 + POW25_7)));
}

/** RC for a mean primed chroma; increasing, → 2. */
function rcOf(cpMean: number) {
  if (!Number.isFinite(cpMean)) return 2;
  const c7 = cpMean ** 7;
  return 2 * Math.sqrt(c7 / (c7 + POW25_7));
}

/** SL for a mean lightness. */
export function slOf(lMean: number) {
  const u = (lMean - 50) ** 2;
  return 1 + (0.015 * u) / Math.sqrt(20 + u);
}

/** The CIEDE2000 hue weighting function T(h̄'), eq. (15) of Sharma et al. (2005). */
export function hueWeight(h: number) {
  return (
    1 -
    0.17 * Math.cos((h - 30) * RAD) +
    0.24 * Math.cos(2 * h * RAD) +
    0.32 * Math.cos((3 * h + 6) * RAD) -
    0.2 * Math.cos((4 * h - 63) * RAD)
  );
}

// Upper bounds of T(h) on each whole-degree bin [k, k + 1]. |dT/dh| ≤ (0.17 + 2·0.24 + 3·0.32 +
// 4·0.20)·π/180 < 0.0421 per degree, so a sample every 0.1° plus 0.0421·0.05 bounds the bin.
const T_BIN_MAX = Array.from({ length: 360 }, (_, k) => {
  let m = -Infinity;
  for (let i = 0; i <= 10; i++) m = Math.max(m, hueWeight(k + i / 10));
  return m + 0.0421 * 0.05 + 1e-9;
});

/** Circular interval [centre − half, centre + half] in degrees; half ≥ 180 is the full circle. */
function forEachBin(centre: number, half: number, visit: (bin: number) => void) {
  if (half >= 180) {
    for (let k = 0; k < 360; k++) visit(k);
    return;
  }
  const from = Math.floor(centre - half);
  const to = Math.floor(centre + half);
  for (let k = from; k <= to; k++) visit(((k % 360) + 360) % 360);
}

function maxHueWeight(centre: number, half: number) {
  let m = -Infinity;
  forEachBin(centre, half, (k) => (m = Math.max(m, T_BIN_MAX[k]!)));
  return m;
}

/** Largest Δθ (degrees) for a mean hue within the circular interval; Δθ peaks at 275°. */
function maxDeltaTheta(centre: number, half: number) {
  if (half >= 180) return 30;
  let d = Math.abs((((275 - centre) % 360) + 540) % 360 - 180); // circular distance to 275°
  d = Math.max(0, d - half);
  return 30 * Math.exp(-((d / 25) ** 2));
}

/** Primed hue of a colour with unprimed hue h (degrees) when a is stretched by s. */
function primedHue(h: number, s: number) {
  return hueDeg(s * Math.cos(h * RAD), Math.sin(h * RAD));
}

/** √(s²cos²h + sin²h): primed chroma over unprimed chroma, between 1 and s. */
function primedRatio(h: number, s: number) {
  const c = Math.cos(h * RAD);
  const sn = Math.sin(h * RAD);
  return Math.sqrt(s * s * c * c + sn * sn);
}

/** Limits of L₂ with |L₂ − L₁| ≤ T·SL((L₁ + L₂)/2); see (2). */
export function lightnessRange(l1: number, t: number): [number, number] {
  const root = (dir: 1 | -1) => {
    const g = (l2: number) => dir * (l2 - l1) - t * slOf((l1 + l2) / 2);
    let lo = l1;
    let hi = l1 + dir * 2 * t;
    while (g(hi) <= 0) hi = l1 + (hi - l1) * 2;
    for (let i = 0; i < 60; i++) {
      const mid = (lo + hi) / 2;
      if (g(mid) <= 0) lo = mid;
      else hi = mid;
    }
    return hi; // the side where g > 0: just outside the root
  };
  return [root(-1) - SLACK, root(1) + SLACK];
}

type Intervals = { cLo: number; cHi: number; primedHalf: number };

/**
 * Bounds of s, κ and C̄' for colours whose unprimed chroma lies in [cLo, cHi] and whose primed hue
 * lies within primedHalf of the query's; see (5).
 */
function pairBounds(c1: number, h1: number, t: number, v: Intervals) {
  const sMin = sOf((c1 + v.cHi) / 2);
  const sMax = sOf((c1 + v.cLo) / 2);
  const cpMeanMax = (sMax * (c1 + v.cHi)) / 2;
  // The query's own primed hue moves with s (monotonically); the mean primed hue lies within
  // half of the primed hue difference of it (midpoint of the shorter arc, Sharma et al. eq. 14).
  const hA = primedHue(h1, sMin);
  const hB = primedHue(h1, sMax);
  let spread = Math.abs(hA - hB);
  if (spread > 180) spread = 360 - spread;
  const centre = spread === Math.abs(hA - hB) ? (hA + hB) / 2 : (hA + hB + 360) / 2;
  const meanHalf = v.primedHalf >= 180 ? 180 : spread / 2 + v.primedHalf / 2;
  const rho = rcOf(cpMeanMax) * Math.sin(2 * maxDeltaTheta(centre, meanHalf) * RAD);
  const kappa = 1 / Math.sqrt(1 - (rho * rho) / 4);
  const tMax = maxHueWeight(centre, meanHalf);
  return { sMin, sMax, cpMeanMax, kappa, tMax };
}

/** Chroma interval from (3). */
function chromaRange(c1: number, h1: number, t: number, v: Intervals, p: ReturnType<typeof pairBounds>) {
  const k = p.kappa * t;
  const beta = 0.0225 * k;
  const c1pMax = c1 * primedRatio(h1, p.sMax);
  const c1pMin = c1 * primedRatio(h1, p.sMin);
  const hi = beta < 1 ? (c1pMax * (1 + beta) + k) / (1 - beta) : Infinity;
  const lo = Math.max(0, (c1pMin * (1 - beta) - k) / (1 + beta)) / p.sMax;
  return { cLo: Math.max(v.cLo, lo), cHi: Math.min(v.cHi, hi) };
}

/** Half-width of the primed hue difference for band chroma ≥ cLo, from (4). */
function primedHueHalf(c1: number, t: number, cLo: number, p: ReturnType<typeof pairBounds>) {
  if (!(c1 > 0 && cLo > 0) || !Number.isFinite(p.cpMeanMax)) return 180;
  const sh = 1 + 0.015 * p.cpMeanMax * Math.max(p.tMax, 0);
  const sinHalf = (p.kappa * t * sh) / (2 * Math.sqrt(c1 * cLo));
  return sinHalf >= 1 ? 180 : (2 * Math.asin(sinHalf)) / RAD;
}

const RINGS = 4;

/**
 * Boxes in (L*, C*ab, h_ab) holding every colour within ΔE2000 `t` of `q`.
 * Hue intervals that cross 0° are split in two; a full circle is [0, 360].
 */
export function colourBoxes(q: Lab, t: number): ColourBox[] {
  if (!(t > 0)) throw new RangeError("the threshold must be positive");
  const [lMin, lMax] = lightnessRange(q.l, t);
  const c1 = chroma(q.a, q.b);
  const h1 = hueDeg(q.a, q.b);

  let v: Intervals = { cLo: 0, cHi: Infinity, primedHalf: 180 };
  for (let i = 0; i < 4; i++) {
    const p = pairBounds(c1, h1, t, v);
    const c = chromaRange(c1, h1, t, v, p);
    const next = { ...v, ...c };
    next.primedHalf = Math.min(v.primedHalf, primedHueHalf(c1, t, next.cLo, pairBounds(c1, h1, t, next)));
    v = next;
  }

  // Rings of chroma, each with its own hue limit.
  const edges: number[] = [v.cLo];
  if (Number.isFinite(v.cHi) && v.cHi > v.cLo) {
    for (let i = 1; i <= RINGS; i++) edges.push(v.cLo + ((v.cHi - v.cLo) * i) / RINGS);
  } else {
    edges.push(v.cHi);
  }
  const boxes: ColourBox[] = [];
  for (let i = 0; i + 1 < edges.length; i++) {
    const ring: Intervals = { cLo: edges[i]!, cHi: edges[i + 1]!, primedHalf: v.primedHalf };
    const p = pairBounds(c1, h1, t, ring);
    const primedHalf = Math.min(v.primedHalf, primedHueHalf(c1, t, ring.cLo, p));
    const half = Math.min(180, p.sMax * primedHalf);
    const cMin = Math.max(0, ring.cLo - SLACK);
    const cMax = ring.cHi + SLACK;
    if (half >= 180 - SLACK) {
      boxes.push({ lMin, lMax, cMin, cMax, hMin: 0, hMax: 360 });
      continue;
    }
    const from = h1 - half - SLACK;
    const to = h1 + half + SLACK;
    if (from < 0) {
      boxes.push({ lMin, lMax, cMin, cMax, hMin: 0, hMax: to });
      boxes.push({ lMin, lMax, cMin, cMax, hMin: from + 360, hMax: 360 });
    } else if (to > 360) {
      boxes.push({ lMin, lMax, cMin, cMax, hMin: from, hMax: 360 });
      boxes.push({ lMin, lMax, cMin, cMax, hMin: 0, hMax: to - 360 });
    } else {
      boxes.push({ lMin, lMax, cMin, cMax, hMin: from, hMax: to });
    }
  }
  return boxes;
}

/** True when a colour lies in one of the boxes (the same test the index runs in SQL). */
export function inBoxes(boxes: ColourBox[], p: Lab) {
  const c = chroma(p.a, p.b);
  const h = hueDeg(p.a, p.b);
  return boxes.some((b) => p.l >= b.lMin && p.l <= b.lMax && c >= b.cMin && c <= b.cMax && h >= b.hMin && h <= b.hMax);
}
