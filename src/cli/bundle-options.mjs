// How the launcher (run.mjs) bundles the command-line renderer with esbuild: one place, so that the test of
// which modules a run loads (tests/cli/lazy-modules.test.ts) checks the bundle users run.
import { join } from "node:path";

/**
 * esbuild options for the renderer's bundle and its CSV parse worker, written to `outdir`.
 * @param repo the repository root.
 */
export function bundleOptions(repo, outdir) {
  return {
    entryPoints: {
      render: join(repo, "src", "cli", "start.ts"),
      "parse-worker": join(repo, "src", "cli", "parse-worker.ts"),
    },
    bundle: true,
    platform: "node",
    format: "esm",
    target: "node20",
    // Packages are bundled too (one file to load instead of d3's many: ~40 ms less start-up), except resvg, a
    // native module loaded only for PNG output; a package upgrade touches package-lock.json, so rebuilds.
    external: ["@resvg/resvg-js"],
    // Split so that start.ts's dynamic import of the renderer loads its modules after the workers start, and
    // what only some inputs or outputs need (the schema, the PDF writer and reader) loads only for them.
    splitting: true,
    outdir,
    outExtension: { ".js": ".mjs" },
    logLevel: "warning",
  };
}
