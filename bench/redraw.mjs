// Redraw benchmark (`node bench/redraw.mjs`): median time of a zoom step in headless Chromium — buildScene
// with a new mass range plus the update of the app's figure component (SceneSvg: React commit and scene-dom's
// in-place DOM update) and a forced layout — on 20 invented curves × 100,000 points, against a
// plain full-resolution draw of the same data in the same run. Prints medians and ratios; never pass/fail.
// Options (environment): AXBAND_BENCH_STEPS (zoom steps, default 40), AXBAND_BENCH_PLAIN_STEPS (full draws,
// default 6), AXBAND_BENCH_DETAIL=1 (every step), AXBAND_BENCH_DOM_ONLY=1 (DOM cost of prebuilt scenes only),
// AXBAND_BENCH_FPS_ONLY=1 (only the frames per second of a continuous zoom), AXBAND_BENCH_NO_FPS=1 (skip it),
// AXBAND_BENCH_FPS_STEPS (default 80), AXBAND_BENCH_FPS_ROUNDS (default 3),
// AXBAND_BENCH_FPS_KINDS=scan,region (diagnostics: only these kinds of the benchmark curves), AXBAND_BENCH_MINIFY=0 (readable bundle for profiling), AXBAND_BENCH_NO_TRACE=1 (skip the painting trace),
// AXBAND_BENCH_LEGEND=auto (the legend place; default outside-right: the automatic place costs more, see NOTES.md),
// CHROMIUM_PATH (default /usr/bin/chromium).
import { spawnSync } from "node:child_process";
import { createServer } from "node:http";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { dirname, extname, join, resolve, normalize } from "node:path";
import { fileURLToPath } from "node:url";

const repoRoot = resolve(dirname(fileURLToPath(import.meta.url)), "..");
const outDir = join(repoRoot, "bench", ".out");
const curvesDir = join(outDir, "curves");
const pageDist = join(outDir, "redraw-page");
const CURVES = 20;
const POINTS = 100000;
const STEPS = Number(process.env.AXBAND_BENCH_STEPS ?? 40);
const PLAIN_STEPS = Number(process.env.AXBAND_BENCH_PLAIN_STEPS ?? 6);
const LEGEND = process.env.AXBAND_BENCH_LEGEND ?? "outside-right";
const FPS_STEPS = Number(process.env.AXBAND_BENCH_FPS_STEPS ?? 80);
const FPS_ROUNDS = Number(process.env.AXBAND_BENCH_FPS_ROUNDS ?? 3);

function log(...a) {
  console.log(...a);
}

/** The invented inputs, made once by the shared generator (../shared relative to the repo root). */
function ensureCurves() {
  const manifestPath = join(curvesDir, "manifest.json");
  if (existsSync(manifestPath)) {
    const m = JSON.parse(readFileSync(manifestPath, "utf8"));
    if (m.curves?.length === CURVES && m.curves.every((c) => c.points === POINTS)) return m;
  }
  const generator = resolve(repoRoot, "../shared/bench/make-curves.mjs");
  if (!existsSync(generator)) throw new Error(`benchmark input generator not found at ${generator}`);
  const r = spawnSync(
    process.execPath,
    [generator, "--curves", String(CURVES), "--points", String(POINTS), "--out", curvesDir],
    { stdio: "inherit" },
  );
  if (r.status !== 0) throw new Error(`make-curves.mjs exited with ${r.status}`);
  return JSON.parse(readFileSync(manifestPath, "utf8"));
}

/** CSV → one Float64Array per column (mass, g); the page receives them as one binary blob. */
function packCurves(manifest) {
  const arrays = [];
  for (const c of manifest.curves) {
    const text = readFileSync(join(curvesDir, c.file), "utf8");
    const m = new Float64Array(c.points);
    const g = new Float64Array(c.points);
    let n = 0;
    for (const line of text.split("\n")) {
      if (!line || line[0] === "#" || line[0] === "m") continue;
      const comma = line.indexOf(",");
      m[n] = Number(line.slice(0, comma));
      g[n] = Number(line.slice(comma + 1));
      n++;
    }
    if (n !== c.points) throw new Error(`${c.file}: read ${n} rows, expected ${c.points}`);
    arrays.push(m, g);
  }
  const total = arrays.reduce((s, a) => s + a.length, 0);
  const all = new Float64Array(total);
  let off = 0;
  for (const a of arrays) {
    all.set(a, off);
    off += a.length;
  }
  return Buffer.from(all.buffer);
}

async function buildPage() {
  const { build } = await import("vite");
  await build({
    root: join(repoRoot, "bench", "redraw-page"),
    configFile: false,
    logLevel: "warn",
    base: "./",
    build: {
      outDir: pageDist,
      emptyOutDir: true,
      sourcemap: false,
      minify: process.env.AXBAND_BENCH_MINIFY !== "0",
      target: "es2022",
    },
  });
}

const TYPES = {
  ".html": "text/html",
  ".js": "text/javascript",
  ".json": "application/json",
  ".bin": "application/octet-stream",
  ".css": "text/css",
};

function serve(files) {
  const server = createServer((req, res) => {
    const url = new URL(req.url ?? "/", "http://127.0.0.1");
    const rel = url.pathname === "/" ? "/index.html" : url.pathname;
    if (files[rel]) {
      res.writeHead(200, { "content-type": TYPES[extname(rel)] ?? "application/octet-stream" });
      res.end(files[rel]);
      return;
    }
    const path = normalize(join(pageDist, rel));
    if (!path.startsWith(pageDist) || !existsSync(path)) {
      res.writeHead(404);
      res.end();
      return;
    }
    res.writeHead(200, { "content-type": TYPES[extname(path)] ?? "application/octet-stream" });
    res.end(readFileSync(path));
  });
  return new Promise((ok) => server.listen(0, "127.0.0.1", () => ok(server)));
}

/**
 * Frames per second of a continuous zoom (one step per animation frame, as a trackpad gives), with the dense
 * columns drawn as a min–max envelope (what the figure does) and as the plain zig-zag, each in a fresh tab,
 * traced for the painting (raster) time per frame. The page steps once per animation frame and the browser
 * holds the next frame back until the last one is painted, so steps per second are frames per second.
 */
async function continuousZoom(browser, port) {
  const runs = { zigzag: [], envelope: [] };
  // Alternated rounds, so that a busy spell of the shared machine does not fall on one variant only.
  for (let round = 0; round < FPS_ROUNDS; round++)
    for (const envelope of [false, true]) {
      const tab = await browser.newPage({ viewport: { width: 1280, height: 800 } });
      await tab.goto(`http://127.0.0.1:${port}/`);
      await tab.waitForSelector("body[data-ready='1']", { timeout: 60000 });
      await browser.startTracing(tab, {
        categories: ["devtools.timeline", "disabled-by-default-devtools.timeline", "blink.user_timing", "benchmark"],
      });
      const r = await tab.evaluate((o) => window.continuous(o), {
        steps: FPS_STEPS,
        legend: LEGEND,
        envelope,
        kinds: process.env.AXBAND_BENCH_FPS_KINDS?.split(","),
      });
      const events = JSON.parse((await browser.stopTracing()).toString()).traceEvents;
      await tab.close();
      const mark = (name) => events.find((e) => e.name === name)?.ts;
      const from = mark("axband-continuous-start") ?? 0;
      const to = mark("axband-continuous-end") ?? Infinity;
      const within = (e) => e.ts >= from && e.ts <= to;
      const raster = events.filter((e) => e.ph === "X" && e.name === "RasterTask" && within(e));
      const rasterMs = raster.reduce((sum, e) => sum + (e.dur ?? 0), 0) / 1000;
      // The raster threads' own CPU time (tdur): what painting costs, whoever else shares the cores.
      const rasterCpuMs = raster.reduce((sum, e) => sum + (e.tdur ?? e.dur ?? 0), 0) / 1000;
      runs[envelope ? "envelope" : "zigzag"].push({ ...r, rasterMs, rasterCpuMs });
    }
  const med = (xs) => [...xs].sort((a, b) => a - b)[(xs.length - 1) >> 1];
  const out = {};
  for (const [name, rs] of Object.entries(runs))
    out[name] = {
      fps: med(rs.map((r) => r.fps)),
      all: rs.map((r) => r.fps.toFixed(1)).join(", "),
      buildMs: med(rs.map((r) => r.buildMs)),
      renderMs: med(rs.map((r) => r.renderMs)),
      paintMs: med(rs.map((r) => r.rasterMs / r.steps)),
      paintCpuMs: med(rs.map((r) => r.rasterCpuMs / r.steps)),
    };
  log(
    `continuous zoom, ${FPS_STEPS} steps, one per animation frame; median of ${FPS_ROUNDS} alternated round(s) (median build / React+DOM ms per step):`,
  );
  for (const [name, r] of Object.entries(out)) {
    log(
      `  ${name.padEnd(9)} ${r.fps.toFixed(1).padStart(5)} frames/s (${r.all}); build ${r.buildMs.toFixed(1)} ms, DOM ${r.renderMs.toFixed(1)} ms; painting ${r.paintMs.toFixed(1)} ms per step (${r.paintCpuMs.toFixed(1)} ms CPU)`,
    );
  }
  log(`  target ≥ 45 frames per second; envelope/zig-zag: ${(out.envelope.fps / out.zigzag.fps).toFixed(2)}×`);
}

async function main() {
  mkdirSync(outDir, { recursive: true });
  const manifest = ensureCurves();
  const bin = packCurves(manifest);
  writeFileSync(join(outDir, "redraw-curves.json"), JSON.stringify(manifest));
  await buildPage();
  const server = await serve({ "/curves.bin": bin, "/curves.json": JSON.stringify(manifest) });
  const port = server.address().port;
  const { chromium } = await import("playwright-core");
  const executablePath = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";
  const browser = await chromium.launch({
    executablePath,
    headless: true,
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
  try {
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    const errors = [];
    page.on("pageerror", (e) => errors.push(String(e)));
    await page.goto(`http://127.0.0.1:${port}/`);
    await page.waitForSelector("body[data-ready='1']", { timeout: 60000 });
    if (process.env.AXBAND_BENCH_DOM_ONLY) {
      for (const strip of [undefined, "text", "legend-text", "axes-text", "curves", "clip"]) {
        const d = await page.evaluate((o) => window.domOnly(o), { steps: STEPS, strip });
        log(
          `DOM only (the app's scene renderer)${strip ? ` without ${strip}` : ""}: set ${d.setMs.toFixed(2)} ms, set + geometry ${d.domMs.toFixed(2)} ms`,
        );
      }
      return;
    }
    if (!process.env.AXBAND_BENCH_NO_FPS) await continuousZoom(browser, port);
    if (process.env.AXBAND_BENCH_FPS_ONLY) return;
    const r = await page.evaluate((o) => window.runBench(o), { steps: STEPS, plainSteps: PLAIN_STEPS, legend: LEGEND });
    if (errors.length) log("page errors:", errors.join("\n"));
    if (process.env.AXBAND_BENCH_DETAIL) {
      const steps = await page.evaluate(() => window.benchSteps);
      for (const st of steps)
        log(
          `  span ${st.span.toFixed(3)} dec  build ${st.build.toFixed(1)}  set ${st.set.toFixed(1)}  dom ${st.dom.toFixed(1)}  chars ${st.chars}`,
        );
    }
    const f = (x) => x.toFixed(2).padStart(9);
    log(
      `inputs: ${r.curves} invented curves, ${r.points.toLocaleString("en")} points; slide preset 960×540, devicePixelRatio ${r.devicePixelRatio}, legend ${LEGEND}`,
    );
    log(`first draw (builds the per-curve caches): ${r.firstDrawMs.toFixed(1)} ms`);
    log(`zoom step, median over ${r.steps} steps (in ×0.8 per step, then out), drawn by the app's SceneSvg:`);
    log(`                      build ms    DOM ms  total ms   path chars`);
    log(
      `  thinned (axband)   ${f(r.thinned.buildMs)} ${f(r.thinned.domMs)} ${f(r.thinned.totalMs)}  ${String(Math.round(r.thinned.pathChars)).padStart(11)}`,
    );
    log(
      `  plain full draw    ${f(r.plain.buildMs)} ${f(r.plain.domMs)} ${f(r.plain.totalMs)}  ${String(Math.round(r.plain.pathChars)).padStart(11)}   (${r.plain.steps} steps)`,
    );
    log(
      `ratio thinned/plain: total ${(r.thinned.totalMs / r.plain.totalMs).toFixed(4)}, path size ${(r.thinned.pathChars / r.plain.pathChars).toFixed(4)}`,
    );
    log(
      `  (of the thinned DOM time, ${r.thinned.setMs.toFixed(2)} ms is setting attributes and text, the rest the forced geometry)`,
    );
    // The same zoom steps with time between them (a wheel turned notch by notch), so that the browser has
    // painted each frame before the next step starts: the main thread then does not share the two cores
    // with the painting of the frame before (see the painting line below).
    // A fresh tab, so that no painting of the full-resolution draws above is still going on.
    const calm = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    await calm.goto(`http://127.0.0.1:${port}/`);
    await calm.waitForSelector("body[data-ready='1']", { timeout: 60000 });
    const settled = await calm.evaluate((o) => window.runBench(o), {
      steps: STEPS,
      plainSteps: 0,
      settleMs: 100,
      legend: LEGEND,
    });
    await calm.close();
    log(
      `  isolated steps     ${f(settled.thinned.buildMs)} ${f(settled.thinned.domMs)} ${f(settled.thinned.totalMs)}   (each frame painted before the next step, 100 ms apart)`,
    );
    log(
      `target: median zoom step ≤ 8 ms; measured ${r.thinned.totalMs.toFixed(2)} ms back to back (one step per frame), ${settled.thinned.totalMs.toFixed(2)} ms for isolated steps`,
    );
    log(`  (DOM time includes a forced getBBox of the curves layer, i.e. the browser's layout of the new paths)`);
    if (!process.env.AXBAND_BENCH_NO_TRACE) {
      // The browser paints each frame on its raster threads, outside the times above but on the same two cores:
      // trace the zoom sequence once more, each frame given time to be painted, and sum the raster work.
      // A fresh tab, so that no painting of the full-resolution draws above is still going on.
      await page.close();
      const tab = await browser.newPage({ viewport: { width: 1280, height: 800 } });
      await tab.goto(`http://127.0.0.1:${port}/`);
      await tab.waitForSelector("body[data-ready='1']", { timeout: 60000 });
      await browser.startTracing(tab, {
        categories: ["devtools.timeline", "disabled-by-default-devtools.timeline", "blink.user_timing"],
      });
      const t = await tab.evaluate((o) => window.runBench(o), {
        steps: STEPS,
        plainSteps: 0,
        settleMs: 100,
        legend: LEGEND,
      });
      const events = JSON.parse((await browser.stopTracing()).toString()).traceEvents;
      // Only the painting of the zoom steps: between the page's marks (first draws and earlier frames left out).
      const mark = (name) => events.find((e) => e.name === name)?.ts;
      const from = mark("axband-zoom-start") ?? 0;
      const to = mark("axband-zoom-end") ?? Infinity;
      const raster = events.filter((e) => e.ph === "X" && e.name === "RasterTask" && e.ts >= from && e.ts <= to);
      const rasterMs = raster.reduce((sum, e) => sum + (e.dur ?? 0), 0) / 1000;
      log(
        `painting (the browser's raster threads, software, no GPU): ${(rasterMs / t.steps).toFixed(1)} ms per zoom step on average;`,
      );
      log(
        `  (the painting of a frame runs on the same two cores: back to back, it overlaps the next step's work; traced run ${t.thinned.totalMs.toFixed(2)} ms a step)`,
      );
    }
  } finally {
    await browser.close();
    await new Promise((ok) => server.close(ok));
  }
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
