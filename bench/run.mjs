// `npm run bench`: runs every benchmark script in turn and prints their medians and ratios.
// Benchmarks never pass or fail on timings; a script that crashes is reported and the rest still run.
import { spawnSync } from "node:child_process";
import { existsSync } from "node:fs";

const scripts = [
  ["Initial JavaScript and time to the first figure (Chromium)", "bench/bundle.mjs"],
  ["CSV import (parser alone vs a general CSV library)", "bench/import.mjs"],
  ["CSV import end to end (worker + transfer, Chromium)", "bench/import-browser.mjs"],
  ["Figure redraw during a zoom step (Chromium)", "bench/redraw.mjs"],
  [
    "Wheel zoom over a big file-order region: new levels thinned in the runs worker (Chromium)",
    "bench/region-zoom.mjs",
  ],
  ["Command line as users run it (bin, npx) vs node -e 0 and gnuplot", "bench/cli.mjs"],
  ["Command-line renderer vs reference plotting script", "bench/render.mjs"],
  ["Overlap summary, benchmark set × demo models", "bench/overlap.mjs"],
  ["Heavy-quark ensembles, N_Q ≤ 28 with the Landau-pole criterion", "bench/ensemble.mjs"],
];
const only = process.argv.slice(2);
let crashed = 0;
for (const [title, file] of scripts) {
  if (only.length && !only.some((o) => file.includes(o))) continue;
  if (!existsSync(file)) {
    console.log(`\n## ${title}\n(missing: ${file})`);
    continue;
  }
  console.log(`\n## ${title}  [${file}]`);
  const r = spawnSync(process.execPath, [file], { stdio: "inherit" });
  if (r.status !== 0) {
    crashed++;
    console.log(`(${file} exited with ${r.status ?? r.signal})`);
  }
}
// The test suite's wall time: minutes of both cores, so only when asked (AXBAND_BENCH_TESTS=1).
if (!only.length || only.some((o) => "tests".includes(o))) {
  console.log("\n## Test suite wall time  [npm test]");
  if (process.env.AXBAND_BENCH_TESTS === "1") {
    const t0 = performance.now();
    const r = spawnSync("npm", ["test"], { stdio: ["ignore", "ignore", "inherit"] });
    const s = (performance.now() - t0) / 1000;
    console.log(`npm test: ${s.toFixed(0)} s (exit ${r.status ?? r.signal}); target ≤ 90 s`);
  } else console.log("skipped: set AXBAND_BENCH_TESTS=1 to time npm test (target ≤ 90 s)");
}
if (crashed) console.log(`\n${crashed} benchmark script(s) crashed`);
