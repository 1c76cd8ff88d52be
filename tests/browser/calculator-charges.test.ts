// In real Chromium: the heavy quark (3,1,0) built in the anomaly calculator from its Yukawa Φ Q̄_L Q_R gives
// E/N = 0 and N_DW = 1 (Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801, Table I; from memory) and goes into the
// figure as a model line; the calculator's draft survives a reload.
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import type { Browser } from "playwright-core";
import { launchChromium, watchPage } from "./chromium";

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

test("build the (3,1,0) heavy-quark model from its Yukawa term, see E/N = 0 and N_DW = 1, add it to the figure", async () => {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
  const page = await context.newPage();
  const watched = watchPage(page);
  await page.goto(inject("baseUrl"), { waitUntil: "networkidle" });
  await page.getByRole("button", { name: "Anomaly calculator…" }).click();
  const dialog = page.getByRole("dialog");
  // Start from wrong typed charges so the solver has to fill them.
  await dialog.getByRole("textbox", { name: "PQ charge of Q_L" }).fill("7");
  await dialog.getByText("Charges from the Lagrangian").click();
  await dialog.getByRole("textbox", { name: "Kept terms" }).fill("Q̄_L Φ Q_R");
  await dialog.getByRole("textbox", { name: "Forbidden terms" }).fill("Qbar_L Q_R");
  await dialog.getByRole("textbox", { name: "Model name" }).fill("KSVZ from its Yukawa");
  await dialog.getByRole("button", { name: "Solve charges" }).click();
  await expect.poll(() => dialog.getByTestId("calc-eovern").textContent()).toBe("0");
  expect(await dialog.getByTestId("calc-ndw").textContent()).toBe("1");
  expect(await dialog.getByRole("textbox", { name: "PQ charge of Q_L" }).inputValue()).toBe("1");
  expect(await dialog.getByTestId("charge-report").textContent()).toContain("determined by the terms");
  await dialog.getByTestId("calc-add-model").click();
  await dialog.getByRole("button", { name: "Close the anomaly calculator" }).click();
  const entry = page.locator('[data-testid="legend"] [data-legend-entry="KSVZ from its Yukawa, E/N = 0"]');
  await expect.poll(() => entry.count()).toBe(1);
  const id = await entry.getAttribute("data-model-id");
  expect(await page.locator(`[data-testid="plot"] path[data-model-id="${id}"]`).count()).toBeGreaterThan(0);
  // The draft (name, terms) is kept across a reload.
  await page.reload({ waitUntil: "networkidle" });
  await page.getByRole("button", { name: "Anomaly calculator…" }).click();
  const again = page.getByRole("dialog");
  await expect.poll(() => again.getByRole("textbox", { name: "Model name" }).inputValue()).toBe("KSVZ from its Yukawa");
  expect(await again.getByRole("textbox", { name: "Kept terms" }).inputValue()).toBe("Q̄_L Φ Q_R");
  expect(await again.getByTestId("calc-eovern").textContent()).toBe("0");
  expect(watched.consoleErrors).toEqual([]);
  await context.close();
});
