// Module Web Worker that parses curve files off the main thread: reads a File/Blob, bytes or text in slices,
// posts progress, honours cancel, and returns the arrays as transferred buffers (no copy on arrival).
import { isImportCancelled, parseCurveSource, type CurveParseOptions } from "../data/csv";
import type { ImportRequest, ImportResponse } from "./import-client";

// The tsconfig mixes DOM and WebWorker libs; inside this file `self` is the dedicated worker scope.
const scope = self as unknown as {
  onmessage: ((ev: MessageEvent<ImportRequest>) => void) | null;
  postMessage(message: ImportResponse, transfer?: Transferable[]): void;
};

const running = new Map<number, AbortController>();

async function run(id: number, source: string | ArrayBuffer | Blob, opts: CurveParseOptions): Promise<void> {
  const controller = new AbortController();
  running.set(id, controller);
  try {
    const result = await parseCurveSource(source, opts, {
      signal: controller.signal,
      onProgress: (p) => scope.postMessage({ type: "progress", id, fraction: p.fraction, lines: p.lines }),
    });
    scope.postMessage({ type: "result", id, result }, [result.massEv.buffer, result.gInvGeV.buffer]);
  } catch (err) {
    if (isImportCancelled(err)) scope.postMessage({ type: "cancelled", id });
    else scope.postMessage({ type: "error", id, message: err instanceof Error ? err.message : String(err) });
  } finally {
    running.delete(id);
  }
}

scope.onmessage = (ev) => {
  const msg = ev.data;
  if (msg.type === "cancel") running.get(msg.id)?.abort();
  else if (msg.type === "parse") void run(msg.id, msg.source, msg.opts);
};
