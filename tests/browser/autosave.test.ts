// Autosave, start-up and undo/redo in real Chromium: a reload keeps the project (curve data from IndexedDB),
// undo/redo by buttons and keys (not while typing), full storage gives one alert, links open over it.
// Storage behaviour per the WHATWG HTML standard, §12 Web storage (setItem throws "QuotaExceededError").
import { afterAll, beforeAll, describe, expect, inject, test } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchChromium, watchPage, type Watched } from "./chromium";
import { reusedContext } from "./fresh-context";
import { defaultProject } from "../../src/project/demo";
import { newModel } from "../../src/project/defaults";
import { encodeLink } from "../../src/formats/codec";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

const contexts = reusedContext(() => browser, { viewport: { width: 1440, height: 900 } });

/** The app in the file's context, emptied (no storage) for each test; `init` runs before the page's scripts. */
async function open(init?: () => void, hash = ""): Promise<{ page: Page; watched: Watched }> {
  const page = await (await contexts.fresh()).newPage();
  if (init) await page.addInitScript(init);
  const watched = watchPage(page);
  await page.goto(inject("baseUrl") + hash, { waitUntil: "networkidle" });
  await page.locator('[data-testid="plot"] svg').waitFor();
  return { page, watched };
}

const legendTexts = (page: Page) =>
  page
    .locator('[data-testid="legend"] [data-legend-entry]')
    .evaluateAll((els) => els.map((e) => e.getAttribute("data-legend-entry") ?? ""));
const massDomain = (page: Page) => page.locator('[data-testid="plot"] svg').getAttribute("data-mass-domain");

/** The autosaved text in localStorage, parsed ({} when nothing is saved yet). */
const savedMeta = (page: Page) =>
  page.evaluate(() => JSON.parse(localStorage.getItem("axband:project") ?? "{}") as Record<string, unknown>);

/** The keys IndexedDB holds for stored curve data (the curve's own record and its chunks). */
const storedCurveKeys = (page: Page) =>
  page.evaluate(
    () =>
      new Promise<string[]>((resolve, reject) => {
        const req = indexedDB.open("axband");
        req.onerror = () => reject(req.error);
        req.onsuccess = () => {
          const db = req.result;
          if (!db.objectStoreNames.contains("curves")) return resolve([]);
          const keys = db.transaction("curves").objectStore("curves").getAllKeys();
          keys.onsuccess = () => resolve(keys.result.map(String));
          keys.onerror = () => reject(keys.error);
        };
      }),
  );

async function addModel(page: Page, text: string) {
  await page.getByTestId("model-eovern").fill(text);
  await page.getByTestId("add-model").click();
}

describe("autosave", () => {
  test("a reload restores models, the zoomed view and the curves", async () => {
    const { page, watched } = await open();
    await addModel(page, "5/3..44/3");
    await page.locator('[data-testid="plot"] svg').focus();
    await page.keyboard.press("+");
    await expect.poll(() => legendTexts(page)).toContain("E/N = 5/3..44/3 (reaches g = 0: cancellation)");
    const zoomed = await massDomain(page);
    // Saved after the debounce: wait until the stored text holds the new model and the zoomed view.
    await expect
      .poll(async () => {
        const meta = await savedMeta(page);
        const figure = meta.figure as { massRangeEv?: number[] } | undefined;
        return JSON.stringify(meta).includes("5/3..44/3") && figure?.massRangeEv?.join(",") === zoomed;
      })
      .toBe(true);
    // Curve data goes to IndexedDB after the text, one task per curve: wait for all four demo curves.
    await expect.poll(async () => (await storedCurveKeys(page)).length, { timeout: 30_000 }).toBeGreaterThanOrEqual(4);
    await page.reload({ waitUntil: "networkidle" });
    await page.locator('[data-testid="plot"] svg').waitFor();
    // Restored curves join the legend once read back and prepared off the main thread (slow on a busy machine).
    await expect
      .poll(async () => (await legendTexts(page)).filter((t) => t.includes("(invented)")).length, { timeout: 30_000 })
      .toBe(4);
    const texts = await legendTexts(page);
    expect(texts).toContain("E/N = 5/3..44/3 (reaches g = 0: cancellation)");
    expect(await massDomain(page)).toBe(zoomed);
    expect(await page.locator('[data-testid="plot"] path[data-curve-id]').count()).toBeGreaterThanOrEqual(4);
    // A fresh start has no history to undo.
    expect(await page.getByTestId("undo").isDisabled()).toBe(true);
    expect(await page.getByRole("alert").count()).toBe(0);
    expect(watched.consoleErrors).toEqual([]);
  });

  test("a curve bigger than one stored chunk (150,000 points) comes back after a reload, drawn the same", async () => {
    const dir = mkdtempSync(join(tmpdir(), "axband-autosave-"));
    const file = join(dir, "chunked (invented).csv");
    // Invented data: 150,000 points over two decades, more than two 65,536-point chunks.
    const rows = ["# invented for the autosave test; not data from any experiment", "m_a [eV],g [GeV^-1]"];
    for (let i = 0; i < 150_000; i++)
      rows.push(
        `${(2e-6 * 10 ** ((2 * i) / 149_999)).toExponential(10)},${(3e-13 * (1.2 + Math.sin(i / 500))).toExponential(8)}`,
      );
    writeFileSync(file, rows.join("\n") + "\n");
    try {
      const { page, watched } = await open();
      await page.setInputFiles('[data-testid="import-files"]', file);
      await page.click('[data-testid="import-confirm"]', { timeout: 60_000 });
      const entry = page.locator('[data-testid="legend"] [data-legend-entry="chunked (invented)"]');
      await entry.waitFor({ timeout: 60_000 });
      const curveId = await entry.getAttribute("data-curve-id");
      const path = page.locator(`[data-testid="plot"] path[data-curve-id="${curveId}"]`).first();
      const before = await path.getAttribute("d");
      expect((before ?? "").length).toBeGreaterThan(1000);
      // Saved after the debounce, one chunk per task: wait for the head and all three 65,536-point chunks.
      await expect
        .poll(async () => (await storedCurveKeys(page)).filter((k) => k.startsWith(curveId!)).length, {
          timeout: 30_000,
        })
        .toBe(4);
      await expect.poll(async () => JSON.stringify(await savedMeta(page)).includes(curveId!)).toBe(true);
      await page.reload({ waitUntil: "networkidle" });
      await page.locator('[data-testid="legend"] [data-legend-entry="chunked (invented)"]').waitFor();
      expect(
        await page.locator(`[data-testid="plot"] path[data-curve-id="${curveId}"]`).first().getAttribute("d"),
      ).toBe(before);
      expect(await page.getByRole("alert").count()).toBe(0);
      expect(watched.consoleErrors).toEqual([]);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  test("full storage: one alert, and the app keeps working", async () => {
    const { page, watched } = await open(() => {
      const w = window as unknown as { __saveTries: number };
      w.__saveTries = 0;
      Storage.prototype.setItem = function () {
        w.__saveTries += 1;
        throw new DOMException("The quota has been exceeded.", "QuotaExceededError");
      };
    });
    const saveTries = () => page.evaluate(() => (window as unknown as { __saveTries: number }).__saveTries);
    // Two changes, each after the other's save was tried: two failed saves, one alert.
    await addModel(page, "2/3");
    await expect.poll(saveTries).toBeGreaterThanOrEqual(1);
    const tries = await saveTries();
    await addModel(page, "8/3..16/3");
    await expect.poll(saveTries).toBeGreaterThan(tries);
    const alerts = page.getByRole("alert");
    await expect.poll(() => alerts.count()).toBe(1);
    expect(await alerts.first().textContent()).toMatch(/storage is full or unavailable/i);
    expect(await legendTexts(page)).toContain("E/N = 2/3");
    await page.getByTestId("undo").click();
    await expect.poll(() => legendTexts(page)).not.toContain("E/N = 8/3..16/3");
    await page.getByRole("button", { name: "Dismiss message" }).click();
    expect(await alerts.count()).toBe(0);
    expect(watched.consoleErrors).toEqual([]);
  });
});

describe("undo and redo", () => {
  test("buttons and Ctrl+Z / Shift+Ctrl+Z / Ctrl+Y; keys inside a text field are left to the field", async () => {
    const { page, watched } = await open();
    await addModel(page, "16/15");
    await expect.poll(() => legendTexts(page)).toContain("E/N = 16/15");
    await page.getByTestId("undo").click();
    await expect.poll(() => legendTexts(page)).not.toContain("E/N = 16/15");
    await page.getByTestId("redo").click();
    await expect.poll(() => legendTexts(page)).toContain("E/N = 16/15");

    await page.locator("h1").click();
    await page.keyboard.press("Control+z");
    await expect.poll(() => legendTexts(page)).not.toContain("E/N = 16/15");
    await page.keyboard.press("Control+Shift+z");
    await expect.poll(() => legendTexts(page)).toContain("E/N = 16/15");
    await page.keyboard.press("Control+z");
    await page.keyboard.press("Control+y");
    await expect.poll(() => legendTexts(page)).toContain("E/N = 16/15");

    const input = page.getByTestId("model-eovern");
    await input.fill("1/6");
    await input.press("Control+z");
    expect(await legendTexts(page)).toContain("E/N = 16/15");
    expect(watched.consoleErrors).toEqual([]);
  });
});

describe("links at start", () => {
  test("a valid link opens its project (undoable) and the fragment is dropped from the address", async () => {
    const project = defaultProject();
    project.models = [
      ...project.models,
      newModel({ id: "from-link", eOverNMin: "44/3", label: "From the link, E/N = 44/3" }, project),
    ];
    const fragment = encodeLink(project, { includeCurves: false });
    const { page, watched } = await open(undefined, `#${fragment}`);
    await expect.poll(() => legendTexts(page)).toContain("From the link, E/N = 44/3");
    expect(await page.getByRole("status").first().textContent()).toMatch(/link/i);
    expect(new URL(page.url()).hash).toBe("");
    expect(await page.getByTestId("undo").isDisabled()).toBe(false);
    expect(watched.consoleErrors).toEqual([]);
  });

  test("a tampered link shows an alert and the previous project stays", async () => {
    const { page, watched } = await open(undefined, "#v1.AAAA-this-is-not-a-project");
    const alert = page.getByRole("alert");
    await expect.poll(() => alert.count()).toBe(1);
    expect(await alert.textContent()).toMatch(/link/i);
    const texts = await legendTexts(page);
    expect(texts).toHaveLength(7); // the demo project
    expect(watched.consoleErrors).toEqual([]);
  });
});
