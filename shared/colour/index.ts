// Colour maths shared by the client and the server. Browser-safe: no Node imports.
// Thin wrappers over culori ("culori/fn" so the client bundles only the modes used here).
import {
  converter,
  modeLab65,
  modeLch65,
  modeLrgb,
  modeRgb,
  modeXyz65,
  useMode,
  type Rgb,
} from "culori/fn";

useMode(modeRgb);
useMode(modeLrgb);
useMode(modeXyz65);
useMode(modeLab65);
useMode(modeLch65);

// culori's `lab` is D50; `lab65` is CIELAB relative to D65, which is what Blendwell stores.
const toLab65 = converter("lab65");
const toRgb = converter("rgb");

/** CIELAB, D65 white, CIE 1931 2° observer. */
export type Lab = { l: number; a: number; b: number };

/** CIE LCh(ab) derived from D65 CIELAB; h in degrees [0, 360). */
export type Lch = { l: number; c: number; h: number };

const HEX_RE = /^#(?:[0-9a-f]{3}|[0-9a-f]{6})$/i;

/** True for "#rgb" or "#rrggbb" (any case). */
export function isHex(s: string): boolean {
  return typeof s === "string" && HEX_RE.test(s);
}

/** "#ABC" → "#aabbcc", " #A1B2C3 " → "#a1b2c3". Throws RangeError on anything that is not a hex colour. */
export function normalizeHex(s: string): string {
  const t = typeof s === "string" ? s.trim() : "";
  if (!isHex(t)) throw new RangeError(`Not a hex colour: ${JSON.stringify(s)}`);
  const body = t.slice(1).toLowerCase();
  if (body.length === 3) return `#${body[0]}${body[0]}${body[1]}${body[1]}${body[2]}${body[2]}`;
  return `#${body}`;
}

function toLab(c: { l?: number; a?: number; b?: number }): Lab {
  return { l: c.l ?? 0, a: c.a ?? 0, b: c.b ?? 0 };
}

/** 8-bit sRGB (0–255 each, IEC 61966-2-1) → CIELAB D65. */
export function srgbToLab(r: number, g: number, b: number): Lab {
  return toLab(toLab65({ mode: "rgb", r: r / 255, g: g / 255, b: b / 255 }));
}

function clamp255(v: number | undefined): number {
  const x = Math.round((v ?? 0) * 255);
  return x < 0 ? 0 : x > 255 ? 255 : x;
}

/** CIELAB D65 → 8-bit sRGB [r, g, b], each channel clipped into 0–255. */
export function labToSrgb(lab: Lab): [number, number, number] {
  const c = toRgb({ mode: "lab65", l: lab.l, a: lab.a, b: lab.b }) as Rgb;
  return [clamp255(c.r), clamp255(c.g), clamp255(c.b)];
}

/** "#rgb" / "#rrggbb" → CIELAB D65. Throws RangeError on invalid input. */
export function hexToLab(hex: string): Lab {
  const h = normalizeHex(hex);
  const n = parseInt(h.slice(1), 16);
  return srgbToLab((n >> 16) & 255, (n >> 8) & 255, n & 255);
}

/** CIELAB D65 → lowercase "#rrggbb"; out-of-gamut colours are clipped per channel. */
export function labToHex(lab: Lab): string {
  const [r, g, b] = labToSrgb(lab);
  return "#" + ((1 << 24) | (r << 16) | (g << 8) | b).toString(16).slice(1);
}

/** CIELAB → LCh(ab); hue in degrees [0, 360), 0 for neutral colours. */
export function labToLch(lab: Lab): Lch {
  const c = Math.hypot(lab.a, lab.b);
  let h = c < 1e-9 ? 0 : (Math.atan2(lab.b, lab.a) * 180) / Math.PI;
  if (h < 0) h += 360;
  return { l: lab.l, c, h };
}

const RAD = Math.PI / 180;
const POW25_7 = 25 ** 7;

/**
 * CIEDE2000 colour difference (kL = kC = kH = 1).
 * Formula and its edge cases (hue of neutral colours, mean hue across 0°/360°) follow
 * Sharma, Wu & Dalal (2005), "The CIEDE2000 color-difference formula: implementation notes,
 * supplementary test data and mathematical observations", Color Res. Appl. 30(1), 21–30.
 * Written out here (rather than culori's differenceCiede2000) so the matching loop needs no
 * converter call per pair; tests check it against that paper's data and against culori.
 */
export function deltaE2000(x: Lab, y: Lab): number {
  // Plain products and square roots instead of Math.hypot and ** (several times slower in V8):
  // the bridge finder evaluates this for every pair of a 2 000-ink catalogue.
  const c1 = Math.sqrt(x.a * x.a + x.b * x.b);
  const c2 = Math.sqrt(y.a * y.a + y.b * y.b);
  const cMean7 = pow7((c1 + c2) / 2);
  const g = 0.5 * (1 - Math.sqrt(cMean7 / (cMean7 + POW25_7)));
  const a1p = (1 + g) * x.a;
  const a2p = (1 + g) * y.a;
  const c1p = Math.sqrt(a1p * a1p + x.b * x.b);
  const c2p = Math.sqrt(a2p * a2p + y.b * y.b);
  const hueDeg = (b: number, ap: number) => {
    if (b === 0 && ap === 0) return 0;
    const h = Math.atan2(b, ap) / RAD;
    return h < 0 ? h + 360 : h;
  };
  const h1p = hueDeg(x.b, a1p);
  const h2p = hueDeg(y.b, a2p);

  const dLp = y.l - x.l;
  const dCp = c2p - c1p;
  let dhp = 0;
  if (c1p * c2p !== 0) {
    dhp = h2p - h1p;
    if (dhp > 180) dhp -= 360;
    else if (dhp < -180) dhp += 360;
  }
  const dHp = 2 * Math.sqrt(c1p * c2p) * Math.sin((dhp * RAD) / 2);

  const lpMean = (x.l + y.l) / 2;
  const cpMean = (c1p + c2p) / 2;
  let hpMean: number;
  if (c1p * c2p === 0) hpMean = h1p + h2p;
  else if (Math.abs(h1p - h2p) <= 180) hpMean = (h1p + h2p) / 2;
  else if (h1p + h2p < 360) hpMean = (h1p + h2p + 360) / 2;
  else hpMean = (h1p + h2p - 360) / 2;

  const t =
    1 -
    0.17 * Math.cos((hpMean - 30) * RAD) +
    0.24 * Math.cos(2 * hpMean * RAD) +
    0.32 * Math.cos((3 * hpMean + 6) * RAD) -
    0.2 * Math.cos((4 * hpMean - 63) * RAD);
  const u = (hpMean - 275) / 25;
  const dTheta = 30 * Math.exp(-(u * u));
  const cpMean7 = pow7(cpMean);
  const rc = 2 * Math.sqrt(cpMean7 / (cpMean7 + POW25_7));
  const l50 = (lpMean - 50) * (lpMean - 50);
  const sl = 1 + (0.015 * l50) / Math.sqrt(20 + l50);
  const sc = 1 + 0.045 * cpMean;
  const sh = 1 + 0.015 * cpMean * t;
  const rt = -Math.sin(2 * dTheta * RAD) * rc;

  const tl = dLp / sl;
  const tc = dCp / sc;
  const th = dHp / sh;
  return Math.sqrt(tl * tl + tc * tc + th * th + rt * tc * th);
}

function pow7(v: number): number {
  const v2 = v * v;
  return v2 * v2 * v2 * v;
}

/**
 * ΔE2000 in plain words. The bands (1 / 2 / 5 / 10) are common practice among colour
 * practitioners, not a published standard.
 */
export function describeDeltaE(de: number): string {
  if (de <= 1) return "indistinguishable";
  if (de <= 2) return "barely different";
  if (de <= 5) return "similar";
  if (de <= 10) return "noticeably different";
  return "very different";
}

/**
 * A plain colour word from CIELAB lightness, chroma and hue angle, so colour is never given by
 * swatch alone. The boundaries are our own, tuned so the sRGB primaries, secondaries and common
 * named colours get the word people expect; they are not a standard.
 * Words: red, orange, yellow, olive, green, teal, blue, purple, pink, brown, beige, grey, white, black.
 */
export function hueName(lab: Lab): string {
  const { l, c, h } = labToLch(lab);
  if (l < 12 || (l < 20 && c < 12)) return "black";
  if (c < 8 || (l > 92 && c < 12)) {
    if (l >= 90) return "white";
    if (l <= 20) return "black";
    return "grey";
  }
  // Warm, weak colours: browns when dark, beige when light.
  if (h >= 20 && h < 112 && c < 30) return l >= 70 ? "beige" : "brown";
  if (h >= 20 && h < 85 && l < 50 && c < 60) return "brown";
  if (h < 20 || h >= 340) {
    if (l >= 60) return "pink";
    return h >= 340 && l >= 40 ? "pink" : "red";
  }
  if (h < 45) return l >= 72 && c < 45 ? "pink" : "red";
  if (h < 75) return "orange";
  // Yellow's tints drift a few degrees greener than the sRGB yellow corner (h ≈ 103°).
  if (h < 110) return l < 60 ? "olive" : "yellow";
  if (h < 165) return "green";
  if (h < 225) return "teal";
  if (h < 300) return "blue";
  // CIELAB bends here: sRGB blue itself sits at h ≈ 306° (very strong for its lightness), while
  // softer colours at the same angle (lavenders, slate violets) read as purple.
  if (h < 310) return c > 1.6 * l ? "blue" : "purple";
  return "purple";
}
