import { expect, test } from "@playwright/test";
import { people, signIn } from "./support";

test("a member saves strips to a new binder from the strip page and reorders them with the keyboard and by dragging", async ({ page }) => {
  await signIn(page, people.newMember.email);
  await page.waitForURL(/account/);
  await page.goto("/gallery");
  const rows = page.getByTestId("strip-row");
  await expect(rows.first()).toBeVisible();
  const hrefs: string[] = [];
  for (let n = 0; n < 3; n++) hrefs.push((await rows.nth(n).locator("a[href^='/strips/']").first().getAttribute("href"))!);
  const name = `Autumn ideas ${Date.now() % 100000}`;
  const dialog = page.getByRole("dialog", { name: "Save to a binder" });
  const titles: string[] = [];
  for (let n = 0; n < 3; n++) {
    await page.goto(hrefs[n]!);
    titles.push((await page.getByRole("heading", { level: 1 }).innerText()).trim());
    await page.getByRole("button", { name: /Saved? to a binder/ }).click();
    if (n === 0) {
      if ((await dialog.getByLabel("Name of the new binder").count()) === 0) await dialog.getByRole("button", { name: "New binder" }).click();
      await dialog.getByLabel("Name of the new binder").fill(name);
      await dialog.getByLabel(/Public/).check();
      await dialog.getByRole("button", { name: "Create and save" }).click();
      await expect(dialog.getByText(`Made “${name}” and saved this strip to it.`)).toBeVisible();
    } else {
      await dialog.getByRole("button", { name: new RegExp(name) }).click();
      await expect(dialog.getByText(`Saved to “${name}”.`)).toBeVisible();
    }
    await page.keyboard.press("Escape");
  }

  await page.goto("/binders");
  await page.getByRole("link", { name }).click();
  const items = page.getByTestId("binder-item");
  const order = () => items.locator("h3").allInnerTexts();
  await expect.poll(order).toEqual(titles);

  // Keyboard: the first strip moves down twice; focus stays on its button.
  await page.getByRole("button", { name: `Move down: ${titles[0]}` }).focus();
  await page.keyboard.press("Enter");
  // Each move is saved before the next key press is taken (the buttons wait while it saves).
  await expect.poll(order).toEqual([titles[1], titles[0], titles[2]]);
  await expect(page.getByRole("button", { name: `Move down: ${titles[0]}` })).toBeFocused();
  await expect(page.getByRole("button", { name: `Move down: ${titles[0]}` })).toBeEnabled();
  await page.keyboard.press("Enter");
  await expect.poll(order).toEqual([titles[1], titles[2], titles[0]]);

  // Drag: the last strip back to the top (all rows on screen so the drop lands on one).
  await page.setViewportSize({ width: 1280, height: 3000 });
  await items.nth(2).locator('[draggable="true"]').dragTo(items.nth(0), { targetPosition: { x: 40, y: 10 } });
  await expect.poll(order).toEqual([titles[0], titles[1], titles[2]]);

  // The server kept it.
  await page.reload();
  await expect.poll(order).toEqual([titles[0], titles[1], titles[2]]);
});
