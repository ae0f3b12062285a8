// Identifies a file by its first bytes (never by its name or declared type).
import { open } from "node:fs/promises";
import { ACCEPTED_WORDS, ImageError } from "./image-error";

export type ImageType = "jpeg" | "png" | "webp" | "heif";

export type SniffResult = {
  type: ImageType;
  /** For HEIF files, the major brand of the ftyp box ("heic", "mif1", "avif", …). */
  brand?: string;
};

/** Bytes read from the start of a file for sniffing. */
export const SNIFF_BYTES = 64;

const HEIF_BRANDS = new Set(["heic", "heix", "heim", "heis", "hevc", "hevx", "mif1", "msf1", "avif", "avis"]);

function ascii(b: Uint8Array, from: number, to: number): string {
  let s = "";
  for (let i = from; i < Math.min(to, b.length); i++) s += String.fromCharCode(b[i]);
  return s;
}

/** A name for the kinds of file people send by mistake, to tell them what we saw. */
function describeOther(b: Uint8Array): string {
  const head = ascii(b, 0, SNIFF_BYTES);
  if (head.startsWith("%PDF")) return "PDF";
  if (head.startsWith("GIF87a") || head.startsWith("GIF89a")) return "GIF";
  if (head.startsWith("II*\0") || head.startsWith("MM\0*")) return "TIFF";
  if (head.startsWith("BM")) return "BMP";
  if (head.startsWith("PK\x03\x04")) return "ZIP archive";
  if (head.startsWith("8BPS")) return "layered image file";
  const text = head.replace(/^\uFEFF|^\xEF\xBB\xBF/, "").trimStart().toLowerCase();
  if (text.startsWith("<svg") || (text.startsWith("<?xml") && /<svg/i.test(head))) return "SVG";
  if (text.startsWith("<?xml") || text.startsWith("<!doctype") || text.startsWith("<html")) return "web page or XML";
  if (b.length > 0 && Array.from(b.subarray(0, Math.min(b.length, SNIFF_BYTES))).every((c) => c === 9 || c === 10 || c === 13 || (c >= 32 && c < 127) || c >= 128)) return "text";
  return "unknown format";
}

/** Sniffs bytes already in memory. Throws ImageError("empty" | "unsupported_type"). */
export function sniffImageBytes(b: Uint8Array): SniffResult {
  if (b.length === 0) throw new ImageError("empty", "This file is empty. Please choose the photo again.");
  if (b.length >= 3 && b[0] === 0xff && b[1] === 0xd8 && b[2] === 0xff) return { type: "jpeg" };
  if (b.length >= 8 && ascii(b, 0, 8) === "\x89PNG\r\n\x1a\n") return { type: "png" };
  if (b.length >= 12 && ascii(b, 0, 4) === "RIFF" && ascii(b, 8, 12) === "WEBP") return { type: "webp" };
  if (b.length >= 12 && ascii(b, 4, 8) === "ftyp") {
    const brand = ascii(b, 8, 12);
    if (HEIF_BRANDS.has(brand)) return { type: "heif", brand };
    // Some writers put a generic major brand first; look through the compatible brands.
    const boxSize = (b[0] << 24) | (b[1] << 16) | (b[2] << 8) | b[3];
    for (let o = 16; o + 4 <= Math.min(boxSize, b.length); o += 4) {
      const c = ascii(b, o, o + 4);
      if (HEIF_BRANDS.has(c)) return { type: "heif", brand: c };
    }
    throw new ImageError("unsupported_type", `This file is not a photo we can read (a video or other media file). Please upload ${ACCEPTED_WORDS}.`);
  }
  const what = describeOther(b);
  throw new ImageError("unsupported_type", `This file is not a photo we can read (${what}). Please upload ${ACCEPTED_WORDS}.`);
}

/** Sniffs a buffer, or a file by path (reading only its first bytes). */
export async function sniffImageType(input: Uint8Array | string): Promise<SniffResult> {
  if (typeof input !== "string") return sniffImageBytes(input);
  let fh;
  try {
    fh = await open(input, "r");
  } catch (cause) {
    throw new ImageError("unreadable", "We could not open this file. Please upload it again.", { cause });
  }
  try {
    const buf = new Uint8Array(SNIFF_BYTES);
    const { bytesRead } = await fh.read(buf, 0, SNIFF_BYTES, 0);
    return sniffImageBytes(buf.subarray(0, bytesRead));
  } finally {
    await fh.close();
  }
}
