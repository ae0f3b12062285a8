import { readFile } from "node:fs/promises";
import { syntheticCatalogue } from "../server/demo/synthetic-photo";
import { analyzeStripImage } from "../server/analysis/index";
const f = process.argv[2];
const { truth } = JSON.parse(await readFile(f.replace(".jpg", ".json"), "utf8"));
const r = await analyzeStripImage(f, { catalogue: syntheticCatalogue() });
console.log("paper", r.paper, r.notices);
for (const s of r.strips) console.log(s.index, s.outline.map((p) => p.map((v) => v.toFixed(3)).join(",")).join(" "), "\n   ", s.bands.map((b) => `${b.start.toFixed(2)}-${b.end.toFixed(2)} L${b.lab.l.toFixed(0)} a${b.lab.a.toFixed(0)} b${b.lab.b.toFixed(0)}`).join(" | "));
for (const s of truth.strips) console.log("T", s.corners.map((p: number[]) => p.map((v) => v.toFixed(3)).join(",")).join(" "), "\n   ", s.inks.map((b: any) => `${b.start.toFixed(2)}-${b.end.toFixed(2)} L${b.lab.l.toFixed(0)} a${b.lab.a.toFixed(0)} b${b.lab.b.toFixed(0)}`).join(" | "));
