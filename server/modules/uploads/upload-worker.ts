// Worker-thread entry for the upload pool (piscina, run under tsx). It runs processStripPhoto —
// the one upload pipeline, also what scripts/bench-analyze.ts times — or, for a member's corrected
// outline, the analysis alone at that outline. Errors cross the thread boundary as plain data: a
// structured clone of an Error drops its class and `code`, so failures a member can act on are
// returned, not thrown. Bugs still throw.
import path from "node:path";
import { NoStripError } from "../../analysis/no-strip-error";
import { analyzeStripImage, processStripPhoto } from "../../analysis/process-strip-photo";
import { ImageError } from "../../images";
import type { OutlineJob, OutlineJobResult, UploadJob, UploadJobResult } from "./upload-job";

/** File names of the derivatives inside the job's outDir. */
export const DERIVATIVE_FILES = { display: "display.webp", thumb: "thumb.webp" } as const;

function memberFailure(err: unknown): { ok: false; code: string; message: string } {
  if (err instanceof ImageError || err instanceof NoStripError) return { ok: false, code: err.code, message: err.message };
  // A white point outside the photo (checked by the analysis) is the caller's mistake too.
  if (err instanceof RangeError) return { ok: false, code: "bad_point", message: err.message };
  throw err;
}

async function readAtOutlines(job: OutlineJob): Promise<OutlineJobResult> {
  try {
    const analysis = await analyzeStripImage(job.originalPath, { catalogue: job.catalogue, stash: new Set(job.stash), white: job.white, outlines: job.outlines });
    return { ok: true, analysis };
  } catch (err) {
    return memberFailure(err);
  }
}

export default async function processUpload(job: UploadJob): Promise<UploadJobResult>;
export default async function processUpload(job: OutlineJob): Promise<OutlineJobResult>;
export default async function processUpload(job: UploadJob | OutlineJob): Promise<UploadJobResult | OutlineJobResult> {
  if ("kind" in job && job.kind === "outline") return readAtOutlines(job);
  const upload = job as UploadJob;
  try {
    const { analysis, derivatives, timings } = await processStripPhoto(
      upload.originalPath,
      { displayPath: path.join(upload.outDir, DERIVATIVE_FILES.display), thumbPath: path.join(upload.outDir, DERIVATIVE_FILES.thumb) },
      { catalogue: upload.catalogue, stash: new Set(upload.stash), white: upload.white },
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
