// Test files picked by what they contain, read by vite.config.ts (projects, order) and tests/run-all.mjs (lanes),
// so both always pick the same files: component tests that replace modules, browser files that must run alone.
import { existsSync, readdirSync, readFileSync } from "node:fs";

/** The files `dir/*suffix` whose text includes `marker`, as "dir/name" paths. */
function filesContaining(dir, suffix, marker) {
  if (!existsSync(dir)) return [];
  return readdirSync(dir)
    .filter((f) => f.endsWith(suffix) && readFileSync(`${dir}/${f}`, "utf8").includes(marker))
    .map((f) => `${dir}/${f}`);
}

/** Component tests that call vi.mock: they need modules of their own (never the shared module cache). */
export const mockingUiTests = () => filesContaining("tests/ui", ".test.tsx", "vi.mock(");

/** Browser test files that time the page's main thread and call runsAlone() (tests/browser/run-lock.ts). */
export const aloneBrowserTests = () => filesContaining("tests/browser", ".test.ts", "\nrunsAlone();");
