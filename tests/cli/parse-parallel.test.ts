// CSV parsing shared by the main thread and worker threads (src/cli/parse-parallel.ts): what the main thread
// parses equals the serial parse and is prepared into its plot cache; files held by a worker that fails are left
// for the caller; nothing is parsed for one file or one thread.
import { describe, expect, it } from "vitest";
import { writeFileSync } from "node:fs";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import { parseArgs } from "../../src/cli/args";
import { parseCsvInParallel } from "../../src/cli/parse-parallel";
import { parseCsvFile } from "../../src/cli/read-input";
import { cachedPrepared } from "../../src/plot/thinning/index";
import { mulberry32 } from "../../src/project/demo";
import { tempDir } from "./fixtures";

/** An invented curve file (not data from any experiment), masses shuffled so that drawing in mass order sorts. */
function invented(file: string, seed: number, rows: number): void {
  const r = mulberry32(seed);
  const lines = ["# invented test curve, not data from any experiment", "mass_eV,g_GeV^-1"];
  for (let i = 0; i < rows; i++)
    lines.push(`${(1e-6 * (1 + r())).toExponential(6)},${(1e-13 * (1 + r())).toExponential(6)}`);
  writeFileSync(file, lines.join("\n") + "\n");
}

function optionsFor(files: string[]) {
  const args = parseArgs([...files, "-o", "out.svg"]);
  if (!args.ok) throw new Error(args.error);
  return args.options;
}

describe("parseCsvInParallel", () => {
  it("parses on the main thread what a failing worker does not, as the serial parse does", async () => {
    const dir = tempDir("axband-parse-parallel-");
    const files = [0, 1, 2, 3, 4].map((i) => join(dir, `curve-${i}.csv`));
    files.forEach((f, i) => invented(f, 11 + i, 300));
    // A worker whose module throws as it loads: it takes files and answers none.
    const broken = join(dir, "broken-worker.mjs");
    writeFileSync(broken, 'throw new Error("this worker fails on purpose");\n');
    const results = await parseCsvInParallel(optionsFor(files), pathToFileURL(broken), 2);
    expect(results).toHaveLength(files.length);
    const parsed = results.flatMap((r, i) => (r ? [i] : []));
    // The worker held at most two files; the main thread took every other one.
    expect(parsed.length).toBeGreaterThanOrEqual(files.length - 2);
    for (const i of parsed) {
      const r = results[i]!;
      const serial = parseCsvFile(files[i], {});
      expect(Buffer.from(r.massEv.buffer).equals(Buffer.from(serial.massEv.buffer))).toBe(true);
      expect(Buffer.from(r.gInvGeV.buffer).equals(Buffer.from(serial.gInvGeV.buffer))).toBe(true);
      expect(r.messages).toEqual(serial.messages);
      // Prepared here for drawing in mass order (a CSV curve's default role), under the arrays returned.
      expect(cachedPrepared(r.massEv, r.gInvGeV, true)?.n).toBe(300);
    }
  });

  it("with one thread and preparation aside, parses every file here; a failing preparer leaves drawing to prepare", async () => {
    const dir = tempDir("axband-parse-parallel-");
    const files = [0, 1, 2].map((i) => join(dir, `curve-${i}.csv`));
    files.forEach((f, i) => invented(f, 31 + i, 200));
    const broken = join(dir, "broken-worker.mjs");
    writeFileSync(broken, 'throw new Error("this worker fails on purpose");\n');
    const results = await parseCsvInParallel(optionsFor(files), pathToFileURL(broken), 1, { prepareAside: true });
    results.forEach((r, i) => {
      const serial = parseCsvFile(files[i], {});
      expect(r && Buffer.from(r.massEv.buffer).equals(Buffer.from(serial.massEv.buffer))).toBe(true);
      // No preparation came back: the curve is prepared when first drawn.
      expect(cachedPrepared(r!.massEv, r!.gInvGeV, true)).toBeUndefined();
    });
  });

  it("parses nothing for a single file or a single thread (the caller parses in-process)", async () => {
    const dir = tempDir("axband-parse-parallel-");
    const files = [0, 1].map((i) => join(dir, `curve-${i}.csv`));
    files.forEach((f, i) => invented(f, 3 + i, 50));
    const url = pathToFileURL(join(dir, "unused-worker.mjs"));
    expect(await parseCsvInParallel(optionsFor(files.slice(0, 1)), url, 2)).toEqual([undefined]);
    expect(await parseCsvInParallel(optionsFor(files), url, 1)).toEqual([undefined, undefined]);
  });
});
