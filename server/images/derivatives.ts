// Display and thumbnail WebP files (no metadata of any kind), a placeholder and a perceptual hash.
import { randomBytes } from "node:crypto";
import { rename, unlink, writeFile } from "node:fs/promises";
import phash from "sharp-phash";
import sharp from "sharp";
import { rgbaToThumbHash } from "thumbhash";
import type { DecodedImage } from "./read-image";
import { useSafeSharp } from "./safe-sharp";

export const DISPLAY_LONG_EDGE = 1600;
export const THUMB_LONG_EDGE = 480;
const WEBP_QUALITY = 82;
// libwebp effort 2 of 0–6: about a third of the time of the default (4) at a few % larger files.
const WEBP_EFFORT = 2;

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

function rawInput(img: { data: Buffer; width: number; height: number }) {
  return sharp(img.data, { raw: { width: img.width, height: img.height, channels: 3 } });
}

async function encodeWebp(img: DecodedImage, longEdge: number): Promise<EncodedImage> {
  // Input is raw pixels, so there is no metadata to carry; sharp's default output adds none.
  const { data, info } = await rawInput(img)
    .resize(longEdge, longEdge, { fit: "inside", withoutEnlargement: true })
    .webp({ quality: WEBP_QUALITY, effort: WEBP_EFFORT })
    .toBuffer({ resolveWithObject: true });
  return { data, width: info.width, height: info.height };
}

async function makePlaceholder(img: DecodedImage): Promise<string> {
  const { data, info } = await rawInput(img)
    .resize(100, 100, { fit: "inside" })
    .ensureAlpha()
    .raw()
    .toBuffer({ resolveWithObject: true });
  return Buffer.from(rgbaToThumbHash(info.width, info.height, data)).toString("base64");
}

async function makePhash(img: DecodedImage): Promise<string> {
  const small = await rawInput(img).resize(256, 256, { fit: "inside" }).raw().toBuffer({ resolveWithObject: true });
  const bits = await phash(small.data, { raw: { width: small.info.width, height: small.info.height, channels: 3 } });
  let hex = "";
  for (let i = 0; i < bits.length; i += 4) hex += parseInt(bits.slice(i, i + 4), 2).toString(16);
  return hex;
}

/** Encodes everything in memory (for object storage, or to write with writeDerivatives). */
export async function makeDerivatives(img: DecodedImage): Promise<Derivatives> {
  useSafeSharp();
  const [display, thumb, placeholder, hash] = await Promise.all([
    encodeWebp(img, DISPLAY_LONG_EDGE),
    encodeWebp(img, THUMB_LONG_EDGE),
    makePlaceholder(img),
    makePhash(img),
  ]);
  return { display, thumb, placeholder, phash: hash };
}

/**
 * Encodes and writes both files. Each is written to a temporary name and renamed into place;
 * if anything fails, every file this call created is removed again (no orphans, no half files).
 */
export async function writeDerivatives(img: DecodedImage, to: { displayPath: string; thumbPath: string }): Promise<DerivativeInfo> {
  const d = await makeDerivatives(img);
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
