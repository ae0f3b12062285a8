import type { Lab } from "../../shared/colour/index";

export type { Lab };

/** One catalogue ink as the analysis needs it. */
export type CatalogueInk = { id: number; name: string; brand: string; lab: Lab; hex: string };

/** Upright 8-bit sRGB pixels, 3 channels, row-major, no padding. */
export type RgbImage = { width: number; height: number; data: Uint8Array };

/** A point given as fractions (0–1) of the upright image's width and height. */
export type WhitePoint = { x: number; y: number };

export type Orientation = "horizontal" | "vertical";

/** "match" ΔE2000 ≤ 3, "close" ≤ 8, otherwise "no close ink" (our thresholds). */
export type MatchConfidence = "match" | "close" | "no close ink";

/** A catalogue ink suggested for a band, with its reference colour so a page can show it beside the band. */
export type InkSuggestion = { inkId: number; name: string; brand: string; deltaE: number; hex: string; lab: Lab };

export type AnalysisBand = {
  index: number;
  /** Fractions 0–1 along the strip: from the left end if horizontal, from the top if vertical. */
  start: number;
  end: number;
  hex: string;
  lab: Lab;
  /** 90th percentile ΔE2000 between the band's colour and its per-position colours along the strip. */
  spread: number;
  confidence: MatchConfidence;
  suggestions: InkSuggestion[];
};

export type AnalysisTransition = { start: number; end: number };

/**
 * A strip's four corners as [x, y] fractions of the upright photo. Order: p0→p1 runs along the
 * strip from its start (left end if horizontal, top end if vertical) to its far end, p1→p2 across
 * the far end, p2→p3 back along the other long side, p3→p0 across the start; clockwise on screen.
 * Under perspective the four corners are a general quadrilateral, not a rectangle.
 */
export type Outline = [[number, number], [number, number], [number, number], [number, number]];

/** Something the member should know about a reading, in words (code for tests and clients). */
export type AnalysisNotice = { code: string; message: string };

/** One strip found in the photo, read on its own. */
export type StripReading = {
  /** Reading order: top to bottom, then left to right. */
  index: number;
  outline: Outline;
  orientation: Orientation;
  bands: AnalysisBand[];
  transitions: AnalysisTransition[];
  /** Why this reading may be off (glare over the strip, strip small in the frame…). */
  notices: AnalysisNotice[];
};

export type AnalysisResult = {
  orientation: Orientation;
  /** The paper as photographed (before correction); found=false means no cast correction was made. */
  paper: { found: boolean; hex: string; lab: Lab };
  bands: AnalysisBand[];
  transitions: AnalysisTransition[];
  /** Centre line (fractions of width and height) and thickness (fraction of the long edge). */
  strip?: { start: { x: number; y: number }; end: { x: number; y: number }; thickness: number };
  /**
   * Every strip found, in reading order. `orientation`, `bands`, `transitions` and `strip` above
   * describe strips[0], so single-strip clients keep working.
   */
  strips: StripReading[];
  /** Notices about the whole photo (no paper white found, so taken as balanced…). */
  notices: AnalysisNotice[];
};
