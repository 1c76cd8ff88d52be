// Runs one parse of an import source through the import worker client: in the Web Worker in a browser (the
// page stays responsive and the arrays arrive as transferred buffers). Where there is no Worker (jsdom
// tests) the client parses on the calling thread; the bytes are read first because jsdom's Blob has no stream().
import type { CurveParseOptions, CurveParseResult } from "../../data";
import { importInWorker, importWorkerAvailable } from "../../worker/import-client";

export interface ParseJob {
  promise: Promise<CurveParseResult>;
  cancel: () => void;
}

/**
 * Starts parsing a file (or pasted text wrapped in a Blob).
 * @param onProgress fraction 0..1 of the bytes read
 */
export function startParse(source: Blob, opts: CurveParseOptions, onProgress: (fraction: number) => void): ParseJob {
  if (importWorkerAvailable() || typeof source.stream === "function") return importInWorker(source, opts, onProgress);
  let cancelled = false;
  let inner: ParseJob | null = null;
  const promise = readBytes(source).then((bytes) => {
    if (cancelled) throw new DOMException("import cancelled", "AbortError");
    inner = importInWorker(bytes, opts, onProgress);
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
