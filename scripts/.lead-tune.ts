// Lead's tuning loop over saved scenes (not committed).
import { readdir, readFile } from "node:fs/promises";
import { join } from "node:path";
import { syntheticCatalogue } from "../server/demo/synthetic-photo";
import { analyzeStripImage, NoStripError } from "../server/analysis/index";
import { aggregate, scoreFailure, scoreScene, type SceneScore } from "../tests/analysis/scenes/score";
const dir = process.argv[2];
const only = process.argv[3];
const catalogue = syntheticCatalogue();
const files = (await readdir(dir)).filter((f) => f.endsWith(".json") && (!only || f.startsWith(only))).sort();
const by = new Map<string, SceneScore[]>();
for (const f of files) {
  const { truth } = JSON.parse(await readFile(join(dir, f), "utf8"));
  const path = join(dir, f.replace(".json", ".jpg"));
  let score: SceneScore;
  let note = "";
  try {
    const r = await analyzeStripImage(path, { catalogue });
    score = scoreScene(truth, { strips: r.strips });
    note = r.strips.map((s) => s.bands.length).join(",") + " vs " + truth.strips.map((s: { inks: unknown[] }) => s.inks.length).join(",");
  } catch (e) {
    if (e instanceof NoStripError) score = scoreFailure(truth, e.code, null);
    else score = scoreFailure(truth, null, String(e));
    note = String(e).slice(0, 80);
  }
  const cls = f.split("-")[0];
  if (!by.has(cls)) by.set(cls, []);
  by.get(cls)!.push(score);
  const a = aggregate([score]);
  const bad = a.rightCountPct < 100 || a.missed || a.invented || a.merged || a.deskBands || (a.deltaEP95 ?? 0) > 2.5;
  if (bad || process.env.ALL) console.log(f.padEnd(14), `cnt ${a.rightCountPct.toFixed(0)}% f/m/i/g ${a.found}/${a.missed}/${a.invented}/${a.merged} dE ${a.deltaEMedian?.toFixed(2)}/${a.deltaEP95?.toFixed(2)} desk ${a.deskBands} ${a.refused ? "REFUSED" : ""}`, note);
}
for (const [c, s] of by) {
  const a = aggregate(s);
  console.log(c, `n ${s.length} cnt ${a.rightCountPct.toFixed(1)}% f/m/i/g ${a.found}/${a.missed}/${a.invented}/${a.merged} dE ${a.deltaEMedian?.toFixed(2)}/${a.deltaEP95?.toFixed(2)} join ${a.joinErrorMedianPct?.toFixed(2)} desk ${a.deskBands} refused ${a.refused}`);
}
const t = aggregate([...by.values()].flat());
console.log("ALL", `cnt ${t.rightCountPct.toFixed(1)}% f/m/i/g ${t.found}/${t.missed}/${t.invented}/${t.merged} dE ${t.deltaEMedian?.toFixed(2)}/${t.deltaEP95?.toFixed(2)} join ${t.joinErrorMedianPct?.toFixed(2)} desk ${t.deskBands} refused ${t.refused}`);
