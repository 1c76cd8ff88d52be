// Region zoom benchmark (`node bench/region-zoom.mjs`): wheel zoom in the built app over a 1,000,000-point invented
// closed region (drawn in file order, restored from autosave), with the first run thinning of each new zoom level
// in the runs worker (what the app does) and on the main thread (the page run without Worker). Prints the longest
// main-thread task of the first wheel step and of a burst of further steps, and the time until the figure shows
// the full thinning; medians of AXBAND_BENCH_ROUNDS (default 3) alternated fresh pages. Never pass/fail.
import { mkdirSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { tsImport } from "tsx/esm/api";

const repoRoot = resolve(dirname(fileURLToPath(import.meta.url)), "..");
const outDir = join(repoRoot, "bench", ".out", "region-zoom-app");
const POINTS = Number(process.env.AXBAND_BENCH_REGION_POINTS ?? 1_000_000);
const ROUNDS = Number(process.env.AXBAND_BENCH_ROUNDS ?? 3);
const BURST = 8;

/** Writes the autosave (project text in localStorage, curve chunks in IndexedDB) as the app stores it. */
async function writeAutosave(page, baseUrl) {
  const { seedStoredRegion } = await tsImport("../tests/browser/stored-region.ts", import.meta.url);
  // Invented: a wobbly contour with a little noise on its radius, like the shared benchmark's regions.
  await seedStoredRegion(page, baseUrl, {
    curveId: "bench-region",
    label: "Invented region",
    projectName: "Region zoom benchmark (invented)",
    contour: { points: POINTS, wobble: 0.05, wobbleTurns: 17, wobblePeriodPoints: Infinity, noise: 0.01 },
    massRangeEv: [1e-7, 1e-2],
    yRange: [1e-14, 1e-10],
  });
}

/** One fresh page: restore, settle, one wheel step, then a burst; long tasks and times to the full thinning. */
async function run(browser, baseUrl, useWorker) {
  const context = await browser.newContext({ viewport: { width: 1400, height: 950 } });
  const page = await context.newPage();
  await writeAutosave(page, baseUrl);
  await page.addInitScript((noWorker) => {
    // Without Worker the runs client thins at once (as before it existed); the preparation then runs here too,
    // before the measured zoom.
    if (noWorker) delete window.Worker;
    // The first autosave after a restore writes the curve again (1 MB chunks, native put tasks of tens of ms),
    // which would fall into the measured window: stored empty here, so only the figure's work is measured.
    const put = IDBObjectStore.prototype.put;
    IDBObjectStore.prototype.put = function (value, key) {
      const empty = { massEv: new Float64Array(0), gInvGeV: new Float64Array(0) };
      return put.call(this, value && value.massEv ? empty : value, key);
    };
    window.__tasks = [];
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) window.__tasks.push({ start: e.startTime, duration: e.duration });
    }).observe({ type: "longtask", buffered: true });
  }, !useWorker);
  await page.goto(baseUrl, { waitUntil: "load" });
  const svg = page.locator('[data-testid="plot"] svg');
  await page.locator('[data-testid="plot"] path[data-curve-id="bench-region"]').first().waitFor({ timeout: 120_000 });
  await page.locator('[data-testid="figure-preparing"]').waitFor({ state: "detached", timeout: 120_000 });
  // Quiet: no long task ended for a second (at most 30 s).
  await page.waitForFunction(
    () => {
      const last = window.__tasks[window.__tasks.length - 1];
      return (
        !document.querySelector("[data-thinning-pending]") &&
        (!last || performance.now() - (last.start + last.duration) > 1000)
      );
    },
    undefined,
    { timeout: 30_000, polling: 100 },
  );
  const box = await svg.boundingBox();
  await page.mouse.move(box.x + box.width * 0.42, box.y + box.height * 0.62);
  const settled = async (domainBefore) => {
    await page.waitForFunction(
      (before) => {
        const el = document.querySelector('[data-testid="plot"] svg');
        return el.getAttribute("data-mass-domain") !== before && !el.hasAttribute("data-thinning-pending");
      },
      domainBefore,
      { timeout: 60_000, polling: "raf" },
    );
    return page.evaluate(() => performance.now());
  };
  const longest = (from, to) =>
    page.evaluate(
      ([a, b]) =>
        Math.max(0, ...window.__tasks.filter((t) => t.start + t.duration >= a && t.start <= b).map((t) => t.duration)),
      [from, to],
    );
  const d0 = await svg.getAttribute("data-mass-domain");
  const t0 = await page.evaluate(() => performance.now());
  await page.mouse.wheel(0, -200);
  const t1 = await settled(d0);
  const first = { longestMs: await longest(t0, t1), finalMs: t1 - t0 };
  const d1 = await svg.getAttribute("data-mass-domain");
  const t2 = await page.evaluate(() => performance.now());
  for (let i = 0; i < BURST; i++) await page.mouse.wheel(0, -120);
  const t3 = await settled(d1);
  const burst = { longestMs: await longest(t2, t3), finalMs: t3 - t2 };
  await context.close();
  return { first, burst };
}

async function main() {
  mkdirSync(outDir, { recursive: true });
  const { build, preview } = await import("vite");
  const nodeEnv = process.env.NODE_ENV;
  process.env.NODE_ENV = "production";
  await build({ root: repoRoot, mode: "production", logLevel: "warn", build: { outDir, emptyOutDir: true } });
  if (nodeEnv === undefined) delete process.env.NODE_ENV;
  else process.env.NODE_ENV = nodeEnv;
  const server = await preview({
    root: repoRoot,
    build: { outDir },
    preview: { port: 0, host: "127.0.0.1", strictPort: false },
    logLevel: "warn",
  });
  const baseUrl = `http://127.0.0.1:${server.httpServer.address().port}/`;
  const { chromium } = await import("playwright-core");
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking"],
  });
  const runs = { worker: [], main: [] };
  try {
    for (let r = 0; r < ROUNDS; r++)
      for (const useWorker of [true, false])
        runs[useWorker ? "worker" : "main"].push(await run(browser, baseUrl, useWorker));
  } finally {
    await browser.close();
    await new Promise((ok) => server.httpServer.close(ok));
  }
  const med = (xs) => [...xs].sort((a, b) => a - b)[(xs.length - 1) >> 1];
  const f = (x) => x.toFixed(0).padStart(6);
  console.log(
    `wheel zoom over a ${POINTS.toLocaleString("en")}-point invented region (file order), app build; medians of ${ROUNDS} round(s):`,
  );
  console.log(
    "                             first step: longest task  to full thinning | burst of 8: longest task  to full",
  );
  for (const [name, rs] of Object.entries(runs)) {
    const label = name === "worker" ? "runs worker (the app)" : "main thread (no Worker)";
    console.log(
      `  ${label.padEnd(25)} ${f(med(rs.map((x) => x.first.longestMs)))} ms ${f(med(rs.map((x) => x.first.finalMs)))} ms          | ${f(med(rs.map((x) => x.burst.longestMs)))} ms ${f(med(rs.map((x) => x.burst.finalMs)))} ms`,
    );
    console.log(
      `    (all: first ${rs.map((x) => x.first.longestMs.toFixed(0)).join(", ")}; burst ${rs.map((x) => x.burst.longestMs.toFixed(0)).join(", ")})`,
    );
  }
  console.log("  (longest task: the longest main-thread task, W3C Long Tasks API, so 0 means none over 50 ms)");
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
