// `node bench/import-browser.mjs`: end-to-end CSV import throughput in headless Chromium — File → import
// worker (stream read, parse, transfer of the Float64Array buffers) — beside the same parse on the main
// thread and the parser alone, on the invented bench curves. A small page is served in-process by Vite.
// Prints medians and ratios (and long tasks seen on the main thread); never passes or fails on timings.
import { createReadStream, existsSync } from "node:fs";
import { basename } from "node:path";
import { chromium } from "playwright-core";
import { createServer } from "vite";
import { arg, benchSets, median, ROOT } from "./import-data.mjs";

const runs = Number(arg("runs", "5"));
const CHROMIUM = process.env.CHROMIUM_PATH || "/usr/bin/chromium";
const ARGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];

if (!existsSync(CHROMIUM)) {
  console.log(`no Chromium at ${CHROMIUM} (set CHROMIUM_PATH); skipping the browser import benchmark`);
  process.exit(0);
}
const sets = benchSets();

/** Serves the bench files under /__bench-data/<set>/<file> straight from bench/.out. */
const benchData = {
  name: "axband-bench-data",
  configureServer(server) {
    server.middlewares.use("/__bench-data/", (req, res, next) => {
      const [setName, fileName] = decodeURIComponent((req.url ?? "").replace(/^\//, "").split("?")[0]).split("/");
      const set = sets.find((s) => s.name === setName);
      const file = set?.files.find((f) => f.name === basename(fileName ?? ""));
      if (!file) return next();
      res.setHeader("Content-Type", "text/csv");
      res.setHeader("Content-Length", String(file.bytes));
      createReadStream(file.path).pipe(res);
    });
  },
};

const server = await createServer({
  configFile: false,
  root: ROOT,
  logLevel: "warn",
  appType: "mpa",
  plugins: [benchData],
  // The page imports only project sources (no npm packages): nothing to pre-bundle, no reload mid-run.
  optimizeDeps: { noDiscovery: true, include: [] },
  server: { host: "127.0.0.1", port: 0, strictPort: false, hmr: false, watch: null },
  worker: { format: "es" },
});
let browser;
try {
  await server.listen();
  const address = server.httpServer?.address();
  const port = typeof address === "object" && address ? address.port : 0;
  const base = `http://127.0.0.1:${port}`;
  browser = await chromium.launch({ executablePath: CHROMIUM, headless: true, args: ARGS });
  const page = await browser.newPage();
  page.on("pageerror", (e) => console.log(`page error: ${e.message}`));
  await page.goto(`${base}/bench/import-page.html`);
  await page.waitForFunction(() => typeof window.axbandImportBench === "function", null, { timeout: 60_000 });
  console.log(`${await browser.version()}, ${runs} runs (plus one warm-up), median throughput`);
  for (const set of sets) {
    const files = set.files.map((f) => ({ name: f.name, url: `${base}/__bench-data/${set.name}/${f.name}` }));
    const r = await page.evaluate(([fs, n]) => window.axbandImportBench(fs, n), [files, runs], { timeout: 0 });
    const mb = r.bytes / 1e6;
    const rate = (times) => mb / median(times);
    const worker = rate(r.workerEndToEnd);
    const fromFile = rate(r.mainThreadFromFile);
    const alone = rate(r.mainThreadParserAlone);
    console.log(
      `\n${set.name}: ${set.files.length} file(s), ${mb.toFixed(1)} MB, ${r.rows.toLocaleString("en")} rows${r.worker ? "" : " (NO worker: fallback measured)"}`,
    );
    console.log(
      `  worker end to end (File → worker → transferred arrays)  ${worker.toFixed(1).padStart(7)} MB/s  ×${(worker / alone).toFixed(2)} of parser alone`,
    );
    console.log(
      `  main thread from File (sliced, no worker)                ${fromFile.toFixed(1).padStart(7)} MB/s  ×${(fromFile / alone).toFixed(2)} of parser alone`,
    );
    console.log(`  parser alone on the main thread (text already decoded)   ${alone.toFixed(1).padStart(7)} MB/s`);
    console.log(
      `  main-thread long tasks during the worker runs: ${r.longTasks.count} (longest ${r.longTasks.maxMs.toFixed(0)} ms); progress messages: ${r.progressMessages}`,
    );
  }
} finally {
  await browser?.close();
  await server.close();
}
