// Shared by the import benchmarks: makes sure the invented bench curves exist (written by the shared
// make-curves.mjs with its fixed seed) and lists them with their sizes.
import { spawnSync } from "node:child_process";
import { existsSync, readdirSync, statSync } from "node:fs";
import { join, resolve } from "node:path";
import { fileURLToPath } from "node:url";

export const ROOT = resolve(fileURLToPath(new URL("..", import.meta.url)));
export const OUT = join(ROOT, "bench", ".out");

/** Where make-curves.mjs lives: ../shared/bench next to the repository (also in CI), or $AXBAND_SHARED/bench. */
function makeCurvesScript() {
  const candidates = [
    process.env.AXBAND_SHARED && join(process.env.AXBAND_SHARED, "bench", "make-curves.mjs"),
    join(ROOT, "..", "shared", "bench", "make-curves.mjs"),
  ];
  const found = candidates.find((p) => p && existsSync(p));
  if (!found) {
    throw new Error(
      `make-curves.mjs not found (looked in ${candidates.filter(Boolean).join(", ")}); set AXBAND_SHARED to the shared folder`,
    );
  }
  return found;
}

function ensureSet(dir, args) {
  if (existsSync(join(dir, "manifest.json"))) return;
  const r = spawnSync(process.execPath, [makeCurvesScript(), "--out", dir, ...args], {
    stdio: ["ignore", "inherit", "inherit"],
  });
  if (r.status !== 0) throw new Error(`make-curves.mjs failed (${r.status ?? r.signal})`);
}

/**
 * The bench sets: "curves" (20 files × 100,000 rows, the shared default) and "curves-1m" (one file of
 * 1,000,000 rows). Returns { name, dir, files: [{ name, path, bytes }] } for each.
 */
export function benchSets() {
  const sets = [
    { name: "curves", dir: join(OUT, "curves"), args: [] },
    { name: "curves-1m", dir: join(OUT, "curves-1m"), args: ["--curves", "1", "--points", "1000000", "--seed", "7"] },
  ];
  return sets.map(({ name, dir, args }) => {
    ensureSet(dir, args);
    const files = readdirSync(dir)
      .filter((f) => f.endsWith(".csv"))
      .sort()
      .map((f) => ({ name: f, path: join(dir, f), bytes: statSync(join(dir, f)).size }));
    return { name, dir, files };
  });
}

export function median(xs) {
  const s = [...xs].sort((a, b) => a - b);
  const n = s.length;
  return n === 0 ? NaN : n % 2 ? s[(n - 1) / 2] : (s[n / 2 - 1] + s[n / 2]) / 2;
}

/** Option `--name value` from the command line, or the default. */
export function arg(name, fallback) {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 && i + 1 < process.argv.length ? process.argv[i + 1] : fallback;
}
