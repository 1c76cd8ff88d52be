// Runs one parse of an import source: in the Web Worker in a browser (so the page stays responsive and the
// arrays arrive as transferred buffers), or on the calling thread where there is no Worker (jsdom tests).
import { importInWorker, parseCurveText, type ParseOpts, type ParseResult } from "./pending-data";

export interface ParseJob {
  promise: Promise<ParseResult>;
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
export function startParse(source: Blob, opts: ParseOpts, onProgress: (fraction: number) => void): ParseJob {
  if (workersAvailable()) {
    const file = source instanceof File ? source : new File([source], opts.fileName ?? "paste", { type: "text/plain" });
    return importInWorker(file, opts, onProgress);
  }
  let cancelled = false;
  const promise = source.text().then((text) => {
    if (cancelled) throw new DOMException("The import was cancelled.", "AbortError");
    const r = parseCurveText(text, opts);
    onProgress(1);
    return r;
  });
  return {
    promise,
    cancel: () => {
      cancelled = true;
    },
  };
}
