// Module Web Worker that parses curve files in slices off the main thread (progress, cancel), returns the arrays
// as transferred buffers and builds the curve's drawing preparation, so the first scene is quick.
import { isImportCancelled, parseCurveSource, type CurveParseOptions } from "../formats/csv";
import {
  computePrepared,
  preparedTransferables,
  type PrepareSpec,
  type PreparedTransfer,
} from "../plot/prepare-transfer";
import type { ImportRequest, ImportResponse } from "./import-client";

// The tsconfig mixes DOM and WebWorker libs; inside this file `self` is the dedicated worker scope.
const scope = self as unknown as {
  onmessage: ((ev: MessageEvent<ImportRequest>) => void) | null;
  postMessage(message: ImportResponse, transfer?: Transferable[]): void;
};

const running = new Map<number, AbortController>();

/** The preparation for a spec, or null when there is nothing to prepare or it failed (then the page builds it). */
function prepareFor(
  massEv: Float64Array,
  gInvGeV: Float64Array,
  spec: PrepareSpec | undefined,
): PreparedTransfer | null {
  if (!spec || massEv.length === 0) return null;
  try {
    return computePrepared(massEv, gInvGeV, spec.sorted, { slopes: spec.slopes });
  } catch {
    return null;
  }
}

async function run(
  id: number,
  source: string | ArrayBuffer | Blob,
  opts: CurveParseOptions,
  spec?: PrepareSpec,
): Promise<void> {
  const controller = new AbortController();
  running.set(id, controller);
  try {
    const result = await parseCurveSource(source, opts, {
      signal: controller.signal,
      onProgress: (p) => scope.postMessage({ type: "progress", id, fraction: p.fraction, lines: p.lines }),
    });
    const prepared = result.fatal ? null : prepareFor(result.massEv, result.gInvGeV, spec);
    const transfer: Transferable[] = [result.massEv.buffer, result.gInvGeV.buffer];
    if (prepared) for (const b of preparedTransferables(prepared)) if (!transfer.includes(b)) transfer.push(b);
    scope.postMessage({ type: "result", id, result, prepared }, transfer);
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
  else if (msg.type === "parse") void run(msg.id, msg.source, msg.opts, msg.prepare);
  else if (msg.type === "prepare") {
    const prepared = prepareFor(msg.massEv, msg.gInvGeV, msg.spec);
    scope.postMessage({ type: "prepared", id: msg.id, prepared }, prepared ? preparedTransferables(prepared) : []);
  }
};
