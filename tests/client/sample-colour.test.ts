import { converter } from "culori";
import { describe, expect, it } from "vitest";
import {
  averageRgba,
  colourSearchHref,
  naturalPointFromDrawn,
  objectFitFrom,
  rgbToHex,
  sampleBox,
} from "../../src/features/strips/sample-colour";

const pixels = (list: [number, number, number, number][]) => Uint8ClampedArray.from(list.flat());
const repeat = <T>(item: T, n: number) => Array.from({ length: n }, () => item);

describe("averaging the pixels under a tap", () => {
  it("gives back the very colour of a patch that is all one colour, at every 8-bit level", () => {
    // IEC 61966-2-1's decode and encode are inverses, so a uniform 7×7 patch keeps its code values.
    for (let v = 0; v < 256; v++) {
      expect(averageRgba(pixels(repeat([v, 255 - v, (v * 7) % 256, 255], 49)))).toEqual({ r: v, g: 255 - v, b: (v * 7) % 256 });
    }
  });

  it("mixes in linear light: half black and half white is code value 188, not 128", () => {
    // IEC 61966-2-1: linear 0.5 encodes to 1.055 × 0.5^(1/2.4) − 0.055 = 0.7354, × 255 = 187.5 → 188.
    const mixed = averageRgba(pixels([...repeat<[number, number, number, number]>([0, 0, 0, 255], 2), ...repeat<[number, number, number, number]>([255, 255, 255, 255], 2)]));
    expect(mixed).toEqual({ r: 188, g: 188, b: 188 });
    expect(rgbToHex(mixed!)).toBe("#bcbcbc");
  });

  it("agrees with culori's sRGB ↔ linear-sRGB conversions on a mixed patch", () => {
    // culori (general-purpose colour library) as the outside reference for the transfer function.
    const toLinear = converter("lrgb");
    const toRgb = converter("rgb");
    const patch: [number, number, number, number][] = [];
    for (let i = 0; i < 49; i++) patch.push([(i * 37) % 256, (i * 91 + 13) % 256, (i * 53 + 200) % 256, 255]);
    const sum = { r: 0, g: 0, b: 0 };
    for (const [r, g, b] of patch) {
      const l = toLinear({ mode: "rgb", r: r / 255, g: g / 255, b: b / 255 });
      sum.r += l.r;
      sum.g += l.g;
      sum.b += l.b;
    }
    const back = toRgb({ mode: "lrgb", r: sum.r / 49, g: sum.g / 49, b: sum.b / 49 });
    const expected = { r: Math.round(back.r * 255), g: Math.round(back.g * 255), b: Math.round(back.b * 255) };
    expect(averageRgba(pixels(patch))).toEqual(expected);
  });

  it("weights pixels by their alpha and ignores see-through ones", () => {
    expect(averageRgba(pixels([[255, 0, 0, 255], [0, 0, 255, 0]]))).toEqual({ r: 255, g: 0, b: 0 });
    // Two opaque reds and one half-transparent blue count as 2 : 0.5.
    const weighted = averageRgba(pixels([[255, 0, 0, 255], [255, 0, 0, 255], [0, 0, 255, 128]]))!;
    expect(weighted.r).toBeGreaterThan(weighted.b);
    expect(averageRgba(pixels([[255, 0, 0, 0]]))).toBeNull();
    expect(averageRgba(new Uint8ClampedArray(0))).toBeNull();
  });
});

describe("where a tap on the photo as drawn lands on the image's own pixels", () => {
  // Scaling and centring as CSS Images Level 3 defines object-fit, with object-position 50% 50%.
  it("scales both ways for a plain <img> (fill)", () => {
    expect(naturalPointFromDrawn({ x: 250, y: 50 }, { width: 500, height: 100 }, { width: 2000, height: 400 })).toEqual({ x: 1000, y: 200 });
    expect(naturalPointFromDrawn({ x: 0, y: 100 }, { width: 500, height: 100 }, { width: 2000, height: 400 })).toEqual({ x: 0, y: 400 });
  });

  it("skips the empty margin that contain leaves and maps the picture inside it", () => {
    // 800×200 in a 400×400 box: drawn 400×100, from y = 150 to 250.
    const box = { width: 400, height: 400 };
    const natural = { width: 800, height: 200 };
    expect(naturalPointFromDrawn({ x: 200, y: 100 }, box, natural, { fit: "contain" })).toBeNull();
    expect(naturalPointFromDrawn({ x: 100, y: 175 }, box, natural, { fit: "contain" })).toEqual({ x: 200, y: 50 });
  });

  it("accounts for the part that cover crops away", () => {
    // 1000×500 in a 4:1 frame of 400×100: scale 0.4, drawn 400×200, 50 px cut off top and bottom.
    const box = { width: 400, height: 100 };
    const natural = { width: 1000, height: 500 };
    expect(naturalPointFromDrawn({ x: 200, y: 50 }, box, natural, { fit: "cover" })).toEqual({ x: 500, y: 250 });
    expect(naturalPointFromDrawn({ x: 0, y: 0 }, box, natural, { fit: "cover" })).toEqual({ x: 0, y: 125 });
  });

  it("undoes the quarter turn of a vertical strip laid along a wide frame", () => {
    // A 500×2000 upright photo, turned −90° to fill a 400×100 frame: its top is at the frame's
    // left, its bottom at the right, and its right-hand edge along the frame's top.
    const frame = { width: 400, height: 100 };
    const natural = { width: 500, height: 2000 };
    const turned = { fit: "cover" as const, turned: true };
    expect(naturalPointFromDrawn({ x: 0, y: 50 }, frame, natural, turned)).toEqual({ x: 250, y: 0 });
    expect(naturalPointFromDrawn({ x: 400, y: 50 }, frame, natural, turned)).toEqual({ x: 250, y: 2000 });
    expect(naturalPointFromDrawn({ x: 200, y: 0 }, frame, natural, turned)).toEqual({ x: 500, y: 1000 });
    expect(naturalPointFromDrawn({ x: 100, y: 75 }, frame, natural, turned)).toEqual({ x: 125, y: 500 });
  });

  it("answers null for a point off the box or an image not loaded yet", () => {
    expect(naturalPointFromDrawn({ x: -1, y: 5 }, { width: 10, height: 10 }, { width: 10, height: 10 })).toBeNull();
    expect(naturalPointFromDrawn({ x: 5, y: 5 }, { width: 10, height: 10 }, { width: 0, height: 0 })).toBeNull();
  });

  it("reads an element's computed object-fit, with fill for anything else", () => {
    expect(objectFitFrom("cover")).toBe("cover");
    expect(objectFitFrom("")).toBe("fill");
    expect(objectFitFrom(undefined)).toBe("fill");
  });
});

describe("the square of pixels read around a tap", () => {
  it("is 7×7 and centred on the tapped pixel", () => {
    expect(sampleBox({ x: 50.7, y: 20.2 }, { width: 100, height: 100 })).toEqual({ x: 47, y: 17, width: 7, height: 7 });
  });

  it("is cut at the image's edges rather than moved off the tapped point", () => {
    expect(sampleBox({ x: 1, y: 99.9 }, { width: 100, height: 100 })).toEqual({ x: 0, y: 96, width: 5, height: 4 });
    expect(sampleBox({ x: 100, y: 0 }, { width: 100, height: 100 })).toEqual({ x: 96, y: 0, width: 4, height: 4 });
    expect(sampleBox({ x: 0, y: 0 }, { width: 1, height: 1 })).toEqual({ x: 0, y: 0, width: 1, height: 1 });
  });
});

describe("the search link for a colour", () => {
  it("escapes the # so the colour reaches /search as a parameter", () => {
    expect(colourSearchHref("#3A6F8C")).toBe("/search?color=%233a6f8c");
    expect(new URLSearchParams(colourSearchHref("#3a6f8c").split("?")[1]).get("color")).toBe("#3a6f8c");
  });
});
