import { mkdirSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import sharp from "sharp";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { deltaE2000, srgbToLab, type Lab } from "../../shared/colour";
import type { Ink } from "../../shared/schemas/inks";
import type { Upload } from "../../shared/schemas/uploads";
import { createTestApp, DEMO, signedIn, type TestApp } from "../setup/test-app";
import { blankPaperPhoto, stripPhoto } from "../setup/strip-photo";

let t: TestApp;
let inks: Ink[];
beforeAll(async () => {
  t = await createTestApp();
  inks = (await request(t.app).get("/api/inks?pageSize=100")).body.items;
});
afterAll(() => t.close());

const byName = (name: string) => {
  const ink = inks.find((i) => i.name === name);
  if (!ink) throw new Error(`demo ink ${name} missing`);
  return ink;
};

async function waitForUpload(agent: ReturnType<TestApp["client"]>, id: string): Promise<Upload> {
  await t.services.uploads.idle();
  const res = await agent.get(`/api/uploads/${id}`).expect(200);
  return res.body;
}

const filesUnder = (dir: string): string[] => {
  const root = path.join(t.config.dataDir, dir);
  try {
    return readdirSync(root, { recursive: true, withFileTypes: true }).filter((d) => d.isFile()).map((d) => d.name);
  } catch {
    return [];
  }
};

describe("uploading a strip photo", () => {
  it("a member's photo is analysed: bands in order, measured colours near the inks, the true ink suggested", async () => {
    // Three well-separated demo inks, dark–light–dark as crafters lay them (common practice).
    const chosen = [byName("Deep Sounding"), byName("Gorse Bloom"), byName("Garnet Vein")];
    const { jpeg } = await stripPhoto(chosen);
    const agent = await signedIn(t, DEMO.member);
    const res = await agent.post("/api/uploads").attach("image", jpeg, "strip.jpg").expect(202);
    expect(res.body).toEqual({ id: expect.any(String), status: "processing" });

    const upload = await waitForUpload(agent, res.body.id);
    expect(upload.status).toBe("ready");
    const analysis = upload.analysis!;
    expect(analysis.orientation).toBe("horizontal");
    expect(analysis.paper.found).toBe(true);
    expect(analysis.bands).toHaveLength(3);
    analysis.bands.forEach((band, i) => {
      expect(band.index).toBe(i);
      expect(band.start).toBeLessThan(band.end);
      // ΔE2000 ≤ 3 between a recovered band and its ink (our target; the analysis tests hold it to 1.5 median).
      expect(deltaE2000(band.lab, chosen[i]!.lab)).toBeLessThan(3);
      expect(band.suggestions.slice(0, 3).map((s) => s.inkId)).toContain(chosen[i]!.id);
    });
    expect(analysis.transitions).toHaveLength(2);
    // The strip's outline for drawing bands on the photo: the synthetic strip spans the middle
    // 75% of the width, centred, 12% of the width thick (known truth of the generated photo).
    expect(analysis.strip!.start.x).toBeCloseTo(0.125, 1);
    expect(analysis.strip!.end.x).toBeCloseTo(0.875, 1);
    expect((analysis.strip!.start.y + analysis.strip!.end.y) / 2).toBeCloseTo(0.5, 1);
    expect(analysis.strip!.thickness).toBeGreaterThan(0.08);
    expect(analysis.strip!.thickness).toBeLessThan(0.16);
    expect(upload.images?.display).toBe(`/api/uploads/${res.body.id}/images/display`);

    // The photo members see is corrected: the paper above the strip (warm D50 cast in the
    // photo) reads neutral, within ΔE2000 2 of a grey of the same lightness.
    const shown = await agent.get(upload.images!.display).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on("data", (c: Buffer) => chunks.push(c));
      r.on("end", () => cb(null, Buffer.concat(chunks)));
    });
    const { data, info } = await sharp(shown.body as Buffer).raw().toBuffer({ resolveWithObject: true });
    const x = Math.round(info.width * 0.5);
    const y = Math.round(info.height * 0.2);
    const o = (y * info.width + x) * info.channels;
    const paper = srgbToLab(data[o]!, data[o + 1]!, data[o + 2]!);
    expect(deltaE2000(paper, { l: paper.l, a: 0, b: 0 })).toBeLessThan(2);
  });

  it("takes a phone HEIC photo (HEVC): sniffed from its bytes, decoded and analysed in the pool", async () => {
    // Made with heif-enc (x265) from a rendered strip of known truth: tests/fixtures/uploads/README.md.
    const fixtures = fileURLToPath(new URL("../fixtures/uploads", import.meta.url));
    const heic = readFileSync(path.join(fixtures, "strip-hevc.heic"));
    const truth = JSON.parse(readFileSync(path.join(fixtures, "strip-hevc.truth.json"), "utf8")) as { bands: { lab: Lab }[] };
    const agent = await signedIn(t, DEMO.member);
    // Phones share it under any name; the bytes decide.
    const res = await agent.post("/api/uploads").attach("image", heic, { filename: "IMG_0001.jpg", contentType: "image/jpeg" }).expect(202);
    const upload = await waitForUpload(agent, res.body.id);
    expect(upload.status).toBe("ready");
    expect(upload.analysis!.orientation).toBe("vertical");
    expect(upload.analysis!.bands).toHaveLength(truth.bands.length);
    upload.analysis!.bands.forEach((band, i) => expect(deltaE2000(band.lab, truth.bands[i]!.lab)).toBeLessThan(3));
    const row = await t.db.selectFrom("uploads").select(["mime", "original_key"]).where("id", "=", res.body.id).executeTakeFirstOrThrow();
    expect(row.mime).toBe("image/heic");
    expect(row.original_key).toMatch(/\.heic$/);
  });

  it("serves derivatives without EXIF or GPS, only to the owner and moderators", async () => {
    const { jpeg } = await stripPhoto([byName("Deep Sounding"), byName("Gorse Bloom")]);
    // A phone photo carries its location: GPS tags in EXIF (EXIF 2.32, GPS IFD).
    const withGps = await sharp(jpeg)
      .withExif({ IFD0: { Make: "Phone", Model: "Camera" }, IFD3: { GPSLatitudeRef: "N", GPSLatitude: "51/1 30/1 0/1", GPSLongitudeRef: "W", GPSLongitude: "0/1 7/1 0/1" } })
      .jpeg()
      .toBuffer();
    expect((await sharp(withGps).metadata()).exif).toBeDefined();
    const owner = await signedIn(t, DEMO.member);
    const { body } = await owner.post("/api/uploads").attach("image", withGps, "strip.jpg").expect(202);
    expect((await waitForUpload(owner, body.id)).status).toBe("ready");

    for (const variant of ["display", "thumb"]) {
      const img = await owner.get(`/api/uploads/${body.id}/images/${variant}`).buffer(true).parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on("data", (c: Buffer) => chunks.push(c));
        res.on("end", () => cb(null, Buffer.concat(chunks)));
      }).expect(200);
      expect(img.headers["content-type"]).toBe("image/webp");
      const meta = await sharp(img.body as Buffer).metadata();
      expect(meta.exif).toBeUndefined();
      expect(meta.xmp).toBeUndefined();
      expect(meta.iptc).toBeUndefined();
      expect(meta.format).toBe("webp");
      expect(Math.max(meta.width!, meta.height!)).toBeLessThanOrEqual(variant === "display" ? 1600 : 480);
    }

    const other = await signedIn(t, DEMO.newMember);
    await other.get(`/api/uploads/${body.id}`).expect(404);
    await other.get(`/api/uploads/${body.id}/images/display`).expect(404);
    await request(t.app).get(`/api/uploads/${body.id}/images/display`).expect(404);
    const mod = await signedIn(t, DEMO.moderator);
    await mod.get(`/api/uploads/${body.id}`).expect(200);
  });

  it("a photo with no strip fails with a reason, and leaves no file behind", async () => {
    const agent = await signedIn(t, DEMO.member);
    const before = { originals: filesUnder("originals").length, images: filesUnder("images").length };
    const res = await agent.post("/api/uploads").attach("image", await blankPaperPhoto(), "paper.jpg").expect(202);
    const upload = await waitForUpload(agent, res.body.id);
    expect(upload.status).toBe("failed");
    expect(upload.error?.message).toMatch(/strip/i);
    expect(filesUnder("originals").length).toBe(before.originals);
    expect(filesUnder("images").length).toBe(before.images);
  });

  it("re-runs the analysis with a tapped paper-white point", async () => {
    const agent = await signedIn(t, DEMO.member);
    // Both inks stay inside the camera's range under illuminant A (a clipped channel is lost to anyone).
    const chosen = [byName("Deep Sounding"), byName("Garnet Vein")];
    const { jpeg } = await stripPhoto(chosen, { illuminant: "A" });
    const { body } = await agent.post("/api/uploads").attach("image", jpeg, "strip.jpg").expect(202);
    expect((await waitForUpload(agent, body.id)).status).toBe("ready");
    const again = await agent.post(`/api/uploads/${body.id}/analysis`).send({ white: { x: 0.5, y: 0.25 } }).expect(202);
    expect(again.body.status).toBe("processing");
    const upload = await waitForUpload(agent, body.id);
    expect(upload.status).toBe("ready");
    // Paper just above the strip, so a warm (illuminant A) cast is corrected from it: bands read true.
    expect(upload.analysis!.paper.found).toBe(true);
    expect(upload.analysis!.bands).toHaveLength(2);
    upload.analysis!.bands.forEach((band, i) => expect(deltaE2000(band.lab, chosen[i]!.lab)).toBeLessThan(3));
    // A tap on the dark first band is taken at its word: that is now the "white", so the strip is
    // still found (on the card) but its colours are read against the wrong white.
    await agent.post(`/api/uploads/${body.id}/analysis`).send({ white: { x: 0.25, y: 0.5 } }).expect(202);
    const misled = await waitForUpload(agent, body.id);
    expect(misled.status).toBe("ready");
    expect(deltaE2000(misled.analysis!.bands[0]!.lab, chosen[0]!.lab)).toBeGreaterThan(10);
    // …and the photo is kept, so a better tap can follow.
    await agent.post(`/api/uploads/${body.id}/analysis`).send({ white: { x: 0.5, y: 0.25 } }).expect(202);
    expect((await waitForUpload(agent, body.id)).status).toBe("ready");
    await agent.post(`/api/uploads/${body.id}/analysis`).send({ white: { x: 2, y: 0 } }).expect(400);
    const other = await signedIn(t, DEMO.newMember);
    await other.post(`/api/uploads/${body.id}/analysis`).send({}).expect(404);
  });
});

describe("photos we refuse at the door", () => {
  const noLeftovers = () => {
    expect(filesUnder("tmp")).toEqual([]);
  };

  it("needs a signed-in member", async () => {
    const { jpeg } = await stripPhoto([byName("Deep Sounding"), byName("Gorse Bloom")]);
    await t.client().post("/api/uploads").attach("image", jpeg, "strip.jpg").expect(401);
  });

  it.each([
    ["a text file named .jpg", Buffer.from("these are my ink notes, not a photo\n"), "notes.jpg", 415, /text/],
    ["an SVG", Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><rect width="9" height="9"/></svg>'), "strip.svg", 415, /SVG/],
    ["a PDF", Buffer.from("%PDF-1.7\n1 0 obj\n<<>>\nendobj\n"), "strip.pdf", 415, /PDF/],
    ["zero bytes", Buffer.alloc(0), "empty.jpg", 400, /empty/i],
  ])("refuses %s with a clear message", async (_what, bytes, name, status, message) => {
    const agent = await signedIn(t, DEMO.member);
    const before = filesUnder("originals").length;
    const res = await agent.post("/api/uploads").attach("image", bytes, name).expect(status);
    expect(res.body.error.message).toMatch(message);
    expect(filesUnder("originals").length).toBe(before);
    noLeftovers();
  });

  it("refuses a 30000 × 30000 PNG from its header, before decoding", async () => {
    // PNG signature and IHDR chunk (ISO/IEC 15948 / PNG spec §11.2.2); CRC left wrong on purpose.
    const ihdr = Buffer.alloc(25);
    ihdr.writeUInt32BE(13, 0);
    ihdr.write("IHDR", 4, "ascii");
    ihdr.writeUInt32BE(30000, 8);
    ihdr.writeUInt32BE(30000, 12);
    ihdr.writeUInt8(8, 16);
    ihdr.writeUInt8(2, 17);
    const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), ihdr]);
    const agent = await signedIn(t, DEMO.member);
    const res = await agent.post("/api/uploads").attach("image", png, "huge.png").expect(413);
    expect(res.body.error.message).toMatch(/30000 × 30000/);
    noLeftovers();
  });

  it("refuses files over 20 MB with 413", async () => {
    const agent = await signedIn(t, DEMO.member);
    const big = Buffer.alloc(20 * 1024 * 1024 + 1, 0xff);
    big[0] = 0xff;
    big[1] = 0xd8;
    const res = await agent.post("/api/uploads").attach("image", big, "big.jpg");
    expect(res.status).toBe(413);
    noLeftovers();
  });

  it("refuses a request without a photo, and bad white-point fields", async () => {
    const agent = await signedIn(t, DEMO.member);
    await agent.post("/api/uploads").field("whiteX", "0.5").expect(400);
    const { jpeg } = await stripPhoto([byName("Deep Sounding"), byName("Gorse Bloom")]);
    const res = await agent.post("/api/uploads").field("whiteX", "0.5").attach("image", jpeg, "strip.jpg").expect(400);
    expect(res.body.error.fields.whiteX).toBeDefined();
    await agent.post("/api/uploads").attach("image", jpeg, "a.jpg").attach("image", jpeg, "b.jpg").expect(400);
    noLeftovers();
  });

  it("answers 404 for unknown or malformed upload ids", async () => {
    const agent = await signedIn(t, DEMO.member);
    await agent.get("/api/uploads/00000000-0000-4000-8000-000000000000").expect(404);
    await agent.get("/api/uploads/not-an-id").expect(404);
  });
});

describe("when the queue is full or the server restarts", () => {
  it("answers 503 with Retry-After when the analysis queue is full", async () => {
    const busy = await createTestApp({ services: { maxQueue: 0 } });
    try {
      const agent = await signedIn(busy, DEMO.member);
      const { jpeg } = await stripPhoto([byName("Deep Sounding"), byName("Gorse Bloom")]);
      const res = await agent.post("/api/uploads").attach("image", jpeg, "strip.jpg").expect(503);
      expect(res.headers["retry-after"]).toBe("30");
    } finally {
      await busy.close();
    }
  });

  it("takes up uploads left in processing, and fails the ones whose photo is gone", async () => {
    const agent = await signedIn(t, DEMO.member);
    const me = (await agent.get("/api/me")).body;
    const { jpeg } = await stripPhoto([byName("Deep Sounding"), byName("Gorse Bloom")]);
    const now = new Date().toISOString();
    mkdirSync(path.join(t.config.dataDir, "originals"), { recursive: true });
    const survivor = "11111111-1111-4111-8111-111111111111";
    const orphan = "22222222-2222-4222-8222-222222222222";
    writeFileSync(path.join(t.config.dataDir, `originals/${survivor}.jpg`), jpeg);
    for (const id of [survivor, orphan]) {
      await t.db.insertInto("uploads").values({
        id, owner_id: me.id, status: "processing", original_key: `originals/${id}.jpg`, mime: "image/jpeg",
        byte_size: jpeg.length, white_x: null, white_y: null, created_at: now, updated_at: now,
      }).execute();
    }
    expect(await t.services.uploads.recover()).toBe(2);
    expect((await waitForUpload(agent, survivor)).status).toBe("ready");
    const gone = await waitForUpload(agent, orphan);
    expect(gone.status).toBe("failed");
    expect(gone.error?.code).toBe("interrupted");
  });
});
