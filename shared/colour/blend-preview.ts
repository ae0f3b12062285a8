// The layout of a blend preview: flat bands with predicted transitions between them, as colour
// stops along the strip. The web page draws it as a CSS gradient and the practice card (PDF) as
// thin rectangles, so both show the same strip.
import { blendDensities, labToDensity } from "./blend";
import { labToHex, type Lab } from "./index";

/**
 * Relative widths: a band, and the blended join between two bands. Crafters blend a join over
 * roughly half to three quarters of a band's width (our reading of the demo strips, whose
 * transitions the analysis measures at 3–10 % of a 3–5 ink strip); 0.6 shows the join clearly.
 */
export const PREVIEW_BAND = 1;
export const PREVIEW_JOIN = 0.6;

export type PreviewStop = { at: number; hex: string };
export type PreviewSpan = { from: number; to: number };

export type PreviewLayout = {
  /** Colour stops along the strip, 0 = start, 1 = end, in order. */
  stops: PreviewStop[];
  bands: PreviewSpan[];
  joins: PreviewSpan[];
};

/** `steps` samples per join (the more, the smoother the printed join). */
export function previewLayout(labs: Lab[], steps = 16): PreviewLayout {
  const n = labs.length;
  if (n === 0) return { stops: [], bands: [], joins: [] };
  const total = n * PREVIEW_BAND + (n - 1) * PREVIEW_JOIN;
  const bands: PreviewSpan[] = [];
  const joins: PreviewSpan[] = [];
  const stops: PreviewStop[] = [];
  const dens = labs.map(labToDensity);
  let x = 0;
  for (let i = 0; i < n; i++) {
    const band = { from: x / total, to: (x + PREVIEW_BAND) / total };
    bands.push(band);
    const hex = labToHex(labs[i]!);
    stops.push({ at: band.from, hex }, { at: band.to, hex });
    x += PREVIEW_BAND;
    if (i < n - 1) {
      const join = { from: x / total, to: (x + PREVIEW_JOIN) / total };
      joins.push(join);
      for (let k = 1; k < steps; k++) {
        const f = k / steps;
        stops.push({ at: join.from + f * (join.to - join.from), hex: labToHex(blendDensities(dens[i]!, dens[i + 1]!, f)) });
      }
      x += PREVIEW_JOIN;
    }
  }
  return { stops, bands, joins };
}

/** The strip as a CSS linear-gradient (left to right). */
export function previewGradient(layout: PreviewLayout): string {
  if (layout.stops.length === 0) return "none";
  const parts = layout.stops.map((s) => `${s.hex} ${(s.at * 100).toFixed(2)}%`);
  return `linear-gradient(to right, ${parts.join(", ")})`;
}
