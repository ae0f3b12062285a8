// Turns the photo into CIELAB (D65) after paper-white correction: each pixel's linear colour is
// divided by the paper brightness at its position, then Bradford-adapted from the paper white.
import { evaluateField, type PaperEstimate } from "./paper-white";
import { SRGB8_TO_LINEAR, xyzToLabInto } from "./srgb-lab";
import type { RgbImage } from "./types";

export type LabImage = {
  width: number;
  height: number;
  /** L, a, b interleaved. */
  lab: Float32Array;
  /** 1 where any 8-bit channel is ≥ 254 (glare or blown highlights). */
  clipped: Uint8Array;
};

export function toCorrectedLab(img: RgbImage, paper: PaperEstimate): LabImage {
  const { width: w, height: h, data } = img;
  const lab = new Float32Array(w * h * 3);
  const clipped = new Uint8Array(w * h);
  const m = paper.correction;
  const rowField = new Float64Array(w);
  for (let y = 0; y < h; y++) {
    const ny = y / h - 0.5;
    for (let x = 0; x < w; x++) rowField[x] = 1 / Math.max(1e-4, evaluateField(paper.field, x / w - 0.5, ny));
    for (let x = 0; x < w; x++) {
      const p = y * w + x;
      const i = p * 3;
      const r8 = data[i];
      const g8 = data[i + 1];
      const b8 = data[i + 2];
      if (r8 >= 254 || g8 >= 254 || b8 >= 254) clipped[p] = 1;
      const k = rowField[x];
      const r = SRGB8_TO_LINEAR[r8] * k;
      const g = SRGB8_TO_LINEAR[g8] * k;
      const b = SRGB8_TO_LINEAR[b8] * k;
      xyzToLabInto(m[0] * r + m[1] * g + m[2] * b, m[3] * r + m[4] * g + m[5] * b, m[6] * r + m[7] * g + m[8] * b, lab, i);
    }
  }
  return { width: w, height: h, lab, clipped };
}
