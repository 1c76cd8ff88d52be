// Which modules a command-line run loads (src/cli/bundle-options.mjs, the launcher's bundle): CSV files to SVG
// load neither the schema validator (zod) nor the PDF code, and the parse workers only the CSV parser and the
// drawing preparation; a project file, an exported SVG or PDF, or PDF output load them on demand.
import { describe, expect, it } from "vitest";
import { build, type Metafile } from "esbuild";
import { REPO } from "./fixtures";
// @ts-expect-error: a plain .mjs module of the launcher, without type declarations
import { bundleOptions } from "../../src/cli/bundle-options.mjs";

type Outputs = Metafile["outputs"];

/** The bundle's outputs, built in memory as the launcher builds them. */
async function bundleOutputs(): Promise<Outputs> {
  const r = await build({ ...bundleOptions(REPO, "/tmp/axband-lazy-modules"), write: false, metafile: true });
  if (!r.metafile) throw new Error("esbuild gave no metafile");
  return r.metafile.outputs;
}

function outputOf(outputs: Outputs, entry: string): string {
  const name = Object.keys(outputs).find((k) => outputs[k].entryPoint?.endsWith(entry));
  if (!name) throw new Error(`no output for ${entry}`);
  return name;
}

/** Source files in an output and in every output it imports statically (what loading it loads). */
function staticInputs(outputs: Outputs, name: string, seen = new Set<string>()): Set<string> {
  if (seen.has(name)) return new Set();
  seen.add(name);
  const files = new Set(Object.keys(outputs[name].inputs));
  for (const i of outputs[name].imports)
    if (i.kind === "import-statement" && !i.external) for (const f of staticInputs(outputs, i.path, seen)) files.add(f);
  return files;
}

const has = (files: Set<string>, part: string) => [...files].some((f) => f.includes(part));

describe("modules a command-line run loads", () => {
  it("CSV to SVG loads no schema validator and no PDF code; the parse worker only the parser", async () => {
    const outputs = await bundleOutputs();
    // start.ts, then render.ts (imported once the workers run): what a CSV-to-SVG run loads.
    const csvRun = new Set([
      ...staticInputs(outputs, outputOf(outputs, "src/cli/start.ts")),
      ...staticInputs(outputs, outputOf(outputs, "src/cli/render.ts")),
    ]);
    expect(has(csvRun, "src/cli/render.ts")).toBe(true);
    expect(has(csvRun, "src/plot/scene.ts")).toBe(true);
    for (const heavy of [
      "node_modules/zod/",
      "src/project/schema.ts",
      "src/project/restore.ts",
      "node_modules/pdf-lib/",
    ])
      expect(has(csvRun, heavy), heavy).toBe(false);

    const worker = staticInputs(outputs, outputOf(outputs, "src/cli/parse-worker.ts"));
    expect(has(worker, "src/formats/csv/parser.ts")).toBe(true);
    for (const heavy of ["node_modules/zod/", "src/plot/scene.ts", "src/cli/render.ts", "src/project/defaults.ts"])
      expect(has(worker, heavy), heavy).toBe(false);

    // The validator and the PDF code are there, for the inputs and outputs that need them.
    expect(has(staticInputs(outputs, outputOf(outputs, "src/cli/project-input.ts")), "node_modules/zod/")).toBe(true);
    expect(has(staticInputs(outputs, outputOf(outputs, "src/formats/figure-pdf.ts")), "node_modules/pdf-lib/")).toBe(
      true,
    );
  });
});
