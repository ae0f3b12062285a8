import { existsSync, readdirSync } from "node:fs";
import path from "node:path";
import sharp from "sharp";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { deltaE2000, srgbToLab } from "../../shared/colour";
import type { Ink } from "../../shared/schemas/inks";
import type { Strip } from "../../shared/schemas/strips";
import type { Outline, StripReading, Upload } from "../../shared/schemas/uploads";
import { loadCatalogue } from "../../server/modules/uploads/uploads.repository";
import { createTestApp, DEMO, signedIn, type TestApp } from "../setup/test-app";
import { giveStrips, readingsOf, severalStripsPhoto } from "../setup/several-strips";

type Agent = ReturnType<TestApp["client"]>;
let t: TestApp;
let inks: Ink[];
let mara: Agent;
let noor: Agent;
let ivo: Agent;
let seed = 500;

beforeAll(async () => {
  t = await createTestApp();
  inks = (await request(t.app).get("/api/inks?pageSize=100")).body.items;
  mara = await signedIn(t, DEMO.member);
  noor = await signedIn(t, DEMO.newMember);
  ivo = await signedIn(t, DEMO.moderator);
});
afterAll(() => t.close());

function ink(name: string) {
  const found = inks.find((i) => i.name === name);
  if (!found) throw new Error(`demo ink ${name} missing`);
  return found;
}

// Three strips of 3, 2 and 4 inks, one above another (tests/setup/several-strips.ts has the truth).
const inkSets = () => [
  [ink("Deep Sounding"), ink("Gorse Bloom"), ink("Garnet Vein")],
  [ink("Riptide"), ink("Buoy Orange")],
  [ink("Bluebell Wood"), ink("Lighthouse Lamp"), ink("Flare Red"), ink("Fern Shadow")],
];

/** An upload of the three-strip photo whose analysis names all three strips at their true outlines. */
async function threeStripUpload(agent: Agent) {
  const photo = await severalStripsPhoto(inkSets(), seed++);
  const { body } = await agent.post("/api/uploads").attach("image", photo.jpeg, "three.jpg").expect(202);
  await t.services.uploads.idle();
  expect((await agent.get(`/api/uploads/${body.id}`)).body.status).toBe("ready");
  const readings = await readingsOf(photo.tiles, photo.outlines, await loadCatalogue(t.db));
  // The analysis reads each strip on its own: 3, 2 and 4 bands (the generator's truth).
  expect(readings.map((r) => r.bands.length)).toEqual([3, 2, 4]);
  await giveStrips(t.db, body.id, readings);
  return { id: body.id as string, photo, readings };
}

const post = (agent: Agent, uploadId: string, stripIndex: number | undefined, inkIds: number[], title = "One of a pile") =>
  agent.post("/api/strips").send({ uploadId, ...(stripIndex === undefined ? {} : { stripIndex }), title, paper: "smooth-cardstock", tools: [], inks: inkIds });

const ids = (list: Ink[]) => list.map((i) => i.id);
/** Outlines agree to 0.001 of the photo (the analysis rounds corners to 4 decimals). */
const expectSameOutline = (got: Outline, want: Outline) => got.forEach((p, k) => p.forEach((v, c) => expect(v).toBeCloseTo(want[k]![c]!, 3)));
const folders = (uploadId: string) => {
  const dir = path.join(t.config.dataDir, "images", uploadId);
  return existsSync(dir) ? readdirSync(dir, { withFileTypes: true }).filter((d) => d.isDirectory()).map((d) => d.name) : [];
};
const originals = (uploadId: string) => readdirSync(path.join(t.config.dataDir, "originals")).filter((f) => f.startsWith(uploadId));

async function bytes(agent: Agent, url: string): Promise<Buffer> {
  const res = await agent.get(url).expect(200).buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on("data", (c: Buffer) => chunks.push(c));
    r.on("end", () => cb(null, Buffer.concat(chunks)));
  });
  return res.body as Buffer;
}

/** CIELAB of the pixel at fractions (x, y) of an image. */
async function labAt(image: Buffer, x: number, y: number) {
  const { data, info } = await sharp(image).removeAlpha().raw().toBuffer({ resolveWithObject: true });
  const px = Math.min(info.width - 1, Math.round(x * info.width));
  const py = Math.min(info.height - 1, Math.round(y * info.height));
  const i = (py * info.width + px) * 3;
  return srgbToLab(data[i]!, data[i + 1]!, data[i + 2]!);
}

describe("posting strips from a several-strip photo", () => {
  it("each ticked strip is posted with its own bands, ink order and cropped images; the photo stays one upload", async () => {
    const { id, readings } = await threeStripUpload(mara);
    const [first, , third] = inkSets();
    const a = await post(mara, id, 0, ids(first!)).expect(201);
    const c = await post(mara, id, 2, ids(third!)).expect(201);
    const stripA: Strip = (await request(t.app).get(`/api/strips/${a.body.id}`).expect(200)).body;
    const stripC: Strip = (await request(t.app).get(`/api/strips/${c.body.id}`).expect(200)).body;
    expect([stripA.stripIndex, stripC.stripIndex]).toEqual([0, 2]);
    // Bands are the strip's own (3 and 4), each tagged with the nearest of its own inks, in order.
    expect(stripA.bands.map((b) => b.inkId)).toEqual(ids(first!));
    expect(stripC.bands.map((b) => b.inkId)).toEqual(ids(third!));
    expect(stripC.bands.map((b) => [b.start, b.end])).toEqual(readings[2]!.bands.map((b) => [b.start, b.end]));

    // Its own image: the strip's box plus a margin of 0.3 × its thickness (144 px → 43 px), so
    // 900 + 2 × 43 by 144 + 2 × 43 pixels from the 1200 × 1200 display photo (truth of the scene).
    const display = await bytes(mara, stripC.images.display);
    const meta = await sharp(display).metadata();
    expect(meta.width).toBeGreaterThanOrEqual(985);
    expect(meta.width).toBeLessThanOrEqual(990);
    expect(meta.height).toBeGreaterThanOrEqual(229);
    expect(meta.height).toBeLessThanOrEqual(233);
    expect([stripC.images.width, stripC.images.height]).toEqual([meta.width, meta.height]);
    expect(stripC.images.placeholder).not.toBe("");
    // Its outline is given in its own image's fractions: the strip sits inside the margin.
    const [p0, , p2] = stripC.outline!;
    expect(p0[0]).toBeCloseTo(43 / meta.width!, 2);
    expect(p0[1]).toBeCloseTo(43 / meta.height!, 1);
    expect(p2[0]).toBeCloseTo(1 - 43 / meta.width!, 2);
    // Drawn at the outline, the bands land on the right inks: the middle of each band of strip 3
    // in its own image is within ΔE2000 6 of that band's ink (display photo is WebP-compressed).
    for (const [k, band] of stripC.bands.entries()) {
      const u = (band.start + band.end) / 2;
      const x = p0[0] + (p2[0] - p0[0]) * u;
      const y = (p0[1] + p2[1]) / 2;
      expect(deltaE2000(await labAt(display, x, y), third![k]!.lab)).toBeLessThan(6);
    }
    const thumb = await sharp(await bytes(mara, stripC.images.thumb)).metadata();
    expect(Math.max(thumb.width!, thumb.height!)).toBeLessThanOrEqual(480);

    // Different strips, different pictures: their perceptual hashes differ.
    const hashes = await t.db.selectFrom("strips").select(["phash"]).where("upload_id", "=", id).execute();
    expect(new Set(hashes.map((h) => h.phash)).size).toBe(2);
    // The upload names the strips posted from it, for the posting page after a reload.
    const view: Upload = (await mara.get(`/api/uploads/${id}`).expect(200)).body;
    expect(view.posted).toEqual([
      { stripIndex: 0, stripId: a.body.id, status: a.body.status },
      { stripIndex: 2, stripId: c.body.id, status: c.body.status },
    ]);
    // One upload, and each strip has a folder of its own under it.
    expect(folders(id)).toHaveLength(2);
    expect(originals(id)).toHaveLength(1);
  });

  it("refuses a strip already posted, a strip the photo does not have, and a strip number out of range", async () => {
    const { id } = await threeStripUpload(mara);
    const [first, second] = inkSets();
    await post(mara, id, 1, ids(second!)).expect(201);
    const again = await post(mara, id, 1, ids(second!)).expect(409);
    expect(again.body.error).toMatchObject({ code: "already_posted", message: "Strip 2 of this photo is already posted." });
    const missing = await post(mara, id, 3, ids(first!)).expect(422);
    expect(missing.body.error.code).toBe("unknown_strip");
    expect(missing.body.error.fields.stripIndex[0]).toMatch(/3 strips/);
    const out = await post(mara, id, 12, ids(first!)).expect(400);
    expect(out.body.error.fields.stripIndex).toBeDefined();
    await post(mara, id, -1, ids(first!)).expect(400);
    expect(folders(id)).toHaveLength(1);
  });

  it("two posts of the same strip at once: one is posted, the other refused, and no image is left behind", async () => {
    const { id } = await threeStripUpload(mara);
    const [first] = inkSets();
    const answers = await Promise.all([post(mara, id, 0, ids(first!)), post(mara, id, 0, ids(first!))]);
    expect(answers.map((r) => r.status).sort()).toEqual([201, 409]);
    expect(folders(id)).toHaveLength(1);
  });

  it("a one-strip photo keeps today's behaviour: no stripIndex needed, the upload's own images", async () => {
    const photo = await severalStripsPhoto([inkSets()[1]!], seed++);
    const { body } = await mara.post("/api/uploads").attach("image", photo.jpeg, "one.jpg").expect(202);
    await t.services.uploads.idle();
    const upload: Upload = (await mara.get(`/api/uploads/${body.id}`)).body;
    expect(upload.analysis!.strips).toHaveLength(1);
    const res = await post(mara, body.id, undefined, ids(inkSets()[1]!)).expect(201);
    const strip: Strip = (await mara.get(`/api/strips/${res.body.id}`)).body;
    expect(strip.stripIndex).toBe(0);
    expect(folders(body.id)).toEqual([]);
    const row = await t.db.selectFrom("strips").select(["display_key", "outline_json"]).where("id", "=", res.body.id).executeTakeFirstOrThrow();
    expect(row.display_key).toBeNull();
    expect(JSON.parse(row.outline_json!)).toEqual(upload.analysis!.strips![0]!.outline);
    const [own, theirs] = await Promise.all([bytes(mara, strip.images.display), bytes(mara, upload.images!.display)]);
    expect(own.equals(theirs)).toBe(true);
  });
});

describe("deleting strips of a several-strip photo", () => {
  it("removes only the strip's own files; the photo goes when no strip and no draft needs it", async () => {
    const { id } = await threeStripUpload(mara);
    const [first, , third] = inkSets();
    const a = (await post(mara, id, 0, ids(first!)).expect(201)).body.id as number;
    const c = (await post(mara, id, 2, ids(third!)).expect(201)).body.id as number;
    const [, folderC] = await Promise.all(
      [a, c].map(async (sid) => (await t.db.selectFrom("strips").select("display_key").where("id", "=", sid).executeTakeFirstOrThrow()).display_key!.split("/")[2]!),
    );
    await mara.delete(`/api/strips/${a}`).expect(204);
    expect(folders(id)).toEqual([folderC]);
    await mara.get(`/api/strips/${c}/images/display`).expect(200);
    await mara.get(`/api/uploads/${id}`).expect(200);

    // The last posted strip goes, but strip 2 was never posted: the photo stays a draft for it…
    await mara.delete(`/api/strips/${c}`).expect(204);
    expect(folders(id)).toEqual([]);
    const draft: Upload = (await mara.get(`/api/uploads/${id}`).expect(200)).body;
    expect(draft.analysis!.strips).toHaveLength(3);
    expect(originals(id)).toHaveLength(1);
    // …until the draft week is over: then the upload, its original and its photo files go.
    await t.services.uploads.cleanupDrafts(new Date(Date.now() + 8 * 24 * 60 * 60 * 1000));
    await mara.get(`/api/uploads/${id}`).expect(404);
    expect(existsSync(path.join(t.config.dataDir, "images", id))).toBe(false);
    expect(originals(id)).toEqual([]);
  });

  it("a one-strip photo goes with its strip, as before", async () => {
    const photo = await severalStripsPhoto([inkSets()[0]!], seed++);
    const { body } = await mara.post("/api/uploads").attach("image", photo.jpeg, "one.jpg").expect(202);
    await t.services.uploads.idle();
    const res = await post(mara, body.id, 0, ids(inkSets()[0]!)).expect(201);
    await mara.delete(`/api/strips/${res.body.id}`).expect(204);
    await mara.get(`/api/uploads/${body.id}`).expect(404);
    expect(existsSync(path.join(t.config.dataDir, "images", body.id))).toBe(false);
    expect(originals(body.id)).toEqual([]);
  });
});

describe("the member's own outline: POST /api/uploads/:id/outline", () => {
  const send = (agent: Agent | ReturnType<typeof request.agent>, id: string, body: unknown) => agent.post(`/api/uploads/${id}/outline`).send(body as object);

  it("only the owner and moderators may; others do not learn the upload exists", async () => {
    const { id } = await threeStripUpload(mara);
    await request(t.app).post(`/api/uploads/${id}/outline`).set("Origin", "http://localhost:3000").send({ stripIndex: 1, outline: null }).expect(401);
    const other = await send(noor, id, { stripIndex: 1, outline: null }).expect(404);
    expect(other.body.error.code).toBe("not_found");
    const byModerator = await send(ivo, id, { stripIndex: 2, outline: null }).expect(200);
    expect(byModerator.body.analysis.strips).toHaveLength(2);
    await send(mara, "00000000-0000-4000-8000-000000000000", { stripIndex: 0, outline: null }).expect(404);
  });

  it("refuses outlines that are not a convex four-cornered shape inside the photo, with a clear message", async () => {
    const { id } = await threeStripUpload(mara);
    const cases: [unknown, RegExp][] = [
      [[[0.1, 0.1], [0.9, 0.1], [0.9, 0.2]], /four corners/],
      [[[0.1, 0.1], [1.5, 0.1], [0.9, 0.2], [0.1, 0.2]], /between 0 and 1/],
      // A "bow tie": p1 and p2 swapped, so two sides cross.
      [[[0.1, 0.1], [0.9, 0.2], [0.9, 0.1], [0.1, 0.2]], /convex/],
      // Counter-clockwise on screen.
      [[[0.1, 0.1], [0.1, 0.2], [0.9, 0.2], [0.9, 0.1]], /clockwise/],
      // A dent: p2 pulled inside the shape.
      [[[0.1, 0.1], [0.9, 0.1], [0.5, 0.12], [0.1, 0.3]], /convex/],
      [[[0.5, 0.5], [0.51, 0.5], [0.51, 0.51], [0.5, 0.51]], /too small/],
      ["corners", /four corners/],
    ];
    for (const [outline, why] of cases) {
      const res = await send(mara, id, { stripIndex: 0, outline }).expect(400);
      expect(res.body.error.code).toBe("invalid_outline");
      expect(res.body.error.message).toMatch(/^The outline is not right: /);
      expect(res.body.error.message).toMatch(why);
    }
    const bad = await send(mara, id, { stripIndex: 1.5, outline: null }).expect(400);
    expect(bad.body.error.message).toMatch(/strip number/);
    await send(mara, id, { stripIndex: 0 }).expect(400);
    await send(mara, id, { stripIndex: 0, outline: null, extra: 1 }).expect(400);
    const unchanged: Upload = (await mara.get(`/api/uploads/${id}`)).body;
    expect(unchanged.analysis!.strips).toHaveLength(3);
  });

  it("removes a strip and renumbers the rest (posted strips too); refuses to change a posted strip or remove the last one", async () => {
    const { id, readings } = await threeStripUpload(mara);
    const third = inkSets()[2]!;
    const postedRes = (await post(mara, id, 2, ids(third)).expect(201)).body as { id: number; status: string };
    const posted = postedRes.id;

    const locked = await send(mara, id, { stripIndex: 2, outline: readings[2]!.outline }).expect(409);
    expect(locked.body.error.message).toBe("Strip 3 is already posted, so its outline cannot change. Delete the posted strip first if it is wrong.");
    await send(mara, id, { stripIndex: 2, outline: null }).expect(409);

    const after: Upload = (await send(mara, id, { stripIndex: 0, outline: null }).expect(200)).body;
    const strips = after.analysis!.strips!;
    expect(strips.map((s) => s.index)).toEqual([0, 1]);
    expect(strips.map((s) => s.outline)).toEqual([readings[1]!.outline, readings[2]!.outline]);
    // The one-strip fields follow the new strip 0 (two bands, from the Riptide–Buoy Orange strip).
    expect(after.analysis!.bands).toEqual(readings[1]!.bands);
    expect(after.analysis!.strip!.start.y).toBeCloseTo(0.5, 2);
    // The posted strip is now strip 1 of the photo.
    expect((await mara.get(`/api/strips/${posted}`)).body.stripIndex).toBe(1);
    expect(after.posted).toEqual([{ stripIndex: 1, stripId: posted, status: postedRes.status }]);
    const repost = await post(mara, id, 1, ids(third)).expect(409);
    expect(repost.body.error.code).toBe("already_posted");

    await send(mara, id, { stripIndex: 0, outline: null }).expect(200);
    const last = await send(mara, id, { stripIndex: 0, outline: null }).expect(409);
    expect(last.body.error.code).toBe("already_posted");
    const extra = await send(mara, id, { stripIndex: 3, outline: readings[0]!.outline }).expect(422);
    expect(extra.body.error.fields.stripIndex[0]).toMatch(/0 \(its one strip\), or 1 to add a strip/);
  });

  it("the only strip of a photo cannot be removed: the member is told why", async () => {
    const photo = await severalStripsPhoto([inkSets()[1]!], seed++);
    const { body } = await mara.post("/api/uploads").attach("image", photo.jpeg, "one.jpg").expect(202);
    await t.services.uploads.idle();
    const res = await send(mara, body.id, { stripIndex: 0, outline: null }).expect(409);
    expect(res.body.error.code).toBe("last_strip");
    expect(res.body.error.message).toMatch(/only strip/);
  });

  it("a photo with posted strips is not analysed again with a new white point", async () => {
    const { id } = await threeStripUpload(mara);
    await post(mara, id, 0, ids(inkSets()[0]!)).expect(201);
    const res = await mara.post(`/api/uploads/${id}/analysis`).send({ white: { x: 0.02, y: 0.02 } }).expect(409);
    expect(res.body.error.code).toBe("already_posted");
  });
});

// These need the analysis to read a strip exactly at a given outline (AnalyzeOptions.outlines,
// the lead's part of issue 11); until then the analysis finds the strip itself.
describe("reading a strip again at the member's outline", () => {
  const send = (agent: Agent, id: string, body: unknown) => agent.post(`/api/uploads/${id}/outline`).send(body as object);

  it("a dragged outline is read there; adding a strip reads the new one; the rest stay as they were", async () => {
    const photo = await severalStripsPhoto(inkSets(), seed++);
    const { body } = await mara.post("/api/uploads").attach("image", photo.jpeg, "three.jpg").expect(202);
    await t.services.uploads.idle();
    // Whatever the analysis found, put strip 0 where strip 3 (four inks) truly is.
    const moved: Upload = (await send(mara, body.id, { stripIndex: 0, outline: photo.outlines[2] }).expect(200)).body;
    const first = moved.analysis!.strips![0]!;
    expectSameOutline(first.outline, photo.outlines[2]!);
    expect(first.bands).toHaveLength(4);
    expect(moved.analysis!.bands).toHaveLength(4);
    first.bands.forEach((b, k) => expect(deltaE2000(b.lab, inkSets()[2]![k]!.lab)).toBeLessThan(3));

    const count = moved.analysis!.strips!.length;
    const added: Upload = (await send(mara, body.id, { stripIndex: count, outline: photo.outlines[1] }).expect(200)).body;
    const strips = added.analysis!.strips! as StripReading[];
    expect(strips).toHaveLength(count + 1);
    expect(strips[count]!.index).toBe(count);
    expectSameOutline(strips[count]!.outline, photo.outlines[1]!);
    expect(strips[count]!.bands).toHaveLength(2);
    expect(strips[0]).toEqual(first);
  });
});
