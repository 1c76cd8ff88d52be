// The heavy-quark ensemble panel in real Chromium: N_Q ≤ 2 (additive, Landau-pole criterion on) runs in its worker,
// shows its counts and histogram, and adds a model set that reaches the legend; the main thread never blocks
// meanwhile (no task over TASK_MARGIN_MS, see settle.ts).
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import type { Browser } from "playwright-core";
import { launchChromium, watchPage } from "./chromium";
import { TASK_MARGIN_MS } from "./settle";
import { heavyQuarkEnsemble } from "../../src/physics";
import { runsAlone } from "./run-lock";

// Times the page's main-thread tasks: no other browser test file runs meanwhile.
runsAlone();

let browser: Browser;

beforeAll(async () => {
  browser = await launchChromium();
});

afterAll(async () => {
  await browser?.close();
});

test("an N_Q ≤ 2 ensemble runs, shows its histogram and joins the legend as a model set", async () => {
  const context = await browser.newContext({ viewport: { width: 1400, height: 950 } });
  const page = await context.newPage();
  const watched = watchPage(page);
  await page.addInitScript(() => {
    const w = window as unknown as { __longTasks: { start: number; duration: number }[] };
    w.__longTasks = [];
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) w.__longTasks.push({ start: e.startTime, duration: e.duration });
    }).observe({ type: "longtask", buffered: true });
  });
  await page.goto(inject("baseUrl"), { waitUntil: "networkidle" });
  // Start-up work (first render, first autosave) ends before the measured window: no long task for a second.
  await page.waitForFunction(
    () => {
      const w = window as unknown as { __longTasks: { start: number; duration: number }[] };
      const last = w.__longTasks[w.__longTasks.length - 1];
      return performance.now() > 1000 && (!last || performance.now() - (last.start + last.duration) > 1000);
    },
    undefined,
    { timeout: 15_000, polling: 100 },
  );
  const t0 = await page.evaluate(() => performance.now());

  await page.click('[data-testid="ensemble-open"]');
  await page.fill('[data-testid="ensemble-max-quarks"]', "2");
  await page.selectOption('[data-testid="ensemble-charges"]', "additive");
  expect(await page.isChecked('[data-testid="ensemble-landau-pole"]')).toBe(true);
  await page.click('[data-testid="ensemble-run"]');
  await page.waitForSelector('[data-testid="ensemble-result"]', { timeout: 60_000 });
  const text = (await page.textContent('[data-testid="ensemble-result"]')) ?? "";
  // The panel shows what the physics core gives for the same settings (checked against papers in tests/physics).
  const core = heavyQuarkEnsemble({ maxQuarks: 2 });
  expect(text).toMatch(new RegExp(`^${core.models} models`));
  expect(text).toContain(`${core.distinct.length} distinct E/N`);
  expect(await page.locator('[data-testid="ensemble-hist"] rect').count()).toBeGreaterThan(3);
  expect(await page.locator('[data-testid="ensemble-hist-log"] rect').count()).toBeGreaterThan(3);

  await page.click('[data-testid="ensemble-add"]');
  await page.waitForSelector('[data-testid="legend"] [data-legend-entry^="Heavy-quark ensemble"]', { timeout: 10_000 });

  const long = await page.evaluate(
    (from) =>
      (window as unknown as { __longTasks: { start: number; duration: number }[] }).__longTasks.filter(
        (t) => t.start >= from,
      ),
    t0,
  );
  expect(long.filter((t) => t.duration > TASK_MARGIN_MS)).toEqual([]);
  expect(watched.consoleErrors).toEqual([]);
  expect(watched.foreignRequests).toEqual([]);
  await context.close();
}, 120_000);
