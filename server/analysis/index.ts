export {
  analyzeStripImage,
  processStripPhoto,
  ANALYSIS_LONG_EDGE,
  type StripPhotoOptions,
  type StripPhotoTimings,
  type ProcessedStripPhoto,
} from "./process-strip-photo";
export {
  analyzePixels,
  estimatePaper,
  measureStrip,
  reportPaper,
  MERGE_BANDS_DE,
  type AnalyzeOptions,
  type MeasuredBand,
  type StripMeasurement,
} from "./analyze-pixels";
export { correctToPaperWhite } from "./correct-photo";
export { NoStripError, type NoStripCode } from "./no-strip-error";
export { suggestInks, confidenceFor, MATCH_MAX_DE, CLOSE_MAX_DE, STASH_TIE_DE, SUGGESTION_COUNT } from "./match-inks";
export { segmentProfile, DEFAULT_SEGMENT_PARAMS, type SegmentParams, type SegmentResult, type Segment } from "./segment-profile";
export { BRADFORD, BRADFORD_INVERSE, bradfordMatrix } from "./bradford";
export { findPaperWhite, type PaperEstimate } from "./paper-white";
export { findStrip, type StripGeometry } from "./find-strip";
export type {
  AnalysisBand,
  AnalysisResult,
  AnalysisTransition,
  CatalogueInk,
  InkSuggestion,
  MatchConfidence,
  Orientation,
  RgbImage,
  WhitePoint,
} from "./types";
