import { existsSync, readdirSync } from "node:fs";
import path from "node:path";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Ink } from "../../shared/schemas/inks";
import type { Strip } from "../../shared/schemas/strips";
import { createTestApp, DEMO, signedIn, type TestApp } from "../setup/test-app";
import { stripPhoto, variedStripPhoto } from "../setup/strip-photo";

type Agent = ReturnType<TestApp["client"]>;
let t: TestApp;
let inks: Ink[];
let mara: Agent;
let noor: Agent;
let ivo: Agent;
let photos = 0;

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

/** A fresh, different photo each time (the same photo twice would be held as a duplicate). */
async function readyUpload(agent: Agent) {
  const { jpeg } = await variedStripPhoto(photos++, [ink("Deep Sounding"), ink("Gorse Bloom"), ink("Garnet Vein")]);
  const { body } = await agent.post("/api/uploads").attach("image", jpeg, "strip.jpg").expect(202);
  await t.services.uploads.idle();
  const upload = (await agent.get(`/api/uploads/${body.id}`).expect(200)).body;
  expect(upload.status).toBe("ready");
  return upload.id as string;
}

const post = (agent: Agent, uploadId: string, extra: Record<string, unknown> = {}) =>
  agent.post("/api/strips").send({
    uploadId,
    title: "Harbour night to gorse",
    notes: "Blended on a damp day.",
    paper: "smooth-cardstock",
    tools: ["blending-brush"],
    inks: [ink("Deep Sounding").id, ink("Gorse Bloom").id, ink("Garnet Vein").id],
    ...extra,
  });

const stripCount = async () => Number((await t.db.selectFrom("strips").select((eb) => eb.fn.countAll().as("n")).executeTakeFirstOrThrow()).n);

describe("posting a strip", () => {
  it("a trusted member's strip is published at once and shows in the gallery to visitors", async () => {
    const res = await post(mara, await readyUpload(mara)).expect(201);
    expect(res.body.status).toBe("published");
    const list = await request(t.app).get("/api/strips").expect(200);
    const item: Strip = list.body.items.find((s: Strip) => s.id === res.body.id);
    expect(item).toBeDefined();
    expect(item.inks.map((i) => i.name)).toEqual(["Deep Sounding", "Gorse Bloom", "Garnet Vein"]);
    expect(item.author.name).toBe("Mara Fenholt");
    expect(item.bands).toHaveLength(3);
    // Each band is tagged with the posted ink it is nearest to, in order.
    expect(item.bands.map((b) => b.inkId)).toEqual(item.inks.map((i) => i.id));
    expect(item.bands.every((b) => (b.deltaE ?? 99) < 3)).toBe(true);
    expect(item.images.display).toBe(`/api/strips/${item.id}/images/display`);
    const img = await request(t.app).get(item.images.thumb).expect(200);
    expect(img.headers["content-type"]).toBe("image/webp");
    expect(img.headers["cache-control"]).toMatch(/public/);
  });

  it("the same photo posted again is held for review as a possible duplicate, even from a trusted member", async () => {
    const { jpeg } = await stripPhoto([ink("Deep Sounding"), ink("Gorse Bloom"), ink("Garnet Vein")], { seed: 999, tiltDeg: -7 });
    const first = (await mara.post("/api/uploads").attach("image", jpeg, "a.jpg").expect(202)).body.id;
    const again = (await mara.post("/api/uploads").attach("image", jpeg, "b.jpg").expect(202)).body.id;
    await t.services.uploads.idle();
    const original = await post(mara, first).expect(201);
    expect(original.body.status).toBe("published");
    const copy = await post(mara, again).expect(201);
    expect(copy.body.status).toBe("pending");
    const row = await t.db.selectFrom("strips").select(["hold", "duplicate_of"]).where("id", "=", copy.body.id).executeTakeFirstOrThrow();
    expect(row).toEqual({ hold: "duplicate", duplicate_of: original.body.id });
  });

  it("a new member's strip waits for review: only the author and moderators can see it or its photo", async () => {
    const res = await post(noor, await readyUpload(noor)).expect(201);
    expect(res.body.status).toBe("pending");
    const id = res.body.id;
    const visitorList = (await request(t.app).get("/api/strips?limit=50")).body.items.map((s: Strip) => s.id);
    expect(visitorList).not.toContain(id);
    await request(t.app).get(`/api/strips/${id}`).expect(404);
    await request(t.app).get(`/api/strips/${id}/images/display`).expect(404);
    await mara.get(`/api/strips/${id}`).expect(404);
    await mara.get(`/api/strips/${id}/images/thumb`).expect(404);
    expect((await noor.get(`/api/strips/${id}`).expect(200)).body.status).toBe("pending");
    const own = await noor.get(`/api/strips/${id}/images/display`).expect(200);
    expect(own.headers["cache-control"]).toMatch(/private/);
    await ivo.get(`/api/strips/${id}`).expect(200);

    const noorId = (await noor.get("/api/me")).body.id;
    const ownPage = (await noor.get(`/api/members/${noorId}`).expect(200)).body;
    expect(ownPage.strips.map((s: Strip) => s.id)).toContain(id);
    const publicPage = (await request(t.app).get(`/api/members/${noorId}`).expect(200)).body;
    expect(publicPage.strips.map((s: Strip) => s.id)).not.toContain(id);
  });

  it("cleans notes: no scripts, event handlers or javascript: links survive", async () => {
    const notes = '<p onclick="steal()">Soft <b>blend</b> <script>alert(1)</script><a href="javascript:alert(2)">x</a> <a href="https://example.org/how">how</a></p><img src=x onerror=alert(3)>';
    const res = await post(mara, await readyUpload(mara), { notes }).expect(201);
    const strip = (await request(t.app).get(`/api/strips/${res.body.id}`).expect(200)).body;
    expect(strip.notes).not.toMatch(/script|onclick|onerror|javascript:|<img/i);
    expect(strip.notes).toContain("<strong>blend</strong>");
    expect(strip.notes).toContain('href="https://example.org/how"');
    expect(strip.notes).toMatch(/rel="nofollow ugc noopener noreferrer"/);
  });

  it("turns plain-text notes into paragraphs", async () => {
    const res = await post(mara, await readyUpload(mara), { notes: "First pass light.\n\nSecond pass <darker>." }).expect(201);
    const strip = (await request(t.app).get(`/api/strips/${res.body.id}`)).body;
    expect(strip.notes).toBe("<p>First pass light.</p><p>Second pass &lt;darker&gt;.</p>");
  });
});

describe("posting refuses bad input and saves nothing", () => {
  it("a second submit of the same upload is a 409", async () => {
    const uploadId = await readyUpload(mara);
    await post(mara, uploadId).expect(201);
    const before = await stripCount();
    const res = await post(mara, uploadId).expect(409);
    expect(res.body.error.code).toBe("already_posted");
    expect(await stripCount()).toBe(before);
  });

  it("someone else's upload is refused", async () => {
    const uploadId = await readyUpload(mara);
    const res = await post(noor, uploadId).expect(422);
    expect(res.body.error.fields.uploadId).toBeDefined();
  });

  it("unknown inks, repeated inks, missing inks", async () => {
    const uploadId = await readyUpload(mara);
    const before = await stripCount();
    const unknown = await post(mara, uploadId, { inks: [ink("Deep Sounding").id, 987654] }).expect(422);
    expect(unknown.body.error.fields.inks[0]).toMatch(/987654/);
    await post(mara, uploadId, { inks: [ink("Deep Sounding").id, ink("Deep Sounding").id] }).expect(400);
    await post(mara, uploadId, { inks: [] }).expect(400);
    expect(await stripCount()).toBe(before);
    // the upload is still free to post properly
    await post(mara, uploadId).expect(201);
  });

  it("a title too long, a javascript: video link, an unknown paper", async () => {
    const uploadId = await readyUpload(mara);
    const res = await post(mara, uploadId, { title: "x".repeat(101), videoUrl: "javascript:alert(1)", paper: "papyrus" }).expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["paper", "title", "videoUrl"]);
  });

  it("an upload that failed or is unknown", async () => {
    await post(mara, "00000000-0000-4000-8000-000000000000").expect(422);
    const me = (await mara.get("/api/me")).body;
    const now = new Date().toISOString();
    await t.db.insertInto("uploads").values({ id: "33333333-3333-4333-8333-333333333333", owner_id: me.id, status: "failed", original_key: null, mime: "image/jpeg", byte_size: 1, white_x: null, white_y: null, error_code: "no_ink", error_message: "No strip", created_at: now, updated_at: now }).execute();
    const res = await post(mara, "33333333-3333-4333-8333-333333333333").expect(422);
    expect(res.body.error.code).toBe("upload_not_ready");
  });

  it("a suspended member cannot post", async () => {
    const uploadId = await readyUpload(noor);
    const noorId = (await noor.get("/api/me")).body.id;
    await t.db.updateTable("profiles").set({ suspended_until: new Date(Date.now() + 86_400_000).toISOString() }).where("user_id", "=", noorId).execute();
    try {
      const res = await post(noor, uploadId).expect(403);
      expect(res.body.error.code).toBe("suspended");
    } finally {
      await t.db.updateTable("profiles").set({ suspended_until: null }).where("user_id", "=", noorId).execute();
    }
  });
});

describe("editing and deleting", () => {
  it("a non-trusted author's edit of a published strip goes back to review; a trusted author's stays published", async () => {
    const { body } = await post(noor, await readyUpload(noor)).expect(201);
    await t.db.updateTable("strips").set({ status: "published", published_at: new Date().toISOString() }).where("id", "=", body.id).execute();
    const edited = await noor.patch(`/api/strips/${body.id}`).send({ title: "Harbour night, second try" }).expect(200);
    expect(edited.body.status).toBe("pending");
    await request(t.app).get(`/api/strips/${body.id}`).expect(404);

    const mine = await post(mara, await readyUpload(mara)).expect(201);
    const kept = await mara.patch(`/api/strips/${mine.body.id}`).send({ inks: [ink("Garnet Vein").id, ink("Deep Sounding").id] }).expect(200);
    expect(kept.body.status).toBe("published");
    expect(kept.body.inks.map((i: { name: string }) => i.name)).toEqual(["Garnet Vein", "Deep Sounding"]);
    expect(kept.body.version).toBe(2);
  });

  it("a stale version is refused; others cannot edit; a returned strip is resubmitted", async () => {
    const { body } = await post(mara, await readyUpload(mara)).expect(201);
    await mara.patch(`/api/strips/${body.id}`).send({ title: "New title", expectedVersion: 1 }).expect(200);
    const stale = await mara.patch(`/api/strips/${body.id}`).send({ title: "Late title", expectedVersion: 1 }).expect(409);
    expect(stale.body.error.code).toBe("stale_version");
    await noor.patch(`/api/strips/${body.id}`).send({ title: "Not mine" }).expect(403);
    await t.db.updateTable("strips").set({ status: "returned", status_reason: "Please name the middle ink" }).where("id", "=", body.id).execute();
    const resubmitted = await mara.patch(`/api/strips/${body.id}`).send({ title: "Fixed the middle ink" }).expect(200);
    expect(resubmitted.body.status).toBe("pending");
    expect(resubmitted.body.statusReason).toBeNull();
  });

  it("the author deletes a strip and its files go too", async () => {
    const uploadId = await readyUpload(mara);
    const { body } = await post(mara, uploadId).expect(201);
    const folder = path.join(t.config.dataDir, "images", uploadId);
    expect(existsSync(folder)).toBe(true);
    await noor.delete(`/api/strips/${body.id}`).expect(403);
    await mara.delete(`/api/strips/${body.id}`).expect(204);
    await request(t.app).get(`/api/strips/${body.id}`).expect(404);
    expect(existsSync(folder)).toBe(false);
    expect(readdirSync(path.join(t.config.dataDir, "originals")).some((f) => f.startsWith(uploadId))).toBe(false);
  });
});

describe("the gallery list", () => {
  it("pages with a cursor, filters by ink, sorts by saves, and refuses a bad cursor", async () => {
    const first = await request(t.app).get("/api/strips?limit=2").expect(200);
    expect(first.body.items).toHaveLength(2);
    expect(first.body.nextCursor).toBeTruthy();
    const second = await request(t.app).get(`/api/strips?limit=2&cursor=${first.body.nextCursor}`).expect(200);
    const ids = [...first.body.items, ...second.body.items].map((s: Strip) => s.id);
    expect(new Set(ids).size).toBe(ids.length);

    const withInk = await request(t.app).get(`/api/strips?ink=${ink("Gorse Bloom").id}&limit=50`).expect(200);
    expect(withInk.body.items.length).toBeGreaterThan(0);
    for (const s of withInk.body.items as Strip[]) expect(s.inks.map((i) => i.id)).toContain(ink("Gorse Bloom").id);
    const both = await request(t.app).get(`/api/strips?ink=${ink("Gorse Bloom").id}&ink=${ink("Garnet Vein").id}&limit=50`).expect(200);
    for (const s of both.body.items as Strip[]) expect(s.inks.map((i) => i.name)).toEqual(expect.arrayContaining(["Gorse Bloom", "Garnet Vein"]));

    const target = first.body.items[1] as Strip;
    await t.db.updateTable("strips").set({ saves: 42 }).where("id", "=", target.id).execute();
    const bySaves = await request(t.app).get("/api/strips?sort=saves&limit=1").expect(200);
    expect(bySaves.body.items[0].id).toBe(target.id);
    expect(bySaves.body.items[0].saves).toBe(42);

    await request(t.app).get("/api/strips?cursor=not-a-cursor").expect(400);
    await request(t.app).get(`/api/strips?sort=saves&cursor=${first.body.nextCursor}`).expect(400);
    await request(t.app).get(`/api/strips?cursor=${"x".repeat(500)}`).expect(400);
    await request(t.app).get("/api/strips?limit=5000").expect(400);
  });

  it("lists strips sharing inks with a strip as related", async () => {
    const list = (await request(t.app).get("/api/strips?limit=5")).body.items as Strip[];
    const related = await request(t.app).get(`/api/strips/${list[0]!.id}/related`).expect(200);
    expect(related.body.items.length).toBeGreaterThan(0);
    for (const s of related.body.items as Strip[]) {
      expect(s.status).toBe("published");
      expect(s.inks.some((i) => list[0]!.inks.some((j) => j.id === i.id))).toBe(true);
    }
  });
});

describe("drafts", () => {
  it("an analysed photo never posted is removed with its files after 7 days; posted ones stay", async () => {
    const draft = await readyUpload(mara);
    const postedUpload = await readyUpload(mara);
    await post(mara, postedUpload).expect(201);
    const inEightDays = new Date(Date.now() + 8 * 24 * 60 * 60 * 1000);
    expect(await t.services.uploads.cleanupDrafts(new Date())).toBe(0);
    const removed = await t.services.uploads.cleanupDrafts(inEightDays);
    expect(removed).toBeGreaterThanOrEqual(1);
    await mara.get(`/api/uploads/${draft}`).expect(404);
    expect(existsSync(path.join(t.config.dataDir, "images", draft))).toBe(false);
    await mara.get(`/api/uploads/${postedUpload}`).expect(200);
    expect(existsSync(path.join(t.config.dataDir, "images", postedUpload))).toBe(true);
  });
});
