import { expect, type APIRequestContext, type Page } from "@playwright/test";

export const PASSWORD = "blendwell-demo";
export const people = {
  member: { email: "mara@blendwell.test", name: "Mara Fenholt" },
  newMember: { email: "noor@blendwell.test", name: "Noor Vessant" },
  moderator: { email: "ivo@blendwell.test", name: "Ivo Kellerhof" },
  admin: { email: "admin@blendwell.test", name: "Tamsin Orrel" },
} as const;

export async function signIn(page: Page, email: string, password = PASSWORD) {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail address").first().fill(email);
  await page.getByLabel("Password", { exact: true }).fill(password);
  await page.getByRole("button", { name: "Sign in", exact: true }).click();
}

export async function expectSignedInAs(page: Page, name: string) {
  await expect(page.getByRole("button", { name: new RegExp(`Account menu for ${name}`) })).toBeVisible();
}

export async function signOut(page: Page) {
  await page.getByRole("button", { name: /Account menu for/ }).click();
  await page.getByRole("button", { name: "Sign out", exact: true }).click();
  await expect(page.getByRole("link", { name: "Sign in" }).first()).toBeVisible();
}

export async function screenshot(page: Page, name: string) {
  await page.screenshot({ path: `test-results/e2e/screens/${name}.png`, fullPage: true });
}

/** Signs an API request context in (password, through Auth.js), e.g. as the admin to read demo mail. */
export async function signInRequest(request: APIRequestContext, email: string, password = PASSWORD) {
  const { csrfToken } = await (await request.get("/auth/csrf")).json();
  const res = await request.post("/auth/callback/credentials", {
    headers: { "X-Auth-Return-Redirect": "1" },
    form: { csrfToken, email, password, callbackUrl: "/" },
  });
  expect(res.ok()).toBe(true);
  expect(String((await res.json()).url)).not.toContain("error=");
}
