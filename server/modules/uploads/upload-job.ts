import type { Analysis, Outline } from "../../../shared/schemas/uploads";
import type { StripPhotoTimings } from "../../analysis/process-strip-photo";

export type CatalogueEntry = { id: number; name: string; brand: string; hex: string; lab: { l: number; a: number; b: number } };

/** What the worker thread gets: plain, serialisable data only. */
export type UploadJob = {
  originalPath: string;
  /** Folder the derivatives are written into (created by the worker). */
  outDir: string;
  catalogue: CatalogueEntry[];
  stash: number[];
  white?: { x: number; y: number };
};

export type UploadJobResult =
  | {
      ok: true;
      analysis: Analysis;
      /** File names inside outDir, the placeholder as a data URL, the perceptual hash. */
      images: { display: string; thumb: string; placeholder: string; phash: string; width: number; height: number };
      /** Where the time went (for the benchmark and logs). */
      timings: StripPhotoTimings;
    }
  | { ok: false; code: string; message: string };

/**
 * A member's corrected outline: read the strips exactly there (no detection, no new photo files),
 * with the paper white the upload was analysed with.
 */
export type OutlineJob = {
  kind: "outline";
  originalPath: string;
  catalogue: CatalogueEntry[];
  stash: number[];
  white?: { x: number; y: number };
  outlines: Outline[];
};

export type OutlineJobResult = { ok: true; analysis: Analysis } | { ok: false; code: string; message: string };
