// Working buffers the thinning reuses from frame to frame, so a redraw allocates nothing: kept indices, and
// kept points' pixels with their outcodes for culling. Grown as needed, never shrunk.

export const scratch = {
  idx: new Int32Array(4096),
  x: new Float64Array(4096),
  y: new Float64Array(4096),
  code: new Uint8Array(4096),
};

/** Room for n indices in scratch.idx (its contents are not kept). */
export function ensureIdx(n: number): void {
  if (scratch.idx.length < n) scratch.idx = new Int32Array(n);
}

/** Appends index i at position `count` of scratch.idx (growing it, contents kept); returns the new count. */
export function pushIdx(count: number, i: number): number {
  if (count >= scratch.idx.length) {
    const grown = new Int32Array(scratch.idx.length * 2);
    grown.set(scratch.idx);
    scratch.idx = grown;
  }
  scratch.idx[count] = i;
  return count + 1;
}

/** Room for n points in scratch.x/y/code; the first `keep` points survive a growth. */
export function ensureBuffers(n: number, keep = 0): void {
  if (scratch.x.length >= n) return;
  let size = scratch.x.length;
  while (size < n) size *= 2;
  const ox = scratch.x;
  const oy = scratch.y;
  scratch.x = new Float64Array(size);
  scratch.y = new Float64Array(size);
  scratch.code = new Uint8Array(size);
  if (keep > 0) {
    scratch.x.set(ox.subarray(0, keep));
    scratch.y.set(oy.subarray(0, keep));
  }
}
