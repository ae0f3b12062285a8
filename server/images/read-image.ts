// Reads an uploaded photo into upright 8-bit sRGB pixels, refusing anything unsafe before decoding.
import { readFile, stat } from "node:fs/promises";
import { createRequire } from "node:module";
import sharp, { type Metadata, type OutputInfo, type Sharp, type SharpOptions } from "sharp";
import { isAnimatedGif, readHeaderInfo } from "./header-info";
import { ACCEPTED_WORDS, ImageError } from "./image-error";
import { useSafeSharp } from "./safe-sharp";
import { sniffImageBytes, type ImageType } from "./sniff-image-type";

export type ReadImageOptions = {
  /** Largest file accepted, bytes. Default 20 MB. */
  maxBytes?: number;
  /** Largest pixel count accepted (width × height of the stored image). Default 50 million. */
  maxPixels?: number;
  /** If set, the image is scaled down (never up) so its long edge is at most this. */
  maxLongEdge?: number;
};

/** Upright 8-bit sRGB pixels (3 channels, row-major), ready for analysis and derivatives. */
export type DecodedImage = {
  width: number;
  height: number;
  channels: 3;
  data: Buffer;
  /** What the file was. */
  type: ImageType;
  /** Upright size of the original before any scaling. */
  originalWidth: number;
  originalHeight: number;
};

export const DEFAULT_MAX_BYTES = 20 * 1024 * 1024;
export const DEFAULT_MAX_PIXELS = 50_000_000;

type HeicDecode = (opts: { buffer: Uint8Array }) => Promise<{ width: number; height: number; data: Uint8ClampedArray }>;
const require = createRequire(import.meta.url);
let heicDecode: HeicDecode | null = null;
function loadHeicDecode(): HeicDecode {
  heicDecode ??= require("heic-decode") as HeicDecode;
  return heicDecode;
}

const mb = (n: number) => `${Math.round(n / (1024 * 1024))} MB`;

function tooManyPixels(width: number, height: number, maxPixels: number): ImageError {
  return new ImageError(
    "too_many_pixels",
    `This photo is too large (${width} × ${height} pixels). Please upload a photo of at most ${Math.round(maxPixels / 1e6)} megapixels.`,
  );
}

const corrupt = (cause?: unknown) =>
  new ImageError("corrupt", "This photo seems to be damaged or incomplete, so we cannot read it. Please export or copy it again and retry.", { cause });

const animated = () => new ImageError("animated", "This is an animated image. Please upload a single still photo of your strip.");

/** Maps a libvips failure on a file we already sniffed to a member-facing error. */
function decodeFailure(err: unknown, maxPixels: number): ImageError {
  const msg = err instanceof Error ? err.message : String(err);
  if (/pixel limit/i.test(msg)) return new ImageError("too_many_pixels", `This photo has more than ${Math.round(maxPixels / 1e6)} megapixels. Please upload a smaller photo.`, { cause: err });
  if (/unsupported image format|not a known file format|blocked/i.test(msg))
    return new ImageError("unsupported_type", `This file is not a photo we can read. Please upload ${ACCEPTED_WORDS}.`, { cause: err });
  return corrupt(err);
}

async function toUprightRgb(pipeline: Sharp, maxLongEdge: number | undefined): Promise<{ data: Buffer; info: OutputInfo }> {
  let p = pipeline.autoOrient();
  if (maxLongEdge) p = p.resize(maxLongEdge, maxLongEdge, { fit: "inside", withoutEnlargement: true });
  // flatten: transparent areas become white paper; toColourspace: CMYK, grey and 16-bit → 8-bit sRGB.
  return p.flatten({ background: "#ffffff" }).toColourspace("srgb").removeAlpha().raw({ depth: "uchar" }).toBuffer({ resolveWithObject: true });
}

/**
 * Reads a photo from disk. Order of checks: file size → magic bytes → header dimensions and
 * animation → decode (HEVC HEIF via heic-decode, everything else via sharp with only our loaders
 * allowed) → EXIF orientation → 8-bit sRGB. Throws ImageError for anything a member can fix.
 */
export async function readImage(path: string, opts: ReadImageOptions = {}): Promise<DecodedImage> {
  return decodeImageBytes(await readImageBytes(path, opts), opts);
}

/** The file's bytes, after checking it is there, not empty and not over the size limit (ImageError otherwise). */
export async function readImageBytes(path: string, opts: Pick<ReadImageOptions, "maxBytes"> = {}): Promise<Buffer> {
  const maxBytes = opts.maxBytes ?? DEFAULT_MAX_BYTES;
  let size: number;
  try {
    size = (await stat(path)).size;
  } catch (cause) {
    throw new ImageError("unreadable", "We could not open this file. Please upload it again.", { cause });
  }
  if (size === 0) throw new ImageError("empty", "This file is empty. Please choose the photo again.");
  if (size > maxBytes) throw new ImageError("too_large", `This photo is larger than ${mb(maxBytes)}. Please upload a smaller file (most phones can share a smaller size).`);
  try {
    return await readFile(path);
  } catch (cause) {
    throw new ImageError("unreadable", "We could not open this file. Please upload it again.", { cause });
  }
}

/** As readImage, for bytes already in memory. */
export async function decodeImageBytes(bytes: Buffer, opts: ReadImageOptions = {}): Promise<DecodedImage> {
  const maxBytes = opts.maxBytes ?? DEFAULT_MAX_BYTES;
  const maxPixels = opts.maxPixels ?? DEFAULT_MAX_PIXELS;
  if (bytes.length === 0) throw new ImageError("empty", "This file is empty. Please choose the photo again.");
  if (bytes.length > maxBytes) throw new ImageError("too_large", `This photo is larger than ${mb(maxBytes)}. Please upload a smaller file.`);
  if (isAnimatedGif(bytes)) throw animated();
  const { type, brand } = sniffImageBytes(bytes);
  useSafeSharp();

  if (type !== "heif") {
    const header = readHeaderInfo(bytes, type);
    if (!header || header.width <= 0 || header.height <= 0) throw corrupt();
    if (header.width * header.height > maxPixels) throw tooManyPixels(header.width, header.height, maxPixels);
    if (header.animated) throw animated();
  }
  if (brand === "msf1" || brand === "avis" || brand === "hevc" || brand === "hevx") throw animated();

  const sharpOpts: SharpOptions = { limitInputPixels: maxPixels, sequentialRead: true, failOn: "warning" };
  let meta: Metadata;
  try {
    meta = await sharp(bytes, sharpOpts).metadata();
  } catch (err) {
    throw decodeFailure(err, maxPixels);
  }
  const w = meta.width ?? 0;
  const h = meta.height ?? 0;
  if (w <= 0 || h <= 0) throw corrupt();
  if (w * h > maxPixels) throw tooManyPixels(w, h, maxPixels);
  if (type !== "heif" && (meta.pages ?? 1) > 1) throw animated();
  const upright = meta.autoOrient ?? { width: w, height: h };

  try {
    if (type === "heif" && meta.compression === "hevc") {
      // sharp's bundled libvips cannot decode HEVC; libheif (WebAssembly) applies the HEIF
      // rotation/mirror boxes itself, so the pixels come out upright.
      const decoded = await loadHeicDecode()({ buffer: bytes });
      const raw = Buffer.from(decoded.data.buffer, decoded.data.byteOffset, decoded.data.byteLength);
      const pipeline = sharp(raw, { raw: { width: decoded.width, height: decoded.height, channels: 4 }, limitInputPixels: maxPixels });
      const { data, info } = await toUprightRgb(pipeline, opts.maxLongEdge);
      return { width: info.width, height: info.height, channels: 3, data, type, originalWidth: decoded.width, originalHeight: decoded.height };
    }
    const { data, info } = await toUprightRgb(sharp(bytes, sharpOpts), opts.maxLongEdge);
    return { width: info.width, height: info.height, channels: 3, data, type, originalWidth: upright.width, originalHeight: upright.height };
  } catch (err) {
    if (err instanceof ImageError) throw err;
    throw decodeFailure(err, maxPixels);
  }
}

/** Scales upright pixels down so the long edge is at most `maxLongEdge` (never up). */
export async function downscaleImage(img: DecodedImage, maxLongEdge: number): Promise<DecodedImage> {
  if (Math.max(img.width, img.height) <= maxLongEdge) return img;
  const { data, info } = await sharp(img.data, { raw: { width: img.width, height: img.height, channels: 3 } })
    .resize(maxLongEdge, maxLongEdge, { fit: "inside" })
    .raw()
    .toBuffer({ resolveWithObject: true });
  return { ...img, width: info.width, height: info.height, data };
}
