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
  analyzePhoto,
  estimatePaper,
  measurePhoto,
  reportPaper,
  MERGE_BANDS_DE,
  type AnalyzeOptions,
  type MeasuredBand,
  type StripMeasurement,
  type PhotoMeasurement,
} from "./analyze-pixels";
export { loadVision } from "./vision";
export { correctToPaperWhite } from "./correct-photo";
export { NoStripError, type NoStripCode } from "./no-strip-error";
export { suggestInks, confidenceFor, MATCH_MAX_DE, CLOSE_MAX_DE, STASH_TIE_DE, SUGGESTION_COUNT } from "./match-inks";
export { segmentProfile, DEFAULT_SEGMENT_PARAMS, type SegmentParams, type SegmentResult, type Segment } from "./segment-profile";
export { BRADFORD, BRADFORD_INVERSE, bradfordMatrix } from "./bradford";
export { findPaperWhite, type PaperEstimate } from "./paper-white";
export { findStrips, detectScene, type FoundStrip } from "./find-strips";
export type {
  AnalysisBand,
  AnalysisResult,
  AnalysisTransition,
  CatalogueInk,
  InkSuggestion,
  MatchConfidence,
  Orientation,
  Outline,
  StripReading,
  AnalysisNotice,
  RgbImage,
  WhitePoint,
} from "./types";
