// Fast per-pixel sRGB → CIELAB (D65) for the analysis. Same constants as culori (and therefore as
// shared/colour), tested against it; written out so a megapixel converts without allocations.

/**
 * sRGB → XYZ (D65) matrix. IEC 61966-2-1:1999 publishes it to four decimals
 * (0.4124 0.3576 0.1805 / 0.2126 0.7152 0.0722 / 0.0193 0.1192 0.9505); these are the same
 * values at full precision, derived from the sRGB primaries and the D65 chromaticity
 * (0.3127, 0.3290), as in CSS Color 4 and culori.
 */
export const SRGB_TO_XYZ: readonly number[] = [
  0.4123907992659593, 0.357584339383878, 0.1804807884018343,
  0.2126390058715102, 0.715168678767756, 0.0721923153607337,
  0.0193308187155918, 0.119194779794626, 0.9505321522496607,
];

/** XYZ (D65) → linear sRGB, the inverse of SRGB_TO_XYZ. */
export const XYZ_TO_SRGB: readonly number[] = [
  3.2409699419045226, -1.5373831775700939, -0.4986107602930034,
  -0.9692436362808796, 1.8759675015077204, 0.0415550574071756,
  0.0556300796969936, -0.2039769588889765, 1.0569715142428784,
];

/** D65 white, Y = 1, from chromaticity (0.3127, 0.3290) — equal to the row sums of SRGB_TO_XYZ. */
export const D65_WHITE: readonly [number, number, number] = [0.3127 / 0.329, 1, (1 - 0.3127 - 0.329) / 0.329];

/** IEC 61966-2-1 decoding: linear = V/12.92 for V ≤ 0.04045, else ((V + 0.055)/1.055)^2.4. */
export function srgbDecode(v: number): number {
  const a = Math.abs(v);
  const lin = a <= 0.04045 ? a / 12.92 : Math.pow((a + 0.055) / 1.055, 2.4);
  return v < 0 ? -lin : lin;
}

/** IEC 61966-2-1 encoding: V = 12.92·L for L ≤ 0.0031308, else 1.055·L^(1/2.4) − 0.055. */
export function srgbEncode(l: number): number {
  const a = Math.abs(l);
  const v = a <= 0.0031308 ? a * 12.92 : 1.055 * Math.pow(a, 1 / 2.4) - 0.055;
  return l < 0 ? -v : v;
}

/** 8-bit code value → linear light, as a 256-entry table. */
export const SRGB8_TO_LINEAR: Float64Array = (() => {
  const t = new Float64Array(256);
  for (let i = 0; i < 256; i++) t[i] = srgbDecode(i / 255);
  return t;
})();

// CIE 15 CIELAB constants: ε = (6/29)^3, κ = (29/3)^3.
const EPS = 216 / 24389;
const KAPPA = 24389 / 27;

function labF(t: number): number {
  return t > EPS ? Math.cbrt(t) : (KAPPA * t + 16) / 116;
}

// Cube roots for the per-pixel conversions: a table over [0, CBRT_TABLE_MAX], linear
// interpolation, then one Newton step (y ← y − (y³ − t)/(3y²)), which squares the relative error
// of the interpolation (≤ 1e-4 above ε) to below 1e-8 — finer than the Float32 the Lab images
// are stored in. Several times faster than Math.cbrt on a megapixel.
const CBRT_TABLE_MAX = 2;
const CBRT_TABLE_SIZE = 4096;
const CBRT_SCALE = CBRT_TABLE_SIZE / CBRT_TABLE_MAX;
const CBRT_TABLE: Float64Array = (() => {
  const t = new Float64Array(CBRT_TABLE_SIZE + 2);
  for (let i = 0; i < t.length; i++) t[i] = Math.cbrt(i / CBRT_SCALE);
  return t;
})();

/** Cube root of t ≥ ε (see above); falls back to Math.cbrt outside the table. */
export function cbrtFast(t: number): number {
  if (!(t > EPS && t < CBRT_TABLE_MAX)) return Math.cbrt(t);
  const u = t * CBRT_SCALE;
  const i = u | 0;
  const y0 = CBRT_TABLE[i]!;
  const y = y0 + (u - i) * (CBRT_TABLE[i + 1]! - y0);
  return y - (y * y * y - t) / (3 * y * y);
}

/** The CIELAB f(t) of CIE 15 with cbrtFast: f(t) = ∛t above ε, (κt + 16)/116 below. */
export function labFFast(t: number): number {
  return t > EPS ? cbrtFast(t) : (KAPPA * t + 16) / 116;
}

/** XYZ relative to D65 (Y of white = 1) → CIELAB. Writes into out[offset..offset+2]. */
export function xyzToLabInto(x: number, y: number, z: number, out: Float32Array | number[], offset: number): void {
  const fx = labF(x / D65_WHITE[0]);
  const fy = labF(y);
  const fz = labF(z / D65_WHITE[2]);
  out[offset] = 116 * fy - 16;
  out[offset + 1] = 500 * (fx - fy);
  out[offset + 2] = 200 * (fy - fz);
}

/** CIELAB (D65) → XYZ (Y of white = 1). */
export function labToXyz(l: number, a: number, b: number): [number, number, number] {
  const fy = (l + 16) / 116;
  const fx = fy + a / 500;
  const fz = fy - b / 200;
  const inv = (f: number) => (f ** 3 > EPS ? f ** 3 : (116 * f - 16) / KAPPA);
  return [inv(fx) * D65_WHITE[0], l > KAPPA * EPS ? fy ** 3 : l / KAPPA, inv(fz) * D65_WHITE[2]];
}

/** 3×3 row-major matrix product a·b. */
export function mul3(a: readonly number[], b: readonly number[]): number[] {
  const r = new Array<number>(9);
  for (let i = 0; i < 3; i++)
    for (let j = 0; j < 3; j++) r[i * 3 + j] = a[i * 3] * b[j] + a[i * 3 + 1] * b[3 + j] + a[i * 3 + 2] * b[6 + j];
  return r;
}

/** 3×3 row-major matrix times vector. */
export function mulVec3(m: readonly number[], v: readonly number[]): [number, number, number] {
  return [
    m[0] * v[0] + m[1] * v[1] + m[2] * v[2],
    m[3] * v[0] + m[4] * v[1] + m[5] * v[2],
    m[6] * v[0] + m[7] * v[1] + m[8] * v[2],
  ];
}

/** Inverse of a 3×3 row-major matrix. */
export function invert3(m: readonly number[]): number[] {
  const [a, b, c, d, e, f, g, h, i] = m;
  const A = e * i - f * h;
  const B = -(d * i - f * g);
  const C = d * h - e * g;
  const det = a * A + b * B + c * C;
  if (Math.abs(det) < 1e-15) throw new RangeError("Singular matrix");
  return [
    A / det, -(b * i - c * h) / det, (b * f - c * e) / det,
    B / det, (a * i - c * g) / det, -(a * f - c * d) / det,
    C / det, -(a * h - b * g) / det, (a * e - b * d) / det,
  ];
}
