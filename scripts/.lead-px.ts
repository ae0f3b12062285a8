import { readFile } from "node:fs/promises";
import { decodeImageBytes } from "../server/images/index";
const img = await decodeImageBytes(await readFile(process.argv[2]), { maxLongEdge: 800 });
const { data, width: w, height: h } = img;
const y = Math.round(Number(process.argv[4]) * h);
const row: string[] = [];
for (let fx = Number(process.argv[3]) - 0.1; fx <= Number(process.argv[3]) + 0.1; fx += 0.01) {
  const x = Math.round(fx * w);
  const i = (y * w + x) * 3;
  row.push(`${data[i]},${data[i + 1]},${data[i + 2]}`);
}
console.log(w, h, row.join("  "));
