// Suggests catalogue inks for a measured band colour by CIEDE2000.
import { deltaE2000, type Lab } from "../../shared/colour/index";
import type { CatalogueInk, InkSuggestion, MatchConfidence } from "./types";

/** Our own thresholds (not a standard): ΔE2000 ≤ 3 reads as the same ink, ≤ 8 as a near one. */
export const MATCH_MAX_DE = 3;
export const CLOSE_MAX_DE = 8;
/** A stash ink this close to the best ΔE2000 is suggested first (treated as a tie). */
export const STASH_TIE_DE = 1.0;
export const SUGGESTION_COUNT = 5;

export function confidenceFor(deltaE: number | undefined): MatchConfidence {
  if (deltaE === undefined) return "no close ink";
  if (deltaE <= MATCH_MAX_DE) return "match";
  if (deltaE <= CLOSE_MAX_DE) return "close";
  return "no close ink";
}

const round2 = (v: number) => Math.round(v * 100) / 100;

/**
 * The best five inks by ΔE2000, closest first; if the stash holds an ink within STASH_TIE_DE of
 * the best, that stash ink (the closest such) goes first. Ties in ΔE are broken by ink id.
 */
export function suggestInks(lab: Lab, catalogue: readonly CatalogueInk[], stash?: ReadonlySet<number>): { suggestions: InkSuggestion[]; confidence: MatchConfidence } {
  const scored = catalogue.map((ink) => ({ ink, de: deltaE2000(lab, ink.lab) }));
  scored.sort((a, b) => a.de - b.de || a.ink.id - b.ink.id);
  if (scored.length === 0) return { suggestions: [], confidence: "no close ink" };
  let ordered = scored.slice(0, SUGGESTION_COUNT);
  if (stash && stash.size > 0) {
    const best = scored[0].de;
    const preferred = scored.find((s) => stash.has(s.ink.id) && s.de <= best + STASH_TIE_DE);
    if (preferred && preferred !== scored[0]) {
      ordered = [preferred, ...scored.filter((s) => s !== preferred).slice(0, SUGGESTION_COUNT - 1)];
    }
  }
  const suggestions = ordered.map((s) => ({ inkId: s.ink.id, name: s.ink.name, brand: s.ink.brand, deltaE: round2(s.de), hex: s.ink.hex, lab: s.ink.lab }));
  return { suggestions, confidence: confidenceFor(ordered[0].de) };
}
