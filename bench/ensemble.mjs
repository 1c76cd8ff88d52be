// `node bench/ensemble.mjs`: time of the default heavy-quark ensembles (R1–R15, N_Q ≤ 28, Landau-pole criterion on)
// with additive and with signed charges, median of a few runs, next to the targets (5 s and 30 s in the browser;
// Chromium runs the same V8 engine as Node). Prints medians; never passes or fails on timings.
import { performance } from "node:perf_hooks";
import { tsImport } from "tsx/esm/api";
import { arg, median } from "./import-data.mjs";

const runs = Number(arg("runs", "3"));
const { heavyQuarkEnsemble } = await tsImport("../src/physics/index.ts", import.meta.url);

for (const [charges, targetS] of [
  ["additive", 5],
  ["signed", 30],
]) {
  const times = [];
  let res;
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    res = heavyQuarkEnsemble({ maxQuarks: 28, charges });
    times.push(performance.now() - t0);
  }
  const m = median(times) / 1000;
  console.log(
    `${charges.padEnd(8)} ${res.models} models, ${res.distinct.length} distinct E/N, N=0 dropped ${res.zeroN}: ` +
      `median ${m.toFixed(2)} s over ${runs} runs (target ${targetS} s, ratio ${(m / targetS).toFixed(2)})`,
  );
}
