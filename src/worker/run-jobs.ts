// The runs worker's jobs (runs-worker.ts runs them, runs-client.ts sends them): the run thinning of chunks of a
// file-order curve at one level, from the worker's own copy of the curve's arrays, by the same code the page uses.
import { thinRunChunk } from "../plot/thinning/runs";

/** Messages to the runs worker. */
export type RunsRequest =
  /** A copy of one y view's arrays (prep.lm, va.v), kept under `key` until dropped. */
  | { type: "data"; key: number; lm: Float64Array; v: Float64Array }
  | { type: "drop"; key: number }
  /** Thin these chunks of the arrays under `key` with run sizes tx, ty (see thinRunsLog). */
  | { type: "runs"; id: number; key: number; tx: number; ty: number; chunks: Int32Array };

/** Messages from the runs worker: chunk k's indices are indices[offsets[k] … offsets[k+1]). */
export type RunsResponse =
  | { type: "runs"; id: number; offsets: Int32Array; indices: Int32Array }
  | { type: "error"; id: number; message: string };

/** The run thinning of the given chunks, concatenated (what thinRunChunk gives chunk by chunk). */
export function thinRunChunks(
  lm: Float64Array,
  v: Float64Array,
  tx: number,
  ty: number,
  chunks: ArrayLike<number>,
): { offsets: Int32Array; indices: Int32Array } {
  const parts: Int32Array[] = [];
  const offsets = new Int32Array(chunks.length + 1);
  for (let k = 0; k < chunks.length; k++) {
    const idx = thinRunChunk(lm, v, chunks[k], tx, ty);
    parts.push(idx);
    offsets[k + 1] = offsets[k] + idx.length;
  }
  const indices = new Int32Array(offsets[chunks.length]);
  for (let k = 0; k < parts.length; k++) indices.set(parts[k], offsets[k]);
  return { offsets, indices };
}

/**
 * The worker's message handler, apart from the worker scope so that tests can drive it: keeps the arrays it is
 * sent and answers each job with its chunks' indices (transferred).
 */
export function createRunsHandler(post: (msg: RunsResponse, transfer: Transferable[]) => void) {
  const data = new Map<number, { lm: Float64Array; v: Float64Array }>();
  return (msg: RunsRequest): void => {
    if (msg.type === "data") data.set(msg.key, { lm: msg.lm, v: msg.v });
    else if (msg.type === "drop") data.delete(msg.key);
    else {
      const arrays = data.get(msg.key);
      if (!arrays) return post({ type: "error", id: msg.id, message: `no arrays under key ${msg.key}` }, []);
      const r = thinRunChunks(arrays.lm, arrays.v, msg.tx, msg.ty, msg.chunks);
      post({ type: "runs", id: msg.id, ...r }, [r.offsets.buffer, r.indices.buffer]);
    }
  };
}
