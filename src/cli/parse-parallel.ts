// Parses the renderer's CSV inputs on worker threads (one file per worker at a time, results in file order),
// each with its drawing preparation: parsing 20 files of 100 000 rows is most of a run, and files are independent.
import { availableParallelism } from "node:os";
import { basename } from "node:path";
import { Worker } from "node:worker_threads";
import type { CurveParseResult } from "../formats/csv";
import { seedPreparedCurve, type PreparedTransfer } from "../plot/prepare-transfer";
import type { CliOptions } from "./args";

/** One file for a worker to read and parse. */
export interface ParseJob {
  index: number;
  path: string;
  fileName: string;
  massUnit?: string;
  couplingUnit?: string;
  /** Drawn in mass order (what drawsSorted says of a CSV curve of this role: all but regions). */
  sorted: boolean;
}

/** A worker's answer; `result` is null when it could not read or parse the file (the caller redoes it). */
export interface ParseReply {
  index: number;
  result: CurveParseResult | null;
  /** The curve's drawing preparation for the g_aγγ view (computePrepared), when the worker made one. */
  prepared?: PreparedTransfer;
}

/**
 * Parse results of the CSV inputs of `opts`, in input order, from up to `threads` workers running
 * `workerUrl` (the bundled parse-worker). An entry is undefined for a file no worker parsed (read error,
 * worker failure): the caller parses it in-process, so messages and output stay those of the serial path.
 * Returns all-undefined without starting a worker for fewer than two CSV files or a single CPU.
 * Never throws.
 * @param threads most workers to start. @default os.availableParallelism()
 */
export async function parseCsvInWorkers(
  opts: CliOptions,
  workerUrl: URL,
  threads: number = availableParallelism(),
): Promise<(CurveParseResult | undefined)[]> {
  const jobs: ParseJob[] = opts.inputs
    // A CSV curve keeps its file order only as a region (inputs.ts), and a CSV figure starts in the g_aγγ view.
    .map((input, index) => ({
      index,
      path: input.path,
      fileName: basename(input.path),
      massUnit: opts.massUnit,
      couplingUnit: opts.couplingUnit,
      sorted: input.role !== "region",
      kind: input.kind,
    }))
    .filter((j) => j.kind === "csv")
    .map(({ kind: _kind, ...job }) => job);
  const results: (CurveParseResult | undefined)[] = new Array(opts.inputs.length).fill(undefined);
  const count = Math.min(threads, jobs.length);
  if (jobs.length < 2 || count < 2) return results;
  let next = 0;
  const runWorker = () =>
    new Promise<void>((done) => {
      let worker: Worker;
      try {
        worker = new Worker(workerUrl);
      } catch {
        done();
        return;
      }
      const feed = () => worker.postMessage(next < jobs.length ? jobs[next++] : null);
      worker.on("message", (reply: ParseReply) => {
        if (reply.result) {
          results[reply.index] = reply.result;
          // Into this thread's plot cache under the arrays the curve is drawn from; a misfit is ignored (prepared when drawn).
          if (reply.prepared)
            seedPreparedCurve(
              reply.result.massEv,
              reply.result.gInvGeV,
              jobs.find((j) => j.index === reply.index)?.sorted ?? true,
              reply.prepared,
            );
        }
        feed();
      });
      // A failed worker leaves its file undefined; the others go on, the caller parses what is missing.
      worker.on("error", () => undefined);
      worker.on("exit", () => done());
      feed();
    });
  await Promise.all(Array.from({ length: count }, runWorker));
  return results;
}
