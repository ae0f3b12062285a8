import { expect, test, type Page } from "@playwright/test";
import { stripPhoto } from "../setup/strip-photo";
import { expectSignedInAs, people, screenshot, signIn, signOut } from "./support";

type Ink = { id: number; name: string; lab: { l: number; a: number; b: number } };

async function inkNamed(page: Page, name: string): Promise<Ink> {
  const res = await page.request.get(`/api/inks?q=${encodeURIComponent(name)}`);
  const ink = (await res.json()).items.find((i: Ink) => i.name === name);
  if (!ink) throw new Error(`no demo ink ${name}`);
  return ink;
}

test("a new member posts a strip, sees it wait for review, and the gallery shows it once a moderator approves", async ({ page }) => {
  test.setTimeout(120_000);
  await signIn(page, people.newMember.email);
  await expectSignedInAs(page, people.newMember.name);

  // Two catalogue inks, photographed dry on white card under a slightly warm lamp.
  const inks = [await inkNamed(page, "Deep Sounding"), await inkNamed(page, "Garnet Vein")];
  const { jpeg } = await stripPhoto(inks, { illuminant: "D50", seed: 4242, tiltDeg: -5 });

  await page.goto("/post");
  await page.locator("input[type=file]:not([capture])").setInputFiles({ name: "strip.jpg", mimeType: "image/jpeg", buffer: jpeg });
  await expect(page.getByTestId("analysis-band")).toHaveCount(2, { timeout: 30_000 });
  // The suggested inks fill the ink order, best first.
  await expect(page.getByTestId("ink-order-item").first()).toContainText("Deep Sounding");
  await expect(page.getByTestId("ink-order-item").nth(1)).toContainText("Garnet Vein");
  await screenshot(page, "post-analysed");

  const title = `Harbour to garnet ${Date.now()}`;
  await page.getByLabel("Title", { exact: true }).fill(title);
  await page.getByLabel("Paper", { exact: true }).selectOption("smooth-cardstock");
  await page.getByRole("button", { name: "Post strip" }).click();
  await expect(page.getByTestId("posted-pending")).toBeVisible();
  await screenshot(page, "post-pending");
  const stripLink = page.getByTestId("posted-pending").getByRole("link").first();
  const href = await stripLink.getAttribute("href");
  const id = Number(href?.match(/\/strips\/(\d+)/)?.[1]);
  expect(id).toBeGreaterThan(0);
  await signOut(page);

  // A visitor cannot see it yet.
  const hidden = await page.request.get(`/api/strips/${id}`);
  expect(hidden.status()).toBe(404);

  await signIn(page, people.moderator.email);
  await expectSignedInAs(page, people.moderator.name);
  const strip = await (await page.request.get(`/api/strips/${id}`)).json();
  const decided = await page.request.post(`/api/strips/${id}/decisions`, {
    data: { action: "approve", reason: "looks good", expectedVersion: strip.version },
    headers: { Origin: new URL(page.url()).origin },
  });
  expect(decided.status()).toBe(200);
  await signOut(page);

  await page.goto("/gallery");
  await expect(page.getByTestId("strip-row").filter({ hasText: title })).toBeVisible();
  await screenshot(page, "gallery-after-approval");
  await page.getByTestId("strip-row").filter({ hasText: title }).getByRole("link", { name: title }).first().click();
  await expect(page).toHaveURL(new RegExp(`/strips/${id}$`));
  await expect(page.getByTestId("band-comparison")).toHaveCount(2);
  await screenshot(page, "strip-page");
});

test("a photo that is not a strip is refused with a reason the member understands", async ({ page }) => {
  await signIn(page, people.member.email);
  await expectSignedInAs(page, people.member.name);
  await page.goto("/post");
  await page.locator("input[type=file]:not([capture])").setInputFiles({ name: "notes.jpg", mimeType: "image/jpeg", buffer: Buffer.from("my ink notes, not a photo") });
  await expect(page.getByText(/text/i).first()).toBeVisible();
  await screenshot(page, "post-refused");
});
