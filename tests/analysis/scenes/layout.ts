// Random scene descriptions per class: what lies on the table, where the phone is, and the light.
// Everything is drawn from one seeded generator, so a seed and a class always give the same scene.
import { deltaE2000, type Lab } from "../../../shared/colour/index";
import { castMatrix, labToLinear, seededRandom, syntheticCatalogue } from "../../../server/demo/synthetic-photo";
import { illuminantXy, labFromLch } from "./colour";
import { DESK_KINDS, makeDesk, type DeskKind } from "./desk";
import { applyH, clipConvex, inv3, mul3, polygonArea, type Mat3, type Pt } from "./geometry";
import { hash2 } from "./noise";
import type { ClutterSpec, GlareSpec, InkSpec, SceneClass, SceneSpec, ShadowSpec, StripSpec } from "./types";

type Rand = () => number;
const U = (r: Rand, a: number, b: number) => a + (b - a) * r();
const chance = (r: Rand, p: number) => r() < p;
const pick = <T>(r: Rand, xs: readonly T[]): T => xs[Math.floor(r() * xs.length)];
const DEG = Math.PI / 180;

const CATALOGUE = syntheticCatalogue();
const WHITE: Lab = { l: 100, a: 0, b: 0 };

export type SceneOptions = { maxLongEdge?: number };

/** One random ink colour: half from the invented catalogue, half invented here; inside sRGB either way. */
function randomInk(rand: Rand): Lab {
  if (chance(rand, 0.5)) return pick(rand, CATALOGUE).lab;
  for (;;) {
    const lab = labFromLch(U(rand, 25, 90), U(rand, 10, 80), rand() * 360);
    const lin = labToLinear(lab);
    if (lin.every((v) => v > 0.003 && v < 0.97)) return lab;
  }
}

/**
 * Inks for one strip: neighbours at least ΔE2000 15 apart and every ink at least 15 from the paper
 * (a crafter blends inks that differ; a near-white "ink" is paper), and every ink still above the
 * camera's black under the cast and the dimmest light on the strip (a clipped channel is lost to
 * any method).
 */
function pickInks(rand: Rand, k: number, cam: Mat3, dimmest: number): Lab[] {
  for (let attempt = 0; attempt < 2000; attempt++) {
    const inks: Lab[] = [];
    for (let tries = 0; inks.length < k && tries < 300; tries++) {
      const lab = randomInk(rand);
      if (deltaE2000(lab, WHITE) < 15) continue;
      if (inks.some((x) => deltaE2000(x, lab) < 8)) continue;
      if (inks.length && deltaE2000(inks[inks.length - 1], lab) < 15) continue;
      const lin = labToLinear(lab);
      const c = [0, 1, 2].map((i) => (cam[i * 3] * lin[0] + cam[i * 3 + 1] * lin[1] + cam[i * 3 + 2] * lin[2]) * dimmest);
      if (c.some((v) => v < 0.0015)) continue;
      inks.push(lab);
    }
    if (inks.length === k) return inks;
  }
  throw new Error("could not pick inks");
}

/** Optical density (−ln transmission, per linear sRGB channel) of an ink layer on white paper. */
function densityOf(lab: Lab): [number, number, number] {
  return labToLinear(lab).map((v) => -Math.log(Math.max(1e-4, Math.min(1, v)))) as [number, number, number];
}

/**
 * Where each ink lies flat and where each blend is, as fractions of the inked part. Ordinary
 * strips: blends 3–16 % of the length, every flat stretch at least 5 %. Class 5: blends 2–22 %.
 * Class 8 (long blends): the flats together take 0–12 %, the blends the rest.
 */
function inkLayout(rand: Rand, k: number, cls: SceneClass, fadeLo: number, fadeHi: number) {
  const lo = fadeLo / 2;
  const span = 1 - fadeLo / 2 - fadeHi / 2;
  let flats: number[];
  let blends: number[];
  if (cls === 8) {
    const flatShare = U(rand, 0, 0.12);
    const fw = Array.from({ length: k }, () => U(rand, 0.2, 1.8));
    const bw = Array.from({ length: k - 1 }, () => U(rand, 0.6, 1.4));
    const fs = fw.reduce((s, x) => s + x, 0);
    const bs = bw.reduce((s, x) => s + x, 0);
    flats = fw.map((x) => (x / fs) * flatShare);
    blends = bw.map((x) => (x / bs) * (1 - flatShare));
  } else {
    for (;;) {
      blends = Array.from({ length: k - 1 }, () => (cls === 5 ? U(rand, 0.02, 0.22) : U(rand, 0.03, 0.16)));
      const free = 1 - blends.reduce((s, x) => s + x, 0);
      const fw = Array.from({ length: k }, () => U(rand, 0.6, 1.4));
      const fs = fw.reduce((s, x) => s + x, 0);
      flats = fw.map((x) => (x / fs) * free);
      if (flats.every((f) => f >= 0.05)) break;
    }
  }
  const out: { start: number; end: number }[] = [];
  const joins: { centre: number; width: number }[] = [];
  let pos = 0;
  for (let i = 0; i < k; i++) {
    out.push({ start: lo + pos * span, end: lo + (pos + flats[i]) * span });
    pos += flats[i];
    if (i < k - 1) {
      joins.push({ centre: lo + (pos + blends[i] / 2) * span, width: blends[i] * span });
      pos += blends[i];
    }
  }
  return { flats: out, joins };
}

function paperWhite(rand: Rand): Lab {
  // Cardstock whites: bright, slightly warm (b* up to +5) or cool (b* down to −3).
  return { l: U(rand, 91, 97), a: U(rand, -1, 1.2), b: chance(rand, 0.6) ? U(rand, 0.5, 5) : U(rand, -3, 0.5) };
}

function rotate(p: Pt, a: number): Pt {
  const c = Math.cos(a);
  const s = Math.sin(a);
  return [p[0] * c - p[1] * s, p[0] * s + p[1] * c];
}

export function rectCorners(cx: number, cy: number, angle: number, len: number, wid: number): [Pt, Pt, Pt, Pt] {
  const c = Math.cos(angle);
  const s = Math.sin(angle);
  const hl = len / 2;
  const hw = wid / 2;
  // Going round the rectangle with corner 0 → 1 along the long (u) axis.
  return [
    [cx - hl * c + hw * s, cy - hl * s - hw * c],
    [cx + hl * c + hw * s, cy + hl * s - hw * c],
    [cx + hl * c - hw * s, cy + hl * s + hw * c],
    [cx - hl * c - hw * s, cy - hl * s + hw * c],
  ];
}

function stripQuad(s: { cx: number; cy: number; angle: number; length: number; width: number }, grow = 0) {
  return rectCorners(s.cx, s.cy, s.angle, s.length + 2 * grow, s.width + 2 * grow);
}

/** Pinhole camera looking at T from distance D, tilted by `tilt` from the table's normal towards azimuth `az`. Returns plane (mm) → image (px). */
function cameraH(T: Pt, D: number, tilt: number, az: number, f: number, w: number, h: number): Mat3 {
  const C = [T[0] + D * Math.sin(tilt) * Math.cos(az), T[1] + D * Math.sin(tilt) * Math.sin(az), D * Math.cos(tilt)];
  const z = [T[0] - C[0], T[1] - C[1], -C[2]];
  const zn = Math.hypot(z[0], z[1], z[2]);
  const zc = z.map((v) => v / zn);
  // x axis: the table's X direction made perpendicular to the view (no roll of the phone).
  const dot = zc[0];
  let xc = [1 - dot * zc[0], -dot * zc[1], -dot * zc[2]];
  const xn = Math.hypot(xc[0], xc[1], xc[2]);
  xc = xc.map((v) => v / xn);
  const yc = [zc[1] * xc[2] - zc[2] * xc[1], zc[2] * xc[0] - zc[0] * xc[2], zc[0] * xc[1] - zc[1] * xc[0]];
  const R = [...xc, ...yc, ...zc];
  const t = [0, 1, 2].map((i) => -(R[i * 3] * C[0] + R[i * 3 + 1] * C[1] + R[i * 3 + 2] * C[2]));
  // Plane point (X, Y, 0): columns r1, r2 and t of [R | t].
  const P = [R[0], R[1], t[0], R[3], R[4], t[1], R[6], R[7], t[2]];
  const K = [f, 0, w / 2, 0, f, h / 2, 0, 0, 1];
  return mul3(K, P);
}

function frameCoverage(H: Mat3, quad: Pt[], w: number, h: number): number {
  const img = quad.map((p) => applyH(H, p));
  const frame: Pt[] = [
    [0, 0],
    [w, 0],
    [w, h],
    [0, h],
  ];
  const c = clipConvex(img, frame);
  return c.length < 3 ? 0 : Math.abs(polygonArea(c)) / (w * h);
}

function inFrame(H: Mat3, pts: Pt[], w: number, h: number, margin: number): boolean {
  return pts.every((p) => {
    const [x, y] = applyH(H, p);
    return x >= margin * w && x <= (1 - margin) * w && y >= margin * h && y <= (1 - margin) * h;
  });
}

/** Make a scene description. `seed` and `cls` fix everything; `maxLongEdge` only renders it smaller. */
export function makeSpec(seed: number, cls: SceneClass, opts: SceneOptions = {}): SceneSpec {
  const rand = seededRandom(Math.floor(hash2(seed, cls, 0x5ce9e5) * 4294967296));

  // --- Frame: phones shoot 4:3 mostly, some 16:9 or square; 12 MP and 48 MP in class 5 and now and then elsewhere.
  const aspect = pick(rand, [4 / 3, 4 / 3, 4 / 3, 4 / 3, 4 / 3, 4 / 3, 16 / 9, 1]);
  const r48 = cls === 5 ? rand() : 1;
  let long: number;
  let upscale = 1;
  if (cls === 5 && r48 < 0.25) {
    long = 4000; // 48 MP: rendered at 12 MP, upscaled 2× by sharp when written (see sceneToJpeg)
    upscale = 2;
  } else if ((cls === 5 && r48 < 0.65) || (cls !== 5 && chance(rand, 0.15))) long = 4000;
  else long = Math.round(U(rand, 1600, 3000));
  const portrait = chance(rand, 0.5);
  let width = portrait ? Math.round(long / aspect) : long;
  let height = portrait ? long : Math.round(long / aspect);
  let outWidth = width * upscale;
  let outHeight = height * upscale;
  if (opts.maxLongEdge && Math.max(width, height) > opts.maxLongEdge) {
    const k = opts.maxLongEdge / Math.max(width, height);
    width = outWidth = Math.round(width * k);
    height = outHeight = Math.round(height * k);
  }
  const quality = cls === 5 ? Math.round(U(rand, 70, 80)) : Math.round(U(rand, 70, 95));

  // --- What lies on the table.
  const cardPresent = cls === 1 ? true : cls === 2 ? false : chance(rand, { 3: 0.75, 4: 0.85, 5: 0.7, 6: 0.5, 7: 0.6, 8: 0.7 }[cls]);
  const deskKind: DeskKind = pick(rand, DESK_KINDS);
  const desk = makeDesk(rand, deskKind);
  const nStrips = cls === 6 ? 2 + Math.floor(Math.pow(rand(), 1.4) * 11) : 1;
  const withMargins = chance(rand, cls === 2 ? 0.5 : cls === 6 ? 0.4 : 0.45);
  const whiteAvailable = cardPresent || withMargins;

  // --- Light (the cast is chosen first: inks must survive it).
  const cct = Math.exp(U(rand, Math.log(2856), Math.log(7504)));
  const xy = illuminantXy(cct);
  const cast = whiteAvailable;
  const castM = cast ? castMatrix(xy) : [1, 0, 0, 0, 1, 0, 0, 0, 1];
  const cardLab = paperWhite(rand);
  const cardPaper = labToLinear(cardLab) as [number, number, number];
  // Most strips are cut from the same cardstock as the card; some from another white within ~ΔE 0.8.
  const stripLab: Lab = whiteAvailable
    ? chance(rand, 0.25)
      ? { l: cardLab.l + U(rand, -0.7, 0.7), a: cardLab.a + U(rand, -0.4, 0.4), b: cardLab.b + U(rand, -0.6, 0.6) }
      : cardLab
    : { l: U(rand, 91, 97), a: 0, b: 0 }; // no white in the photo: a neutral paper, so "taken as balanced" is right
  const stripPaper = labToLinear(stripLab) as [number, number, number];
  const falloffRatio = !whiteAvailable ? 1 : cls === 4 ? U(rand, 0.6, 0.75) : chance(rand, 0.6) ? U(rand, 0.82, 0.97) : 1;
  const paperCam = castM.slice(0, 3).map((_, i) => castM[i * 3] * stripPaper[0] + castM[i * 3 + 1] * stripPaper[1] + castM[i * 3 + 2] * stripPaper[2]);
  // The phone exposes the paper to 72–92 % of full scale; with no white in the photo, exactly to full scale (a balanced photo).
  const exposure = whiteAvailable ? U(rand, 0.72, 0.92) / Math.max(...paperCam) : 1 / Math.max(...paperCam);
  const camera = castM.map((v) => v * exposure);
  const shadowWanted = cls === 4 ? chance(rand, 0.65) : whiteAvailable && chance(rand, 0.1);
  const glareWanted = cls === 4 ? !shadowWanted || chance(rand, 0.5) : false;
  const shadowDark = cls === 4 ? U(rand, 0.25, 0.55) : U(rand, 0.1, 0.2);
  const dimmest = falloffRatio * (shadowWanted ? 1 - shadowDark : 1) * 0.7 * Math.min(...stripPaper);

  // --- Strips, laid along the table's X axis around the origin.
  const baseW = U(rand, 14, 45);
  const baseAspect = U(rand, 3, 10);
  const strips: StripSpec[] = [];
  const cols = nStrips === 1 ? 1 : nStrips >= 4 && chance(rand, 0.35) ? (nStrips >= 8 && chance(rand, 0.5) ? 3 : 2) : 1;
  const rows = Math.ceil(nStrips / cols);
  const gapAcross = U(rand, 2.5, 20);
  const gapAlong = U(rand, 6, 30);
  for (let i = 0; i < nStrips; i++) {
    const aspectS = nStrips > 1 ? baseAspect * U(rand, 0.85, 1.15) : baseAspect;
    let width = (nStrips > 1 ? baseW * U(rand, 0.85, 1.15) : baseW) * (cols > 1 ? 0.8 : 1);
    let length = width * Math.min(10, Math.max(3, aspectS));
    if (length > 260) {
      length = 260;
      width = length / Math.min(10, Math.max(3, aspectS));
    }
    if (length < 70) {
      length = 70;
      width = Math.min(width, length / 3);
    }
    const margin = () => U(rand, 0.03, 0.12) * length;
    let marginLo = 0;
    let marginHi = 0;
    if (withMargins || (nStrips > 1 && !cardPresent && chance(rand, 0.2) && withMargins)) {
      const which = rand();
      if (which < 0.5 || nStrips > 1) {
        marginLo = margin();
        marginHi = margin();
      } else if (which < 0.75) marginLo = margin();
      else marginHi = margin();
    }
    const fadeLo = marginLo > 0 ? U(rand, 0.5, 4) : 0;
    const fadeHi = marginHi > 0 ? U(rand, 0.5, 4) : 0;
    const inkLen = length - marginLo - marginHi;
    const k = 2 + Math.floor(rand() * 4);
    const labs = pickInks(rand, k, camera, dimmest);
    const inks: InkSpec[] = labs.map((lab) => ({ lab, density: densityOf(lab) }));
    const lay = inkLayout(rand, k, cls, fadeLo / inkLen, fadeHi / inkLen);
    strips.push({
      cx: 0,
      cy: 0,
      angle: 0,
      length,
      width,
      paper: stripPaper,
      marginLo,
      marginHi,
      fadeLo,
      fadeHi,
      inks,
      flats: lay.flats,
      joins: lay.joins,
      mottle: cls === 5 ? U(rand, 0.08, 0.2) : U(rand, 0.03, 0.08),
      mottleScale: U(rand, 2, 12),
      streaks: cls === 5 ? chance(rand, 0.5) : chance(rand, 0.15),
      grain: cls === 5 ? U(rand, 0.02, 0.04) : U(rand, 0.004, 0.015),
      curl: U(rand, 0, 0.04),
      edgeInk: chance(rand, 0.5) ? U(rand, -0.15, 0.25) : 0,
      seed: Math.floor(rand() * 1e9),
    });
  }
  // Place them in a loose grid (rows one above another, columns end to end), each a little askew.
  for (let attempt = 0; ; attempt++) {
    const grow = 1 + attempt * 0.25;
    const maxLen = Math.max(...strips.map((s) => s.length));
    const rowH = Math.max(...strips.map((s) => s.width)) + gapAcross * grow;
    strips.forEach((s, i) => {
      const r = Math.floor(i / cols);
      const c = i % cols;
      s.cx = (c - (cols - 1) / 2) * (maxLen + gapAlong * grow) + (nStrips > 1 ? U(rand, -4, 4) : 0);
      s.cy = (r - (rows - 1) / 2) * rowH + (nStrips > 1 ? U(rand, -1.5, 1.5) : 0);
      s.angle = nStrips > 1 ? U(rand, -3, 3) * DEG : 0;
      if (nStrips > 1 && chance(rand, 0.5)) s.angle += Math.PI; // some lie the other way round
    });
    // Never touching: every pair at least 2 mm apart (quads grown by 1 mm must not overlap).
    let ok = true;
    for (let i = 0; i < nStrips && ok; i++)
      for (let j = i + 1; j < nStrips && ok; j++) if (clipConvex(stripQuad(strips[i], 1), stripQuad(strips[j], 1)).length >= 3) ok = false;
    if (ok) break;
    if (attempt > 40) throw new Error("could not place strips");
  }

  // --- The card under them: the strips' extent plus uneven margins (the strip is rarely centred).
  let card: SceneSpec["card"] = null;
  const allStripPts = strips.flatMap((s) => stripQuad(s));
  if (cardPresent) {
    const xs = allStripPts.map((p) => p[0]);
    const ys = allStripPts.map((p) => p[1]);
    const cardAspect = U(rand, 1.25, 1.7);
    const cardSplit = rand();
    const skew = chance(rand, 0.7) ? U(rand, -3, 3) * DEG : U(rand, -15, 15) * DEG;
    for (let grow = 1; ; grow *= 1.15) {
      let [l, r, t, b] = [U(rand, 5, 60), U(rand, 5, 60), U(rand, 5, 60), U(rand, 5, 60)].map((m) => m * grow);
      let w = Math.max(...xs) - Math.min(...xs) + l + r;
      let h = Math.max(...ys) - Math.min(...ys) + t + b;
      // Cards are sheets (index card to A4/letter proportions), not slivers: the short side at least long/1.7.
      if (h < w / cardAspect) {
        const extra = w / cardAspect - h;
        t += extra * cardSplit;
        b += extra * (1 - cardSplit);
        h = w / cardAspect;
      } else if (w < h / cardAspect) {
        const extra = h / cardAspect - w;
        l += extra * cardSplit;
        r += extra * (1 - cardSplit);
        w = h / cardAspect;
      }
      const cx = (Math.min(...xs) - l + Math.max(...xs) + r) / 2;
      const cy = (Math.min(...ys) - t + Math.max(...ys) + b) / 2;
      const quad = rectCorners(cx, cy, skew, w - 4, h - 4);
      if (allStripPts.every((p) => insideQuad(p, quad))) {
        card = { cx, cy, angle: skew, w, h, paper: cardPaper, grain: U(rand, 0.006, 0.02) * (cls === 5 ? 2 : 1), seed: Math.floor(rand() * 1e9) };
        break;
      }
    }
  }

  // --- Turn the whole layout on the table: strips run horizontally, vertically or diagonally on screen.
  const rr = rand();
  const psi = (rr < 0.35 ? U(rand, -7, 7) : rr < 0.7 ? 90 + U(rand, -7, 7) : U(rand, 0, 180)) * DEG;
  for (const s of strips) {
    [s.cx, s.cy] = rotate([s.cx, s.cy], psi);
    s.angle += psi;
  }
  if (card) {
    [card.cx, card.cy] = rotate([card.cx, card.cy], psi);
    card.angle += psi;
  }
  const cardQuad = card ? rectCorners(card.cx, card.cy, card.angle, card.w, card.h) : null;
  const stripPts = strips.flatMap((s) => stripQuad(s));

  // --- The phone: tilt, field of view, distance chosen so the card or strips fill the wanted share.
  const tilt = (cls === 3 ? U(rand, 10, 25) : U(rand, 0, 8)) * DEG;
  const az = rand() * 2 * Math.PI;
  const hfov = U(rand, 62, 76);
  const f = width > height ? width / 2 / Math.tan((hfov / 2) * DEG) : height / 2 / Math.tan((hfov / 2) * DEG);
  const groupCentre: Pt = [stripPts.reduce((s, p) => s + p[0], 0) / stripPts.length, stripPts.reduce((s, p) => s + p[1], 0) / stripPts.length];
  const longEdge = Math.max(width, height);
  const stripLenShare = (H: Mat3) => {
    // The longest on-screen extent of the strips, as a share of the long edge.
    const img = stripPts.map((p) => applyH(H, p));
    let m = 0;
    for (const a of img) for (const b of img) m = Math.max(m, Math.hypot(a[0] - b[0], a[1] - b[1]));
    return m / longEdge;
  };
  let metric: (H: Mat3) => number;
  let target: number;
  if (cls === 7) {
    metric = stripLenShare;
    target = U(rand, 0.15, 0.3);
  } else if (cardQuad) {
    metric = (H) => frameCoverage(H, cardQuad, width, height);
    target = U(rand, 0.3, 0.95);
  } else {
    metric = stripLenShare;
    target = nStrips > 1 ? U(rand, 0.5, 0.9) : U(rand, 0.35, 0.85);
  }
  const objCentre: Pt = card ? [card.cx, card.cy] : groupCentre;
  const objSize = card ? Math.max(card.w, card.h) : Math.max(...strips.map((s) => s.length));
  let offset: Pt = [U(rand, -1, 1) * objSize * (cls === 7 ? 0.8 : 0.25), U(rand, -1, 1) * objSize * (cls === 7 ? 0.8 : 0.25)];
  let H: Mat3 = [];
  let placed = false;
  // Aim off-centre first; if the strips leave the frame, bring the aim back to the middle, then
  // step back (a smaller share) until every strip corner is at least 2.5 % inside the frame.
  for (let attempt = 0; attempt < 120 && !placed; attempt++) {
    if (attempt >= 8) offset = [0, 0];
    const T: Pt = [objCentre[0] + offset[0], objCentre[1] + offset[1]];
    let lo = Math.log(30);
    let hi = Math.log(20000);
    for (let it = 0; it < 40; it++) {
      const mid = (lo + hi) / 2;
      const m = metric(cameraH(T, Math.exp(mid), tilt, az, f, width, height));
      if (m > target) lo = mid;
      else hi = mid;
    }
    H = cameraH(T, Math.exp((lo + hi) / 2), tilt, az, f, width, height);
    if (inFrame(H, stripPts, width, height, 0.025)) placed = true;
    else if (attempt < 8) offset = [offset[0] * 0.6, offset[1] * 0.6];
    else target *= 0.96;
  }
  if (!placed) throw new Error(`scene ${seed}/${cls}: could not frame the strips`);

  // --- Light on the table: falloff from a window side, shadows, glare.
  const litObj = cardQuad ?? stripPts;
  const fdir = rand() * 2 * Math.PI;
  const [dx, dy] = [Math.cos(fdir), Math.sin(fdir)];
  const proj = litObj.map((p) => p[0] * dx + p[1] * dy);
  const falloff = { ratio: falloffRatio, ox: objCentre[0], oy: objCentre[1], dx, dy, extent: Math.max(...proj) - Math.min(...proj) };
  const shadows: ShadowSpec[] = [];
  let shadowOverStrip = false;
  if (shadowWanted) {
    const s = pick(rand, strips);
    const onStrip = chance(rand, 0.6);
    const along = U(rand, -0.5, 0.5) * s.length;
    const anchor: Pt = onStrip ? [s.cx + along * Math.cos(s.angle), s.cy + along * Math.sin(s.angle)] : cardQuad ? pick(rand, cardQuad) : [s.cx, s.cy];
    const phone = chance(rand, 0.5);
    const hw = phone ? U(rand, 35, 45) : U(rand, 40, 60);
    const hh = phone ? U(rand, 70, 85) : U(rand, 50, 80);
    const a = rand() * 2 * Math.PI;
    const dist = U(rand, 0.3, 1) * Math.min(hw, hh);
    shadows.push({ cx: anchor[0] + dist * Math.cos(a), cy: anchor[1] + dist * Math.sin(a), angle: rand() * Math.PI, hw, hh, round: phone ? 8 : Math.min(hw, hh), penumbra: U(rand, 6, 25), darkness: shadowDark });
    shadowOverStrip = onStrip;
  }
  const glares: GlareSpec[] = [];
  let glareOverStrip = false;
  if (glareWanted) {
    const s = pick(rand, strips);
    glareOverStrip = chance(rand, 0.5);
    const sigma = glareOverStrip ? U(rand, 0.015, 0.05) * s.length : U(rand, 4, 15);
    let c: Pt;
    if (glareOverStrip) {
      const along = U(rand, -0.4, 0.4) * s.length;
      c = [s.cx + along * Math.cos(s.angle), s.cy + along * Math.sin(s.angle)];
    } else {
      // Beside the strip, on the card (or desk), a few glare radii away from it.
      const side = chance(rand, 0.5) ? 1 : -1;
      const off = s.width / 2 + U(rand, 2.5, 6) * sigma;
      const along = U(rand, -0.5, 0.5) * s.length;
      c = [s.cx + along * Math.cos(s.angle) - side * off * Math.sin(s.angle), s.cy + along * Math.sin(s.angle) + side * off * Math.cos(s.angle)];
    }
    glares.push({ cx: c[0], cy: c[1], sigma, peak: U(rand, 1.3, 3) });
  }
  const lightDir = fdir + Math.PI; // thin shadows of the cardstock's edges fall away from the window
  const contactLen = U(rand, 0.2, 1.0);
  const contact = { ox: contactLen * Math.cos(lightDir), oy: contactLen * Math.sin(lightDir), darkness: U(rand, 0.08, 0.3) };

  // --- Clutter on the desk around the card (pencils, an ink pad, a sticky note, a roll of tape).
  const clutter: ClutterSpec[] = [];
  const nClutter = chance(rand, 0.35) ? 1 + Math.floor(rand() * 3) : 0;
  const Hinv = inv3(H);
  const keepOut = [...(cardQuad ? [cardQuad] : []), ...strips.map((s) => stripQuad(s, 8))];
  for (let i = 0; i < nClutter; i++) {
    const kind = pick(rand, ["pencil", "pencil", "ink-pad", "sticky-note", "tape-roll"] as const);
    const colourLab = kind === "sticky-note" ? labFromLch(U(rand, 75, 90), U(rand, 40, 75), pick(rand, [95, 100, 0, 140, 250, 330])) : labFromLch(U(rand, 25, 70), U(rand, 10, 70), rand() * 360);
    const innerLab = kind === "ink-pad" ? labFromLch(U(rand, 20, 60), U(rand, 10, 60), rand() * 360) : kind === "tape-roll" ? labFromLch(U(rand, 70, 85), U(rand, 5, 15), 80) : colourLab;
    const [hw, hh, round, height] =
      kind === "pencil" ? [3.5, U(rand, 70, 95), 3.5, 7] : kind === "ink-pad" ? [U(rand, 30, 50), U(rand, 30, 50), 6, 15] : kind === "sticky-note" ? [38, 38, 1, 1] : [U(rand, 22, 30), 0, 0, 14];
    const shape = { hw, hh: kind === "tape-roll" ? hw : hh, round: kind === "tape-roll" ? hw : round };
    for (let tries = 0; tries < 30; tries++) {
      const [X, Y] = applyH(Hinv, [U(rand, -0.1, 1.1) * width, U(rand, -0.1, 1.1) * height]);
      const angle = rand() * Math.PI;
      const quad = rectCorners(X, Y, angle, 2 * shape.hh + 10, 2 * shape.hw + 10);
      if (keepOut.some((q) => clipConvex(quad, q).length >= 3)) continue;
      clutter.push({ kind, cx: X, cy: Y, angle: angle + Math.PI / 2, ...shape, colour: refl(colourLab), inner: refl(innerLab), height });
      keepOut.push(quad);
      break;
    }
  }

  return {
    seed,
    cls,
    width,
    height,
    outWidth,
    outHeight,
    quality,
    H,
    tiltDeg: tilt / DEG,
    hfovDeg: hfov,
    layoutRotationDeg: psi / DEG,
    desk,
    clutter,
    card,
    strips,
    light: { cct, xy, cast, camera, falloff, shadows, glares, contact, vignette: whiteAvailable ? U(rand, 0, 0.25) : U(rand, 0, 0.08) },
    sharpen: chance(rand, 0.5) ? { amount: U(rand, 0.2, 0.8), sigma: U(rand, 0.8, 1.6) } : null,
    blurPx: (cls === 5 ? U(rand, 0.5, 1.3) : U(rand, 0.3, 1.0)) * (Math.max(width, height) / 1600),
    noise: cls === 5 ? U(rand, 0.015, 0.035) : U(rand, 0.006, 0.02),
    shadowOverStrip,
    glareOverStrip,
  };
}

function refl(lab: Lab): [number, number, number] {
  return labToLinear(lab).map((v) => Math.min(0.95, Math.max(0.002, v))) as [number, number, number];
}

function insideQuad(p: Pt, q: Pt[]): boolean {
  let sgn = 0;
  for (let i = 0; i < 4; i++) {
    const a = q[i];
    const b = q[(i + 1) % 4];
    const c = Math.sign((b[0] - a[0]) * (p[1] - a[1]) - (b[1] - a[1]) * (p[0] - a[0]));
    if (!sgn) sgn = c;
    else if (c && c !== sgn) return false;
  }
  return true;
}

/** Image pixel → table plane, for the renderer. */
export function planeFromImage(H: Mat3): Mat3 {
  return inv3(H);
}
