// `node bench/overlap.mjs`: the overlap summary for the benchmark set (20 invented curves × 100,000 points, the
// shared make-curves.mjs) against the demo's three models, the computation the overlap worker runs. The first call
// (code not yet optimised) is what a user waits for after an import, so it is timed in fresh processes (`--first N`,
// default 5): from raw arrays (the command line), and with the curves already prepared (sorted, log10) as the app's
// overlap worker receives them from the import worker. Later calls on the same arrays (`--runs N`, default 7) reuse
// the caches.
import { spawnSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { performance } from "node:perf_hooks";
import { register } from "tsx/esm/api";
import { arg, benchSets, median } from "./import-data.mjs";

// One module graph for all the imports below, so the summary sees the curve preparations made here.
register();
const csv = await import("../src/formats/csv/index.ts");
const { overlapSummary } = await import("../src/analysis/overlap-summary/index.ts");
const { prepareCurve } = await import("../src/analysis/prepared-curve.ts");
const { demoModels } = await import("../src/project/demo.ts");
const { emptyProject, newCurve } = await import("../src/project/defaults.ts");

const child = process.argv.includes("--child");
const runs = child ? 0 : Number(arg("runs", 7));
const firsts = Number(arg("first", 5));
const set = benchSets().find((s) => s.name === "curves");
const roles = ["exclusion", "exclusion", "projection", "region"];
const curves = set.files.map((f, i) => {
  const parsed = csv.parseCurveText(readFileSync(f.path, "utf8"));
  const role = f.name.includes("region") ? "region" : f.name.includes("projection") ? "projection" : roles[i % 2];
  return newCurve({ id: `c${i}`, label: f.name, role, massEv: parsed.massEv, gInvGeV: parsed.gInvGeV });
});
const project = { ...emptyProject("bench"), models: demoModels(), curves };
const models = project.models.filter((m) => m.visible).length;

/** Wall time and CPU time (all of the process's threads: a busy shared machine inflates the first, not the second). */
function timed(f) {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const value = f();
  const c = process.cpuUsage(c0);
  return { value, wall: performance.now() - t0, cpu: (c.user + c.system) / 1000 };
}

if (child) {
  if (process.argv.includes("--prepared"))
    for (const c of curves) prepareCurve(c.massEv, c.gInvGeV, c.role !== "region");
  const { wall, cpu } = timed(() => overlapSummary(project));
  console.log(JSON.stringify({ wall, cpu }));
  process.exit(0);
}

/** Median wall and CPU time of the first call in `firsts` fresh processes. */
function firstCalls(extra) {
  const wall = [];
  const cpu = [];
  for (let k = 0; k < firsts; k++) {
    const args = [fileURLToPath(import.meta.url), "--child", ...extra];
    const r = spawnSync(process.execPath, args, { encoding: "utf8" });
    if (r.status !== 0) throw new Error(`child run failed: ${r.stderr}`);
    const t = JSON.parse(r.stdout.trim().split("\n").pop());
    wall.push(t.wall);
    cpu.push(t.cpu);
  }
  return `${median(wall).toFixed(0)} ms wall, ${median(cpu).toFixed(0)} ms CPU  [wall ${fmt(wall)}]`;
}
const fmt = (xs) => xs.map((x) => x.toFixed(0)).join(", ");
const fromRaw = firstCalls([]);
const fromPrepared = firstCalls(["--prepared"]);
let rows = overlapSummary(project);
const laterWall = [];
const laterCpu = [];
for (let r = 0; r < runs; r++) {
  const t = timed(() => overlapSummary(project));
  rows = t.value;
  laterWall.push(t.wall);
  laterCpu.push(t.cpu);
}
const intervals = rows.reduce((s, r) => s + r.intervals.count, 0);
const overlapping = rows.filter((r) => r.verdict !== "none").length;
const busiest = rows.reduce((a, r) => (r.intervals.count > a.intervals.count ? r : a), rows[0]);
console.log(
  `${models} models × ${curves.length} curves: ${rows.length} summary rows (${overlapping} overlap), ${intervals} intervals` +
    ` (busiest row: ${busiest.intervals.count}, ${busiest.modelLabel} × ${busiest.curveLabel})`,
);
console.log(`summary, first call in a fresh process, median of ${firsts}:`);
console.log(`  curves prepared beforehand (the app's overlap worker): ${fromPrepared}`);
console.log(`  from raw arrays (the command line):                    ${fromRaw}`);
console.log(
  `summary, later calls (prepared curves cached), median of ${runs}: ` +
    `${median(laterWall).toFixed(0)} ms wall, ${median(laterCpu).toFixed(0)} ms CPU`,
);
