// Reads dimensions and animation flags straight from file headers, before any decoder runs,
// so an oversized or animated file is refused without spending memory on it.
import type { ImageType } from "./sniff-image-type";

export type HeaderInfo = { width: number; height: number; animated: boolean };

const u16be = (b: Uint8Array, o: number) => (b[o] << 8) | b[o + 1];
const u32be = (b: Uint8Array, o: number) => ((b[o] << 24) >>> 0) + (b[o + 1] << 16) + (b[o + 2] << 8) + b[o + 3];
const u16le = (b: Uint8Array, o: number) => b[o] | (b[o + 1] << 8);
const u24le = (b: Uint8Array, o: number) => b[o] | (b[o + 1] << 8) | (b[o + 2] << 16);
const u32le = (b: Uint8Array, o: number) => (b[o] | (b[o + 1] << 8) | (b[o + 2] << 16)) + b[o + 3] * 0x1000000;
const tag = (b: Uint8Array, o: number) => String.fromCharCode(b[o], b[o + 1], b[o + 2], b[o + 3]);

/** JPEG: walk the marker segments to the first SOFn frame header (ITU-T T.81, B.2.2). */
function jpegInfo(b: Uint8Array): HeaderInfo | null {
  let o = 2;
  while (o + 4 <= b.length) {
    if (b[o] !== 0xff) return null;
    let marker = b[o + 1];
    while (marker === 0xff && o + 2 < b.length) marker = b[++o + 1];
    if (marker === 0xd8 || marker === 0x01 || (marker >= 0xd0 && marker <= 0xd7)) {
      o += 2;
      continue;
    }
    if (marker === 0xd9 || marker === 0xda) return null; // end of image / start of scan before any frame
    const len = u16be(b, o + 2);
    const isSof = marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc;
    if (isSof) {
      if (o + 9 > b.length) return null;
      return { height: u16be(b, o + 5), width: u16be(b, o + 7), animated: false };
    }
    if (len < 2) return null;
    o += 2 + len;
  }
  return null;
}

/** PNG: IHDR is the first chunk; an acTL chunk before IDAT marks an animated PNG. */
function pngInfo(b: Uint8Array): HeaderInfo | null {
  if (b.length < 24 || tag(b, 12) !== "IHDR") return null;
  const width = u32be(b, 16);
  const height = u32be(b, 20);
  let animated = false;
  let o = 8;
  while (o + 8 <= b.length) {
    const len = u32be(b, o);
    const t = tag(b, o + 4);
    if (t === "acTL") animated = true;
    if (t === "IDAT" || t === "IEND") break;
    o += 12 + len;
  }
  return { width, height, animated };
}

/** WebP: VP8 (lossy), VP8L (lossless) or VP8X (extended, with the animation flag). */
function webpInfo(b: Uint8Array): HeaderInfo | null {
  if (b.length < 30) return null;
  const chunk = tag(b, 12);
  if (chunk === "VP8X") {
    const flags = b[20];
    return { width: u24le(b, 24) + 1, height: u24le(b, 27) + 1, animated: (flags & 0x02) !== 0 };
  }
  if (chunk === "VP8 ") {
    if (b[23] !== 0x9d || b[24] !== 0x01 || b[25] !== 0x2a) return null;
    return { width: u16le(b, 26) & 0x3fff, height: u16le(b, 28) & 0x3fff, animated: false };
  }
  if (chunk === "VP8L") {
    if (b[20] !== 0x2f) return null;
    const bits = u32le(b, 21);
    return { width: (bits & 0x3fff) + 1, height: ((bits >>> 14) & 0x3fff) + 1, animated: false };
  }
  return null;
}

/**
 * Dimensions from the header for JPEG, PNG and WebP; null when the header is unreadable.
 * HEIF keeps its sizes in nested boxes, which sharp's metadata() reads (bounded by its pixel limit).
 */
export function readHeaderInfo(b: Uint8Array, type: ImageType): HeaderInfo | null {
  if (type === "jpeg") return jpegInfo(b);
  if (type === "png") return pngInfo(b);
  if (type === "webp") return webpInfo(b);
  return null;
}

/** GIF animation marker (the looping application extension). */
export function isAnimatedGif(b: Uint8Array): boolean {
  if (b.length < 6 || tag(b, 0) !== "GIF8") return false;
  const s = Buffer.from(b.buffer, b.byteOffset, b.byteLength);
  return s.includes("NETSCAPE2.0") || s.includes("ANIMEXTS1.0");
}
