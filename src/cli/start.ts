// Entry of the bundled command-line renderer (run.mjs): starts any CSV parse workers first (more than two CPUs),
// then loads the renderer, so that workers parse while this thread loads d3 and the plot core (then parses too).
import { availableParallelism } from "node:os";
import { parseArgs } from "./args";
import type { Io } from "./render";
import { parseCsvInParallel } from "./parse-parallel";

/**
 * Most threads parsing, this one included: AXBAND_PARSE_THREADS when set to a whole number ≥ 1; else one
 * (in-process) on up to two CPUs and one per CPU on more. On a 2-core machine, 20 files of 100 000 rows
 * (bench/NOTES.md, ninth session): idle, this thread with one worker and this thread alone took the same wall
 * time (~0.9 s); with other work running, alone was faster (1.7 s against 2.1 s), and it always took less CPU:
 * a worker boots and warms up its own copy of the parser, and V8's background compiling and GC threads need the
 * second core. The output bytes are the same either way.
 */
function parseThreads(): number {
  const n = Number(process.env.AXBAND_PARSE_THREADS);
  if (Number.isInteger(n) && n >= 1) return n;
  const cpus = availableParallelism();
  return cpus <= 2 ? 1 : cpus;
}

/**
 * Runs the renderer on argv (as render.ts's main) and resolves to its exit code, with several CSV inputs
 * read and parsed on this thread and worker threads running `parseWorker` (the bundled parse-worker.ts).
 * Output and messages are those of main(): any file left unparsed is parsed in-process as main() would.
 * AXBAND_PARSE_THREADS=n in the environment caps the threads (1: no worker, to compare timings).
 * @param io where messages go. @default stdout and stderr
 */
export async function mainAsync(
  argv: readonly string[],
  io?: Io,
  options: { parseWorker?: URL } = {},
): Promise<number> {
  const args = parseArgs(argv);
  const pending =
    args.ok && !args.options.help && options.parseWorker
      ? parseCsvInParallel(args.options, options.parseWorker, parseThreads())
      : Promise.resolve([]);
  const render = await import("./render");
  return render.mainWithPreParsed(argv, io ?? render.consoleIo, await pending);
}
