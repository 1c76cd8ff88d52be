// `node bench/overlap.mjs`: the overlap summary for the benchmark set (20 invented curves × 100,000 points, the
// shared make-curves.mjs) against the demo's three models, the computation the overlap worker runs; median of runs.
import { readFileSync } from "node:fs";
import { performance } from "node:perf_hooks";
import { tsImport } from "tsx/esm/api";
import { arg, benchSets, median } from "./import-data.mjs";

const csv = await tsImport("../src/formats/csv.ts", import.meta.url);
const { overlapSummary } = await tsImport("../src/analysis/overlap-summary/index.ts", import.meta.url);
const { overlapTable } = await tsImport("../src/analysis/overlap-table.ts", import.meta.url);
const { demoModels } = await tsImport("../src/project/demo.ts", import.meta.url);
const { emptyProject, newCurve } = await tsImport("../src/project/defaults.ts", import.meta.url);

const runs = Number(arg("runs", 7));
const set = benchSets().find((s) => s.name === "curves");
const roles = ["exclusion", "exclusion", "projection", "region"];
const curves = set.files.map((f, i) => {
  const parsed = csv.parseCurveText(readFileSync(f.path, "utf8"));
  const role = f.name.includes("region") ? "region" : f.name.includes("projection") ? "projection" : roles[i % 2];
  return newCurve({ id: `c${i}`, label: f.name, role, massEv: parsed.massEv, gInvGeV: parsed.gInvGeV });
});
const project = { ...emptyProject("bench"), models: demoModels(), curves };
const models = project.models.filter((m) => m.visible).length;

// The first call prepares each curve once (logs, sort; cached as in the worker); later runs reuse it.
let t0 = performance.now();
let rows = overlapSummary(project);
const first = performance.now() - t0;
const times = [];
for (let r = 0; r < runs; r++) {
  t0 = performance.now();
  rows = overlapSummary(project);
  times.push(performance.now() - t0);
}
const intervals = rows.reduce((s, r) => s + r.intervals.count, 0);
const overlapping = rows.filter((r) => r.verdict !== "none").length;
console.log(
  `${models} models × ${curves.length} curves: ${rows.length} summary rows (${overlapping} overlap), ${intervals} intervals`,
);
console.log(`summary, first call (with curve preparation): ${first.toFixed(0)} ms`);
console.log(`summary, median of ${runs}: ${median(times).toFixed(0)} ms`);
t0 = performance.now();
const old = overlapTable(project);
console.log(`for comparison, the per-interval table: ${old.length} rows in ${(performance.now() - t0).toFixed(0)} ms`);
