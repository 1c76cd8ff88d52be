// Entry of the bundled command-line renderer (run.mjs): starts the CSV parse workers first, then loads the
// renderer, so that workers read and parse while this thread loads d3 and the plot core (then parses too).
import { availableParallelism } from "node:os";
import { parseArgs } from "./args";
import type { Io } from "./render";
import { parseCsvInParallel } from "./parse-parallel";

/**
 * Most threads parsing, this one included: AXBAND_PARSE_THREADS when set to a whole number ≥ 1, else the CPUs
 * available (one, i.e. in-process, on a single CPU). On a 2-core machine, 20 files of 100 000 rows: this thread
 * and one worker beat two workers with this thread waiting (each worker boots and warms up its own copy of the
 * parser; bench/NOTES.md, ninth session). The output bytes are the same either way.
 */
function parseThreads(): number {
  const n = Number(process.env.AXBAND_PARSE_THREADS);
  if (Number.isInteger(n) && n >= 1) return n;
  return Math.max(1, availableParallelism());
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
