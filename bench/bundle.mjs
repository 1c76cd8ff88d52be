// Bundle benchmark (`node bench/bundle.mjs`): builds the app and prints the gzip size of every chunk, the initial
// JavaScript (the entry chunk and what it imports statically: what the first figure waits for) against the
// 150 kB target, and the time to the first drawn figure beside a blank Vite + React page, in the same run
// (headless Chromium, a fresh profile per load, Vite preview in-process). Prints medians; never pass/fail.
// Options (environment): AXBAND_BENCH_LOADS (page loads per page, default 7), CHROMIUM_PATH (default /usr/bin/chromium).
import { existsSync, mkdirSync, rmSync, writeFileSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { gzipSync } from "node:zlib";
import { build, preview } from "vite";
import react from "@vitejs/plugin-react";
import { chromium } from "playwright-core";

const repoRoot = resolve(dirname(fileURLToPath(import.meta.url)), "..");
const outDir = join(repoRoot, "bench", ".out");
const appDist = join(outDir, "bundle-app");
const blankRoot = join(outDir, "blank-react");
const blankDist = join(blankRoot, "dist");
const LOADS = Number(process.env.AXBAND_BENCH_LOADS ?? 7);
const TARGET_KB = 150;
const CHROMIUM = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";

const kB = (bytes) => (bytes / 1000).toFixed(1);
const gzipBytes = (code) => gzipSync(code, { level: 9 }).length;
const median = (xs) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

/** Production build; returns the Rollup-style output list. NODE_ENV must be production for React's build. */
async function buildProduction(config) {
  const nodeEnv = process.env.NODE_ENV;
  process.env.NODE_ENV = "production";
  try {
    const r = await build({ mode: "production", logLevel: "warn", ...config });
    return (Array.isArray(r) ? r : [r]).flatMap((o) => o.output);
  } finally {
    if (nodeEnv === undefined) delete process.env.NODE_ENV;
    else process.env.NODE_ENV = nodeEnv;
  }
}

/** Prints every chunk's size and returns the gzip total of the entry chunk and its static imports. */
function reportChunks(output) {
  const chunks = output.filter((o) => o.type === "chunk");
  const byName = new Map(chunks.map((c) => [c.fileName, c]));
  const initial = new Set();
  const visit = (c) => {
    if (initial.has(c.fileName)) return;
    initial.add(c.fileName);
    for (const f of c.imports) if (byName.has(f)) visit(byName.get(f));
  };
  for (const c of chunks) if (c.isEntry) visit(c);
  const rows = chunks
    .map((c) => ({ name: c.fileName, raw: c.code.length, gz: gzipBytes(c.code), initial: initial.has(c.fileName) }))
    .sort((a, b) => b.gz - a.gz);
  console.log("chunk                                            raw kB   gzip kB   loaded");
  for (const r of rows)
    console.log(
      `${r.name.padEnd(48)} ${kB(r.raw).padStart(7)} ${kB(r.gz).padStart(9)}   ${r.initial ? "at start" : "on demand"}`,
    );
  const css = output.filter((o) => o.type === "asset" && o.fileName.endsWith(".css"));
  for (const a of css)
    console.log(
      `${a.fileName.padEnd(48)} ${kB(a.source.length).padStart(7)} ${kB(gzipBytes(a.source)).padStart(9)}   (CSS)`,
    );
  return rows.filter((r) => r.initial).reduce((n, r) => n + r.gz, 0);
}

/** A blank Vite + React page: one paragraph rendered by React, built with the same Vite and React. */
async function buildBlank() {
  rmSync(blankRoot, { recursive: true, force: true });
  mkdirSync(blankRoot, { recursive: true });
  writeFileSync(
    join(blankRoot, "index.html"),
    '<!doctype html><html><head><meta charset="utf-8"><title>blank</title></head>' +
      '<body><div id="root"></div><script type="module" src="./main.jsx"></script></body></html>\n',
  );
  writeFileSync(
    join(blankRoot, "main.jsx"),
    'import { createRoot } from "react-dom/client";\n' +
      'createRoot(document.getElementById("root")).render(<p id="blank">blank page</p>);\n',
  );
  return buildProduction({
    root: blankRoot,
    configFile: false,
    base: "./",
    plugins: [react()],
    build: { outDir: blankDist, emptyOutDir: true },
  });
}

async function serve(config) {
  const server = await preview({
    logLevel: "warn",
    ...config,
    preview: { port: 0, host: "127.0.0.1", strictPort: false },
  });
  const address = server.httpServer.address();
  return { server, url: `http://127.0.0.1:${address.port}/` };
}

/**
 * ms from navigation start to the first animation frame after `selector` is in the DOM (the frame that paints
 * it), in a fresh browser context (empty cache and storage: the app shows its demo project).
 */
async function timeToDrawn(browser, url, selector) {
  const context = await browser.newContext();
  const page = await context.newPage();
  await page.addInitScript((sel) => {
    const done = () => requestAnimationFrame(() => (window.__drawnAt = performance.now()));
    const check = () => {
      if (!document.querySelector(sel)) return false;
      done();
      return true;
    };
    new MutationObserver((_, obs) => check() && obs.disconnect()).observe(document, { childList: true, subtree: true });
  }, selector);
  await page.goto(url, { waitUntil: "commit" });
  await page.waitForFunction(() => typeof window.__drawnAt === "number", null, { timeout: 60_000 });
  const ms = await page.evaluate(() => window.__drawnAt);
  await context.close();
  return ms;
}

async function main() {
  if (!existsSync(CHROMIUM)) console.log(`(no Chromium at ${CHROMIUM}: sizes only)`);
  console.log("building the app…");
  const appOutput = await buildProduction({ root: repoRoot, build: { outDir: appDist, emptyOutDir: true } });
  const initialGz = reportChunks(appOutput);
  console.log(
    `\ninitial JavaScript: ${kB(initialGz)} kB gzip = ${(initialGz / 1000 / TARGET_KB).toFixed(2)} × the ${TARGET_KB} kB target`,
  );
  const blankOutput = await buildBlank();
  const blankGz = blankOutput.filter((o) => o.type === "chunk").reduce((n, c) => n + gzipBytes(c.code), 0);
  console.log(`blank Vite + React page: ${kB(blankGz)} kB gzip`);
  if (!existsSync(CHROMIUM)) return;

  const app = await serve({ root: repoRoot, build: { outDir: appDist } });
  const blank = await serve({ root: blankRoot, configFile: false, build: { outDir: blankDist } });
  const browser = await chromium.launch({
    executablePath: CHROMIUM,
    headless: true,
    args: ["--no-sandbox", "--disable-gpu"],
  });
  try {
    // Alternating loads, so that a busy moment of the machine falls on both pages alike.
    const appMs = [];
    const blankMs = [];
    await timeToDrawn(browser, blank.url, "#blank"); // warm-up: browser start, not the page
    for (let k = 0; k < LOADS; k++) {
      blankMs.push(await timeToDrawn(browser, blank.url, "#blank"));
      appMs.push(await timeToDrawn(browser, app.url, '[data-testid="plot"] svg [data-testid="legend"]'));
    }
    const a = median(appMs);
    const b = median(blankMs);
    console.log(`\ntime to the first drawn figure (median of ${LOADS} fresh loads): ${a.toFixed(0)} ms`);
    console.log(`time to the blank Vite + React page (same run):              ${b.toFixed(0)} ms`);
    console.log(`ratio: ${(a / b).toFixed(2)} × the blank page (+${(a - b).toFixed(0)} ms)`);
  } finally {
    await browser.close();
    await new Promise((r) => app.server.httpServer.close(r));
    await new Promise((r) => blank.server.httpServer.close(r));
  }
}

await main();
