// Search benchmark (issue 5): `npx tsx scripts/bench-search.ts`.
// Builds a temporary database with the project's migrations, 100,000 published strips and
// 400,000 bands, then measures in one run: colour search (the API's default "closest" first
// page, ΔE 10) p50/p95; the same searches answered by a naive full scan that computes ΔE2000
// for every band (p95, and a check that both give the same page); ink search p95 for one and
// two inks. Prints figures; the last line is one JSON object.
// Band colours are uniform random 8-bit sRGB: spread over the whole gamut, so every query lands
// in populated colour space (real strips cluster around catalogue inks).
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import SQLite from "better-sqlite3";
import { deltaE2000, hexToLab, srgbToLab, type Lab } from "../shared/colour";
import { stripSearchQuery, type StripSearchQueryInput } from "../shared/schemas/search";
import { openDatabase, type Db } from "../server/db/client";
import { migrateToLatest } from "../server/db/migrate";
import { seedDemo } from "../server/demo/seed";
import { searchStrips } from "../server/modules/search/search.service";
import { seededRandom } from "../server/demo/seeded-random";

const STRIPS = Number(process.env.BENCH_STRIPS ?? 100_000);
const BANDS_PER_STRIP = 4;
const COLOUR_QUERIES = 200;
const FULL_SCAN_QUERIES = 12;
const INK_QUERIES = 200;
const PAGE = 20;

// Deterministic pseudo-random numbers, so runs are comparable.
const rnd = seededRandom(20261202);
const pick = <T>(list: readonly T[]) => list[Math.floor(rnd() * list.length)]!;
const hex = (r: number, g: number, b: number) => "#" + ((1 << 24) | (r << 16) | (g << 8) | b).toString(16).slice(1);
const randomHex = () => hex(Math.floor(rnd() * 256), Math.floor(rnd() * 256), Math.floor(rnd() * 256));

function percentile(values: number[], p: number) {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
}
const ms = (n: number) => Math.round(n * 100) / 100;

async function build(file: string) {
  const db = openDatabase(file);
  await migrateToLatest(db);
  await seedDemo(db);
  const inks = await db.selectFrom("inks").select("id").execute();
  const authors = await db.selectFrom("profiles").select("user_id").execute();
  await db.destroy();

  // Bulk load on a connection of its own: prepared statements, big transactions, no fsync.
  const raw = new SQLite(file);
  raw.pragma("journal_mode = WAL");
  raw.pragma("synchronous = OFF");
  const insUpload = raw.prepare(
    "insert into uploads (id, owner_id, status, mime, byte_size, created_at, updated_at) values (?, ?, 'ready', 'image/webp', 1, ?, ?)",
  );
  const insStrip = raw.prepare(
    `insert into strips (author_id, upload_id, title, paper, tools_json, status, orientation, ink_count, saves, created_at, updated_at, published_at)
     values (?, ?, ?, ?, '[]', 'published', 'horizontal', ?, ?, ?, ?, ?)`,
  );
  const insInk = raw.prepare("insert into strip_inks (strip_id, position, ink_id) values (?, ?, ?)");
  const insBand = raw.prepare(
    "insert into strip_bands (strip_id, position, start_frac, end_frac, lab_l, lab_a, lab_b, hex, ink_id, delta_e) values (?, ?, ?, ?, ?, ?, ?, ?, ?, null)",
  );
  const papers = ["smooth-cardstock", "hot-press", "cold-press", "mixed-media", "other"];
  const start = Date.parse("2025-01-01T00:00:00Z");
  const batch = raw.transaction((from: number, to: number) => {
    for (let i = from; i < to; i++) {
      const author = pick(authors).user_id;
      const at = new Date(start + i * 60_000 + Math.floor(rnd() * 30_000)).toISOString();
      const upload = `bench-${i}`;
      insUpload.run(upload, author, at, at);
      const chosen = new Set<number>();
      while (chosen.size < BANDS_PER_STRIP) chosen.add(pick(inks).id);
      const inkIds = [...chosen];
      const id = Number(insStrip.run(author, upload, `Bench strip ${i}`, pick(papers), inkIds.length, Math.floor(rnd() * rnd() * 500), at, at, at).lastInsertRowid);
      inkIds.forEach((inkId, position) => insInk.run(id, position, inkId));
      for (let position = 0; position < BANDS_PER_STRIP; position++) {
        const r = Math.floor(rnd() * 256);
        const g = Math.floor(rnd() * 256);
        const b = Math.floor(rnd() * 256);
        const lab = srgbToLab(r, g, b);
        insBand.run(id, position, position / BANDS_PER_STRIP, (position + 1) / BANDS_PER_STRIP, lab.l, lab.a, lab.b, hex(r, g, b), inkIds[position]!);
      }
    }
  });
  for (let from = 0; from < STRIPS; from += 10_000) batch(from, Math.min(STRIPS, from + 10_000));
  raw.pragma("wal_checkpoint(TRUNCATE)");
  raw.exec("analyze");
  raw.close();
  return inks.map((i) => i.id);
}

type BandRow = { strip_id: number; position: number; lab_l: number; lab_a: number; lab_b: number };

/** The naive answer: every band of every published strip, ΔE2000 each, best band per strip. */
function fullScan(bands: BandRow[], colour: Lab, t: number) {
  const best = new Map<number, { position: number; deltaE: number }>();
  for (const band of bands) {
    const de = deltaE2000(colour, { l: band.lab_l, a: band.lab_a, b: band.lab_b });
    if (!(de <= t)) continue;
    const cur = best.get(band.strip_id);
    if (!cur || de < cur.deltaE || (de === cur.deltaE && band.position < cur.position)) best.set(band.strip_id, { position: band.position, deltaE: de });
  }
  return best;
}

async function main() {
  const dir = mkdtempSync(path.join(os.tmpdir(), "blendwell-bench-"));
  const file = path.join(dir, "bench.sqlite");
  let db: Db | undefined;
  try {
    const load = () => os.loadavg().map((n) => n.toFixed(1)).join(", ");
    console.log(`machine: ${os.cpus().length} cores, load average ${load()} (other work on the machine slows every figure)`);
    let t0 = performance.now();
    const inkIds = await build(file);
    console.log(`built ${STRIPS} published strips, ${STRIPS * BANDS_PER_STRIP} bands in ${((performance.now() - t0) / 1000).toFixed(1)} s`);
    db = openDatabase(file);
    const search = (input: StripSearchQueryInput) => searchStrips(db!, stripSearchQuery.parse(input));

    // Warm the page cache and the JIT.
    for (let i = 0; i < 20; i++) await search({ color: randomHex(), maxDeltaE: "10" });

    const colourTimes: number[] = [];
    const queries: string[] = [];
    for (let i = 0; i < COLOUR_QUERIES; i++) {
      const q = randomHex();
      queries.push(q);
      t0 = performance.now();
      await search({ color: q, maxDeltaE: "10" });
      colourTimes.push(performance.now() - t0);
    }
    const colorP50Ms = ms(percentile(colourTimes, 50));
    const colorP95Ms = ms(percentile(colourTimes, 95));
    console.log(`colour search (closest, first page of ${PAGE}, ΔE 10), ${COLOUR_QUERIES} random colours: p50 ${colorP50Ms} ms, p95 ${colorP95Ms} ms, max ${ms(Math.max(...colourTimes))} ms`);

    const newestTimes: number[] = [];
    for (let i = 0; i < 20; i++) {
      t0 = performance.now();
      await search({ color: queries[i]!, maxDeltaE: "10", sort: "newest" });
      newestTimes.push(performance.now() - t0);
    }
    console.log(`colour search sorted newest (ΔE 10), 20 colours: p50 ${ms(percentile(newestTimes, 50))} ms, p95 ${ms(percentile(newestTimes, 95))} ms`);

    const published = new Map((await db.selectFrom("strips").select(["id", "published_at"]).where("status", "=", "published").execute()).map((r) => [r.id, r.published_at ?? ""]));
    const scanTimes: number[] = [];
    let mismatches = 0;
    for (let i = 0; i < FULL_SCAN_QUERIES; i++) {
      const q = queries[i]!;
      t0 = performance.now();
      const bands = await db
        .selectFrom("strip_bands as b")
        .innerJoin("strips as s", "s.id", "b.strip_id")
        .select(["b.strip_id", "b.position", "b.lab_l", "b.lab_a", "b.lab_b"])
        .where("s.status", "=", "published")
        .execute();
      const all = fullScan(bands, hexToLab(q), 10);
      const closest = [...all.entries()].sort((a, b) => a[1].deltaE - b[1].deltaE || a[0] - b[0]).slice(0, PAGE);
      scanTimes.push(performance.now() - t0);
      const newest = [...all.entries()].sort((a, b) => (published.get(b[0])! < published.get(a[0])! ? -1 : published.get(b[0])! > published.get(a[0])! ? 1 : b[0] - a[0])).slice(0, PAGE);
      for (const [sort, naive] of [["closest", closest], ["newest", newest]] as const) {
        const fast = await search({ color: q, maxDeltaE: "10", sort });
        const same =
          fast.rows.length === naive.length &&
          naive.every(([id, m], k) => fast.rows[k]!.id === id && fast.matches.get(id)![0]!.bandIndex === m.position && fast.matches.get(id)![0]!.deltaE === Math.round(m.deltaE * 100) / 100);
        if (!same) mismatches++;
      }
    }
    const fullScanP95Ms = ms(percentile(scanTimes, 95));
    console.log(`naive full scan (read every band, ΔE2000 each), ${FULL_SCAN_QUERIES} colours: p50 ${ms(percentile(scanTimes, 50))} ms, p95 ${fullScanP95Ms} ms`);
    console.log(`same first page as the full scan (closest and newest): ${2 * FULL_SCAN_QUERIES - mismatches} of ${2 * FULL_SCAN_QUERIES}`);

    const oneInk: number[] = [];
    const twoInks: number[] = [];
    for (let i = 0; i < INK_QUERIES; i++) {
      t0 = performance.now();
      await search({ ink: String(pick(inkIds)) });
      oneInk.push(performance.now() - t0);
      // Two inks that share a strip, so the search has results.
      const pair = await db.selectFrom("strip_inks").select("ink_id").where("strip_id", "=", 1 + Math.floor(rnd() * STRIPS)).orderBy("position").limit(2).execute();
      t0 = performance.now();
      await search({ ink: pair.map((p) => String(p.ink_id)) });
      twoInks.push(performance.now() - t0);
    }
    const oneP95 = ms(percentile(oneInk, 95));
    const twoP95 = ms(percentile(twoInks, 95));
    console.log(`ink search (newest, first page with total), ${INK_QUERIES} each: one ink p50 ${ms(percentile(oneInk, 50))} ms p95 ${oneP95} ms; two inks p50 ${ms(percentile(twoInks, 50))} ms p95 ${twoP95} ms`);

    console.log(`load average at the end: ${load()}`);
    const speedup = Math.round((fullScanP95Ms / colorP95Ms) * 10) / 10;
    const inkP95Ms = Math.max(oneP95, twoP95);
    const verdict = (ok: boolean) => (ok ? "met" : "MISSED");
    console.log(`targets: colour p95 ≤ 25 ms ${verdict(colorP95Ms <= 25)}; ≥ 20× the full scan ${verdict(speedup >= 20)} (${speedup}×); identical pages ${verdict(mismatches === 0)}; ink p95 ≤ 10 ms ${verdict(inkP95Ms <= 10)}`);
    console.log(JSON.stringify({ colorP50Ms, colorP95Ms, fullScanP95Ms, speedup, inkP95Ms, strips: STRIPS }));
  } finally {
    await db?.destroy();
    rmSync(dir, { recursive: true, force: true });
  }
}

await main();
