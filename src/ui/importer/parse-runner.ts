// Runs one parse of an import source through the import worker client (the calling thread where there is no
// Worker), with the curve's drawing preparation built alongside.
import type { CurveParseOptions, CurveParseResult } from "../../data";
import { hasPrepared, type PrepareSpec } from "../../plot/prepare-transfer";
import { importInWorker, importWorkerAvailable, prepareInWorker } from "../../worker/import-client";

export interface ParseJob {
  promise: Promise<CurveParseResult>;
  cancel: () => void;
}

/**
 * Starts parsing a file (or pasted text wrapped in a Blob).
 * @param onProgress fraction 0..1 of the bytes read
 * @param prepare the drawing preparation the worker should build too (see prepareSpecOf)
 */
export function startParse(
  source: Blob,
  opts: CurveParseOptions,
  onProgress: (fraction: number) => void,
  prepare?: PrepareSpec,
): ParseJob {
  if (importWorkerAvailable() || typeof source.stream === "function")
    return importInWorker(source, opts, onProgress, prepare);
  // No Worker and no Blob.stream() (jsdom tests): read the bytes first; the client then parses on this thread.
  let cancelled = false;
  let inner: ParseJob | null = null;
  const promise = readBytes(source).then((bytes) => {
    if (cancelled) throw new DOMException("import cancelled", "AbortError");
    inner = importInWorker(bytes, opts, onProgress, prepare);
    return inner.promise;
  });
  return {
    promise,
    cancel: () => {
      cancelled = true;
      inner?.cancel();
    },
  };
}

/** Points from which a curve's preparation goes to the worker; below it, it takes a few ms on the page. */
export const PREPARE_OFF_THREAD_POINTS = 50_000;

/**
 * Makes sure a large parsed curve's drawing preparation for the final settings is in the plot cache before
 * the curve is added (the parse prepared for the settings at that time; role, order or view may have changed).
 */
export async function ensurePrepared(
  r: Pick<CurveParseResult, "massEv" | "gInvGeV">,
  spec: PrepareSpec,
): Promise<void> {
  if (r.massEv.length < PREPARE_OFF_THREAD_POINTS || !importWorkerAvailable() || hasPrepared(r.massEv, r.gInvGeV, spec))
    return;
  await prepareInWorker(r.massEv, r.gInvGeV, spec);
}

/** The bytes of a Blob; FileReader where Blob.arrayBuffer is missing too. */
function readBytes(blob: Blob): Promise<ArrayBuffer> {
  if (typeof blob.arrayBuffer === "function") return blob.arrayBuffer();
  return new Promise((resolve, reject) => {
    const r = new FileReader();
    r.onload = () => resolve(r.result as ArrayBuffer);
    r.onerror = () => reject(r.error ?? new Error("The file could not be read."));
    r.readAsArrayBuffer(blob);
  });
}
