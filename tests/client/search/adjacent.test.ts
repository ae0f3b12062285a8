import { describe, expect, it } from "vitest";
import { loosenings, parseSearch, searchApiQuery, searchToParams } from "../../../src/features/search/search-state";

describe("next to each other in a search's address", () => {
  it("keeps adjacent=true only with exactly two inks", () => {
    const s = parseSearch(new URLSearchParams("ink=3&ink=4&adjacent=true"));
    expect(s.adjacent).toBe(true);
    expect(searchToParams(s).get("adjacent")).toBe("true");
    expect(searchApiQuery(s, 20).adjacent).toBe("true");
    expect(parseSearch(new URLSearchParams("ink=3&adjacent=true")).adjacent).toBeUndefined();
    expect(searchToParams({ ...s, ink: [3, 4, 5] }).get("adjacent")).toBeNull();
  });

  it("offers 'anywhere in the strip' when nothing matches", () => {
    const s = parseSearch(new URLSearchParams("ink=3&ink=4&adjacent=true"));
    const l = loosenings(s, { ink: String, brand: String, colour: String }).find((x) => x.key === "adjacent");
    expect(l?.next.adjacent).toBeUndefined();
  });
});
