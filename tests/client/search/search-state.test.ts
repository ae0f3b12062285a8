// The search page's address ↔ search state, checked against the API's own contract: every
// address the page writes must be accepted by the server's query schema (shared/schemas/search).
import { describe, expect, it } from "vitest";
import { describeDeltaE } from "../../../shared/colour";
import { DEFAULT_MAX_DELTA_E, stripSearchQuery } from "../../../shared/schemas/search";
import { papers } from "../../../shared/schemas/strips";
import { inkTypes } from "../../../shared/schemas/inks";
import {
  effectiveSort,
  emptySearch,
  filterCount,
  loosenings,
  parseSearch,
  searchApiQuery,
  searchToParams,
  widerThreshold,
  type SearchState,
} from "../../../src/features/search/search-state";
import { thresholdWords } from "../../../src/features/search/threshold-words";
import { seededRandom as seeded } from "../../../server/demo/seeded-random";


function randomSearch(rand: () => number): SearchState {
  const n = (max: number) => Math.floor(rand() * (max + 1));
  const ids = [...new Set(Array.from({ length: n(4) }, () => 1 + n(200)))];
  const split = n(ids.length);
  const hex = () => `#${Array.from({ length: 3 }, () => n(255).toString(16).padStart(2, "0")).join("")}`;
  const color = [...new Set(Array.from({ length: n(3) }, hex))];
  const sorts = [undefined, "newest", "saves", ...(color.length ? (["closest"] as const) : [])] as const;
  return {
    ink: ids.slice(0, split),
    notInk: ids.slice(split),
    color,
    maxDeltaE: color.length ? 0.5 + n(59) / 2 : DEFAULT_MAX_DELTA_E,
    brand: rand() < 0.3 ? ["tidewick-colourworks"] : [],
    type: rand() < 0.3 ? inkTypes[n(2)] : undefined,
    inkCount: rand() < 0.3 ? 1 + n(5) : undefined,
    paper: rand() < 0.3 ? papers[n(papers.length - 1)] : undefined,
    stash: rand() < 0.2 ? "all" : rand() < 0.2 ? "missingOne" : undefined,
    sort: sorts[n(sorts.length - 1)],
  };
}

/** URLSearchParams → the object Express hands to the validator (repeated names become arrays). */
function asExpressQuery(params: URLSearchParams) {
  const out: Record<string, string | string[]> = {};
  for (const key of new Set(params.keys())) {
    const all = params.getAll(key);
    out[key] = all.length > 1 ? all : all[0]!;
  }
  return out;
}

describe("the search address", () => {
  it("round-trips any search, and every address it writes is one the API accepts", () => {
    const rand = seeded(5);
    for (let i = 0; i < 500; i++) {
      const s = randomSearch(rand);
      const params = searchToParams(s);
      const back = parseSearch(params);
      expect(searchToParams(back).toString()).toBe(params.toString());
      expect(effectiveSort(back)).toBe(effectiveSort(s));
      // The page's API query, encoded the way the api client encodes it, passes the shared schema.
      const q = searchApiQuery(back, 12);
      const api = new URLSearchParams();
      for (const [k, v] of Object.entries(q)) for (const one of Array.isArray(v) ? v : [v]) if (one !== undefined) api.append(k, String(one));
      const parsed = stripSearchQuery.safeParse(asExpressQuery(api));
      expect(parsed.success, `${api} → ${JSON.stringify(parsed.error?.issues)}`).toBe(true);
    }
  });

  it("leaves the defaults out of the address", () => {
    expect(searchToParams(emptySearch).toString()).toBe("");
    expect(searchToParams({ ...emptySearch, color: ["#aabbcc"], sort: "closest" }).toString()).toBe("color=%23aabbcc");
    expect(searchToParams({ ...emptySearch, sort: "newest" }).toString()).toBe("");
  });

  it("opens a hand-edited link as the nearest sensible search instead of failing", () => {
    const s = parseSearch(
      new URLSearchParams(
        "ink=3&ink=3&ink=abc&notInk=3&notInk=9&color=%23ABC&color=zzz&color=%23aabbcc&maxDeltaE=99&sort=closest&type=oil&paper=papyrus&inkCount=0&stash=most&brand=Not%20A%20Slug",
      ),
    );
    expect(s.ink).toEqual([3]);
    expect(s.notInk).toEqual([9]); // an ink cannot be both required and left out
    expect(s.color).toEqual(["#aabbcc"]); // "#ABC" is "#aabbcc" too; "zzz" is no colour
    expect(s.maxDeltaE).toBe(30); // clamped to the API's range
    expect(s.sort).toBe("closest");
    expect([s.type, s.paper, s.inkCount, s.stash]).toEqual([undefined, undefined, undefined, undefined]);
    expect(s.brand).toEqual([]);
    // "closest" without a colour is not a search the API takes: it falls back to newest.
    expect(effectiveSort(parseSearch(new URLSearchParams("sort=closest")))).toBe("newest");
    // At most 8 inks, as the API allows.
    expect(parseSearch(new URLSearchParams(Array.from({ length: 50 }, (_, i) => `ink=${i + 1}`).join("&"))).ink).toHaveLength(8);
  });
});

describe("loosening a search that found nothing", () => {
  const names = { ink: (id: number) => `ink ${id}`, brand: (slug: string) => slug, colour: () => "teal" };

  it("offers only changes that make the search strictly looser", () => {
    const rand = seeded(9);
    for (let i = 0; i < 300; i++) {
      const s = randomSearch(rand);
      for (const l of loosenings(s, names)) {
        const looser =
          filterCount(l.next) < filterCount(s) || l.next.maxDeltaE > s.maxDeltaE || (s.stash === "all" && l.next.stash === "missingOne");
        expect(looser, `${l.label} from ${searchToParams(s)}`).toBe(true);
        expect(l.next.ink.every((id) => s.ink.includes(id))).toBe(true);
      }
    }
  });

  it("widens the closeness in steps up to the API's limit", () => {
    expect(widerThreshold(3)).toBe(5);
    expect(widerThreshold(10)).toBe(15);
    expect(widerThreshold(29.5)).toBe(30);
    expect(widerThreshold(30)).toBeNull();
  });
});

describe("closeness in words", () => {
  it("follows the common-practice ΔE2000 reading at 1, 2, 5 and 10 (not a standard)", () => {
    // Up to each step, a threshold admits colours describeDeltaE calls by that step's name.
    expect(describeDeltaE(1)).toBe("indistinguishable");
    expect(thresholdWords(1)).toMatch(/look the same/);
    expect(describeDeltaE(2)).toBe("barely different");
    expect(thresholdWords(2)).toMatch(/barely different/);
    expect(describeDeltaE(5)).toBe("similar");
    expect(thresholdWords(5)).toMatch(/similar/);
    expect(thresholdWords(DEFAULT_MAX_DELTA_E)).toMatch(/usual/);
    const words = [0.5, 1, 1.5, 2, 3, 5, 7, 10, 15, 20, 25, 30].map(thresholdWords);
    // Wider never reads narrower: the words change only at the steps.
    expect(new Set(words).size).toBe(7);
  });
});
