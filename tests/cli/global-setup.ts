// Bundles the command-line renderer once before the unit tests (src/cli/run.mjs rebuilds its bundle when a source
// is newer), so that each CLI test runs the bin as users do, without starting a TypeScript loader per run.
import { spawnSync } from "node:child_process";
import { resolve } from "node:path";

export default function setup(): void {
  const r = spawnSync(process.execPath, ["src/cli/run.mjs", "--help"], {
    cwd: resolve(__dirname, "../.."),
    encoding: "utf8",
    timeout: 120_000,
  });
  if (r.status !== 0) throw new Error(`bundling the command line failed (exit ${r.status ?? r.signal}):\n${r.stderr}`);
}
