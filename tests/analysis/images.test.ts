import { mkdtemp, readdir, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { crc32 } from "node:zlib";
import sharp from "sharp";
import { thumbHashToAverageRGBA } from "thumbhash";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { deltaE2000, srgbToLab } from "../../shared/colour/index";
import {
  ImageError,
  decodeImageBytes,
  makeDerivatives,
  phashDistance,
  readHeaderInfo,
  readImage,
  sniffImageBytes,
  sniffImageType,
  useSafeSharp,
  writeDerivatives,
} from "../../server/images/index";

let dir: string;
beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), "blendwell-images-"));
});
afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

async function file(name: string, data: Uint8Array | string): Promise<string> {
  const p = join(dir, name);
  await writeFile(p, data);
  return p;
}

/** A test picture: colour quadrants, so orientation and colour can both be checked. */
function quadrants(w: number, h: number): Buffer {
  const data = Buffer.alloc(w * h * 3);
  const colours = [
    [200, 40, 40], // top-left: red
    [40, 160, 60], // top-right: green
    [40, 70, 190], // bottom-left: blue
    [230, 200, 60], // bottom-right: yellow
  ];
  for (let y = 0; y < h; y++)
    for (let x = 0; x < w; x++) {
      const c = colours[(y < h / 2 ? 0 : 2) + (x < w / 2 ? 0 : 1)];
      data.set(c, (y * w + x) * 3);
    }
  return data;
}

const raw = (data: Buffer, width: number, height: number) => sharp(data, { raw: { width, height, channels: 3 } });

function pixel(img: { data: Buffer; width: number }, x: number, y: number): number[] {
  const i = (y * img.width + x) * 3;
  return [img.data[i], img.data[i + 1], img.data[i + 2]];
}

function deltaE(a: number[], b: number[]): number {
  return deltaE2000(srgbToLab(a[0], a[1], a[2]), srgbToLab(b[0], b[1], b[2]));
}

async function expectImageError(p: Promise<unknown>, code: ImageError["code"], words?: RegExp): Promise<ImageError> {
  const err = await p.then(
    () => null,
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(ImageError);
  const e = err as ImageError;
  expect(e.code).toBe(code);
  if (words) expect(e.message).toMatch(words);
  return e;
}

/** PNG signature + IHDR claiming the given size + IEND, with real CRCs (PNG spec, ISO/IEC 15948). */
function pngHeaderOnly(width: number, height: number): Buffer {
  const chunk = (type: string, body: Buffer) => {
    const len = Buffer.alloc(4);
    len.writeUInt32BE(body.length);
    const tb = Buffer.concat([Buffer.from(type, "latin1"), body]);
    const crc = Buffer.alloc(4);
    crc.writeUInt32BE(crc32(tb));
    return Buffer.concat([len, tb, crc]);
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // truecolour
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk("IHDR", ihdr), chunk("IEND", Buffer.alloc(0))]);
}

describe("sniffing", () => {
  it("recognises the accepted formats by their magic bytes, not their names", async () => {
    const q = quadrants(32, 24);
    expect(sniffImageBytes(await raw(q, 32, 24).jpeg().toBuffer()).type).toBe("jpeg");
    expect(sniffImageBytes(await raw(q, 32, 24).png().toBuffer()).type).toBe("png");
    expect(sniffImageBytes(await raw(q, 32, 24).webp().toBuffer()).type).toBe("webp");
    const avif = await raw(q, 32, 24).heif({ compression: "av1" }).toBuffer();
    expect(sniffImageBytes(avif)).toEqual({ type: "heif", brand: "avif" });
    const path = await file("really-a-png.jpg", await raw(q, 32, 24).png().toBuffer());
    expect((await sniffImageType(path)).type).toBe("png");
  });

  it("reads the same dimensions from headers as sharp does (reference library)", async () => {
    const q = quadrants(123, 45);
    for (const [type, buf] of [
      ["jpeg", await raw(q, 123, 45).jpeg().toBuffer()],
      ["png", await raw(q, 123, 45).png().toBuffer()],
      ["webp", await raw(q, 123, 45).webp().toBuffer()],
      ["webp", await raw(q, 123, 45).webp({ lossless: true }).toBuffer()],
    ] as const) {
      const meta = await sharp(buf).metadata();
      const info = readHeaderInfo(buf, type);
      expect(info).toEqual({ width: meta.width, height: meta.height, animated: false });
    }
  });
});

describe("bad input gets a clear, typed error", () => {
  it("zero bytes", async () => {
    await expectImageError(readImage(await file("empty.jpg", Buffer.alloc(0))), "empty", /empty/);
  });

  it("a missing file", async () => {
    await expectImageError(readImage(join(dir, "nope.jpg")), "unreadable");
  });

  it("a file over the size limit, refused before it is read", async () => {
    const jpg = await raw(quadrants(64, 64), 64, 64).jpeg().toBuffer();
    await expectImageError(readImage(await file("big.jpg", jpg), { maxBytes: 100 }), "too_large", /larger than/);
  });

  it("a truncated JPEG", async () => {
    const jpg = await raw(quadrants(400, 300), 400, 300).jpeg({ quality: 90 }).toBuffer();
    await expectImageError(readImage(await file("cut.jpg", jpg.subarray(0, Math.floor(jpg.length / 2)))), "corrupt", /damaged or incomplete/);
  });

  it("text named .jpg", async () => {
    await expectImageError(readImage(await file("notes.jpg", "three inks: mustard, teal, plum\n")), "unsupported_type", /not a photo we can read \(text\)/);
  });

  it("an SVG, which never reaches libvips", async () => {
    const svg = '<?xml version="1.0"?><svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><rect width="10" height="10"/></svg>';
    await expectImageError(readImage(await file("strip.svg", svg)), "unsupported_type", /\(SVG\)/);
    // Even handed straight to sharp, the SVG loader is blocked once our settings are on.
    useSafeSharp();
    await expect(sharp(Buffer.from(svg)).metadata()).rejects.toThrow();
  });

  it("a PDF", async () => {
    const pdf = "%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n";
    await expectImageError(readImage(await file("strip.pdf", pdf)), "unsupported_type", /not a photo we can read \(PDF\)/);
  });

  it("a 30000 × 30000 PNG header, refused from the header before any decoding", async () => {
    // The file has no pixel data at all: decoding it would fail as "corrupt", so "too_many_pixels"
    // proves the size was checked first.
    const e = await expectImageError(readImage(await file("huge.png", pngHeaderOnly(30000, 30000))), "too_many_pixels", /30000 × 30000/);
    expect(e.message).toMatch(/50 megapixels/);
  });

  it("an animated GIF and an animated WebP", async () => {
    const frames = Buffer.concat([quadrants(32, 32), Buffer.alloc(32 * 32 * 3, 90)]);
    const anim = (fmt: "gif" | "webp") =>
      sharp(frames, { raw: { width: 32, height: 64, channels: 3, pageHeight: 32 } as never })[fmt]({ loop: 0 }).toBuffer();
    const gif = await anim("gif");
    const webp = await anim("webp");
    expect((await sharp(webp, { pages: -1 }).metadata()).pages).toBe(2); // really animated
    await expectImageError(readImage(await file("anim.gif", gif)), "animated", /animated/);
    await expectImageError(readImage(await file("anim.webp", webp)), "animated", /animated/);
  });

  it("a still GIF is a format we do not take", async () => {
    const gif = await raw(quadrants(16, 16), 16, 16).gif().toBuffer();
    await expectImageError(readImage(await file("still.gif", gif)), "unsupported_type", /\(GIF\)/);
  });
});

describe("decoding", () => {
  it("applies EXIF orientation so pixels come out upright", async () => {
    const w = 80;
    const h = 60;
    const upright = quadrants(w, h);
    // Store the picture turned 90° anticlockwise with Orientation = 6 ("turn 90° clockwise to view").
    const turned = await raw(upright, w, h).rotate(270).raw().toBuffer({ resolveWithObject: true });
    const jpg = await raw(turned.data, turned.info.width, turned.info.height).jpeg({ quality: 95 }).withMetadata({ orientation: 6 }).toBuffer();
    expect((await sharp(jpg).metadata()).orientation).toBe(6);
    const img = await readImage(await file("turned.jpg", jpg));
    expect([img.width, img.height]).toEqual([w, h]);
    expect(deltaE(pixel(img, 10, 10), [200, 40, 40])).toBeLessThan(3);
    expect(deltaE(pixel(img, w - 10, 10), [40, 160, 60])).toBeLessThan(3);
    expect(deltaE(pixel(img, 10, h - 10), [40, 70, 190])).toBeLessThan(3);
  });

  it("converts a CMYK JPEG to 8-bit sRGB", async () => {
    const q = quadrants(64, 64);
    const cmyk = await raw(q, 64, 64).toColourspace("cmyk").jpeg({ quality: 95 }).toBuffer();
    expect((await sharp(cmyk).metadata()).space).toBe("cmyk");
    const img = await readImage(await file("cmyk.jpg", cmyk));
    expect(img.channels).toBe(3);
    expect(img.data.length).toBe(64 * 64 * 3);
    // Through a print profile and back: close, not exact (the round trip is libvips + lcms).
    expect(deltaE(pixel(img, 16, 16), [200, 40, 40])).toBeLessThan(8);
    expect(deltaE(pixel(img, 48, 48), [230, 200, 60])).toBeLessThan(8);
  });

  it("converts a 16-bit PNG to 8-bit exactly", async () => {
    const w = 16;
    const h = 4;
    const data = new Uint16Array(w * h * 3);
    for (let i = 0; i < data.length; i++) data[i] = ((i * 37) % 256) * 257; // v·257 is v in 16 bits
    // sharp takes the sample depth of raw input from the typed array (Uint16Array → 16 bits).
    const png = await sharp(data, { raw: { width: w, height: h, channels: 3 } })
      .toColourspace("rgb16")
      .png()
      .toBuffer();
    expect((await sharp(png).metadata()).depth).toBe("ushort");
    const img = await readImage(await file("deep.png", png));
    for (let i = 0; i < data.length; i++) expect(img.data[i]).toBe(data[i] / 257);
  });

  it("puts transparent areas on white, like paper", async () => {
    const rgba = Buffer.alloc(8 * 8 * 4, 0);
    const png = await sharp(rgba, { raw: { width: 8, height: 8, channels: 4 } }).png().toBuffer();
    const img = await readImage(await file("clear.png", png));
    expect(pixel(img, 4, 4)).toEqual([255, 255, 255]);
  });

  it("decodes a HEIF file whose images are AV1-coded (AVIF) through sharp", async () => {
    const avif = await raw(quadrants(64, 48), 64, 48).heif({ compression: "av1", quality: 90 }).toBuffer();
    const img = await readImage(await file("strip.avif", avif));
    expect([img.width, img.height, img.type]).toEqual([64, 48, "heif"]);
    expect(deltaE(pixel(img, 10, 10), [200, 40, 40])).toBeLessThan(5);
  });

  it("scales down on decode when asked, keeping the aspect ratio", async () => {
    const jpg = await raw(quadrants(400, 300), 400, 300).jpeg().toBuffer();
    const img = await decodeImageBytes(jpg, { maxLongEdge: 100 });
    expect([img.width, img.height, img.originalWidth, img.originalHeight]).toEqual([100, 75, 400, 300]);
  });
});

describe("derivatives", () => {
  it("carry no EXIF, GPS, XMP, IPTC or ICC data, even when the upload had GPS", async () => {
    const jpg = await raw(quadrants(2000, 1500), 2000, 1500)
      .jpeg()
      .withExif({
        IFD0: { Copyright: "Blendwell test photo" },
        IFD3: { GPSLatitudeRef: "N", GPSLatitude: "51/1 30/1 0/1", GPSLongitudeRef: "W", GPSLongitude: "0/1 7/1 0/1" },
      })
      .toBuffer();
    const inMeta = await sharp(jpg).metadata();
    expect(inMeta.exif).toBeDefined();
    // The GPS IFD pointer tag 0x8825 (EXIF 2.3 / TIFF 6.0) is present in the upload's EXIF.
    expect(inMeta.exif!.includes(Buffer.from([0x88, 0x25])) || inMeta.exif!.includes(Buffer.from([0x25, 0x88]))).toBe(true);
    const img = await readImage(await file("gps.jpg", jpg), { maxLongEdge: 1600 });
    const d = await makeDerivatives(img);
    for (const out of [d.display.data, d.thumb.data]) {
      const meta = await sharp(out).metadata();
      expect(meta.format).toBe("webp");
      expect(meta.exif).toBeUndefined();
      expect(meta.xmp).toBeUndefined();
      expect(meta.iptc).toBeUndefined();
      expect(meta.icc).toBeUndefined();
      // WebP container (RIFF) chunk names for metadata: none present, nor the GPS text.
      for (const marker of ["EXIF", "XMP ", "ICCP", "Blendwell test photo", "GPS"]) expect(out.includes(Buffer.from(marker, "latin1"))).toBe(false);
    }
    expect([d.display.width, d.display.height]).toEqual([1600, 1200]);
    expect([d.thumb.width, d.thumb.height]).toEqual([480, 360]);
  });

  it("give a placeholder of the right average colour and a stable perceptual hash", async () => {
    const q = quadrants(640, 480);
    const img = await decodeImageBytes(await raw(q, 640, 480).jpeg({ quality: 95 }).toBuffer());
    const d = await makeDerivatives(img);
    const avg = thumbHashToAverageRGBA(Buffer.from(d.placeholder, "base64"));
    const mean = [0, 1, 2].map((c) => [200, 40, 40, 230][c] / 4 + [40, 160, 60, 200][c] / 4 + [40, 70, 190, 60][c] / 4 + [230, 200, 60, 0][c] / 4);
    expect(deltaE([avg.r * 255, avg.g * 255, avg.b * 255], mean)).toBeLessThan(6);
    expect(d.phash).toMatch(/^[0-9a-f]{16}$/);
    // The same picture at a much lower quality hashes nearly the same; a different one does not.
    const again = await makeDerivatives(await decodeImageBytes(await raw(q, 640, 480).jpeg({ quality: 40 }).toBuffer()));
    const flipped = await makeDerivatives(await decodeImageBytes(await raw(q, 640, 480).flip().jpeg().toBuffer()));
    expect(phashDistance(d.phash, again.phash)).toBeLessThanOrEqual(4);
    expect(phashDistance(d.phash, flipped.phash)).toBeGreaterThan(10);
  });

  it("write both files, or leave nothing behind when one cannot be written", async () => {
    const img = await decodeImageBytes(await raw(quadrants(300, 200), 300, 200).jpeg().toBuffer());
    const out = join(dir, "out");
    await rm(out, { recursive: true, force: true });
    await (await import("node:fs/promises")).mkdir(out);
    const info = await writeDerivatives(img, { displayPath: join(out, "d.webp"), thumbPath: join(out, "t.webp") });
    expect(info.display.width).toBe(300); // never enlarged
    expect((await readdir(out)).sort()).toEqual(["d.webp", "t.webp"]);
    await rm(out, { recursive: true, force: true });
    await (await import("node:fs/promises")).mkdir(out);
    await expect(writeDerivatives(img, { displayPath: join(out, "d.webp"), thumbPath: join(out, "missing-folder", "t.webp") })).rejects.toThrow();
    expect(await readdir(out)).toEqual([]);
  });
});
