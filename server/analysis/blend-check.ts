// Predicted joins against measured ones (`npm run report:blends`): for each transition the
// analysis reads on a strip, the colour the blend model (shared/colour/blend.ts) predicts for its
// middle — from the two neighbouring bands' measured colours — against the colour measured there.
import { deltaE2000, type Lab } from "../../shared/colour";
import { blendLab } from "../../shared/colour/blend";
import type { StripMeasurement } from "./analyze-pixels";

export type JoinCheck = {
  /** Measured colour at the middle of the transition (mean of the one or two central profile samples). */
  measured: Lab;
  /** The model's middle, straight in optical density between the two bands' measured colours. */
  predicted: Lab;
  deltaE: number;
  /** For comparison: the middle of a straight line in CIELAB between the same two colours. */
  straightLabDeltaE: number;
  /** Transition length in profile samples (0 for a hard edge, which is skipped). */
  samples: number;
};

/** One check per transition with at least one sample between its two bands. */
export function checkJoins(m: Pick<StripMeasurement, "profile" | "bands">): JoinCheck[] {
  const { lab } = m.profile;
  const out: JoinCheck[] = [];
  for (let k = 0; k + 1 < m.bands.length; k++) {
    const a = m.bands[k]!;
    const b = m.bands[k + 1]!;
    const samples = b.from - a.to;
    if (samples < 1) continue;
    // The middle of [a.to, b.from): one sample when the count is odd, the two central ones when even.
    const mid = (a.to + b.from - 1) / 2;
    const idx = [...new Set([Math.floor(mid), Math.ceil(mid)])];
    const measured = { l: 0, a: 0, b: 0 };
    for (const i of idx) {
      measured.l += lab[i * 3]! / idx.length;
      measured.a += lab[i * 3 + 1]! / idx.length;
      measured.b += lab[i * 3 + 2]! / idx.length;
    }
    const predicted = blendLab(a.lab, b.lab, 0.5);
    const straight = { l: (a.lab.l + b.lab.l) / 2, a: (a.lab.a + b.lab.a) / 2, b: (a.lab.b + b.lab.b) / 2 };
    out.push({ measured, predicted, deltaE: deltaE2000(measured, predicted), straightLabDeltaE: deltaE2000(measured, straight), samples });
  }
  return out;
}

/** Median and 95th percentile (nearest rank) of a list; NaN when empty. */
export function medianAndP95(values: number[]): { median: number; p95: number } {
  if (!values.length) return { median: NaN, p95: NaN };
  const s = [...values].sort((x, y) => x - y);
  const rank = (p: number) => s[Math.min(s.length - 1, Math.max(0, Math.ceil(p * s.length) - 1))]!;
  const median = s.length % 2 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2;
  return { median, p95: rank(0.95) };
}
