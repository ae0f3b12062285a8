// Worker-thread entry for the upload pool (piscina, run under tsx). It runs processStripPhoto —
// the one upload pipeline, also what scripts/bench-analyze.ts times. Errors cross the thread
// boundary as plain data: a structured clone of an Error drops its class and `code`, so failures
// a member can act on are returned, not thrown. Bugs still throw.
import path from "node:path";
import { NoStripError } from "../../analysis/no-strip-error";
import { processStripPhoto } from "../../analysis/process-strip-photo";
import { ImageError } from "../../images";
import type { UploadJob, UploadJobResult } from "./upload-job";

/** File names of the derivatives inside the job's outDir. */
export const DERIVATIVE_FILES = { display: "display.webp", thumb: "thumb.webp" } as const;

export default async function processUpload(job: UploadJob): Promise<UploadJobResult> {
  try {
    const { analysis, derivatives, timings } = await processStripPhoto(
      job.originalPath,
      { displayPath: path.join(job.outDir, DERIVATIVE_FILES.display), thumbPath: path.join(job.outDir, DERIVATIVE_FILES.thumb) },
      { catalogue: job.catalogue, stash: new Set(job.stash), white: job.white },
    );
    return {
      ok: true,
      analysis,
      images: {
        ...DERIVATIVE_FILES,
        placeholder: derivatives.placeholder,
        phash: derivatives.phash,
        width: derivatives.display.width,
        height: derivatives.display.height,
      },
      timings,
    };
  } catch (err) {
    if (err instanceof ImageError || err instanceof NoStripError) {
      return { ok: false, code: err.code, message: err.message };
    }
    throw err;
  }
}
