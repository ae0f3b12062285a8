import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { deltaE2000 } from "../../shared/colour";
import { createTestApp, DEMO, signedIn, type TestApp } from "../setup/test-app";

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

const inkCount = async () => (await t.client().get("/api/inks?pageSize=1")).body.total as number;

describe("the ink catalogue for everyone", () => {
  it("lists inks a page at a time with brand, type, hex and L*a*b*", async () => {
    const res = await request(t.app).get("/api/inks?pageSize=10&page=2").expect(200);
    expect(res.body.items).toHaveLength(10);
    expect(res.body.total).toBeGreaterThanOrEqual(80);
    expect(res.body.page).toBe(2);
    for (const ink of res.body.items) {
      expect(ink.hex).toMatch(/^#[0-9a-f]{6}$/);
      expect(ink.brand.slug).toMatch(/^[a-z0-9-]+$/);
      expect(["dye", "pigment", "hybrid"]).toContain(ink.type);
    }
  });

  it("searches by name and filters by brand and type", async () => {
    const all = (await request(t.app).get("/api/inks?pageSize=100")).body.items;
    const sample = all[3];
    const word = sample.name.split(" ")[0];
    const byName = await request(t.app).get(`/api/inks?q=${encodeURIComponent(word)}&pageSize=100`).expect(200);
    expect(byName.body.items.length).toBeGreaterThan(0);
    for (const ink of byName.body.items) {
      expect(`${ink.name} ${ink.brand.name}`.toLowerCase()).toContain(word.toLowerCase());
    }
    const filtered = await request(t.app).get(`/api/inks?brand=${sample.brand.slug}&type=${sample.type}&pageSize=100`).expect(200);
    expect(filtered.body.items.length).toBeGreaterThan(0);
    for (const ink of filtered.body.items) {
      expect(ink.brand.slug).toBe(sample.brand.slug);
      expect(ink.type).toBe(sample.type);
    }
  });

  it("treats LIKE wildcards in a search as plain characters", async () => {
    const res = await request(t.app).get("/api/inks?q=%25").expect(200);
    expect(res.body.total).toBe(0);
  });

  it("separates discontinued inks on request", async () => {
    const only = (await request(t.app).get("/api/inks?discontinued=only&pageSize=100")).body;
    const exclude = (await request(t.app).get("/api/inks?discontinued=exclude&pageSize=100")).body;
    expect(only.total).toBeGreaterThan(0);
    expect(only.items.every((i: { discontinued: boolean }) => i.discontinued)).toBe(true);
    expect(exclude.items.every((i: { discontinued: boolean }) => !i.discontinued)).toBe(true);
    expect(only.total + exclude.total).toBe(await inkCount());
  });

  it("shows one ink, and 404 for unknown or malformed ids", async () => {
    const first = (await request(t.app).get("/api/inks?pageSize=1")).body.items[0];
    const res = await request(t.app).get(`/api/inks/${first.id}`).expect(200);
    expect(res.body).toEqual(first);
    await request(t.app).get("/api/inks/999999").expect(404);
    await request(t.app).get("/api/inks/not-a-number").expect(404);
  });

  it("rejects bad queries with 400", async () => {
    await request(t.app).get("/api/inks?type=oil").expect(400);
    await request(t.app).get("/api/inks?pageSize=1000").expect(400);
    await request(t.app).get("/api/inks?type=dye&type=pigment").expect(400);
  });

  it("stores each demo ink's L*a*b* consistent with its hex", async () => {
    const { items } = (await request(t.app).get("/api/inks?pageSize=100")).body;
    const { hexToLab } = await import("../../shared/colour");
    for (const ink of items) expect(deltaE2000(ink.lab, hexToLab(ink.hex))).toBeLessThan(0.05);
  });
});

describe("curating the catalogue", () => {
  const newInk = (brandId: number, name = "Harbour Fog") => ({ name, brandId, type: "dye", hex: "#8fa3ad" });

  it("a visitor gets 401 and a member 403 when adding an ink; nothing is written", async () => {
    const before = await inkCount();
    const brandId = (await request(t.app).get("/api/brands")).body[0].id;
    await t.client().post("/api/inks").send(newInk(brandId)).expect(401);
    const member = await signedIn(t, DEMO.member);
    await member.post("/api/inks").send(newInk(brandId)).expect(403);
    expect(await inkCount()).toBe(before);
  });

  it("a moderator adds an ink from hex and gets its L*a*b*; a second with the same name is a 409", async () => {
    const mod = await signedIn(t, DEMO.moderator);
    const brandId = (await request(t.app).get("/api/brands")).body[0].id;
    const res = await mod.post("/api/inks").send(newInk(brandId, "Quayside Mist")).expect(201);
    expect(res.body).toMatchObject({ name: "Quayside Mist", hex: "#8fa3ad", discontinued: false });
    expect(res.body.lab.l).toBeGreaterThan(60);
    const dup = await mod.post("/api/inks").send(newInk(brandId, "quayside mist")).expect(409);
    expect(dup.body.error.fields.name).toBeDefined();
  });

  it("L*a*b* alone is the measurement and gives the hex; a hex that disagrees is refused", async () => {
    const mod = await signedIn(t, DEMO.moderator);
    const brandId = (await request(t.app).get("/api/brands")).body[1].id;
    // D65 white in CIELAB is L*=100, a*=b*=0 (CIE 15:2004), which is sRGB #ffffff.
    const white = await mod.post("/api/inks").send({ name: "Paper Ghost", brandId, type: "pigment", lab: { l: 100, a: 0, b: 0 } }).expect(201);
    expect(white.body.hex).toBe("#ffffff");
    const clash = await mod
      .post("/api/inks")
      .send({ name: "Confused", brandId, type: "dye", hex: "#000000", lab: { l: 100, a: 0, b: 0 } })
      .expect(422);
    expect(clash.body.error.code).toBe("colour_mismatch");
  });

  it("rejects unknown brands and bad fields", async () => {
    const mod = await signedIn(t, DEMO.moderator);
    await mod.post("/api/inks").send(newInk(999999, "Nowhere Blue")).expect(422);
    const bad = await mod.post("/api/inks").send({ name: "", brandId: "x", type: "oil", hex: "blue" }).expect(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["brandId", "hex", "name", "type"]);
  });

  it("a moderator edits an ink; the edit shows to everyone", async () => {
    const mod = await signedIn(t, DEMO.moderator);
    const ink = (await request(t.app).get("/api/inks?pageSize=1&page=7")).body.items[0];
    const res = await mod.patch(`/api/inks/${ink.id}`).send({ discontinued: true, hex: "#445566" }).expect(200);
    expect(res.body).toMatchObject({ id: ink.id, discontinued: true, hex: "#445566" });
    const seen = await request(t.app).get(`/api/inks/${ink.id}`).expect(200);
    expect(seen.body.hex).toBe("#445566");
    await mod.patch(`/api/inks/${ink.id}`).send({}).expect(400);
    await mod.patch("/api/inks/999999").send({ discontinued: false }).expect(404);
  });

  it("a moderator adds a brand; its slug is made from the name", async () => {
    const mod = await signedIn(t, DEMO.moderator);
    const res = await mod.post("/api/brands").send({ name: "Saltmarsh & Reed" }).expect(201);
    expect(res.body).toMatchObject({ name: "Saltmarsh & Reed", slug: "saltmarsh-and-reed", inkCount: 0 });
    await mod.post("/api/brands").send({ name: "saltmarsh & reed" }).expect(409);
  });
});

describe("importing a catalogue CSV (admins)", () => {
  const csv = (...lines: string[]) => Buffer.from(lines.join("\n") + "\n");
  const upload = (agent: ReturnType<TestApp["client"]>, buf: Buffer, name = "catalogue.csv") =>
    agent.post("/api/inks/import").attach("file", buf, { filename: name, contentType: "text/csv" });

  it("imports good rows: new brands and inks created, known inks updated", async () => {
    const admin = await signedIn(t, DEMO.admin);
    const before = await inkCount();
    const res = await upload(
      admin,
      csv(
        "brand,name,type,hex,l,a,b,discontinued",
        "Fernlight Studio,Morning Frost,dye,#dfe8ee,,,,no",
        'Fernlight Studio,"Bramble, Late",pigment,,32.5,28.1,-10.4,',
        "Fernlight Studio,Old Brick,hybrid,#9a4a3a,,,,yes",
      ),
    ).expect(200);
    expect(res.body).toEqual({ created: 3, updated: 0, brandsCreated: 1 });
    expect(await inkCount()).toBe(before + 3);

    const again = await upload(admin, csv("brand,name,type,hex", "fernlight studio,MORNING FROST,dye,#e0e9ef")).expect(200);
    expect(again.body).toEqual({ created: 0, updated: 1, brandsCreated: 0 });
    const found = (await request(t.app).get("/api/inks?q=Morning%20Frost")).body.items;
    expect(found).toHaveLength(1);
    expect(found[0].hex).toBe("#e0e9ef");
  });

  it("reports every bad row by line number and imports nothing", async () => {
    const admin = await signedIn(t, DEMO.admin);
    const before = await inkCount();
    const res = await upload(
      admin,
      csv(
        "brand,name,type,hex,l,a,b,discontinued",
        "Fernlight Studio,Fine One,dye,#112233,,,,",
        "Fernlight Studio,Bad Type,oil,#112233,,,,",
        "Fernlight Studio,No Colour,dye,,,,,",
        "Fernlight Studio,Half Lab,dye,,50,10,,",
        "Fernlight Studio,Fine One,dye,#112244,,,,",
        "Fernlight Studio,Maybe,dye,#112233,,,,perhaps",
      ),
    ).expect(422);
    expect(res.body.error.code).toBe("csv_invalid");
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["line 3", "line 4", "line 5", "line 6", "line 7"]);
    expect(res.body.error.fields["line 6"][0]).toMatch(/line 2/);
    expect(await inkCount()).toBe(before);
  });

  it("refuses a header it does not know, a file that is not text, and a missing file", async () => {
    const admin = await signedIn(t, DEMO.admin);
    const header = await upload(admin, csv("maker,ink,colour", "A,B,#000000")).expect(422);
    expect(header.body.error.fields["line 1"].join(" ")).toMatch(/unknown column "maker"/);
    const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
    const binary = await upload(admin, png, "catalogue.csv").expect(422);
    expect(binary.body.error.message).toMatch(/not a CSV/);
    await admin.post("/api/inks/import").field("note", "no file").expect(400);
    await upload(admin, Buffer.alloc(0)).expect(422);
  });

  it("refuses an unbalanced quote with the line it is on", async () => {
    const admin = await signedIn(t, DEMO.admin);
    const res = await upload(admin, csv("brand,name,type,hex", "Fernlight Studio,Fine,dye,#112233", 'Fernlight Studio,"Open quote,dye,#112233')).expect(422);
    expect(Object.keys(res.body.error.fields)[0]).toMatch(/^line \d+$/);
  });

  it("refuses files over 2 MB with 413", async () => {
    const admin = await signedIn(t, DEMO.admin);
    const big = Buffer.alloc(2 * 1024 * 1024 + 10, "a");
    await upload(admin, big).expect(413);
  });

  it("is for admins only", async () => {
    const mod = await signedIn(t, DEMO.moderator);
    await upload(mod, csv("brand,name,type,hex", "X Co,Y,dye,#000000")).expect(403);
    await upload(t.client(), csv("brand,name,type,hex", "X Co,Y,dye,#000000")).expect(401);
  });
});
