// `npm test`: typecheck, lint, format check, knip, then the Vitest projects (unit + ui together, then browser alone); ends with
// the plain summary line "N passed, N failed" that CI reads. Exit code 0 only when everything passed.
import { spawnSync } from "node:child_process";
import { mkdirSync, readFileSync, rmSync, existsSync } from "node:fs";

const bin = (name) => `node_modules/.bin/${name}`;
// The same files as `npm run format` (package.json), without npm's start-up.
const FORMAT_GLOBS = JSON.parse(readFileSync("package.json", "utf8"))
  .scripts["format:check"].match(/"[^"]+"|\S+/g)
  .slice(2)
  .map((g) => g.replace(/"/g, ""));
let passed = 0;
let failed = 0;

function step(label, cmd, args) {
  console.log(`\n== ${label}: ${cmd} ${args.join(" ")}`);
  const r = spawnSync(cmd, args, { stdio: "inherit" });
  const ok = r.status === 0;
  console.log(`== ${label}: ${ok ? "ok" : `FAILED (exit ${r.status ?? r.signal})`}`);
  return ok;
}

for (const [label, cmd, args] of [
  ["typecheck", bin("tsc"), ["--noEmit", "-p", "src/tsconfig.json"]],
  [
    "lint",
    bin("eslint"),
    ["-c", "tests/eslint.config.mjs", "--no-error-on-unmatched-pattern", "src", "tests", "bench"],
  ],
  ["format", bin("prettier"), ["--check", "--log-level=warn", ...FORMAT_GLOBS]],
  ["knip (unused files, exports, dependencies)", bin("knip"), ["--no-progress"]],
]) {
  if (step(label, cmd, args)) passed++;
  else failed++;
}

mkdirSync("tests/.artifacts", { recursive: true });
// The browser tests run after the others and alone: their timing checks (long tasks on the main thread)
// must not share the two cores with hundreds of unit tests.
for (const projects of [["unit", "ui"], ["browser"]]) {
  const name = projects.join("+");
  const report = `tests/.artifacts/vitest-${name}.json`;
  rmSync(report, { force: true });
  const args = [
    "run",
    ...projects.flatMap((p) => ["--project", p]),
    "--reporter=default",
    "--reporter=json",
    `--outputFile.json=${report}`,
  ];
  const ok = step(`vitest ${name}`, bin("vitest"), args);
  if (!existsSync(report)) {
    failed++;
    continue;
  }
  const r = JSON.parse(readFileSync(report, "utf8"));
  passed += r.numPassedTests;
  failed += r.numFailedTests;
  // A file that fails to load has no tests to count; count it once so it cannot pass unnoticed.
  for (const f of r.testResults ?? []) if (f.status === "failed" && (f.assertionResults ?? []).length === 0) failed++;
  if (!ok && r.numFailedTests === 0) failed++;
}

console.log(`\n${passed} passed, ${failed} failed`);
process.exit(failed === 0 ? 0 : 1);
