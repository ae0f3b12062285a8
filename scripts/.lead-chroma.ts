import { readFile } from "node:fs/promises";
import { decodeImageBytes } from "../server/images/index";
const img = await decodeImageBytes(await readFile(process.argv[2]), { maxLongEdge: 800 });
const { data, width: w } = img;
for (const [x, y] of [[50, 50], [300, 100], [700, 500]]) {
  const i = (y * w + x) * 3;
  const lin = [data[i], data[i + 1], data[i + 2]].map((v) => ((v / 255 + 0.055) / 1.055) ** 2.4);
  const s = lin[0] + lin[1] + lin[2];
  console.log([data[i], data[i + 1], data[i + 2]], lin.map((v) => (v / s).toFixed(3)));
}
