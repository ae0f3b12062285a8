import { DEFAULT_MAX_DELTA_E } from "../../../shared/schemas/search";

/**
 * A colour search's closeness (a ΔE2000 threshold) in words. The steps at 1, 2, 5 and 10 follow
 * the common-practice reading of ΔE2000 (indistinguishable, barely different, similar,
 * noticeably different) that describeDeltaE uses; they are not a published standard.
 */
export function thresholdWords(maxDeltaE: number): string {
  if (maxDeltaE <= 1) return "only colours that look the same";
  if (maxDeltaE <= 2) return "the same colour or barely different";
  if (maxDeltaE <= 5) return "similar colours";
  if (maxDeltaE <= 10) return maxDeltaE === DEFAULT_MAX_DELTA_E ? "the same colour family (the usual choice)" : "the same colour family";
  if (maxDeltaE <= 20) return "loosely related colours";
  return "anything roughly nearby";
}
