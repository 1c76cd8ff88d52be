#!/usr/bin/env node
// Launcher of the command-line renderer (`npx axband render …`, the package's bin; `npm run render -- …`): bundles
// src/cli/start.ts (which loads render.ts) and the CSV parse worker with esbuild into node_modules/.cache/axband/
// when any source file is newer than a bundle, then runs it in this process. A leading "render" is the command's
// name and is dropped.
// Why: starting through a TypeScript loader costs ~1–3 s per run on a small machine, more than rendering; esbuild
// itself is loaded only to rebuild.
import { existsSync, readdirSync, statSync, mkdirSync, rmSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const repo = resolve(dirname(fileURLToPath(import.meta.url)), "../..");
const cache = join(repo, "node_modules", ".cache", "axband");
const out = join(cache, "render.mjs");
const worker = join(cache, "parse-worker.mjs");

function newestMtime(dir) {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, entry.name);
    if (entry.isDirectory()) newest = Math.max(newest, newestMtime(p));
    else newest = Math.max(newest, statSync(p).mtimeMs);
  }
  return newest;
}

const bundles = [out, worker];
const stale =
  !bundles.every((f) => existsSync(f)) ||
  Math.min(...bundles.map((f) => statSync(f).mtimeMs)) <
    Math.max(
      newestMtime(join(repo, "src")),
      ...["package.json", "package-lock.json"]
        .filter((f) => existsSync(join(repo, f)))
        .map((f) => statSync(join(repo, f)).mtimeMs),
    );
if (stale) {
  const { build } = await import("esbuild");
  mkdirSync(cache, { recursive: true });
  // Chunk names carry content hashes: drop the previous build's so they do not pile up.
  for (const f of readdirSync(cache)) if (f.endsWith(".mjs")) rmSync(join(cache, f), { force: true });
  // Packages are bundled too (one file to load instead of zod's and d3's many: ~40 ms less start-up), except
  // resvg, a native module loaded only for PNG output; a package upgrade touches package-lock.json, so rebuilds.
  await build({
    entryPoints: {
      render: join(repo, "src", "cli", "start.ts"),
      "parse-worker": join(repo, "src", "cli", "parse-worker.ts"),
    },
    bundle: true,
    platform: "node",
    format: "esm",
    target: "node20",
    external: ["@resvg/resvg-js"],
    // Split so that start.ts's dynamic import of the renderer loads its modules after the workers start.
    splitting: true,
    outdir: cache,
    outExtension: { ".js": ".mjs" },
    logLevel: "warning",
  });
}
const { mainAsync } = await import(pathToFileURL(out).href);
const argv = process.argv.slice(2);
if (argv[0] === "render") argv.shift();
process.exitCode = await mainAsync(argv, undefined, { parseWorker: pathToFileURL(worker) });
