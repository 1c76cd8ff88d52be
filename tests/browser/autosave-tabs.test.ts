// Two tabs of the app in one real Chromium profile (two pages of one browser context: one localStorage, one
// IndexedDB, one BroadcastChannel), and a full localStorage across reloads (issue 16): a tab never saves over
// newer work of another tab without asking, loading the other tab's work names what this tab loses, and the
// newest state survives a reload when localStorage is full. BroadcastChannel per the WHATWG HTML standard,
// §9.5 Broadcasting to other browsing contexts; storage per §12 Web storage (setItem throws "QuotaExceededError").
import { afterAll, beforeAll, describe, expect, inject, test } from "vitest";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { launchChromium, watchPage, type Watched } from "./chromium";
import { reusedContext } from "./fresh-context";

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

const contexts = reusedContext(() => browser, { viewport: { width: 1440, height: 900 } });

/** A tab of the app in `context`; `init` runs before the page's scripts, on reloads too. */
async function openTab(context: BrowserContext, init?: () => void): Promise<{ page: Page; watched: Watched }> {
  const page = await context.newPage();
  if (init) await page.addInitScript(init);
  const watched = watchPage(page);
  await page.goto(inject("baseUrl"), { waitUntil: "networkidle" });
  await page.locator('[data-testid="plot"] svg').waitFor();
  return { page, watched };
}

const legendTexts = (page: Page) =>
  page
    .locator('[data-testid="legend"] [data-legend-entry]')
    .evaluateAll((els) => els.map((e) => e.getAttribute("data-legend-entry") ?? ""));

/** The autosaved project text in localStorage ("" when nothing is saved). */
const savedText = (page: Page) => page.evaluate(() => localStorage.getItem("axband:project") ?? "");

/** The project text autosave keeps in IndexedDB when localStorage is full ("" when there is none). */
const spareText = (page: Page) =>
  page.evaluate(
    () =>
      new Promise<string>((resolve, reject) => {
        const req = indexedDB.open("axband");
        req.onerror = () => reject(req.error);
        req.onsuccess = () => {
          const db = req.result;
          if (!db.objectStoreNames.contains("curves")) return resolve("");
          const get = db.transaction("curves").objectStore("curves").get("\u0001project");
          get.onsuccess = () => resolve((get.result as { text?: string } | undefined)?.text ?? "");
          get.onerror = () => reject(get.error);
        };
      }),
  );

async function addModel(page: Page, text: string) {
  await page.getByTestId("model-eovern").fill(text);
  await page.getByTestId("add-model").click();
}

const UPGRADE = "Demo network: upgrade reach (invented)";

describe("two tabs", () => {
  test("a tab that hears of newer work stops saving and asks; closing it then leaves the other tab's work", async () => {
    const context = await contexts.fresh();
    const a = await openTab(context);
    const b = await openTab(context);
    await addModel(a.page, "11/7");
    await expect.poll(() => savedText(a.page)).toContain('"11/7"');

    const conflict = b.page.getByTestId("tab-conflict");
    await expect.poll(() => conflict.count()).toBe(1);
    expect(await conflict.textContent()).toMatch(/Another tab saved newer work/);
    await addModel(b.page, "12/7");
    await expect.poll(() => legendTexts(b.page)).toContain("E/N = 12/7");
    // Closing the tab fires pagehide, where autosave saves at once when it may.
    await b.page.close({ runBeforeUnload: true });
    const saved = await savedText(a.page);
    expect(saved).toContain('"11/7"');
    expect(saved).not.toContain('"12/7"');
    expect([...a.watched.consoleErrors, ...b.watched.consoleErrors]).toEqual([]);
  });

  test("'Load it' takes the other tab's work and names the curve this tab loses; 'Keep mine and save' writes over it", async () => {
    const context = await contexts.fresh();
    const a = await openTab(context);
    const b = await openTab(context);
    await a.page.getByRole("button", { name: `Remove ${UPGRADE}`, exact: true }).click();
    await expect.poll(() => legendTexts(a.page)).not.toContain(UPGRADE);
    await expect.poll(() => savedText(a.page)).not.toContain(UPGRADE);

    // Tab B still shows the curve, and asks instead of saving its own edit over A's.
    const conflictB = b.page.getByTestId("tab-conflict");
    await expect.poll(() => conflictB.count()).toBe(1);
    expect(await legendTexts(b.page)).toContain(UPGRADE);
    await conflictB.getByRole("button", { name: "Load it" }).click();
    await expect.poll(() => conflictB.count()).toBe(0);
    expect(await legendTexts(b.page)).not.toContain(UPGRADE);
    const status = b.page.getByRole("status").filter({ hasText: "Loaded the newer work of another tab" });
    expect(await status.textContent()).toContain(`It does not have curve "${UPGRADE}" from this tab.`);

    // B now builds on the newest work: its edit saves, and A, whose work is now older, asks in turn.
    await addModel(b.page, "13/7");
    await expect.poll(() => savedText(b.page)).toContain('"13/7"');
    const conflictA = a.page.getByTestId("tab-conflict");
    await expect.poll(() => conflictA.count()).toBe(1);
    await addModel(a.page, "15/7");
    await conflictA.getByRole("button", { name: "Keep mine and save" }).click();
    await expect.poll(() => savedText(a.page)).toContain('"15/7"');
    expect(await savedText(a.page)).not.toContain('"13/7"');
    // …and B hears of it.
    await expect.poll(() => conflictB.count()).toBe(1);
    expect([...a.watched.consoleErrors, ...b.watched.consoleErrors]).toEqual([]);
  });
});

describe("full storage", () => {
  test("with localStorage full, the last edit is kept in IndexedDB and comes back after a reload", async () => {
    const context = await contexts.fresh();
    // Once the page sets the flag, saving the project into localStorage throws as a full storage does.
    const { page, watched } = await openTab(context, () => {
      if (!sessionStorage.getItem("fill")) return;
      const setItem = Storage.prototype.setItem;
      Storage.prototype.setItem = function (this: Storage, key: string, value: string) {
        if (this === localStorage && key === "axband:project")
          throw new DOMException("The quota has been exceeded.", "QuotaExceededError");
        setItem.call(this, key, value);
      };
    });
    await addModel(page, "1/7");
    await expect.poll(() => savedText(page)).toContain('"1/7"');
    await page.evaluate(() => sessionStorage.setItem("fill", "1"));
    await page.reload({ waitUntil: "networkidle" });
    await page.locator('[data-testid="plot"] svg').waitFor();
    await addModel(page, "2/7");
    await expect.poll(() => page.getByRole("alert").count()).toBe(1);
    await expect.poll(() => spareText(page)).toContain('"2/7"');
    expect(await savedText(page)).not.toContain('"2/7"');

    await page.reload({ waitUntil: "networkidle" });
    await expect.poll(() => legendTexts(page)).toContain("E/N = 2/7");
    expect(await legendTexts(page)).toContain("E/N = 1/7");
    expect(watched.consoleErrors).toEqual([]);
  });
});
