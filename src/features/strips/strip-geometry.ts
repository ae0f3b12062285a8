import type { Analysis } from "../../../shared/schemas/uploads";

/**
 * Where the strip lies in the photo, if the analysis says: its two ends as fractions of the
 * image's width and height, and its thickness as a fraction of the image's long edge.
 */
export type StripGeometry = { start: { x: number; y: number }; end: { x: number; y: number }; thickness: number };

const fraction = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v) && v >= 0 && v <= 1;
const point = (v: unknown): v is { x: number; y: number } =>
  typeof v === "object" && v !== null && fraction((v as { x?: unknown }).x) && fraction((v as { y?: unknown }).y);

/** The analysis's `strip`, when present and sensible; otherwise null (bands are drawn as a bar). */
export function stripGeometry(analysis: Analysis | undefined): StripGeometry | null {
  const strip = (analysis as (Analysis & { strip?: unknown }) | undefined)?.strip;
  if (typeof strip !== "object" || strip === null) return null;
  const { start, end, thickness } = strip as Record<string, unknown>;
  if (!point(start) || !point(end) || !fraction(thickness) || thickness === 0) return null;
  if (start.x === end.x && start.y === end.y) return null;
  return { start, end, thickness };
}
