// Entry of the bundled command-line renderer (run.mjs): starts the CSV workers first, then loads the renderer,
// so that workers start while this thread loads d3 and the plot core (then parses).
import { availableParallelism } from "node:os";
import { parseArgs } from "./args";
import type { Io } from "./render";
import { parseCsvInParallel } from "./parse-parallel";

/**
 * How CSV files are parsed: AXBAND_PARSE_THREADS=n (a whole number ≥ 1) threads, this one included, taking files
 * from one queue (1: all in-process, nothing aside); by default, on up to two CPUs this thread parses every file
 * while one worker prepares each parsed curve for drawing, and on more one thread per CPU parses. On a 2-core
 * machine, 20 files of 100 000 rows (bench/NOTES.md, ninth session), median wall and CPU: preparing aside 1.13 s
 * and 1.84 s, one worker parsing beside this thread 1.22 s and 2.08 s, all in-process 1.29 s and 1.63 s: a
 * parsing worker boots and warms up its own copy of the parser, a preparing one only small loops. The output
 * bytes are the same either way.
 */
function parseMode(): { threads: number; prepareAside: boolean } {
  const n = Number(process.env.AXBAND_PARSE_THREADS);
  if (Number.isInteger(n) && n >= 1) return { threads: n, prepareAside: false };
  const cpus = availableParallelism();
  return cpus <= 2 ? { threads: 1, prepareAside: true } : { threads: cpus, prepareAside: false };
}

/**
 * Runs the renderer on argv (as render.ts's main) and resolves to its exit code, with several CSV inputs
 * read, parsed and prepared on this thread and worker threads running `parseWorker` (the bundled parse-worker.ts).
 * Output and messages are those of main(): any file left unparsed is parsed in-process as main() would.
 * AXBAND_PARSE_THREADS=n in the environment sets the parsing threads (1: no worker, to compare timings).
 * @param io where messages go. @default stdout and stderr
 */
export async function mainAsync(
  argv: readonly string[],
  io?: Io,
  options: { parseWorker?: URL } = {},
): Promise<number> {
  const args = parseArgs(argv);
  const mode = parseMode();
  const pending =
    args.ok && !args.options.help && options.parseWorker
      ? parseCsvInParallel(args.options, options.parseWorker, mode.threads, mode)
      : Promise.resolve([]);
  const render = await import("./render");
  return render.mainWithPreParsed(argv, io ?? render.consoleIo, await pending);
}
