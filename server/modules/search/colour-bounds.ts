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
 *     the blue region (h̄' ≈ 275°) or at low chroma (RC small) κ is close to 1.
 * (2) Lightness: |L₂ − L₁| ≤ T·SL((L₁ + L₂)/2); the left side minus the right is increasing in L₂
 *     for T ≤ 30 (SL' < 0.0165 per unit), so the limits are the two roots, found by bisection.
 *     A band with |ΔL| ≥ d leaves only √(T² − (d/SL)²) for the chroma–hue part: lightness is
 *     cut into slabs, each with its own smaller chroma–hue boxes.
 * (3) Chroma: with SC = 1 + 0.0225·(C₁' + C₂'), |C₂' − C₁'| ≤ κT·SC solves to
 *     C₂' ≤ (C₁'(1 + β) + κT)/(1 − β) and C₂' ≥ (C₁'(1 − β) − κT)/(1 + β), β = 0.0225·κT.
 *     Primed and unprimed chroma: C ≤ C' = C·√(s²cos²h + sin²h) ≤ s·C.
 * (4) Hue: |ΔH'| = 2√(C₁'C₂')·|sin(Δh'/2)| ≤ |z|·SH gives |Δh'| ≤ 2·asin(|z|·SH / (2√(C₁'C₂'))).
 *     The map h → h' (stretching a by s ≥ 1) has slope between 1/s and s, and keeps sides
 *     (h + 180° maps to h' + 180°), so the unprimed hue difference is at most s·|Δh'|, same sign.
 * (5) G (so s), RC, SH, T(h̄') and ρ depend on the pair; each is bounded over a ring of band
 *     chroma and over one side (clockwise or counter-clockwise) of the query's hue. The mean
 *     primed hue h̄' is the midpoint of the shorter arc (Sharma et al. eq. 14), so on the band's
 *     side and within half the primed hue difference (never more than 90°): the side away from
 *     275° gets a small ρ. Each pass narrows the hue limit and so ρ and T(h̄'), soundly.
 * (6) Within a ring the chroma difference is at least dmin, so |y| ≥ dmin/SC; the widest |z|
 *     with |y| ≥ ymin inside y² + z² − ρ|y||z| ≤ T² then bounds the hue, and a ring where no z
 *     fits is dropped.
 * Every step uses only facts that hold for any colour within T of q, so the union of the boxes
 * holds all of them. tests/server/search-index.test.ts probes this on the boundary.
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

// Range maxima of T_BIN_MAX over any run of bins in O(1): a sparse table over the bins laid out
// twice (0–719), so an arc across 0° is one run.
const T_SPARSE: number[][] = [[...T_BIN_MAX, ...T_BIN_MAX]];
for (let w = 1; 1 << w <= 720; w++) {
  const prev = T_SPARSE[w - 1]!;
  T_SPARSE.push(prev.map((v, i) => Math.max(v, prev[i + (1 << (w - 1))] ?? -Infinity)));
}
const T_ALL_MAX = Math.max(...T_BIN_MAX);

/** Largest T(h) for h on the arc [from, to] (degrees, to ≥ from); an arc of 359° or more is everything. */
export function maxHueWeight(from: number, to: number) {
  if (to - from >= 359) return T_ALL_MAX;
  const first = ((Math.floor(from) % 360) + 360) % 360;
  const last = first + (Math.floor(to) - Math.floor(from));
  const w = Math.floor(Math.log2(last - first + 1));
  return Math.max(T_SPARSE[w]![first]!, T_SPARSE[w]![last - (1 << w) + 1]!);
}

/** Largest Δθ (degrees) for a mean hue on the arc [from, to]; Δθ peaks at 275° and falls away on both sides. */
function maxDeltaTheta(from: number, to: number) {
  if (to - from >= 360) return 30;
  // Circular distance from 275° to the arc: zero if the arc holds 275° (or 275° + 360k).
  const k = Math.ceil((from - 275) / 360);
  const inside = 275 + 360 * k <= to;
  const d = inside ? 0 : Math.min(circular(from, 275), circular(to, 275));
  return 30 * Math.exp(-((d / 25) ** 2));
}

/** Distance between two hue angles along the circle, 0–180. */
function circular(x: number, y: number) {
  const d = Math.abs((((x - y) % 360) + 360) % 360);
  return d > 180 ? 360 - d : d;
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

type Ring = { cLo: number; cHi: number };
/** +1: band hues counter-clockwise of the query's, −1: clockwise, 0: either. */
type Side = 1 | -1 | 0;
type PairBounds = {
  sMin: number;
  sMax: number;
  c1pMin: number;
  c1pMax: number;
  /** Upper bound of C̄'. */
  cpMeanMax: number;
  rho: number;
  kappa: number;
  /** Upper bound of T(h̄'). */
  tMax: number;
};

/**
 * Bounds of s, C₁', C̄', ρ, κ and T(h̄') over every band whose unprimed chroma lies in the ring
 * and whose primed hue lies on `side` of the query's, at most `primedHalf` degrees away; see (5).
 */
function pairBounds(c1: number, h1: number, ring: Ring, side: Side, primedHalf: number): PairBounds {
  const sMin = sOf((c1 + ring.cHi) / 2);
  const sMax = sOf((c1 + ring.cLo) / 2);
  const c1pMin = c1 * primedRatio(h1, sMin);
  const c1pMax = c1 * primedRatio(h1, sMax);
  const cpMeanMax = (c1pMax + sMax * ring.cHi) / 2;
  // The mean primed hue h̄' (Sharma et al. eq. 14) is the midpoint of the shorter arc between the
  // two primed hues: on the band's side of the query's primed hue, at most half the primed hue
  // difference away (and so never more than 90°). The query's primed hue itself moves
  // monotonically with s, between its values at sMin and sMax. With a neutral query
  // (C₁ = 0) h̄' is the band's own hue: anything.
  let from: number;
  let to: number;
  if (c1 === 0) {
    from = 0;
    to = 360;
  } else {
    const hA = primedHue(h1, sMin);
    const hB = primedHue(h1, sMax);
    let lo = Math.min(hA, hB);
    let hi = Math.max(hA, hB);
    if (hi - lo > 180) [lo, hi] = [hi, lo + 360];
    const reach = Math.min(90, primedHalf / 2);
    from = side === 1 ? lo : lo - reach;
    to = side === -1 ? hi : hi + reach;
  }
  const rho = rcOf(cpMeanMax) * Math.sin(2 * maxDeltaTheta(from, to) * RAD);
  return { sMin, sMax, c1pMin, c1pMax, cpMeanMax, rho, kappa: 1 / Math.sqrt(1 - (rho * rho) / 4), tMax: Math.max(0, maxHueWeight(from, to)) };
}

/**
 * Largest |z| = |ΔH'|/SH when |y| = |ΔC'|/SC ≥ yMin: over |RT| ≤ ρ the set
 * y² + z² + RT·y·z ≤ T² is contained in y² + z² − ρ|y||z| ≤ T². Its widest |z| is κT, reached
 * at |y| = ρκT/2; when that is below yMin the widest |z| sits on |y| = yMin, the larger root of
 * z² − ρ·yMin·z + yMin² − T² = 0. Null when no point of the ring can be within T.
 */
function widestHueTerm(t: number, yMin: number, p: PairBounds): number | null {
  if ((p.rho * p.kappa * t) / 2 >= yMin) return p.kappa * t;
  const disc = p.rho * p.rho * yMin * yMin - 4 * (yMin * yMin - t * t);
  if (disc < 0) return null;
  return (p.rho * yMin + Math.sqrt(disc)) / 2;
}

/**
 * Half-width (degrees, unprimed) of the band hues of a ring on one side of the query's hue, or
 * null when no band of the ring on that side can be within T. From (1), (4) and (5), narrowed
 * a few times: each pass bounds ρ and T(h̄') with the previous pass's (sound) hue limit.
 */
function ringHueHalf(c1: number, h1: number, t: number, ring: Ring, side: Side): number | null {
  let primedHalf = 180;
  let p = pairBounds(c1, h1, ring, side, primedHalf);
  for (let pass = 0; pass < 3; pass++) {
    // The smallest chroma difference between the query and any band of the ring, in SC units.
    const dMin = Math.max(0, ring.cLo - p.c1pMax, p.c1pMin - ring.cHi * p.sMax);
    const z = widestHueTerm(t, dMin / (1 + 0.045 * p.cpMeanMax), p);
    if (z === null) return null;
    if (!(p.c1pMin > 0 && ring.cLo > 0) || !Number.isFinite(p.cpMeanMax)) break;
    const sh = 1 + 0.015 * p.cpMeanMax * p.tMax;
    const sinHalf = (z * sh) / (2 * Math.sqrt(p.c1pMin * ring.cLo));
    if (sinHalf >= 1) break;
    const next = (2 * Math.asin(sinHalf)) / RAD;
    if (next >= primedHalf) break;
    primedHalf = next;
    p = pairBounds(c1, h1, ring, side, primedHalf);
  }
  return Math.min(180, p.sMax * primedHalf);
}

/**
 * Chroma interval of every band within T, from (3). Upper limit: with κ ≤ κmax (ρ at RC = 2)
 * nothing beyond (C₁'max(1 + βmax) + κmax·T)/(1 − βmax) is possible, βmax = 0.0225·κmax·T (for
 * βmax ≥ 1 there is no limit). Below that, a walk up in steps: a step [xa, xb] of primed band
 * chroma is impossible when xa − C₁'max > κ(xb)·T·(1 + 0.0225·(C₁'max + xb)), where κ(xb) uses
 * RC at the largest mean chroma of the step; low-chroma queries get a much smaller κ this way.
 */
function chromaRange(c1: number, h1: number, t: number): Ring {
  const c1pMax = pairBounds(c1, h1, { cLo: 0, cHi: Infinity }, 0, 180).c1pMax;
  const sinTwoTheta = Math.sin(2 * maxDeltaTheta(...meanArcAll(c1, h1)) * RAD);
  const kappaOf = (rc: number) => 1 / Math.sqrt(1 - (rc * sinTwoTheta) ** 2 / 4);
  const betaMax = 0.0225 * kappaOf(2) * t;
  let cHi = Infinity;
  if (betaMax < 1) {
    const beyond = (c1pMax * (1 + betaMax) + kappaOf(2) * t) / (1 - betaMax);
    const step = Math.max(0.25, t / 16);
    cHi = c1pMax;
    for (let xa = c1pMax; xa < beyond; xa += step) {
      const xb = Math.min(xa + step, beyond);
      if (xa - c1pMax <= kappaOf(rcOf((c1pMax + xb) / 2)) * t * (1 + 0.0225 * (c1pMax + xb))) cHi = xb;
    }
  }
  // Lower limit: the closed form of (3) with κ bounded over [0, cHi].
  const p = pairBounds(c1, h1, { cLo: 0, cHi }, 0, 180);
  const k = p.kappa * t;
  const beta = 0.0225 * k;
  const cLo = Math.max(0, (p.c1pMin * (1 - beta) - k) / (1 + beta)) / p.sMax;
  return { cLo, cHi };
}

/** The arc of possible mean primed hues when nothing is known of the band's hue. */
function meanArcAll(c1: number, h1: number): [number, number] {
  if (c1 === 0) return [0, 360];
  const hA = primedHue(h1, 1);
  const hB = primedHue(h1, 1.5);
  let lo = Math.min(hA, hB);
  let hi = Math.max(hA, hB);
  if (hi - lo > 180) [lo, hi] = [hi, lo + 360];
  return [lo - 90, hi + 90];
}

/**
 * At most this many chroma rings, each at least MIN_RING wide: finer than the index's cells
 * only trims rows, so small searches use fewer, cheaper boxes.
 */
const RINGS = 8;
const MIN_RING = 2.5;
/** Lightness slabs, as fractions of the largest |ΔL| on each side, once the range spans 2 cells. */
const SLABS = [0, 0.5, 0.75, 0.9, 1];
const SLAB_FROM = 10;

type ChromaHueBox = Omit<ColourBox, "lMin" | "lMax">;

/** Boxes in (C*, h) for bands within `t` in the chroma–hue part of ΔE2000 (Q ≤ t²). */
function chromaHueBoxes(c1: number, h1: number, t: number): ChromaHueBox[] {
  const range = chromaRange(c1, h1, t);
  if (!(range.cHi >= range.cLo)) return [];
  const rings: Ring[] = [];
  if (Number.isFinite(range.cHi) && range.cHi > range.cLo) {
    const n = Math.min(RINGS, Math.max(1, Math.ceil((range.cHi - range.cLo) / MIN_RING)));
    for (let i = 0; i < n; i++) {
      rings.push({ cLo: range.cLo + ((range.cHi - range.cLo) * i) / n, cHi: range.cLo + ((range.cHi - range.cLo) * (i + 1)) / n });
    }
  } else {
    rings.push(range);
  }
  const boxes: ChromaHueBox[] = [];
  for (const ring of rings) {
    const ccw = ringHueHalf(c1, h1, t, ring, 1);
    const cw = ringHueHalf(c1, h1, t, ring, -1);
    if (ccw === null && cw === null) continue;
    const cMin = Math.max(0, ring.cLo - SLACK);
    // Unbounded above (large thresholds): any chroma, written as a finite number for SQL and JSON.
    const cMax = Number.isFinite(ring.cHi) ? ring.cHi + SLACK : 1e9;
    const from = h1 - (cw ?? 0) - SLACK;
    const to = h1 + (ccw ?? 0) + SLACK;
    if (to - from >= 360 || c1 === 0) {
      boxes.push({ cMin, cMax, hMin: 0, hMax: 360 });
    } else if (from < 0) {
      boxes.push({ cMin, cMax, hMin: 0, hMax: to });
      boxes.push({ cMin, cMax, hMin: from + 360, hMax: 360 });
    } else if (to > 360) {
      boxes.push({ cMin, cMax, hMin: from, hMax: 360 });
      boxes.push({ cMin, cMax, hMin: 0, hMax: to - 360 });
    } else {
      boxes.push({ cMin, cMax, hMin: from, hMax: to });
    }
  }
  return boxes;
}

/**
 * Boxes in (L*, C*ab, h_ab) holding every colour within ΔE2000 `t` of `q`.
 * Hue intervals that cross 0° are split in two; a full circle is [0, 360].
 * Lightness is cut into slabs: a band at |ΔL| ≥ d has only √(t² − (d/SL)²) left for chroma and
 * hue, so the outer slabs get smaller chroma–hue boxes.
 */
export function colourBoxes(q: Lab, t: number): ColourBox[] {
  if (!(t > 0)) throw new RangeError("the threshold must be positive");
  const [lLo, lHi] = lightnessRange(q.l, t);
  const c1 = chroma(q.a, q.b);
  const h1 = hueDeg(q.a, q.b);
  const boxes: ColourBox[] = [];
  const add = (lMin: number, lMax: number, tEff: number) => {
    for (const b of chromaHueBoxes(c1, h1, tEff)) boxes.push({ lMin, lMax, ...b });
  };
  const down = q.l - lLo;
  const up = lHi - q.l;
  if (down + up < SLAB_FROM) {
    add(lLo, lHi, t);
    return boxes;
  }
  add(q.l - SLABS[1]! * down, q.l + SLABS[1]! * up, t);
  for (let i = 1; i + 1 < SLABS.length; i++) {
    for (const side of [-1, 1] as const) {
      const extent = side < 0 ? down : up;
      const near = q.l + side * SLABS[i]! * extent;
      const far = q.l + side * SLABS[i + 1]! * extent;
      // In this slab |ΔL| ≥ SLABS[i]·extent; SL is largest at one end of its mean-lightness range.
      const dL = Math.max(0, SLABS[i]! * extent - SLACK);
      const sl = Math.max(slOf((q.l + near) / 2), slOf((q.l + far) / 2));
      const left = t * t - (dL / sl) ** 2;
      if (left <= 0) continue;
      const [lMin, lMax] = side < 0 ? [far, near] : [near, far];
      add(lMin - SLACK, lMax + SLACK, Math.sqrt(left));
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
