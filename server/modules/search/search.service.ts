import { deltaE2000, describeDeltaE, hexToLab, type Lab } from "../../../shared/colour";
import { LOOK_ALIKE_DELTA_E, type ColourMatch, type StripSearchList, type StripSearchQuery, type StripSearchResult } from "../../../shared/schemas/search";
import type { Strip } from "../../../shared/schemas/strips";
import type { DbOrTx } from "../../db/client";
import type { StripRow } from "../../db/schema";
import { AppError } from "../../middleware/errors";
import { colourBoxes } from "./colour-bounds";
import { decodeSearchCursor, encodeSearchCursor, type SearchCursor } from "./search-cursor";
import * as repo from "./search.repository";
import { searchDb, type SearchDb } from "./search-tables";

export type SearchResult = {
  /** The page, in order; published strips only. */
  rows: StripRow[];
  /** For colour searches: per strip, where each asked-for colour was found. */
  matches: Map<number, ColourMatch[]>;
  nextCursor: string | null;
  /** Given on a first page when known exactly (see StripSearchList.total). */
  total?: number;
};

/** The best band of one strip for one colour. */
export type BandHit = { position: number; deltaE: number };

/** A strip with a band within the threshold for every asked-for colour. */
export type ColourHit = {
  stripId: number;
  /** One per colour, in the order asked. */
  bands: BandHit[];
  /** The largest of the per-colour best ΔE2000: how well the strip answers the whole search. */
  distance: number;
  publishedAt: string | null;
  saves: number;
};

const round2 = (n: number) => Math.round(n * 100) / 100;

/** Turns ids and slugs into a filter, refusing (422) any that the catalogue does not know. */
async function resolveFilter(db: SearchDb, q: StripSearchQuery, viewerId: string | null): Promise<repo.StripFilter> {
  if (q.stash && !viewerId) throw new AppError("sign_in_required", "Sign in to search by the inks in your stash.", 401);
  const asked = [...(q.ink ?? []), ...(q.notInk ?? [])];
  const known = new Set((await repo.findKnownInks(db, asked)).map((r) => r.id));
  const brands = await repo.findBrandsBySlug(db, q.brand ?? []);
  const fields: Record<string, string[]> = {};
  const missing = (ids: number[] | undefined) => (ids ?? []).filter((id) => !known.has(id));
  const unknownInks = missing(q.ink);
  const unknownExcluded = missing(q.notInk);
  if (unknownInks.length) fields.ink = [`unknown ink id${unknownInks.length > 1 ? "s" : ""}: ${unknownInks.join(", ")}`];
  if (unknownExcluded.length) fields.notInk = [`unknown ink id${unknownExcluded.length > 1 ? "s" : ""}: ${unknownExcluded.join(", ")}`];
  const unknownBrands = (q.brand ?? []).filter((slug) => !brands.some((b) => b.slug === slug));
  if (unknownBrands.length) fields.brand = [`unknown brand${unknownBrands.length > 1 ? "s" : ""}: ${unknownBrands.join(", ")}`];
  if (Object.keys(fields).length) {
    throw new AppError("unknown_filters", "Some inks or brands in this search are not in the catalogue.", 422, fields);
  }
  return {
    inks: q.ink ?? [],
    notInks: q.notInk ?? [],
    brandIds: (q.brand ?? []).map((slug) => brands.find((b) => b.slug === slug)!.id),
    inkType: q.type,
    inkCount: q.inkCount,
    paper: q.paper,
    authorId: q.author,
    ...(q.adjacent && q.ink?.length === 2 && { adjacent: [q.ink[0]!, q.ink[1]!] as [number, number] }),
    ...(q.stash && viewerId && { stash: { userId: viewerId, mode: q.stash } }),
  };
}

/**
 * For each strip (any status) with a band within ΔE2000 `radius` of every colour: its best band
 * per colour (lowest ΔE2000, then lowest position). The index gives candidates that may be
 * farther; exact ΔE2000 (the shared wrapper) decides.
 */
export async function bandMatches(db: DbOrTx, colours: Lab[], radius: number): Promise<Map<number, BandHit[]>> {
  const sdb = searchDb(db);
  let best: Map<number, BandHit[]> | null = null;
  for (let i = 0; i < colours.length; i++) {
    const colour = colours[i]!;
    const rows = await repo.bandsInBoxes(sdb, colourBoxes(colour, radius));
    const next = new Map<number, BandHit[]>();
    for (const row of rows) {
      const earlier = best?.get(row.strip_id);
      if (best && !earlier) continue; // already missing an earlier colour
      const de = deltaE2000(colour, { l: row.l, a: row.a, b: row.b });
      if (!(de <= radius)) continue;
      const bands = next.get(row.strip_id);
      if (!bands) {
        next.set(row.strip_id, [...(earlier ?? []), { position: row.position, deltaE: de }]);
        continue;
      }
      const mine = bands[i]!;
      if (de < mine.deltaE || (de === mine.deltaE && row.position < mine.position)) bands[i] = { position: row.position, deltaE: de };
    }
    best = next;
  }
  return best ?? new Map();
}

const distanceOf = (bands: BandHit[]) => Math.max(...bands.map((b) => b.deltaE));

/** Of these strips (in this order), the published ones that pass the filter, in the same order. */
async function visibleHits(db: DbOrTx, ids: number[], best: Map<number, BandHit[]>, filter: repo.StripFilter): Promise<ColourHit[]> {
  const found = new Map((await repo.visibleStrips(searchDb(db), ids, filter)).map((s) => [s.id, s]));
  const hits: ColourHit[] = [];
  for (const id of ids) {
    const s = found.get(id);
    if (!s) continue;
    const bands = best.get(id)!;
    hits.push({ stripId: id, bands, distance: distanceOf(bands), publishedAt: s.published_at, saves: s.saves });
  }
  return hits;
}

/**
 * Every published strip (matching the filter) with a band within ΔE2000 `radius` of every
 * colour, with its best band per colour.
 */
export async function findColourHits(db: DbOrTx, colours: Lab[], radius: number, filter: repo.StripFilter): Promise<Map<number, ColourHit>> {
  const best = await bandMatches(db, colours, radius);
  const hits = await visibleHits(db, [...best.keys()], best, filter);
  return new Map(hits.map((h) => [h.stripId, h]));
}

const byNewest = (a: ColourHit, b: ColourHit) => (a.publishedAt === b.publishedAt ? b.stripId - a.stripId : (b.publishedAt ?? "") < (a.publishedAt ?? "") ? -1 : 1);
const bySaves = (a: ColourHit, b: ColourHit) => b.saves - a.saves || b.stripId - a.stripId;

function afterCursor(hit: Pick<ColourHit, "stripId" | "distance" | "publishedAt" | "saves">, c: SearchCursor | undefined) {
  if (!c) return true;
  if (c.s === "closest") return hit.distance > c.k || (hit.distance === c.k && hit.stripId > c.i);
  if (c.s === "saves") return hit.saves < c.k || (hit.saves === c.k && hit.stripId < c.i);
  const at = hit.publishedAt ?? "";
  return at < c.k || (at === c.k && hit.stripId < c.i);
}

/**
 * "Closest": strips in order of distance, from an eighth of the threshold outwards. Every strip within the
 * radius is known exactly, so once a page of visible strips is in hand the page is settled (all
 * others are farther). Otherwise the radius grows by the volume still needed — a ΔE ball holds
 * about r³ — and the last try is the threshold itself, which also gives the total.
 */
async function closestHits(db: DbOrTx, colours: Lab[], threshold: number, limit: number, filter: repo.StripFilter, cursor: SearchCursor | undefined) {
  const from = cursor?.s === "closest" ? Math.min(cursor.k, threshold) : 0;
  let radius = from + (threshold - from) / 8;
  for (let attempt = 0; ; attempt++) {
    if (attempt >= 5) radius = threshold;
    const final = radius >= threshold;
    const best = await bandMatches(db, colours, radius);
    const order = [...best.entries()]
      .map(([stripId, bands]) => ({ stripId, distance: distanceOf(bands), publishedAt: null, saves: 0 }))
      .filter((h) => afterCursor(h, cursor))
      .sort((a, b) => a.distance - b.distance || a.stripId - b.stripId)
      .map((h) => h.stripId);
    // Visibility in growing batches, nearest first, until a page (and one more) is found.
    const hits: ColourHit[] = [];
    for (let at = 0, batch = (limit + 1) * 2; at < order.length && (final || hits.length <= limit); at += batch, batch *= 2) {
      hits.push(...(await visibleHits(db, order.slice(at, at + batch), best, filter)));
    }
    if (final) return { ordered: hits, complete: true };
    if (hits.length > limit) return { ordered: hits, complete: false };
    const grow = Math.min(8, Math.max(1.4, ((limit + 1) * 1.3) / Math.max(hits.length, 0.5)));
    radius = Math.min(threshold, Math.cbrt(from ** 3 + (radius ** 3 - from ** 3) * grow));
  }
}

/** Strips per batch when walking strips in sort order for a colour. */
const WALK_BATCH = 256;

/**
 * Newest or most saved with colours: when matches are common, walk published strips in that
 * order and test each one's bands (exact ΔE2000) until a page is full — about limit·N/m strips
 * for m matches among N. When they are rare, gather them all through the index (and count them).
 * A quarter-radius probe through the index estimates m (a ΔE ball holds about r³).
 */
async function sortedColourHits(db: DbOrTx, colours: Lab[], threshold: number, q: StripSearchQuery, filter: repo.StripFilter, cursor: SearchCursor | undefined) {
  const sort = q.sort === "saves" ? "saves" : "newest";
  const probe = await bandMatches(db, colours, threshold / 4);
  const estimate = probe.size * 64;
  const all = Math.max(1, await repo.stripCountEstimate(searchDb(db)));
  const walk = ((q.limit + 1) * all) / Math.max(1, estimate);
  if (walk * 4 < estimate) {
    const sdb = searchDb(db);
    const hits: ColourHit[] = [];
    let after = cursor && cursor.s !== "closest" ? { key: cursor.k, id: cursor.i } : undefined;
    for (;;) {
      const strips = await repo.listStrips(sdb, filter, sort, after, WALK_BATCH);
      if (!strips.length) break;
      const bands = await repo.bandsOfStrips(sdb, strips.map((s) => s.id));
      for (const s of strips) {
        const own = bands.get(s.id) ?? [];
        const best: BandHit[] = [];
        for (const colour of colours) {
          let hit: BandHit | null = null;
          for (const b of own) {
            const de = deltaE2000(colour, { l: b.l, a: b.a, b: b.b });
            if (de <= threshold && (!hit || de < hit.deltaE || (de === hit.deltaE && b.position < hit.position))) hit = { position: b.position, deltaE: de };
          }
          if (!hit) break;
          best.push(hit);
        }
        if (best.length === colours.length) hits.push({ stripId: s.id, bands: best, distance: distanceOf(best), publishedAt: s.published_at, saves: s.saves });
      }
      if (hits.length > q.limit || strips.length < WALK_BATCH) break;
      const last = strips[strips.length - 1]!;
      after = { key: sort === "saves" ? last.saves : (last.published_at ?? ""), id: last.id };
    }
    return { ordered: hits, complete: false };
  }
  const hits = await findColourHits(db, colours, threshold, filter);
  return { ordered: [...hits.values()].filter((h) => afterCursor(h, cursor)).sort(sort === "saves" ? bySaves : byNewest), complete: true };
}

async function colourSearch(db: DbOrTx, q: StripSearchQuery, filter: repo.StripFilter, cursor: SearchCursor | undefined) {
  const colours = q.color!.map((hex) => hexToLab(hex));
  const { ordered, complete } =
    q.sort === "closest" ? await closestHits(db, colours, q.maxDeltaE, q.limit, filter, cursor) : await sortedColourHits(db, colours, q.maxDeltaE, q, filter, cursor);
  const page = ordered.slice(0, q.limit);
  const last = page[page.length - 1];
  let nextCursor: string | null = null;
  if (ordered.length > q.limit && last) {
    const c: SearchCursor =
      q.sort === "closest"
        ? { s: "closest", k: last.distance, i: last.stripId }
        : q.sort === "saves"
          ? { s: "saves", k: last.saves, i: last.stripId }
          : { s: "newest", k: last.publishedAt ?? "", i: last.stripId };
    nextCursor = encodeSearchCursor(c);
  }
  const rows = await repo.findStripsByIds(searchDb(db), page.map((h) => h.stripId));
  const byId = new Map(rows.map((r) => [r.id, r]));
  const matches = new Map<number, ColourMatch[]>();
  for (const hit of page) {
    matches.set(
      hit.stripId,
      hit.bands.map((b, i) => ({ color: q.color![i]!, bandIndex: b.position, deltaE: round2(b.deltaE) })),
    );
  }
  return {
    rows: page.map((h) => byId.get(h.stripId)).filter((r): r is StripRow => !!r),
    matches,
    nextCursor,
    ...(complete && !cursor && { total: ordered.length }),
  };
}

function keysetCursor(sort: "newest" | "saves", id: number, key: string | number | null): string {
  return encodeSearchCursor(sort === "saves" ? { s: "saves", k: Number(key ?? 0), i: id } : { s: "newest", k: String(key ?? ""), i: id });
}

/**
 * Without colours. With required inks, matches come from the inks' own strips (an index merge,
 * each strip looked up once), gathered and sorted here, which also gives the total. With one
 * ink they are counted first: when they are many (m of N strips), walking strips in sort order
 * finds a page sooner — about (limit + 1)·N/m strips. Two or more inks together are rarely
 * common enough for that.
 */
async function inkSearch(db: SearchDb, q: StripSearchQuery, filter: repo.StripFilter, cursor: SearchCursor | undefined) {
  const sort = q.sort === "saves" ? "saves" : "newest";
  const after = cursor && cursor.s !== "closest" ? { key: cursor.k, id: cursor.i } : undefined;
  let total: number | undefined;
  if (filter.inks.length) {
    let gather = true;
    if (filter.inks.length === 1) {
      total = await repo.countStrips(db, filter);
      const all = Math.max(1, await repo.stripCountEstimate(db));
      gather = total <= ((q.limit + 1) * all) / Math.max(1, total);
    }
    if (gather) {
      const keys = total === 0 ? [] : await repo.matchingKeys(db, filter, sort);
      const cmp = (a: { id: number; k: string | number | null }, b: { id: number; k: string | number | null }) => {
        const ka = a.k ?? "";
        const kb = b.k ?? "";
        return ka === kb ? b.id - a.id : ka < kb ? 1 : -1;
      };
      const ordered = keys
        .filter((r) => !after || (r.k ?? "") < after.key || ((r.k ?? "") === after.key && r.id < after.id))
        .sort(cmp);
      const page = ordered.slice(0, q.limit);
      const rows = await repo.findStripsByIds(db, page.map((r) => r.id));
      const byId = new Map(rows.map((r) => [r.id, r]));
      const last = page[page.length - 1];
      return {
        rows: page.map((r) => byId.get(r.id)).filter((r): r is StripRow => !!r),
        matches: new Map<number, ColourMatch[]>(),
        nextCursor: ordered.length > q.limit && last ? keysetCursor(sort, last.id, last.k) : null,
        ...(!cursor && { total: ordered.length }),
      };
    }
  }
  const rows = await repo.listStrips(db, filter, sort, after, q.limit + 1);
  const page = rows.slice(0, q.limit);
  const last = page[page.length - 1];
  const nextCursor = rows.length > q.limit && last ? keysetCursor(sort, last.id, sort === "saves" ? last.saves : last.published_at) : null;
  if (!cursor && total === undefined) total = page.length < q.limit ? page.length : await repo.countStrips(db, filter);
  return { rows: page, matches: new Map<number, ColourMatch[]>(), nextCursor, ...(!cursor && { total }) };
}

/**
 * Searches published strips — nothing else ever — by inks, brands, ink type, ink count, paper,
 * author and colours. Rows come back in page order, ready for the strips module's hydrate().
 */
export async function searchStrips(db: DbOrTx, q: StripSearchQuery, viewerId: string | null = null): Promise<SearchResult> {
  const sdb = searchDb(db);
  const cursor = q.cursor ? decodeSearchCursor(q.cursor, q.sort) : undefined;
  const filter = await resolveFilter(sdb, q, viewerId);
  if (q.color?.length) return colourSearch(db, q, filter, cursor);
  return inkSearch(sdb, q, filter, cursor);
}

type OwnedInk = { id: number; name: string; brand: string; hex: string; lab: Lab };

async function ownedInks(db: DbOrTx, userId: string): Promise<OwnedInk[]> {
  const rows = await db
    .selectFrom("stash_items as s")
    .innerJoin("inks as i", "i.id", "s.ink_id")
    .innerJoin("brands as b", "b.id", "i.brand_id")
    .select(["i.id", "i.name", "b.name as brand", "i.hex", "i.lab_l", "i.lab_a", "i.lab_b"])
    .where("s.user_id", "=", userId)
    .execute();
  return rows.map((r) => ({ id: r.id, name: r.name, brand: r.brand, hex: r.hex, lab: { l: r.lab_l, a: r.lab_a, b: r.lab_b } }));
}

/** The member's ink closest to a missing one, if it is a look-alike (within LOOK_ALIKE_DELTA_E). */
function closestOwned(lab: Lab, owned: OwnedInk[]): StripSearchResult["ownedLookAlike"] | null {
  let best: { ink: OwnedInk; deltaE: number } | null = null;
  for (const ink of owned) {
    const deltaE = round2(deltaE2000(lab, ink.lab));
    if (deltaE <= LOOK_ALIKE_DELTA_E && (!best || deltaE < best.deltaE || (deltaE === best.deltaE && ink.id < best.ink.id))) best = { ink, deltaE };
  }
  if (!best) return null;
  const { ink, deltaE } = best;
  return { inkId: ink.id, name: ink.name, brand: ink.brand, hex: ink.hex, deltaE, words: describeDeltaE(deltaE) };
}

/**
 * The whole GET /api/strips answer: search, then the strips module's hydrate() (passed in, so
 * this module does not import the strips service that calls it), with each colour search result
 * carrying its matches.
 */
export async function searchStripList(
  db: DbOrTx,
  q: StripSearchQuery,
  hydrate: (db: DbOrTx, rows: StripRow[]) => Promise<Strip[]>,
  viewerId: string | null = null,
): Promise<StripSearchList> {
  const result = await searchStrips(db, q, viewerId);
  const strips = await hydrate(db, result.rows);
  let owned: OwnedInk[] | null = null;
  if (q.stash === "missingOne" && viewerId) owned = await ownedInks(db, viewerId);
  const ownedIds = new Set((owned ?? []).map((i) => i.id));
  return {
    items: strips.map((s) => {
      const match = result.matches.get(s.id);
      const missing = owned ? s.inks.find((ink) => !ownedIds.has(ink.id)) : undefined;
      const lookAlike = missing && owned ? closestOwned(missing.lab, owned) : null;
      return { ...s, ...(match && { match }), ...(missing && { missingInkId: missing.id }), ...(lookAlike && { ownedLookAlike: lookAlike }) };
    }),
    nextCursor: result.nextCursor,
    ...(result.total !== undefined && { total: result.total }),
  };
}
