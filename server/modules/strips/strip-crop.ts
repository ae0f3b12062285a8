// Where a strip of a several-strip photo is cut out for its own images.
//
// Why an upright box with a margin, not a rectified (perspective-warped) crop: the strip's own
// image then looks like every one-strip post (the strip on its paper, as photographed), its
// pixels are the display photo's own — no resampling — so a colour tapped on the strip page is
// the colour the analysis read, and it needs nothing beyond sharp's extract(). Bands stay
// fractions along the strip, so they mean the same in the crop; the outline is re-expressed in
// the crop's own fractions so it still lands on the strip.
import type { Outline } from "../../../shared/schemas/uploads";
import type { PixelBox } from "../../images";

/** Paper kept around the strip, as a share of its thickness (ours: enough to see the card, little of a neighbour). */
export const CROP_MARGIN = 0.3;
const MIN_MARGIN_PX = 6;

const round4 = (v: number) => Math.min(1, Math.max(0, Math.round(v * 10_000) / 10_000));

/** The pixel box to cut from a width × height display photo, and the outline as fractions of that box. */
export function cropFor(outline: Outline, width: number, height: number): { box: PixelBox; outline: Outline } {
  const px = outline.map(([x, y]) => [x * width, y * height] as const);
  const side = (a: number, b: number) => Math.hypot(px[a]![0] - px[b]![0], px[a]![1] - px[b]![1]);
  const thickness = (side(0, 3) + side(1, 2)) / 2;
  const margin = Math.max(MIN_MARGIN_PX, CROP_MARGIN * thickness);
  const xs = px.map((p) => p[0]);
  const ys = px.map((p) => p[1]);
  const left = Math.max(0, Math.floor(Math.min(...xs) - margin));
  const top = Math.max(0, Math.floor(Math.min(...ys) - margin));
  const right = Math.min(width, Math.ceil(Math.max(...xs) + margin));
  const bottom = Math.min(height, Math.ceil(Math.max(...ys) + margin));
  const box = { left, top, width: Math.max(1, right - left), height: Math.max(1, bottom - top) };
  const inBox = px.map(([x, y]) => [round4((x - left) / box.width), round4((y - top) / box.height)]) as Outline;
  return { box, outline: inBox };
}
