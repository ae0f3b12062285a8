import { isHex, normalizeHex } from "../../../shared/colour";
import { inkTypes, type InkType } from "../../../shared/schemas/inks";
import {
  DEFAULT_MAX_DELTA_E,
  MAX_MAX_DELTA_E,
  MAX_SEARCH_BRANDS,
  MAX_SEARCH_COLOURS,
  MAX_SEARCH_INKS,
  MIN_MAX_DELTA_E,
  searchSorts,
  stashModes,
  type SearchSort,
  type StashMode,
} from "../../../shared/schemas/search";
import { papers } from "../../../shared/schemas/strips";

export type Paper = (typeof papers)[number];

/**
 * A search as the page holds it. The address bar carries the same names as GET /api/strips
 * (`ink`, `notInk`, `color`, `maxDeltaE`, `brand`, `type`, `inkCount`, `paper`, `stash`, `sort`,
 * `adjacent`),
 * so a shared link opens the same search.
 */
export type SearchState = {
  ink: number[];
  notInk: number[];
  /** "#rrggbb", lower case. */
  color: string[];
  maxDeltaE: number;
  brand: string[];
  type?: InkType;
  inkCount?: number;
  paper?: Paper;
  stash?: StashMode;
  /** With exactly two inks: they sit next to each other in the ink order (else: anywhere). */
  adjacent?: boolean;
  /** As asked; see effectiveSort for what the list uses. */
  sort?: SearchSort;
};

export const emptySearch: SearchState = { ink: [], notInk: [], color: [], maxDeltaE: DEFAULT_MAX_DELTA_E, brand: [] };

const idPattern = /^[1-9]\d{0,9}$/;
const slugPattern = /^[a-z0-9-]{1,60}$/;
const oneOf = <T extends string>(list: readonly T[], v: string | null): T | undefined =>
  v !== null && (list as readonly string[]).includes(v) ? (v as T) : undefined;
const uniqueFirst = <T>(list: T[], max: number) => [...new Set(list)].slice(0, max);

/**
 * Reads a search from the address. A hand-edited or old link should still open something
 * sensible, so values the server would refuse are left out rather than shown as an error.
 */
export function parseSearch(params: URLSearchParams): SearchState {
  const ink = uniqueFirst(params.getAll("ink").filter((v) => idPattern.test(v)).map(Number), MAX_SEARCH_INKS);
  const notInk = uniqueFirst(
    params
      .getAll("notInk")
      .filter((v) => idPattern.test(v))
      .map(Number)
      .filter((id) => !ink.includes(id)),
    MAX_SEARCH_INKS,
  );
  const color = uniqueFirst(params.getAll("color").filter(isHex).map(normalizeHex), MAX_SEARCH_COLOURS);
  const rawDelta = Number(params.get("maxDeltaE"));
  const maxDeltaE =
    params.get("maxDeltaE") !== null && Number.isFinite(rawDelta)
      ? Math.min(MAX_MAX_DELTA_E, Math.max(MIN_MAX_DELTA_E, Math.round(rawDelta * 2) / 2))
      : DEFAULT_MAX_DELTA_E;
  const brand = uniqueFirst(params.getAll("brand").filter((v) => slugPattern.test(v)), MAX_SEARCH_BRANDS);
  const count = Number(params.get("inkCount"));
  const inkCount = Number.isInteger(count) && count >= 1 && count <= MAX_SEARCH_INKS ? count : undefined;
  let sort = oneOf(searchSorts, params.get("sort"));
  if (sort === "closest" && !color.length) sort = undefined;
  return {
    ink,
    notInk,
    color,
    maxDeltaE,
    brand,
    type: oneOf(inkTypes, params.get("type")),
    inkCount,
    paper: oneOf(papers, params.get("paper")),
    stash: oneOf(stashModes, params.get("stash")),
    ...(params.get("adjacent") === "true" && ink.length === 2 && { adjacent: true }),
    sort,
  };
}

/** The address for a search, leaving out what is the default. */
export function searchToParams(s: SearchState): URLSearchParams {
  const p = new URLSearchParams();
  for (const id of s.ink) p.append("ink", String(id));
  for (const id of s.notInk) p.append("notInk", String(id));
  for (const hex of s.color) p.append("color", hex);
  if (s.color.length && s.maxDeltaE !== DEFAULT_MAX_DELTA_E) p.set("maxDeltaE", String(s.maxDeltaE));
  for (const slug of s.brand) p.append("brand", slug);
  if (s.type) p.set("type", s.type);
  if (s.inkCount) p.set("inkCount", String(s.inkCount));
  if (s.paper) p.set("paper", s.paper);
  if (s.stash) p.set("stash", s.stash);
  if (s.adjacent && s.ink.length === 2) p.set("adjacent", "true");
  if (s.sort && s.sort !== defaultSort(s)) p.set("sort", s.sort);
  return p;
}

const defaultSort = (s: SearchState): SearchSort => (s.color.length ? "closest" : "newest");

/** Closest first for a colour search, newest otherwise; "closest" without a colour falls back. */
export function effectiveSort(s: SearchState): SearchSort {
  if (s.sort === "closest" && !s.color.length) return "newest";
  return s.sort ?? defaultSort(s);
}

/** The query for GET /api/strips. */
export function searchApiQuery(s: SearchState, limit: number) {
  return {
    ink: s.ink,
    notInk: s.notInk,
    color: s.color,
    maxDeltaE: s.color.length ? s.maxDeltaE : undefined,
    brand: s.brand,
    type: s.type,
    inkCount: s.inkCount,
    paper: s.paper,
    stash: s.stash,
    adjacent: s.adjacent && s.ink.length === 2 ? ("true" as const) : undefined,
    sort: effectiveSort(s),
    limit,
  };
}

/** How many filters narrow the search (the sort is not one). */
export function filterCount(s: SearchState): number {
  return (
    s.ink.length +
    s.notInk.length +
    s.color.length +
    s.brand.length +
    (s.type ? 1 : 0) +
    (s.inkCount ? 1 : 0) +
    (s.paper ? 1 : 0) +
    (s.stash ? 1 : 0) +
    (s.adjacent ? 1 : 0)
  );
}

export type Loosening = { key: string; label: string; next: SearchState };

/** A ΔE2000 threshold a step wider than this one (within the server's range), or null at the top. */
export function widerThreshold(current: number): number | null {
  if (current >= MAX_MAX_DELTA_E) return null;
  const steps = [2, 5, 10, 15, 20, MAX_MAX_DELTA_E];
  return steps.find((v) => v > current) ?? MAX_MAX_DELTA_E;
}

/**
 * When nothing matches: each way to loosen the search by one step, the gentlest first. Names
 * of inks and brands come from the caller (the page knows them).
 */
export function loosenings(s: SearchState, names: { ink: (id: number) => string; brand: (slug: string) => string; colour: (hex: string) => string }): Loosening[] {
  const out: Loosening[] = [];
  const wider = s.color.length ? widerThreshold(s.maxDeltaE) : null;
  if (wider !== null) out.push({ key: "wider", label: `Widen the closeness to ΔE ${wider}`, next: { ...s, maxDeltaE: wider } });
  if (s.stash === "all") out.push({ key: "stash-one", label: "Include strips missing one of your inks", next: { ...s, stash: "missingOne" } });
  if (s.stash) out.push({ key: "stash", label: "Search beyond your stash", next: { ...s, stash: undefined } });
  if (s.adjacent) out.push({ key: "adjacent", label: "The two inks anywhere in the strip", next: { ...s, adjacent: undefined } });
  if (s.inkCount) out.push({ key: "count", label: "Any number of inks", next: { ...s, inkCount: undefined } });
  if (s.paper) out.push({ key: "paper", label: "Any paper", next: { ...s, paper: undefined } });
  if (s.type) out.push({ key: "type", label: "Any ink type", next: { ...s, type: undefined } });
  for (const slug of s.brand) out.push({ key: `brand-${slug}`, label: `Any brand, not only ${names.brand(slug)}`, next: { ...s, brand: s.brand.filter((b) => b !== slug) } });
  for (const id of s.notInk) out.push({ key: `not-${id}`, label: `Allow ${names.ink(id)} again`, next: { ...s, notInk: s.notInk.filter((x) => x !== id) } });
  if (s.ink.length > 1) {
    for (const id of s.ink) out.push({ key: `ink-${id}`, label: `Without ${names.ink(id)}`, next: { ...s, ink: s.ink.filter((x) => x !== id) } });
  }
  if (s.color.length > 1) {
    for (const hex of s.color) out.push({ key: `color-${hex}`, label: `Without the ${names.colour(hex)} (${hex})`, next: { ...s, color: s.color.filter((x) => x !== hex) } });
  }
  return out;
}
