// Wheel zoom over a 500,000-point invented closed region (drawn in file order) in real Chromium: the first run
// thinning at each new zoom level goes to the runs worker (src/worker/runs-client.ts) while the figure draws a
// stand-in, the figure ends on the full thinning with nothing pending, and no main-thread task comes near a
// generous 200 ms margin ("long tasks" as defined by the W3C Long Tasks API, https://w3c.github.io/longtasks/).
// Timing targets belong to the bench (bench/region-zoom.mjs); this only catches a regression.
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import type { Browser } from "playwright-core";
import { launchChromium, watchPage } from "./chromium";
import { seedStoredRegion } from "./stored-region";
import { runsAlone } from "./run-lock";

// Times the page's main-thread tasks: no other browser test file runs meanwhile.
runsAlone();

const POINTS = 500_000;
const CURVE_ID = "zoomed-region";
const LABEL = "Demo noisy region (invented)";

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

test("zooming a big file-order region thins new levels in the worker and ends on the full thinning", async () => {
  const context = await browser.newContext({ viewport: { width: 1400, height: 950 } });
  const page = await context.newPage();
  // The autosave as the app stores it. Invented data: a wobbly contour with a little noise on the radius, so run
  // thinning beats Douglas–Peucker once zoomed in.
  await seedStoredRegion(page, inject("baseUrl"), {
    curveId: CURVE_ID,
    label: LABEL,
    projectName: "Zoomed region (invented)",
    contour: { points: POINTS, wobble: 0.05, wobbleTurns: 17, wobblePeriodPoints: Infinity, noise: 0.01 },
    massRangeEv: [1e-7, 1e-2],
    yRange: [1e-14, 1e-10],
  });

  const watched = watchPage(page);
  await page.addInitScript(() => {
    const w = window as unknown as { __longTasks: { start: number; duration: number }[]; __pendingSeen: number };
    w.__longTasks = [];
    w.__pendingSeen = 0;
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) w.__longTasks.push({ start: e.startTime, duration: e.duration });
    }).observe({ type: "longtask", buffered: true });
    // Every frame the figure drew with a stand-in says so on its <svg>.
    new MutationObserver(() => {
      if (document.querySelector("[data-thinning-pending]")) w.__pendingSeen++;
    }).observe(document, { subtree: true, attributes: true, attributeFilter: ["data-thinning-pending"] });
  });
  await page.goto(inject("baseUrl"), { waitUntil: "load" });
  const svg = page.locator('[data-testid="plot"] svg');
  const path = page.locator(`[data-testid="plot"] path[data-curve-id="${CURVE_ID}"]`).first();
  await path.waitFor({ timeout: 60_000 });
  // The restore is done once the preparation note and any stand-in are gone.
  await page.locator('[data-testid="figure-preparing"]').waitFor({ state: "detached", timeout: 60_000 });
  await expect.poll(() => svg.getAttribute("data-thinning-pending"), { timeout: 60_000 }).toBeNull();

  const domain = async () => (await svg.getAttribute("data-mass-domain"))!.split(",").map(Number);
  const span = async () => {
    const [a, b] = await domain();
    return Math.log10(b / a);
  };
  const span0 = await span();
  const t0 = await page.evaluate(() => performance.now());
  const box = (await svg.boundingBox())!;
  // About the region's lower left edge, in steps of exp(−0.4) (the figure's wheel rate × 200 px): each step
  // is a new thinning level or more.
  await page.mouse.move(box.x + box.width * 0.42, box.y + box.height * 0.62);
  for (let i = 0; i < 5; i++) await page.mouse.wheel(0, -200);
  await expect.poll(async () => (await span()) / span0, { timeout: 60_000 }).toBeCloseTo(Math.exp(-2), 6);
  await expect.poll(() => svg.getAttribute("data-thinning-pending"), { timeout: 60_000 }).toBeNull();

  const { longTasks, pendingSeen } = await page.evaluate(() => {
    const w = window as unknown as { __longTasks: { start: number; duration: number }[]; __pendingSeen: number };
    return { longTasks: w.__longTasks, pendingSeen: w.__pendingSeen };
  });
  // The worker took at least one level (the stand-in was drawn), and the figure ended on the full thinning.
  expect(pendingSeen).toBeGreaterThan(0);
  expect(((await path.getAttribute("d")) ?? "").length).toBeGreaterThan(1000);
  const zoomTasks = longTasks.filter((t) => t.start + t.duration >= t0);
  expect(
    zoomTasks.filter((t) => t.duration > 200),
    JSON.stringify(zoomTasks),
  ).toEqual([]);
  await page.screenshot({ path: "/tmp/axband-zoom-region.png" });
  expect(watched.consoleErrors).toEqual([]);
  expect(watched.foreignRequests).toEqual([]);
  await context.close();
});
