import { describe, expect, it } from "vitest";
import type { Lab } from "../../shared/colour";
import { seededRandom } from "../../server/demo/seeded-random";
import { bruteForceBridges, buildJoinMatrix, findBestBridges, kBestBridges, type BridgeQuery } from "../../server/modules/plan/bridge-search";

/** Invented inks spread over the sRGB-ish part of CIELAB. */
function catalogue(n: number, rand: () => number): Lab[] {
  return Array.from({ length: n }, () => ({ l: 25 + rand() * 65, a: -60 + rand() * 120, b: -60 + rand() * 120 }));
}

describe("the bridge finder's search (Yen 1971) against brute-force enumeration", () => {
  const cases: { name: string; q: (n: number, rand: () => number) => Omit<BridgeQuery, "k"> }[] = [
    { name: "any ink", q: (n) => ({ from: 0, to: n - 1, allowed: () => true }) },
    {
      name: "only inks owned",
      q: (n, rand) => {
        const owned = new Set(Array.from({ length: n }, (_, i) => i).filter(() => rand() < 0.5));
        return { from: 0, to: n - 1, allowed: (i) => owned.has(i) };
      },
    },
    {
      name: "at most one ink to buy",
      q: (n, rand) => {
        const owned = new Set(Array.from({ length: n }, (_, i) => i).filter(() => rand() < 0.4));
        return { from: 1, to: 2, allowed: () => true, mustBuy: (i) => !owned.has(i), maxBuys: 1 };
      },
    },
    { name: "at most one ink between", q: (n) => ({ from: 0, to: n - 1, allowed: () => true, maxBetween: 1 }) },
  ];
  for (const c of cases) {
    it(`finds the same best bridges, in the same order (${c.name})`, () => {
      let compared = 0;
      for (let seed = 1; seed <= 12; seed++) {
        const rand = seededRandom(seed * 97 + c.name.length);
        const n = 7 + (seed % 6);
        const m = buildJoinMatrix(catalogue(n, rand));
        const q: BridgeQuery = { ...c.q(n, rand), k: 5 };
        const expected = bruteForceBridges(m, q);
        expect(kBestBridges(m, q)).toEqual(expected);
        expect(findBestBridges(m, q)).toEqual(expected);
        compared += expected.length;
      }
      // Something was compared: most catalogues give the full five.
      expect(compared).toBeGreaterThan(40);
    });
  }

  it("finds the same best bridges on a 30-ink catalogue, where the capped search must widen its cap", () => {
    for (let seed = 1; seed <= 6; seed++) {
      const rand = seededRandom(4000 + seed);
      const n = 30;
      const m = buildJoinMatrix(catalogue(n, rand));
      const q: BridgeQuery = { from: 0, to: n - 1, allowed: () => true, k: 5 };
      const expected = bruteForceBridges(m, q);
      expect(expected).toHaveLength(5);
      expect(findBestBridges(m, q)).toEqual(expected);
    }
  });

  it("never returns the direct join, a muddy join or a repeated ink", () => {
    const rand = seededRandom(5);
    const n = 12;
    const m = buildJoinMatrix(catalogue(n, rand));
    const bridges = kBestBridges(m, { from: 0, to: n - 1, allowed: () => true, k: 8 });
    expect(bridges.length).toBe(8);
    for (const b of bridges) {
      expect(b.nodes.length).toBeGreaterThanOrEqual(3);
      expect(b.nodes.length).toBeLessThanOrEqual(5);
      expect(new Set(b.nodes).size).toBe(b.nodes.length);
      for (let i = 1; i < b.nodes.length; i++) expect(m.w[b.nodes[i - 1]! * n + b.nodes[i]!]).toBeLessThan(Infinity);
    }
    for (let i = 1; i < bridges.length; i++) expect(bridges[i]!.maxStep).toBeGreaterThanOrEqual(bridges[i - 1]!.maxStep);
  });
});
