// `npm test`: typecheck, lint, format check, knip and the Vitest projects; ends with the plain summary line
// "N passed, N failed" that CI reads. Exit code 0 only when everything passed. Two lanes run side by side: the
// browser tests, and the static checks followed by the unit and component tests (order below). A static check whose inputs (every
// file git lists, tracked or not ignored, and the installed lock file) are those of its last passing run is not run
// again (node_modules/.cache/axband-checks; a fresh clone has none, so CI runs them all; AXBAND_NO_CHECK_CACHE=1 runs them).
import { spawn, spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { mkdirSync, readFileSync, readdirSync, rmSync, existsSync, writeFileSync, statSync } from "node:fs";
import { join } from "node:path";
import { aloneBrowserTests } from "./test-files.mjs";

const bin = (name) => `node_modules/.bin/${name}`;
const CACHE = "node_modules/.cache/axband-checks";
// The same files as `npm run format` (package.json), without npm's start-up.
const FORMAT_GLOBS = JSON.parse(readFileSync("package.json", "utf8"))
  .scripts["format:check"].match(/"[^"]+"|\S+/g)
  .slice(2)
  .map((g) => g.replace(/"/g, ""));
let passed = 0;
let failed = 0;

const CHECKS = [
  // TypeScript's native compiler (7.x, a tenth of 6.x's time here); 6.x stays installed for typescript-eslint.
  ["typecheck", "node_modules/typescript-native/bin/tsc", ["--noEmit", "-p", "src/tsconfig.json"]],
  [
    "lint",
    bin("eslint"),
    [
      "-c",
      "tests/eslint.config.mjs",
      "--no-error-on-unmatched-pattern",
      "--cache",
      "--cache-location",
      `${CACHE}/eslint`,
      "src",
      "tests",
      "bench",
    ],
  ],
  ["knip (unused files, exports, dependencies)", bin("knip"), ["--no-progress"]],
  [
    "format",
    bin("prettier"),
    ["--check", "--log-level=warn", "--cache", "--cache-location", `${CACHE}/prettier`, ...FORMAT_GLOBS],
  ],
];

/** Files the checks read: what git lists (tracked, or untracked and not ignored), else the source folders. */
function inputFiles() {
  const git = spawnSync("git", ["ls-files", "-z", "--cached", "--others", "--exclude-standard"], { encoding: "utf8" });
  if (git.status === 0) return git.stdout.split("\0").filter((f) => f && existsSync(f));
  const walk = (dir) =>
    readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
      e.isDirectory() ? walk(join(dir, e.name)) : [join(dir, e.name)],
    );
  return [
    ...["src", "tests", "bench", "public"].filter((d) => existsSync(d)).flatMap(walk),
    ...readdirSync(".").filter((f) => statSync(f).isFile()),
  ].filter((f) => !f.startsWith(join("tests", ".artifacts")));
}

function inputsHash() {
  const h = createHash("sha256");
  h.update(process.version);
  for (const f of inputFiles().sort()) {
    h.update(f + "\0");
    h.update(readFileSync(f));
    h.update("\0");
  }
  // What is installed (a different lock file in node_modules means other tool versions).
  if (existsSync("node_modules/.package-lock.json")) h.update(readFileSync("node_modules/.package-lock.json"));
  return h.digest("hex");
}

const stampOf = (label) => join(CACHE, `${label.split(" ")[0]}.ok`);

/** Runs a command with its output collected and printed in one piece when it ends (lanes run side by side). */
function run(label, cmd, args, env = {}) {
  return new Promise((resolve) => {
    const t0 = Date.now();
    const child = spawn(cmd, args, {
      stdio: ["ignore", "pipe", "pipe"],
      env: { ...process.env, FORCE_COLOR: "0", ...env },
    });
    const out = [];
    child.stdout.on("data", (d) => out.push(d));
    child.stderr.on("data", (d) => out.push(d));
    child.on("close", (code, signal) => {
      const ok = code === 0;
      const s = ((Date.now() - t0) / 1000).toFixed(1);
      console.log(`\n== ${label}: ${cmd} ${args.join(" ")}`);
      process.stdout.write(Buffer.concat(out));
      console.log(`== ${label}: ${ok ? "ok" : `FAILED (exit ${code ?? signal})`} (${s} s)`);
      resolve(ok);
    });
  });
}

/** One static check, skipped when its inputs are those of its last passing run. */
async function runCheck([label, cmd, args], hash) {
  const stamp = stampOf(label);
  if (hash && existsSync(stamp) && readFileSync(stamp, "utf8") === `${hash}\n${args.join(" ")}`) {
    console.log(`\n== ${label}: ok (inputs unchanged since it last passed)`);
    return true;
  }
  const ok = await run(label, cmd, args);
  if (ok && hash) writeFileSync(stamp, `${hash}\n${args.join(" ")}`);
  return ok;
}

/** Runs Vitest projects with a JSON report and counts their tests. */
async function runVitest(projects, files = [], part = "", env = {}) {
  const name = projects.join("+") + part;
  const report = `tests/.artifacts/vitest-${name}.json`;
  rmSync(report, { force: true });
  const args = [
    "run",
    ...projects.flatMap((p) => ["--project", p]),
    ...files,
    "--reporter=default",
    "--reporter=json",
    `--outputFile.json=${report}`,
  ];
  const ok = await run(`vitest ${name}`, bin("vitest"), args, env);
  if (!existsSync(report)) return { passed: 0, failed: 1 };
  const r = JSON.parse(readFileSync(report, "utf8"));
  let failedHere = r.numFailedTests;
  // A file that fails to load has no tests to count; count it once so it cannot pass unnoticed.
  for (const f of r.testResults ?? [])
    if (f.status === "failed" && (f.assertionResults ?? []).length === 0) failedHere++;
  if (!ok && failedHere === 0) failedHere++;
  return { passed: r.numPassedTests, failed: failedHere };
}

const started = Date.now();
mkdirSync(CACHE, { recursive: true });
mkdirSync("tests/.artifacts", { recursive: true });
const hash = process.env.AXBAND_NO_CHECK_CACHE ? undefined : inputsHash();
const count = ({ passed: p, failed: f }) => {
  passed += p;
  failed += f;
};
// Two lanes side by side on the two cores. The browser files that time the page's main thread (they call
// runsAlone()) go first, beside the static checks only (one process at a time), so that their margins are not spent
// on hundreds of unit tests; then the other browser files (two at a time) beside the unit and component tests.
const browserFiles = readdirSync("tests/browser")
  .filter((f) => f.endsWith(".test.ts"))
  .map((f) => `tests/browser/${f}`);
const aloneFiles = aloneBrowserTests();
const sharedFiles = browserFiles.filter((f) => !aloneFiles.includes(f));
const check = async (c) => count((await runCheck(c, hash)) ? { passed: 1, failed: 0 } : { passed: 0, failed: 1 });
let timedDone;
const timed = new Promise((resolve) => (timedDone = resolve));
await Promise.all([
  (async () => {
    let built = false;
    if (aloneFiles.length) {
      const timedRun = await runVitest(["browser"], aloneFiles, "-timed");
      count(timedRun);
      built = timedRun.failed === 0;
    }
    timedDone();
    // The last check here, where it evens out the lanes (the unit lane is the longer one).
    await check(CHECKS[CHECKS.length - 1]);
    // The app the timed files' run built (tests/browser/global-setup.ts) serves these too: no second build.
    if (sharedFiles.length)
      count(await runVitest(["browser"], sharedFiles, "", built ? { AXBAND_SKIP_BUILD: "1" } : {}));
  })(),
  (async () => {
    for (const c of CHECKS.slice(0, -1)) await check(c);
    await timed;
    count(await runVitest(["unit", "ui", "ui-mocking"]));
  })(),
]);

console.log(`\nnpm test took ${((Date.now() - started) / 1000).toFixed(0)} s`);
console.log(`\n${passed} passed, ${failed} failed`);
process.exit(failed === 0 ? 0 : 1);
