// Parses the renderer's CSV inputs, with their drawing preparation, on this thread and worker threads taking files
// from one queue, or on this thread with a worker preparing aside: 20 files of 100 000 rows are most of a run.
import { availableParallelism } from "node:os";
import { basename } from "node:path";
import { Worker } from "node:worker_threads";
import type { CurveParseResult } from "../formats/csv";
import { computePrepared, seedPreparedCurve, type PreparedTransfer } from "../plot/prepare-transfer";
import type { CliOptions } from "./args";
import { parseCsvFile } from "./read-input";

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
 * A parsed curve's drawing preparation for the g_aγγ view a CSV figure starts in (the one the figure would build on
 * first drawing, identical by construction; cached on this thread too); undefined when it has nothing to draw.
 */
export function prepareForFigure(
  r: { massEv: Float64Array; gInvGeV: Float64Array; fatal?: CurveParseResult["fatal"] },
  sorted: boolean,
): PreparedTransfer | undefined {
  return !r.fatal && r.massEv.length > 0 ? computePrepared(r.massEv, r.gInvGeV, sorted, { slopes: [0] }) : undefined;
}

/** A parsed curve for a worker to prepare for drawing (its arrays are copied to the worker). */
export interface PrepareJob {
  kind: "prepare";
  index: number;
  massEv: Float64Array;
  gInvGeV: Float64Array;
  sorted: boolean;
}

/** A worker's preparation of a {@link PrepareJob}'s curve; null when it could not make one. */
export interface PrepareReply {
  index: number;
  prepared: PreparedTransfer | null;
}

/** Most jobs a worker holds at once: the next file is there when one ends, even while this thread is parsing. */
const IN_FLIGHT = 2;

/** The CSV inputs of `opts` as parse jobs (a CSV figure starts in the g_aγγ view; regions keep file order). */
function jobsOf(opts: CliOptions): ParseJob[] {
  return opts.inputs
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
}

/** Yields to the event loop, so that workers' replies are taken and the workers fed between local files. */
const yieldToEvents = () => new Promise<void>((resolve) => setImmediate(resolve));

/**
 * A worker that prepares the curves this thread parses, while it parses the next file: `prepare` sends a copy
 * of the arrays, the answer is seeded into this thread's plot cache under the original ones; `finish` resolves
 * when every answer is in (or the worker failed: its curves are then prepared here when first drawn).
 */
function startPreparer(workerUrl: URL) {
  let worker: Worker | null = null;
  let exited: Promise<void> = Promise.resolve();
  const pending = new Map<number, PrepareJob>();
  try {
    const w = new Worker(workerUrl);
    worker = w;
    exited = new Promise<void>((done) => w.on("exit", () => done()));
    w.on("message", (reply: PrepareReply) => {
      const job = pending.get(reply.index);
      pending.delete(reply.index);
      if (job && reply.prepared) seedPreparedCurve(job.massEv, job.gInvGeV, job.sorted, reply.prepared);
    });
    w.on("error", () => undefined);
  } catch {
    worker = null;
  }
  return {
    prepare(job: PrepareJob): void {
      if (!worker) return;
      pending.set(job.index, job);
      worker.postMessage(job);
    },
    finish(): Promise<void> {
      worker?.postMessage(null);
      return exited;
    },
  };
}

/**
 * Parse results of the CSV inputs of `opts`, in input order, from this thread and up to `threads − 1` workers
 * running `workerUrl` (the bundled parse-worker), all taking files from one queue. A file parsed here is also
 * prepared for drawing here (into this thread's plot cache, as buildScene would prepare it); a worker's
 * preparation is seeded into the cache. An entry is undefined for a file not parsed (read error, worker
 * failure): the caller parses it again, so messages and output stay those of the serial path.
 * With one thread and `prepareAside`, this thread parses every file and one worker prepares each curve meanwhile.
 * Returns all-undefined without parsing anything for fewer than two CSV files, or one thread without
 * `prepareAside`. Never throws.
 * @param threads most threads parsing, this one included. @default os.availableParallelism()
 */
export async function parseCsvInParallel(
  opts: CliOptions,
  workerUrl: URL,
  threads: number = availableParallelism(),
  { prepareAside = false }: { prepareAside?: boolean } = {},
): Promise<(CurveParseResult | undefined)[]> {
  const jobs = jobsOf(opts);
  const results: (CurveParseResult | undefined)[] = new Array(opts.inputs.length).fill(undefined);
  if (jobs.length < 2 || (threads < 2 && !prepareAside)) return results;
  const preparer = threads < 2 ? startPreparer(workerUrl) : null;
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
      let held = 0;
      const feed = () => {
        // A second file only while the queue has one for every thread: the last ones go to whoever is free.
        while (held < IN_FLIGHT && next < jobs.length && (held === 0 || jobs.length - next >= threads)) {
          worker.postMessage(jobs[next++]);
          held++;
        }
        if (held === 0) worker.postMessage(null);
      };
      worker.on("message", (reply: ParseReply) => {
        held--;
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
      // A failed worker leaves its files undefined; the others go on, the caller parses what is missing.
      worker.on("error", () => undefined);
      worker.on("exit", () => done());
      feed();
    });
  const local = async () => {
    // First let the workers start and this thread begin loading the renderer (start.ts).
    await yieldToEvents();
    while (next < jobs.length) {
      const job = jobs[next++];
      try {
        const result = parseCsvFile(job.path, job);
        results[job.index] = result;
        const { massEv, gInvGeV } = result;
        // The preparation lands in this thread's cache under the arrays the curve is drawn from.
        if (!preparer) prepareForFigure(result, job.sorted);
        else if (!result.fatal && massEv.length > 0)
          preparer.prepare({ kind: "prepare", index: job.index, massEv, gInvGeV, sorted: job.sorted });
      } catch {
        // Parsed again by the caller, which reports the problem in its own words.
      }
      await yieldToEvents();
    }
  };
  // No more workers than files beside the one this thread takes.
  const workers = Math.max(0, Math.min(threads - 1, jobs.length - 1));
  await Promise.all([local(), ...Array.from({ length: workers }, runWorker)]);
  await preparer?.finish();
  return results;
}
