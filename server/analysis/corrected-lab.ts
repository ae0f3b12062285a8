// Turns the photo into CIELAB (D65) after paper-white correction: each pixel's linear colour is
// divided by the paper brightness at its position, then Bradford-adapted from the paper white.
import { evaluateField, type PaperEstimate } from "./paper-white";
import { D65_WHITE, SRGB8_TO_LINEAR, labFFast } from "./srgb-lab";
import type { RgbImage } from "./types";

export type LabImage = {
  width: number;
  height: number;
  /** L, a, b interleaved. */
  lab: Float32Array;
  /** 1 where any 8-bit channel is ≥ 254 (glare or blown highlights). */
  clipped: Uint8Array;
};

/**
 * Per 8-bit code value of one channel, its share of X/Xn, Y and Z/Zn after the correction
 * matrix: the matrix is linear, so a pixel's XYZ is the sum of one entry per channel.
 */
function channelTables(m: readonly number[]): [Float64Array, Float64Array, Float64Array] {
  const tables: [Float64Array, Float64Array, Float64Array] = [new Float64Array(768), new Float64Array(768), new Float64Array(768)];
  for (let c = 0; c < 3; c++) {
    const t = tables[c];
    for (let v = 0; v < 256; v++) {
      const lin = SRGB8_TO_LINEAR[v]!;
      t[v * 3] = (m[c]! * lin) / D65_WHITE[0];
      t[v * 3 + 1] = m[3 + c]! * lin;
      t[v * 3 + 2] = (m[6 + c]! * lin) / D65_WHITE[2];
    }
  }
  return tables;
}

export function toCorrectedLab(img: RgbImage, paper: PaperEstimate): LabImage {
  const { width: w, height: h, data } = img;
  const lab = new Float32Array(w * h * 3);
  const clipped = new Uint8Array(w * h);
  const [tr, tg, tb] = channelTables(paper.correction);
  const rowField = new Float64Array(w);
  for (let y = 0; y < h; y++) {
    const ny = y / h - 0.5;
    for (let x = 0; x < w; x++) rowField[x] = 1 / Math.max(1e-4, evaluateField(paper.field, x / w - 0.5, ny));
    for (let x = 0; x < w; x++) {
      const p = y * w + x;
      const i = p * 3;
      const r8 = data[i]!;
      const g8 = data[i + 1]!;
      const b8 = data[i + 2]!;
      if (r8 >= 254 || g8 >= 254 || b8 >= 254) clipped[p] = 1;
      const k = rowField[x]!;
      const ri = r8 * 3;
      const gi = g8 * 3;
      const bi = b8 * 3;
      const fx = labFFast(k * (tr[ri]! + tg[gi]! + tb[bi]!));
      const fy = labFFast(k * (tr[ri + 1]! + tg[gi + 1]! + tb[bi + 1]!));
      const fz = labFFast(k * (tr[ri + 2]! + tg[gi + 2]! + tb[bi + 2]!));
      lab[i] = 116 * fy - 16;
      lab[i + 1] = 500 * (fx - fy);
      lab[i + 2] = 200 * (fy - fz);
    }
  }
  return { width: w, height: h, lab, clipped };
}
