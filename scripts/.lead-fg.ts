import { readFile } from "node:fs/promises";
import sharp from "sharp";
import { decodeImageBytes } from "../server/images/index";
import { loadVision } from "../server/analysis/vision";
import { detectScene, findStrips } from "../server/analysis/find-strips";
await loadVision();
const img = await decodeImageBytes(await readFile(process.argv[2]), { maxLongEdge: Number(process.env.EDGE ?? 800) });
const scene = detectScene(img);
(globalThis as any).__fg = true;
try { console.log(findStrips(scene).length); } catch (e) { console.log(String(e)); }
const fg = (globalThis as any).__fgMask as Uint8Array;
const { width: w, height: h } = scene.maps;
const out = Buffer.alloc(w * h);
for (let p = 0; p < w * h; p++) out[p] = fg?.[p] ? 255 : scene.card?.[p] ? 100 : 0;
await sharp(out, { raw: { width: w, height: h, channels: 1 } }).png().toFile("/tmp/fg.png");
