// What a generated scene knows about itself: the physical description it was rendered from
// (SceneSpec, millimetres on the table) and the truth the analysis is scored against (SceneTruth,
// fractions of the image). All colours in the truth are media-relative CIELAB (D65): the colour as
// it would read on the strip's own paper with that paper mapped to L* = 100.
import type { Lab } from "../../../shared/colour/index";
import type { Desk, DeskKind } from "./desk";
import type { Mat3, Pt, Quad } from "./geometry";

export type SceneClass = 1 | 2 | 3 | 4 | 5 | 6 | 7 | 8;

export const CLASS_NAMES: Record<SceneClass, string> = {
  1: "card on a desk",
  2: "no card",
  3: "at an angle",
  4: "uneven light",
  5: "real ink and paper",
  6: "several strips",
  7: "small in the frame",
  8: "long blends",
};

export type InkTruth = {
  lab: Lab;
  /** Where the band is flat, as fractions of the inked part's length from the strip's start (left/top end on screen). */
  start: number;
  end: number;
};

export type StripTruth = {
  /** Corners of the whole cardstock strip, [x, y] fractions of the image, in the project's Outline order. */
  corners: Quad;
  /** Corners of the inked part (the strip less its white end margins), same order. */
  inkedCorners: Quad;
  orientation: "horizontal" | "vertical";
  inks: InkTruth[];
  /** Centre of each blend (where the density is half-way between the two inks), fractions of the inked part. */
  joins: number[];
  /** Un-inked white margins at the start and far end, fractions of the whole strip's length. */
  margins: [number, number];
  /** The strip's length on screen as a share of the image's long edge. */
  lengthShare: number;
};

export type SceneTruth = {
  seed: number;
  cls: SceneClass;
  split: "tuning" | "heldout" | "other";
  /** Size of the JPEG (for 48 MP scenes, rendered at 12 MP and upscaled by sharp). */
  width: number;
  height: number;
  renderedWidth: number;
  renderedHeight: number;
  quality: number;
  desk: { kind: DeskKind; sub: string; colours: Lab[]; clutter: string[] };
  card: { present: boolean; lab?: Lab; coverage?: number; deskSides?: number; corners?: Pt[] };
  light: {
    cct: number;
    xy: [number, number];
    /** False when the scene was rendered with no cast (a no-card strip with no white margin). */
    cast: boolean;
    falloff: number;
    shadow: boolean;
    shadowOverStrip: boolean;
    glare: boolean;
    glareOverStrip: boolean;
    vignette: number;
  };
  camera: { tiltDeg: number; layoutRotationDeg: number; hfovDeg: number };
  nuisances: { mottle: number; streaks: boolean; grain: number; blurPx: number; sharpen: number; noise: number };
  /** True when the photo holds paper white the analysis can use (a card, or a strip's white margins). */
  whiteAvailable: boolean;
  /** Reading order: rows top to bottom (strips whose on-screen vertical extents overlap by half the smaller one share a row), then left to right by centre. */
  strips: StripTruth[];
};

export type InkSpec = { lab: Lab; density: [number, number, number] };

export type StripSpec = {
  cx: number;
  cy: number;
  /** Direction of the strip's axis on the table (radians). */
  angle: number;
  length: number;
  width: number;
  paper: [number, number, number];
  /** White margins at the low-u and high-u ends, mm. */
  marginLo: number;
  marginHi: number;
  /** Width of the brush's fade into a margin, mm (0 where the ink runs off the cut end). */
  fadeLo: number;
  fadeHi: number;
  inks: InkSpec[];
  /** Flat stretch of each ink and each join's blend, fractions of the inked part, from its low-u end. */
  flats: { start: number; end: number }[];
  joins: { centre: number; width: number }[];
  mottle: number;
  mottleScale: number;
  streaks: boolean;
  grain: number;
  curl: number;
  /** Extra ink density at the long edges (the blending tool drags or starves there), as a share. */
  edgeInk: number;
  seed: number;
};

/** Things crafters leave on the desk beside the card: not strips, never to be read as one. */
export type ClutterSpec = {
  kind: "pencil" | "ink-pad" | "sticky-note" | "tape-roll";
  cx: number;
  cy: number;
  angle: number;
  hw: number;
  hh: number;
  round: number;
  /** Outer colour and, for an ink pad or a tape roll, the inner one (linear reflectance). */
  colour: [number, number, number];
  inner: [number, number, number];
  /** Height above the desk in mm: how far its shadow falls. */
  height: number;
};

export type ShadowSpec = { cx: number; cy: number; angle: number; hw: number; hh: number; round: number; penumbra: number; darkness: number };
export type GlareSpec = { cx: number; cy: number; sigma: number; peak: number };

export type SceneSpec = {
  seed: number;
  cls: SceneClass;
  width: number;
  height: number;
  outWidth: number;
  outHeight: number;
  quality: number;
  /** Table plane (mm) → image (px). */
  H: Mat3;
  tiltDeg: number;
  hfovDeg: number;
  layoutRotationDeg: number;
  desk: Desk;
  clutter: ClutterSpec[];
  card: { cx: number; cy: number; angle: number; w: number; h: number; paper: [number, number, number]; grain: number; seed: number } | null;
  strips: StripSpec[];
  light: {
    cct: number;
    xy: [number, number];
    cast: boolean;
    /** Linear camera RGB per unit of scene linear sRGB (cast × exposure). */
    camera: Mat3;
    falloff: { ratio: number; ox: number; oy: number; dx: number; dy: number; extent: number };
    shadows: ShadowSpec[];
    glares: GlareSpec[];
    contact: { ox: number; oy: number; darkness: number };
    vignette: number;
  };
  blurPx: number;
  /** Phone sharpening (unsharp mask on the linear image): amount and radius in px, or none. */
  sharpen: { amount: number; sigma: number } | null;
  noise: number;
  shadowOverStrip: boolean;
  glareOverStrip: boolean;
};
