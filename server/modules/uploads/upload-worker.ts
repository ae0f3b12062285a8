import { mkdir } from "node:fs/promises";
import path from "node:path";
import { analyzePixels } from "../../analysis/analyze-pixels";
import { NoStripError } from "../../analysis/no-strip-error";
import { DISPLAY_LONG_EDGE, downscaleImage, ImageError, readImage, writeDerivatives } from "../../images";
import { correctToPaperWhite } from "./correct-colours";
import type { UploadJob, UploadJobResult } from "./upload-job";

/** Long edge the analysis works at: plenty for bands, and fast. */
const ANALYSIS_LONG_EDGE = 1200;

/**
 * Runs in a worker thread: one decode of the photo feeds both the analysis and the served,
 * colour-corrected derivatives. Failures a member can act on come back as codes and messages, not exceptions.
 */
export default async function processUpload(job: UploadJob): Promise<UploadJobResult> {
  try {
    const img = await readImage(job.originalPath);
    const small = await downscaleImage(img, ANALYSIS_LONG_EDGE);
    const analysis = analyzePixels(
      { width: small.width, height: small.height, data: small.data },
      { catalogue: job.catalogue, stash: new Set(job.stash), white: job.white },
    );
    // Members see the corrected photo; without a paper white there is nothing to correct against.
    const display = await downscaleImage(img, DISPLAY_LONG_EDGE);
    const shown = analysis.paper.found ? correctToPaperWhite(display, analysis.paper.lab) : display;
    await mkdir(job.outDir, { recursive: true });
    const files = { display: "display.webp", thumb: "thumb.webp" };
    const derived = await writeDerivatives(shown, {
      displayPath: path.join(job.outDir, files.display),
      thumbPath: path.join(job.outDir, files.thumb),
    });
    // Suggestions carry the ink's reference colour, so a page can show it beside the band.
    const byId = new Map(job.catalogue.map((ink) => [ink.id, ink]));
    for (const band of analysis.bands) {
      band.suggestions = band.suggestions.map((s) => ({ ...s, hex: byId.get(s.inkId)?.hex, lab: byId.get(s.inkId)?.lab }));
    }
    return {
      ok: true,
      analysis,
      images: {
        ...files,
        placeholder: derived.placeholder,
        phash: derived.phash,
        width: derived.display.width,
        height: derived.display.height,
      },
    };
  } catch (err) {
    if (err instanceof ImageError || err instanceof NoStripError) {
      return { ok: false, code: err.code, message: err.message };
    }
    throw err;
  }
}
