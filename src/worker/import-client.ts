// Main-thread side of the curve import: parses in the shared import Web Worker (jobs by id, progress, cancel) or
// sliced on the calling thread without Workers, and caches the drawing preparation built in the worker.
import type { CurveParseOptions, CurveParseResult, ImportProgress } from "../formats/csv";
import { ImportCancelled } from "../formats/csv/cancel";
import { seedPreparedCurve, type PrepareSpec, type PreparedTransfer } from "../plot/prepare-transfer";

/** Messages to the worker. */
export type ImportRequest =
  | { type: "parse"; id: number; source: string | ArrayBuffer | Blob; opts: CurveParseOptions; prepare?: PrepareSpec }
  | { type: "prepare"; id: number; massEv: Float64Array; gInvGeV: Float64Array; spec: PrepareSpec }
  | { type: "cancel"; id: number };

/** Messages from the worker. */
export type ImportResponse =
  | { type: "progress"; id: number; fraction: number; lines: number }
  | { type: "result"; id: number; result: CurveParseResult; prepared?: PreparedTransfer | null }
  | { type: "prepared"; id: number; prepared: PreparedTransfer | null }
  | { type: "cancelled"; id: number }
  | { type: "error"; id: number; message: string };

export interface ImportJob {
  /**
   * The parse result (a file that gives no curve resolves with `fatal` set, it does not reject). Rejects
   * with an error named "AbortError" after cancel() (test with isImportCancelled), or on a worker failure.
   */
  promise: Promise<CurveParseResult>;
  /** Stops the parse; the promise then rejects with an AbortError. */
  cancel(): void;
}

/** Called with the fraction 0..1 of the input read, and the lines read so far. */
export type ProgressCallback = (fraction: number, progress: ImportProgress) => void;

interface Pending {
  resolve: (r: CurveParseResult) => void;
  reject: (e: Error) => void;
  onProgress?: ProgressCallback;
  /** Re-run on the main thread if the worker dies before answering. */
  fallback: () => void;
}

let worker: Worker | null = null;
let workerBroken = false;
let nextId = 1;
const pending = new Map<number, Pending>();
/** Preparation jobs ({@link prepareInWorker}) by id; resolved with false when the worker fails. */
const preparing = new Map<
  number,
  { resolve: (seeded: boolean) => void; massEv: Float64Array; gInvGeV: Float64Array; sorted: boolean }
>();
/** Set to false to force the main-thread path (tests, benchmarks). */
let workerAllowed = true;

/** Chooses whether imports may use the Worker (true, the default) or always run on the calling thread. */
export function setImportWorkerEnabled(enabled: boolean): void {
  workerAllowed = enabled;
}

/** True when imports run in a Web Worker here. */
export function importWorkerAvailable(): boolean {
  return workerAllowed && !workerBroken && typeof Worker === "function";
}

function getWorker(): Worker | null {
  if (!importWorkerAvailable()) return null;
  if (worker) return worker;
  try {
    worker = new Worker(new URL("./import-worker.ts", import.meta.url), { type: "module" });
  } catch {
    workerBroken = true;
    return null;
  }
  worker.onmessage = (ev: MessageEvent<ImportResponse>) => {
    const msg = ev.data;
    if (msg.type === "prepared") {
      const p = preparing.get(msg.id);
      if (!p) return;
      preparing.delete(msg.id);
      p.resolve(!!msg.prepared && seedPreparedCurve(p.massEv, p.gInvGeV, p.sorted, msg.prepared));
      return;
    }
    const job = pending.get(msg.id);
    if (!job) return;
    if (msg.type === "progress") {
      job.onProgress?.(msg.fraction, { fraction: msg.fraction, lines: msg.lines });
      return;
    }
    pending.delete(msg.id);
    if (msg.type === "result") {
      // Seeded under the arrays that arrived with it: the curve made from this result is drawn from them.
      if (msg.prepared) seedPreparedCurve(msg.result.massEv, msg.result.gInvGeV, msg.prepared.sorted, msg.prepared);
      job.resolve(msg.result);
    } else if (msg.type === "cancelled") job.reject(new ImportCancelled());
    else job.reject(new Error(`import failed: ${msg.message}`));
  };
  // A worker that cannot load (blocked module worker, CSP) must not lose the import: redo it here.
  worker.onerror = (ev) => {
    ev.preventDefault?.();
    workerBroken = true;
    worker?.terminate();
    worker = null;
    const jobs = [...pending.values()];
    pending.clear();
    for (const job of jobs) job.fallback();
    for (const p of preparing.values()) p.resolve(false);
    preparing.clear();
  };
  return worker;
}

/** Stops the shared worker (it is started again by the next import). */
export function disposeImportWorker(): void {
  worker?.terminate();
  worker = null;
  for (const job of pending.values()) job.reject(new ImportCancelled());
  pending.clear();
  for (const p of preparing.values()) p.resolve(false);
  preparing.clear();
}

// The parser itself loads only where this thread parses (no worker, or a preview), apart from the first figure.
const loadParser = () => import("../formats/csv");

async function onMainThread(
  source: File | Blob | string | ArrayBuffer,
  opts: CurveParseOptions,
  onProgress: ProgressCallback | undefined,
  signal: AbortSignal,
): Promise<CurveParseResult> {
  const { parseCurveSource } = await loadParser();
  // Short slices keep the page responsive even without a worker.
  return parseCurveSource(source, opts, {
    signal,
    yieldMs: 30,
    sliceChars: 1 << 18,
    onProgress: onProgress ? (p) => onProgress(p.fraction, p) : undefined,
  });
}

/**
 * Parses a file, Blob, text or bytes in the import worker (main-thread fallback where there is no Worker).
 * `opts.fileName` defaults to the File's name. Files over MAX_IMPORT_BYTES, empty or binary files resolve
 * at once with `fatal` set and nothing parsed.
 * @param onProgress called with the fraction 0..1 read (throttled to steps of 0.5 % or more)
 * @param prepare the drawing preparation the worker builds after parsing and this thread puts into the plot
 *   cache (see prepare-transfer.ts); none when omitted or on the same-thread path.
 */
export function importInWorker(
  source: File | Blob | string | ArrayBuffer,
  opts: CurveParseOptions = {},
  onProgress?: ProgressCallback,
  prepare?: PrepareSpec,
): ImportJob {
  const o: CurveParseOptions = { ...opts };
  if (o.fileName === undefined && typeof File === "function" && source instanceof File) o.fileName = source.name;
  const controller = new AbortController();
  let resolve!: (r: CurveParseResult) => void;
  let reject!: (e: Error) => void;
  const promise = new Promise<CurveParseResult>((res, rej) => {
    resolve = res;
    reject = rej;
  });
  const local = () => onMainThread(source, o, onProgress, controller.signal).then(resolve, reject);

  const w = getWorker();
  if (!w) {
    void local();
    return { promise, cancel: () => controller.abort() };
  }
  const id = nextId++;
  pending.set(id, { resolve, reject, onProgress, fallback: () => void local() });
  try {
    w.postMessage({ type: "parse", id, source, opts: o, prepare } satisfies ImportRequest);
  } catch {
    pending.delete(id);
    void local();
  }
  return {
    promise,
    cancel: () => {
      controller.abort();
      if (pending.has(id)) w.postMessage({ type: "cancel", id } satisfies ImportRequest);
    },
  };
}

/**
 * Builds a curve's drawing preparation in the import worker from copies of its arrays and puts it into the
 * plot cache under the arrays given (used when the import step's role or order changed after the parse, and
 * for big curves that reach the store another way: src/ui/store/preparation.ts).
 * @returns true when it was seeded; false without a worker or on failure (the page then prepares it lazily).
 */
export function prepareInWorker(massEv: Float64Array, gInvGeV: Float64Array, spec: PrepareSpec): Promise<boolean> {
  const w = getWorker();
  if (!w) return Promise.resolve(false);
  const id = nextId++;
  return new Promise<boolean>((resolve) => {
    preparing.set(id, { resolve, massEv, gInvGeV, sorted: spec.sorted });
    try {
      // The page keeps its own arrays: copies go, transferred. For a million points slice() and transfer
      // took 15–27 ms here against 24–75 ms for structured cloning in postMessage (Chromium, 2 busy cores).
      const m = massEv.slice();
      const g = gInvGeV.slice();
      w.postMessage({ type: "prepare", id, massEv: m, gInvGeV: g, spec } satisfies ImportRequest, [m.buffer, g.buffer]);
    } catch {
      preparing.delete(id);
      resolve(false);
    }
  });
}

/** How much of a file {@link previewFile} reads. */
export const PREVIEW_BYTES = 64 * 1024;

/**
 * A quick look at a file for the import step: checks (size cap, binary, empty) and parses only its first
 * {@link PREVIEW_BYTES} on the calling thread. The result is `truncated` when the file is longer; its
 * detected delimiter, header, units and preview rows are those the full import will find.
 */
export async function previewFile(file: Blob, opts: CurveParseOptions = {}): Promise<CurveParseResult> {
  const o: CurveParseOptions = { ...opts };
  if (o.fileName === undefined && typeof File === "function" && file instanceof File) o.fileName = file.name;
  const { checkImportFile, createCurveParser } = await loadParser();
  const bytes = new Uint8Array(await file.slice(0, PREVIEW_BYTES).arrayBuffer());
  const check = checkImportFile({ name: o.fileName, size: file.size, firstBytes: bytes.subarray(0, 4096) });
  if (!check.ok) {
    const r = createCurveParser(o).finish();
    return {
      ...r,
      fatal: check.problem,
      messages: [{ level: "error", text: `${o.fileName ?? "input"}: ${check.problem.message}` }],
    };
  }
  let text = new TextDecoder(check.encoding).decode(bytes);
  const complete = file.size <= PREVIEW_BYTES;
  if (!complete) {
    // The byte cut may break the last line: leave it out.
    const nl = Math.max(text.lastIndexOf("\n"), text.lastIndexOf("\r"));
    if (nl >= 0) text = text.slice(0, nl + 1);
  }
  const parser = createCurveParser(o);
  parser.push(text);
  const r = parser.finish();
  return complete ? r : { ...r, truncated: true };
}
