// One strip's own images, cut from the display photo of a several-strip upload.
import { mkdir } from "node:fs/promises";
import { dirname } from "node:path";
import sharp from "sharp";
import { DISPLAY_LONG_EDGE, makeDerivatives, saveDerivatives, type DerivativeInfo } from "./derivatives";
import { useSafeSharp } from "./safe-sharp";

/** A rectangle of whole pixels inside an image. */
export type PixelBox = { left: number; top: number; width: number; height: number };

/**
 * Cuts `box` out of one of our own display photos (a WebP we wrote, already colour-corrected and
 * free of metadata) and writes its display and thumbnail WebP files, with its own placeholder and
 * perceptual hash. The folders are created; if writing fails, nothing is left behind
 * (saveDerivatives removes what it wrote).
 */
export async function cropDerivatives(sourcePath: string, box: PixelBox, to: { displayPath: string; thumbPath: string }): Promise<DerivativeInfo> {
  useSafeSharp();
  const { data, info } = await sharp(sourcePath, { limitInputPixels: DISPLAY_LONG_EDGE * DISPLAY_LONG_EDGE })
    .extract(box)
    .removeAlpha()
    .toColourspace("srgb")
    .raw()
    .toBuffer({ resolveWithObject: true });
  const encoded = await makeDerivatives({ data, width: info.width, height: info.height });
  await Promise.all([mkdir(dirname(to.displayPath), { recursive: true }), mkdir(dirname(to.thumbPath), { recursive: true })]);
  return saveDerivatives(encoded, to);
}
