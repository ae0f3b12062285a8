// Optimal 1-D segmentation of a colour profile into bands (flat) and transitions (blends) by
// dynamic programming with a penalty per band. See docs/decisions/002-strip-segmentation.md.
import { deltaE2000, type Lab } from "../../shared/colour/index";
import { D65_WHITE, SRGB_TO_XYZ, XYZ_TO_SRGB, labFFast, labToXyz, mulVec3 } from "./srgb-lab";
import { blendResidual, labToDensity, type Density } from "../../shared/colour/blend";

export type Segment = { from: number; to: number }; // sample indices, [from, to)

export type SegmentParams = {
  /**
   * Cost of each band, in ΔE*ab² units per 100 profile samples (so the choice does not depend on
   * how many samples the strip was read at).
   */
  beta: number;
  /** Cost of each transition sample, in ΔE*ab² units: keeps flat stretches from being called ramps. */
  gamma: number;
  maxBands: number;
  /** Shortest band, as a share of the profile. */
  minBandShare: number;
  /**
   * Longest transition, as a share of the profile. Blends on a strip are short; without a cap a
   * long straight "blend" could stand in for a staircase of several flat bands.
   */
  maxTransitionShare: number;
  /**
   * Largest RMS distance (ΔE*ab) of a transition's samples from the blend it stands for. A real
   * blend follows the mixing path within the noise; a staircase of flat patches (a grey scale) does
   * not, however long — so long blends can be allowed without swallowing a staircase.
   */
  maxTransitionRms: number;
  /** Longest unread stretch at either end, as a share of the profile. */
  maxMarginShare: number;
  /** Profile noise (per channel, ΔE units) that the costs are tuned for; more noise scales costs down. */
  referenceSigma: number;
};

export const DEFAULT_SEGMENT_PARAMS: SegmentParams = {
  beta: 300,
  gamma: 2,
  maxBands: 6,
  minBandShare: 0.03,
  maxTransitionShare: 0.9,
  maxTransitionRms: 6,
  maxMarginShare: 0.02,
  referenceSigma: 0.6,
};

export type SegmentResult = {
  bands: Segment[];
  /** Penalised cost of the best segmentation with k bands, k = 1..maxBands (Infinity if impossible). */
  costByCount: number[];
  /** Estimated per-channel noise of the profile. */
  sigma: number;
};

/** Robust per-channel noise from first differences (median of squared step / 2 per channel). */
export function profileNoise(lab: Float64Array, n: number): number {
  if (n < 3) return 0;
  const d: number[] = [];
  for (let i = 1; i < n; i++) {
    const dl = lab[i * 3] - lab[i * 3 - 3];
    const da = lab[i * 3 + 1] - lab[i * 3 - 2];
    const db = lab[i * 3 + 2] - lab[i * 3 - 1];
    d.push(dl * dl + da * da + db * db);
  }
  d.sort((a, b) => a - b);
  // For Gaussian noise, |Δ|² is 2σ²·χ²(3), whose median is about 2.366 σ².
  return Math.sqrt(d[d.length >> 1] / (2 * 2.366));
}

export class PrefixSums {
  readonly s1: Float64Array;
  readonly s2: Float64Array;
  readonly st: Float64Array;
  constructor(lab: Float64Array, n: number) {
    this.s1 = new Float64Array((n + 1) * 3);
    this.s2 = new Float64Array(n + 1);
    this.st = new Float64Array((n + 1) * 3);
    for (let i = 0; i < n; i++) {
      let sq = 0;
      for (let c = 0; c < 3; c++) {
        const x = lab[i * 3 + c];
        this.s1[(i + 1) * 3 + c] = this.s1[i * 3 + c] + x;
        this.st[(i + 1) * 3 + c] = this.st[i * 3 + c] + i * x;
        sq += x * x;
      }
      this.s2[i + 1] = this.s2[i] + sq;
    }
  }

  /** Sum of squared distances to the segment mean (flat fit). */
  flat(i: number, j: number): number {
    const n = j - i;
    if (n <= 1) return 0;
    let sse = this.s2[j] - this.s2[i];
    for (let c = 0; c < 3; c++) {
      const s = this.s1[j * 3 + c] - this.s1[i * 3 + c];
      sse -= (s * s) / n;
    }
    return Math.max(0, sse);
  }

  /**
   * Sum of squared distances from a straight blend between the colour just before i (mean of
   * `w` samples) and the colour at j onwards: a transition must lead from one band to the next.
   */
  bridge(i: number, j: number, n: number, w: number): number {
    const m = j - i;
    if (m <= 0) return 0;
    const a0 = Math.max(0, i - w);
    const b1 = Math.min(n, j + w);
    let sse = this.s2[j] - this.s2[i];
    const k2 = (m * (m + 1) * (2 * m + 1)) / 6 / ((m + 1) * (m + 1));
    for (let c = 0; c < 3; c++) {
      const A = i > a0 ? (this.s1[i * 3 + c] - this.s1[a0 * 3 + c]) / (i - a0) : this.s1[(i + 1) * 3 + c] - this.s1[i * 3 + c];
      const B = b1 > j ? (this.s1[b1 * 3 + c] - this.s1[j * 3 + c]) / (b1 - j) : this.s1[j * 3 + c] - this.s1[(j - 1) * 3 + c];
      const D = B - A;
      const S1 = this.s1[j * 3 + c] - this.s1[i * 3 + c];
      const ST = this.st[j * 3 + c] - this.st[i * 3 + c];
      const weighted = (ST - (i - 1) * S1 - (A * m * (m + 1)) / 2) / (m + 1);
      sse += -2 * A * S1 + m * A * A - 2 * D * weighted + D * D * k2;
    }
    return Math.max(0, sse);
  }

  /** Sum of squared residuals of the best straight line through the segment, per channel. */
  ramp(i: number, j: number): number {
    const n = j - i;
    if (n <= 2) return 0;
    // Σt and Σt² over t = i..j-1.
    const st = ((i + j - 1) * n) / 2;
    const stt = ((j - 1) * j * (2 * j - 1) - (i - 1) * i * (2 * i - 1)) / 6;
    const vt = stt - (st * st) / n;
    let sse = this.s2[j] - this.s2[i];
    for (let c = 0; c < 3; c++) {
      const sx = this.s1[j * 3 + c] - this.s1[i * 3 + c];
      const stx = this.st[j * 3 + c] - this.st[i * 3 + c];
      const cov = stx - (st * sx) / n;
      sse -= (sx * sx) / n + (vt > 0 ? (cov * cov) / vt : 0);
    }
    return Math.max(0, sse);
  }
}

/**
 * SSE (in CIELAB) of a blend that is straight in optical density between the mean colour of the
 * w samples before i and of the w samples from j on: dye laid over dye multiplies reflectance
 * (Beer–Lambert), so layered blends are straight in density and curved in CIELAB.
 * Returned as table[i * (maxT + 1) + (j − i)] for 1 ≤ j − i ≤ maxT.
 */
function densityBridgeTable(lab: Float64Array, n: number, w: number, maxT: number): Float64Array {
  const table = new Float64Array((n + 1) * (maxT + 1)).fill(Infinity);
  const mean = (from: number, to: number) => {
    const m = [0, 0, 0];
    for (let t = from; t < to; t++) for (let c = 0; c < 3; c++) m[c] += lab[t * 3 + c] / (to - from);
    return m;
  };
  const dens: Density[] = [];
  for (let j = 0; j < n; j++) {
    const m = mean(j, Math.min(n, j + w));
    dens.push(labToDensity({ l: m[0], a: m[1], b: m[2] }));
  }
  for (let i = 1; i < n; i++) {
    const a = mean(Math.max(0, i - w), i);
    const dA = labToDensity({ l: a[0], a: a[1], b: a[2] });
    for (let m = 1; m <= maxT && i + m < n; m++) {
      // The shared blend model (shared/colour/blend.ts): samples i … i+m−1 against it.
      table[i * (maxT + 1) + m] = blendResidual(dA, dens[i + m]!, m, lab, i);
    }
  }
  return table;
}

/**
 * The same as densityBridgeTable for a blend straight in linear reflectance: ink laid as a
 * pattern of dots or sponge texture, where what blends is the area covered, not the layer
 * thickness (decision 009; the third path decision 002 left room for).
 */
function reflectanceBridgeTable(lab: Float64Array, n: number, w: number, maxT: number): Float64Array {
  const table = new Float64Array((n + 1) * (maxT + 1)).fill(Infinity);
  const mean = (from: number, to: number) => {
    const m = [0, 0, 0];
    for (let t = from; t < to; t++) for (let c = 0; c < 3; c++) m[c] += lab[t * 3 + c] / (to - from);
    return m;
  };
  const dens = new Float64Array(n * 3);
  for (let j = 0; j < n; j++) {
    const m = mean(j, Math.min(n, j + w));
    dens.set(labToDensity({ l: m[0], a: m[1], b: m[2] }), j * 3);
  }
  // sRGB → XYZ rows, divided by the white's X and Z (CIELAB's X/Xn, Z/Zn).
  const M = SRGB_TO_XYZ;
  const xr = M[0] / D65_WHITE[0], xg = M[1] / D65_WHITE[0], xb = M[2] / D65_WHITE[0];
  const yr = M[3], yg = M[4], yb = M[5];
  const zr = M[6] / D65_WHITE[2], zg = M[7] / D65_WHITE[2], zb = M[8] / D65_WHITE[2];
  for (let i = 1; i < n; i++) {
    const a = mean(Math.max(0, i - w), i);
    const dA = labToDensity({ l: a[0], a: a[1], b: a[2] });
    for (let m = 1; m <= maxT && i + m < n; m++) {
      const o = (i + m) * 3;
      // Reflectance at t = i is exp(−((1 − f)·dA + f·dB)) with f = 1/(m + 1); each step multiplies it by q.
      const ra = Math.exp(-dA[0]);
      const ga = Math.exp(-dA[1]);
      const ba = Math.exp(-dA[2]);
      const qr = (Math.exp(-dens[o]!) - ra) / (m + 1);
      const qg = (Math.exp(-dens[o + 1]!) - ga) / (m + 1);
      const qb = (Math.exp(-dens[o + 2]!) - ba) / (m + 1);
      let r = ra + qr;
      let g = ga + qg;
      let b = ba + qb;
      let sse = 0;
      for (let t = i; t < i + m; t++) {
        const fx = labFFast(xr * r + xg * g + xb * b);
        const fy = labFFast(yr * r + yg * g + yb * b);
        const fz = labFFast(zr * r + zg * g + zb * b);
        const dl = lab[t * 3]! - (116 * fy - 16);
        const da = lab[t * 3 + 1]! - 500 * (fx - fy);
        const db = lab[t * 3 + 2]! - 200 * (fy - fz);
        sse += dl * dl + da * da + db * db;
        r += qr;
        g += qg;
        b += qb;
      }
      table[i * (maxT + 1) + m] = sse;
    }
  }
  return table;
}

/**
 * Minimises Σ bands (flat SSE + β) + Σ transitions (SSE from a blend between the neighbouring
 * bands, straight in CIELAB or in optical density, whichever fits better, + γ·length) + end margins (free line SSE + γ·length) over all layouts
 * margin · band · (transition · band)* · margin with 1..maxBands bands.
 * O(maxBands · n²) plus O(n · maxTransition²) for the density blends.
 */
export function segmentProfile(lab: Float64Array, n: number, params: SegmentParams = DEFAULT_SEGMENT_PARAMS): SegmentResult {
  const sigma = profileNoise(lab, n);
  const scale = Math.max(1, (sigma / params.referenceSigma) ** 2);
  const ps = new PrefixSums(lab, n);
  const minBand = Math.max(3, Math.round(params.minBandShare * n));
  const maxMargin = Math.max(1, Math.round(params.maxMarginShare * n));
  const maxTransition = Math.max(1, Math.round(params.maxTransitionShare * n));
  const K = params.maxBands;
  const beta = (params.beta * n) / 100;
  const flat = (i: number, j: number) => ps.flat(i, j) / scale + beta;
  const ramp = (i: number, j: number) => (j > i ? ps.ramp(i, j) / scale + params.gamma * (j - i) : 0);
  // Each end of a transition is anchored on the mean of a shortest-band's worth of samples, all
  // inside the neighbouring bands, so a band cannot cheat by ending on a few samples of the next.
  const dTable = densityBridgeTable(lab, n, minBand, maxTransition);
  const rTable = reflectanceBridgeTable(lab, n, minBand, maxTransition);
  const maxSse = (len: number) => len * Math.max(params.maxTransitionRms, 3 * sigma) ** 2;
  const bridge = (i: number, j: number) => {
    if (j <= i) return 0;
    const k = i * (maxTransition + 1) + (j - i);
    const sse = Math.min(ps.bridge(i, j, n, minBand), dTable[k], rTable[k]);
    return sse > maxSse(j - i) ? Infinity : sse / scale + params.gamma * (j - i);
  };

  // B[k][j]: best cost of [0, j) whose last segment is band k ending at j.
  // T[k][j]: best cost of [0, j) after band k and a (possibly empty) transition ending at j.
  const B = Array.from({ length: K + 1 }, () => new Float64Array(n + 1).fill(Infinity));
  const T = Array.from({ length: K + 1 }, () => new Float64Array(n + 1).fill(Infinity));
  const bFrom = Array.from({ length: K + 1 }, () => new Int32Array(n + 1).fill(-1));
  const tFrom = Array.from({ length: K + 1 }, () => new Int32Array(n + 1).fill(-1));

  // A band's and a transition's costs do not depend on how many bands come before them: work
  // each out once, not once per band count.
  const flatCost = new Float64Array((n + 1) * (n + 1));
  for (let j = minBand; j <= n; j++) for (let i = 0; i <= j - minBand; i++) flatCost[i * (n + 1) + j] = flat(i, j);
  const W = maxTransition + 1;
  const bridgeCost = new Float64Array((n + 1) * W);
  for (let j = 0; j <= n; j++) for (let i = Math.max(0, j - maxTransition); i < j; i++) bridgeCost[j * W + (j - i)] = bridge(i, j);

  for (let k = 1; k <= K; k++) {
    const prev = T[k - 1]!;
    for (let j = minBand; j <= n; j++) {
      let best = Infinity;
      let arg = -1;
      for (let i = 0; i <= j - minBand; i++) {
        const before = k === 1 ? (i <= maxMargin ? ramp(0, i) : Infinity) : prev[i]!;
        if (before === Infinity) continue;
        const c = before + flatCost[i * (n + 1) + j]!;
        if (c < best) {
          best = c;
          arg = i;
        }
      }
      B[k][j] = best;
      bFrom[k][j] = arg;
    }
    const Bk = B[k]!;
    for (let j = 0; j <= n; j++) {
      let best = Bk[j]!;
      let arg = j;
      for (let i = Math.max(0, j - maxTransition); i < j; i++) {
        if (Bk[i] === Infinity) continue;
        const c = Bk[i]! + bridgeCost[j * W + (j - i)]!;
        if (c < best) {
          best = c;
          arg = i;
        }
      }
      T[k][j] = best;
      tFrom[k][j] = arg;
    }
  }

  const costByCount: number[] = [];
  const endOf: number[] = [];
  for (let k = 1; k <= K; k++) {
    let best = Infinity;
    let arg = -1;
    for (let j = Math.max(0, n - maxMargin); j <= n; j++) {
      const c = B[k][j] + ramp(j, n);
      if (c < best) {
        best = c;
        arg = j;
      }
    }
    costByCount.push(best);
    endOf.push(arg);
  }
  let bestK = 1;
  for (let k = 2; k <= K; k++) if (costByCount[k - 1] < costByCount[bestK - 1]) bestK = k;
  if (costByCount[bestK - 1] === Infinity) return { bands: [{ from: 0, to: n }], costByCount, sigma };

  const bands: Segment[] = [];
  let j = endOf[bestK - 1];
  for (let k = bestK; k >= 1; k--) {
    const i = bFrom[k][j];
    bands.push({ from: i, to: j });
    if (k > 1) j = tFrom[k - 1][i];
  }
  bands.reverse();
  return { bands, costByCount, sigma };
}

/**
 * How far (ΔE2000) a colour is from every mix of two inks: the blend straight in optical density
 * (dye over dye) and straight in linear reflectance (area coverage), 41 steps each. A short band
 * that sits on that path is the middle of a blend between its neighbours, not an ink of its own
 * (issue 11: "the band count is the ink count").
 */
export function distanceFromMix(c: Lab, a: Lab, b: Lab): number {
  const lin = (x: Lab) => mulVec3(XYZ_TO_SRGB, labToXyz(x.l, x.a, x.b)).map((v) => Math.max(1e-4, v));
  const ra = lin(a);
  const rb = lin(b);
  let best = Infinity;
  for (let k = 0; k <= 40; k++) {
    const f = k / 40;
    for (const mode of [0, 1]) {
      const rgb = ra.map((va, ch) => (mode === 0 ? Math.exp((1 - f) * Math.log(va) + f * Math.log(rb[ch])) : (1 - f) * va + f * rb[ch]));
      const xyz = mulVec3(SRGB_TO_XYZ, rgb);
      const fx = labFFast(xyz[0] / D65_WHITE[0]);
      const fy = labFFast(xyz[1]);
      const fz = labFFast(xyz[2] / D65_WHITE[2]);
      best = Math.min(best, deltaE2000(c, { l: 116 * fy - 16, a: 500 * (fx - fy), b: 200 * (fy - fz) }));
    }
  }
  return best;
}
