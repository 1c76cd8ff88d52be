// `node bench/ensemble.mjs`: time of the default heavy-quark ensembles (R1–R15, N_Q ≤ 28, Landau-pole criterion on)
// with additive and with signed charges, median of a few runs in Node and in headless Chromium (the physics core
// bundled by esbuild and run in a page), next to the targets (5 s and 30 s in the browser). Prints medians; never
// passes or fails on timings.
import { performance } from "node:perf_hooks";
import { tsImport } from "tsx/esm/api";
import { build } from "esbuild";
import { arg, median } from "./import-data.mjs";
import { chromium } from "playwright-core";

const runs = Number(arg("runs", "3"));
const { heavyQuarkEnsemble } = await tsImport("../src/physics/index.ts", import.meta.url);

const CASES = [
  ["additive", 5],
  ["signed", 30],
];

function report(where, charges, targetS, res, times) {
  const m = median(times) / 1000;
  console.log(
    `${where.padEnd(8)} ${charges.padEnd(8)} ${res.models} models, ${res.distinct.length} distinct E/N, ` +
      `N=0 dropped ${res.zeroN}: median ${m.toFixed(2)} s over ${times.length} runs ` +
      `(target ${targetS} s, ratio ${(m / targetS).toFixed(2)})`,
  );
}

for (const [charges, targetS] of CASES) {
  const times = [];
  let res;
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    res = heavyQuarkEnsemble({ maxQuarks: 28, charges });
    times.push(performance.now() - t0);
  }
  report("node", charges, targetS, res, times);
}

const bundle = await build({
  entryPoints: [new URL("../src/physics/ensemble/index.ts", import.meta.url).pathname],
  bundle: true,
  format: "iife",
  globalName: "axbandEnsemble",
  write: false,
});
// CHROMIUM_PATH (default /usr/bin/chromium), as the other browser benchmarks.
const browser = await chromium.launch({
  executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
  headless: true,
  args: ["--no-sandbox", "--disable-gpu"],
});
try {
  const page = await browser.newPage();
  await page.addScriptTag({ content: bundle.outputFiles[0].text });
  for (const [charges, targetS] of CASES) {
    const times = [];
    let res;
    for (let i = 0; i < runs; i++) {
      const out = await page.evaluate((c) => {
        const t0 = performance.now();
        const r = globalThis.axbandEnsemble.heavyQuarkEnsemble({ maxQuarks: 28, charges: c });
        return { ms: performance.now() - t0, models: r.models, distinct: r.distinct, zeroN: r.zeroN };
      }, charges);
      times.push(out.ms);
      res = out;
    }
    report("chromium", charges, targetS, res, times);
  }
} finally {
  await browser.close();
}
