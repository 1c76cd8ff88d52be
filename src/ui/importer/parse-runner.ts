// Runs one parse of an import source: in the Web Worker in a browser (so the page stays responsive and the
// arrays arrive as transferred buffers), or on the calling thread where there is no Worker (jsdom tests).
import { parseCurveSource, type CurveParseOptions, type CurveParseResult } from "../../data/csv";
import { importInWorker } from "./pending-data";

export interface ParseJob {
  promise: Promise<CurveParseResult>;
  cancel: () => void;
}

/** True where Web Workers exist (browsers); false in jsdom. */
export function workersAvailable(): boolean {
  return typeof Worker === "function";
}

/**
 * Starts parsing a file (or pasted text wrapped in a Blob).
 * @param onProgress fraction 0..1 of the bytes read
 */
export function startParse(source: Blob, opts: CurveParseOptions, onProgress: (fraction: number) => void): ParseJob {
  if (workersAvailable()) {
    const file = source instanceof File ? source : new File([source], opts.fileName ?? "paste", { type: "text/plain" });
    return importInWorker(file, opts, (p) => onProgress(typeof p === "number" ? p : p.fraction));
  }
  const ac = new AbortController();
  return {
    promise: readBytes(source).then((bytes) => parseCurveSource(bytes, opts, { signal: ac.signal, onProgress: (p) => onProgress(p.fraction) })),
    cancel: () => ac.abort(),
  };
}

/** The bytes of a Blob; FileReader where Blob.arrayBuffer is missing (older jsdom). */
function readBytes(blob: Blob): Promise<Uint8Array> {
  if (typeof blob.arrayBuffer === "function") return blob.arrayBuffer().then((b) => new Uint8Array(b));
  return new Promise((resolve, reject) => {
    const r = new FileReader();
    r.onload = () => resolve(new Uint8Array(r.result as ArrayBuffer));
    r.onerror = () => reject(r.error ?? new Error("The file could not be read."));
    r.readAsArrayBuffer(blob);
  });
}
