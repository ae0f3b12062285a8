// The strip analysis over plain pixels: paper white → corrected CIELAB → strip → profile →
// bands and transitions → ink suggestions. Pure: no files, no sharp.
import { deltaE2000, labToHex, type Lab } from "../../shared/colour/index";
import { toCorrectedLab, type LabImage } from "./corrected-lab";
import { findStrip, type StripGeometry } from "./find-strip";
import { suggestInks } from "./match-inks";
import { findPaperWhite, paperSrgb8, type PaperEstimate } from "./paper-white";
import { collectSamples, robustLab, readProfile, type Profile } from "./read-profile";
import { DEFAULT_SEGMENT_PARAMS, segmentProfile, type Segment, type SegmentParams } from "./segment-profile";
import { srgbToLab } from "../../shared/colour/index";
import type { AnalysisBand, AnalysisResult, CatalogueInk, Outline, RgbImage, WhitePoint } from "./types";

export type AnalyzeOptions = {
  catalogue: readonly CatalogueInk[];
  stash?: ReadonlySet<number>;
  white?: WhitePoint;
  /** Read the strips exactly at these outlines (the member's corrections), skipping detection. */
  outlines?: Outline[];
  /** Overrides for the segmentation constants (for experiments; production uses the defaults). */
  segment?: Partial<SegmentParams>;
  /** The paper white, when already estimated on this same image (estimatePaper(img, white)). */
  paper?: PaperEstimate;
  /** The corrected CIELAB image, when already made from this image and `paper` (toCorrectedLab). */
  lab?: LabImage;
};

/** Adjacent bands closer than this (ΔE2000) are one band read twice; ours, "barely different". */
export const MERGE_BANDS_DE = 2;

export type MeasuredBand = { from: number; to: number; lab: Lab; spread: number };

export type StripMeasurement = {
  paper: PaperEstimate;
  geometry: StripGeometry;
  profile: Profile;
  bands: MeasuredBand[];
  sigma: number;
};

const round = (v: number, d: number) => Math.round(v * 10 ** d) / 10 ** d;

function checkWhite(white: WhitePoint | undefined): void {
  if (white === undefined) return;
  const ok = (v: unknown) => typeof v === "number" && Number.isFinite(v) && v >= 0 && v <= 1;
  if (!ok(white.x) || !ok(white.y)) throw new RangeError("The white point must be given as fractions 0–1 of the photo's width and height.");
}

function measureBand(img: LabImage, g: StripGeometry, profile: Profile, seg: Segment): MeasuredBand {
  const len = seg.to - seg.from;
  const inset = len >= 5 ? Math.max(1, Math.round(0.1 * len)) : 0;
  const step = g.length / profile.n;
  const from = (seg.from + inset) * step;
  const to = (seg.to - inset) * step;
  const stepV = Math.max(1, (0.6 * g.thickness) / 41);
  const stepU = Math.max(1, (to - from) / 200);
  const lab3 = robustLab(collectSamples(img, g, from, Math.max(to, from + 1), stepU, stepV));
  const lab: Lab = { l: lab3[0], a: lab3[1], b: lab3[2] };
  const des: number[] = [];
  for (let i = seg.from; i < seg.to; i++) {
    des.push(deltaE2000(lab, { l: profile.lab[i * 3], a: profile.lab[i * 3 + 1], b: profile.lab[i * 3 + 2] }));
  }
  des.sort((a, b) => a - b);
  const spread = des.length ? des[Math.min(des.length - 1, Math.floor(0.9 * des.length))] : 0;
  return { from: seg.from, to: seg.to, lab, spread };
}

/** Finds and measures the strip; throws NoStripError when there is none. */
export function measureStrip(img: RgbImage, opts: Pick<AnalyzeOptions, "white" | "segment" | "paper" | "lab"> = {}): StripMeasurement {
  const paper = opts.paper ?? estimatePaper(img, opts.white);
  const labImg = (opts.paper && opts.lab) || toCorrectedLab(img, paper);
  const geometry = findStrip(labImg);
  const profile = readProfile(labImg, geometry);
  const seg = segmentProfile(profile.lab, profile.n, { ...DEFAULT_SEGMENT_PARAMS, ...opts.segment });
  let bands = seg.bands.map((s) => measureBand(labImg, geometry, profile, s));
  // Merge neighbours that are the same colour (the DP may split one uneven band).
  for (let k = 0; k + 1 < bands.length; ) {
    if (deltaE2000(bands[k].lab, bands[k + 1].lab) < MERGE_BANDS_DE) {
      const merged = measureBand(labImg, geometry, profile, { from: bands[k].from, to: bands[k + 1].to });
      bands = [...bands.slice(0, k), merged, ...bands.slice(k + 2)];
    } else k++;
  }
  return { paper, geometry, profile, bands, sigma: seg.sigma };
}

/** The paper white of the photo; throws RangeError for a white point outside the photo. */
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

export function analyzePixels(img: RgbImage, opts: AnalyzeOptions): AnalysisResult {
  const m = measureStrip(img, opts);
  const n = m.profile.n;
  const frac = (i: number) => round(i / n, 4);
  const bands: AnalysisBand[] = m.bands.map((b, index) => {
    const { suggestions, confidence } = suggestInks(b.lab, opts.catalogue, opts.stash);
    return {
      index,
      start: index === 0 ? 0 : frac(b.from),
      end: index === m.bands.length - 1 ? 1 : frac(b.to),
      hex: labToHex(b.lab),
      lab: { l: round(b.lab.l, 2), a: round(b.lab.a, 2), b: round(b.lab.b, 2) },
      spread: round(b.spread, 2),
      confidence,
      suggestions,
    };
  });
  const transitions = m.bands.slice(1).map((b, k) => ({ start: frac(m.bands[k].to), end: frac(b.from) }));
  const outline = quadOf(m.geometry, img.width, img.height);
  return {
    orientation: m.geometry.orientation,
    paper: reportPaper(m.paper),
    bands,
    transitions,
    strip: stripOutline(m.geometry, img.width, img.height),
    strips: [{ index: 0, outline, orientation: m.geometry.orientation, bands, transitions, notices: [] }],
    notices: [],
  };
}

/** The strip's four corners as fractions of the image, in the order of Outline. */
function quadOf(g: StripGeometry, width: number, height: number): Outline {
  const h = g.thickness / 2;
  const at = (u: number, v: number): [number, number] => [
    round((g.origin[0] + g.along[0] * u + g.across[0] * v) / width, 4),
    round((g.origin[1] + g.along[1] * u + g.across[1] * v) / height, 4),
  ];
  // across = along turned +90° on screen (y down), so -h is the left-hand side going along.
  return [at(0, -h), at(g.length, -h), at(g.length, h), at(0, h)];
}

/** The strip's centre line and thickness as fractions of the image, for drawing its bands on the photo. */
function stripOutline(g: StripGeometry, width: number, height: number) {
  const end: [number, number] = [g.origin[0] + g.along[0] * g.length, g.origin[1] + g.along[1] * g.length];
  return {
    start: { x: round(g.origin[0] / width, 4), y: round(g.origin[1] / height, 4) },
    end: { x: round(end[0] / width, 4), y: round(end[1] / height, 4) },
    thickness: round(g.thickness / Math.max(width, height), 4),
  };
}
