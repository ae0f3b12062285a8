// Finds every strip in a photo as it is really taken: on a white card with the desk around it, or
// straight on the desk. The card is the large paper-coloured region; strips on it are the regions
// it encloses. Strips on the desk are regions whose colour the desk (seen at the photo's border)
// does not explain. Each region must look like cut cardstock: long, straight-sided, filled.
// Thresholds are ours, chosen on the tuning split of tests/analysis/scenes (decision 009).
import { NoStripError } from "./no-strip-error";
import { PAPER_MAX_TEXTURE, sceneMaps, type SceneMaps } from "./scene-maps";
import { fitQuad, orderQuad, polygonArea, readingOrder, type OrderedQuad, type Point } from "./strip-quad";
import type { RgbImage } from "./types";
import { components, minAreaRect, morph, type Component } from "./vision";

export type StripSurface = "paper" | "desk" | "crop";

export type FoundStrip = OrderedQuad & { surface: StripSurface };

export type Scene = {
  maps: SceneMaps;
  /** The card (paper regions at least CARD_MIN_SHARE of the photo), or null. */
  card: Uint8Array | null;
};

/** A paper region this share of the photo or more is a card (or the desk's own paper). */
const CARD_MIN_SHARE = 0.04;
/** Linear luminance (90th percentile) below which a frame-filling smooth "paper" is a pale desk (L* ≈ 92). */
const PALE_DESK_MAX_LUM = 0.8;
/** Shape of cut cardstock. */
const MIN_ASPECT = 2.2;
const MIN_THICKNESS_PX = 5;
const MIN_LENGTH_SHARE = 0.1; // of the photo's long edge
const MIN_FILL = 0.78; // region area / convex hull area
const MIN_QUAD_COVER = 0.85; // convex hull area / quad area
/** Ink: this far (ΔE*ab, rough) from the local paper white. */
const INK_CORE = 10;
/** Desk colour model: clusters, and how far (weighted Lab) from every cluster a strip pixel is. */
const DESK_CLUSTERS = 8;
const DESK_FAR = 14;

type Region = { pts: Point[]; area: number; comp: Component };

function regionsOf(mask: Uint8Array, w: number, h: number, keep: (c: Component) => boolean): Region[] {
  const { labels, list } = components(mask, w, h);
  const wanted = new Map<number, Region>();
  for (const c of list) if (keep(c)) wanted.set(c.label, { pts: [], area: c.area, comp: c });
  if (wanted.size === 0) return [];
  for (const c of wanted.values()) {
    for (let y = c.comp.top; y < c.comp.top + c.comp.height; y++) {
      for (let x = c.comp.left; x < c.comp.left + c.comp.width; x++) {
        if (labels[y * w + x] === c.comp.label) c.pts.push([x, y]);
      }
    }
  }
  return [...wanted.values()];
}

const touchesBorder = (c: Component, w: number, h: number) => c.left <= 0 || c.top <= 0 || c.left + c.width >= w || c.top + c.height >= h;

/** Why a region is not a strip, or null when it is one. */
type Verdict = { strip: FoundStrip } | { reject: "too_small" | "not_strip_shaped" | "no_ink" };

function judge(r: Region, maps: SceneMaps, surface: StripSurface): Verdict {
  return judgeRegion(r, maps, surface);
}

/**
 * The region without thin spurs (a shadow's edge or a speck touching the strip): opened with a
 * disc a third of the strip's own thickness (estimated from its minimum-area rectangle), keeping
 * the largest piece.
 */
function trimmed(r: Region): Region {
  const box = orderQuad(minAreaRect(r.pts));
  const size = Math.max(3, Math.round(box.thickness / 3) | 1);
  if (box.thickness < 9) return r;
  const { left, top, width, height } = r.comp;
  const pad = size;
  const bw = width + 2 * pad;
  const bh = height + 2 * pad;
  const mask = new Uint8Array(bw * bh);
  for (const [x, y] of r.pts) mask[(y - top + pad) * bw + (x - left + pad)] = 1;
  const opened = morph(mask, bw, bh, "open", size);
  const pieces = regionsOf(opened, bw, bh, () => true);
  if (!pieces.length) return r;
  const best = pieces.reduce((a, b) => (b.area > a.area ? b : a));
  return { pts: best.pts.map(([x, y]) => [x + left - pad, y + top - pad] as Point), area: best.area, comp: r.comp };
}

function judgeRegion(region: Region, maps: SceneMaps, surface: StripSurface): Verdict {
  const { width: w, height: h } = maps;
  const r = trimmed(region);
  const { quad, hullArea } = fitQuad(r.pts);
  const o = orderQuad(quad);
  const quadArea = polygonArea(o.corners);
  if (o.thickness < MIN_THICKNESS_PX || o.length < MIN_LENGTH_SHARE * Math.max(w, h)) return { reject: "too_small" };
  if (o.length / o.thickness < MIN_ASPECT) return { reject: "not_strip_shaped" };
  if (r.area < MIN_FILL * hullArea || hullArea < MIN_QUAD_COVER * quadArea) return { reject: "not_strip_shaped" };
  // Cut cardstock carries ink: a shadow or a fold in the card is paper-coloured all over.
  let ink = 0;
  const step = Math.max(1, Math.floor(r.pts.length / 2000));
  let seen = 0;
  for (let i = 0; i < r.pts.length; i += step) {
    const p = r.pts[i][1] * w + r.pts[i][0];
    const l = maps.lab[p * 3];
    const dl = Math.min(0, l - 100);
    if (Math.hypot(dl, maps.lab[p * 3 + 1], maps.lab[p * 3 + 2]) >= INK_CORE) ink++;
    seen++;
  }
  if (surface === "paper" && ink < 0.3 * seen) return { reject: "no_ink" };
  return { strip: { ...o, surface } };
}

/** Deterministic k-means (k-means++ seeding with a fixed sequence) on 3-D points, L weighted by ½. */
function deskModel(maps: SceneMaps, exclude: Uint8Array): { centres: number[][]; radius: number[] } | null {
  const { width: w, height: h, lab } = maps;
  const ring = Math.max(2, Math.round(0.05 * Math.min(w, h)));
  const pts: number[][] = [];
  const stride = Math.max(1, Math.floor((2 * ring * (w + h)) / 6000));
  let k = 0;
  for (let y = 0; y < h; y++) {
    for (let x = 0; x < w; x++) {
      if (x >= ring && x < w - ring && y >= ring && y < h - ring) continue;
      if (k++ % stride) continue;
      const p = y * w + x;
      if (exclude[p]) continue;
      pts.push([lab[p * 3] / 2, lab[p * 3 + 1], lab[p * 3 + 2]]);
    }
  }
  if (pts.length < 50) return null;
  const centres: number[][] = [pts[Math.floor(pts.length / 2)]];
  const d2 = new Float64Array(pts.length).fill(Infinity);
  while (centres.length < DESK_CLUSTERS) {
    const c = centres[centres.length - 1];
    let far = 0;
    for (let i = 0; i < pts.length; i++) {
      d2[i] = Math.min(d2[i], (pts[i][0] - c[0]) ** 2 + (pts[i][1] - c[1]) ** 2 + (pts[i][2] - c[2]) ** 2);
      if (d2[i] > d2[far]) far = i;
    }
    if (d2[far] < 4) break;
    centres.push(pts[far].slice());
  }
  const assign = new Int32Array(pts.length);
  for (let iter = 0; iter < 10; iter++) {
    const sums = centres.map(() => [0, 0, 0, 0]);
    for (let i = 0; i < pts.length; i++) {
      let best = 0;
      let bd = Infinity;
      for (let j = 0; j < centres.length; j++) {
        const d = (pts[i][0] - centres[j][0]) ** 2 + (pts[i][1] - centres[j][1]) ** 2 + (pts[i][2] - centres[j][2]) ** 2;
        if (d < bd) {
          bd = d;
          best = j;
        }
      }
      assign[i] = best;
      const s = sums[best];
      s[0] += pts[i][0];
      s[1] += pts[i][1];
      s[2] += pts[i][2];
      s[3]++;
    }
    centres.forEach((c, j) => {
      if (sums[j][3]) for (let d = 0; d < 3; d++) c[d] = sums[j][d] / sums[j][3];
    });
  }
  const radius = centres.map(() => 0);
  const counts = centres.map(() => 0);
  for (let i = 0; i < pts.length; i++) {
    const c = centres[assign[i]];
    radius[assign[i]] += (pts[i][0] - c[0]) ** 2 + (pts[i][1] - c[1]) ** 2 + (pts[i][2] - c[2]) ** 2;
    counts[assign[i]]++;
  }
  return { centres, radius: radius.map((r, j) => Math.sqrt(r / Math.max(1, counts[j]))) };
}

function deskForeground(maps: SceneMaps, exclude: Uint8Array): Uint8Array {
  const { width: w, height: h, lab } = maps;
  const fg = new Uint8Array(w * h);
  const model = deskModel(maps, exclude);
  if (!model) return fg;
  const { centres, radius } = model;
  for (let p = 0; p < w * h; p++) {
    if (exclude[p]) continue;
    const l = lab[p * 3] / 2;
    const a = lab[p * 3 + 1];
    const b = lab[p * 3 + 2];
    let far = true;
    for (let j = 0; j < centres.length; j++) {
      const d = Math.sqrt((l - centres[j][0]) ** 2 + (a - centres[j][1]) ** 2 + (b - centres[j][2]) ** 2);
      if (d < Math.max(DESK_FAR, 2.5 * radius[j])) {
        far = false;
        break;
      }
    }
    if (far) fg[p] = 1;
  }
  return fg;
}

/** The whole photo as one strip: a tight crop of the strip itself (ink everywhere, long frame). */
function wholePhoto(maps: SceneMaps): FoundStrip | null {
  const { width: w, height: h, lab } = maps;
  if (Math.max(w, h) / Math.min(w, h) < 1.8) return null;
  let ink = 0;
  let n = 0;
  for (let p = 0; p < w * h; p += 5, n++) {
    const dl = Math.min(0, lab[p * 3] - 100);
    if (Math.hypot(dl, lab[p * 3 + 1], lab[p * 3 + 2]) >= INK_CORE) ink++;
  }
  if (ink < 0.6 * n) return null;
  const o = orderQuad([
    [0, 0],
    [w, 0],
    [w, h],
    [0, h],
  ]);
  return { ...o, surface: "crop" };
}

const kernel = (size: number, f: number) => Math.max(3, Math.round(f * size) | 1);

/** The photo's maps and its card, if there is one: large regions of paper, grain and specks closed over. */
export function detectScene(img: RgbImage): Scene {
  const maps = sceneMaps(img);
  const { width: w, height: h } = maps;
  const n = w * h;
  const paperClean = morph(morph(maps.paper, w, h, "open", 3), w, h, "close", kernel(Math.max(w, h), 0.006));
  const paperRegions = regionsOf(paperClean, w, h, (c) => c.area >= CARD_MIN_SHARE * n).filter((r) => {
    const tex: number[] = [];
    const step = Math.max(1, Math.floor(r.pts.length / 3000));
    for (let i = 0; i < r.pts.length; i += step) tex.push(maps.texture[r.pts[i][1] * w + r.pts[i][0]]);
    tex.sort((a, b) => a - b);
    if (tex[tex.length >> 1] > PAPER_MAX_TEXTURE) return false;
    // A smooth pale desk filling the frame: it reaches all four edges of the photo and is
    // photographed well below full scale (a card is always exposed near white or shows an edge).
    const c = r.comp;
    const allSides = c.left <= 0 && c.top <= 0 && c.left + c.width >= w && c.top + c.height >= h;
    if (allSides) {
      const lums: number[] = [];
      for (let i = 0; i < r.pts.length; i += step) lums.push(maps.lum[r.pts[i][1] * w + r.pts[i][0]]);
      lums.sort((a, b) => a - b);
      if (lums[Math.floor(0.9 * (lums.length - 1))] < PALE_DESK_MAX_LUM) return false;
    }
    return true;
  });
  let card: Uint8Array | null = null;
  if (paperRegions.length) {
    card = new Uint8Array(n);
    for (const r of paperRegions) for (const [x, y] of r.pts) card[y * w + x] = 1;
  }
  return { maps, card };
}

/** Every strip in the photo, in reading order; throws NoStripError (with the reason) when there is none. */
export function findStrips(scene: Scene): FoundStrip[] {
  const { maps, card } = scene;
  const { width: w, height: h } = maps;
  const n = w * h;
  const k = (f: number) => kernel(Math.max(w, h), f);

  const found: FoundStrip[] = [];
  const rejects: string[] = [];
  const taken = new Uint8Array(n);
  if (card) {
    // Strips on the card: what the paper encloses (not connected to the photo's border).
    const notCard = new Uint8Array(n);
    for (let p = 0; p < n; p++) notCard[p] = card[p] ? 0 : 1;
    const holes = regionsOf(notCard, w, h, (c) => !touchesBorder(c, w, h) && c.area >= 0.0005 * n);
    for (const r of holes) {
      for (const [x, y] of r.pts) taken[y * w + x] = 1;
      const v = judge(r, maps, "paper");
      if ("strip" in v) found.push(v.strip);
      else rejects.push(v.reject);
    }
  }
  // Strips on the desk (beside the card, or with no card at all).
  const exclude = new Uint8Array(n);
  const cardNear = card ? morph(card, w, h, "dilate", k(0.01)) : null;
  for (let p = 0; p < n; p++) exclude[p] = taken[p] || (cardNear && cardNear[p]) ? 1 : 0;
  const fg = morph(morph(deskForeground(maps, exclude), w, h, "open", k(0.004)), w, h, "close", k(0.006));
  for (let p = 0; p < n; p++) if (exclude[p]) fg[p] = 0;
  const deskRegions = regionsOf(fg, w, h, (c) => !touchesBorder(c, w, h) && c.area >= 0.0005 * n);
  for (const r of deskRegions) {
    const v = judge(r, maps, "desk");
    if ("strip" in v) found.push(v.strip);
    else rejects.push(v.reject);
  }

  if (found.length === 0) {
    const crop = wholePhoto(maps);
    if (crop) return [crop];
    let anyInk = false;
    for (let p = 0; p < n && !anyInk; p += 3) {
      const dl = Math.min(0, maps.lab[p * 3] - 100);
      if (Math.hypot(dl, maps.lab[p * 3 + 1], maps.lab[p * 3 + 2]) >= INK_CORE) anyInk = true;
    }
    if (!anyInk) throw new NoStripError("no_ink");
    throw new NoStripError(rejects.includes("too_small") && !rejects.includes("not_strip_shaped") ? "too_small" : "not_strip_shaped");
  }
  return readingOrder(found);
}
