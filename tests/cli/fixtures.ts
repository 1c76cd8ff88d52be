// Small projects and files for the CLI and export tests, plus a helper that runs the CLI as a child process
// exactly as `npm run render` and `npx axband` do (the bundled bin, built once by global-setup.ts), from the
// repository root.
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { afterAll, onTestFinished } from "vitest";
import { emptyProject, newCurve, newModel } from "../../src/project/defaults";
import { projectToFile } from "../../src/formats/project-file";
import type { Project } from "../../src/project/types";
import { main } from "../../src/cli/render";

export const REPO = resolve(__dirname, "../..");

/**
 * A fresh temporary directory for one test's files, removed when that test ends (or, made in a describe block,
 * after the block's tests), so that runs leave nothing behind in the system's temporary folder.
 */
export function tempDir(tag = "axband-cli-"): string {
  const dir = mkdtempSync(join(tmpdir(), tag));
  const remove = () => rmSync(dir, { recursive: true, force: true });
  try {
    onTestFinished(remove);
  } catch {
    // Not inside a test: the directory serves the tests of the describe block being collected.
    afterAll(remove);
  }
  return dir;
}

/**
 * A small project: two models (a line and a band) and two invented curves (an exclusion and a projection),
 * single-column figure, fixed ids so output is reproducible. Labels may be overridden for injection tests.
 */
export function smallProject(labels: { model?: string; curve?: string; name?: string; title?: string } = {}): Project {
  const p = emptyProject(labels.name ?? "CLI test (invented data)");
  const models = [newModel({ id: "m-1", eOverNMin: "8/3", label: labels.model ?? "DFSZ-type line" })];
  models.push(newModel({ id: "m-2", eOverNMin: "5/3", eOverNMax: "44/3", label: "Preferred window" }, { models }));
  const mass = Float64Array.from({ length: 200 }, (_, i) => 10 ** (-6 + (3 * i) / 199));
  const curves = [
    newCurve({
      id: "c-1",
      label: labels.curve ?? "Demo scan (invented)",
      role: "exclusion",
      massEv: mass,
      gInvGeV: mass.map((m) => 1e-13 * (1 + 0.3 * Math.sin(40 * Math.log10(m)))),
    }),
  ];
  curves.push(
    newCurve(
      {
        id: "c-2",
        label: "Demo reach (invented)",
        role: "projection",
        massEv: mass,
        gInvGeV: mass.map((m) => 3e-15 * (m / 1e-5) ** 0.5),
      },
      { curves },
    ),
  );
  return {
    ...p,
    models,
    curves,
    figure: {
      ...p.figure,
      preset: "single-column",
      massRangeEv: [1e-6, 1e-3],
      yRange: [1e-17, 1e-11],
      title: labels.title ?? "",
    },
  };
}

/** The project as the text of a .axband.json file. */
export function projectFileText(p: Project): string {
  return projectToFile(p);
}

export interface CliRun {
  status: number | null;
  stdout: string;
  stderr: string;
}

/**
 * Runs `node src/cli/run.mjs ARGS` (the package's bin) from the repository root and returns its exit code and
 * output; `ts: true` runs the TypeScript entry `tsx src/cli/render.ts` instead (slower: compiled on each start).
 */
export function runCli(args: string[], { ts = false } = {}): CliRun {
  const entry = ts ? ["--import", "tsx", "src/cli/render.ts"] : ["src/cli/run.mjs"];
  const r = spawnSync(process.execPath, [...entry, ...args], {
    cwd: REPO,
    encoding: "utf8",
    timeout: 60_000,
  });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** Runs the renderer's main() in-process and collects its exit code and messages. */
export async function runRender(argv: string[]): Promise<{ status: number; out: string; err: string }> {
  const out: string[] = [];
  const err: string[] = [];
  const status = await main(argv, { out: (s) => out.push(s), err: (s) => err.push(s) });
  return { status, out: out.join("\n"), err: err.join("\n") };
}
