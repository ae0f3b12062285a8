import { expect, test } from "@playwright/test";
import { expectSignedInAs, people, screenshot, signIn, signInRequest, signOut } from "./support";

test("a visitor sees the home page and the ink catalogue, without curating controls", async ({ page }) => {
  await page.goto("/");
  await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
  await screenshot(page, "visitor-home");
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Inks" }).click();
  await expect(page).toHaveURL(/\/inks$/);
  await expect(page.getByRole("heading", { name: "Ink catalogue" })).toBeVisible();
  await expect(page.getByText(/\d+ inks/).first()).toBeVisible();
  await expect(page.getByRole("link", { name: "New ink" })).toHaveCount(0);
  await expect(page.getByRole("link", { name: "Import catalogue" })).toHaveCount(0);
  await screenshot(page, "visitor-inks");

  // Every ink shows its colour in numbers: hex and L*a*b*.
  const firstInk = page.locator("main a[href^='/inks/']").first();
  await firstInk.click();
  await expect(page).toHaveURL(/\/inks\/\d+$/);
  await expect(page.getByText(/#[0-9a-f]{6}/i).first()).toBeVisible();
  await expect(page.getByText(/L\*/).first()).toBeVisible();
  await expect(page.getByRole("button", { name: "Edit ink" })).toHaveCount(0);
});

test("a visitor can filter the catalogue by type, and the filter is in the address", async ({ page, request }) => {
  const pigments = (await (await request.get("/api/inks?type=pigment&pageSize=1")).json()).total as number;
  const all = (await (await request.get("/api/inks?pageSize=1")).json()).total as number;
  expect(pigments).toBeLessThan(all);
  await page.goto("/inks?type=pigment");
  await expect(page.getByText(new RegExp(`\\b${pigments} inks?\\b`)).first()).toBeVisible();
  await page.goto("/inks");
  await expect(page.getByText(new RegExp(`\\b${all} inks?\\b`)).first()).toBeVisible();
});

test("a wrong password is refused with a clear message", async ({ page }) => {
  await signIn(page, people.member.email, "not-the-password");
  await expect(page.getByText("That e-mail and password do not match.")).toBeVisible();
  await expect(page.getByRole("button", { name: /Account menu for/ })).toHaveCount(0);
});

test("a member signs in and out, and sees no curating controls", async ({ page }) => {
  await signIn(page, people.member.email);
  await expectSignedInAs(page, people.member.name);
  await page.goto("/inks");
  await expect(page.getByRole("link", { name: "New ink" })).toHaveCount(0);
  await page.goto("/account");
  await expect(page.getByRole("main").getByText(people.member.email).first()).toBeVisible();
  await screenshot(page, "member-account");
  await signOut(page);
});

test("a moderator adds an ink through the form", async ({ page }) => {
  await signIn(page, people.moderator.email);
  await expectSignedInAs(page, people.moderator.name);
  await page.goto("/inks");
  await expect(page.getByRole("link", { name: "Import catalogue" })).toHaveCount(0);
  await page.getByRole("link", { name: "New ink" }).click();
  await expect(page).toHaveURL(/\/inks\/new$/);
  await page.getByLabel("Name", { exact: true }).fill("Lantern Smoke");
  await page.getByLabel("Brand", { exact: true }).selectOption({ index: 1 });
  await page.getByRole("radio", { name: /^dye/i }).check();
  await page.getByLabel("Hex", { exact: true }).fill("#6b5b73");
  await screenshot(page, "moderator-new-ink");
  await page.getByRole("button", { name: /Add ink|Save ink|Create ink/ }).click();
  await expect(page).toHaveURL(/\/inks\/\d+$/);
  await expect(page.getByRole("heading", { name: "Lantern Smoke" })).toBeVisible();
  await expect(page.getByText("#6b5b73").first()).toBeVisible();
  await signOut(page);
});

test("an admin sees the catalogue import and is told which CSV lines are wrong", async ({ page }) => {
  await signIn(page, people.admin.email);
  await expectSignedInAs(page, people.admin.name);
  await page.goto("/inks");
  await page.getByRole("link", { name: "Import catalogue" }).click();
  await expect(page).toHaveURL(/\/inks\/import$/);
  await page.locator("input[type=file]").setInputFiles({
    name: "catalogue.csv",
    mimeType: "text/csv",
    buffer: Buffer.from("brand,name,type,hex\nFernlight Studio,Good Ink,dye,#112233\nFernlight Studio,Bad Ink,oil,#112233\n"),
  });
  await page.getByRole("button", { name: "Import catalogue" }).click();
  await expect(page.getByText(/line 3/i).first()).toBeVisible();
  await expect(page.getByText(/Nothing was imported/i).first()).toBeVisible();
  await screenshot(page, "admin-import-errors");
  await signOut(page);
});

test("a newcomer signs in with an e-mailed link after confirming on our page", async ({ page, request }) => {
  const email = `newcomer-${Date.now()}@blendwell.test`;
  await page.goto("/sign-in");
  await page.getByLabel("E-mail address").last().fill(email);
  await page.getByRole("button", { name: /link/i }).click();
  await expect(page).toHaveURL(/\/sign-in\/check-email/);
  await screenshot(page, "check-email");

  // The demo mail viewer answers only the admin (it holds everyone's sign-in links).
  expect((await request.get("/api/dev/mail")).status()).toBe(401);
  await signInRequest(request, people.admin.email);
  let link = "";
  await expect(async () => {
    const mail = await (await request.get("/api/dev/mail")).json();
    const message = mail.messages.find((m: { to: string[] }) => m.to.includes(email));
    link = message?.text.match(/https?:\/\/\S+/)?.[0] ?? "";
    expect(link).not.toBe("");
  }).toPass({ timeout: 10_000 });

  await page.goto(link);
  await expect(page).toHaveURL(/\/sign-in\/confirm/);
  await screenshot(page, "confirm-sign-in");
  await page.getByRole("button", { name: "Sign in to Blendwell" }).click();
  await expect(page.getByRole("button", { name: /Account menu for/ })).toBeVisible();

  // The same link a second time does not sign anyone in.
  await signOut(page);
  await page.goto(link);
  await page.getByRole("button", { name: "Sign in to Blendwell" }).click();
  await expect(page).toHaveURL(/\/sign-in\/error/);
  await expect(page.getByRole("button", { name: /Account menu for/ })).toHaveCount(0);
});

test("the sign-in confirmation page refuses links that lead anywhere but our own sign-in callback", async ({ page }) => {
  for (const next of ["https://elsewhere.example/auth/callback/nodemailer?token=x", "//elsewhere.example/auth/callback/nodemailer", "/auth/signout", "javascript:alert(1)"]) {
    await page.goto(`/sign-in/confirm?next=${encodeURIComponent(next)}`);
    await expect(page.getByRole("heading").first()).toBeVisible();
    await expect(page.getByRole("button", { name: "Sign in to Blendwell" })).toHaveCount(0);
  }
});
