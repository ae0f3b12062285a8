// What a planned join between two neighbouring inks will look like, in words and numbers: the
// step (ΔE2000), a muddy-join warning and a takeover hint. The rules and their thresholds are
// argued in docs/decisions/008-muddy-joins-and-takeover.md; the blend model is shared/colour/blend.ts.
import { blendDensities, labToDensity, type Density } from "./blend";
import { deltaE2000, describeDeltaE, labToHex, labToLch, type Lab } from "./index";

/**
 * A join is muddy when the middle of the predicted blend has less than MUDDY_CHROMA_RATIO of the
 * chroma (C*ab) of the weaker of its two inks, both inks being colourful (C*ab ≥
 * MUDDY_MIN_END_CHROMA; a grey or near-white ink has no colour to lose). 0.8 was chosen on the
 * demo catalogue's 7 140 pairs (decision 008): no pair of inks whose hues lie within 60° loses
 * that much (their lowest ratio is 0.85), while 78 % of near-complementary pairs (hues 150–180°
 * apart) do.
 */
export const MUDDY_CHROMA_RATIO = 0.8;
export const MUDDY_MIN_END_CHROMA = 15;

/**
 * A takeover hint when one ink is at least this much darker (CIELAB L*) than its neighbour. Our
 * own threshold (decision 008): at that gap the model puts the halfway colour about 60 % of the
 * way to the dark ink in lightness, and the common advice of the trade is to blend the dark ink
 * in lightly, from the light side.
 */
export const TAKEOVER_LIGHTNESS_GAP = 40;

/** Shown beside the step's words wherever they appear. */
export const STEP_SCALE =
  "ΔE2000 up to 1: indistinguishable, up to 2: barely different, up to 5: similar, up to 10: noticeably different, above: very different (common practice among colour practitioners, not a published standard).";

export type JoinFacts = {
  /** ΔE2000 between the two inks' reference colours. */
  deltaE: number;
  /** The step in plain words ("noticeably different"). */
  words: string;
  /** The predicted colour halfway through the blend. */
  middle: { lab: Lab; hex: string };
  /** C*ab of the first ink, the second, and the predicted middle. */
  chroma: { first: number; second: number; middle: number };
  /** Middle chroma over the weaker end's chroma (1 = keeps its colour). */
  chromaRatio: number;
  muddy: boolean;
  /** Which ink would take the blend over (the far darker one), if any. */
  takeover: "first" | "second" | null;
};

const round2 = (n: number) => Math.round(n * 100) / 100;

/** The muddy rule alone, from chromas (the bridge finder's hot loop uses this). */
export function isMuddy(firstChroma: number, secondChroma: number, middleChroma: number): boolean {
  const weaker = Math.min(firstChroma, secondChroma);
  return weaker >= MUDDY_MIN_END_CHROMA && middleChroma < MUDDY_CHROMA_RATIO * weaker;
}

/** Chroma of the predicted middle of a blend between two densities. */
export function middleChroma(dA: Density, dB: Density): number {
  const m = blendDensities(dA, dB, 0.5);
  return Math.hypot(m.a, m.b);
}

/** The far darker ink of the two, which would swamp the other if blended in heavily. */
export function takeoverOf(first: Lab, second: Lab): JoinFacts["takeover"] {
  if (first.l - second.l >= TAKEOVER_LIGHTNESS_GAP) return "second";
  if (second.l - first.l >= TAKEOVER_LIGHTNESS_GAP) return "first";
  return null;
}

/** The facts of one join, first ink on the left (or top) of the strip. */
export function joinFacts(first: Lab, second: Lab): JoinFacts {
  const deltaE = round2(deltaE2000(first, second));
  const mid = blendDensities(labToDensity(first), labToDensity(second), 0.5);
  const c1 = labToLch(first).c;
  const c2 = labToLch(second).c;
  const cm = Math.hypot(mid.a, mid.b);
  const weaker = Math.min(c1, c2);
  return {
    deltaE,
    words: describeDeltaE(deltaE),
    middle: { lab: mid, hex: labToHex(mid) },
    chroma: { first: round2(c1), second: round2(c2), middle: round2(cm) },
    chromaRatio: weaker > 0 ? round2(cm / weaker) : 1,
    muddy: isMuddy(c1, c2, cm),
    takeover: takeoverOf(first, second),
  };
}
