// Entry of the bundled command-line renderer (run.mjs): starts the CSV parse workers first, then loads the
// renderer, so that workers read and parse while this thread spends its start-up loading zod, d3 and the plot core.
import { availableParallelism } from "node:os";
import { parseArgs } from "./args";
import type { Io } from "./render";
import { parseCsvInWorkers } from "./parse-parallel";

/**
 * Most parse workers: AXBAND_PARSE_THREADS when set to a whole number ≥ 1, else the CPUs available (one, i.e.
 * in-process, on a single CPU). Measured with bench/render.mjs on a 2-core machine, 20 files of 100 000 rows:
 * idle, two workers 1.74 s against 2.14 s in-process; with the machine busy the two were about even (each
 * worker boots and warms up its own copy of the parser). The output bytes are the same either way.
 */
function parseThreads(): number {
  const n = Number(process.env.AXBAND_PARSE_THREADS);
  if (Number.isInteger(n) && n >= 1) return n;
  return Math.max(1, availableParallelism());
}

/**
 * Runs the renderer on argv (as render.ts's main) and resolves to its exit code, with several CSV inputs
 * read and parsed on worker threads running `parseWorker` (the bundled parse-worker.ts). Output and
 * messages are those of main(): any file a worker did not parse is parsed in-process.
 * AXBAND_PARSE_THREADS=n in the environment caps the workers (1: parse in-process, to compare timings).
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
      ? parseCsvInWorkers(args.options, options.parseWorker, parseThreads())
      : Promise.resolve([]);
  const render = await import("./render");
  return render.mainWithPreParsed(argv, io ?? render.consoleIo, await pending);
}
