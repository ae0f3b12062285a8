import { readFileSync } from "node:fs";
import { expect, test } from "@playwright/test";
import { expectSignedInAs, people, screenshot, signIn } from "./support";

// A generated held-out scene (tests/analysis/scenes, committed with its truth beside it): three
// strips lying straight on a light wood desk, no card, photographed at an angle.
const photo = readFileSync(new URL("../fixtures/scenes/three-strips-desk.jpg", import.meta.url));
const truth = JSON.parse(readFileSync(new URL("../fixtures/scenes/three-strips-desk.json", import.meta.url), "utf8")) as {
  strips: { corners: [number, number][]; inks: unknown[] }[];
};

/** Whether a point lies inside a convex quadrilateral (same side of every edge). */
function inside(p: [number, number], quad: [number, number][]): boolean {
  const sides = quad.map((a, k) => {
    const b = quad[(k + 1) % quad.length]!;
    return Math.sign((b[0] - a[0]) * (p[1] - a[1]) - (b[1] - a[1]) * (p[0] - a[0]));
  });
  return sides.every((s) => s === sides[0]);
}

test("a photo of three strips on a desk becomes three outlined drafts, and two of them are posted", async ({ page }) => {
  test.setTimeout(120_000);
  // Not met yet (issue 11, decision 009): on this light-wood desk the analysis finds two of the
  // three strips (it reads the first one's white margin only). Kept as an expected failure so it
  // turns red — and must be made a plain test again — the day the analysis reads this photo.
  test.fail();
  await signIn(page, people.newMember.email);
  await expectSignedInAs(page, people.newMember.name);

  await page.goto("/post");
  await page.locator("input[type=file]:not([capture])").setInputFiles({ name: "three-strips-desk.jpg", mimeType: "image/jpeg", buffer: photo });
  // Each strip outlined and numbered on the photo, and one draft per strip.
  await expect(page.getByTestId("strip-draft")).toHaveCount(truth.strips.length, { timeout: 45_000 });
  await expect(page.getByTestId("strip-outline")).toHaveCount(truth.strips.length);
  const uploadId = new URL(page.url()).searchParams.get("upload");
  // Each strip found where it truly lies: the middle of each outline is inside that strip's true
  // corners (the scene's truth JSON), in reading order.
  const found = await (await page.request.get(`/api/uploads/${uploadId}`)).json();
  expect(found.analysis.strips).toHaveLength(truth.strips.length);
  for (const [i, strip] of truth.strips.entries()) {
    const outline = found.analysis.strips[i].outline as [number, number][];
    const centre: [number, number] = [outline.reduce((s, p) => s + p[0], 0) / 4, outline.reduce((s, p) => s + p[1], 0) / 4];
    expect(inside(centre, strip.corners), `strip ${i + 1}'s outline is centred on it`).toBe(true);
    await expect(page.getByTestId("strip-draft").nth(i).getByRole("heading", { level: 3 })).toContainText(`Strip ${i + 1} · `);
  }
  await screenshot(page, "several-strips-drafts");

  // The keyboard moves a corner of strip 2, and the change is said in words.
  await page.getByTestId("strip-choice").nth(1).click();
  await page.getByTestId("outline-corner").nth(2).focus();
  await page.keyboard.press("Shift+ArrowDown");
  await expect(page.getByTestId("outline-status")).toHaveText(/^Strip 2 (now has|read again)/, { timeout: 15_000 });

  // Strip 2 stays behind; strips 1 and 3 go, sharing the paper.
  await page.getByLabel("Post strip 2").uncheck();
  await page.getByLabel("Paper", { exact: true }).selectOption("smooth-cardstock");
  for (const i of [0, 2]) await expect(page.getByTestId("strip-draft").nth(i).getByTestId("ink-order-item").first()).toBeVisible();
  await page.getByRole("button", { name: "Post 2 strips" }).click();
  const summary = page.getByTestId("batch-posted");
  await expect(summary).toBeVisible({ timeout: 30_000 });
  await expect(summary.getByRole("heading", { level: 2 })).toHaveText("2 strips posted");
  // A new member's strips wait for review.
  await expect(summary.getByTestId("batch-pending").getByRole("listitem")).toHaveText([/^Strip 1: /, /^Strip 3: /]);
  await expect(page.getByTestId("strip-draft").nth(0)).toContainText("Posted; waiting for review.");
  await expect(page.getByLabel("Post strip 2")).not.toBeChecked();
  await screenshot(page, "several-strips-posted");

  // One upload, two strips from it, each with its own picture cut from the photo.
  const upload = await (await page.request.get(`/api/uploads/${uploadId}`)).json();
  expect(upload.posted.map((p: { stripIndex: number }) => p.stripIndex)).toEqual([0, 2]);
  for (const p of upload.posted as { stripId: number }[]) {
    const strip = await (await page.request.get(`/api/strips/${p.stripId}`)).json();
    expect(strip.images.display).toBe(`/api/strips/${p.stripId}/images/display`);
    expect(strip.images.width * strip.images.height).toBeLessThan(0.5 * 1200 * 1600);
  }
});
