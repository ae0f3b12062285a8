import sharp from "sharp";
const [src, dst, w] = process.argv.slice(2);
await sharp(src).resize({ width: Number(w || 600), height: Number(w || 600), fit: "inside" }).png().toFile(dst);
