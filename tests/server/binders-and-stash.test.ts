import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Ink } from "../../shared/schemas/inks";
import { createTestApp, DEMO, signedIn, type TestApp } from "../setup/test-app";
import { variedStripPhoto } from "../setup/strip-photo";

type Agent = ReturnType<TestApp["client"]>;
let t: TestApp;
let inks: Ink[];
let mara: Agent;
let noor: Agent;
let ivo: Agent;
const published: number[] = [];
let pending: number;

const ink = (name: string) => inks.find((i) => i.name === name)!;

async function postStrip(agent: Agent, n: number) {
  const chosen = [ink("Deep Sounding"), ink("Gorse Bloom"), ink("Garnet Vein")];
  const { jpeg } = await variedStripPhoto(n, chosen);
  const upload = (await agent.post("/api/uploads").attach("image", jpeg, "strip.jpg").expect(202)).body.id;
  await t.services.uploads.idle();
  return (await agent.post("/api/strips").send({ uploadId: upload, title: `Strip ${n}`, paper: "hot-press", inks: chosen.map((i) => i.id) }).expect(201)).body;
}

beforeAll(async () => {
  t = await createTestApp();
  inks = (await request(t.app).get("/api/inks?pageSize=100")).body.items;
  [mara, noor, ivo] = await Promise.all([DEMO.member, DEMO.newMember, DEMO.moderator].map((e) => signedIn(t, e)));
  for (let n = 0; n < 3; n++) published.push((await postStrip(mara, n)).id);
  pending = (await postStrip(noor, 3)).id;
});
afterAll(() => t.close());

const binderCount = async () => Number((await t.db.selectFrom("binders").select((eb) => eb.fn.countAll().as("n")).executeTakeFirstOrThrow()).n);

describe("binders", () => {
  it("a member saves strips to a new binder, adds notes, reorders them; save counts follow", async () => {
    const binder = (await noor.post("/api/binders").send({ name: "Autumn ideas", visibility: "public" }).expect(201)).body;
    for (const id of published) await noor.post(`/api/binders/${binder.id}/items`).send({ stripId: id }).expect(201);
    await noor.patch(`/api/binders/${binder.id}/items/${published[1]}`).send({ note: "try with a darker end" }).expect(204);
    const reordered = (await noor.put(`/api/binders/${binder.id}/order`).send({ stripIds: [published[2], published[0], published[1]] }).expect(200)).body;
    expect(reordered.items.map((i: { stripId: number }) => i.stripId)).toEqual([published[2], published[0], published[1]]);
    expect(reordered.items[2].note).toBe("try with a darker end");
    const strip = (await request(t.app).get(`/api/strips/${published[0]}`)).body;
    expect(strip.saves).toBe(1);
    // A second binder of the same member does not count twice.
    const other = (await noor.post("/api/binders").send({ name: "Blues" }).expect(201)).body;
    await noor.post(`/api/binders/${other.id}/items`).send({ stripId: published[0] }).expect(201);
    expect((await request(t.app).get(`/api/strips/${published[0]}`)).body.saves).toBe(1);
    expect((await noor.get(`/api/strips/${published[0]}/saved-in`)).body.binderIds.sort()).toEqual([binder.id, other.id].sort());
    // Public binders can be shared; visitors see them.
    const shared = (await request(t.app).get(`/api/binders/${binder.id}`).expect(200)).body;
    expect(shared.isOwner).toBe(false);
    expect(shared.items).toHaveLength(3);
  });

  it("a private binder is a 404 for everyone but its owner, moderators included; nobody else can change it", async () => {
    const binder = (await mara.post("/api/binders").send({ name: "Secret stash plans" }).expect(201)).body;
    expect(binder.visibility).toBe("private");
    await request(t.app).get(`/api/binders/${binder.id}`).expect(404);
    await noor.get(`/api/binders/${binder.id}`).expect(404);
    await ivo.get(`/api/binders/${binder.id}`).expect(404);
    await noor.post(`/api/binders/${binder.id}/items`).send({ stripId: published[0] }).expect(404);
    await noor.patch(`/api/binders/${binder.id}`).send({ name: "Mine now" }).expect(404);
    await noor.delete(`/api/binders/${binder.id}`).expect(404);
    const maraId = (await mara.get("/api/me")).body.id;
    const list = (await request(t.app).get(`/api/members/${maraId}/binders`)).body.items;
    expect(list.map((b: { id: number }) => b.id)).not.toContain(binder.id);
    expect((await mara.get(`/api/binders/${binder.id}`).expect(200)).body.name).toBe("Secret stash plans");
    // The owner sees their own private binders on their profile.
    const own = (await mara.get(`/api/members/${maraId}/binders`).expect(200)).body.items;
    expect(own.map((b: { id: number }) => b.id)).toContain(binder.id);
  });

  it("a strip hidden later disappears for others but stays listed for the owner as no longer available", async () => {
    const binder = (await noor.post("/api/binders").send({ name: "Watch list", visibility: "public" }).expect(201)).body;
    await noor.post(`/api/binders/${binder.id}/items`).send({ stripId: published[2] }).expect(201);
    const strip = (await ivo.get(`/api/strips/${published[2]}`)).body;
    await ivo.post(`/api/strips/${published[2]}/decisions`).send({ action: "hide", reason: "offensive", expectedVersion: strip.version }).expect(200);
    const visitor = (await request(t.app).get(`/api/binders/${binder.id}`)).body;
    expect(visitor.items).toHaveLength(0);
    const owner = (await noor.get(`/api/binders/${binder.id}`)).body;
    expect(owner.items).toEqual([expect.objectContaining({ stripId: published[2], available: false, strip: null })]);
    await ivo.post(`/api/strips/${published[2]}/decisions`).send({ action: "restore", reason: "hidden by mistake", expectedVersion: strip.version + 1 }).expect(200);
  });

  it("refuses unpublished strips, duplicate saves, long names, HTML names kept as text, bad orders", async () => {
    const binder = (await mara.post("/api/binders").send({ name: "<b>Bold</b> binder", visibility: "public" }).expect(201)).body;
    expect(binder.name).toBe("<b>Bold</b> binder");
    await mara.post(`/api/binders/${binder.id}/items`).send({ stripId: pending }).expect(422);
    await mara.post(`/api/binders/${binder.id}/items`).send({ stripId: 999999 }).expect(422);
    await mara.post(`/api/binders/${binder.id}/items`).send({ stripId: published[0] }).expect(201);
    expect((await mara.post(`/api/binders/${binder.id}/items`).send({ stripId: published[0] }).expect(409)).body.error.code).toBe("already_saved");
    const before = await binderCount();
    await mara.post("/api/binders").send({ name: "x".repeat(5000) }).expect(400);
    await mara.post("/api/binders").send({ name: "Fine", visibility: "secret" }).expect(400);
    expect(await binderCount()).toBe(before);
    const many = Array.from({ length: 10_000 }, (_, i) => i + 1);
    await mara.put(`/api/binders/${binder.id}/order`).send({ stripIds: many }).expect(400);
    await mara.put(`/api/binders/${binder.id}/order`).send({ stripIds: [published[1]] }).expect(422);
  });
});

describe("the stash", () => {
  it("a member adds inks, marks one running low, removes one; others never see it", async () => {
    await noor.post("/api/stash/items").send({ inkId: ink("Gorse Bloom").id }).expect(201);
    await noor.post("/api/stash/items").send({ inkId: ink("Deep Sounding").id }).expect(201);
    await noor.patch(`/api/stash/items/${ink("Gorse Bloom").id}`).send({ runningLow: true }).expect(200);
    await noor.delete(`/api/stash/items/${ink("Deep Sounding").id}`).expect(204);
    const items = (await noor.get("/api/stash").expect(200)).body.items;
    expect(items).toEqual([expect.objectContaining({ runningLow: true, ink: expect.objectContaining({ name: "Gorse Bloom" }) })]);
    expect((await mara.get("/api/stash")).body.items).toEqual([]);
    await request(t.app).get("/api/stash").expect(401);
    await noor.post("/api/stash/items").send({ inkId: 999999 }).expect(422);
  });

  it("replaces the whole stash at once, refusing unknown or repeated inks without changing anything", async () => {
    const ids = [ink("Garnet Vein").id, ink("Deep Sounding").id];
    await mara.put("/api/stash").send({ items: ids.map((inkId) => ({ inkId })) }).expect(200);
    await mara.put("/api/stash").send({ items: [{ inkId: ids[0] }, { inkId: 999999 }] }).expect(422);
    await mara.put("/api/stash").send({ items: [{ inkId: ids[0] }, { inkId: ids[0] }] }).expect(400);
    expect((await mara.get("/api/stash")).body.items.map((i: { ink: Ink }) => i.ink.id).sort()).toEqual([...ids].sort());
  });

  it("previews a CSV import: matched, ambiguous and unmatched rows, and saves nothing", async () => {
    const before = (await noor.get("/api/stash")).body.items.length;
    const first = inks[0]!;
    const csv = [
      "brand,name,running_low",
      `${first.brand.name},${first.name},yes`,
      `,${ink("Garnet Vein").name},`,
      "Nobody's Inks,Imaginary Teal,no",
    ].join("\n");
    const res = await noor.post("/api/stash/import").attach("file", Buffer.from(csv), "stash.csv").expect(200);
    expect(res.body.rows.map((r: { status: string }) => r.status)).toEqual(["matched", "matched", "unmatched"]);
    expect(res.body.rows[0]).toMatchObject({ line: 2, runningLow: true, ink: { id: first.id } });
    expect((await noor.get("/api/stash")).body.items.length).toBe(before);
    await noor.post("/api/stash/import").attach("file", Buffer.from([0x89, 0x50, 0x4e, 0x47, 0, 0, 0]), "stash.csv").expect(422);
    await noor.post("/api/stash/import").attach("file", Buffer.from("colour,shade\nred,dark\n"), "stash.csv").expect(422);
  });

  it("calls a name shared by two brands ambiguous when no brand is given", async () => {
    const brands = (await request(t.app).get("/api/brands")).body;
    const mod = await signedIn(t, DEMO.moderator);
    await mod.post("/api/inks").send({ name: "Twin Name", brandId: brands[0].id, type: "dye", hex: "#336699" }).expect(201);
    await mod.post("/api/inks").send({ name: "Twin Name", brandId: brands[1].id, type: "dye", hex: "#336698" }).expect(201);
    const res = await noor.post("/api/stash/import").attach("file", Buffer.from("brand,name\n,Twin Name\n"), "stash.csv").expect(200);
    expect(res.body.rows[0].status).toBe("ambiguous");
    expect(res.body.rows[0].candidates).toHaveLength(2);
  });

  it("exports the stash as CSV in our column layout", async () => {
    const res = await mara.get("/api/stash/export").expect(200);
    expect(res.headers["content-type"]).toMatch(/text\/csv/);
    const lines = res.text.trim().split("\n");
    expect(lines[0]).toBe("brand,name,running_low");
    expect(lines.slice(1).map((l) => l.split(",")[1]).sort()).toEqual(["Deep Sounding", "Garnet Vein"]);
  });
});
