// Benchmark: invented CSV curves → SVG with the command-line renderer, side by side in the same run with the
// reference plotting script (a general plotting library drawing the same curves). Prints medians and ratios,
// and the thinning error of the exported scene; never passes or fails on the numbers.
//
// usage: node bench/render.mjs [--thinning-only]   (BENCH_RUNS=3 timed runs per variant; inputs made once under bench/.out)
import { spawnSync } from "node:child_process";
import { existsSync, mkdirSync, readFileSync, statSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), "..");
const SHARED = resolve(ROOT, "../shared");
const OUT = join(ROOT, "bench/.out");
const CURVES = join(OUT, "curves");
const RUNS = Math.max(1, Number(process.env.BENCH_RUNS ?? 3));
const CURVE_COUNT = 20;
const POINTS = 100000;
// The reference script's fixed axes, so both programs draw the same figure.
const MASS_RANGE = "1e-10:1e-1";
const G_RANGE = "1e-17:1e-7";
const ROLE_OF_KIND = { scan: "exclusion", plateau: "exclusion", projection: "projection", region: "region" };

const median = (xs) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};
const mb = (bytes) => (bytes >= 1e6 ? `${(bytes / 1e6).toFixed(2)} MB` : `${(bytes / 1e3).toFixed(1)} kB`);
const sec = (ms) => `${(ms / 1000).toFixed(2)} s`;

function ensureCurves() {
  const manifestPath = join(CURVES, "manifest.json");
  if (existsSync(manifestPath)) {
    const m = JSON.parse(readFileSync(manifestPath, "utf8"));
    if (
      m.curves?.length === CURVE_COUNT &&
      m.curves.every((c) => c.points === POINTS && existsSync(join(CURVES, c.file)))
    )
      return m;
  }
  mkdirSync(OUT, { recursive: true });
  const maker = join(SHARED, "bench/make-curves.mjs");
  if (!existsSync(maker)) throw new Error(`input generator not found: ${maker}`);
  const r = spawnSync(
    process.execPath,
    [maker, "--out", CURVES, "--curves", String(CURVE_COUNT), "--points", String(POINTS)],
    { stdio: "inherit" },
  );
  if (r.status !== 0) throw new Error("make-curves.mjs failed");
  return JSON.parse(readFileSync(manifestPath, "utf8"));
}

function cliArgs(manifest, outSvg, extra = []) {
  const files = manifest.curves.flatMap((c) => ["--role", ROLE_OF_KIND[c.kind] ?? "exclusion", join(CURVES, c.file)]);
  return [
    "src/cli/run.mjs",
    ...files,
    "--model",
    "0",
    "--model",
    "8/3",
    "--model",
    "44/3",
    "--preset",
    "double-column",
    "--mass-range",
    MASS_RANGE,
    "--g-range",
    G_RANGE,
    "-o",
    outSvg,
    ...extra,
  ];
}

function timed(cmd, args, env = process.env) {
  const t0 = performance.now();
  const r = spawnSync(cmd, args, { cwd: ROOT, encoding: "utf8", env, maxBuffer: 64 * 1024 * 1024 });
  const ms = performance.now() - t0;
  if (r.status !== 0)
    throw new Error(`${cmd} ${args.slice(0, 4).join(" ")} … exited ${r.status ?? r.signal}:\n${r.stderr}`);
  return ms;
}

/** Median wall time of RUNS runs, and the output size. */
function measure(label, cmd, args, outFile, { env } = {}) {
  const times = [];
  for (let i = 0; i < RUNS; i++) times.push(timed(cmd, args, env));
  const bytes = statSync(outFile).size;
  console.log(`  ${label}: runs ${times.map(sec).join(", ")}; median ${sec(median(times))}; ${mb(bytes)}`);
  return { ms: median(times), bytes };
}

function findPython() {
  for (const py of ["python3", "/usr/bin/python3"]) {
    const r = spawnSync(py, ["-c", "import matplotlib; print(matplotlib.__version__)"], { encoding: "utf8" });
    if (r.status === 0) return { py, version: r.stdout.trim() };
  }
  return null;
}

// ------------------------------------------------------------------------------------------ thinning error

/** Polylines (absolute px) of SVG path data with M/L/H/V/Z commands, absolute or relative (what the plot core writes). */
function polylines(d) {
  const out = [];
  let cur = null;
  let x = 0;
  let y = 0;
  let sx = 0;
  let sy = 0;
  let cmd = "M";
  let nums = [];
  const flush = () => {
    const rel = cmd === cmd.toLowerCase();
    const C = cmd.toUpperCase();
    if (C === "Z") {
      if (cur) cur.push(sx, sy);
      x = sx;
      y = sy;
      return;
    }
    const step = C === "H" || C === "V" ? 1 : 2;
    for (let i = 0; i + step <= nums.length; i += step) {
      if (C === "H") x = rel ? x + nums[i] : nums[i];
      else if (C === "V") y = rel ? y + nums[i] : nums[i];
      else {
        x = rel ? x + nums[i] : nums[i];
        y = rel ? y + nums[i + 1] : nums[i + 1];
      }
      if (C === "M" && i === 0) {
        cur = [];
        out.push(cur);
        sx = x;
        sy = y;
      }
      cur?.push(x, y);
    }
  };
  for (const m of d.matchAll(/([MmLlHhVvZz])|(-?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?)/g)) {
    if (m[1]) {
      flush();
      cmd = m[1];
      nums = [];
    } else nums.push(Number(m[2]));
  }
  flush();
  return out;
}

function segDist(px, py, ax, ay, bx, by) {
  const dx = bx - ax;
  const dy = by - ay;
  const len2 = dx * dx + dy * dy;
  let t = len2 > 0 ? ((px - ax) * dx + (py - ay) * dy) / len2 : 0;
  t = t < 0 ? 0 : t > 1 ? 1 : t;
  const ex = ax + t * dx - px;
  const ey = ay + t * dy - py;
  return Math.sqrt(ex * ex + ey * ey);
}

/**
 * Largest distance (px) from any point of the unthinned drawing inside the plot area to the thinned drawing
 * of the same node, over every curve line and region outline. Segments are bucketed on a 1 px grid, so a
 * point only looks at nearby segments; beyond 4 px it counts as 4 px (reported as "≥").
 */
function thinningError(fullScene, thinScene) {
  const nodesOf = (scene) =>
    new Map(
      scene.layers
        .flatMap((l) => l.nodes)
        .filter((n) => n.kind === "path" && /^curve-\d+-/.test(n.id ?? ""))
        .map((n) => [n.id, n.d]),
    );
  const full = nodesOf(fullScene);
  const thin = nodesOf(thinScene);
  const { x: X0, y: Y0, w: W, h: H } = fullScene.plot;
  const CAP = 4;
  let max = 0;
  let sum = 0;
  let count = 0;
  for (const [id, d] of full) {
    const segs = [];
    for (const p of polylines(thin.get(id) ?? ""))
      for (let i = 0; i + 3 < p.length; i += 2) segs.push(p[i], p[i + 1], p[i + 2], p[i + 3]);
    const grid = new Map();
    for (let s = 0; s < segs.length; s += 4) {
      const x0 = Math.floor(Math.min(segs[s], segs[s + 2]));
      const x1 = Math.floor(Math.max(segs[s], segs[s + 2]));
      const y0 = Math.floor(Math.min(segs[s + 1], segs[s + 3]));
      const y1 = Math.floor(Math.max(segs[s + 1], segs[s + 3]));
      for (let gx = x0; gx <= x1; gx++)
        for (let gy = y0; gy <= y1; gy++) {
          const k = gx * 100003 + gy;
          const list = grid.get(k);
          if (list) list.push(s);
          else grid.set(k, [s]);
        }
    }
    for (const p of polylines(d)) {
      for (let i = 0; i < p.length; i += 2) {
        const x = p[i];
        const y = p[i + 1];
        if (x < X0 || x > X0 + W || y < Y0 || y > Y0 + H) continue;
        let best = CAP;
        for (let r = 1; r <= CAP && best > r - 1; r++) {
          const gx = Math.floor(x);
          const gy = Math.floor(y);
          for (let cx = gx - r; cx <= gx + r; cx++)
            for (let cy = gy - r; cy <= gy + r; cy++) {
              if (Math.abs(cx - gx) < r && Math.abs(cy - gy) < r && r > 1) continue; // inner ring already seen
              const list = grid.get(cx * 100003 + cy);
              if (!list) continue;
              for (const s of list) {
                const dist = segDist(x, y, segs[s], segs[s + 1], segs[s + 2], segs[s + 3]);
                if (dist < best) best = dist;
              }
            }
        }
        if (best > max) max = best;
        sum += best;
        count++;
      }
    }
  }
  return { max, mean: count ? sum / count : 0, count, capped: max >= CAP };
}

async function measureThinning(manifest) {
  const { register } = await import("tsx/esm/api");
  register();
  const { parseArgs } = await import("../src/cli/args.ts");
  const { loadCsvProject } = await import("../src/cli/inputs.ts");
  const { buildScene } = await import("../src/plot/scene.ts");
  const { presetOf } = await import("../src/plot/layout.ts");
  const { EXPORT_RESOLUTION, rasterResolution } = await import("../src/formats/figure-file.ts");
  const args = parseArgs(cliArgs(manifest, join(OUT, "unused.svg")).slice(3));
  if (!args.ok) throw new Error(args.error);
  const { project } = loadCsvProject(args.options);
  const size = presetOf(project.figure);
  const base = { widthPx: size.widthPx, heightPx: size.heightPx };
  const full = buildScene(project, { ...base, thin: false });
  const results = [];
  const png300 = rasterResolution(300);
  for (const resolution of [...new Set([1, EXPORT_RESOLUTION, png300])]) {
    const e = thinningError(full, buildScene(project, { ...base, resolution }));
    const used = [
      resolution === EXPORT_RESOLUTION ? "the SVG export" : "",
      resolution === png300 ? "a 300 dpi PNG" : "",
    ]
      .filter(Boolean)
      .join(", ");
    results.push({ resolution, ...e, used, png300: resolution === png300 });
  }
  return { results, size };
}

// ----------------------------------------------------------------------------------------------------- main

const manifest = ensureCurves();
console.log(
  `inputs: ${manifest.curves.length} invented curves × ${POINTS} points (${CURVES}), preset double-column, models E/N = 0, 8/3, 44/3, axes ${MASS_RANGE} eV × ${G_RANGE} GeV^-1; median of ${RUNS} runs`,
);

const thinningOnly = process.argv.includes("--thinning-only");
const cliEmbed = thinningOnly
  ? null
  : measure(
      "axband CLI, project embedded (default)",
      process.execPath,
      cliArgs(manifest, join(OUT, "cli.svg")),
      join(OUT, "cli.svg"),
    );
const cliBare = thinningOnly
  ? null
  : measure(
      "axband CLI, --no-embed (figure only)",
      process.execPath,
      cliArgs(manifest, join(OUT, "cli-noembed.svg"), ["--no-embed"]),
      join(OUT, "cli-noembed.svg"),
    );
// The same with two parse threads forced (the main thread and one worker; on ≤ 2 CPUs the default parses in-process).
const cliWorkers = thinningOnly
  ? null
  : measure(
      "axband CLI, --no-embed, AXBAND_PARSE_THREADS=2 (main thread + one worker)",
      process.execPath,
      cliArgs(manifest, join(OUT, "cli-workers.svg"), ["--no-embed"]),
      join(OUT, "cli-workers.svg"),
      {
        env: { ...process.env, AXBAND_PARSE_THREADS: "2" },
      },
    );

const python = thinningOnly ? null : findPython();
let ref = null;
if (python) {
  const env = { ...process.env, MPLCONFIGDIR: join(OUT, "mplconfig") };
  // Older OpenBLAS workarounds slow a current numpy; unset both together for the reference only.
  delete env.OPENBLAS_CORETYPE;
  delete env.OPENBLAS_L2_SIZE;
  ref = measure(
    `reference script (matplotlib ${python.version}, ${python.py})`,
    python.py,
    [join(SHARED, "bench/reference-figure.py"), CURVES, join(OUT, "reference.svg")],
    join(OUT, "reference.svg"),
    { env },
  );
} else if (!thinningOnly) {
  console.log("  reference script: skipped (no python3 with matplotlib; Debian: apt-get install python3-matplotlib)");
}

if (ref) {
  const r = (a, b) => `${(a / b).toFixed(3)}×`;
  console.log("ratios to the reference (goal: time ≤ 0.1×, bytes ≤ 0.05×):");
  console.log(`  embedded: time ${r(cliEmbed.ms, ref.ms)}, bytes ${r(cliEmbed.bytes, ref.bytes)}`);
  console.log(`  --no-embed: time ${r(cliBare.ms, ref.ms)}, bytes ${r(cliBare.bytes, ref.bytes)}`);
  console.log(`  --no-embed with two parse workers: time ${r(cliWorkers.ms, ref.ms)}`);
}
if (cliBare && cliWorkers) {
  const same = readFileSync(join(OUT, "cli-noembed.svg")).equals(readFileSync(join(OUT, "cli-workers.svg")));
  console.log(
    `--no-embed: ${sec(cliBare.ms)} default, ${sec(cliWorkers.ms)} with two parse workers; SVG bytes ${same ? "identical" : "DIFFER"}`,
  );
}

try {
  const { results, size } = await measureThinning(manifest);
  console.log(
    `thinning error at the export size (${size.widthPhysical} × ${size.heightPhysical}, ${size.widthPx} × ${size.heightPx} scene px), distance from every unthinned point inside the plot to the drawn line:`,
  );
  for (const e of results) {
    console.log(
      `  resolution ${e.resolution}${e.used ? ` (used by ${e.used})` : ""}: max ${e.capped ? "≥ " : ""}${e.max.toFixed(4)} scene px, mean ${e.mean.toFixed(4)} px over ${e.count} points` +
        (e.png300 ? `; = ${((e.max * 300) / 96).toFixed(4)} px of the 300 dpi PNG` : ""),
    );
  }
} catch (e) {
  console.log(`thinning error: not measured (${e instanceof Error ? e.message : String(e)})`);
}
