// Command-line benchmark: the twenty invented benchmark files to SVG as users run it (the package's bin, as
// `npx axband render DIR/*.csv -o out.svg` runs it, and through npx itself), beside Node's own start-up
// (`node -e 0`) and gnuplot drawing the same files as plain lines when it is installed. Medians of
// BENCH_RUNS runs (default 5); never passes or fails on the numbers.
import { spawnSync } from "node:child_process";
import { existsSync, mkdirSync, readdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import { loadavg } from "node:os";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), "..");
const OUT = join(ROOT, "bench/.out");
const CURVES = join(OUT, "curves");
const RUNS = Math.max(1, Number(process.env.BENCH_RUNS ?? 5));

const median = (xs) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};
const sec = (ms) => `${(ms / 1000).toFixed(2)} s`;
const size = (bytes) => (bytes >= 1e6 ? `${(bytes / 1e6).toFixed(1)} MB` : `${(bytes / 1e3).toFixed(1)} kB`);

function ensureCurves() {
  const manifest = join(CURVES, "manifest.json");
  if (existsSync(manifest)) return;
  const maker = resolve(ROOT, "../shared/bench/make-curves.mjs");
  if (!existsSync(maker)) throw new Error(`input generator not found: ${maker}`);
  const r = spawnSync(process.execPath, [maker, "--out", CURVES], { stdio: "inherit" });
  if (r.status !== 0) throw new Error("make-curves.mjs failed");
}

// GNU time, when installed, adds the CPU time (user + system) of each run: on a shared machine it varies
// less than the wall time.
const GNU_TIME = existsSync("/usr/bin/time") ? "/usr/bin/time" : null;

/** Median wall time of RUNS runs (after one unmeasured run: bundles built, files in the page cache). */
function timed(label, cmd, args, outFile) {
  const cpu = [];
  const once = () => {
    const t0 = performance.now();
    const r = GNU_TIME
      ? spawnSync(GNU_TIME, ["-f", "axband-cpu %U %S", cmd, ...args], {
          cwd: ROOT,
          encoding: "utf8",
          maxBuffer: 1 << 26,
        })
      : spawnSync(cmd, args, { cwd: ROOT, encoding: "utf8", maxBuffer: 1 << 26 });
    if (r.status !== 0) throw new Error(`${label}: exited ${r.status ?? r.signal}\n${r.stderr}`);
    const m = /axband-cpu ([\d.]+) ([\d.]+)/.exec(r.stderr ?? "");
    if (m) cpu.push(1000 * (Number(m[1]) + Number(m[2])));
    return performance.now() - t0;
  };
  once();
  cpu.length = 0;
  const times = Array.from({ length: RUNS }, once);
  const bytes = outFile && existsSync(outFile) ? `, ${size(statSync(outFile).size)}` : "";
  const cpuText = cpu.length ? `; CPU ${sec(median(cpu))}` : "";
  console.log(`  ${label.padEnd(44)} median ${sec(median(times))} (${times.map(sec).join(", ")})${cpuText}${bytes}`);
  return median(times);
}

function hasGnuplot() {
  return spawnSync("gnuplot", ["--version"], { encoding: "utf8" }).status === 0;
}

ensureCurves();
mkdirSync(OUT, { recursive: true });
const files = readdirSync(CURVES)
  .filter((f) => f.endsWith(".csv"))
  .sort()
  .map((f) => join(CURVES, f));
// The load average says how far the times are from an idle machine's (2 cores: above 2, runs wait for a CPU).
const load = () =>
  loadavg()
    .map((x) => x.toFixed(2))
    .join(", ");
console.log(`inputs: ${files.length} invented files in ${CURVES}; median of ${RUNS} runs (target ≤ 0.5 s)`);
console.log(`  machine load (1, 5, 15 min) before: ${load()}`);
const svg = join(OUT, "cli-bin.svg");
const nodeMs = timed("node -e 0 (Node's own start-up)", process.execPath, ["-e", "0"]);
const binMs = timed("axband render (the bin: node src/cli/run.mjs)", process.execPath, [
  "src/cli/run.mjs",
  "render",
  ...files,
  "-o",
  svg,
]);
timed("npx axband render (with npx's own start-up)", "npx", ["axband", "render", ...files, "-o", svg], svg);
console.log(`  axband render beyond Node's start-up: ${sec(binMs - nodeMs)}`);
if (hasGnuplot()) {
  const script = join(OUT, "gnuplot.gp");
  const out = join(OUT, "gnuplot.svg");
  writeFileSync(
    script,
    [
      "set terminal svg size 960,540",
      `set output '${out}'`,
      'set datafile separator ","',
      // The files' comment and header lines: "#…" and "mass_eV,…".
      'set datafile commentschars "#m"',
      "set logscale xy",
      "unset key",
      `plot ${files.map((f) => `'${f}' using 1:2 with lines`).join(", ")}`,
    ].join("\n") + "\n",
  );
  const gnuMs = timed("gnuplot (plain lines, no fills)", "gnuplot", [script], out);
  console.log(`  ratio axband/gnuplot: ${(binMs / gnuMs).toFixed(2)}×`);
} else console.log("  gnuplot: skipped (not installed; Debian: apt-get install gnuplot-nox)");
console.log(`  machine load (1, 5, 15 min) after: ${load()}`);
// The reference figure script and the thinning error: bench/render.mjs.
const first = readFileSync(svg, "utf8").slice(0, 5);
if (first !== "<?xml") console.log("  (unexpected SVG output)");
