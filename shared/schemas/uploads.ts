import { z } from "zod";
import type { LabValue } from "./common";

export const uploadStatuses = ["processing", "ready", "failed"] as const;
export type UploadStatus = (typeof uploadStatuses)[number];

export type InkSuggestion = {
  inkId: number;
  name: string;
  brand: string;
  deltaE: number;
  /** The ink's catalogue reference colour. */
  hex?: string;
  lab?: LabValue;
};

export type AnalysisBand = {
  index: number;
  /** Fractions 0–1 along the strip, from the left (horizontal) or top (vertical) end. */
  start: number;
  end: number;
  hex: string;
  lab: LabValue;
  spread?: number;
  confidence: "match" | "close" | "no close ink";
  suggestions: InkSuggestion[];
};

export type Analysis = {
  orientation: "horizontal" | "vertical";
  paper: { found: boolean; hex: string; lab: LabValue };
  bands: AnalysisBand[];
  transitions: { start: number; end: number }[];
  /** Centre line (fractions of width and height) and thickness (fraction of the long edge). */
  strip?: { start: { x: number; y: number }; end: { x: number; y: number }; thickness: number };
  /**
   * Every strip found in the photo, in reading order (top to bottom, then left to right); the
   * fields above describe strips[0]. Absent on analyses made before several-strip photos.
   */
  strips?: StripReading[];
  /** Notices about the whole photo, in words (e.g. no paper white found, taken as balanced). */
  notices?: AnalysisNotice[];
};

/**
 * A strip's corners as [x, y] fractions of the upright photo: p0→p1 along the strip from its start
 * (left or top end), p1→p2 across the far end, p2→p3 back, p3→p0 across the start; clockwise.
 */
export type Outline = [[number, number], [number, number], [number, number], [number, number]];

export type AnalysisNotice = { code: string; message: string };

export type StripReading = {
  index: number;
  outline: Outline;
  orientation: "horizontal" | "vertical";
  bands: AnalysisBand[];
  transitions: { start: number; end: number }[];
  notices: AnalysisNotice[];
};

export type UploadImages = { display: string; thumb: string; placeholder: string };

export type Upload = {
  id: string;
  status: UploadStatus;
  error?: { code: string; message: string };
  analysis?: Analysis;
  images?: UploadImages;
  /** Strips already posted from this photo (its owner and moderators see them): their number in `strips` and their id. */
  posted?: { stripIndex: number; stripId: number; status: "pending" | "published" | "hidden" | "returned" | "rejected" }[];
  createdAt: string;
};

const fraction = z.coerce
  .number({ error: "must be a number" })
  .min(0, "must be between 0 and 1")
  .max(1, "must be between 0 and 1");

/** Text fields sent beside the `image` file (multipart). */
export const uploadFields = z
  .strictObject({ whiteX: fraction.optional(), whiteY: fraction.optional() })
  .refine((v) => (v.whiteX === undefined) === (v.whiteY === undefined), {
    message: "give both whiteX and whiteY, or neither",
    path: ["whiteX"],
  });

/** Re-run the analysis of an upload, optionally with a tapped paper-white point. */
export const reanalyseInput = z.strictObject({
  white: z.strictObject({ x: fraction, y: fraction }).optional(),
});

export const uploadIdParams = z.strictObject({ id: z.string().uuid("is not an upload id") });
