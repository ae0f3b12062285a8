// A strip's outline (four corners as fractions of the upright photo) and the member's corrections
// to it. The same checks run in the browser (before sending) and on the server (zod).
import { z } from "zod";
import type { Analysis, Outline, StripReading } from "./uploads";

/** Most strips one photo may hold (issue 11: "two to twelve strips"). */
export const MAX_STRIPS = 12;
/**
 * Smallest outline area, as a share of the photo (ours): 0.05 % — a strip 15 % of the long edge
 * long and one sixth as thick covers about 0.4 % of a 4:3 photo, so this only refuses slips.
 */
export const MIN_OUTLINE_AREA = 0.0005;

type Point = readonly [number, number];

/** Twice the signed area (shoelace formula); positive when the corners run clockwise on screen (y down). */
function signedArea2(q: readonly Point[]): number {
  let s = 0;
  for (let i = 0; i < q.length; i++) {
    const [x0, y0] = q[i]!;
    const [x1, y1] = q[(i + 1) % q.length]!;
    s += x0 * y1 - x1 * y0;
  }
  return s;
}

/** Area of the outline as a share of the photo (fractions of width × height). */
export function outlineArea(q: readonly Point[]): number {
  return Math.abs(signedArea2(q)) / 2;
}

/**
 * Whether the four corners make a convex quadrilateral running clockwise on screen: every turn
 * (cross product of consecutive edges) is to the same side, so the shape neither folds over
 * itself (a "bow tie") nor dents inwards.
 */
export function isClockwiseConvex(q: readonly Point[]): boolean {
  for (let i = 0; i < 4; i++) {
    const a = q[i]!;
    const b = q[(i + 1) % 4]!;
    const c = q[(i + 2) % 4]!;
    const cross = (b[0] - a[0]) * (c[1] - b[1]) - (b[1] - a[1]) * (c[0] - b[0]);
    if (!(cross > 0)) return false;
  }
  return true;
}

/** Why these corners are not an outline we can read, in words; null when they are fine. */
export function outlineProblem(q: readonly Point[]): string | null {
  if (!isClockwiseConvex(q)) {
    return "the four corners must make a convex shape, listed clockwise from the start of the strip (no crossed or dented sides)";
  }
  if (outlineArea(q) < MIN_OUTLINE_AREA) return "the outline is too small to read a strip from; drag its corners further apart";
  return null;
}

const coordinate = z.number({ error: "must be a number" }).min(0, "must be between 0 and 1").max(1, "must be between 0 and 1");
const point = z.tuple([coordinate, coordinate], { error: "each corner must be [x, y]" });

export const outlineSchema = z
  .tuple([point, point, point, point], { error: "an outline is four corners, each [x, y] as fractions of the photo" })
  .superRefine((q, ctx) => {
    const problem = outlineProblem(q);
    if (problem) ctx.addIssue({ code: "custom", message: problem });
  });

/** POST /api/uploads/:id/outline: read strip `stripIndex` at this outline; `stripIndex` = count adds one; null removes it. */
export const outlineCorrectionInput = z.strictObject({
  stripIndex: z
    .number({ error: "must be a number" })
    .int("must be a whole number")
    .min(0, "must be 0 or more")
    .max(MAX_STRIPS, `a photo holds at most ${MAX_STRIPS} strips`),
  outline: outlineSchema.nullable(),
});
export type OutlineCorrection = z.infer<typeof outlineCorrectionInput>;

/** The strip's centre line and thickness (fraction of the long edge), as `Analysis.strip` gives them. */
export function centreLineOf(q: Outline, width: number, height: number): NonNullable<Analysis["strip"]> {
  const mid = (a: Point, b: Point) => ({ x: (a[0] + b[0]) / 2, y: (a[1] + b[1]) / 2 });
  const px = (a: Point, b: Point) => Math.hypot((a[0] - b[0]) * width, (a[1] - b[1]) * height);
  const r = (v: number) => Math.round(v * 10_000) / 10_000;
  const start = mid(q[0], q[3]);
  const end = mid(q[1], q[2]);
  return {
    start: { x: r(start.x), y: r(start.y) },
    end: { x: r(end.x), y: r(end.y) },
    thickness: r((px(q[0], q[3]) + px(q[1], q[2])) / 2 / Math.max(width, height)),
  };
}

/** The outline around a centre line and thickness (an analysis made before outlines existed). */
export function outlineOfCentreLine(strip: NonNullable<Analysis["strip"]>, width: number, height: number): Outline {
  const sx = strip.start.x * width;
  const sy = strip.start.y * height;
  const dx = strip.end.x * width - sx;
  const dy = strip.end.y * height - sy;
  const len = Math.hypot(dx, dy) || 1;
  const h = (strip.thickness * Math.max(width, height)) / 2;
  // Across = along turned +90° on screen (y down): -h is the left-hand side going along.
  const ax = -dy / len;
  const ay = dx / len;
  const clamp = (v: number) => Math.min(1, Math.max(0, Math.round(v * 10_000) / 10_000));
  const at = (u: number, v: number): [number, number] => [clamp((sx + dx * u + ax * v) / width), clamp((sy + dy * u + ay * v) / height)];
  return [at(0, -h), at(1, -h), at(1, h), at(0, h)];
}

/**
 * Every strip of an analysis, in reading order. An analysis made before several-strip photos is
 * one strip: its own bands, with an outline made from its centre line when it has one.
 */
export function stripReadings(analysis: Analysis, size?: { width: number; height: number }): (Omit<StripReading, "outline"> & { outline: Outline | null })[] {
  if (analysis.strips?.length) return analysis.strips;
  const outline = analysis.strip && size ? outlineOfCentreLine(analysis.strip, size.width, size.height) : null;
  return [{ index: 0, outline, orientation: analysis.orientation, bands: analysis.bands, transitions: analysis.transitions, notices: [] }];
}
