// Curve arrays cut into ~1 MiB chunks for IndexedDB and put back together (the record layout autosave uses).
// Pure: no storage here, so the layout can be tested without a database.

export interface CurveArrays {
  massEv: Float64Array;
  gInvGeV: Float64Array;
}

/** Points per stored chunk: 2 × 8 bytes × 65,536 = 1 MiB, a few ms of structured cloning per put. */
export const CHUNK_POINTS = 65_536;

/** The record stored under a curve's id; its data follow in `chunks` records keyed by {@link chunkKey}. */
export interface ChunkedHead {
  v: 1;
  length: number;
  chunks: number;
}

/** Key of chunk k of a curve ("\u0000" cannot appear in ids the app makes, and sorts first). */
export function chunkKey(id: string, k: number): string {
  return `${id}\u0000${String(k).padStart(6, "0")}`;
}

/** The head record of a curve's arrays cut into chunks of at most `size` points. */
export function chunkHead(data: CurveArrays, size = CHUNK_POINTS): ChunkedHead {
  const n = Math.min(data.massEv.length, data.gInvGeV.length);
  return { v: 1, length: n, chunks: Math.ceil(n / size) };
}

/** Chunk k of a curve's arrays: a copy, so it clones only its own bytes. */
export function chunkOf(data: CurveArrays, k: number, size = CHUNK_POINTS): CurveArrays {
  const n = Math.min(data.massEv.length, data.gInvGeV.length);
  const i = k * size;
  const j = Math.min(n, i + size);
  return { massEv: data.massEv.slice(i, j), gInvGeV: data.gInvGeV.slice(i, j) };
}

/** A curve's arrays cut into copies of at most `size` points (copies, so each clones only its own bytes). */
export function splitChunks(data: CurveArrays, size = CHUNK_POINTS): { head: ChunkedHead; chunks: CurveArrays[] } {
  const head = chunkHead(data, size);
  return { head, chunks: Array.from({ length: head.chunks }, (_, k) => chunkOf(data, k, size)) };
}

/** Puts a curve's arrays back together one chunk at a time (so each chunk can be read in its own task). */
export interface ChunkJoiner {
  /** Appends the next chunk; false (and the joiner is spoilt) when it is missing, malformed or too long. */
  add(chunk: CurveArrays | undefined): boolean;
  /** The arrays, or undefined when a chunk was bad or the count or total length disagrees with the head. */
  finish(): CurveArrays | undefined;
}

/** A {@link ChunkJoiner} for the chunks of `head`, in order. */
export function chunkJoiner(head: ChunkedHead): ChunkJoiner {
  const massEv = new Float64Array(head.length);
  const gInvGeV = new Float64Array(head.length);
  let o = 0;
  let count = 0;
  let ok = true;
  return {
    add(c) {
      if (!ok) return false;
      count++;
      if (
        count > head.chunks ||
        !c ||
        !(c.massEv instanceof Float64Array) ||
        !(c.gInvGeV instanceof Float64Array) ||
        c.massEv.length !== c.gInvGeV.length ||
        o + c.massEv.length > head.length
      ) {
        ok = false;
        return false;
      }
      massEv.set(c.massEv, o);
      gInvGeV.set(c.gInvGeV, o);
      o += c.massEv.length;
      return true;
    },
    finish: () => (ok && count === head.chunks && o === head.length ? { massEv, gInvGeV } : undefined),
  };
}

/** The arrays back from their chunks; undefined when a chunk is missing or the sizes disagree. */
export function joinChunks(head: ChunkedHead, chunks: (CurveArrays | undefined)[]): CurveArrays | undefined {
  if (chunks.length !== head.chunks) return undefined;
  const j = chunkJoiner(head);
  for (const c of chunks) if (!j.add(c)) return undefined;
  return j.finish();
}

/** Lets other work run between two chunk writes or reads (structured cloning happens synchronously). */
export const nextTask = () => new Promise<void>((resolve) => setTimeout(resolve, 0));
