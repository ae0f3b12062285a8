// Bradford chromatic adaptation (von Kries scaling in the Bradford "sharpened" cone space).
import { invert3, mul3, mulVec3 } from "./srgb-lab";

/**
 * Bradford cone-response matrix M_A (XYZ → ρβγ), from Lam (1985), "Metamerism and colour
 * constancy" (PhD thesis, University of Bradford), as tabulated in common references such as
 * Lindbloom, "Chromatic Adaptation" (brucelindbloom.com). Values quoted from memory of that table.
 */
export const BRADFORD: readonly number[] = [
  0.8951, 0.2664, -0.1614,
  -0.7502, 1.7135, 0.0367,
  0.0389, -0.0685, 1.0296,
];

export const BRADFORD_INVERSE: readonly number[] = invert3(BRADFORD);

/**
 * The 3×3 matrix that maps XYZ seen under white `src` to corresponding XYZ under white `dst`:
 * M = M_A⁻¹ · diag(ρ_d/ρ_s, γ_d/γ_s, β_d/β_s) · M_A (Lindbloom's formulation).
 * Whites are XYZ triples; their Y scale carries over (a src white with Y = 0.8 maps to dst's Y).
 */
export function bradfordMatrix(src: readonly number[], dst: readonly number[]): number[] {
  const s = mulVec3(BRADFORD, src);
  const d = mulVec3(BRADFORD, dst);
  const scale = [d[0] / s[0], 0, 0, 0, d[1] / s[1], 0, 0, 0, d[2] / s[2]];
  return mul3(BRADFORD_INVERSE, mul3(scale, BRADFORD));
}
