// A phone-default HEIC photo (HEVC-coded HEIF) through the real upload pipeline. The fixture was
// rendered with the project's synthetic photo renderer and encoded by libheif's heif-enc with
// x265 (see tests/fixtures/uploads/README.md); its rendering truth sits beside it. Thresholds
// are those of the synthetic strip tests (strips.test.ts), the targets.
import { copyFile, mkdtemp, readFile, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { deltaE2000, type Lab } from "../../shared/colour/index";
import { processStripPhoto, type ProcessedStripPhoto } from "../../server/analysis/index";
import { syntheticCatalogue } from "../../server/demo/synthetic-photo";
import { readImage, sniffImageBytes, sniffImageType } from "../../server/images/index";

const fixture = (name: string) => fileURLToPath(new URL(`../fixtures/uploads/${name}`, import.meta.url));
type Truth = {
  width: number;
  height: number;
  orientation: "horizontal" | "vertical";
  bands: { start: number; end: number; inkId: number; hex: string; lab: Lab }[];
};
let truth: Truth;
let dir: string;
const done = new Map<string, ProcessedStripPhoto>();
const catalogue = syntheticCatalogue();
// The upright file, and the same photo stored on its side with an irot property (as phones store portrait shots).
const FILES = ["strip-hevc.heic", "strip-hevc-irot.heic"];

beforeAll(async () => {
  truth = JSON.parse(await readFile(fixture("strip-hevc.truth.json"), "utf8")) as Truth;
  dir = await mkdtemp(join(tmpdir(), "blendwell-heic-"));
  for (const name of FILES) {
    const out = { displayPath: join(dir, name, "display.webp"), thumbPath: join(dir, name, "thumb.webp") };
    done.set(name, await processStripPhoto(fixture(name), out, { catalogue }));
  }
}, 60_000);

afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

describe("a phone HEIC photo (HEVC)", () => {
  it("is an HEVC-coded HEIF file, sniffed as HEIC from its bytes whatever its name", async () => {
    for (const name of FILES) {
      const bytes = await readFile(fixture(name));
      // ISO/IEC 14496-12 file type box: size, "ftyp", major brand "heic" (ISO/IEC 23008-12 Annex B).
      expect(bytes.subarray(4, 12).toString("latin1")).toBe("ftypheic");
      expect(sniffImageBytes(bytes)).toEqual({ type: "heif", brand: "heic" });
      const misnamed = join(dir, `${name}.jpg`);
      await copyFile(fixture(name), misnamed);
      expect(await sniffImageType(misnamed)).toEqual({ type: "heif", brand: "heic" });
      // libvips reads the header and names the codec; its prebuilt build cannot decode HEVC pixels.
      expect((await sharp(bytes).metadata()).compression).toBe("hevc");
    }
  });

  it("stores the portrait shot on its side with a rotation property, as phones do", async () => {
    // ISO/IEC 23008-12 §6.5.10: "irot", angle × 90° anticlockwise; angle 3 here.
    const bytes = await readFile(fixture("strip-hevc-irot.heic"));
    const at = bytes.indexOf("irot", 0, "latin1");
    expect(at).toBeGreaterThan(0);
    expect(bytes[at + 4]! & 3).toBe(3);
    // The coded image is landscape (ispe: width, height after the FullBox header).
    const ispe = bytes.indexOf("ispe", 0, "latin1");
    expect([bytes.readUInt32BE(ispe + 8), bytes.readUInt32BE(ispe + 12)]).toEqual([truth.height, truth.width]);
  });

  it.each(FILES)("%s decodes upright at its rendered size", async (name) => {
    const img = await readImage(fixture(name));
    expect([img.type, img.width, img.height]).toEqual(["heif", truth.width, truth.height]);
  });

  it.each(FILES)("%s: the rendered bands are found — count, orientation, colours within ΔE2000 1.5 (median), boundaries within 4%%", (name) => {
    const { analysis } = done.get(name)!;
    expect(analysis.orientation).toBe(truth.orientation);
    expect(analysis.bands).toHaveLength(truth.bands.length);
    const des = analysis.bands.map((b, i) => deltaE2000(b.lab, truth.bands[i]!.lab)).sort((a, b) => a - b);
    expect(des[Math.floor(des.length / 2)]).toBeLessThanOrEqual(1.5);
    for (const de of des) expect(de).toBeLessThanOrEqual(3); // and each band a "match" (our ΔE2000 ≤ 3)
    analysis.bands.forEach((b, i) => {
      if (i > 0) expect(Math.abs(b.start - truth.bands[i]!.start)).toBeLessThanOrEqual(0.04);
      if (i < truth.bands.length - 1) expect(Math.abs(b.end - truth.bands[i]!.end)).toBeLessThanOrEqual(0.04);
    });
  });

  it.each(FILES)("%s: the true ink is among the top three suggestions for every band", (name) => {
    // The truth names inks of syntheticCatalogue(); check they are still the same colours.
    for (const t of truth.bands) expect(catalogue.find((c) => c.id === t.inkId)?.hex).toBe(t.hex);
    done.get(name)!.analysis.bands.forEach((b, i) => expect(b.suggestions.slice(0, 3).map((s) => s.inkId)).toContain(truth.bands[i]!.inkId));
  });

  it.each(FILES)("%s: WebP derivatives with no metadata, at the photo's upright size", async (name) => {
    const { derivatives } = done.get(name)!;
    expect([derivatives.display.width, derivatives.display.height]).toEqual([truth.width, truth.height]);
    const meta = await sharp(derivatives.display.path).metadata();
    expect(meta.format).toBe("webp");
    expect(meta.exif).toBeUndefined();
    expect(meta.icc).toBeUndefined();
  });
});
