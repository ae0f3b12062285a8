import { readFileSync } from "node:fs";
import { expect, test, type Download, type Page } from "@playwright/test";
import type { InkList } from "../../shared/schemas/inks";
import type { BesideList } from "../../shared/schemas/plan";
import type { StashItem } from "../../shared/schemas/stash";
import { people, screenshot, signIn } from "./support";

/** Page count and text of a downloaded PDF, read with pdf-parse (an independent PDF reader). */
async function pdfOf(download: Download) {
  const { PDFParse } = await import("pdf-parse");
  const path = await download.path();
  const parser = new PDFParse({ data: new Uint8Array(readFileSync(path)) });
  const result = await parser.getText();
  await parser.destroy();
  return { pages: result.total, text: result.text.replace(/\s+/g, " ") };
}

async function inkByName(page: Page, name: string) {
  const list = (await (await page.request.get(`/api/inks?q=${encodeURIComponent(name)}`)).json()) as InkList;
  return list.items.find((i) => i.name === name)!;
}

async function addInk(page: Page, label: string, name: string) {
  const picker = page.getByRole("combobox", { name: label });
  await picker.fill(name);
  await page.getByRole("option", { name: new RegExp(name) }).first().click();
}

test("a visitor plans a blend, sees a muddy join and a takeover, bridges it and prints a practice card", async ({ page }) => {
  await page.goto("/");
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Plan" }).click();
  await expect(page.getByRole("heading", { name: "Plan a blend" })).toBeVisible();

  for (const name of ["Lemon Curd", "Amethyst Geode", "Cobalt Lantern"]) await addInk(page, "Add an ink", name);
  const [lemon, amethyst, cobalt] = await Promise.all(["Lemon Curd", "Amethyst Geode", "Cobalt Lantern"].map((n) => inkByName(page, n)));
  await expect(page).toHaveURL(new RegExp(`inks=${lemon.id}%2C${amethyst.id}%2C${cobalt.id}`));
  await expect(page.getByRole("img", { name: "Blend preview: Lemon Curd, then Amethyst Geode, then Cobalt Lantern" })).toBeVisible();
  await expect(page.getByTestId("plan-summary")).toHaveText("2 joins: 1 muddy, 1 with a dark ink that could take over.");
  const first = page.getByTestId("join-hints").first();
  await expect(first).toContainText(/Step: very different \(ΔE2000 \d+\.\d\)/);
  await expect(first.getByTestId("muddy-join")).toContainText("Muddy join");
  await expect(first.getByTestId("takeover")).toContainText("Amethyst Geode");
  await expect(page.getByTestId("join-hints").nth(1).getByTestId("muddy-join")).toHaveCount(0);

  // The link keeps the plan: a fresh page opens the same preview.
  const link = await page.getByTestId("plan-link").innerText();
  await page.goto(link);
  await expect(page.getByTestId("plan-summary")).toHaveText("2 joins: 1 muddy, 1 with a dark ink that could take over.");

  // The muddy join offers the bridge finder, filled in with its two inks.
  await first.getByRole("link", { name: "find a bridge" }).click();
  await expect(page).toHaveURL(new RegExp(`from=${lemon.id}&to=${amethyst.id}`));
  await expect(page.getByTestId("bridge-summary")).toContainText(/a muddy join\. 5 bridges found among \d+ inks/);
  const bridges = page.getByTestId("bridge");
  await expect(bridges).toHaveCount(5);
  await expect(bridges.first()).toContainText("No muddy join");
  await screenshot(page, "plan-bridges-desktop");
  await bridges.first().getByRole("button", { name: "Plan this strip" }).click();
  await expect(page.getByTestId("plan-summary")).toContainText("none muddy");
  const planned = page.getByRole("list", { name: "Ink order" }).getByRole("listitem");
  expect(await planned.count()).toBeGreaterThanOrEqual(4);
  await expect(planned.first()).toContainText("Lemon Curd");
  await expect(planned.last()).toContainText("Cobalt Lantern");

  // Printable practice card.
  const names = await planned.locator("a").allInnerTexts();
  const [card] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: "A practice card, A4" }).click()]);
  expect(card.suggestedFilename()).toBe("blendwell-practice-card-a4.pdf");
  const pdf = await pdfOf(card);
  expect(pdf.pages).toBe(1);
  for (const name of names) expect(pdf.text).toContain(name);
  expect(pdf.text).toContain("Swatch each ink in its box");

  // A link naming an ink the catalogue does not have says so and offers to leave it out.
  await page.goto(`/plan?inks=${lemon.id},999999,${cobalt.id}`);
  await expect(page.getByRole("region", { name: "Blend preview" }).getByRole("alert")).toContainText("Ink #999999 is not in the catalogue.");
  await page.getByRole("button", { name: "Leave it out" }).click();
  await expect(page).toHaveURL(new RegExp(`inks=${lemon.id}%2C${cobalt.id}$`));
  await expect(page.getByTestId("plan-summary")).toHaveText(/^One join/);

  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto(link);
  await expect(page.getByTestId("plan-summary")).toBeVisible();
  await screenshot(page, "plan-phone");
});

test("a member prints a stash chart and bridges from her own inks; an ink page lists what is blended next to it; search narrows to inks side by side", async ({ page }) => {
  await signIn(page, people.member.email);
  await expect(page.getByRole("button", { name: /Account menu for/ })).toBeVisible();
  const stash = ((await (await page.request.get("/api/stash")).json()) as { items: StashItem[] }).items;
  expect(stash.length).toBeGreaterThan(3);

  await page.goto("/stash");
  const [chart] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: "Your stash chart, US Letter" }).click()]);
  const pdf = await pdfOf(chart);
  expect(pdf.pages).toBeGreaterThanOrEqual(1);
  for (const item of stash) expect(pdf.text).toContain(item.ink.name);
  expect(pdf.text).toContain(`${stash.length} inks, grouped by hue`);

  // Only my inks: every ink of every bridge is in the stash.
  const owned = new Set(stash.map((s) => s.ink.name));
  const ends = [stash[0]!.ink, stash[stash.length - 1]!.ink];
  await page.goto(`/plan?from=${ends[0]!.id}&to=${ends[1]!.id}&bridgeInks=stash`);
  await expect(page.getByRole("radio", { name: "Only my inks" })).toBeChecked();
  await expect(page.getByTestId("bridge-summary")).toContainText(/in your stash|bridges? found/);
  for (const b of await page.getByTestId("bridge").all()) {
    for (const name of await b.locator("ol > li > span.font-bold").allInnerTexts()) expect(owned.has(name)).toBe(true);
  }

  // Keep a plan in a binder as a planned strip; the binder shows it.
  await page.goto(`/plan?inks=${ends[0]!.id},${ends[1]!.id}`);
  const binderName = await page.getByLabel("Keep this plan in a binder").locator("option").first().innerText();
  await page.getByRole("button", { name: "Save as a planned strip" }).click();
  await page.getByRole("status").getByRole("link", { name: binderName }).click();
  const planned = page.getByTestId("binder-plan").first();
  await expect(planned).toContainText(ends[0]!.name);
  await expect(planned).toContainText(ends[1]!.name);
  await planned.getByRole("button", { name: "Remove" }).click();
  await expect(page.getByTestId("binder-plan")).toHaveCount(0);

  // An ink page: the inks most often blended next to it, from the demo's published strips.
  const strips = (await (await page.request.get("/api/strips?limit=1")).json()) as { items: { inks: { id: number; name: string }[] }[] };
  const [a, b] = strips.items[0]!.inks;
  const beside = (await (await page.request.get(`/api/inks/${a!.id}/beside`)).json()) as BesideList;
  await page.goto(`/inks/${a!.id}`);
  const section = page.getByRole("list", { name: `Inks blended next to ${a!.name}, most often first` });
  await expect(section.getByTestId("beside-ink")).toHaveCount(beside.items.length);
  await expect(section.getByTestId("beside-ink").first()).toContainText(beside.items[0]!.ink.name);

  // Search: the two inks anywhere, then only side by side.
  await page.goto(`/search?ink=${a!.id}&ink=${b!.id}`);
  await page.getByText("Next to each other", { exact: true }).click();
  await expect(page).toHaveURL(/adjacent=true/);
  await expect(page.getByTestId("result-summary")).toContainText(/strips? found/);
});
