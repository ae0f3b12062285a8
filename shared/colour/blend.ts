// The blend model: the colour across the join of two inks worked together on white cardstock.
// ONE implementation for everything that needs it: the strip analysis fits it to real strips
// (server/analysis/segment-profile.ts, decision 002), and the blend preview, the bridge finder,
// the printed practice cards and `npm run report:blends` predict joins with it. Browser-safe.
//
// Why optical density: a dye film absorbs light, and by the Beer–Lambert law the transmittance of
// absorbers in series multiplies — their absorbances (optical densities, D = −log T) add
// (Swinehart 1962, "The Beer–Lambert law", J. Chem. Educ. 39(7), 333; also the IUPAC Gold Book
// entry "Beer–Lambert law" — cited from memory). On white paper the light passes the dye film
// twice, which doubles D but keeps it additive. Blending one dye into another therefore moves
// straight in D = −ln R per channel: geometric in reflectance R, curved in CIELAB. The three
// linear-sRGB channels stand in for the spectrum — a coarse but common simplification (common
// practice in subtractive-mixing previews; real dyes have spectral curves, so predictions for
// inks with sharp absorption edges will be off by a few ΔE).
import type { Lab } from "./index";
import { D65_WHITE, SRGB_TO_XYZ, XYZ_TO_SRGB, labFFast, labToXyz, mulVec3 } from "./srgb-lab";

/** Optical density per linear-sRGB channel, D = −ln R. */
export type Density = [number, number, number];

/** Reflectance floor: keeps D finite for a channel a gamut-clipped black sends to 0. */
const MIN_REFLECTANCE = 1e-4;

/** Optical density (−ln reflectance) of a CIELAB colour, per linear-sRGB channel. */
export function labToDensity(lab: Lab): Density {
  const rgb = mulVec3(XYZ_TO_SRGB, labToXyz(lab.l, lab.a, lab.b));
  return [-Math.log(Math.max(MIN_REFLECTANCE, rgb[0])), -Math.log(Math.max(MIN_REFLECTANCE, rgb[1])), -Math.log(Math.max(MIN_REFLECTANCE, rgb[2]))];
}

// sRGB → XYZ rows divided by the white's X and Z (CIELAB's X/Xn, Z/Zn): linear sRGB → f-inputs.
const M = SRGB_TO_XYZ;
const XR = M[0]! / D65_WHITE[0], XG = M[1]! / D65_WHITE[0], XB = M[2]! / D65_WHITE[0];
const YR = M[3]!, YG = M[4]!, YB = M[5]!;
const ZR = M[6]! / D65_WHITE[2], ZG = M[7]! / D65_WHITE[2], ZB = M[8]! / D65_WHITE[2];

/** Linear-sRGB reflectance → CIELAB (D65). */
export function reflectanceToLab(r: number, g: number, b: number): Lab {
  const fx = labFFast(XR * r + XG * g + XB * b);
  const fy = labFFast(YR * r + YG * g + YB * b);
  const fz = labFFast(ZR * r + ZG * g + ZB * b);
  return { l: 116 * fy - 16, a: 500 * (fx - fy), b: 200 * (fy - fz) };
}

/** CIELAB of an optical density. */
export function densityToLab(d: Density): Lab {
  return reflectanceToLab(Math.exp(-d[0]), Math.exp(-d[1]), Math.exp(-d[2]));
}

/**
 * The colour a fraction f (0 = all of a, 1 = all of b) of the way through a blend from ink a to
 * ink b: straight in optical density.
 */
export function blendLab(a: Lab, b: Lab, f: number): Lab {
  return blendDensities(labToDensity(a), labToDensity(b), f);
}

/** As blendLab, from densities worked out once (hot loops: previews, the bridge finder). */
export function blendDensities(dA: Density, dB: Density, f: number): Lab {
  return densityToLab([dA[0] + f * (dB[0] - dA[0]), dA[1] + f * (dB[1] - dA[1]), dA[2] + f * (dB[2] - dA[2])]);
}

/**
 * How far measured colours lie from the model: the sum of squared CIELAB distances between the m
 * samples lab[from … from+m−1] (packed L*, a*, b*) and a blend from density dA to dB sampled at
 * f = 1/(m+1) … m/(m+1). The analysis asks this for every candidate transition of every strip,
 * so it is written for speed: straight in density means geometric in reflectance — from one
 * sample to the next each channel's reflectance is multiplied by the same factor — so a blend of
 * any length costs three exponentials, not three per sample.
 */
export function blendResidual(dA: Density, dB: Density, m: number, lab: ArrayLike<number>, from: number): number {
  const qr = Math.exp(-(dB[0] - dA[0]) / (m + 1));
  const qg = Math.exp(-(dB[1] - dA[1]) / (m + 1));
  const qb = Math.exp(-(dB[2] - dA[2]) / (m + 1));
  let r = Math.exp(-dA[0]) * qr;
  let g = Math.exp(-dA[1]) * qg;
  let b = Math.exp(-dA[2]) * qb;
  let sse = 0;
  for (let t = from; t < from + m; t++) {
    const fx = labFFast(XR * r + XG * g + XB * b);
    const fy = labFFast(YR * r + YG * g + YB * b);
    const fz = labFFast(ZR * r + ZG * g + ZB * b);
    const dl = lab[t * 3]! - (116 * fy - 16);
    const da = lab[t * 3 + 1]! - 500 * (fx - fy);
    const db = lab[t * 3 + 2]! - 200 * (fy - fz);
    sse += dl * dl + da * da + db * db;
    r *= qr;
    g *= qg;
    b *= qb;
  }
  return sse;
}
