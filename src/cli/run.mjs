#!/usr/bin/env node
// Launcher of the command-line renderer (the package's bin; `npm run render -- …`): bundles src/cli/start.ts and the
// CSV parse worker with esbuild into node_modules/.cache/axband/ when a source is newer, then runs it in this process.
import { existsSync, readdirSync, statSync, mkdirSync, rmSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { bundleOptions } from "./bundle-options.mjs";

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
// Why bundle: starting through a TypeScript loader costs ~1–3 s per run on a small machine, more than rendering;
// esbuild itself is loaded only to rebuild.
if (stale) {
  const { build } = await import("esbuild");
  mkdirSync(cache, { recursive: true });
  // Chunk names carry content hashes: drop the previous build's so they do not pile up.
  for (const f of readdirSync(cache)) if (f.endsWith(".mjs")) rmSync(join(cache, f), { force: true });
  await build(bundleOptions(repo, cache));
}
const { mainAsync } = await import(pathToFileURL(out).href);
const argv = process.argv.slice(2);
// `npx axband render …`: a leading "render" is the command's name.
if (argv[0] === "render") argv.shift();
process.exitCode = await mainAsync(argv, undefined, { parseWorker: pathToFileURL(worker) });
