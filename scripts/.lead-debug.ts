import { readFile } from "node:fs/promises";
import { decodeImageBytes } from "../server/images/index";
import { loadVision } from "../server/analysis/vision";
import { detectScene } from "../server/analysis/find-strips";
import * as fs from "../server/analysis/find-strips";
import sharp from "sharp";
await loadVision();
const file = process.argv[2];
const img = await decodeImageBytes(await readFile(file), { maxLongEdge: 800 });
const scene = detectScene(img);
const { width: w, height: h } = scene.maps;
console.log("paperChroma", scene.maps.paperChroma, "card", scene.card ? scene.card.reduce((a, b) => a + b, 0) / (w * h) : null);
// write masks: paper (white), card (grey)
const out = Buffer.alloc(w * h * 3);
for (let p = 0; p < w * h; p++) {
  const v = scene.card?.[p] ? 200 : scene.maps.paper[p] ? 120 : 0;
  out[p * 3] = v; out[p * 3 + 1] = v; out[p * 3 + 2] = v;
}
try { const s = fs.findStrips(scene); console.log(s.map((x) => [x.surface, x.corners.map((c) => c.map(Math.round)), Math.round(x.length), Math.round(x.thickness)])); } catch (e) { console.log(String(e)); }
await sharp(out, { raw: { width: w, height: h, channels: 3 } }).resize({ width: 500 }).png().toFile("/tmp/mask.png");
// texture of the card region vs everything else
{
  const { raw, rgb } = scene.maps;
  const tex = (sel: (p: number) => boolean) => {
    const v: number[] = [];
    for (let p = 0; p < w * h; p += 7) if (sel(p)) {
      const yr = 0.2126 * raw[p * 3] + 0.7152 * raw[p * 3 + 1] + 0.0722 * raw[p * 3 + 2];
      const ys = 0.2126 * rgb[p * 3] + 0.7152 * rgb[p * 3 + 1] + 0.0722 * rgb[p * 3 + 2];
      v.push(Math.abs(yr - ys) / Math.max(1e-4, ys));
    }
    v.sort((a, b) => a - b);
    return [v.length, v[v.length >> 1]?.toFixed(4), v[Math.floor(0.9 * v.length)]?.toFixed(4)];
  };
  console.log("texture card", tex((p) => !!scene.card?.[p]), "not card", tex((p) => !scene.card?.[p]));
}
