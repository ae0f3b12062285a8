// Predicted joins against measured ones: `npm run report:blends` (DATA_DIR as for the app,
// default ./storage). For every published strip, the analysis reads the original photo again and,
// for each transition between two bands, compares the middle the blend model predicts (from the
// two bands' measured colours; shared/colour/blend.ts, decision 002) with the colour measured
// there. Prints the median and 95th percentile ΔE2000, and the same for a straight CIELAB
// blend for comparison; the last line is one JSON object.
//
// Be plain about the data: the demo's strips are SYNTHETIC photos rendered by
// server/demo/synthetic-photo.ts, whose blends are themselves made in log reflectance — the same
// family as the model — so on the demo this checks the measuring, not the model. The figures mean
// something about real ink only once members post real strips.
import path from "node:path";
import { decodeImageBytes, readImageBytes } from "../server/images";
import { measurePhoto } from "../server/analysis/analyze-pixels";
import { loadVision } from "../server/analysis/vision";
import { checkJoins, medianAndP95, type JoinCheck } from "../server/analysis/blend-check";
import { ANALYSIS_LONG_EDGE } from "../server/analysis/process-strip-photo";
import { openDatabase } from "../server/db/client";

const dataDir = path.resolve(process.env.DATA_DIR || "./storage");
const db = openDatabase(path.join(dataDir, "blendwell.sqlite"));
await loadVision();
try {
  const strips = await db
    .selectFrom("strips as s")
    .innerJoin("uploads as u", "u.id", "s.upload_id")
    .innerJoin("profiles as p", "p.user_id", "s.author_id")
    .select(["s.id", "s.title", "s.strip_index", "u.original_key", "p.is_demo"])
    .where("s.status", "=", "published")
    .orderBy("s.id")
    .execute();
  const checks: JoinCheck[] = [];
  let read = 0;
  let unreadable = 0;
  let demo = 0;
  for (const s of strips) {
    if (!s.original_key) {
      unreadable++;
      continue;
    }
    try {
      const bytes = await readImageBytes(path.join(dataDir, s.original_key));
      const img = await decodeImageBytes(bytes, { maxLongEdge: ANALYSIS_LONG_EDGE });
      const m = measurePhoto(img).strips[s.strip_index];
      if (!m) throw new Error("strip not found in its photo");
      checks.push(...checkJoins(m));
      read++;
      if (s.is_demo) demo++;
    } catch {
      unreadable++;
    }
  }
  const model = medianAndP95(checks.map((c) => c.deltaE));
  const straight = medianAndP95(checks.map((c) => c.straightLabDeltaE));
  const r = (n: number) => Math.round(n * 100) / 100;
  console.log(`${strips.length} published strips; ${read} photos read again (${unreadable} without a readable original).`);
  if (demo === read && read > 0) {
    console.log("NOTE: every strip read is a demo strip. The demo photos are synthetic, rendered with blends in log reflectance (the model's own family), so these figures check the measuring, not the model against real ink.");
  } else if (demo > 0) console.log(`NOTE: ${demo} of the ${read} strips are synthetic demo strips.`);
  console.log(`${checks.length} transitions compared (hard edges without a blend are skipped).`);
  console.log(`Blend model (straight in optical density): median ΔE2000 ${r(model.median)}, p95 ${r(model.p95)}`);
  console.log(`For comparison, straight in CIELAB:        median ΔE2000 ${r(straight.median)}, p95 ${r(straight.p95)}`);
  console.log(JSON.stringify({ medianDeltaE: r(model.median), p95DeltaE: r(model.p95), straightLabMedianDeltaE: r(straight.median), straightLabP95DeltaE: r(straight.p95), transitions: checks.length, strips: read, syntheticStrips: demo }));
} finally {
  await db.destroy();
}
