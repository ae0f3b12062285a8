// The strip analysis over plain pixels: find every strip (on a card or on the desk) → the paper
// white (the card, the member's tap, or a strip's own un-inked margin) → each strip straightened
// and read as a colour profile → bands and transitions → ink suggestions. Pure: no files, no sharp.
import { deltaE2000, labToHex, srgbToLab, type Lab } from "../../shared/colour/index";
import { findStrips, detectScene, type FoundStrip } from "./find-strips";
import { suggestInks } from "./match-inks";
import { evaluateField, findPaperWhite, noPaper, paperFromColour, paperFromRegion, paperSrgb8, type PaperEstimate } from "./paper-white";
import { ON_DESK, correctGrid, extendAlong, positionsFor, profileOf, robustRows, sampleStrip, sideWhite, type SideWhite, type StripGrid, type StripLab } from "./read-strip";
import { LOCUS_TOL, offLocus } from "./scene-maps";
import { DEFAULT_SEGMENT_PARAMS, distanceFromMix, segmentProfile, type SegmentParams } from "./segment-profile";
import { orderQuad, readingOrder, type Point } from "./strip-quad";
import type { AnalysisBand, AnalysisNotice, AnalysisResult, CatalogueInk, Outline, RgbImage, StripReading, WhitePoint } from "./types";
import { NoStripError } from "./no-strip-error";

export type AnalyzeOptions = {
  catalogue: readonly CatalogueInk[];
  stash?: ReadonlySet<number>;
  white?: WhitePoint;
  /** Read the strips exactly at these outlines (the member's own), skipping detection. */
  outlines?: readonly Outline[];
  /** Overrides for the segmentation constants (for experiments; production uses the defaults). */
  segment?: Partial<SegmentParams>;
};

/** Adjacent bands closer than this (ΔE2000) are one band read twice; ours, "barely different". */
export const MERGE_BANDS_DE = 2;
/** A profile position this close to the paper white (ΔE*ab, darker only) is un-inked cardstock. */
const UNINKED = 4;
const UNINKED_ON_PAPER = 2.5;
/** A band at most this share of the strip, within MIX_BAND_DE (ΔE2000) of a mix of its neighbours, is blend. */
const MIX_BAND_MAX_SHARE = 0.06;
const MIX_BAND_DE = 8;

export type MeasuredBand = { from: number; to: number; lab: Lab; spread: number };

export type StripMeasurement = {
  strip: FoundStrip;
  /** Inked part of the strip, as profile positions [from, to) of n. */
  inked: { from: number; to: number; n: number };
  bands: MeasuredBand[];
  /** The colour profile along the whole strip (band positions index into it). */
  profile: { n: number; lab: Float64Array };
  grid: StripGrid;
  notices: AnalysisNotice[];
};

export type PhotoMeasurement = { paper: PaperEstimate; strips: StripMeasurement[]; notices: AnalysisNotice[] };

const round = (v: number, d: number) => Math.round(v * 10 ** d) / 10 ** d;

function checkWhite(white: WhitePoint | undefined): void {
  if (white === undefined) return;
  const ok = (v: unknown) => typeof v === "number" && Number.isFinite(v) && v >= 0 && v <= 1;
  if (!ok(white.x) || !ok(white.y)) throw new RangeError("The white point must be given as fractions 0–1 of the photo's width and height.");
}

/** The paper white of the photo as the old whole-photo estimate saw it (kept for the tap). */
export function estimatePaper(img: RgbImage, white?: WhitePoint): PaperEstimate {
  checkWhite(white);
  return findPaperWhite(img, white);
}

/** The paper as the result reports it: its photographed colour, 8-bit sRGB → CIELAB (D65). */
export function reportPaper(paper: PaperEstimate): AnalysisResult["paper"] {
  const [r, g, b] = paperSrgb8(paper);
  const lab = srgbToLab(r, g, b);
  return { found: paper.found, hex: labToHex(lab), lab: { l: round(lab.l, 2), a: round(lab.a, 2), b: round(lab.b, 2) } };
}

/** Per profile position, the IQ-mean linear colour as photographed (for finding un-inked margins). */
function rawProfile(grid: StripGrid): Float64Array {
  const n = grid.rows / 2;
  const out = new Float64Array(n * 3);
  const vals: number[][] = [[], [], []];
  for (let i = 0; i < n; i++) {
    vals.forEach((v) => (v.length = 0));
    for (let r = 2 * i; r < 2 * i + 2; r++) {
      for (let c = 0; c < grid.cols; c++) {
        const k = r * grid.cols + c;
        if (Number.isNaN(grid.rgb[k * 3]) || grid.clipped[k]) continue;
        for (let ch = 0; ch < 3; ch++) vals[ch].push(grid.rgb[k * 3 + ch]);
      }
    }
    for (let ch = 0; ch < 3; ch++) {
      const s = vals[ch].sort((a, b) => a - b);
      out[i * 3 + ch] = s.length ? s[s.length >> 1] : NaN;
    }
  }
  return out;
}

type Margin = { colour: [number, number, number]; at: "start" | "end"; length: number };

/**
 * The strip's own un-inked ends: a run from an end that is as bright as the brightest part of the
 * strip and one even colour, and could be white paper under some light. Both ends must agree when
 * both look un-inked.
 */
function findMargins(grid: StripGrid): Margin[] {
  const prof = rawProfile(grid);
  const n = grid.rows / 2;
  const lum = (i: number) => 0.2126 * prof[i * 3] + 0.7152 * prof[i * 3 + 1] + 0.0722 * prof[i * 3 + 2];
  const lums = Array.from({ length: n }, (_, i) => lum(i)).filter((v) => !Number.isNaN(v)).sort((a, b) => a - b);
  if (lums.length < 10) return [];
  const top = lums[Math.floor(0.97 * (lums.length - 1))];
  const chroma = (i: number) => {
    const s = prof[i * 3] + prof[i * 3 + 1] + prof[i * 3 + 2];
    return [prof[i * 3] / s, prof[i * 3 + 1] / s] as const;
  };
  const run = (from: number, dir: 1 | -1): Margin | null => {
    const ref = chroma(from);
    let len = 0;
    for (let i = from; i >= 0 && i < n; i += dir) {
      const c = chroma(i);
      if (Number.isNaN(lum(i)) || lum(i) < 0.85 * top || Math.hypot(c[0] - ref[0], c[1] - ref[1]) > 0.012) break;
      len++;
    }
    if (len < Math.max(2, Math.round(0.015 * n))) return null;
    // The run's colour, leaving out the positions nearest the ink (the blend's edge).
    const use = Math.max(1, len - Math.max(1, Math.round(0.3 * len)));
    const acc = [0, 0, 0];
    for (let k = 0; k < use; k++) for (let ch = 0; ch < 3; ch++) acc[ch] += prof[(from + dir * k) * 3 + ch];
    return { colour: [acc[0] / use, acc[1] / use, acc[2] / use], at: dir === 1 ? "start" : "end", length: len };
  };
  const a = run(0, 1);
  const b = run(n - 1, -1);
  // White paper under some light: on the daylight–incandescent locus (a pale ink is off it).
  const neutral = (m: Margin) => {
    const s = m.colour[0] + m.colour[1] + m.colour[2];
    return offLocus(m.colour[0] / s, m.colour[1] / s) <= LOCUS_TOL;
  };
  if (a && b) {
    const ca = srgbLike(a.colour);
    const cb = srgbLike(b.colour);
    return (deltaE2000(ca, cb) < 6 ? [a, b] : [a, b]).filter(neutral);
  }
  return [a, b].filter((m): m is Margin => !!m && neutral(m));
}

/** Rough CIELAB of a linear colour, normalised to its own brightness peak (for comparing margins). */
function srgbLike(c: [number, number, number]): Lab {
  const enc = (v: number) => Math.round(255 * Math.min(1, Math.max(0, v <= 0.0031308 ? 12.92 * v : 1.055 * v ** (1 / 2.4) - 0.055)));
  return srgbToLab(enc(c[0]), enc(c[1]), enc(c[2]));
}

function measureBand(s: StripLab, profile: { lab: Float64Array }, from: number, to: number): MeasuredBand {
  const len = to - from;
  const inset = len >= 5 ? Math.max(1, Math.round(0.1 * len)) : 0;
  const m = robustRows(s, 2 * (from + inset), 2 * Math.max(from + inset + 1, to - inset));
  const lab: Lab = { l: m[0], a: m[1], b: m[2] };
  const des: number[] = [];
  for (let i = from; i < to; i++) des.push(deltaE2000(lab, { l: profile.lab[i * 3], a: profile.lab[i * 3 + 1], b: profile.lab[i * 3 + 2] }));
  des.sort((a, b) => a - b);
  const spread = des.length ? des[Math.min(des.length - 1, Math.floor(0.9 * des.length))] : 0;
  return { from, to, lab, spread };
}

function readOne(strip: FoundStrip, grid: StripGrid, paper: PaperEstimate, rowWhite: SideWhite | null, params: SegmentParams, trim: boolean): StripMeasurement {
  const s = correctGrid(grid, paper, rowWhite);
  const profile = profileOf(s);
  const n = profile.n;
  // Un-inked cardstock at the ends is not part of the blend.
  // On a card the limit is tighter: a white chart patch (L* 96.5) is a band, paper is not.
  const limit = strip.surface === "paper" ? UNINKED_ON_PAPER : UNINKED;
  const uninked = (i: number) => Math.hypot(Math.min(0, profile.lab[i * 3] - 100), profile.lab[i * 3 + 1], profile.lab[i * 3 + 2]) < limit;
  let from = 0;
  let to = n;
  if (trim) {
    // The outline may reach a few positions past the cardstock: look for the white run just inside.
    const reach = Math.max(2, Math.round(0.05 * n));
    let a = 0;
    while (a < reach && !uninked(a)) a++;
    if (a < reach) {
      from = a;
      while (from < n && uninked(from)) from++;
    }
    let b = n - 1;
    while (b > n - 1 - reach && !uninked(b)) b--;
    if (b > n - 1 - reach) {
      to = b + 1;
      while (to > from && uninked(to - 1)) to--;
    }
  }
  if (to - from < Math.max(10, 0.3 * n)) {
    from = 0;
    to = n;
  }
  const sub = profile.lab.subarray(from * 3, to * 3);
  const seg = segmentProfile(sub, to - from, params);
  let bands = seg.bands.map((b) => measureBand(s, profile, b.from + from, b.to + from));
  // A short band on the mixing path between its neighbours is the middle of their blend.
  for (let k = 1; k + 1 < bands.length; ) {
    const short = bands[k].to - bands[k].from <= MIX_BAND_MAX_SHARE * (to - from);
    if (short && distanceFromMix(bands[k].lab, bands[k - 1].lab, bands[k + 1].lab) < MIX_BAND_DE) bands = [...bands.slice(0, k), ...bands.slice(k + 1)];
    else k++;
  }
  for (let k = 0; k + 1 < bands.length; ) {
    if (deltaE2000(bands[k].lab, bands[k + 1].lab) < MERGE_BANDS_DE) {
      const merged = measureBand(s, profile, bands[k].from, bands[k + 1].to);
      bands = [...bands.slice(0, k), merged, ...bands.slice(k + 2)];
    } else k++;
  }
  return { strip, inked: { from, to, n }, bands, profile: { n, lab: profile.lab }, grid, notices: [] };
}

/** Outlines from the member (fractions) as ordered pixel quads. */
function givenStrips(outlines: readonly Outline[], w: number, h: number): FoundStrip[] {
  return outlines.map((o) => ({ ...orderQuad(o.map(([x, y]) => [x * w, y * h] as Point)), surface: "paper" as const }));
}

const NOTICE_BALANCED: AnalysisNotice = {
  code: "no_paper_white",
  message:
    "We found no white paper around the strip and no un-inked end on it, so we took the photo's colours as they are. If they look off, tap a bit of white paper in the photo.",
};

/** Finds and measures every strip; throws NoStripError when there is none. */
export function measurePhoto(img: RgbImage, opts: Pick<AnalyzeOptions, "white" | "segment" | "outlines"> = {}): PhotoMeasurement {
  checkWhite(opts.white);
  const { width: w, height: h } = img;
  const scene = detectScene(img);
  let found = opts.outlines?.length ? readingOrder(givenStrips(opts.outlines, w, h)) : findStrips(scene);
  const params = { ...DEFAULT_SEGMENT_PARAMS, ...opts.segment };
  const notices: AnalysisNotice[] = [];

  let paper: PaperEstimate | null = null;
  if (opts.white) paper = findPaperWhite(img, opts.white);
  else if (scene.card) {
    const card = scene.card;
    paper = paperFromRegion(img, (x, y) => x >= 0 && y >= 0 && x < w && y < h && card[y * w + x] === 1);
  }
  const sample = (list: FoundStrip[]) => list.map((f) => sampleStrip(scene.maps.raw, scene.maps.clipped, scene.maps.glare, w, h, f, positionsFor(f.length)));
  // A strip on the desk may have lost an end whose colour the desk explains: walk on from each end.
  // (Only for a lone strip: beside a neighbour, the "desk beside it" would be the next strip.)
  if (!opts.outlines?.length && found.length === 1) found = found.map((f) => (f.surface === "desk" ? extendAlong(scene.maps.raw, w, h, f, noPaper(), ON_DESK) : f));
  let strips0 = found;
  let grids = sample(found);
  const margins: Margin[][] = grids.map((g) => findMargins(g));
  if (paper && !opts.white) {
    // A strip's own un-inked end clearly brighter than the "card" means the card is a pale desk.
    const p = paper;
    const brighter = margins.some((ms, k) =>
      ms.some((m) => {
        const [x, y] = grids[k].map(m.at === "start" ? 0.01 : 0.99, 0.5);
        const lum = 0.2126 * m.colour[0] + 0.7152 * m.colour[1] + 0.0722 * m.colour[2];
        return lum > 1.1 * evaluateField(p.field, x / w - 0.5, y / h - 0.5);
      }),
    );
    if (brighter) paper = null;
  }
  const knownPaper = paper;
  if (knownPaper && !opts.outlines?.length) {
    strips0 = found.map((f) => (f.surface === "paper" ? extendAlong(scene.maps.raw, w, h, f, knownPaper) : f));
    grids = sample(strips0);
  }
  if (!paper) {
    const all = margins.flat();
    if (all.length) {
      const mean: [number, number, number] = [0, 1, 2].map((ch) => all.reduce((s, m) => s + m.colour[ch], 0) / all.length) as [number, number, number];
      paper = paperFromColour(mean);
    }
  }
  if (!paper) {
    paper = noPaper();
    notices.push(NOTICE_BALANCED);
  }
  const p = paper;
  const strips = strips0.map((f, k) => {
    let rowWhite: SideWhite | null = null;
    if (p.found && p.paperSamples > 0) rowWhite = sideWhite(grids[k], p);
    else if (margins[k].length === 2) {
      // Light falling off along a strip on the desk: even it out between its two white ends.
      const [a, b] = margins[k];
      const la = 0.2126 * a.colour[0] + 0.7152 * a.colour[1] + 0.0722 * a.colour[2];
      const lb = 0.2126 * b.colour[0] + 0.7152 * b.colour[1] + 0.0722 * b.colour[2];
      const mid = (la + lb) / 2;
      const rows = grids[k].rows;
      const along = Float64Array.from({ length: rows }, (_, r) => (la + ((lb - la) * (r + 0.5)) / rows) / mid);
      rowWhite = { side0: along, side1: along };
    }
    return readOne(f, grids[k], p, rowWhite, params, true);
  });
  return { paper: p, strips, notices };
}

function readingOf(m: StripMeasurement, index: number, img: RgbImage, opts: AnalyzeOptions): StripReading {
  const { from, to, n } = m.inked;
  const len = to - from;
  const frac = (i: number) => round((i - from) / len, 4);
  const bands: AnalysisBand[] = m.bands.map((b, k) => {
    const { suggestions, confidence } = suggestInks(b.lab, opts.catalogue, opts.stash);
    return {
      index: k,
      start: k === 0 ? 0 : frac(b.from),
      end: k === m.bands.length - 1 ? 1 : frac(b.to),
      hex: labToHex(b.lab),
      lab: { l: round(b.lab.l, 2), a: round(b.lab.a, 2), b: round(b.lab.b, 2) },
      spread: round(b.spread, 2),
      confidence,
      suggestions,
    };
  });
  const transitions = m.bands.slice(1).map((b, k) => ({ start: frac(m.bands[k].to), end: frac(b.from) }));
  const s0 = from / n;
  const s1 = to / n;
  const at = (s: number, t: number): [number, number] => {
    const [x, y] = m.grid.map(s, t);
    return [round(Math.min(1, Math.max(0, x / img.width)), 4), round(Math.min(1, Math.max(0, y / img.height)), 4)];
  };
  const outline: Outline = [at(s0, 0), at(s1, 0), at(s1, 1), at(s0, 1)];
  return { index, outline, orientation: m.strip.orientation, bands, transitions, notices: m.notices };
}

/** The strip's centre line and thickness as fractions of the image (the single-strip field `strip`). */
function centreLine(r: StripReading, img: RgbImage): NonNullable<AnalysisResult["strip"]> {
  const [p0, p1, p2, p3] = r.outline;
  const start = { x: round((p0[0] + p3[0]) / 2, 4), y: round((p0[1] + p3[1]) / 2, 4) };
  const end = { x: round((p1[0] + p2[0]) / 2, 4), y: round((p1[1] + p2[1]) / 2, 4) };
  const px = (a: [number, number], b: [number, number]) => Math.hypot((a[0] - b[0]) * img.width, (a[1] - b[1]) * img.height);
  const thickness = (px(p0, p3) + px(p1, p2)) / 2 / Math.max(img.width, img.height);
  return { start, end, thickness: round(thickness, 4) };
}

export function analyzePhoto(img: RgbImage, opts: AnalyzeOptions): { result: AnalysisResult; paper: PaperEstimate } {
  const m = measurePhoto(img, opts);
  if (m.strips.length === 0) throw new NoStripError("no_ink");
  const strips = m.strips.map((s, k) => readingOf(s, k, img, opts));
  const first = strips[0];
  return {
    paper: m.paper,
    result: {
      orientation: first.orientation,
      paper: reportPaper(m.paper),
      bands: first.bands,
      transitions: first.transitions,
      strip: centreLine(first, img),
      strips,
      notices: m.notices,
    },
  };
}

export function analyzePixels(img: RgbImage, opts: AnalyzeOptions): AnalysisResult {
  return analyzePhoto(img, opts).result;
}
