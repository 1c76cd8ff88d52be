// `npm test`: typecheck, lint, then every Vitest project (unit, ui, browser) in one run; ends with
// the plain summary line "N passed, N failed" that CI reads. Exit code 0 only when everything passed.
import { spawnSync } from "node:child_process";
import { mkdirSync, readFileSync, rmSync, existsSync } from "node:fs";

const bin = (name) => `node_modules/.bin/${name}`;
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
  ["lint", bin("eslint"), ["-c", "tests/eslint.config.mjs", "--no-error-on-unmatched-pattern", "src", "tests", "bench"]],
]) {
  if (step(label, cmd, args)) passed++;
  else failed++;
}

mkdirSync("tests/.artifacts", { recursive: true });
const report = "tests/.artifacts/vitest.json";
rmSync(report, { force: true });
const vitestOk = step("vitest", bin("vitest"), ["run", "--reporter=default", "--reporter=json", `--outputFile.json=${report}`]);
if (existsSync(report)) {
  const r = JSON.parse(readFileSync(report, "utf8"));
  passed += r.numPassedTests;
  failed += r.numFailedTests;
  // A file that fails to load has no tests to count; count it once so it cannot pass unnoticed.
  for (const f of r.testResults ?? []) if (f.status === "failed" && (f.assertionResults ?? []).length === 0) failed++;
} else {
  failed++;
}
if (!vitestOk && failed === 0) failed++;

console.log(`\n${passed} passed, ${failed} failed`);
process.exit(failed === 0 ? 0 : 1);
