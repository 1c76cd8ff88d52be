// The bundled launcher that `npm run render` uses (src/cli/run.mjs): CSV files parsed and prepared for drawing by
// the main thread and worker threads together, or parsed on the main thread and prepared on a worker, give the same
// SVG bytes as doing both in-process, and as the TypeScript entry run through tsx (sorted curves and a closed
// region, whose preparations differ).
import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { accessSync, constants, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { REPO, runCli, tempDir } from "./fixtures";
import { mulberry32 } from "../../src/project/demo";

function invented(file: string, seed: number, rows: number): void {
  const r = mulberry32(seed);
  const lines = ["# invented test curve, not data from any experiment", "mass_eV,g_GeV^-1"];
  for (let i = 0; i < rows; i++)
    lines.push(`${(10 ** (-6 + (2 * i) / rows)).toExponential(6)},${(10 ** (-13 + r())).toExponential(6)}`);
  writeFileSync(file, lines.join("\n") + "\n");
}

/** Runs the launcher with AXBAND_PARSE_THREADS set to `threads`, or unset (the default) when it is null. */
function launch(
  args: string[],
  threads: string | null,
  script = "src/cli/run.mjs",
): { status: number | null; stderr: string } {
  const { AXBAND_PARSE_THREADS: _unset, ...inherited } = process.env;
  const env = threads === null ? inherited : { ...inherited, AXBAND_PARSE_THREADS: threads };
  const r = spawnSync(process.execPath, [script, ...args], { cwd: REPO, encoding: "utf8", timeout: 120_000, env });
  return { status: r.status, stderr: r.stderr };
}

describe("npm run render launcher", () => {
  it("gives the same bytes with parse workers, a preparing worker, in-process, and through the TypeScript entry", () => {
    const dir = tempDir("axband-launcher-");
    const files = [0, 1, 2].map((i) => join(dir, `curve-${i}.csv`));
    files.forEach((f, i) => invented(f, 7 + i, 2000));
    const common = [
      "--role",
      "exclusion",
      files[0],
      files[1],
      "--role",
      "region",
      files[2],
      "--model",
      "8/3",
      "--no-embed",
    ];
    // Parse threads, the main one included: 2 is the main thread and one worker, 3 two workers beside it; the
    // default on up to two CPUs parses on the main thread while a worker prepares the curves.
    const two = launch([...common, "-o", join(dir, "two.svg")], "2");
    const aside = launch([...common, "-o", join(dir, "default.svg")], null);
    expect(aside.status, aside.stderr).toBe(0);
    expect(two.status, two.stderr).toBe(0);
    const three = launch([...common, "-o", join(dir, "three.svg")], "3");
    expect(three.status, three.stderr).toBe(0);
    const one = launch([...common, "-o", join(dir, "one.svg")], "1");
    expect(one.status, one.stderr).toBe(0);
    const ts = runCli([...common, "-o", join(dir, "ts.svg")], { ts: true });
    expect(ts.status).toBe(0);
    const bytes = readFileSync(join(dir, "two.svg"), "utf8");
    expect(bytes).toContain("<svg");
    expect(bytes).toMatch(/id="curve-3-region"/);
    expect(readFileSync(join(dir, "one.svg"), "utf8")).toBe(bytes);
    expect(readFileSync(join(dir, "three.svg"), "utf8")).toBe(bytes);
    expect(readFileSync(join(dir, "default.svg"), "utf8")).toBe(bytes);
    expect(readFileSync(join(dir, "ts.svg"), "utf8")).toBe(bytes);
  });

  it("is the package's bin `axband`: an executable node script, `render` taken as the command's name", () => {
    const pkg = JSON.parse(readFileSync(join(REPO, "package.json"), "utf8")) as { bin?: Record<string, string> };
    const bin = pkg.bin?.axband;
    expect(bin).toBe("src/cli/run.mjs");
    const path = join(REPO, bin!);
    // A shebang naming node through env, and the executable bit (npm links bins to the file as it is).
    expect(readFileSync(path, "utf8").split("\n")[0]).toBe("#!/usr/bin/env node");
    expect(() => accessSync(path, constants.X_OK)).not.toThrow();
    const dir = tempDir("axband-bin-");
    const csv = join(dir, "curve.csv");
    invented(csv, 3, 500);
    const named = launch(["render", csv, "--no-embed", "-o", join(dir, "named.svg")], "1", bin);
    expect(named.status, named.stderr).toBe(0);
    const bare = launch([csv, "--no-embed", "-o", join(dir, "bare.svg")], "1", bin);
    expect(bare.status, bare.stderr).toBe(0);
    expect(readFileSync(join(dir, "named.svg"), "utf8")).toContain("<svg");
    expect(readFileSync(join(dir, "named.svg"), "utf8")).toBe(readFileSync(join(dir, "bare.svg"), "utf8"));
  });
});
