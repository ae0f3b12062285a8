// Picking a colour from a strip photo: where a tap on the photo as drawn lands on the image's
// own pixels, which pixels to read around it, and their average colour.

export type Size = { width: number; height: number };
export type Point = { x: number; y: number };
export type PixelBox = { x: number; y: number; width: number; height: number };
export type ObjectFit = "fill" | "contain" | "cover" | "none" | "scale-down";

/** The side of the square read around a tapped point, in pixels of the image file. */
export const SAMPLE_SIZE = 7;

export type DrawnAs = {
  /** CSS object-fit of the <img> (an <img> without one is "fill"); object-position is centred. */
  fit?: ObjectFit;
  /**
   * Drawn as `.strip-fill-turned` draws a vertical strip: laid out in a box as tall as the frame
   * is wide (and as wide as it is tall), then turned a quarter counter-clockwise (CSS
   * rotate(-90deg)) about the frame's centre, so the photo's top lies at the frame's left.
   */
  turned?: boolean;
};

export function objectFitFrom(css: string | null | undefined): ObjectFit {
  return css === "contain" || css === "cover" || css === "none" || css === "scale-down" ? css : "fill";
}

/** How object-fit scales the image on each axis (CSS Images 3, "object-fit"). */
function fitScale(box: Size, natural: Size, fit: ObjectFit): { sx: number; sy: number } {
  const contain = Math.min(box.width / natural.width, box.height / natural.height);
  switch (fit) {
    case "fill":
      return { sx: box.width / natural.width, sy: box.height / natural.height };
    case "contain":
      return { sx: contain, sy: contain };
    case "cover": {
      const cover = Math.max(box.width / natural.width, box.height / natural.height);
      return { sx: cover, sy: cover };
    }
    case "none":
      return { sx: 1, sy: 1 };
    case "scale-down":
      return { sx: Math.min(1, contain), sy: Math.min(1, contain) };
  }
}

/**
 * A point on the photo as drawn (CSS pixels from the top left of the box you see: the <img>'s
 * box, or for a turned photo the frame it fills) → the same point in the image's own pixels, as
 * fractional coordinates from its top left. Null when the point is off the picture (outside the
 * box, or on the empty margin that "contain" leaves).
 */
export function naturalPointFromDrawn(point: Point, box: Size, natural: Size, drawn: DrawnAs = {}): Point | null {
  if (!(box.width > 0 && box.height > 0 && natural.width > 0 && natural.height > 0)) return null;
  if (!(point.x >= 0 && point.y >= 0 && point.x <= box.width && point.y <= box.height)) return null;
  let local = point;
  let layout = box;
  if (drawn.turned) {
    // rotate(-90deg) takes a vector (u, v) from the centre to (v, −u) on screen; undo that.
    const dx = point.x - box.width / 2;
    const dy = point.y - box.height / 2;
    layout = { width: box.height, height: box.width };
    local = { x: layout.width / 2 - dy, y: layout.height / 2 + dx };
  }
  const { sx, sy } = fitScale(layout, natural, drawn.fit ?? "fill");
  const x = (local.x - (layout.width - natural.width * sx) / 2) / sx;
  const y = (local.y - (layout.height - natural.height * sy) / 2) / sy;
  const eps = 1e-9;
  if (x < -eps || y < -eps || x > natural.width + eps || y > natural.height + eps) return null;
  return { x: Math.min(Math.max(x, 0), natural.width), y: Math.min(Math.max(y, 0), natural.height) };
}

/**
 * The square of pixels to read around a point of the image, `size` pixels a side and centred on
 * the pixel the point falls in, cut to the image's edges (a tap at the edge reads fewer pixels
 * rather than pixels that were not tapped).
 */
export function sampleBox(at: Point, natural: Size, size = SAMPLE_SIZE): PixelBox {
  const w = Math.max(1, Math.floor(natural.width));
  const h = Math.max(1, Math.floor(natural.height));
  const cx = Math.min(w - 1, Math.max(0, Math.floor(at.x)));
  const cy = Math.min(h - 1, Math.max(0, Math.floor(at.y)));
  const half = Math.floor(Math.max(1, Math.floor(size)) / 2);
  const x0 = Math.max(0, cx - half);
  const y0 = Math.max(0, cy - half);
  const x1 = Math.min(w, cx + half + 1);
  const y1 = Math.min(h, cy + half + 1);
  return { x: x0, y: y0, width: x1 - x0, height: y1 - y0 };
}

// IEC 61966-2-1 (sRGB) transfer function, both ways.
function toLinear(v8: number): number {
  const v = v8 / 255;
  return v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4;
}
function fromLinear(l: number): number {
  const v = l <= 0.0031308 ? 12.92 * l : 1.055 * l ** (1 / 2.4) - 0.055;
  return Math.min(255, Math.max(0, Math.round(v * 255)));
}
const LINEAR = Array.from({ length: 256 }, (_, i) => toLinear(i));

export type Rgb8 = { r: number; g: number; b: number };

/**
 * The mean colour of RGBA pixels (as canvas getImageData gives them), averaged in linear light
 * as the camera sensor mixes it, each pixel weighted by its alpha. Null when no pixel is opaque
 * at all.
 */
export function averageRgba(rgba: ArrayLike<number>): Rgb8 | null {
  let r = 0;
  let g = 0;
  let b = 0;
  let weight = 0;
  for (let i = 0; i + 3 < rgba.length; i += 4) {
    const a = rgba[i + 3]! / 255;
    if (a <= 0) continue;
    r += LINEAR[rgba[i]! & 255]! * a;
    g += LINEAR[rgba[i + 1]! & 255]! * a;
    b += LINEAR[rgba[i + 2]! & 255]! * a;
    weight += a;
  }
  if (weight === 0) return null;
  return { r: fromLinear(r / weight), g: fromLinear(g / weight), b: fromLinear(b / weight) };
}

/** { r: 58, g: 111, b: 140 } → "#3a6f8c" */
export function rgbToHex({ r, g, b }: Rgb8): string {
  return "#" + [r, g, b].map((v) => Math.min(255, Math.max(0, Math.round(v))).toString(16).padStart(2, "0")).join("");
}

/** The search page asked for strips with a band near this colour ("#3a6f8c" → /search?color=%233a6f8c). */
export function colourSearchHref(hex: string): string {
  return `/search?color=${encodeURIComponent(hex.toLowerCase())}`;
}
