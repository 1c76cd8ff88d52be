// Build, dev server and test configuration for axband (one file: Vite serves the app, Vitest runs the tests).
import { defineConfig } from "vitest/config";
import react from "@vitejs/plugin-react";
import { BaseSequencer, type TestSpecification } from "vitest/node";
import { aloneBrowserTests, mockingUiTests } from "./tests/test-files.mjs";
import { resolve } from "node:path";

// Component tests that replace modules with vi.mock, and browser files that run with no other file beside them,
// found by reading the files (tests/test-files.mjs; tests/run-all.mjs picks the same).
const MOCKING_UI_TESTS = mockingUiTests();
const ALONE_BROWSER_TESTS = new Set(aloneBrowserTests().map((f) => resolve(f)));

/** Vitest's order (failed, then longest first), with the browser files that run alone first: run later, each would
 *  leave the second worker idle until the other file then running ends, as well as while it runs. */
class AloneFirstSequencer extends BaseSequencer {
  override async sort(files: TestSpecification[]): Promise<TestSpecification[]> {
    const sorted = await super.sort(files);
    const alone = (f: TestSpecification) => ALONE_BROWSER_TESTS.has(resolve(f.moduleId));
    // Moved to where the browser project's files begin (projects stay in Vitest's order).
    const at = sorted.findIndex((f) => f.project.name === "browser");
    if (at < 0) return sorted;
    const rest = sorted.filter((f) => !alone(f));
    return [...rest.slice(0, at), ...sorted.filter(alone), ...rest.slice(at)];
  }
}

export default defineConfig({
  plugins: [react()],
  // Relative base so the built app works from any folder or static host.
  base: "./",
  server: { host: "127.0.0.1", port: 5173 },
  preview: { host: "127.0.0.1", port: 4173 },
  worker: { format: "es" },
  build: { outDir: "dist", sourcemap: false, chunkSizeWarningLimit: 1500 },
  test: {
    // Both cores (Vitest's default leaves one free: one worker on a 2-core machine).
    maxWorkers: 2,
    sequence: { sequencer: AloneFirstSequencer },
    projects: [
      {
        extends: true,
        test: {
          name: "unit",
          environment: "node",
          include: [
            "tests/physics/**/*.test.ts",
            "tests/project/**/*.test.ts",
            "tests/formats/**/*.test.ts",
            "tests/analysis/**/*.test.ts",
            "tests/plot/**/*.test.ts",
            "tests/cli/**/*.test.ts",
            "tests/worker/**/*.test.ts",
            // Store, autosave and view tests without JSX need no DOM (their stores are passed in as fakes).
            "tests/ui/**/*.test.ts",
          ],
          // Worker threads that keep loaded modules from file to file: these tests share no global state (spies
          // and fake timers are restored in the test that sets them), and the cores load once per worker.
          pool: "threads",
          isolate: false,
          globalSetup: ["tests/cli/global-setup.ts"],
          testTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: "ui",
          environment: "jsdom",
          include: ["tests/ui/**/*.test.tsx"],
          exclude: MOCKING_UI_TESTS,
          setupFiles: ["tests/ui/setup.ts"],
          // One DOM and one module cache per worker thread, not per file (setting up jsdom and loading React for
          // each file was two thirds of this project's CPU time); setup.ts empties the DOM after every test.
          pool: "threads",
          isolate: false,
          testTimeout: 30_000,
        },
      },
      {
        extends: true,
        test: {
          name: "ui-mocking",
          environment: "jsdom",
          include: MOCKING_UI_TESTS,
          setupFiles: ["tests/ui/setup.ts"],
          testTimeout: 30_000,
        },
      },
      {
        extends: true,
        test: {
          name: "browser",
          environment: "node",
          include: ["tests/browser/**/*.test.ts"],
          globalSetup: ["tests/browser/global-setup.ts"],
          // Two files at a time (the root's maxWorkers) on the one app and Chromium, each in its own browser
          // contexts; the files that time the main thread run alone (runsAlone(), tests/browser/run-lock.ts).
          setupFiles: ["tests/browser/setup.ts"],
          // Worker processes that keep loaded modules (Playwright, the cores) from file to file: importing them
          // again for each file cost seconds per file on a busy machine. The files share no global state but the
          // run lock's mark, which setup.ts clears.
          isolate: false,
          testTimeout: 120_000,
          hookTimeout: 180_000,
        },
      },
    ],
  },
});
