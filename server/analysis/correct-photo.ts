// The photo as members should see it: the measured paper white becomes D65 white by the same
// Bradford adaptation the analysis uses, applied in linear sRGB (IEC 61966-2-1).
import type { Lab } from "../../shared/colour/index";
import { bradfordMatrix } from "./bradford";
import { D65_WHITE, labToXyz, mul3, SRGB8_TO_LINEAR, SRGB_TO_XYZ, srgbEncode, XYZ_TO_SRGB } from "./srgb-lab";

/** Steps of the linear-light table the corrected values are encoded back to 8 bits through. */
const ENCODE_STEPS = 4096;

/** 8-bit sRGB → 8-bit sRGB, re-encoded through a 4097-entry table (IEC 61966-2-1 encoding). */
const ENCODE: Uint8Array = (() => {
  const t = new Uint8Array(ENCODE_STEPS + 1);
  for (let i = 0; i <= ENCODE_STEPS; i++) t[i] = Math.round(srgbEncode(i / ENCODE_STEPS) * 255);
  return t;
})();

/**
 * Corrects upright 8-bit sRGB pixels (3 channels) so `paper` (CIELAB D65, as photographed) reads
 * as white. The matrix is linear, so each output channel is a sum of one table entry per input
 * channel (the tables hold matrix × linear value × 4096; scaling by a power of two is exact).
 */
export function correctToPaperWhite<T extends { width: number; height: number; data: Buffer }>(img: T, paper: Lab): T {
  const adapt = bradfordMatrix(labToXyz(paper.l, paper.a, paper.b), D65_WHITE);
  const m = mul3(XYZ_TO_SRGB, mul3(adapt, SRGB_TO_XYZ));
  // tables[c][v * 3 + o]: input channel c at code value v, its share of output channel o.
  const tables = [0, 1, 2].map((c) => {
    const t = new Float64Array(768);
    for (let v = 0; v < 256; v++) for (let o = 0; o < 3; o++) t[v * 3 + o] = m[o * 3 + c]! * SRGB8_TO_LINEAR[v]! * ENCODE_STEPS;
    return t;
  });
  const [tr, tg, tb] = tables as [Float64Array, Float64Array, Float64Array];
  const d = img.data;
  const out = Buffer.allocUnsafe(d.length);
  for (let p = 0; p < d.length; p += 3) {
    const ri = d[p]! * 3;
    const gi = d[p + 1]! * 3;
    const bi = d[p + 2]! * 3;
    const r = tr[ri]! + tg[gi]! + tb[bi]!;
    const g = tr[ri + 1]! + tg[gi + 1]! + tb[bi + 1]!;
    const b = tr[ri + 2]! + tg[gi + 2]! + tb[bi + 2]!;
    out[p] = ENCODE[r <= 0 ? 0 : r >= ENCODE_STEPS ? ENCODE_STEPS : (r + 0.5) | 0]!;
    out[p + 1] = ENCODE[g <= 0 ? 0 : g >= ENCODE_STEPS ? ENCODE_STEPS : (g + 0.5) | 0]!;
    out[p + 2] = ENCODE[b <= 0 ? 0 : b >= ENCODE_STEPS ? ENCODE_STEPS : (b + 0.5) | 0]!;
  }
  return { ...img, data: out };
}
