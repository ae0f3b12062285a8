import { describe, expect, it } from "vitest";
import { actionFrom } from "../../../shared/schemas/moderation";
import { stripStatuses } from "../../../shared/schemas/strips";
import { splitForBulk, type Picked } from "../../../src/features/review/bulk";
import { isMemberId, logFilterProblems, logFiltersFromSearchParams, logFiltersToSearchParams } from "../../../src/features/review/log-filters";
import { isTypingTarget, queueCommandFor, queueShortcuts } from "../../../src/features/review/queue-keys";
import { deltaEText, durationWords, spanWords, stateWords, waitingWords, withoutReloadHint } from "../../../src/features/review/review-words";

const key = (k: string, target: unknown = { tagName: "BODY" }, mods: Partial<{ ctrlKey: boolean; metaKey: boolean; altKey: boolean; shiftKey: boolean }> = {}) => ({
  key: k,
  ctrlKey: false,
  metaKey: false,
  altKey: false,
  shiftKey: false,
  ...mods,
  target,
});

describe("the queue's waiting time", () => {
  const now = Date.parse("2026-03-04T12:00:00Z");
  it("says minutes, hours and days, rounded down, with singular and plural", () => {
    expect(waitingWords("2026-03-04T11:59:30Z", now)).toBe("waiting less than a minute");
    expect(waitingWords("2026-03-04T11:59:00Z", now)).toBe("waiting 1 minute");
    expect(waitingWords("2026-03-04T09:00:00Z", now)).toBe("waiting 3 hours");
    expect(waitingWords("2026-03-04T08:59:00Z", now)).toBe("waiting 3 hours");
    expect(waitingWords("2026-03-03T12:00:00Z", now)).toBe("waiting 1 day");
    expect(waitingWords("2026-02-25T11:00:00Z", now)).toBe("waiting 7 days");
  });
  it("never shows a negative span when a clock runs ahead, and keeps an unreadable time as given", () => {
    expect(durationWords(-5000)).toBe("less than a minute");
    expect(waitingWords("yesterday", now)).toBe("waiting since yesterday");
  });
});

describe("colour and position in words", () => {
  // The words for ΔE2000 come from shared/colour's describeDeltaE (1 / 2 / 5 / 10: common practice).
  it("gives ΔE as a number and in plain words", () => {
    expect(deltaEText(12.44)).toBe("ΔE 12.4, very different");
    expect(deltaEText(0.34)).toBe("ΔE 0.3, indistinguishable");
    expect(deltaEText(4.2)).toBe("ΔE 4.2, similar");
  });
  it("gives a band's span as percentages along the strip", () => {
    expect(spanWords(0.2625, 0.49)).toBe("26–49 % along the strip");
    expect(spanWords(-0.01, 1.2)).toBe("0–100 % along the strip");
  });
});

describe("the log's before and after", () => {
  it("names statuses, standings, roles and suspensions in words", () => {
    expect(stateWords("approve", "pending")).toBe("Waiting for review");
    expect(stateWords("hold", "hidden")).toBe("Hidden");
    expect(stateWords("trust", "trusted")).toBe("Trusted member");
    expect(stateWords("change role", "moderator")).toBe("Moderator");
    expect(stateWords("lift suspension", null)).toBe("not suspended");
    expect(stateWords("suspend", "2026-03-11T12:00:00.000Z")).toMatch(/^suspended until 11 Mar 2026/);
    expect(stateWords("correct inks", null)).toBe("—");
  });
  it("drops the server's reload hint, since the queue refreshes by itself", () => {
    expect(withoutReloadHint("This strip changed since you opened it (it is now published). Reload to see the latest.")).toBe(
      "This strip changed since you opened it (it is now published).",
    );
  });
});

describe("keyboard shortcuts", () => {
  it("maps j/k/a/r/h/x to moving and deciding", () => {
    expect(queueShortcuts.map((s) => `${s.key}:${s.command}`)).toEqual(["j:next", "k:previous", "a:approve", "r:return", "h:hide", "x:reject"]);
    expect(queueCommandFor(key("j"))).toBe("next");
    expect(queueCommandFor(key("x"))).toBe("reject");
    expect(queueCommandFor(key("q"))).toBeNull();
  });
  it("stays quiet while typing, in forms, and with modifier keys", () => {
    expect(queueCommandFor(key("a", { tagName: "INPUT", type: "text" }))).toBeNull();
    expect(queueCommandFor(key("a", { tagName: "TEXTAREA" }))).toBeNull();
    expect(queueCommandFor(key("a", { tagName: "SELECT" }))).toBeNull();
    expect(queueCommandFor(key("a", { tagName: "DIV", isContentEditable: true }))).toBeNull();
    expect(queueCommandFor(key("a", { tagName: "BUTTON", closest: (s: string) => (s.includes("form") ? {} : null) }))).toBeNull();
    expect(queueCommandFor(key("a", undefined, { ctrlKey: true }))).toBeNull();
    expect(queueCommandFor(key("A", undefined, { shiftKey: true }))).toBeNull();
  });
  it("still works on a focused row checkbox or button outside a form", () => {
    expect(isTypingTarget({ tagName: "INPUT", type: "checkbox" })).toBe(false);
    expect(queueCommandFor(key("h", { tagName: "INPUT", type: "checkbox", closest: () => null }))).toBe("hide");
  });
});

describe("bulk decisions", () => {
  const picked: Picked[] = stripStatuses.map((status, i) => ({ id: i + 1, title: status, status, expectedVersion: 1 }));
  it("offers each strip only the actions its status allows (the server's actionFrom table)", () => {
    const approve = splitForBulk("approve", picked);
    expect(approve.fit.map((p) => p.status)).toEqual(["pending", "hidden"]);
    expect(approve.unfit.map((p) => p.status)).toEqual(["published", "returned", "rejected"]);
    const hide = splitForBulk("hide", picked);
    expect(hide.fit.map((p) => p.status)).toEqual(["pending", "published"]);
    // Nothing is lost: every pick lands on one side.
    for (const action of ["approve", "hide"] as const) {
      const { fit, unfit } = splitForBulk(action, picked);
      expect(fit.length + unfit.length).toBe(picked.length);
      expect(fit.every((p) => actionFrom[action].includes(p.status))).toBe(true);
    }
  });
});

describe("moderation log filters in the address", () => {
  it("reads strip, member and action, and drops what the server would refuse", () => {
    const f = logFiltersFromSearchParams(new URLSearchParams("strip=12&member=87EB6051-741E-466F-8F22-257C1F8FEC39&action=hold"));
    expect(f).toEqual({ strip: 12, member: "87eb6051-741e-466f-8f22-257c1f8fec39", moderator: undefined, action: "hold" });
    expect(logFiltersFromSearchParams(new URLSearchParams("strip=0&member=mara"))).toEqual({ strip: undefined, member: undefined, moderator: undefined, action: undefined });
    expect(logFiltersFromSearchParams(new URLSearchParams("strip=1e3"))).toMatchObject({ strip: undefined });
  });
  it("writes back the shortest address, so links like ?strip=12 round-trip", () => {
    expect(logFiltersToSearchParams({ strip: 12 }).toString()).toBe("strip=12");
    const back = logFiltersFromSearchParams(logFiltersToSearchParams({ strip: 3, action: "change role" }));
    expect(back).toMatchObject({ strip: 3, action: "change role" });
  });
  it("explains unusable filter boxes", () => {
    expect(logFilterProblems({ strip: "abc", member: "" })).toEqual({ strip: "must be a strip number such as 12" });
    expect(logFilterProblems({ strip: "", member: "not-an-id" }).member).toMatch(/member id/);
    expect(logFilterProblems({ strip: " 7 ", member: "" })).toEqual({});
  });
  // Member ids are RFC 4122 UUIDs in the 8-4-4-4-12 hex layout (the server checks z.string().uuid()).
  it("accepts member ids in the UUID layout only", () => {
    expect(isMemberId("87eb6051-741e-466f-8f22-257c1f8fec39")).toBe(true);
    expect(isMemberId("87eb6051741e466f8f22257c1f8fec39")).toBe(false);
  });
});
