// Optimal 1-D segmentation of a colour profile into bands (flat) and transitions (ramps) by
// dynamic programming with a penalty per band. See docs/decisions/002-strip-segmentation.md.

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
  /** Longest unread stretch at either end, as a share of the profile. */
  maxMarginShare: number;
  /** Profile noise (per channel, ΔE units) that the costs are tuned for; more noise scales costs down. */
  referenceSigma: number;
};

export const DEFAULT_SEGMENT_PARAMS: SegmentParams = {
  beta: 150,
  gamma: 6,
  maxBands: 6,
  minBandShare: 0.03,
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

class PrefixSums {
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
 * Minimises Σ bands (flat SSE + β) + Σ transitions (ramp SSE + γ·length) over all layouts
 * margin · band · (transition · band)* · margin with 1..maxBands bands. O(maxBands · n²).
 */
export function segmentProfile(lab: Float64Array, n: number, params: SegmentParams = DEFAULT_SEGMENT_PARAMS): SegmentResult {
  const sigma = profileNoise(lab, n);
  const scale = Math.max(1, (sigma / params.referenceSigma) ** 2);
  const ps = new PrefixSums(lab, n);
  const minBand = Math.max(3, Math.round(params.minBandShare * n));
  const maxMargin = Math.max(1, Math.round(params.maxMarginShare * n));
  const K = params.maxBands;
  const beta = (params.beta * n) / 100;
  const flat = (i: number, j: number) => ps.flat(i, j) / scale + beta;
  const ramp = (i: number, j: number) => (j > i ? ps.ramp(i, j) / scale + params.gamma * (j - i) : 0);

  // B[k][j]: best cost of [0, j) whose last segment is band k ending at j.
  // T[k][j]: best cost of [0, j) after band k and a (possibly empty) transition ending at j.
  const B = Array.from({ length: K + 1 }, () => new Float64Array(n + 1).fill(Infinity));
  const T = Array.from({ length: K + 1 }, () => new Float64Array(n + 1).fill(Infinity));
  const bFrom = Array.from({ length: K + 1 }, () => new Int32Array(n + 1).fill(-1));
  const tFrom = Array.from({ length: K + 1 }, () => new Int32Array(n + 1).fill(-1));

  for (let k = 1; k <= K; k++) {
    for (let j = minBand; j <= n; j++) {
      let best = Infinity;
      let arg = -1;
      for (let i = 0; i <= j - minBand; i++) {
        const before = k === 1 ? (i <= maxMargin ? ramp(0, i) : Infinity) : T[k - 1][i];
        if (before === Infinity) continue;
        const c = before + flat(i, j);
        if (c < best) {
          best = c;
          arg = i;
        }
      }
      B[k][j] = best;
      bFrom[k][j] = arg;
    }
    for (let j = 0; j <= n; j++) {
      let best = B[k][j];
      let arg = j;
      for (let i = 0; i < j; i++) {
        if (B[k][i] === Infinity) continue;
        const c = B[k][i] + ramp(i, j);
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
