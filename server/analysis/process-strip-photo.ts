// One upload, start to finish — the code path the upload worker runs and the benchmark times:
// read the file once → the 800 px analysis copy and the 1600 px display photo (see decode()) →
// paper white → the display photo corrected to that white → WebP derivatives, placeholder and
// perceptual hash encoding on libvips' threads while this thread finishes the analysis → files
// written only once the analysis has succeeded.
import { mkdir } from "node:fs/promises";
import { dirname } from "node:path";
import {
  DISPLAY_LONG_EDGE,
  decodeImageBytes,
  downscaleImage,
  makeDerivatives,
  readImageBytes,
  saveDerivatives,
  sniffImageBytes,
  type DecodedImage,
  type DerivativeInfo,
  type ReadImageOptions,
} from "../images/index";
import { analyzePhoto } from "./analyze-pixels";
import { correctToPaperWhite } from "./correct-photo";
import type { AnalysisResult, CatalogueInk, Outline, WhitePoint } from "./types";
import { loadVision } from "./vision";

/** Long edge of the copy the analysis reads (fast, and plenty for colour bands). */
export const ANALYSIS_LONG_EDGE = 800;

export type StripPhotoOptions = {
  catalogue: readonly CatalogueInk[];
  /** Ink ids the member owns: preferred on near-ties. */
  stash?: ReadonlySet<number>;
  /** A paper-white point the member tapped, as fractions of the upright photo. */
  white?: WhitePoint;
  /** The member's own strip outlines: read exactly there instead of finding the strips. */
  outlines?: readonly Outline[];
  limits?: Pick<ReadImageOptions, "maxBytes" | "maxPixels">;
};

/** Wall-clock milliseconds of each stage of one processStripPhoto call, in order. */
export type StripPhotoTimings = {
  /** Read and check the file, decode the 800 px analysis copy (upright sRGB). */
  decodeMs: number;
  /** Waiting for the 1600 px display decode after the paper white was known. */
  displayWaitMs: number;
  /** Display photo corrected to the paper white (this thread). */
  correctMs: number;
  /** Finding the strips, the paper white, reading and matching every strip (this thread). */
  analysisMs: number;
  /** From the start until bands and suggestions are known. */
  analysisReadyMs: number;
  /** Waiting for the derivatives after the analysis was done. */
  derivativesWaitMs: number;
  /** Writing the two WebP files. */
  writeMs: number;
  totalMs: number;
};

export type ProcessedStripPhoto = {
  analysis: AnalysisResult;
  derivatives: DerivativeInfo;
  timings: StripPhotoTimings;
};

/**
 * Reads the file once and gives the analysis copy (long edge ≤ 800) and, when asked, the display
 * photo (≤ 1600), both upright 8-bit sRGB. A JPEG is decoded twice, concurrently, each time with
 * shrink-on-load (libjpeg scales by ⅛–½ inside the DCT): the quarter-scale decode for the
 * analysis is ready in about half the time of the 1600 px one, so the analysis starts while the
 * display photo is still decoding (scripts/bench-analyze.ts measures both ways). Other formats
 * cannot shrink on load (an HEVC HEIC is decoded in full by WebAssembly), so they are decoded
 * once and the analysis copy is scaled from the display photo.
 */
async function decode(path: string, opts: StripPhotoOptions, display: boolean): Promise<{ small: DecodedImage; display: Promise<DecodedImage> | null }> {
  const bytes = await readImageBytes(path, opts.limits);
  const limits = { maxBytes: opts.limits?.maxBytes, maxPixels: opts.limits?.maxPixels };
  if (sniffImageBytes(bytes).type === "jpeg") {
    const big = display ? decodeImageBytes(bytes, { ...limits, maxLongEdge: DISPLAY_LONG_EDGE }) : null;
    // If the analysis copy fails first, the same failure reaches the caller from it; this one is not left unhandled.
    big?.catch(() => undefined);
    const small = await decodeImageBytes(bytes, { ...limits, maxLongEdge: ANALYSIS_LONG_EDGE });
    return { small, display: big };
  }
  const img = await decodeImageBytes(bytes, { ...limits, maxLongEdge: DISPLAY_LONG_EDGE });
  return { small: await downscaleImage(img, ANALYSIS_LONG_EDGE), display: display ? Promise.resolve(img) : null };
}

/**
 * Decodes the photo and analyses the strip, with no derivatives: the same decode and analysis an
 * upload runs. Throws ImageError or NoStripError for member mistakes, RangeError for a bad white point.
 */
export async function analyzeStripImage(path: string, opts: StripPhotoOptions): Promise<AnalysisResult> {
  await loadVision();
  const { small } = await decode(path, opts, false);
  return analyzePhoto(small, { catalogue: opts.catalogue, stash: opts.stash, white: opts.white, outlines: opts.outlines }).result;
}

/**
 * The whole upload: analysis plus the display and thumbnail WebP files (written to the given
 * paths, folders created) with the placeholder and perceptual hash. Nothing is written unless
 * the analysis succeeds; a failed write removes what it wrote.
 */
export async function processStripPhoto(
  path: string,
  out: { displayPath: string; thumbPath: string },
  opts: StripPhotoOptions,
): Promise<ProcessedStripPhoto> {
  await loadVision();
  const start = performance.now();
  const { small, display } = await decode(path, opts, true);
  display!.catch(() => undefined);
  const decodeMs = performance.now() - start;
  let t = performance.now();
  // The analysis runs on this thread while libvips decodes the display photo on its own threads.
  let analysis: AnalysisResult;
  let reported: AnalysisResult["paper"];
  let paperFound: boolean;
  try {
    const done = analyzePhoto(small, { catalogue: opts.catalogue, stash: opts.stash, white: opts.white, outlines: opts.outlines });
    analysis = done.result;
    reported = analysis.paper;
    paperFound = done.paper.found;
  } catch (err) {
    await display!.catch(() => undefined);
    throw err;
  }
  const analysisDone = performance.now();
  const analysisMs = analysisDone - t;
  t = performance.now();
  const img = await display!;
  const displayWaitMs = performance.now() - t;
  t = performance.now();
  // Members see the corrected photo; without a paper white there is nothing to correct against.
  const shown = paperFound ? correctToPaperWhite(img, reported.lab) : img;
  const correctMs = performance.now() - t;
  const encodeStart = performance.now();
  const encoding = makeDerivatives(shown);
  const encoded = await encoding;
  const encodedAt = performance.now();
  await Promise.all([mkdir(dirname(out.displayPath), { recursive: true }), mkdir(dirname(out.thumbPath), { recursive: true })]);
  const derivatives = await saveDerivatives(encoded, out);
  const end = performance.now();
  return {
    analysis,
    derivatives,
    timings: {
      decodeMs,
      displayWaitMs,
      correctMs,
      analysisMs,
      analysisReadyMs: analysisDone - start,
      derivativesWaitMs: encodedAt - encodeStart,
      writeMs: end - encodedAt,
      totalMs: end - start,
    },
  };
}
