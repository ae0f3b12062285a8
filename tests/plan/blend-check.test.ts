import { describe, expect, it } from "vitest";
import { hexToLab, type Lab } from "../../shared/colour";
import { blendLab } from "../../shared/colour/blend";
import { checkJoins, medianAndP95 } from "../../server/analysis/blend-check";

/** A measured profile: flat band, a blend of `m` samples made by `mix`, flat band. */
function profile(a: Lab, b: Lab, m: number, mix: (f: number) => Lab) {
  const n = 100 + m + 100;
  const lab = new Float64Array(n * 3);
  for (let i = 0; i < n; i++) {
    const c = i < 100 ? a : i >= 100 + m ? b : mix((i - 100 + 1) / (m + 1));
    lab.set([c.l, c.a, c.b], i * 3);
  }
  return { profile: { lab, n }, bands: [{ from: 0, to: 100, lab: a, spread: 0 }, { from: 100 + m, to: n, lab: b, spread: 0 }] } as never;
}

describe("predicted joins against measured ones", () => {
  const yellow = hexToLab("#f2d24a");
  const blue = hexToLab("#3358b8");

  it("finds no difference when a strip was blended the way the model says (odd and even blend lengths)", () => {
    for (const m of [29, 30]) {
      const [c] = checkJoins(profile(yellow, blue, m, (f) => blendLab(yellow, blue, f)));
      expect(c!.samples).toBe(m);
      expect(c!.deltaE).toBeLessThan(0.3);
      expect(c!.straightLabDeltaE).toBeGreaterThan(5);
    }
  });

  it("shows the model's error when a strip was blended straight in CIELAB instead", () => {
    const straight = (f: number) => ({ l: yellow.l + f * (blue.l - yellow.l), a: yellow.a + f * (blue.a - yellow.a), b: yellow.b + f * (blue.b - yellow.b) });
    const [c] = checkJoins(profile(yellow, blue, 31, straight));
    expect(c!.straightLabDeltaE).toBeLessThan(0.3);
    expect(c!.deltaE).toBeGreaterThan(5);
  });

  it("skips hard edges and gives nearest-rank percentiles", () => {
    expect(checkJoins(profile(yellow, blue, 0, () => yellow))).toEqual([]);
    expect(medianAndP95([5, 1, 3, 2, 4])).toEqual({ median: 3, p95: 5 });
    expect(medianAndP95(Array.from({ length: 100 }, (_, i) => i + 1))).toEqual({ median: 50.5, p95: 95 });
  });
});
