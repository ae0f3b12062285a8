import { describe, expect, it } from "vitest";
import { moveInk, noRepeatsSideBySide, parseBridgeRequest, parsePlanInks, planToParams, planWithBridge } from "../../../src/features/plan/plan-state";
import { planInksParam } from "../../../shared/schemas/plan";

describe("a plan's address", () => {
  it("keeps the inks in order and round-trips", () => {
    const ids = parsePlanInks(new URLSearchParams("inks=12,5,7"));
    expect(ids).toEqual([12, 5, 7]);
    expect(planToParams(ids).toString()).toBe("inks=12%2C5%2C7");
    expect(parsePlanInks(planToParams(ids))).toEqual(ids);
  });

  it("opens a hand-edited link as far as it can: bad ids, an ink next to itself and a seventh ink are left out", () => {
    expect(parsePlanInks(new URLSearchParams("inks=3,x,3,0,4,-2,5,6,7,8,9,10"))).toEqual([3, 4, 5, 6, 7, 8]);
  });

  it("moves an ink one place and never past the ends", () => {
    expect(moveInk([1, 2, 3], 0, 1)).toEqual([2, 1, 3]);
    expect(moveInk([1, 2, 3], 0, -1)).toEqual([1, 2, 3]);
    // 1,2,1 → 2,1,1 would put an ink next to itself: the page refuses that move.
    expect(noRepeatsSideBySide(moveInk([1, 2, 1], 0, 1))).toBe(false);
    expect(noRepeatsSideBySide([1, 1, 2])).toBe(false);
  });

  it("is refused by the server's schema when it is not a plan", () => {
    expect(planInksParam.safeParse("12,5,7").data).toEqual([12, 5, 7]);
    expect(planInksParam.safeParse("12").success).toBe(false);
    expect(planInksParam.safeParse("1,2,3,4,5,6,7").success).toBe(false);
    expect(planInksParam.safeParse("4,4").success).toBe(false);
    expect(planInksParam.safeParse("4;5").success).toBe(false);
  });
});

describe("the bridge finder's address and a bridge put into the plan", () => {
  it("reads the two ends and the options, and asks nothing until both ends differ", () => {
    expect(parseBridgeRequest(new URLSearchParams("from=3&to=9&bridgeInks=oneToBuy&sameBrand=true")).request).toEqual({ from: 3, to: 9, inks: "oneToBuy", sameBrand: true, limit: 5 });
    expect(parseBridgeRequest(new URLSearchParams("from=3&to=3")).request).toBeNull();
    expect(parseBridgeRequest(new URLSearchParams("from=3&bridgeInks=everything")).request).toBeNull();
    expect(parseBridgeRequest(new URLSearchParams("from=3&to=4&bridgeInks=everything")).request?.inks).toBe("any");
  });

  it("puts a bridge's inks between its two ends when the plan has them side by side, either way round", () => {
    expect(planWithBridge([1, 2, 3], [2, 7, 8, 3])).toEqual([1, 2, 7, 8, 3]);
    expect(planWithBridge([1, 3, 2], [2, 7, 8, 3])).toEqual([1, 3, 8, 7, 2]);
    expect(planWithBridge([5, 6], [2, 7, 3])).toEqual([2, 7, 3]);
  });
});
