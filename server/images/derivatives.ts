// Display and thumbnail WebP files (no metadata of any kind), a placeholder and a perceptual hash.
import { randomBytes } from "node:crypto";
import { rename, unlink, writeFile } from "node:fs/promises";
import sharp from "sharp";
import phash from "sharp-phash";
import { rgbaToThumbHash } from "thumbhash";
import { useSafeSharp } from "./safe-sharp";

export const DISPLAY_LONG_EDGE = 1600;
export const THUMB_LONG_EDGE = 480;
/** Long edge of the one small copy the placeholder and the perceptual hash are both made from. */
const SMALL_LONG_EDGE = 100;
const WEBP_QUALITY = 82;
// libwebp effort 1 of 0–6, as measured by scripts/bench-analyze.ts (time and bytes per effort):
// about 20–25 % faster than effort 2 for files about 12 % larger; effort 0 saves about as much
// again but its files are about 25 % larger than effort 1's.
const WEBP_EFFORT = 1;

export type EncodedImage = { data: Buffer; width: number; height: number };

export type Derivatives = {
  display: EncodedImage;
  thumb: EncodedImage;
  /** ThumbHash of the image, base64 (decode with thumbhash's thumbHashToDataURL on the client). */
  placeholder: string;
  /** 64-bit DCT perceptual hash as 16 hex digits (compare with Hamming distance). */
  phash: string;
};

export type DerivativeInfo = Omit<Derivatives, "display" | "thumb"> & {
  display: { path: string; width: number; height: number; bytes: number };
  thumb: { path: string; width: number; height: number; bytes: number };
};

type RawRgb = { data: Buffer; width: number; height: number };

function rawInput(img: RawRgb) {
  return sharp(img.data, { raw: { width: img.width, height: img.height, channels: 3 } });
}

/** One WebP derivative; input is raw pixels, so there is no metadata to carry and sharp adds none. */
export async function encodeWebp(img: RawRgb, longEdge: number, effort = WEBP_EFFORT): Promise<EncodedImage> {
  useSafeSharp();
  const { data, info } = await rawInput(img)
    .resize(longEdge, longEdge, { fit: "inside", withoutEnlargement: true })
    .webp({ quality: WEBP_QUALITY, effort })
    .toBuffer({ resolveWithObject: true });
  return { data, width: info.width, height: info.height };
}

/** The small copy (long edge ≤ 100 px) that both the placeholder and the perceptual hash read. */
export async function smallCopy(img: RawRgb): Promise<RawRgb> {
  useSafeSharp();
  const { data, info } = await rawInput(img)
    .resize(SMALL_LONG_EDGE, SMALL_LONG_EDGE, { fit: "inside", withoutEnlargement: true })
    .raw()
    .toBuffer({ resolveWithObject: true });
  return { data, width: info.width, height: info.height };
}

export function makePlaceholder(small: RawRgb): string {
  const rgba = new Uint8Array(small.width * small.height * 4);
  for (let p = 0, q = 0; p < small.data.length; p += 3, q += 4) {
    rgba[q] = small.data[p]!;
    rgba[q + 1] = small.data[p + 1]!;
    rgba[q + 2] = small.data[p + 2]!;
    rgba[q + 3] = 255;
  }
  return Buffer.from(rgbaToThumbHash(small.width, small.height, rgba)).toString("base64");
}

/** The 64-bit DCT perceptual hash (sharp-phash) of the small copy, as 16 hex digits. */
export async function makePhash(small: RawRgb): Promise<string> {
  const bits = await phash(small.data, { raw: { width: small.width, height: small.height, channels: 3 } });
  let hex = "";
  for (let i = 0; i < bits.length; i += 4) hex += parseInt(bits.slice(i, i + 4), 2).toString(16);
  return hex;
}

/**
 * Encodes everything in memory (for object storage, or to write with saveDerivatives). All the
 * libvips work is queued at once, so it runs on libvips' threads while the caller's thread goes on.
 */
export async function makeDerivatives(img: RawRgb): Promise<Derivatives> {
  useSafeSharp();
  const small = smallCopy(img);
  const [display, thumb, placeholder, hash] = await Promise.all([
    encodeWebp(img, DISPLAY_LONG_EDGE),
    encodeWebp(img, THUMB_LONG_EDGE),
    small.then(makePlaceholder),
    small.then(makePhash),
  ]);
  return { display, thumb, placeholder, phash: hash };
}

/**
 * Writes both files. Each is written to a temporary name and renamed into place; if anything
 * fails, every file this call created is removed again (no orphans, no half files).
 */
export async function saveDerivatives(d: Derivatives, to: { displayPath: string; thumbPath: string }): Promise<DerivativeInfo> {
  const suffix = `.tmp-${randomBytes(6).toString("hex")}`;
  const plan = [
    { data: d.display.data, final: to.displayPath, temp: to.displayPath + suffix },
    { data: d.thumb.data, final: to.thumbPath, temp: to.thumbPath + suffix },
  ];
  const created: string[] = [];
  try {
    for (const f of plan) {
      created.push(f.temp);
      await writeFile(f.temp, f.data, { flag: "wx" });
    }
    for (const f of plan) {
      await rename(f.temp, f.final);
      created.push(f.final);
    }
  } catch (err) {
    await Promise.all(created.map((p) => unlink(p).catch(() => undefined)));
    throw err;
  }
  return {
    display: { path: to.displayPath, width: d.display.width, height: d.display.height, bytes: d.display.data.length },
    thumb: { path: to.thumbPath, width: d.thumb.width, height: d.thumb.height, bytes: d.thumb.data.length },
    placeholder: d.placeholder,
    phash: d.phash,
  };
}

/** Encodes and writes both files (see makeDerivatives and saveDerivatives). */
export async function writeDerivatives(img: RawRgb, to: { displayPath: string; thumbPath: string }): Promise<DerivativeInfo> {
  return saveDerivatives(await makeDerivatives(img), to);
}

/** Hamming distance between two hex perceptual hashes (0 = same picture). */
export function phashDistance(a: string, b: string): number {
  if (a.length !== b.length) throw new RangeError("Perceptual hashes differ in length");
  let d = 0;
  for (let i = 0; i < a.length; i++) {
    let x = parseInt(a[i], 16) ^ parseInt(b[i], 16);
    while (x) {
      d += x & 1;
      x >>= 1;
    }
  }
  return d;
}
