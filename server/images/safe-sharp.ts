// Process-wide sharp settings for untrusted uploads, applied once on first use.
import sharp from "sharp";

/** The only libvips loaders uploads may reach (raw pixel input needs no loader). */
export const ALLOWED_LOADERS = [
  "VipsForeignLoadJpegFile",
  "VipsForeignLoadJpegBuffer",
  "VipsForeignLoadPngFile",
  "VipsForeignLoadPngBuffer",
  "VipsForeignLoadWebpFile",
  "VipsForeignLoadWebpBuffer",
  "VipsForeignLoadHeifFile",
  "VipsForeignLoadHeifBuffer",
] as const;

let applied = false;

/**
 * Blocks every libvips loader except JPEG, PNG, WebP and HEIF, so SVG, PDF, GIF, TIFF and exotic
 * formats never reach libvips even if sniffing were bypassed, and turns off sharp's operation
 * cache (each upload is seen once). Affects the whole process, including other sharp users.
 */
export function useSafeSharp(): void {
  if (applied) return;
  sharp.block({ operation: ["VipsForeignLoad"] });
  sharp.unblock({ operation: [...ALLOWED_LOADERS] });
  sharp.cache(false);
  applied = true;
}
