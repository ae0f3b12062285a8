// Blendwell's scene generator: photo-realistic phone photos of blended ink strips lying on a card
// or straight on a desk, with known truth, for tuning and judging the strip analysis (issue 11).
//
// SPLITS — which seeds are which (fixed; never move a seed between them):
//   tuning   seeds 1–50 of every class 1–8       (400 scenes): the analysis's constants may be chosen on these;
//   heldout  seeds 100001–100050 of every class   (400 scenes): only ever scored, never tuned on.
// Seeds from 100001 up are all held-out side: the committed fixtures (tests/fixtures/scenes) and
// the vitest subset (tests/analysis/scenes.test.ts) come from there; seeds below are tuning side.
// A scene is (seed, class): the class fixes the scene's defining condition, the seed everything else.
//
// Rendering is physical where it matters to the analysis: reflectances in linear light, ink as
// optical density on the paper (Beer–Lambert, blends interpolate density — decision 002), a
// pinhole camera over a table plane (perspective), a CAT02 cast (CIE 159:2004; not the Bradford
// transform the analysis corrects with), window falloff, soft shadows, clipped specular glare,
// defocus blur, shot/read noise, vignetting, sRGB encoding and JPEG (sharp/libjpeg).
import sharp from "sharp";
import type { Lab } from "../../../shared/colour/index";
import { labToLinear } from "../../../server/demo/synthetic-photo";
import { linearToLab } from "./colour";
import { applyH, clipConvex, orderStripCorners, polygonArea, type Pt, type Quad } from "./geometry";
import { makeSpec, rectCorners, type SceneOptions } from "./layout";
import { renderScene, type RgbImage } from "./render";
import type { SceneClass, SceneSpec, SceneTruth, StripTruth } from "./types";

export type { SceneClass, SceneTruth, StripTruth, InkTruth } from "./types";
export { CLASS_NAMES } from "./types";
export type { RgbImage } from "./render";
export { renderScene } from "./render";
export type { SceneSpec } from "./types";
export type { SceneOptions } from "./layout";

export const CLASSES: SceneClass[] = [1, 2, 3, 4, 5, 6, 7, 8];
export const SPLITS = {
  tuning: { first: 1, count: 50 },
  heldout: { first: 100001, count: 50 },
} as const;
export type Split = keyof typeof SPLITS;

export function splitSeeds(split: Split): number[] {
  const s = SPLITS[split];
  return Array.from({ length: s.count }, (_, i) => s.first + i);
}

/** Which side of the split a seed is on (the scored ranges are SPLITS; everything from 100001 up is held-out side). */
export function splitOf(seed: number): SceneTruth["split"] {
  if (seed >= SPLITS.heldout.first) return "heldout";
  if (seed >= SPLITS.tuning.first) return "tuning";
  return "other";
}

export type Scene = { rgb: RgbImage; truth: SceneTruth; spec: SceneSpec };

/** Media-relative CIELAB of a reflectance, against the strip's own paper (paper → L* 100). */
function relLab(refl: readonly number[], paper: readonly number[]): Lab {
  return linearToLab([refl[0] / paper[0], refl[1] / paper[1], refl[2] / paper[2]]);
}

/** Reading order: rows top to bottom (on-screen vertical extents overlapping by half the smaller share a row), then left to right. */
export function readingOrder<T extends { corners: Pt[] }>(items: T[]): T[] {
  const info = items.map((it) => {
    const ys = it.corners.map((p) => p[1]);
    const xs = it.corners.map((p) => p[0]);
    return { it, y0: Math.min(...ys), y1: Math.max(...ys), cx: xs.reduce((s, v) => s + v, 0) / xs.length, cy: ys.reduce((s, v) => s + v, 0) / ys.length };
  });
  info.sort((a, b) => a.cy - b.cy);
  const rows: (typeof info)[] = [];
  for (const s of info) {
    const row = rows.find((r) => r.some((o) => Math.min(o.y1, s.y1) - Math.max(o.y0, s.y0) > 0.5 * Math.min(o.y1 - o.y0, s.y1 - s.y0)));
    if (row) row.push(s);
    else rows.push([s]);
  }
  rows.sort((a, b) => a.reduce((s, o) => s + o.cy, 0) / a.length - b.reduce((s, o) => s + o.cy, 0) / b.length);
  return rows.flatMap((r) => r.sort((a, b) => a.cx - b.cx).map((o) => o.it));
}

function truthOf(spec: SceneSpec): SceneTruth {
  const { width: w, height: h } = spec;
  const frac = (p: Pt): [number, number] => {
    const [x, y] = applyH(spec.H, p);
    return [x / w, y / h];
  };
  const paper = spec.strips[0].paper;
  const strips: StripTruth[] = spec.strips.map((s) => {
    const whole = rectCorners(s.cx, s.cy, s.angle, s.length, s.width).map(frac) as Quad;
    // Inked part: the strip less its margins, along u.
    const inkCentre = (s.marginLo - s.marginHi) / 2;
    const inked = rectCorners(s.cx + inkCentre * Math.cos(s.angle), s.cy + inkCentre * Math.sin(s.angle), s.angle, s.length - s.marginLo - s.marginHi, s.width).map(frac) as Quad;
    const o = orderStripCorners(whole);
    const oi = orderStripCorners(inked);
    const flip = (t: number) => (o.reversed ? 1 - t : t);
    let inks = s.inks.map((ink, i) => ({ lab: ink.lab, start: flip(s.flats[i].start), end: flip(s.flats[i].end) }));
    let joins = s.joins.map((j) => flip(j.centre));
    let margins: [number, number] = [s.marginLo / s.length, s.marginHi / s.length];
    if (o.reversed) {
      inks = inks.reverse().map((k) => ({ lab: k.lab, start: k.end, end: k.start }));
      joins = joins.reverse();
      margins = [margins[1], margins[0]];
    }
    const a = [(o.corners[0][0] + o.corners[3][0]) / 2 * w, (o.corners[0][1] + o.corners[3][1]) / 2 * h];
    const b = [(o.corners[1][0] + o.corners[2][0]) / 2 * w, (o.corners[1][1] + o.corners[2][1]) / 2 * h];
    return { corners: o.corners, inkedCorners: oi.corners, orientation: o.orientation, inks, joins, margins, lengthShare: Math.hypot(b[0] - a[0], b[1] - a[1]) / Math.max(w, h) };
  });

  let cardTruth: SceneTruth["card"] = { present: false };
  if (spec.card) {
    const c = spec.card;
    const quad = rectCorners(c.cx, c.cy, c.angle, c.w, c.h).map((p) => applyH(spec.H, p));
    const frame: Pt[] = [
      [0, 0],
      [w, 0],
      [w, h],
      [0, h],
    ];
    const clipped = clipConvex(quad, frame);
    const coverage = clipped.length < 3 ? 0 : Math.abs(polygonArea(clipped)) / (w * h);
    // A side of the frame "shows desk" if at least 5 % of it lies off the card.
    const inside = (p: Pt) => clipConvex([p, [p[0] + 0.01, p[1]], [p[0], p[1] + 0.01]], quad).length >= 3;
    let deskSides = 0;
    for (const side of [0, 1, 2, 3]) {
      let off = 0;
      for (let i = 0; i < 40; i++) {
        const t = (i + 0.5) / 40;
        const p: Pt = side === 0 ? [t * w, 0.5] : side === 1 ? [w - 0.5, t * h] : side === 2 ? [t * w, h - 0.5] : [0.5, t * h];
        if (!inside(p)) off++;
      }
      if (off >= 2) deskSides++;
    }
    cardTruth = { present: true, lab: relLab(c.paper, paper), coverage, deskSides, corners: quad.map(([x, y]) => [x / w, y / h] as Pt) };
  }

  const L = spec.light;
  const mottle = Math.max(...spec.strips.map((s) => s.mottle));
  return {
    seed: spec.seed,
    cls: spec.cls,
    split: splitOf(spec.seed),
    width: spec.outWidth,
    height: spec.outHeight,
    renderedWidth: w,
    renderedHeight: h,
    quality: spec.quality,
    desk: { kind: spec.desk.kind, sub: spec.desk.sub, colours: spec.desk.colours.map((lab) => relLab(labToLinear(lab), paper)), clutter: spec.clutter.map((c) => c.kind) },
    card: cardTruth,
    light: {
      cct: Math.round(L.cct),
      xy: [Number(L.xy[0].toFixed(5)), Number(L.xy[1].toFixed(5))],
      cast: L.cast,
      falloff: Number(L.falloff.ratio.toFixed(3)),
      shadow: L.shadows.length > 0,
      shadowOverStrip: spec.shadowOverStrip,
      glare: L.glares.length > 0,
      glareOverStrip: spec.glareOverStrip,
      vignette: Number(L.vignette.toFixed(3)),
    },
    camera: { tiltDeg: Number(spec.tiltDeg.toFixed(2)), layoutRotationDeg: Number(spec.layoutRotationDeg.toFixed(2)), hfovDeg: Number(spec.hfovDeg.toFixed(1)) },
    nuisances: {
      mottle: Number(mottle.toFixed(3)),
      streaks: spec.strips.some((s) => s.streaks),
      grain: Number(Math.max(...spec.strips.map((s) => s.grain)).toFixed(4)),
      blurPx: Number(spec.blurPx.toFixed(2)),
      sharpen: spec.sharpen ? Number(spec.sharpen.amount.toFixed(2)) : 0,
      noise: Number(spec.noise.toFixed(4)),
    },
    whiteAvailable: L.cast,
    strips: readingOrder(strips),
  };
}

/** A scene: rendered 8-bit sRGB pixels (upright, 3 channels) and its truth. */
export function makeScene(seed: number, cls: SceneClass, opts: SceneOptions = {}): Scene {
  const spec = makeSpec(seed, cls, opts);
  return { rgb: renderScene(spec), truth: truthOf(spec), spec };
}

/** Only the truth (no rendering): cheap, for choosing scenes by what they contain. */
export function sceneTruth(seed: number, cls: SceneClass, opts: SceneOptions = {}): SceneTruth {
  return truthOf(makeSpec(seed, cls, opts));
}

/**
 * The scene as a phone JPEG at its own quality (or `quality`). A 48 MP scene is rendered at 12 MP
 * and upscaled 2× here with sharp's Lanczos kernel, as a phone's binned 48 MP mode delivers soft
 * full-size frames; rendering 48 MP procedurally would take a minute per scene.
 */
export async function sceneToJpeg(scene: Scene, quality = scene.truth.quality): Promise<Buffer> {
  const { rgb, truth } = scene;
  let p = sharp(Buffer.from(rgb.data.buffer, rgb.data.byteOffset, rgb.data.byteLength), { raw: { width: rgb.width, height: rgb.height, channels: 3 } });
  if (truth.width > truth.renderedWidth && rgb.width === truth.renderedWidth) p = p.resize(truth.width, truth.height, { kernel: "lanczos3" });
  return p.jpeg({ quality }).toBuffer();
}
