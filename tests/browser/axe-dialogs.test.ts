// axe-core (Deque, default rules) on the two dialogs of the page, in real Chromium: the import step with a file
// staged (its card with the detected layout, units and first rows) and the anomaly calculator opened with a model
// built in it (charges solved from a Lagrangian). Every violation is listed on failure; none may remain.
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Browser } from "playwright-core";
import { launchChromium, watchPage } from "./chromium";
import { reusedContext } from "./fresh-context";
import { axeViolations } from "./axe";

let browser: Browser;
let dir: string;
beforeAll(async () => {
  browser = await launchChromium();
  dir = mkdtempSync(join(tmpdir(), "axband-axe-"));
});
afterAll(async () => {
  await browser?.close();
  if (dir) rmSync(dir, { recursive: true, force: true });
});

const contexts = reusedContext(() => browser, { viewport: { width: 1400, height: 950 } });

test("the import step with a file staged has no axe violations", async () => {
  const file = join(dir, "invented-scan.csv");
  // Invented: a few points in μeV with one unreadable row, so the card shows its warnings too.
  writeFileSync(file, "# invented for a test\nm_a [ueV],g [1/GeV]\n1.0,3e-14\n2.0,2.5e-14\nx,y\n3.0,2.7e-14\n");
  const page = await (await contexts.fresh()).newPage();
  const watched = watchPage(page);
  await page.goto(inject("baseUrl"), { waitUntil: "networkidle" });
  await page.setInputFiles('[data-testid="import-files"]', file);
  await page.locator('[data-testid="import-detected"]').waitFor();
  await page.locator('[data-testid="import-confirm"]').waitFor();
  expect(await axeViolations(page)).toEqual([]);
  expect(watched.consoleErrors).toEqual([]);
});

test("the anomaly calculator with a model built in it has no axe violations", async () => {
  const page = await (await contexts.fresh()).newPage();
  const watched = watchPage(page);
  await page.goto(inject("baseUrl"), { waitUntil: "networkidle" });
  await page.getByRole("button", { name: "Anomaly calculator…" }).click();
  const dialog = page.getByRole("dialog");
  await dialog.getByTestId("calc-eovern").waitFor();
  expect(await axeViolations(page)).toEqual([]);
  // The heavy quark (3,1,0) from its Yukawa term (as in calculator-charges.test.ts): the charge solver's parts open.
  await dialog.getByText("Charges from the Lagrangian").click();
  await dialog.getByRole("textbox", { name: "Kept terms" }).fill("Q̄_L Φ Q_R");
  await dialog.getByRole("textbox", { name: "Model name" }).fill("KSVZ from its Yukawa");
  await dialog.getByRole("button", { name: "Solve charges" }).click();
  await expect.poll(() => dialog.getByTestId("calc-eovern").textContent()).toBe("0");
  expect(await axeViolations(page)).toEqual([]);
  // The breakdown open, a forbidden term the symmetry allows (a warning), then an SU(3)_L row whose β field shows
  // and the Yukawa no longer an SU(3)_L singlet (the error list).
  await dialog.getByText("Per-field breakdown").click();
  await dialog.getByRole("textbox", { name: "Forbidden terms" }).fill("Qbar_L Q_R Phi");
  await dialog.getByRole("button", { name: "Solve charges" }).click();
  await expect.poll(() => dialog.getByTestId("charge-report").textContent()).toContain("Not forbidden");
  expect(await axeViolations(page)).toEqual([]);
  await dialog.getByRole("combobox", { name: "Electroweak kind of Q_L" }).selectOption("su3l");
  await dialog.getByRole("textbox", { name: "β of Q_L" }).fill("-1/√3");
  await dialog.getByRole("button", { name: "Solve charges" }).click();
  await expect.poll(() => dialog.getByTestId("solve-errors").textContent()).toContain("SU(3)_L: triality");
  expect(await axeViolations(page)).toEqual([]);
  expect(watched.consoleErrors).toEqual([]);
});
