// Colour helpers for the scene generator: linear sRGB ↔ CIELAB (D65) and illuminant chromaticities.
import type { Lab } from "../../../shared/colour/index";

/**
 * Linear sRGB → XYZ (D65): the IEC 61966-2-1 matrix at full precision (derived from the sRGB
 * primaries and D65 at (0.3127, 0.3290), as in CSS Color 4), the same values the project's
 * labToLinear inverts, so a colour survives the round trip.
 */
const M = [
  0.4123907992659593, 0.357584339383878, 0.1804807884018343, 0.2126390058715102, 0.715168678767756, 0.0721923153607337,
  0.0193308187155918, 0.119194779794626, 0.9505321522496607,
];
const WN = [0.3127 / 0.329, 1, (1 - 0.3127 - 0.329) / 0.329];

/** CIE 15:2004 CIELAB from XYZ, white D65. */
export function linearToLab(rgb: readonly number[]): Lab {
  const f = (t: number) => (t > 216 / 24389 ? Math.cbrt(t) : (24389 / 27 * t + 16) / 116);
  const X = (M[0] * rgb[0] + M[1] * rgb[1] + M[2] * rgb[2]) / WN[0];
  const Y = (M[3] * rgb[0] + M[4] * rgb[1] + M[5] * rgb[2]) / WN[1];
  const Z = (M[6] * rgb[0] + M[7] * rgb[1] + M[8] * rgb[2]) / WN[2];
  const fx = f(X);
  const fy = f(Y);
  const fz = f(Z);
  return { l: 116 * fy - 16, a: 500 * (fx - fy), b: 200 * (fy - fz) };
}

/** IEC 61966-2-1 encoding of linear light to a 0–1 sRGB value. */
export function srgbEncode(l: number): number {
  return l <= 0.0031308 ? 12.92 * l : 1.055 * Math.pow(l, 1 / 2.4) - 0.055;
}

/**
 * Chromaticity of a light of correlated colour temperature `cct` K: below 4000 K the Planckian
 * locus by the cubic-spline fit of Kim et al. (US patent 7,024,034, 2006; good to ~1e-3 in xy);
 * from 4000 K the CIE daylight locus (CIE 15:2004, eq. 3.3–3.4). Coefficients from memory.
 * 2856 K ≈ CIE A, 6504 K ≈ D65, 7504 K ≈ D75.
 */
export function illuminantXy(cct: number): [number, number] {
  const t = cct;
  if (t < 4000) {
    const x = -0.2661239e9 / t ** 3 - 0.234358e6 / t ** 2 + 0.8776956e3 / t + 0.17991;
    const y = t < 2222 ? -1.1063814 * x ** 3 - 1.3481102 * x ** 2 + 2.18555832 * x - 0.20219683 : -0.9549476 * x ** 3 - 1.37418593 * x ** 2 + 2.09137015 * x - 0.16748867;
    return [x, y];
  }
  const x = t <= 7000 ? -4.607e9 / t ** 3 + 2.9678e6 / t ** 2 + 0.09911e3 / t + 0.244063 : -2.0064e9 / t ** 3 + 1.9018e6 / t ** 2 + 0.24748e3 / t + 0.23704;
  return [x, -3 * x * x + 2.87 * x - 0.275];
}

export function labFromLch(l: number, c: number, hDeg: number): Lab {
  const h = (hDeg * Math.PI) / 180;
  return { l, a: c * Math.cos(h), b: c * Math.sin(h) };
}
