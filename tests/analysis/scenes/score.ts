// Scoring one analysis result against a scene's truth. Definitions (also in scripts/eval-scenes.ts):
//
// MATCHING. Reported outlines and true strips are quads in image fractions (scaled to pixels for
// areas). A reported outline is MERGED if at least two true strips each have ≥ 50 % of their area
// inside it. Otherwise it may match a true strip when IoU(outline, whole strip) or IoU(outline,
// inked part) ≥ 0.3 (polygon IoU, Sutherland–Hodgman clipping of convex quads), or when each one's
// centroid lies inside the other and their areas are within 2× of each other. Pairs are taken
// greedily by IoU, one to one. A true strip left without a match is MISSED; a reported outline
// that is neither merged nor matched is INVENTED. FOUND = matched true strips.
//
// POSITIONS. A reported fraction s along a strip is the point (s, ½) of the reported outline
// (unit square → outline homography), mapped into the true strip's inked part (its own
// homography): u = fraction along the true inked part. So a report may measure along the whole
// strip or the inked part, either direction, with or without rectification: only where it says
// the band is on the real strip counts.
//
// BANDS. Right count: the number of reported bands equals the number of true inks (denominator:
// every true strip; a missed strip or a refused photo is not right). On strips with the right count,
// bands sorted by u pair with the true inks in order: ΔE2000(reported lab, truth lab); each join
// error = |u of the reported transition's centre − true join| in % of the inked part's length
// (the centre of transitions[j] when there are exactly count − 1 transitions, otherwise the
// midpoint of bands[j].end and bands[j+1].start).
//
// DESK OR CARD READ AS A BAND. A reported band of a matched strip whose centre lies outside the
// true inked part (u < −0.03 or u > 1.03, or more than half the strip's width off its axis), or
// whose colour is within ΔE2000 6 of the desk's main colours or the card (media-relative truth)
// while ≥ 10 from every true ink of that strip. Every band of an invented outline within ΔE2000 6 of
// the desk or card counts too.
import { deltaE2000, type Lab } from "../../../shared/colour/index";
import { applyH, centroid, insideConvex, intersectionArea, inv3, iou, polygonArea, squareToQuad, type Pt, type Quad } from "./geometry";
import type { SceneTruth } from "./types";

/** The parts of an AnalysisResult (server/analysis/types.ts) the scoring reads. */
export type ReportedStrip = {
  index: number;
  outline: Quad;
  bands: { start: number; end: number; lab: Lab }[];
  transitions: { start: number; end: number }[];
};
export type Reported = { strips: ReportedStrip[] };

export type StripScore = {
  truthIndex: number;
  inks: number;
  found: boolean;
  reportedIndex?: number;
  iou?: number;
  bands?: number;
  rightCount: boolean;
  deltaE: number[];
  joinErrorPct: number[];
  deskBands: number;
};

export type SceneScore = {
  seed: number;
  cls: number;
  refused: string | null;
  error: string | null;
  trueStrips: number;
  reportedStrips: number;
  found: number;
  missed: number;
  invented: number;
  merged: number;
  /** Reading order right: matched strips' reported indices increase with the truth's order (scenes of several strips). */
  orderRight: boolean | null;
  deskBands: number;
  strips: StripScore[];
};

function toPx(q: readonly (readonly number[])[], w: number, h: number): Pt[] {
  return q.map((p) => [p[0] * w, p[1] * h] as Pt);
}

/** Score a scene whose analysis refused (NoStripError code) or crashed. */
export function scoreFailure(truth: SceneTruth, refused: string | null, error: string | null): SceneScore {
  return {
    seed: truth.seed,
    cls: truth.cls,
    refused,
    error,
    trueStrips: truth.strips.length,
    reportedStrips: 0,
    found: 0,
    missed: truth.strips.length,
    invented: 0,
    merged: 0,
    orderRight: null,
    deskBands: 0,
    strips: truth.strips.map((s, i) => ({ truthIndex: i, inks: s.inks.length, found: false, rightCount: false, deltaE: [], joinErrorPct: [], deskBands: 0 })),
  };
}

export function scoreScene(truth: SceneTruth, reported: Reported): SceneScore {
  const w = truth.width;
  const h = truth.height;
  const trueWhole = truth.strips.map((s) => toPx(s.corners, w, h));
  const trueInked = truth.strips.map((s) => toPx(s.inkedCorners, w, h));
  const rep = reported.strips.map((r) => toPx(r.outline, w, h));
  const surround: Lab[] = [...truth.desk.colours, ...(truth.card.present && truth.card.lab ? [truth.card.lab] : [])];

  // Merged outlines.
  const merged = new Set<number>();
  rep.forEach((q, i) => {
    let n = 0;
    for (const t of trueWhole) if (intersectionArea(t, q) >= 0.5 * Math.abs(polygonArea(t))) n++;
    if (n >= 2) merged.add(i);
  });
  // Candidate pairs.
  const pairs: { r: number; t: number; score: number }[] = [];
  rep.forEach((q, r) => {
    if (merged.has(r)) return;
    trueWhole.forEach((t, ti) => {
      const score = Math.max(iou(q, t), iou(q, trueInked[ti]));
      const ratio = Math.abs(polygonArea(q)) / Math.abs(polygonArea(t));
      const mutual = insideConvex(centroid(q), t) && insideConvex(centroid(t), q) && ratio >= 0.5 && ratio <= 2;
      if (score >= 0.3 || mutual) pairs.push({ r, t: ti, score });
    });
  });
  pairs.sort((a, b) => b.score - a.score);
  const repToTrue = new Map<number, number>();
  const trueToRep = new Map<number, number>();
  for (const p of pairs) {
    if (repToTrue.has(p.r) || trueToRep.has(p.t)) continue;
    repToTrue.set(p.r, p.t);
    trueToRep.set(p.t, p.r);
  }

  const strips: StripScore[] = truth.strips.map((ts, ti) => {
    const ri = trueToRep.get(ti);
    const base: StripScore = { truthIndex: ti, inks: ts.inks.length, found: ri !== undefined, rightCount: false, deltaE: [], joinErrorPct: [], deskBands: 0 };
    if (ri === undefined) return base;
    const r = reported.strips[ri];
    const toTrue = inv3(squareToQuad(trueInked[ti] as Quad));
    const fromRep = squareToQuad(rep[ri] as Quad);
    const uv = (s: number): Pt => applyH(toTrue, applyH(fromRep, [s, 0.5]));
    const bands = r.bands.map((b) => ({ ...b, pos: uv((b.start + b.end) / 2) })).sort((a, b) => a.pos[0] - b.pos[0]);
    let desk = 0;
    for (const b of bands) {
      const outside = b.pos[0] < -0.03 || b.pos[0] > 1.03 || Math.abs(b.pos[1] - 0.5) > 1;
      const looksLikeSurround = surround.some((c) => deltaE2000(b.lab, c) <= 6) && ts.inks.every((k) => deltaE2000(b.lab, k.lab) >= 10);
      if (outside || looksLikeSurround) desk++;
    }
    const k = ts.inks.length;
    const right = r.bands.length === k;
    const out: StripScore = { ...base, reportedIndex: r.index, iou: Math.max(iou(rep[ri], trueWhole[ti]), iou(rep[ri], trueInked[ti])), bands: r.bands.length, rightCount: right, deskBands: desk };
    if (right) {
      out.deltaE = bands.map((b, i) => deltaE2000(b.lab, ts.inks[i].lab));
      // Transition centres in the report's own order, then put in true order by u.
      const centres = r.transitions.length === k - 1 ? r.transitions.map((t) => (t.start + t.end) / 2) : r.bands.slice(0, -1).map((b, i) => (b.end + r.bands[i + 1].start) / 2);
      const us = centres.map((c) => uv(c)[0]).sort((a, b) => a - b);
      out.joinErrorPct = us.map((u, j) => Math.abs(u - ts.joins[j]) * 100);
    }
    return out;
  });

  let inventedDesk = 0;
  let invented = 0;
  reported.strips.forEach((r, i) => {
    if (merged.has(i) || repToTrue.has(i)) return;
    invented++;
    for (const b of r.bands) if (surround.some((c) => deltaE2000(b.lab, c) <= 6)) inventedDesk++;
  });

  // Reading order among the matched strips.
  let orderRight: boolean | null = null;
  if (truth.strips.length > 1) {
    const idx = truth.strips.map((_, ti) => trueToRep.get(ti)).filter((x): x is number => x !== undefined).map((ri) => reported.strips[ri].index);
    orderRight = idx.every((v, i) => i === 0 || v > idx[i - 1]);
  }

  const found = strips.filter((s) => s.found).length;
  return {
    seed: truth.seed,
    cls: truth.cls,
    refused: null,
    error: null,
    trueStrips: truth.strips.length,
    reportedStrips: reported.strips.length,
    found,
    missed: truth.strips.length - found,
    invented,
    merged: merged.size,
    orderRight,
    deskBands: strips.reduce((s, x) => s + x.deskBands, 0) + inventedDesk,
    strips,
  };
}

export function quantile(xs: number[], q: number): number | null {
  if (!xs.length) return null;
  const s = [...xs].sort((a, b) => a - b);
  const pos = (s.length - 1) * q;
  const lo = Math.floor(pos);
  const hi = Math.ceil(pos);
  return s[lo] + (s[hi] - s[lo]) * (pos - lo);
}

export type ClassFigures = {
  scenes: number;
  trueStrips: number;
  found: number;
  missed: number;
  invented: number;
  merged: number;
  rightCountPct: number;
  deltaEMedian: number | null;
  deltaEP95: number | null;
  joinErrorMedianPct: number | null;
  joinErrorP95Pct: number | null;
  refused: number;
  refusedCodes: Record<string, number>;
  errors: number;
  deskBands: number;
  deskBandScenes: number;
  orderRightPct: number | null;
};

export function aggregate(scores: SceneScore[]): ClassFigures {
  const strips = scores.flatMap((s) => s.strips);
  const dE = strips.flatMap((s) => s.deltaE);
  const je = strips.flatMap((s) => s.joinErrorPct);
  const codes: Record<string, number> = {};
  for (const s of scores) if (s.refused) codes[s.refused] = (codes[s.refused] ?? 0) + 1;
  const ordered = scores.filter((s) => s.orderRight !== null);
  const r2 = (x: number | null) => (x === null ? null : Math.round(x * 100) / 100);
  return {
    scenes: scores.length,
    trueStrips: strips.length,
    found: scores.reduce((a, s) => a + s.found, 0),
    missed: scores.reduce((a, s) => a + s.missed, 0),
    invented: scores.reduce((a, s) => a + s.invented, 0),
    merged: scores.reduce((a, s) => a + s.merged, 0),
    rightCountPct: strips.length ? Math.round((1000 * strips.filter((s) => s.rightCount).length) / strips.length) / 10 : 0,
    deltaEMedian: r2(quantile(dE, 0.5)),
    deltaEP95: r2(quantile(dE, 0.95)),
    joinErrorMedianPct: r2(quantile(je, 0.5)),
    joinErrorP95Pct: r2(quantile(je, 0.95)),
    refused: scores.filter((s) => s.refused).length,
    refusedCodes: codes,
    errors: scores.filter((s) => s.error).length,
    deskBands: scores.reduce((a, s) => a + s.deskBands, 0),
    deskBandScenes: scores.filter((s) => s.deskBands > 0).length,
    orderRightPct: ordered.length ? Math.round((1000 * ordered.filter((s) => s.orderRight).length) / ordered.length) / 10 : null,
  };
}
