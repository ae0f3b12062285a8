// Entry points from a file on disk: decode once, then analyse (and optionally write derivatives).
import { downscaleImage, readImage, writeDerivatives, type DecodedImage, type DerivativeInfo, type ReadImageOptions } from "../images/index";
import { analyzePixels } from "./analyze-pixels";
import type { AnalysisResult, CatalogueInk, WhitePoint } from "./types";

/** Long edge of the copy the analysis reads (fast, and plenty for colour bands). */
export const ANALYSIS_LONG_EDGE = 800;
/** Long edge decoded from the upload; the display derivative is made at this size. */
const DECODE_LONG_EDGE = 1600;

export type AnalyzeStripOptions = {
  catalogue: CatalogueInk[];
  stash?: Set<number>;
  white?: { x: number; y: number };
  limits?: Pick<ReadImageOptions, "maxBytes" | "maxPixels">;
};

async function analyzeDecoded(img: DecodedImage, opts: AnalyzeStripOptions): Promise<AnalysisResult> {
  const small = await downscaleImage(img, ANALYSIS_LONG_EDGE);
  return analyzePixels(small, { catalogue: opts.catalogue, stash: opts.stash, white: opts.white as WhitePoint | undefined });
}

/** Reads the photo and analyses the strip. Throws ImageError or NoStripError for member mistakes. */
export async function analyzeStripImage(path: string, opts: AnalyzeStripOptions): Promise<AnalysisResult> {
  const img = await readImage(path, { ...opts.limits, maxLongEdge: DECODE_LONG_EDGE });
  return analyzeDecoded(img, opts);
}

/**
 * One upload, start to finish: decode once, write the display and thumbnail WebP files (no
 * metadata) while the analysis runs, and return both. If the analysis fails, the files just
 * written are removed again before the error is rethrown.
 */
export async function processStripPhoto(
  path: string,
  opts: AnalyzeStripOptions & { displayPath: string; thumbPath: string },
): Promise<{ analysis: AnalysisResult; derivatives: DerivativeInfo }> {
  const img = await readImage(path, { ...opts.limits, maxLongEdge: DECODE_LONG_EDGE });
  const written = writeDerivatives(img, { displayPath: opts.displayPath, thumbPath: opts.thumbPath });
  let analysis: AnalysisResult;
  try {
    analysis = await analyzeDecoded(img, opts);
  } catch (err) {
    const done = await written.catch(() => null);
    if (done) {
      const { unlink } = await import("node:fs/promises");
      await Promise.all([unlink(done.display.path).catch(() => undefined), unlink(done.thumb.path).catch(() => undefined)]);
    }
    throw err;
  }
  return { analysis, derivatives: await written };
}
