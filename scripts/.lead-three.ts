import { writeFile } from "node:fs/promises";
import { hexToLab } from "../shared/colour/index";
import { analyzeStripImage } from "../server/analysis/index";
import { renderScene, sceneToJpeg } from "../server/demo/synthetic-photo";
const lab = (h: string) => hexToLab(h);
const spec = { width: 1000, height: 750, orientation: "horizontal" as const, tiltDeg: 3, lengthShare: 0.75, thicknessShare: 0.16,
  bands: [{ start: 0, end: 0.3, lab: lab("#2f5d8a") }, { start: 0.36, end: 0.62, lab: lab("#d8b43a") }, { start: 0.68, end: 1, lab: lab("#a33a52") }],
  blend: "soft" as const, illuminant: process.env.ILL ?? "F2", exposure: 0.9, vignette: 0.15, noise: 1.5, seed: 42 };
await writeFile("/tmp/three.jpg", await sceneToJpeg(renderScene(spec), 90));
const r = await analyzeStripImage("/tmp/three.jpg", { catalogue: [], white: process.env.TAP ? { x: 0.04, y: 0.05 } : undefined });
console.log(r.paper.found, r.strips[0].outline, r.bands.map((b) => [b.start, b.end, b.lab.l, b.lab.a, b.lab.b]));
