// One browser context per test file, emptied between tests instead of made anew: a new context fetches and compiles
// the app from nothing (2.6–5.5 s to the first figure on a busy 2-core machine, against 0.9–2 s in a context that has
// loaded it before), and an emptied one gives the next test the same start as a new one (no storage, no cookies, no
// permissions, no page open).
import { inject } from "vitest";
import type { Browser, BrowserContext, BrowserContextOptions } from "playwright-core";

export interface ReusedContext {
  /**
   * The file's context with every page closed and its storage empty (localStorage, IndexedDB, cookies, permissions;
   * sessionStorage goes with the pages). Scripts meant for every page go on the page (page.addInitScript): a
   * context's own init scripts would outlive the test.
   */
  fresh(): Promise<BrowserContext>;
}

/** A context of `browser()` (the file's connection, made in its beforeAll) with `options`, reused by fresh(). */
export function reusedContext(browser: () => Browser, options: BrowserContextOptions): ReusedContext {
  let context: BrowserContext | undefined;
  return {
    async fresh() {
      if (!context) {
        context = await browser().newContext(options);
        return context;
      }
      // Closed first, so no page saves into the storage after it is emptied.
      await Promise.all(context.pages().map((p) => p.close()));
      await context.clearCookies();
      await context.clearPermissions();
      // Emptied from a same-origin page that does not run the app (the demo project file).
      const page = await context.newPage();
      await page.goto(inject("baseUrl") + "demo.axband.json", { waitUntil: "load" });
      await page.evaluate(async () => {
        localStorage.clear();
        sessionStorage.clear();
        for (const { name } of await indexedDB.databases()) {
          if (!name) continue;
          await new Promise<void>((resolve, reject) => {
            const req = indexedDB.deleteDatabase(name);
            req.onsuccess = () => resolve();
            req.onerror = () => reject(req.error);
          });
        }
      });
      await page.close();
      return context;
    },
  };
}
