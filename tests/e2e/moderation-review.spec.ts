import { expect, test, type Page } from "@playwright/test";
import type { ReviewQueueItem } from "../../shared/schemas/moderation";
import { expectSignedInAs, people, screenshot, signIn, signOut } from "./support";

/** Two of Noor's strips waiting for review (the demo data posts several for her, a new member). */
async function twoOfNoorsStrips(page: Page) {
  const { items } = (await (await page.request.get("/api/review-queue")).json()) as { items: ReviewQueueItem[] };
  const hers = items.filter((i) => i.author.name === people.newMember.name && i.strip.status === "pending");
  expect(hers.length).toBeGreaterThanOrEqual(2);
  return [hers[0].strip, hers[1].strip] as const;
}

test("a moderator approves one strip by keyboard and hides another; the author sees the reason", async ({ page }) => {
  await signIn(page, people.moderator.email);
  await expectSignedInAs(page, people.moderator.name);
  await page.goto("/review");
  await expect(page.getByRole("heading", { name: "Review queue", level: 1 })).toBeVisible();
  const [first, second] = await twoOfNoorsStrips(page);
  await screenshot(page, "moderator-review-queue");

  // Approve: put the row in focus, then "a" opens the decision with a reason to choose.
  const firstRow = page.locator("article", { has: page.getByRole("heading", { name: first.title }) });
  await firstRow.getByRole("checkbox").focus();
  await page.keyboard.press("a");
  const approveForm = firstRow.locator("form");
  await expect(approveForm.getByRole("combobox", { name: "Reason" })).toBeFocused();
  await approveForm.getByRole("combobox", { name: "Reason" }).selectOption("looks good");
  await approveForm.getByRole("button", { name: "Approve" }).click();
  await expect(page.getByText(`“${first.title}” is approved.`)).toBeVisible();
  await expect(page.getByRole("heading", { name: first.title })).toHaveCount(0);

  // Hide, with a reason the author will read.
  const secondRow = page.locator("article", { has: page.getByRole("heading", { name: second.title }) });
  await secondRow.getByRole("button", { name: /^Hide/ }).click();
  const hideForm = secondRow.locator("form");
  // A decision without a reason is refused before anything is sent.
  await hideForm.getByRole("button", { name: "Hide" }).click();
  await expect(hideForm.getByText("Choose a reason", { exact: true })).toBeVisible();
  await hideForm.getByRole("combobox", { name: "Reason" }).selectOption("spam or advertising");
  await hideForm.getByRole("textbox", { name: /Note/ }).fill("links to a shop in the notes");
  await hideForm.getByRole("button", { name: "Hide" }).click();
  await expect(page.getByText(`“${second.title}” is hidden.`)).toBeVisible();

  // The trail shows both, with before and after.
  await page.goto(`/moderation/log?strip=${second.id}`);
  const entry = page.locator("tbody tr").first();
  await expect(entry).toContainText("Hidden");
  await expect(entry).toContainText("spam or advertising");
  await expect(entry).toContainText("Waiting for review");
  await expect(entry).toContainText(people.moderator.name);
  await screenshot(page, "moderator-moderation-log");
  await signOut(page);

  await signIn(page, people.newMember.email);
  await expectSignedInAs(page, people.newMember.name);
  await page.goto("/notices");
  const hidden = page.locator("article", { hasText: `"${second.title}" was hidden` });
  await expect(hidden).toContainText("Reason: spam or advertising: links to a shop in the notes");
  await expect(page.locator("article", { hasText: `"${first.title}" is published` })).toBeVisible();
  await screenshot(page, "author-notices");
  await page.getByRole("button", { name: "Mark all read" }).click();
  await expect(page.getByText("All read.")).toBeVisible();
});

test("a member who opens the review queue is told it is for moderators", async ({ page }) => {
  await signIn(page, people.member.email);
  await expectSignedInAs(page, people.member.name);
  await page.goto("/review");
  await expect(page.getByText("Moderators only")).toBeVisible();
  await expect(page.getByRole("button", { name: "Approve selected" })).toHaveCount(0);
});
