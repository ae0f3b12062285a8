import type { ReactNode } from "react";
import type { Lab } from "../../../shared/colour";
import type { AnalysisBand, InkSuggestion } from "../../../shared/schemas/uploads";

/** One ink in the ink order being put together: enough to show it and send its id. */
export type InkChoice = {
  id: number;
  name: string;
  brand: string;
  /** Unknown until the ink's details have loaded (suggestions carry no colour). */
  hex?: string;
  lab?: Lab;
  /** The band this ink was suggested for, if it came from the analysis. */
  band?: number;
};

/** Looks up an ink's reference colour by id (the route supplies it from the catalogue). */
export type InkColourLookup = (id: number) => { hex: string; lab: Lab } | undefined;

/** A slot for the catalogue's ink search; the route fills it (features do not import each other). */
export type InkPickerSlot = (props: { onPick: (ink: InkChoice) => void; chosenIds: number[]; disabled: boolean }) => ReactNode;

/** The ink order to start from: each band's best suggestion, in band order, each ink once. */
export function prefillInks(bands: AnalysisBand[]): InkChoice[] {
  const seen = new Set<number>();
  const inks: InkChoice[] = [];
  for (const band of [...bands].sort((a, b) => a.index - b.index)) {
    const top = band.suggestions[0];
    if (!top || seen.has(top.inkId)) continue;
    seen.add(top.inkId);
    inks.push({ id: top.inkId, name: top.name, brand: top.brand, band: band.index });
  }
  return inks;
}

/**
 * The ink order with a suggestion taken for a band: it replaces the ink that stood for that band,
 * or goes in among the other bands' inks in band order. (The caller checks it is not there yet.)
 */
export function withSuggestion(inks: InkChoice[], bandIndex: number, s: InkSuggestion): InkChoice[] {
  const choice: InkChoice = { id: s.inkId, name: s.name, brand: s.brand, band: bandIndex };
  const at = inks.findIndex((i) => i.band === bandIndex);
  if (at >= 0) return inks.map((ink, i) => (i === at ? choice : ink));
  const before = inks.findIndex((i) => i.band !== undefined && i.band > bandIndex);
  return before >= 0 ? [...inks.slice(0, before), choice, ...inks.slice(before)] : [...inks, choice];
}
