// The colour index never misses: the pre-filter boxes hold every colour within the threshold,
// and the indexed search returns exactly what a naive full scan computing ΔE2000 for every band
// returns. ΔE2000 is the shared wrapper (checked against Sharma, Wu & Dalal (2005) test data in
// tests/analysis/colour.test.ts); the full scan here is written independently of the index.
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { deltaE2000, labToLch, srgbToLab, type Lab } from "../../shared/colour";
import { openDatabase, type Db } from "../../server/db/client";
import { migrations } from "../../migrations";
import { createMigrator, migrateToLatest } from "../../server/db/migrate";
import { colourBoxes, hueWeight, inBoxes, maxHueWeight, slOf } from "../../server/modules/search/colour-bounds";
import { cellOf, cellRuns } from "../../server/modules/search/colour-cells";
import { findColourHits } from "../../server/modules/search/search.service";
import { searchDb } from "../../server/modules/search/search-tables";
import { seededRandom as seeded } from "../../server/demo/seeded-random";


const fromLch = (l: number, c: number, hDeg: number): Lab => ({ l, a: c * Math.cos((hDeg * Math.PI) / 180), b: c * Math.sin((hDeg * Math.PI) / 180) });

/**
 * Query colours that stress the bound: random sRGB; the blue region where CIEDE2000's rotation
 * term RT peaks (mean hue near 275°, Sharma et al. 2005 eq. 19–21), over many chromas;
 * near-neutral colours (hue barely defined, G near 0.5); exact neutrals; lightness extremes;
 * chromas beyond the sRGB gamut.
 */
function stressColours(rand: () => number, n: number): Lab[] {
  const out: Lab[] = [];
  for (let i = 0; out.length < n; i++) {
    switch (i % 7) {
      case 0:
        out.push(srgbToLab(Math.floor(rand() * 256), Math.floor(rand() * 256), Math.floor(rand() * 256)));
        break;
      case 1:
      case 2:
        out.push(fromLch(5 + rand() * 90, rand() * 90, 235 + rand() * 80));
        break;
      case 3:
        out.push(fromLch(rand() * 100, rand() * 3, rand() * 360));
        break;
      case 4:
        out.push({ l: rand() * 100, a: 0, b: 0 });
        break;
      case 5:
        out.push(fromLch(rand() < 0.5 ? rand() * 4 : 96 + rand() * 4, rand() * 40, rand() * 360));
        break;
      default:
        out.push(fromLch(20 + rand() * 60, 90 + rand() * 60, rand() * 360));
    }
  }
  return out;
}

const thresholdOf = (rand: () => number) => [0.5, 1, 2, 5, 10, 20, 30][Math.floor(rand() * 7)]! * (0.8 + rand() * 0.2);

/** A point on the ray from q in direction u where ΔE2000 crosses t, approached from inside and outside. */
function crossing(q: Lab, u: [number, number, number], t: number): { inside: Lab; outside: Lab } | null {
  const at = (d: number): Lab => ({ l: q.l + u[0] * d, a: q.a + u[1] * d, b: q.b + u[2] * d });
  let lo = 0;
  let hi = t;
  while (deltaE2000(q, at(hi)) <= t) {
    lo = hi;
    hi *= 2;
    if (hi > 2000) return null;
  }
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (deltaE2000(q, at(mid)) <= t) lo = mid;
    else hi = mid;
  }
  return { inside: at(lo), outside: at(hi) };
}

function direction(rand: () => number): [number, number, number] {
  for (;;) {
    const v: [number, number, number] = [rand() * 2 - 1, rand() * 2 - 1, rand() * 2 - 1];
    const n = Math.hypot(...v);
    if (n > 0.1 && n <= 1) return [v[0] / n, v[1] / n, v[2] / n];
  }
}

describe("the pre-filter boxes", () => {
  it("hold every colour within the threshold, probed on the boundary and all around it", () => {
    const rand = seeded(5);
    let probed = 0;
    for (const q of stressColours(rand, 350)) {
      const t = thresholdOf(rand);
      const boxes = colourBoxes(q, t);
      // Limits go to SQL as JSON: they must be finite numbers.
      expect(boxes.every((b) => Object.values(b).every(Number.isFinite))).toBe(true);
      const runs = boxes.flatMap(cellRuns);
      const check = (p: Lab) => {
        probed++;
        const inside = inBoxes(boxes, p);
        if (!inside) throw new Error(`missed ${JSON.stringify(p)} at ΔE ${deltaE2000(q, p)} from ${JSON.stringify(q)}, t ${t}`);
        // The index reads whole cells: the point's cell is in one of the runs read.
        const { l, c, h } = labToLch(p);
        const cell = cellOf(l, c, h);
        expect(runs.some(([from, to]) => cell >= from && cell <= to)).toBe(true);
      };
      for (let r = 0; r < 60; r++) {
        const hit = crossing(q, direction(rand), t);
        if (hit) check(hit.inside);
      }
      // And random colours around q: every one within t must be in the boxes.
      for (let r = 0; r < 200; r++) {
        const u = direction(rand);
        const d = rand() * t * 4;
        const p = { l: q.l + u[0] * d, a: q.a + u[1] * d, b: q.b + u[2] * d };
        if (deltaE2000(q, p) <= t) check(p);
      }
    }
    expect(probed).toBeGreaterThan(30_000);
  });

  it("stay tight enough to be worth it: on random sRGB colours they hold at most a few times the matches", () => {
    const rand = seeded(9);
    const points = Array.from({ length: 20_000 }, () => srgbToLab(Math.floor(rand() * 256), Math.floor(rand() * 256), Math.floor(rand() * 256)));
    let inBox = 0;
    let within = 0;
    for (let i = 0; i < 40; i++) {
      const q = srgbToLab(Math.floor(rand() * 256), Math.floor(rand() * 256), Math.floor(rand() * 256));
      const boxes = colourBoxes(q, 10);
      for (const p of points) {
        if (!inBoxes(boxes, p)) continue;
        inBox++;
        if (deltaE2000(q, p) <= 10) within++;
      }
    }
    expect(within).toBeGreaterThan(0);
    // Measured about 1.8 when written; a fixed L*a*b* box would be several times worse.
    expect(inBox / within).toBeLessThan(2.5);
  });

  it("rest on constants that hold: SL' < 0.0165, |dT/dh| < 0.0421 per degree, T(h) bounded on every arc", () => {
    // SL, T(h) as in Sharma, Wu & Dalal (2005) eqs. (15)–(18); checked here on a fine grid.
    let slSlope = 0;
    for (let l = -100; l <= 200; l += 0.01) slSlope = Math.max(slSlope, Math.abs(slOf(l + 1e-5) - slOf(l)) / 1e-5);
    expect(slSlope).toBeLessThan(0.0165);
    let tSlope = 0;
    for (let h = 0; h < 360; h += 0.01) tSlope = Math.max(tSlope, Math.abs(hueWeight(h + 1e-6) - hueWeight(h)) / 1e-6);
    expect(tSlope).toBeLessThan(0.0421);
    const rand = seeded(11);
    for (let i = 0; i < 3000; i++) {
      const from = rand() * 1080 - 360;
      const to = from + rand() * (rand() < 0.5 ? 10 : 400);
      let sampled = -Infinity;
      for (let k = 0; k <= 300; k++) sampled = Math.max(sampled, hueWeight(from + ((to - from) * k) / 300));
      expect(maxHueWeight(from, to)).toBeGreaterThanOrEqual(sampled);
      expect(maxHueWeight(from, to)).toBeLessThan(sampled + 0.05);
    }
  });

  it("refuse a threshold that is not positive", () => {
    expect(() => colourBoxes({ l: 50, a: 0, b: 0 }, 0)).toThrow(RangeError);
    expect(() => colourBoxes({ l: 50, a: 0, b: 0 }, Number.NaN)).toThrow(RangeError);
  });
});

// ---- The index in a real database ------------------------------------------------------------

let dir: string;
let db: Db;
let author: string;
let stripSeq = 0;

async function addStrip(bands: Lab[], status: "published" | "pending" | "hidden" | "returned" | "rejected" = "published") {
  const n = ++stripSeq;
  const now = new Date(Date.UTC(2026, 0, 1, 0, n)).toISOString();
  const upload = `index-test-${n}`;
  await db.insertInto("uploads").values({ id: upload, owner_id: author, status: "ready", original_key: null, mime: "image/webp", byte_size: 1, white_x: null, white_y: null, analysis_json: null, display_key: null, thumb_key: null, placeholder: null, phash: null, width: null, height: null, error_code: null, error_message: null, created_at: now, updated_at: now }).execute();
  const { id } = await db
    .insertInto("strips")
    .values({ author_id: author, upload_id: upload, title: `Strip ${n}`, notes_html: "", paper: "smooth-cardstock", tools_json: "[]", video_url: null, status, status_reason: null, orientation: "horizontal", ink_count: 1, phash: null, created_at: now, updated_at: now, published_at: status === "published" ? now : null, hold: null, duplicate_of: null })
    .returning("id")
    .executeTakeFirstOrThrow();
  if (bands.length) {
    await db
      .insertInto("strip_bands")
      .values(bands.map((lab, position) => ({ strip_id: id, position, start_frac: position / bands.length, end_frac: (position + 1) / bands.length, lab_l: lab.l, lab_a: lab.a, lab_b: lab.b, hex: "#808080", ink_id: null, delta_e: null })))
      .execute();
  }
  return id;
}

/** The naive answer, written without the index: every band of every published strip, ΔE2000 each. */
async function fullScan(colours: Lab[], t: number) {
  const bands = await db
    .selectFrom("strip_bands as b")
    .innerJoin("strips as s", "s.id", "b.strip_id")
    .select(["b.strip_id", "b.position", "b.lab_l", "b.lab_a", "b.lab_b"])
    .where("s.status", "=", "published")
    .orderBy("b.strip_id")
    .orderBy("b.position")
    .execute();
  const byStrip = new Map<number, typeof bands>();
  for (const b of bands) byStrip.set(b.strip_id, [...(byStrip.get(b.strip_id) ?? []), b]);
  const out = new Map<number, { position: number; deltaE: number }[]>();
  for (const [stripId, list] of byStrip) {
    const best = colours.map((q) => {
      let found: { position: number; deltaE: number } | null = null;
      for (const b of list) {
        const de = deltaE2000(q, { l: b.lab_l, a: b.lab_a, b: b.lab_b });
        if (de <= t && (!found || de < found.deltaE)) found = { position: b.position, deltaE: de };
      }
      return found;
    });
    if (best.every((b) => b)) out.set(stripId, best as { position: number; deltaE: number }[]);
  }
  return out;
}

const noFilter = { inks: [], notInks: [], brandIds: [] };

async function fastPath(colours: Lab[], t: number) {
  const hits = await findColourHits(db, colours, t, noFilter);
  return new Map([...hits.values()].map((h) => [h.stripId, h.bands]));
}

const sortedEntries = (m: Map<number, unknown>) => [...m.entries()].sort((a, b) => a[0] - b[0]);

describe("the colour index in a database", () => {
  const rand = seeded(2026);
  const queries = stressColours(rand, 70).map((q) => ({ q, t: thresholdOf(rand) }));

  beforeAll(async () => {
    dir = mkdtempSync(path.join(os.tmpdir(), "blendwell-search-index-"));
    db = openDatabase(path.join(dir, "index.sqlite"));
    await migrateToLatest(db);
    author = "00000000-0000-4000-8000-00000000a11c";
    await db.insertInto("User").values({ id: author, name: "Index tester", email: "index@blendwell.test", emailVerified: null, image: null }).execute();
    // Bands just inside and just outside each query's threshold (where a loose bound would
    // miss), plus colours spread over the sRGB gamut; a fifth of the strips are not published.
    const bands: Lab[] = [];
    for (const { q, t } of queries) {
      for (let i = 0; i < 12; i++) {
        const hit = crossing(q, direction(rand), t);
        if (hit) bands.push(i % 3 === 2 ? hit.outside : hit.inside);
      }
    }
    for (let i = 0; i < 900; i++) bands.push(srgbToLab(Math.floor(rand() * 256), Math.floor(rand() * 256), Math.floor(rand() * 256)));
    for (let i = bands.length - 1; i > 0; i--) {
      const j = Math.floor(rand() * (i + 1));
      [bands[i], bands[j]] = [bands[j]!, bands[i]!];
    }
    const statuses = ["published", "published", "published", "published", "pending", "hidden", "returned", "rejected"] as const;
    for (let i = 0; i < bands.length; ) {
      const n = 1 + Math.floor(rand() * 5);
      await addStrip(bands.slice(i, i + n), statuses[Math.floor(rand() * statuses.length)]!);
      i += n;
    }
  }, 60_000);
  afterAll(async () => {
    await db?.destroy();
    rmSync(dir, { recursive: true, force: true });
  });

  it("the fast path returns exactly the strips and band matches of a full scan (the proof the pre-filter never misses)", async () => {
    let compared = 0;
    let found = 0;
    const more = stressColours(rand, 80).map((q) => ({ q, t: thresholdOf(rand) }));
    for (const { q, t } of [...queries, ...more]) {
      const naive = await fullScan([q], t);
      const fast = await fastPath([q], t);
      expect(sortedEntries(fast), `query ${JSON.stringify(q)} at ΔE ${t}`).toEqual(sortedEntries(naive));
      compared++;
      found += naive.size;
    }
    expect(compared).toBe(150);
    expect(found).toBeGreaterThan(500); // the comparison is not between empty answers
  }, 60_000);

  it("several colours: a strip must have a band within the threshold for each", async () => {
    let nonEmpty = 0;
    for (let i = 0; i < 25; i++) {
      const colours = stressColours(rand, 2 + (i % 2));
      const t = 8 + rand() * 22;
      const naive = await fullScan(colours, t);
      expect(sortedEntries(await fastPath(colours, t))).toEqual(sortedEntries(naive));
      if (naive.size) nonEmpty++;
    }
    expect(nonEmpty).toBeGreaterThan(3);
  }, 60_000);

  it("stays in step with strip_bands through inserts, edits, deletes and a deleted strip", async () => {
    const sdb = searchDb(db);
    const indexed = async () =>
      (await sdb.selectFrom("strip_band_colours").select(["strip_id", "position", "l", "a", "b"]).orderBy("strip_id").orderBy("position").execute()).map((r) => [r.strip_id, r.position, r.l, r.a, r.b]);
    const stored = async () =>
      (await db.selectFrom("strip_bands").select(["strip_id", "position", "lab_l", "lab_a", "lab_b"]).orderBy("strip_id").orderBy("position").execute()).map((r) => [r.strip_id, r.position, r.lab_l, r.lab_a, r.lab_b]);
    expect(await indexed()).toEqual(await stored());

    const id = await addStrip([fromLch(50, 40, 30), fromLch(60, 20, 200)]);
    await db.updateTable("strip_bands").set({ lab_l: 70, lab_a: -30, lab_b: 10 }).where("strip_id", "=", id).where("position", "=", 0).execute();
    await db.updateTable("strip_bands").set({ ink_id: null, delta_e: 1.5 }).where("strip_id", "=", id).execute();
    await db.deleteFrom("strip_bands").where("strip_id", "=", id).where("position", "=", 1).execute();
    expect(await indexed()).toEqual(await stored());
    const moved = await fastPath([{ l: 70, a: -30, b: 10 }], 0.5);
    expect(moved.get(id)).toEqual([{ position: 0, deltaE: 0 }]);

    // Deleting the strip cascades to its bands, and the triggers clear the index.
    await db.deleteFrom("strips").where("id", "=", id).execute();
    expect(await indexed()).toEqual(await stored());
    expect((await fastPath([{ l: 70, a: -30, b: 10 }], 0.5)).has(id)).toBe(false);
  });

  it("refuses a band position it cannot key, and writes nothing", async () => {
    const id = await addStrip([]);
    await expect(
      db.insertInto("strip_bands").values({ strip_id: id, position: 1024, start_frac: 0, end_frac: 1, lab_l: 50, lab_a: 0, lab_b: 0, hex: "#777777", ink_id: null, delta_e: null }).execute(),
    ).rejects.toThrow(/between 0 and 1023/);
    expect(await db.selectFrom("strip_bands").select("position").where("strip_id", "=", id).execute()).toEqual([]);
  });

  it("files bands under the hue angles of the sRGB primaries and secondaries", async () => {
    // CIELAB (D65) hue angles h_ab of the sRGB primaries and secondaries, from the IEC 61966-2-1
    // primaries and the CIE 15:2004 L*a*b* formulas; values from memory of the commonly
    // tabulated L*a*b* of these colours (e.g. red 53.24, 80.09, 67.20), to 0.1°.
    const expected: [string, [number, number, number], number][] = [
      ["red", [255, 0, 0], 40.0],
      ["yellow", [255, 255, 0], 102.9],
      ["green", [0, 255, 0], 136.0],
      ["cyan", [0, 255, 255], 196.4],
      ["blue", [0, 0, 255], 306.3],
      ["magenta", [255, 0, 255], 328.2],
    ];
    const id = await addStrip(expected.map(([, rgb]) => srgbToLab(...rgb)), "pending");
    const rows = await searchDb(db).selectFrom("strip_band_colours").select(["position", "h", "cell"]).where("strip_id", "=", id).orderBy("position").execute();
    expect(rows).toHaveLength(expected.length);
    rows.forEach((row, i) => {
      expect(row.h, expected[i]![0]).toBeCloseTo(expected[i]![2], 1);
      const lch = labToLch(srgbToLab(...expected[i]![1]));
      expect(row.cell).toBe(cellOf(lch.l, lch.c, lch.h));
    });
  });

  it("is rebuilt from existing bands when the migration runs on a database that has strips", async () => {
    const before = await sql<{ n: number }>`select count(*) as n from strip_bands`.execute(db);
    // Back to just before the search index (whatever comes after it), then up again.
    const names = Object.keys(migrations);
    const result = await createMigrator(db).migrateTo(names[names.indexOf("20261202_0006_search_index") - 1]!);
    expect(result.error).toBeUndefined();
    expect(await sql`select name from sqlite_master where name = 'strip_band_colours'`.execute(db).then((r) => r.rows)).toEqual([]);
    await migrateToLatest(db);
    const after = await sql<{ n: number }>`select count(*) as n from strip_band_colours`.execute(db);
    expect(Number(after.rows[0]!.n)).toBe(Number(before.rows[0]!.n));
    const q = queries[0]!;
    expect(sortedEntries(await fastPath([q.q], q.t))).toEqual(sortedEntries(await fullScan([q.q], q.t)));
  });
});
