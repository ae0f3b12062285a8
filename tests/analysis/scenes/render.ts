// Renders a scene description to 8-bit sRGB, in linear light: table → card → strips (reflectance),
// × illumination (window falloff, soft shadows) + specular glare, → camera (CAT02 cast × exposure),
// × vignetting, → defocus blur, → sensor noise, → sRGB encoding. Edges are anti-aliased against
// each pixel's footprint on the table, so the perspective's far side is as soft as a real photo's.
import { inv3 } from "./geometry";
import { fbm, valueNoise } from "./noise";
import { gaussian, seededRandom } from "../../../server/demo/synthetic-photo";
import { srgbEncode } from "./colour";
import type { SceneSpec, StripSpec } from "./types";

export type RgbImage = { width: number; height: number; data: Uint8Array };

const clamp01 = (v: number) => (v < 0 ? 0 : v > 1 ? 1 : v);
const smooth = (t: number) => {
  const x = clamp01(t);
  return x * x * (3 - 2 * x);
};

/** Per-strip constants for the inner loop. */
type StripR = StripSpec & {
  c: number;
  s: number;
  hl: number;
  hw: number;
  inkLo: number;
  inkLen: number;
  lut: Float64Array;
  bbox: [number, number, number, number];
};

const LUT_N = 2048;

/**
 * Density along the inked part: each ink flat over its stretch; across a join the optical
 * density (−ln reflectance) goes from one ink's to the next along a smoothstep centred on the
 * join (dye layered on dye, Beer–Lambert — decision 002's blend model). Centre = truth join.
 */
function densityLut(s: StripSpec): Float64Array {
  const lut = new Float64Array(LUT_N * 3);
  for (let i = 0; i < LUT_N; i++) {
    const t = (i + 0.5) / LUT_N;
    let k = 0;
    while (k < s.joins.length && t > s.joins[k].centre + s.joins[k].width / 2) k++;
    let d = s.inks[k].density;
    if (k < s.joins.length) {
      const j = s.joins[k];
      const lo = j.centre - j.width / 2;
      if (t > lo) {
        const w = smooth((t - lo) / j.width);
        const a = s.inks[k].density;
        const b = s.inks[k + 1].density;
        d = [a[0] + (b[0] - a[0]) * w, a[1] + (b[1] - a[1]) * w, a[2] + (b[2] - a[2]) * w];
      }
    }
    lut[i * 3] = d[0];
    lut[i * 3 + 1] = d[1];
    lut[i * 3 + 2] = d[2];
  }
  return lut;
}

function prepStrip(s: StripSpec): StripR {
  const c = Math.cos(s.angle);
  const sn = Math.sin(s.angle);
  const hl = s.length / 2;
  const hw = s.width / 2;
  const ex = Math.abs(hl * c) + Math.abs(hw * sn) + 3;
  const ey = Math.abs(hl * sn) + Math.abs(hw * c) + 3;
  return { ...s, c, s: sn, hl, hw, inkLo: -hl + s.marginLo, inkLen: s.length - s.marginLo - s.marginHi, lut: densityLut(s), bbox: [s.cx - ex, s.cx + ex, s.cy - ey, s.cy + ey] };
}

/** Signed distance (mm, positive outside) to a w×h rectangle centred at the origin of its own frame. */
function boxSd(u: number, v: number, hw: number, hh: number): number {
  const qx = Math.abs(u) - hw;
  const qy = Math.abs(v) - hh;
  const ox = Math.max(qx, 0);
  const oy = Math.max(qy, 0);
  return Math.hypot(ox, oy) + Math.min(Math.max(qx, qy), 0);
}

export function renderScene(spec: SceneSpec): RgbImage {
  const { width: w, height: h } = spec;
  const Hi = inv3(spec.H);
  // Pixel footprint on the table: |det J| of image → plane is |det Hi| / wden³.
  const detHi = Math.abs(Hi[0] * (Hi[4] * Hi[8] - Hi[5] * Hi[7]) - Hi[1] * (Hi[3] * Hi[8] - Hi[5] * Hi[6]) + Hi[2] * (Hi[3] * Hi[7] - Hi[4] * Hi[6]));
  const strips = spec.strips.map(prepStrip);
  const card = spec.card;
  const cc = card ? Math.cos(card.angle) : 1;
  const cs = card ? Math.sin(card.angle) : 0;
  const L = spec.light;
  const M = L.camera;
  const fall = L.falloff;
  const lnRatio = Math.log(fall.ratio);
  const ct = L.contact;
  const desk = spec.desk;
  const lin = new Float32Array(w * h * 3);
  const tmp = new Float64Array(3);
  const halfDiag2 = (w * w + h * h) / 4;
  const clutter = spec.clutter.map((c) => ({ ...c, c: Math.cos(c.angle), s: Math.sin(c.angle) }));
  /** Objects on the desk with their own soft shadows, over the desk colour in `out`. */
  const deskClutter = (X: number, Y: number, mm: number, out: Float64Array) => {
    for (const o of clutter) {
      const dx = X - o.cx;
      const dy = Y - o.cy;
      if (Math.abs(dx) > o.hh + 40 || Math.abs(dy) > o.hh + 40) continue;
      const u = dx * o.c + dy * o.s;
      const v = -dx * o.s + dy * o.c;
      // Shadow: the outline shifted away from the light by its height, blurred by half its height.
      const sx = u - (ct.ox * o.c + ct.oy * o.s) * o.height;
      const sy = v - (-ct.ox * o.s + ct.oy * o.c) * o.height;
      const sdS = boxSd(sx, sy, Math.max(0, o.hw - o.round), Math.max(0, o.hh - o.round)) - o.round;
      const sh = 1 - Math.min(0.5, ct.darkness * 1.5) * smooth(0.5 - sdS / (0.5 * o.height + 1));
      const sd = boxSd(u, v, Math.max(0, o.hw - o.round), Math.max(0, o.hh - o.round)) - o.round;
      const cov = clamp01(0.5 - sd / mm);
      let r = o.colour[0];
      let g = o.colour[1];
      let b = o.colour[2];
      if (o.kind === "pencil") {
        const k = 0.75 + 0.45 * Math.cos((Math.min(1, Math.abs(v) / o.hw) * Math.PI) / 2); // a round body: lit along the middle
        r *= k;
        g *= k;
        b *= k;
      } else if (o.kind !== "sticky-note") {
        const innerSd = o.kind === "ink-pad" ? sd + 6 : sd + o.hw * 0.45;
        const t = clamp01(0.5 - innerSd / mm);
        const hole = o.kind === "tape-roll" ? clamp01(0.5 - (sd + o.hw * 0.7) / mm) : 0;
        r = r + (o.inner[0] - r) * t;
        g = g + (o.inner[1] - g) * t;
        b = b + (o.inner[2] - b) * t;
        if (hole > 0) {
          r = r * (1 - hole) + out[0] * 0.8 * hole;
          g = g * (1 - hole) + out[1] * 0.8 * hole;
          b = b * (1 - hole) + out[2] * 0.8 * hole;
        }
      }
      out[0] = out[0] * sh * (1 - cov) + r * cov;
      out[1] = out[1] * sh * (1 - cov) + g * cov;
      out[2] = out[2] * sh * (1 - cov) + b * cov;
    }
  };
  const shadowPrep = L.shadows.map((s) => ({ ...s, c: Math.cos(s.angle), s: Math.sin(s.angle) }));

  for (let y = 0; y < h; y++) {
    for (let x = 0; x < w; x++) {
      const px = x + 0.5;
      const py = y + 0.5;
      const wd = Hi[6] * px + Hi[7] * py + Hi[8];
      const X = (Hi[0] * px + Hi[1] * py + Hi[2]) / wd;
      const Y = (Hi[3] * px + Hi[4] * py + Hi[5]) / wd;
      const mm = Math.sqrt(detHi / Math.abs(wd * wd * wd)); // one pixel's size on the table, mm

      // Strips on top: coverage of the one under this pixel (they never overlap).
      let sCov = 0;
      let sr = 0;
      let sg = 0;
      let sb = 0;
      let under = 1; // light reaching what lies under the strips' edges (their thin shadows)
      for (const s of strips) {
        if (X < s.bbox[0] || X > s.bbox[1] || Y < s.bbox[2] || Y > s.bbox[3]) continue;
        const dx = X - s.cx;
        const dy = Y - s.cy;
        const u = dx * s.c + dy * s.s;
        const v = -dx * s.s + dy * s.c;
        const sd = boxSd(u, v, s.hl, s.hw);
        if (sd > -mm && sd < 2.5) {
          // Contact shadow: the strip's outline shifted away from the light, softened over ~0.5 mm.
          const su = (dx - ct.ox) * s.c + (dy - ct.oy) * s.s;
          const sv = -(dx - ct.ox) * s.s + (dy - ct.oy) * s.c;
          under *= 1 - ct.darkness * smooth(0.5 - boxSd(su, sv, s.hl, s.hw) / 0.6);
        }
        const cov = clamp01(0.5 - sd / mm);
        if (cov <= 0) continue;
        sCov = cov;
        // Paper: grain (fine, ~0.25 mm) and curl shading across the width.
        const grain = s.grain * valueNoise(u / 0.22, v / 0.22, s.seed);
        const vv = v / s.hw;
        const paperK = (1 + grain) * (1 - s.curl * vv * vv);
        let r = s.paper[0] * paperK;
        let g = s.paper[1] * paperK;
        let b = s.paper[2] * paperK;
        const t = (u - s.inkLo) / s.inkLen;
        let inkAmt = 1;
        if (s.fadeLo > 0) inkAmt *= smooth((u - s.inkLo) / s.fadeLo + 0.5);
        else if (t < 0) inkAmt = 0;
        if (s.fadeHi > 0) inkAmt *= smooth((s.inkLo + s.inkLen - u) / s.fadeHi + 0.5);
        else if (t > 1) inkAmt = 0;
        if (inkAmt > 0.001) {
          const li = Math.min(LUT_N - 1, Math.max(0, Math.floor(t * LUT_N))) * 3;
          // Mottle: low-frequency density noise (streaks: stretched along the strip), plus more ink in the paper's valleys.
          const mot = s.streaks ? fbm(u / (s.mottleScale * 4), v / (s.mottleScale * 0.4), s.seed + 3, 3) : fbm(u / s.mottleScale, v / s.mottleScale, s.seed + 3, 3);
          const ev = vv * vv * vv * vv;
          const k = inkAmt * (1 + s.mottle * mot - 0.6 * grain + s.edgeInk * ev * ev);
          r *= Math.exp(-s.lut[li] * k);
          g *= Math.exp(-s.lut[li + 1] * k);
          b *= Math.exp(-s.lut[li + 2] * k);
        }
        sr = r;
        sg = g;
        sb = b;
        break;
      }

      let r = 0;
      let g = 0;
      let b = 0;
      if (sCov < 1) {
        // Card (or desk) under the strip's edge or around it.
        let cCov = 0;
        let shade = under;
        if (card) {
          const dx = X - card.cx;
          const dy = Y - card.cy;
          const u = dx * cc + dy * cs;
          const v = -dx * cs + dy * cc;
          const sd = boxSd(u, v, card.w / 2, card.h / 2);
          cCov = clamp01(0.5 - sd / mm);
          if (cCov < 1 && sd < 3) {
            const su = (dx - ct.ox * 1.5) * cc + (dy - ct.oy * 1.5) * cs;
            const sv = -(dx - ct.ox * 1.5) * cs + (dy - ct.oy * 1.5) * cc;
            shade *= 1 - (1 - cCov) * ct.darkness * smooth(0.5 - boxSd(su, sv, card.w / 2, card.h / 2) / 0.8);
          }
          if (cCov > 0) {
            const k = 1 + card.grain * valueNoise(u / 0.25, v / 0.25, card.seed) + 0.006 * fbm(u / 40, v / 40, card.seed + 1, 2);
            r = card.paper[0] * k * cCov;
            g = card.paper[1] * k * cCov;
            b = card.paper[2] * k * cCov;
          }
        }
        if (cCov < 1) {
          desk.at(X, Y, mm, tmp);
          if (clutter.length) deskClutter(X, Y, mm, tmp);
          r += tmp[0] * (1 - cCov);
          g += tmp[1] * (1 - cCov);
          b += tmp[2] * (1 - cCov);
        }
        r *= shade;
        g *= shade;
        b *= shade;
        r = r * (1 - sCov) + sr * sCov;
        g = g * (1 - sCov) + sg * sCov;
        b = b * (1 - sCov) + sb * sCov;
      } else {
        r = sr;
        g = sg;
        b = sb;
      }

      // Illumination: window falloff (ratio across the lit object), soft shadows; then glare.
      let E = 1;
      if (lnRatio !== 0) {
        const sPos = ((X - fall.ox) * fall.dx + (Y - fall.oy) * fall.dy) / fall.extent + 0.5;
        E = Math.exp(lnRatio * Math.max(-0.4, Math.min(1.4, sPos)));
      }
      for (const sh of shadowPrep) {
        const dx = X - sh.cx;
        const dy = Y - sh.cy;
        const u = dx * sh.c + dy * sh.s;
        const v = -dx * sh.s + dy * sh.c;
        const sd = boxSd(u, v, sh.hw - sh.round, sh.hh - sh.round) - sh.round;
        E *= 1 - sh.darkness * smooth(0.5 - sd / sh.penumbra);
      }
      r *= E;
      g *= E;
      b *= E;
      for (const gl of L.glares) {
        const d2 = (X - gl.cx) ** 2 + (Y - gl.cy) ** 2;
        if (d2 < 16 * gl.sigma * gl.sigma) {
          const k = gl.peak * Math.exp(-d2 / (2 * gl.sigma * gl.sigma));
          r += k;
          g += k;
          b += k;
        }
      }
      const vig = 1 - L.vignette * (((px - w / 2) ** 2 + (py - h / 2) ** 2) / halfDiag2);
      const o = (y * w + x) * 3;
      lin[o] = (M[0] * r + M[1] * g + M[2] * b) * vig;
      lin[o + 1] = (M[3] * r + M[4] * g + M[5] * b) * vig;
      lin[o + 2] = (M[6] * r + M[7] * g + M[8] * b) * vig;
    }
  }

  if (spec.blurPx > 0.2) gaussianBlur(lin, w, h, spec.blurPx);
  if (spec.sharpen) {
    // Phones sharpen: image + amount · (image − blurred image), which rings at edges (halos).
    const soft = new Float32Array(lin);
    gaussianBlur(soft, w, h, spec.sharpen.sigma);
    const a = spec.sharpen.amount;
    for (let i = 0; i < lin.length; i++) lin[i] += a * (lin[i] - soft[i]);
  }
  return { width: w, height: h, data: encode(lin, spec.noise, spec.seed * 31 + spec.cls) };
}

/** Separable Gaussian blur of a linear RGB float image (defocus), edges clamped. */
function gaussianBlur(img: Float32Array, w: number, h: number, sigma: number) {
  const r = Math.ceil(sigma * 2.5);
  const k = new Float32Array(2 * r + 1);
  let sum = 0;
  for (let i = -r; i <= r; i++) sum += k[i + r] = Math.exp(-(i * i) / (2 * sigma * sigma));
  for (let i = 0; i < k.length; i++) k[i] /= sum;
  const line = new Float32Array(Math.max(w, h) * 3);
  for (let y = 0; y < h; y++) {
    const base = y * w * 3;
    line.set(img.subarray(base, base + w * 3));
    for (let x = 0; x < w; x++) {
      let a = 0;
      let b = 0;
      let c = 0;
      for (let i = -r; i <= r; i++) {
        const xx = (x + i < 0 ? 0 : x + i >= w ? w - 1 : x + i) * 3;
        const kk = k[i + r];
        a += line[xx] * kk;
        b += line[xx + 1] * kk;
        c += line[xx + 2] * kk;
      }
      img[base + x * 3] = a;
      img[base + x * 3 + 1] = b;
      img[base + x * 3 + 2] = c;
    }
  }
  // Vertical pass row by row (cache-friendly): out[y] = Σ k[i] · in[y + i].
  const rowLen = w * 3;
  const out = new Float32Array(img.length);
  for (let y = 0; y < h; y++) {
    const base = y * rowLen;
    for (let i = -r; i <= r; i++) {
      const yy = y + i < 0 ? 0 : y + i >= h ? h - 1 : y + i;
      const src = yy * rowLen;
      const kk = k[i + r];
      for (let j = 0; j < rowLen; j++) out[base + j] += kk * img[src + j];
    }
  }
  img.set(out);
}

const ENC_N = 65536;
const ENC = (() => {
  const t = new Float32Array(ENC_N + 1);
  for (let i = 0; i <= ENC_N; i++) t[i] = srgbEncode(i / ENC_N) * 255;
  return t;
})();

/** Shot noise + read noise in linear light (σ = k·√(x + 0.002)), then sRGB encoding to 8 bits; clipping at full scale. */
function encode(lin: Float32Array, k: number, seed: number): Uint8Array {
  const rand = seededRandom(seed);
  const gauss = gaussian(rand);
  const N = 1 << 16;
  const normals = new Float32Array(N);
  for (let i = 0; i < N; i++) normals[i] = gauss();
  const out = new Uint8Array(lin.length);
  let state = (seed * 2654435761) >>> 0 || 1;
  for (let i = 0; i < lin.length; i++) {
    state ^= state << 13;
    state ^= state >>> 17;
    state ^= state << 5;
    let v = lin[i];
    v += k * Math.sqrt((v > 0 ? v : 0) + 0.002) * normals[(state >>> 0) & (N - 1)];
    const e = v <= 0 ? 0 : v >= 1 ? 255 : ENC[Math.round(v * ENC_N)];
    out[i] = Math.round(e);
  }
  return out;
}
