// Table surfaces under a strip photo, procedural, in table-plane millimetres. Each returns linear
// sRGB reflectance (D65 scene) at a point, with thin features anti-aliased against the local pixel
// footprint so a grid line 0.4 mm wide does not alias into a moiré at 1600 px.
import type { Lab } from "../../../shared/colour/index";
import { labToLinear } from "../../../server/demo/synthetic-photo";
import { labFromLch } from "./colour";
import { fbm, hash2, valueNoise } from "./noise";

export type DeskKind =
  | "dark"
  | "coloured"
  | "wood"
  | "pattern-checks"
  | "pattern-stripes"
  | "pattern-dots"
  | "pattern-speckle"
  | "cutting-mat"
  | "light-grey"
  | "light-wood"
  | "near-white";

export const DESK_KINDS: DeskKind[] = [
  "dark",
  "coloured",
  "wood",
  "pattern-checks",
  "pattern-stripes",
  "pattern-dots",
  "pattern-speckle",
  "cutting-mat",
  "light-grey",
  "light-wood",
  "near-white",
];

export type Desk = {
  kind: DeskKind;
  /** A few words on the variant (mat colour, wood tone…), for people reading failures. */
  sub: string;
  /** The main colours of the surface (absolute CIELAB D65 of its reflectance). */
  colours: Lab[];
  /** Reflectance at (x, y) mm, written into out[0..2]; px = size of one image pixel there, in mm. */
  at(x: number, y: number, px: number, out: Float64Array): void;
};

type Rand = () => number;
const U = (r: Rand, a: number, b: number) => a + (b - a) * r();
const clamp01 = (v: number) => (v < 0 ? 0 : v > 1 ? 1 : v);

/** Reflectance of a CIELAB colour, pulled inside (0.002, 0.95) so the desk is a real surface. */
function refl(lab: Lab): [number, number, number] {
  return labToLinear(lab).map((v) => Math.min(0.95, Math.max(0.002, v))) as [number, number, number];
}

/** Anti-aliased coverage of a line of half-width hw at distance d, for a pixel of size px (all mm). */
function lineCov(d: number, hw: number, px: number): number {
  const w = Math.max(px, 2 * hw);
  return clamp01((hw + px / 2 - d) / w) * Math.min(1, (2 * hw) / px + 0.15);
}

/** Anti-aliased step: 0 below the edge, 1 above it, the transition one pixel wide. */
function edge(d: number, px: number): number {
  return clamp01(0.5 + d / px);
}

function mix(out: Float64Array, a: ArrayLike<number>, b: ArrayLike<number>, t: number) {
  out[0] = a[0] + (b[0] - a[0]) * t;
  out[1] = a[1] + (b[1] - a[1]) * t;
  out[2] = a[2] + (b[2] - a[2]) * t;
}

export function makeDesk(rand: Rand, kind: DeskKind): Desk {
  const seed = Math.floor(rand() * 1e9);
  const rot = rand() * Math.PI; // pattern direction on the table
  const cr = Math.cos(rot);
  const sr = Math.sin(rot);
  const grainAmp = U(rand, 0.01, 0.035);
  // Fine surface texture common to every desk: a little low-frequency unevenness and fine grain.
  const tex = (x: number, y: number) => 1 + 0.04 * fbm(x / 60, y / 60, seed + 7, 2) + grainAmp * valueNoise(x / 0.35, y / 0.35, seed + 9);

  const plain = (lab: Lab, sub: string): Desk => {
    const c = refl(lab);
    return {
      kind,
      sub,
      colours: [lab],
      at(x, y, _px, out) {
        const t = tex(x, y);
        out[0] = c[0] * t;
        out[1] = c[1] * t;
        out[2] = c[2] * t;
      },
    };
  };

  switch (kind) {
    case "dark":
      return plain(labFromLch(U(rand, 8, 28), U(rand, 0, 14), rand() * 360), "dark solid");
    case "coloured": {
      const h = rand() * 360;
      let lab = labFromLch(U(rand, 30, 70), U(rand, 35, 70), h);
      for (let i = 0; i < 30 && labToLinear(lab).some((v) => v < 0.003 || v > 0.95); i++) lab = labFromLch(lab.l, Math.hypot(lab.a, lab.b) * 0.9, h);
      return plain(lab, `saturated h${Math.round(h)}`);
    }
    case "light-grey":
      return plain(labFromLch(U(rand, 76, 90), U(rand, 0, 4), rand() * 360), "pale grey");
    case "near-white":
      return plain(labFromLch(U(rand, 88, 95), U(rand, 1, 6), rand() * 360), "near-white (adversarial)");
    case "wood":
    case "light-wood": {
      const light = kind === "light-wood";
      const dark = !light && rand() < 0.4;
      const base: Lab = light
        ? { l: U(rand, 72, 84), a: U(rand, 3, 8), b: U(rand, 16, 26) }
        : dark
          ? { l: U(rand, 24, 40), a: U(rand, 8, 14), b: U(rand, 14, 26) }
          : { l: U(rand, 52, 68), a: U(rand, 8, 14), b: U(rand, 22, 34) };
      const lateLab: Lab = { l: base.l - U(rand, 10, 20), a: base.a + 2, b: base.b + U(rand, 0, 4) };
      const cb = refl(base);
      const cl = refl(lateLab);
      const ring = U(rand, 2.2, 6.5); // mm between growth rings
      const bend = U(rand, 6, 20); // slow sideways wander of the grain, mm
      const late = U(rand, 0.25, 0.45); // share of each ring that is dark latewood
      const contrast = U(rand, 0.35, 0.75);
      const plank = U(rand, 90, 220); // plank width
      const plankTint = Array.from({ length: 16 }, () => U(rand, 0.88, 1.1));
      const plankShift = Array.from({ length: 16 }, () => U(rand, 0, 500));
      return {
        kind,
        sub: light ? "light wood" : dark ? "dark wood" : "mid wood",
        colours: [base, lateLab],
        at(x, y, px, out) {
          // Plain-sawn boards: growth rings as nearly parallel lines along u that wander slowly,
          // their spacing varying, fine fibres along the grain, a seam and a new tint per plank.
          const u = x * cr + y * sr;
          const v = -x * sr + y * cr;
          const p = Math.floor(v / plank);
          const pi = ((p % 16) + 16) % 16;
          const uu = u + plankShift[pi];
          const wander = bend * fbm(uu / 700, v / 260 + p * 3.7, seed + 3, 2) + 0.6 * valueNoise(uu / 35, v / 4, seed + 5);
          const r = (v + wander) / (ring * (1 + 0.35 * valueNoise(uu / 900, v / 40, seed + 6)));
          const f = r - Math.floor(r);
          // Earlywood → latewood rises gradually and drops sharply at the ring boundary.
          const lw = f < 1 - late ? 0 : (f - (1 - late)) / late;
          const fibre = 0.07 * valueNoise(uu / 9, v / 0.18, seed + 11) + 0.04 * valueNoise(uu / 2.5, v / 0.09, seed + 12);
          mix(out, cb, cl, clamp01(contrast * Math.pow(lw, 0.7) + 0.15 * valueNoise(uu / 60, v / 6, seed + 13)));
          const seam = 1 - 0.55 * lineCov(Math.abs(v - p * plank), 0.35, px) - 0.55 * lineCov(Math.abs(v - (p + 1) * plank), 0.35, px);
          const t = plankTint[pi] * (1 + fibre) * seam * tex(x, y);
          out[0] *= t;
          out[1] *= t;
          out[2] *= t;
        },
      };
    }
    case "pattern-checks":
    case "pattern-stripes":
    case "pattern-dots": {
      const a = labFromLch(U(rand, 25, 75), U(rand, 15, 60), rand() * 360);
      const b = rand() < 0.5 ? labFromLch(U(rand, 85, 94), U(rand, 0, 6), rand() * 360) : labFromLch(U(rand, 20, 60), U(rand, 10, 50), rand() * 360);
      const ca = refl(a);
      const cb = refl(b);
      const size = kind === "pattern-dots" ? U(rand, 4, 16) : U(rand, 5, 40);
      const spacing = size * U(rand, 1.8, 3.2);
      const gingham = kind === "pattern-checks" && rand() < 0.5;
      return {
        kind,
        sub: kind === "pattern-checks" ? (gingham ? "gingham" : "checks") : kind === "pattern-dots" ? "polka dots" : "stripes",
        colours: gingham ? [a, b, { l: (a.l + b.l) / 2, a: (a.a + b.a) / 2, b: (a.b + b.b) / 2 }] : [a, b],
        at(x, y, px, out) {
          const u = x * cr + y * sr;
          const v = -x * sr + y * cr;
          let t: number;
          if (kind === "pattern-stripes") {
            const f = (((v / size) % 2) + 2) % 2; // 0–2: first half one colour
            t = edge(Math.min(f, 2 - f, Math.abs(f - 1)) * size * (f < 1 ? 1 : -1), px);
          } else if (kind === "pattern-checks") {
            const fu = (((u / size) % 2) + 2) % 2;
            const fv = (((v / size) % 2) + 2) % 2;
            const su = edge((fu < 1 ? 1 : -1) * Math.min(fu % 1, 1 - (fu % 1)) * size, px);
            const sv = edge((fv < 1 ? 1 : -1) * Math.min(fv % 1, 1 - (fv % 1)) * size, px);
            t = gingham ? (su + sv) / 2 : su * sv + (1 - su) * (1 - sv);
          } else {
            const gu = Math.round(u / spacing);
            const gv = Math.round(v / spacing + ((gu & 1) ? 0.5 : 0));
            const du = u - gu * spacing;
            const dv = v - (gv - ((gu & 1) ? 0.5 : 0)) * spacing;
            t = edge(size / 2 - Math.hypot(du, dv), px);
          }
          mix(out, cb, ca, t);
          // Printed on cloth or oilcloth: a weave and some unevenness.
          const w = tex(x, y) * (1 + 0.03 * Math.sin(u / 0.18) * Math.sin(v / 0.18));
          out[0] *= w;
          out[1] *= w;
          out[2] *= w;
        },
      };
    }
    case "pattern-speckle": {
      // Printed noise (terrazzo-like laminate): a base with blobs of two or three other colours.
      const base = labFromLch(U(rand, 40, 85), U(rand, 3, 30), rand() * 360);
      const chips = Array.from({ length: 2 + Math.floor(rand() * 2) }, () => labFromLch(U(rand, 20, 80), U(rand, 10, 60), rand() * 360));
      const cb = refl(base);
      const cc = chips.map(refl);
      const scale = U(rand, 2, 8);
      return {
        kind,
        sub: "printed speckle",
        colours: [base, ...chips],
        at(x, y, px, out) {
          out[0] = cb[0];
          out[1] = cb[1];
          out[2] = cb[2];
          for (let i = 0; i < cc.length; i++) {
            // Chips: thresholded fractal noise on rotated axes, so their edges are irregular, not lattice-aligned.
            const xr = (x * cr + y * sr) / scale;
            const yr = (-x * sr + y * cr) / scale;
            const n = fbm(xr + i * 31.7, yr - i * 17.3, seed + 21 + i, 3, 0.55);
            const t = edge((n - 0.42) * scale * 1.5, px);
            if (t > 0) mix(out, out, cc[i], t);
          }
          const w = tex(x, y);
          out[0] *= w;
          out[1] *= w;
          out[2] *= w;
        },
      };
    }
    case "cutting-mat": {
      const variants: [string, Lab][] = [
        ["green", { l: U(rand, 38, 52), a: U(rand, -38, -24), b: U(rand, 4, 16) }],
        ["blue", { l: U(rand, 32, 48), a: U(rand, -6, 4), b: U(rand, -36, -24) }],
        ["grey", labFromLch(U(rand, 30, 48), U(rand, 0, 4), rand() * 360)],
        ["black", labFromLch(U(rand, 14, 22), U(rand, 0, 3), rand() * 360)],
        ["pink", { l: U(rand, 60, 70), a: U(rand, 24, 36), b: U(rand, -2, 10) }],
        ["teal", { l: U(rand, 40, 52), a: U(rand, -30, -20), b: U(rand, -14, -6) }],
      ];
      const [name, base] = rand() < 0.45 ? variants[0] : variants[Math.floor(rand() * variants.length)];
      const line: Lab = base.l < 45 && rand() < 0.8 ? { l: U(rand, 80, 92), a: U(rand, -2, 2), b: U(rand, 2, 14) } : { l: base.l - 20, a: base.a * 0.6, b: base.b * 0.6 };
      const cb = refl(base);
      const cl = refl(line);
      const pitch = rand() < 0.7 ? 10 : 12.7; // cm grid or half-inch grid
      const ox = rand() * pitch * 5;
      const oy = rand() * pitch * 5;
      const thin = U(rand, 0.15, 0.3);
      const thick = U(rand, 0.45, 0.7);
      const diagonals = rand() < 0.4;
      const scratches = Array.from({ length: 14 }, () => {
        const a = rand() * Math.PI;
        return { x: U(rand, -250, 250), y: U(rand, -250, 250), c: Math.cos(a), s: Math.sin(a), l: U(rand, 10, 120) };
      });
      return {
        kind,
        sub: `${name} mat, ${pitch === 10 ? "10 mm" : "½ inch"} grid${diagonals ? ", 45° lines" : ""}`,
        colours: [base, line],
        at(x, y, px, out) {
          const u = x * cr + y * sr + ox;
          const v = -x * sr + y * cr + oy;
          let cov = 0;
          for (const q of [u, v]) {
            const k = Math.round(q / pitch);
            const d = Math.abs(q - k * pitch);
            cov = Math.max(cov, lineCov(d, k % 5 === 0 ? thick : thin, px));
          }
          if (diagonals) {
            const dpitch = pitch * 5 * Math.SQRT2;
            for (const q of [(u + v) / Math.SQRT2, (u - v) / Math.SQRT2]) cov = Math.max(cov, lineCov(Math.abs(q - Math.round(q / dpitch) * dpitch), thin, px));
          }
          mix(out, cb, cl, cov);
          // Knife scratches: short lighter lines.
          let s = 0;
          for (const sc of scratches) {
            const dx = x - sc.x;
            const dy = y - sc.y;
            if (dx > sc.l || dx < -sc.l || dy > sc.l || dy < -sc.l) continue;
            const along = dx * sc.c + dy * sc.s;
            if (along < 0 || along > sc.l) continue;
            const d = Math.abs(-dx * sc.s + dy * sc.c);
            if (d < 1) s = Math.max(s, 0.25 * lineCov(d, 0.08, px));
          }
          const w = tex(x, y) * (1 + s);
          out[0] *= w;
          out[1] *= w;
          out[2] *= w;
        },
      };
    }
  }
}

/** A stable pseudo-random value per integer cell, for callers that need per-tile variation. */
export const cellRandom = hash2;
