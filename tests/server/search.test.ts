// Search over HTTP: GET /api/strips with the search filters and GET /api/inks/:id/look-alikes,
// on the real app (tests/setup/test-app.ts, demo catalogue).
// Strips are written straight into the database (a few hundred, with bands made from the
// catalogue inks' reference colours), and every answer is compared with a naive model computed
// here from the same data.
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { differenceCiede2000 } from "culori";
import { deltaE2000, hexToLab, labToHex, type Lab } from "../../shared/colour";
import type { Ink } from "../../shared/schemas/inks";
import { type LookAlikeList, type StripSearchList, type StripSearchResult } from "../../shared/schemas/search";
import { papers, type StripStatus } from "../../shared/schemas/strips";
import { createTestApp, DEMO, signedIn, type TestApp } from "../setup/test-app";
import { seededRandom as seeded } from "../../server/demo/seeded-random";


type Model = {
  id: number;
  status: StripStatus;
  paper: (typeof papers)[number];
  saves: number;
  publishedAt: string | null;
  inks: Ink[];
  bands: Lab[];
};

let t: TestApp;
let app: TestApp["app"];
let inks: Ink[];
const strips: Model[] = [];
const rand = seeded(77);
const pick = <T>(list: readonly T[]) => list[Math.floor(rand() * list.length)]!;

async function insertStrip(m: Omit<Model, "id">, author: string, n: number) {
  const at = new Date(Date.UTC(2026, 1, 1) + n * 3_600_000).toISOString();
  const upload = `search-test-${n}`;
  await t.db.insertInto("uploads").values({ id: upload, owner_id: author, status: "ready", original_key: null, mime: "image/webp", byte_size: 1, white_x: null, white_y: null, analysis_json: null, display_key: null, thumb_key: null, placeholder: null, phash: null, width: 1200, height: 300, error_code: null, error_message: null, created_at: at, updated_at: at }).execute();
  const { id } = await t.db
    .insertInto("strips")
    .values({ author_id: author, upload_id: upload, title: `Search strip ${n}`, notes_html: "", paper: m.paper, tools_json: "[]", video_url: null, status: m.status, status_reason: null, orientation: "horizontal", ink_count: m.inks.length, saves: m.saves, phash: null, created_at: at, updated_at: at, published_at: m.publishedAt, hold: null, duplicate_of: null })
    .returning("id")
    .executeTakeFirstOrThrow();
  await t.db.insertInto("strip_inks").values(m.inks.map((ink, position) => ({ strip_id: id, position, ink_id: ink.id }))).execute();
  await t.db
    .insertInto("strip_bands")
    .values(m.bands.map((lab, position) => ({ strip_id: id, position, start_frac: position / m.bands.length, end_frac: (position + 1) / m.bands.length, lab_l: lab.l, lab_a: lab.a, lab_b: lab.b, hex: "#808080", ink_id: m.inks[position]?.id ?? null, delta_e: null })))
    .execute();
  return id;
}

beforeAll(async () => {
  t = await createTestApp();
  app = t.app;

  inks = (await request(t.app).get("/api/inks?pageSize=100")).body.items;
  const more = (await request(t.app).get("/api/inks?pageSize=100&page=2")).body.items;
  inks.push(...more);
  const authors = (await t.db.selectFrom("profiles").select("user_id").execute()).map((p) => p.user_id);
  const statuses: StripStatus[] = ["published", "published", "published", "published", "published", "pending", "hidden", "returned", "rejected"];
  // One ink is in about 40% of strips, so searches for it walk strips in order rather than
  // gathering the ink's strips (the service picks by how common the inks are).
  const favourite = inks[3]!;
  for (let n = 0; n < 300; n++) {
    const count = 1 + Math.floor(rand() * 5);
    const chosen = new Set<Ink>();
    if (rand() < 0.4) chosen.add(favourite);
    while (chosen.size < count) chosen.add(pick(inks));
    const list = [...chosen];
    // Bands: each ink's reference colour, a little off (as a photo measures it), sometimes a blend.
    const bands = list.map((ink) => ({ l: ink.lab.l + (rand() - 0.5) * 4, a: ink.lab.a + (rand() - 0.5) * 6, b: ink.lab.b + (rand() - 0.5) * 6 }));
    if (rand() < 0.3 && list.length > 1) bands.splice(1, 0, { l: (bands[0]!.l + bands[1]!.l) / 2, a: (bands[0]!.a + bands[1]!.a) / 2, b: (bands[0]!.b + bands[1]!.b) / 2 });
    const status = pick(statuses);
    // Ties in the sort keys on purpose: a few strips share a publishing time or a save count.
    const publishedAt = status === "published" ? new Date(Date.UTC(2026, 2, 1) + Math.floor(n / 3) * 60_000).toISOString() : null;
    const m = { status, paper: pick(papers), saves: Math.floor(rand() * 6), publishedAt, inks: list, bands };
    strips.push({ id: await insertStrip(m, pick(authors), n), ...m });
  }
}, 120_000);
afterAll(() => t.close());

const published = () => strips.filter((s) => s.status === "published");
const newest = (a: Model, b: Model) => (a.publishedAt === b.publishedAt ? b.id - a.id : a.publishedAt! < b.publishedAt! ? 1 : -1);
const mostSaved = (a: Model, b: Model) => b.saves - a.saves || b.id - a.id;

/** Every page of a search, following nextCursor. */
async function allPages(query: Record<string, string | string[]>, limit = 7, agent: { get: (url: string) => request.Test } = request(app)) {
  const items: StripSearchResult[] = [];
  let cursor: string | null = null;
  let first: StripSearchList | null = null;
  for (let page = 0; page < 100; page++) {
    const res = await agent
      .get("/api/strips")
      .query({ ...query, limit: String(limit), ...(cursor && { cursor }) })
      .expect(200);
    const body = res.body as StripSearchList;
    first ??= body;
    if (page > 0) expect(body.total).toBeUndefined();
    items.push(...body.items);
    cursor = body.nextCursor;
    if (!cursor) break;
  }
  expect(cursor).toBeNull();
  return { items, ids: items.map((s) => s.id), total: first!.total };
}

/** Naive colour match: the strip's best band per colour within t, or null. */
function colourMatch(s: Model, colours: string[], t: number) {
  const best = colours.map((hex) => {
    const q = hexToLab(hex);
    let found: { bandIndex: number; deltaE: number } | null = null;
    s.bands.forEach((band, i) => {
      const de = deltaE2000(q, band);
      if (de <= t && (!found || de < found.deltaE)) found = { bandIndex: i, deltaE: de };
    });
    return found as { bandIndex: number; deltaE: number } | null;
  });
  return best.every((b) => b) ? (best as { bandIndex: number; deltaE: number }[]) : null;
}

describe("who sees what", () => {
  it("every search answers with published strips only, whatever the filter, sort or page", async () => {
    const hiddenOnes = strips.filter((s) => s.status !== "published");
    expect(hiddenOnes.length).toBeGreaterThan(30);
    const target = hiddenOnes[0]!;
    const searches: Record<string, string | string[]>[] = [
      {},
      { sort: "saves" },
      { ink: String(target.inks[0]!.id) },
      { color: "#" + hexOf(target.bands[0]!), maxDeltaE: "30" },
      { color: "#" + hexOf(target.bands[0]!), maxDeltaE: "30", sort: "newest" },
      { brand: target.inks[0]!.brand.slug, type: target.inks[0]!.type },
      { paper: target.paper, inkCount: String(target.inks.length) },
    ];
    for (const query of searches) {
      const { items } = await allPages(query, 20);
      for (const s of items) expect(s.status, JSON.stringify(query)).toBe("published");
      for (const hidden of hiddenOnes) expect(items.some((s) => s.id === hidden.id)).toBe(false);
    }
    // The plain gallery walks every published strip exactly once.
    const all = await allPages({}, 25);
    expect(all.ids).toEqual(published().sort(newest).map((s) => s.id));
    expect(all.total).toBe(published().length);
  });
});

describe("finding combinations by ink", () => {
  it("several inks are all required, newest first, with the total", async () => {
    const some = published().find((s) => s.inks.length >= 3)!;
    const wanted = some.inks.slice(0, 2).map((i) => i.id);
    const expected = published()
      .filter((s) => wanted.every((id) => s.inks.some((i) => i.id === id)))
      .sort(newest);
    const { ids, total } = await allPages({ ink: wanted.map(String) }, 3);
    expect(ids).toEqual(expected.map((s) => s.id));
    expect(total).toBe(expected.length);
    expect(ids).toContain(some.id);
  });

  it("one ink, most saved first; excluded inks never appear", async () => {
    const common = [...inks].sort((a, b) => countWith(b.id) - countWith(a.id))[0]!;
    const other = published().find((s) => s.inks.some((i) => i.id === common.id) && s.inks.length > 1)!.inks.find((i) => i.id !== common.id)!;
    const expected = published()
      .filter((s) => s.inks.some((i) => i.id === common.id) && !s.inks.some((i) => i.id === other.id))
      .sort(mostSaved);
    const { ids, total } = await allPages({ ink: String(common.id), notInk: String(other.id), sort: "saves" }, 4);
    expect(ids).toEqual(expected.map((s) => s.id));
    expect(total).toBe(expected.length);
    expect(expected.length).toBeGreaterThan(3);
  });

  it("brand, ink type, ink count and paper narrow the results", async () => {
    const brands = [...new Set(inks.map((i) => i.brand.slug))];
    const cases: [Record<string, string | string[]>, (s: Model) => boolean][] = [
      [{ brand: brands[0]! }, (s) => s.inks.some((i) => i.brand.slug === brands[0])],
      [{ brand: [brands[0]!, brands[1]!] }, (s) => [brands[0], brands[1]].every((b) => s.inks.some((i) => i.brand.slug === b))],
      [{ type: "pigment" }, (s) => s.inks.some((i) => i.type === "pigment")],
      [{ inkCount: "2" }, (s) => s.inks.length === 2],
      [{ paper: "hot-press", sort: "saves" }, (s) => s.paper === "hot-press"],
      [{ brand: brands[1]!, inkCount: "3", notInk: String(inks[0]!.id) }, (s) => s.inks.some((i) => i.brand.slug === brands[1]) && s.inks.length === 3 && !s.inks.some((i) => i.id === inks[0]!.id)],
    ];
    for (const [query, keep] of cases) {
      const expected = published().filter(keep).sort(query.sort === "saves" ? mostSaved : newest);
      expect(expected.length, JSON.stringify(query)).toBeGreaterThan(0);
      const { ids, total } = await allPages(query, 9);
      expect(ids, JSON.stringify(query)).toEqual(expected.map((s) => s.id));
      expect(total).toBe(expected.length);
    }
  });

  it("a search with no match says so with a total of 0", async () => {
    const res = await request(app).get("/api/strips").query({ ink: inks.map((i) => String(i.id)).slice(0, 8) }).expect(200);
    expect(res.body).toEqual({ items: [], nextCursor: null, total: 0 });
  });
});

function countWith(inkId: number) {
  return published().filter((s) => s.inks.some((i) => i.id === inkId)).length;
}

/** A band's colour as a picker would send it: hex through the shared sRGB conversion, no "#". */
function hexOf(lab: Lab) {
  return labToHex(lab).slice(1);
}

describe("finding combinations by colour", () => {
  it("ranks strips by their closest band and says which band matched, page after page", async () => {
    const rand2 = seeded(5);
    let totals = 0;
    for (let i = 0; i < 7; i++) {
      const colour = "#" + hexOf(pick(published()).bands[0]!);
      const t = [1.5, 3, 6, 10, 15, 25, 30][i]! * (0.9 + rand2() * 0.1);
      const expected = published()
        .map((s) => ({ s, m: colourMatch(s, [colour], t) }))
        .filter((x) => x.m)
        .sort((a, b) => a.m![0]!.deltaE - b.m![0]!.deltaE || a.s.id - b.s.id);
      expect(expected.length).toBeGreaterThan(0);
      const { items, total } = await allPages({ color: colour, maxDeltaE: String(t) }, 6);
      expect(items.map((s) => s.id)).toEqual(expected.map((x) => x.s.id));
      items.forEach((s, k) => {
        const m = expected[k]!.m![0]!;
        expect(s.match).toEqual([{ color: colour, bandIndex: m.bandIndex, deltaE: Math.round(m.deltaE * 100) / 100 }]);
        // The matched band is one of the strip's own bands, as the gallery shows them.
        expect(s.bands.map((b) => b.index)).toContain(m.bandIndex);
      });
      // The total is given when the search went out to the full threshold.
      if (total !== undefined) {
        expect(total).toBe(expected.length);
        totals++;
      }
    }
    expect(totals).toBeGreaterThan(0);
  });

  it("several colours must all be found; newest and most saved orders work with colour too", async () => {
    const s = published().find((x) => x.bands.length >= 3)!;
    const colours = ["#" + hexOf(s.bands[0]!), "#" + hexOf(s.bands[2]!)];
    for (const sort of ["newest", "saves", "closest"] as const) {
      const expected = published()
        .map((x) => ({ x, m: colourMatch(x, colours, 12) }))
        .filter((y) => y.m)
        .sort((a, b) =>
          sort === "newest" ? newest(a.x, b.x) : sort === "saves" ? mostSaved(a.x, b.x) : Math.max(...a.m!.map((m) => m.deltaE)) - Math.max(...b.m!.map((m) => m.deltaE)) || a.x.id - b.x.id,
        );
      const { items, total } = await allPages({ color: colours, maxDeltaE: "12", sort }, 5);
      expect(items.map((i) => i.id)).toEqual(expected.map((y) => y.x.id));
      expect(items.every((i) => i.match?.length === 2 && i.match[0]!.color === colours[0] && i.match[1]!.color === colours[1])).toBe(true);
      // A total is given when the search gathered every match (not when it settled early).
      if (total !== undefined) expect(total).toBe(expected.length);
      expect(items.map((i) => i.id)).toContain(s.id);
    }
  });

  it("colour combines with ink and strip filters", async () => {
    const s = published().find((x) => x.inks.length >= 2)!;
    const colour = "#" + hexOf(s.bands[0]!);
    const cases: [Record<string, string>, (x: Model) => boolean][] = [
      [{ ink: String(s.inks[1]!.id) }, (x) => x.inks.some((i) => i.id === s.inks[1]!.id)],
      [{ paper: s.paper, inkCount: String(s.inks.length) }, (x) => x.paper === s.paper && x.inks.length === s.inks.length],
    ];
    for (const [filter, keep] of cases) {
      const expected = published()
        .filter((x) => keep(x) && colourMatch(x, [colour], 20))
        .sort(newest);
      const { ids, total } = await allPages({ color: colour, maxDeltaE: "20", sort: "newest", ...filter }, 4);
      expect(ids).toEqual(expected.map((x) => x.id));
      if (total !== undefined) expect(total).toBe(expected.length);
      expect(ids).toContain(s.id);
    }
  });
});

describe("finding combinations by my stash", () => {
  it("lists strips I can blend with what I own, and strips missing one ink with the ink to buy", async () => {
    const member = await signedIn(t, DEMO.newMember);
    // A stash of the 40 inks used most in published strips, so both lists have members.
    const owned = new Set([...inks].sort((a, b) => countWith(b.id) - countWith(a.id) || a.id - b.id).slice(0, 40).map((i) => i.id));
    await member.put("/api/stash").send({ items: [...owned].map((inkId) => ({ inkId })) }).expect(200);
    const notOwned = (s: Model) => s.inks.filter((i) => !owned.has(i.id));

    const blendable = published().filter((s) => notOwned(s).length === 0).sort(newest);
    expect(blendable.length).toBeGreaterThan(3);
    const all = await allPages({ stash: "all" }, 5, member);
    expect(all.ids).toEqual(blendable.map((s) => s.id));
    expect(all.total).toBe(blendable.length);
    expect(all.items.every((s) => s.missingInkId === undefined)).toBe(true);

    const oneShort = published().filter((s) => notOwned(s).length === 1).sort(mostSaved);
    expect(oneShort.length).toBeGreaterThan(3);
    const missing = await allPages({ stash: "missingOne", sort: "saves" }, 6, member);
    expect(missing.ids).toEqual(oneShort.map((s) => s.id));
    expect(missing.items.map((s) => s.missingInkId)).toEqual(oneShort.map((s) => notOwned(s)[0]!.id));
    // For the ink to buy, the closest ink the member owns within ΔE2000 5, if any (culori's
    // CIEDE2000 as the outside reference).
    const ref = differenceCiede2000();
    let withLookAlike = 0;
    for (const item of missing.items) {
      const gone = inks.find((i) => i.id === item.missingInkId)!;
      const best = inks
        .filter((i) => owned.has(i.id))
        .map((i) => ({ id: i.id, de: Math.round(ref({ mode: "lab65", ...gone.lab }, { mode: "lab65", ...i.lab }) * 100) / 100 }))
        .filter((o) => o.de <= 5)
        .sort((a, b) => a.de - b.de || a.id - b.id)[0];
      expect(item.ownedLookAlike?.inkId).toBe(best?.id);
      if (best) {
        withLookAlike++;
        expect(item.ownedLookAlike!.deltaE).toBeCloseTo(best.de, 2);
      }
    }
    expect(withLookAlike).toBeGreaterThan(0);

    // The stash combines with the other filters (here an ink and a colour).
    const some = blendable.find((s) => s.inks.length > 1) ?? blendable[0]!;
    const withInk = await allPages({ stash: "all", ink: String(some.inks[0]!.id) }, 5, member);
    expect(withInk.ids).toEqual(blendable.filter((s) => s.inks.some((i) => i.id === some.inks[0]!.id)).map((s) => s.id));
    const colour = hexOf(some.bands[0]!);
    const byColour = await allPages({ stash: "all", color: `#${colour}` }, 5, member);
    expect(byColour.ids).toContain(some.id);
    for (const id of byColour.ids) expect(blendable.map((s) => s.id)).toContain(id);
  });

  it("asks a visitor to sign in, and refuses a mode it does not know", async () => {
    const res = await request(app).get("/api/strips?stash=all").expect(401);
    expect(res.body.error.message).toMatch(/sign in/i);
    const bad = await request(app).get("/api/strips?stash=most").expect(400);
    expect(Object.keys(bad.body.error.fields)).toContain("stash");
  });
});

describe("bad input", () => {
  const bad = async (query: string, field: string) => {
    const res = await request(app).get(`/api/strips?${query}`).expect(400);
    expect(res.body.error.code).toBe("invalid_request");
    expect(Object.keys(res.body.error.fields), query).toContain(field);
    return res.body.error.fields[field] as string[];
  };

  it("gets a clear 400 naming the field", async () => {
    expect((await bad("color=%23zzzzzz", "color.0"))[0]).toMatch(/hex colour/);
    await bad("color=12345", "color.0");
    expect((await bad("color=%23abcdef&maxDeltaE=0.4", "maxDeltaE"))[0]).toMatch(/at least 0.5/);
    expect((await bad("color=%23abcdef&maxDeltaE=31", "maxDeltaE"))[0]).toMatch(/at most 30/);
    await bad("color=%23abcdef&maxDeltaE=lots", "maxDeltaE");
    expect((await bad(Array.from({ length: 50 }, (_, i) => `ink=${i + 1}`).join("&"), "ink"))[0]).toMatch(/at most 8/);
    await bad(Array.from({ length: 50 }, () => "color=%23abcdef").join("&"), "color");
    await bad("limit=5&limit=6", "limit");
    await bad("sort=closest", "sort");
    await bad("sort=oldest", "sort");
    await bad("ink=3&notInk=3", "notInk");
    await bad("ink=abc", "ink.0");
    await bad("inkCount=9", "inkCount");
    await bad("paper=papyrus", "paper");
    await bad("type=oil", "type");
    await bad("brand=Not%20A%20Slug", "brand.0");
    await bad("colour=%23abcdef", "colour");
    await bad(`cursor=${"x".repeat(5000)}`, "cursor");
    await bad("cursor=not-a-cursor", "cursor");
  });

  it("a cursor from another sort or another kind of search is refused", async () => {
    const page = await request(app).get("/api/strips?limit=2").expect(200);
    expect(page.body.nextCursor).toBeTruthy();
    await bad(`sort=saves&cursor=${page.body.nextCursor}`, "cursor");
    await bad(`color=%23abcdef&cursor=${page.body.nextCursor}`, "cursor");
    const forged = Buffer.from(JSON.stringify({ s: "closest", k: -1, i: 1 })).toString("base64url");
    await bad(`color=%23abcdef&cursor=${forged}`, "cursor");
  });

  it("unknown inks and brands are named in a 422", async () => {
    const res = await request(app).get("/api/strips?ink=987654&ink=" + inks[0]!.id + "&notInk=876543&brand=no-such-maker").expect(422);
    expect(res.body.error.fields.ink).toEqual(["unknown ink id: 987654"]);
    expect(res.body.error.fields.notInk).toEqual(["unknown ink id: 876543"]);
    expect(res.body.error.fields.brand).toEqual(["unknown brand: no-such-maker"]);
  });
});

describe("look-alikes", () => {
  it("lists catalogue inks within ΔE2000 5, closest first, in words", async () => {
    // culori's differenceCiede2000 (a port of Sharma's reference code) as an outside check.
    const ref = differenceCiede2000();
    let withAny = 0;
    for (const ink of inks) {
      const res = await request(app).get(`/api/inks/${ink.id}/look-alikes`).expect(200);
      const body = res.body as LookAlikeList;
      expect(body.ink.id).toBe(ink.id);
      expect(body.maxDeltaE).toBe(5);
      expect(body.scale).toMatch(/common practice/);
      const expected = inks
        .filter((o) => o.id !== ink.id)
        .map((o) => ({ id: o.id, de: Math.round(ref({ mode: "lab65", ...ink.lab }, { mode: "lab65", ...o.lab }) * 100) / 100 }))
        .filter((o) => o.de <= 5)
        .sort((a, b) => a.de - b.de || a.id - b.id);
      expect(body.items.map((i) => i.ink.id)).toEqual(expected.map((o) => o.id));
      body.items.forEach((item, k) => {
        expect(item.deltaE).toBeCloseTo(expected[k]!.de, 2);
        // Common practice, not a standard: ≤ 1 indistinguishable, ≤ 2 barely different, ≤ 5 similar.
        expect(item.words).toBe(item.deltaE <= 1 ? "indistinguishable" : item.deltaE <= 2 ? "barely different" : "similar");
        expect(item.owned).toBeUndefined();
      });
      if (body.items.length) withAny++;
    }
    expect(withAny).toBeGreaterThan(5);
  });

  it("finds the demo catalogue's planted look-alike pairs", async () => {
    // scripts/demo/catalogue.ts plants these pairs under about ΔE2000 3 (invented inks).
    for (const [a, b] of [["Lighthouse Lamp", "Citrine Ledge"], ["Gull Wing", "Moonlit Tin"]] as const) {
      const ink = inks.find((i) => i.name === a)!;
      const body = (await request(app).get(`/api/inks/${ink.id}/look-alikes`).expect(200)).body as LookAlikeList;
      expect(body.items.map((i) => i.ink.name)).toContain(b);
    }
  });

  it("with a stash, marks the look-alikes a member owns and names the closest one", async () => {
    const ink = inks.find((i) => i.name === "Lighthouse Lamp")!;
    const all = ((await request(app).get(`/api/inks/${ink.id}/look-alikes`).expect(200)).body as LookAlikeList).items;
    expect(all.length).toBeGreaterThan(0);
    const owned = all[all.length - 1]!.ink.id;
    const member = await signedIn(t, DEMO.member);
    await member.put("/api/stash").send({ items: [{ inkId: owned }] }).expect(200);
    const res = await member.get(`/api/inks/${ink.id}/look-alikes`).expect(200);
    const body = res.body as LookAlikeList;
    expect(body.items.map((i) => [i.ink.id, i.owned])).toEqual(all.map((i) => [i.ink.id, i.ink.id === owned]));
    expect(body.ownedLookAlike?.ink.id).toBe(owned);
    expect(res.headers["cache-control"]).toMatch(/private/);
    // A visitor never gets a stash answer.
    const anon = (await request(app).get(`/api/inks/${ink.id}/look-alikes`).expect(200)).body as LookAlikeList;
    expect(anon.ownedLookAlike).toBeUndefined();
    expect(anon.items.every((i) => i.owned === undefined)).toBe(true);
  });

  it("an unknown or malformed ink id is a 404", async () => {
    await request(app).get("/api/inks/987654/look-alikes").expect(404);
    await request(app).get("/api/inks/abc/look-alikes").expect(404);
  });
});
