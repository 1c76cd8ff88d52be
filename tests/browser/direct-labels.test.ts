// Direct labels in real Chromium: Figure → Legend "on the plot" writes each label beside its line; dragging one
// moves it, the place survives a reload (autosave) and travels in a share link, arrow keys move a focused label,
// "Reset label positions" puts them back, and axe-core finds no serious or critical violation (Deque axe-core rules).
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchChromium, watchPage } from "./chromium";
import { seriousViolations } from "./axe";

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

const HANDLE = '[data-testid="direct-label-handle"][data-label-id="demo-dish"]';

/** The centre of the dish curve's label text on screen, client px (rounded). */
const labelXY = (page: Page) =>
  page.evaluate(() => {
    const t = document.querySelector('[data-testid="plot"] svg text[id$="label-curve-2"]');
    if (!t) return null;
    // Client px: the text sits in a group placed by a transform, so its own attributes say nothing.
    const b = t.getBoundingClientRect();
    return [Math.round(b.x + b.width / 2), Math.round(b.y + b.height / 2)];
  });

/** The stored labelAt of the dish curve in the autosaved project text (null when none). */
const savedAt = (page: Page) =>
  page.evaluate(() => {
    const p = JSON.parse(localStorage.getItem("axband:project") ?? "{}") as {
      curves?: { id: string; labelAt?: unknown }[];
    };
    return p.curves?.find((c) => c.id === "demo-dish")?.labelAt ?? null;
  });

test("labels on the plot: drag, reload, keys, reset; no serious axe violations", async () => {
  const context = await browser.newContext({ viewport: { width: 1400, height: 950 } });
  const page = await context.newPage();
  const watched = watchPage(page);
  await page.goto(inject("baseUrl"), { waitUntil: "networkidle" });
  await page.locator("#section-figure > summary").click();
  await page.selectOption('[data-testid="legend-place"]', "on-plot");
  await page.locator(HANDLE).waitFor();
  expect(await page.locator('[data-testid="plot"] svg text[data-direct-label]').count()).toBeGreaterThanOrEqual(7);
  const before = await labelXY(page);

  // Drag the label 80 px left and 40 px down.
  const box = (await page.locator(HANDLE).boundingBox())!;
  await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
  await page.mouse.down();
  await page.mouse.move(box.x + box.width / 2 - 40, box.y + box.height / 2 + 20, { steps: 4 });
  await page.mouse.move(box.x + box.width / 2 - 80, box.y + box.height / 2 + 40, { steps: 4 });
  await page.mouse.up();
  await expect.poll(() => page.locator(HANDLE).getAttribute("data-moved")).toBe("true");
  const moved = (await labelXY(page))!;
  expect(moved[0]).toBeLessThan(before![0] - 20);
  expect(moved[1]).toBeGreaterThan(before![1] + 10);

  // Saved with the project, and back after a reload.
  await expect.poll(() => savedAt(page), { timeout: 10_000 }).not.toBeNull();
  await page.reload({ waitUntil: "networkidle" });
  await page.locator(HANDLE).waitFor({ timeout: 30_000 });
  await expect.poll(() => labelXY(page), { timeout: 30_000 }).toEqual(moved);
  expect(await page.locator(HANDLE).getAttribute("data-moved")).toBe("true");

  // Keyboard: a focused label moves with the arrow keys.
  await page.locator(HANDLE).focus();
  await page.keyboard.press("ArrowUp");
  await expect.poll(async () => (await labelXY(page))![1]).toBeLessThan(moved[1]);

  expect(await seriousViolations(page)).toEqual([]);

  // Reset: every label back to its automatic place.
  // The Figure section may have stayed open across the reload.
  if (!(await page.getByTestId("reset-label-positions").isVisible()))
    await page.locator("#section-figure > summary").click();
  await page.getByTestId("reset-label-positions").click();
  await expect.poll(() => page.locator(HANDLE).getAttribute("data-moved")).toBe("false");
  await expect.poll(() => labelXY(page)).toEqual(before);
  expect(watched.consoleErrors).toEqual([]);
  await context.close();
});
