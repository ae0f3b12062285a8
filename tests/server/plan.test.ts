// The bridge finder over HTTP (GET /api/bridges) on the real app with the demo catalogue. Each
// answer is checked against the rules it must keep (ends included, no muddy step, best first,
// options honoured) and against brute-force enumeration over the same catalogue.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { deltaE2000, type Lab } from "../../shared/colour";
import { joinFacts } from "../../shared/colour/joins";
import type { BridgeList } from "../../shared/schemas/plan";
import { bruteForceBridges, buildJoinMatrix } from "../../server/modules/plan/bridge-search";
import { createTestApp, DEMO, signedIn, type TestApp } from "../setup/test-app";

type Row = { id: number; name: string; brand_id: number; brand: string; lab: Lab; discontinued: number };

let t: TestApp;
let inks: Row[];
const byName = (name: string) => inks.find((i) => i.name === name)!;

beforeAll(async () => {
  t = await createTestApp();
  inks = (
    await t.db
      .selectFrom("inks as i")
      .innerJoin("brands as b", "b.id", "i.brand_id")
      .select(["i.id", "i.name", "i.brand_id", "b.name as brand", "i.lab_l", "i.lab_a", "i.lab_b", "i.discontinued"])
      .orderBy("i.id")
      .execute()
  ).map((r) => ({ id: r.id, name: r.name, brand_id: r.brand_id, brand: r.brand, lab: { l: r.lab_l, a: r.lab_a, b: r.lab_b }, discontinued: r.discontinued }));
});
afterAll(async () => {
  await t?.close();
});

function expectWellFormed(list: BridgeList, fromId: number, toId: number) {
  for (const b of list.bridges) {
    expect(b.inks[0]!.id).toBe(fromId);
    expect(b.inks[b.inks.length - 1]!.id).toBe(toId);
    expect(b.inks.length).toBeGreaterThanOrEqual(3);
    expect(b.inks.length).toBeLessThanOrEqual(5);
    expect(b.steps).toHaveLength(b.inks.length - 1);
    expect(new Set(b.inks.map((i) => i.id)).size).toBe(b.inks.length);
    for (const [i, s] of b.steps.entries()) {
      const a = byName(b.inks[i]!.name).lab;
      const c = byName(b.inks[i + 1]!.name).lab;
      expect(s.muddy).toBe(false);
      expect(joinFacts(a, c).muddy).toBe(false);
      expect(s.deltaE).toBeCloseTo(deltaE2000(a, c), 2);
    }
    expect(b.maxStepDeltaE).toBeCloseTo(Math.max(...b.steps.map((s) => s.deltaE)), 1);
  }
  for (let i = 1; i < list.bridges.length; i++) expect(list.bridges[i]!.maxStepDeltaE).toBeGreaterThanOrEqual(list.bridges[i - 1]!.maxStepDeltaE);
}

describe("GET /api/bridges", () => {
  it("bridges a muddy join (purple into yellow) with the same bridges a brute-force search finds", async () => {
    const from = byName("Amethyst Geode");
    const to = byName("Lemon Curd");
    const res = await t.client().get(`/api/bridges?from=${from.id}&to=${to.id}&inks=any&limit=5`).expect(200);
    const list = res.body as BridgeList;
    expect(list.direct.muddy).toBe(true);
    expect(list.bridges).toHaveLength(5);
    expectWellFormed(list, from.id, to.id);
    // Brute force over the same catalogue (discontinued inks are left out for a visitor).
    const m = buildJoinMatrix(inks.map((i) => i.lab));
    const idx = (id: number) => inks.findIndex((i) => i.id === id);
    const expected = bruteForceBridges(m, { from: idx(from.id), to: idx(to.id), allowed: (i) => !inks[i]!.discontinued, k: 5 });
    expect(list.bridges.map((b) => b.inks.map((i) => i.id))).toEqual(expected.map((b) => b.nodes.map((v) => inks[v]!.id)));
  });

  it("keeps to one brand when asked", async () => {
    const from = byName("Amethyst Geode");
    const to = byName("Lemon Curd");
    const res = await t.client().get(`/api/bridges?from=${from.id}&to=${to.id}&sameBrand=true`).expect(200);
    const list = res.body as BridgeList;
    expect(list.bridges.length).toBeGreaterThan(0);
    expectWellFormed(list, from.id, to.id);
    const brands = new Set([from.brand, to.brand]);
    for (const b of list.bridges) for (const ink of b.inks) expect(brands.has(ink.brand)).toBe(true);
  });

  it("asks a visitor to sign in for the stash options", async () => {
    const res = await t.client().get(`/api/bridges?from=${byName("Amethyst Geode").id}&to=${byName("Lemon Curd").id}&inks=stash`).expect(401);
    expect(res.body.error.code).toBe("sign_in_required");
  });

  it("uses only a member's own inks, or names the one ink to buy", async () => {
    const agent = await signedIn(t, DEMO.member);
    const from = byName("Amethyst Geode");
    const to = byName("Lemon Curd");
    const own = ["Lavender Shortbread", "Hawthorn Blossom", "Rhubarb Fool", "Apricot Glaze", "Custard Tart", "Foxglove Bell", "Saffron Bun"].map(byName);
    await agent
      .put("/api/stash")
      .send({ items: [...own, from, to].map((i) => ({ inkId: i.id })) })
      .expect(200);
    const owned = new Set([...own, from, to].map((i) => i.id));
    const stash = (await agent.get(`/api/bridges?from=${from.id}&to=${to.id}&inks=stash`).expect(200)).body as BridgeList;
    expect(stash.bridges.length).toBeGreaterThan(0);
    expectWellFormed(stash, from.id, to.id);
    for (const b of stash.bridges) for (const ink of b.inks) expect(owned.has(ink.id)).toBe(true);

    const buy = (await agent.get(`/api/bridges?from=${from.id}&to=${to.id}&inks=oneToBuy`).expect(200)).body as BridgeList;
    expect(buy.bridges).toHaveLength(5);
    expectWellFormed(buy, from.id, to.id);
    for (const b of buy.bridges) {
      const notOwned = b.inks.filter((i) => !owned.has(i.id));
      expect(notOwned.length).toBeLessThanOrEqual(1);
      expect(b.toBuy?.id ?? null).toBe(notOwned[0]?.id ?? null);
    }
    // One ink to buy can only do as well as or better than none.
    expect(buy.bridges[0]!.maxStepDeltaE).toBeLessThanOrEqual(stash.bridges[0]!.maxStepDeltaE);
  });

  it.each([
    ["the same ink twice", "from=5&to=5", 400],
    ["no ink to bridge to", "from=5", 400],
    ["a word for an id", "from=abc&to=5", 400],
    ["too many bridges", "from=5&to=6&limit=50", 400],
    ["an unknown option", "from=5&to=6&inks=all", 400],
    ["a parameter given twice", "from=5&from=7&to=6", 400],
    ["an unknown parameter", "from=5&to=6&colour=red", 400],
    ["an ink not in the catalogue", "from=5&to=999999", 422],
  ])("refuses %s with a clear error", async (_what, query, status) => {
    const res = await t.client().get(`/api/bridges?${query}`).expect(status);
    expect(res.body.error.message).toMatch(/\w/);
  });
});

describe("what goes with an ink, and inks next to each other in search", () => {
  let n = 0;
  async function insertStrip(inkIds: number[], status: "published" | "pending", title: string) {
    n++;
    const author = (await t.db.selectFrom("profiles").select("user_id").executeTakeFirstOrThrow()).user_id;
    const at = new Date(Date.UTC(2026, 5, 1) + n * 3_600_000).toISOString();
    const upload = `plan-test-${n}`;
    await t.db.insertInto("uploads").values({ id: upload, owner_id: author, status: "ready", original_key: null, mime: "image/webp", byte_size: 1, white_x: null, white_y: null, analysis_json: null, display_key: null, thumb_key: null, placeholder: null, phash: null, width: 1200, height: 300, error_code: null, error_message: null, created_at: at, updated_at: at }).execute();
    const { id } = await t.db
      .insertInto("strips")
      .values({ author_id: author, upload_id: upload, title, notes_html: "", paper: "smooth-cardstock", tools_json: "[]", video_url: null, status, status_reason: null, orientation: "horizontal", ink_count: inkIds.length, saves: 0, phash: null, created_at: at, updated_at: at, published_at: status === "published" ? at : null, hold: null, duplicate_of: null })
      .returning("id")
      .executeTakeFirstOrThrow();
    await t.db.insertInto("strip_inks").values(inkIds.map((ink_id, position) => ({ strip_id: id, position, ink_id }))).execute();
    return id;
  }

  let A: Row, B: Row, C: Row;
  const ids: Record<string, number> = {};
  beforeAll(async () => {
    [A, B, C] = [byName("Gorse Bloom"), byName("Rain Barrel"), byName("Heather Moor")];
    ids.abc = await insertStrip([A.id, B.id, C.id], "published", "A B C");
    ids.ba = await insertStrip([B.id, A.id], "published", "B A");
    ids.acb = await insertStrip([A.id, C.id, B.id], "published", "A C B");
    ids.pending = await insertStrip([A.id, B.id], "pending", "A B waiting");
  });

  it("counts the inks published strips put directly next to an ink, with example strips, newest first", async () => {
    const res = await t.client().get(`/api/inks/${A.id}/beside`).expect(200);
    expect(res.body.items).toEqual([
      { ink: { id: B.id, name: B.name, brand: B.brand, hex: expect.any(String) }, strips: 2, examples: [{ id: ids.ba, title: "B A" }, { id: ids.abc, title: "A B C" }] },
      { ink: { id: C.id, name: C.name, brand: C.brand, hex: expect.any(String) }, strips: 1, examples: [{ id: ids.acb, title: "A C B" }] },
    ]);
    // A strip waiting for review never counts.
    expect(JSON.stringify(res.body)).not.toContain("waiting");
  });

  it("says so for an unknown ink and refuses a bad limit", async () => {
    await t.client().get(`/api/inks/999999/beside`).expect(404);
    await t.client().get(`/api/inks/${A.id}/beside?limit=500`).expect(400);
  });

  it("finds strips with two inks anywhere, or only side by side (adjacent=true)", async () => {
    const anywhere = await t.client().get(`/api/strips?ink=${A.id}&ink=${B.id}`).expect(200);
    expect(anywhere.body.items.map((s: { id: number }) => s.id).sort()).toEqual([ids.abc, ids.ba, ids.acb].sort());
    const beside = await t.client().get(`/api/strips?ink=${A.id}&ink=${B.id}&adjacent=true`).expect(200);
    expect(beside.body.items.map((s: { id: number }) => s.id).sort()).toEqual([ids.abc, ids.ba].sort());
    expect(beside.body.total).toBe(2);
    const other = await t.client().get(`/api/strips?ink=${C.id}&ink=${B.id}&adjacent=true`).expect(200);
    expect(other.body.items.map((s: { id: number }) => s.id).sort()).toEqual([ids.abc, ids.acb].sort());
  });

  it("refuses next to each other without exactly two inks", async () => {
    const res = await t.client().get(`/api/strips?ink=${A.id}&adjacent=true`).expect(400);
    expect(res.body.error.fields.adjacent[0]).toMatch(/exactly two inks/);
    await t.client().get(`/api/strips?ink=${A.id}&ink=${B.id}&adjacent=maybe`).expect(400);
  });

  it("counts a bridge's joins in published strips", async () => {
    const res = await t.client().get(`/api/bridges?from=${A.id}&to=${B.id}`).expect(200);
    expect(res.body.direct.strips).toBe(2);
  });
});

describe("printable sheets (PDF)", () => {
  async function pdfText(buf: Buffer) {
    const { PDFParse } = await import("pdf-parse");
    const parser = new PDFParse({ data: new Uint8Array(buf) });
    const result = await parser.getText();
    await parser.destroy();
    return { pages: result.total, text: result.text.replace(/\s+/g, " ") };
  }
  const binary = (res: import("supertest").Response, cb: (err: Error | null, body: Buffer) => void) => {
    const chunks: Buffer[] = [];
    res.on("data", (c: Buffer) => chunks.push(c));
    res.on("end", () => cb(null, Buffer.concat(chunks)));
  };

  it("prints a practice card: the ink order, the join hints and the page size asked for", async () => {
    const plan = ["Lemon Curd", "Amethyst Geode", "Cobalt Lantern", "Polar Night"].map(byName);
    const res = await t.client().get(`/api/plan/card.pdf?inks=${plan.map((i) => i.id).join(",")}&paper=letter`).buffer(true).parse(binary).expect(200);
    expect(res.headers["content-type"]).toBe("application/pdf");
    expect(res.headers["content-disposition"]).toMatch(/attachment; filename="blendwell-practice-card-letter\.pdf"/);
    const body = res.body as Buffer;
    // US Letter is 612 × 792 points (ANSI/ASME Y14.1), A4 595.28 × 841.89 (ISO 216).
    expect(body.toString("latin1")).toMatch(/\/MediaBox \[0 0 612 792\]/);
    const { pages, text } = await pdfText(body);
    expect(pages).toBe(1);
    for (const ink of plan) expect(text).toContain(ink.name);
    expect(text).toContain("MUDDY JOIN");
    expect(text).toContain("TAKEOVER");
    expect(text).toContain("Swatch each ink in its box");
    const a4 = await t.client().get(`/api/plan/card.pdf?inks=${plan[0]!.id},${plan[1]!.id}`).buffer(true).parse(binary).expect(200);
    expect((a4.body as Buffer).toString("latin1")).toMatch(/\/MediaBox \[0 0 595\.28 841\.89\]/);
  });

  it("refuses a plan it cannot print, with a clear error", async () => {
    expect((await t.client().get(`/api/plan/card.pdf?inks=${byName("Lemon Curd").id}`).expect(400)).body.error.fields.inks[0]).toMatch(/at least 2/);
    await t.client().get(`/api/plan/card.pdf?inks=1,999999`).expect(422);
    await t.client().get(`/api/plan/card.pdf?inks=1,2&paper=a3`).expect(400);
  });

  it("prints a member's stash chart with every ink named, over as many pages as it needs; visitors are asked to sign in", async () => {
    await t.client().get("/api/stash/chart.pdf").expect(401);
    const agent = await signedIn(t, DEMO.newMember);
    const owned = inks.slice(0, 60);
    await agent.put("/api/stash").send({ items: owned.map((i) => ({ inkId: i.id })) }).expect(200);
    const res = await agent.get("/api/stash/chart.pdf?paper=a4").buffer(true).parse(binary).expect(200);
    const { pages, text } = await pdfText(res.body as Buffer);
    expect(pages).toBeGreaterThan(1);
    for (const ink of owned) expect(text).toContain(ink.name);
    expect(text).toMatch(/60 inks, grouped by hue/);
  });
});

describe("planned strips in a binder", () => {
  it("saves a plan to the member's own binder, lists it, and removes it", async () => {
    const agent = await signedIn(t, DEMO.member);
    const binder = (await agent.post("/api/binders").send({ name: "Plans to try", visibility: "private" }).expect(201)).body as { id: number };
    const inksOf = ["Lemon Curd", "Rhubarb Fool", "Amethyst Geode"].map(byName);
    const saved = (await agent.post(`/api/binders/${binder.id}/plans`).send({ inks: inksOf.map((i) => i.id) }).expect(201)).body;
    expect(saved.inks.map((i: { name: string }) => i.name)).toEqual(inksOf.map((i) => i.name));
    const list = (await agent.get(`/api/binders/${binder.id}/plans`).expect(200)).body;
    expect(list.canEdit).toBe(true);
    expect(list.items.map((p: { id: number }) => p.id)).toEqual([saved.id]);
    // A private binder's plans are nobody else's business: not found for a visitor.
    await t.client().get(`/api/binders/${binder.id}/plans`).expect(404);
    await agent.delete(`/api/binders/${binder.id}/plans/${saved.id}`).expect(204);
    await agent.delete(`/api/binders/${binder.id}/plans/${saved.id}`).expect(404);
    expect((await agent.get(`/api/binders/${binder.id}/plans`).expect(200)).body.items).toEqual([]);
  });

  it("refuses another member's binder, bad plans and unknown inks, and writes nothing", async () => {
    const owner = await signedIn(t, DEMO.member);
    const binder = (await owner.post("/api/binders").send({ name: "Public plans", visibility: "public" }).expect(201)).body as { id: number };
    const other = await signedIn(t, DEMO.moderator);
    const two = [byName("Lemon Curd").id, byName("Rhubarb Fool").id];
    expect((await other.post(`/api/binders/${binder.id}/plans`).send({ inks: two }).expect(403)).body.error.code).toBe("forbidden");
    await t.client().post(`/api/binders/${binder.id}/plans`).send({ inks: two }).expect(401);
    await owner.post(`/api/binders/${binder.id}/plans`).send({ inks: [two[0]] }).expect(400);
    await owner.post(`/api/binders/${binder.id}/plans`).send({ inks: [two[0], two[0]] }).expect(400);
    await owner.post(`/api/binders/${binder.id}/plans`).send({ inks: "1,2" }).expect(400);
    await owner.post(`/api/binders/${binder.id}/plans`).send({ inks: [two[0], 999999] }).expect(422);
    await owner.post(`/api/binders/999999/plans`).send({ inks: two }).expect(404);
    const list = (await other.get(`/api/binders/${binder.id}/plans`).expect(200)).body;
    expect(list).toEqual({ items: [], canEdit: false });
  });
});
