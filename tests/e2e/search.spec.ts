import { expect, test } from "@playwright/test";
import type { StripSearchList } from "../../shared/schemas/search";
import type { Strip } from "../../shared/schemas/strips";
import { people, signIn } from "./support";

test("a visitor finds strips by an ink, then by a colour tapped from a band, and loosens a search that found nothing", async ({ page }) => {
  // A published demo strip to aim at (its measured bands come from the real analysis).
  const newest = (await (await page.request.get("/api/strips?limit=5")).json()) as StripSearchList;
  const target = newest.items.find((s) => s.bands.length >= 3) as Strip;
  const ink = target.inks[0]!;

  await page.goto("/search");
  await expect(page.getByTestId("result-summary")).toContainText(/All \d+ strips, newest first/);

  // By ink: the type-ahead adds it; every result carries it; the address keeps it.
  const picker = page.getByRole("combobox", { name: "Must include" });
  await picker.fill(ink.name);
  await page.getByRole("option", { name: new RegExp(ink.name) }).first().click();
  await expect(page).toHaveURL(new RegExp(`[?&]ink=${ink.id}(&|$)`));
  await expect(page.getByRole("list", { name: "Inks the strip must include" })).toContainText(ink.name);
  await expect(page.getByTestId("result-summary")).toContainText(/\d+ strips? found, newest first/);
  const rows = page.getByTestId("strip-row");
  await expect(rows.first()).toBeVisible();
  const count = await rows.count();
  for (let i = 0; i < count; i++) await expect(rows.nth(i).getByRole("list", { name: /^Inks of / })).toContainText(ink.name);
  await expect(page.getByRole("link", { name: target.title })).toBeVisible();

  // By colour: a shared link with the target's third band. Its hex is the band's L*a*b* rounded
  // to 8-bit sRGB, so the band answers within a few tenths of a ΔE2000 unit.
  const band = target.bands[2]!;
  await page.goto(`/search?color=${encodeURIComponent(band.hex)}`);
  await expect(page.getByTestId("result-summary")).toContainText(/closest colour first/);
  const targetRow = rows.filter({ has: page.getByRole("link", { name: target.title, exact: true }) });
  await expect(targetRow).toHaveCount(1);
  await expect(targetRow.getByTestId("strip-match")).toContainText(`Band ${band.index + 1}`);
  await expect(targetRow.getByTestId("strip-match")).toContainText("indistinguishable");
  await expect(targetRow.getByTestId("strip-match")).toContainText(/ΔE2000 0\.[0-4]\d/);
  await expect(targetRow.locator("[data-highlighted]")).toHaveCount(1);
  await expect(page.getByRole("slider", { name: "Closeness" })).toHaveValue("10");

  // Closeness: a narrow threshold still finds the exact band; the words follow the slider.
  const slider = page.getByRole("slider", { name: "Closeness" });
  await slider.focus();
  for (let i = 0; i < 18; i++) await page.keyboard.press("ArrowLeft");
  await expect(page.getByText("only colours that look the same")).toBeVisible();
  await expect(page).toHaveURL(/maxDeltaE=1(&|$)/);
  await expect(targetRow).toHaveCount(1);

  // Nothing matches pure blue at ΔE 1 as well: the page says so and offers to loosen.
  await page.getByLabel("or type its hex").fill("#0000ff");
  await page.getByRole("button", { name: "Add colour" }).click();
  await expect(page.getByTestId("no-results")).toBeVisible();
  await expect(page.getByTestId("result-summary")).toContainText("No strips found");
  await page.getByRole("button", { name: /^Without the .*#0000ff/ }).click();
  await expect(page.getByTestId("no-results")).toHaveCount(0);
  await expect(targetRow).toHaveCount(1);
  await expect(page).not.toHaveURL(/0000ff/);

  // A bad hex is refused in words, and nothing is added.
  await page.getByLabel("or type its hex").fill("#12345");
  await page.getByRole("button", { name: "Add colour" }).click();
  await expect(page.getByText("Type a hex colour such as")).toBeVisible();
});

test("a member searches by their stash: strips one ink short say which ink to buy", async ({ page }) => {
  await signIn(page, people.member.email);
  await page.waitForURL(/account/);
  await page.goto("/search");
  // The radios follow the address, which changes a moment after the click.
  await page.getByRole("radio", { name: /One ink short/ }).click();
  await expect(page).toHaveURL(/stash=missingOne/);
  await expect(page.getByRole("radio", { name: /One ink short/ })).toBeChecked();
  const stash = (await (await page.request.get("/api/stash")).json()) as { items: { ink: { id: number } }[] };
  const owned = new Set(stash.items.map((i) => i.ink.id));
  const api = (await (await page.request.get("/api/strips?stash=missingOne&limit=50")).json()) as StripSearchList;
  // The API's answer, checked here against the member's stash, is what the page shows.
  for (const s of api.items) {
    const notOwned = s.inks.filter((i) => !owned.has(i.id));
    expect(notOwned.map((i) => i.id)).toEqual([s.missingInkId]);
  }
  const rows = page.getByTestId("strip-row");
  if (api.items.length === 0) {
    await expect(page.getByTestId("no-results")).toBeVisible();
  } else {
    await expect(rows).toHaveCount(Math.min(api.items.length, 12));
    const first = api.items[0]!;
    const missing = first.inks.find((i) => i.id === first.missingInkId)!;
    await expect(rows.first().getByTestId("strip-match")).toContainText(`One ink short: you do not own ${missing.name}`);
  }
  await page.getByRole("radio", { name: /Inks I own/ }).click();
  await expect(page).toHaveURL(/stash=all/);
  await expect(page.getByTestId("result-summary")).toContainText(/found|No strips/);
});

test("look-alikes: an ink page lists them in words, and a search can swap an ink for one", async ({ page }) => {
  // The demo catalogue plants this pair under ΔE2000 1 (invented inks; server/demo).
  const found = (await (await page.request.get("/api/inks?q=Lighthouse%20Lamp")).json()) as { items: { id: number; name: string }[] };
  const lamp = found.items.find((i) => i.name === "Lighthouse Lamp")!;
  await page.goto(`/inks/${lamp.id}`);
  const list = page.getByRole("list", { name: "Look-alikes of Lighthouse Lamp" });
  const ledge = list.getByTestId("look-alike").filter({ hasText: "Citrine Ledge" });
  await expect(ledge).toContainText("indistinguishable");
  await expect(ledge).toContainText(/ΔE2000 0\.\d\d/);
  await expect(page.getByText(/common practice/)).toBeVisible();

  await page.getByRole("link", { name: /Search strips with this ink/ }).click();
  await expect(page).toHaveURL(new RegExp(`/search\\?ink=${lamp.id}$`));
  await page.getByRole("button", { name: /Search with Citrine Ledge .* instead of Lighthouse Lamp/ }).click();
  const chosen = page.getByRole("list", { name: "Inks the strip must include" });
  await expect(chosen.getByRole("link", { name: "Citrine Ledge" })).toBeVisible();
  await expect(chosen.getByRole("link", { name: "Lighthouse Lamp" })).toHaveCount(0);
  await expect(page).not.toHaveURL(new RegExp(`ink=${lamp.id}(&|$)`));
  await expect(page.getByTestId("result-summary")).toContainText(/found/);
});

test("a colour tapped on a strip photo opens a colour search for it", async ({ page }) => {
  const newest = (await (await page.request.get("/api/strips?limit=1")).json()) as StripSearchList;
  await page.goto(`/strips/${newest.items[0]!.id}`);
  await page.getByRole("button", { name: "Pick a colour from the photo" }).click();
  const surface = page.getByRole("application", { name: "Photo colour picker" });
  await surface.click(); // the middle of the photo, where the strip lies
  const picked = page.getByTestId("picked-colour");
  await expect(picked).toContainText(/#[0-9A-F]{6}/i);
  const hex = ((await picked.innerText()).match(/#[0-9A-F]{6}/i)![0]).toLowerCase();
  await picked.getByRole("link", { name: "Find strips with this colour" }).click();
  await expect(page).toHaveURL(new RegExp(`/search\\?color=${encodeURIComponent(hex)}$`, "i"));
  await expect(page.getByRole("list", { name: "Colours in this search" })).toContainText(hex);
  await expect(page.getByTestId("result-summary")).toContainText(/found/);
});

test("a shared link naming an ink the catalogue does not know says so and searches without it", async ({ page }) => {
  await page.goto("/search?ink=987654&paper=hot-press");
  await expect(page.getByText("Some inks or brands in this search are not in the catalogue.")).toBeVisible();
  await page.getByRole("button", { name: "Leave those out and search" }).click();
  await expect(page).toHaveURL(/\/search\?paper=hot-press$/);
  await expect(page.getByTestId("result-summary")).toContainText(/found/);
});
