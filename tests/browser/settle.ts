// Waiting for the page to have finished its work, by its own signals (storage written, main thread quiet), instead
// of sleeping for a fixed time: browser tests that measure the main thread's tasks end their window here.
import { expect } from "vitest";
import type { Page } from "playwright-core";

/**
 * Resolves once the curve `curveId` is saved: its head record in IndexedDB (written after all its chunks,
 * src/ui/store/curve-store.ts) and the project text in localStorage naming it.
 */
export async function waitForSavedCurve(page: Page, curveId: string, timeout = 60_000): Promise<void> {
  const saved = () =>
    page.evaluate(
      (id) =>
        (localStorage.getItem("axband:project") ?? "").includes(id) &&
        new Promise<boolean>((resolve) => {
          const req = indexedDB.open("axband");
          req.onerror = () => resolve(false);
          req.onsuccess = () => {
            const db = req.result;
            if (!db.objectStoreNames.contains("curves")) return resolve(false);
            const get = db.transaction("curves").objectStore("curves").getKey(id);
            get.onsuccess = () => resolve(get.result !== undefined);
            get.onerror = () => resolve(false);
            db.close();
          };
        }),
      curveId,
    );
  // Polled from here: page.waitForFunction does not wait for a predicate's promise.
  await expect.poll(saved, { timeout, interval: 100 }).toBe(true);
}

/**
 * Resolves once no long task (recorded in `window.__longTasks` by the test's PerformanceObserver) has ended for
 * `quietMs`: the work a step set off, drawing included, has run.
 */
export async function waitForQuiet(page: Page, quietMs = 500, timeout = 30_000): Promise<void> {
  await page.waitForFunction(
    (quiet) => {
      const w = window as unknown as { __longTasks: { start: number; duration: number }[] };
      const last = w.__longTasks[w.__longTasks.length - 1];
      return !last || performance.now() - (last.start + last.duration) > quiet;
    },
    quietMs,
    { timeout, polling: 50 },
  );
}

/**
 * The longest main-thread task the browser tests accept. The budget is 200 ms (the W3C Long Tasks API counts
 * tasks over 50 ms, https://w3c.github.io/longtasks/), measured by the benchmarks (`npm run bench`); a test
 * allows five times that, a margin for a busy machine (tasks of 560–680 ms were seen at a load of 20 on two
 * cores) that still catches work moved back onto the main thread (preparing a million-point region there took
 * 1.1–1.4 s on an idle machine, parsing a million rows seconds). A file that checks it calls runsAlone()
 * (run-lock.ts): another test file's page beside it would stretch its tasks.
 */
export const TASK_MARGIN_MS = 1000;
