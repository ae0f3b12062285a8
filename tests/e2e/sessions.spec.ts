import { expect, test } from "@playwright/test";
import { expectSignedInAs, people, screenshot, signIn } from "./support";

// Issue 12: sessions that can be ended, and a demo mail viewer only the admin can open.
const femi = { email: "femi@blendwell.test" };

for (const [label, viewport] of [
  ["desktop", { width: 1280, height: 900 }],
  ["phone", { width: 390, height: 844 }],
] as const) {
  test(`"Sign out everywhere" on the account page ends this session and the one on another device (${label})`, async ({ page, browser }) => {
    await page.setViewportSize(viewport);
    // Another device: its own browser context, signed in as the same member.
    const other = await browser.newContext({ viewport });
    const otherPage = await other.newPage();
    await signIn(otherPage, femi.email);
    await otherPage.waitForURL(/account/);

    await signIn(page, femi.email);
    await page.waitForURL(/account/);
    const card = page.getByRole("heading", { name: "Where you are signed in" });
    await card.scrollIntoViewIfNeeded();
    await screenshot(page, `sign-out-everywhere-${label}`);
    await page.getByRole("button", { name: "Sign out everywhere" }).click();
    const dialog = page.getByRole("dialog", { name: "Sign out on every device?" });
    await expect(dialog).toBeVisible();
    await screenshot(page, `sign-out-everywhere-confirm-${label}`);
    await dialog.getByRole("button", { name: "Sign out everywhere" }).click();
    await expect(page.getByText("You are signed out on every device.")).toBeVisible();
    await expect(page.getByRole("link", { name: "Sign in" }).first()).toBeVisible();

    // The other device's cookie is still in its browser, but the server no longer knows it.
    expect((await otherPage.request.get("/api/me")).status()).toBe(401);
    await otherPage.goto("/account");
    await expect(otherPage.getByRole("button", { name: /Account menu for/ })).toHaveCount(0);
    await other.close();
  });
}

test("the demo mail viewer tells visitors to sign in as the admin, and shows the admin the mail", async ({ page }) => {
  await page.goto("/dev/mail");
  await expect(page.getByText("Only for the admin")).toBeVisible();
  await expect(page.getByText("admin@blendwell.test")).toBeVisible();
  await screenshot(page, "dev-mail-visitor");

  await signIn(page, people.member.email);
  await expectSignedInAs(page, people.member.name);
  await page.goto("/dev/mail");
  await expect(page.getByText("Only for the admin")).toBeVisible();

  await page.context().clearCookies();
  await signIn(page, people.admin.email);
  await expectSignedInAs(page, people.admin.name);
  await page.goto("/dev/mail");
  await expect(page.getByRole("heading", { name: "Mail viewer" })).toBeVisible();
  await expect(page.getByText("Only for the admin")).toHaveCount(0);
  await screenshot(page, "dev-mail-admin");
});
