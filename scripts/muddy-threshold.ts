// The data behind the muddy-join threshold (docs/decisions/008-muddy-joins-and-takeover.md):
// for every pair of demo catalogue inks, the predicted middle's chroma over the weaker end's,
// grouped by how far apart the two hues are. Run: npx tsx scripts/muddy-threshold.ts
import { hexToLab, labToLch } from "../shared/colour";
import { blendLab } from "../shared/colour/blend";
import { MUDDY_CHROMA_RATIO, MUDDY_MIN_END_CHROMA, TAKEOVER_LIGHTNESS_GAP } from "../shared/colour/joins";
import { demoInks } from "./demo/catalogue";

type Pair = { hueGap: number; ratio: number; weaker: number; lightnessGap: number; lightnessProgress: number };

const inks = demoInks.map((i) => hexToLab(i.hex));
const pairs: Pair[] = [];
for (let i = 0; i < inks.length; i++) {
  for (let j = i + 1; j < inks.length; j++) {
    const a = inks[i]!;
    const b = inks[j]!;
    const la = labToLch(a);
    const lb = labToLch(b);
    const mid = blendLab(a, b, 0.5);
    let hueGap = Math.abs(la.h - lb.h);
    if (hueGap > 180) hueGap = 360 - hueGap;
    const [light, dark] = a.l >= b.l ? [a, b] : [b, a];
    pairs.push({
      hueGap,
      ratio: Math.hypot(mid.a, mid.b) / Math.min(la.c, lb.c),
      weaker: Math.min(la.c, lb.c),
      lightnessGap: light.l - dark.l,
      lightnessProgress: light.l - dark.l > 1 ? (light.l - mid.l) / (light.l - dark.l) : NaN,
    });
  }
}
const quantile = (xs: number[], p: number) => {
  const s = [...xs].sort((x, y) => x - y);
  return s.length ? s[Math.floor(p * (s.length - 1))]! : NaN;
};
const f2 = (n: number) => n.toFixed(2);

console.log(`${inks.length} inks, ${pairs.length} pairs; colourful pairs (both C*ab ≥ ${MUDDY_MIN_END_CHROMA}) by hue gap:`);
const colourful = pairs.filter((p) => p.weaker >= MUDDY_MIN_END_CHROMA);
console.log("| hue gap | pairs | lowest ratio | p10 | median | muddy at the chosen ratio |");
for (const [lo, hi] of [[0, 30], [30, 60], [60, 90], [90, 120], [120, 150], [150, 181]] as const) {
  const g = colourful.filter((p) => p.hueGap >= lo && p.hueGap < hi).map((p) => p.ratio);
  const muddy = g.filter((r) => r < MUDDY_CHROMA_RATIO).length;
  console.log(`| ${lo}–${Math.min(hi, 180)}° | ${g.length} | ${f2(quantile(g, 0))} | ${f2(quantile(g, 0.1))} | ${f2(quantile(g, 0.5))} | ${((100 * muddy) / Math.max(1, g.length)).toFixed(0)} % |`);
}

const close = colourful.filter((p) => p.hueGap < 60);
const opposite = colourful.filter((p) => p.hueGap >= 150);
console.log("\nratio threshold: share of near-complementary (≥150°) flagged, share of close hues (<60°) flagged");
for (let r = 0.5; r <= 1.0001; r += 0.05) {
  const tp = opposite.filter((p) => p.ratio < r).length / opposite.length;
  const fp = close.filter((p) => p.ratio < r).length / close.length;
  console.log(`  ${f2(r)}: ${(100 * tp).toFixed(1)} %  ${(100 * fp).toFixed(1)} %`);
}

console.log(`\ntakeover: halfway lightness progress toward the darker ink, by L* gap (hint at ≥ ${TAKEOVER_LIGHTNESS_GAP})`);
for (const [lo, hi] of [[10, 20], [20, 30], [30, 40], [40, 50], [50, 100]] as const) {
  const g = pairs.filter((p) => p.lightnessGap >= lo && p.lightnessGap < hi).map((p) => p.lightnessProgress);
  console.log(`  ΔL* ${lo}–${hi}: ${g.length} pairs, median ${f2(quantile(g, 0.5))}, p90 ${f2(quantile(g, 0.9))}`);
}
console.log(`pairs with a takeover hint: ${pairs.filter((p) => p.lightnessGap >= TAKEOVER_LIGHTNESS_GAP).length} of ${pairs.length}`);
