// Min–max envelope of densely zig-zagging pixel columns: a browser paints one filled polygon per run of such
// columns far faster than it strokes the zig-zag of first/lowest/highest/last points, and covers the same pixels.

import type { Polyline } from "./clip";

export interface EnvelopeParams {
  /** Left edge of the column grid (scene px; the plot's left edge) and device px per scene px. */
  originX: number;
  resolution: number;
  /** Half the stroke width (scene px): a stroked near-vertical segment covers this much either side. */
  halfWidthPx: number;
  /** A column counts as dense when its points span more than this vertically (scene px). */
  minSpanPx: number;
}

export interface EnvelopeSplit {
  /**
   * The polyline with every dense column cut to its first and last point (all inside the envelope): the
   * thin stroke for the sparse stretches, and still one connected line for an exclusion's fill edge.
   */
  line: Polyline;
  /** Closed polygons, one per run of adjacent dense columns, packed: polygon k spans [ends[k−1], ends[k]). */
  band: { xs: Float64Array; ys: Float64Array; ends: Int32Array; count: number };
}

// Working buffers, reused frame to frame (results are views, valid until the next call).
const buf = {
  lineX: new Float64Array(4096),
  lineY: new Float64Array(4096),
  bandX: new Float64Array(4096),
  bandY: new Float64Array(4096),
  ends: new Int32Array(64),
  // Per segment of the current run's dense columns: the box of its stroke (left, right, top, bottom).
  left: new Float64Array(1024),
  right: new Float64Array(1024),
  top: new Float64Array(1024),
  bot: new Float64Array(1024),
  deque: new Int32Array(1024),
};

function grow(a: Float64Array<ArrayBuffer>, n: number, keep: number): Float64Array<ArrayBuffer> {
  if (a.length >= n) return a;
  let size = a.length;
  while (size < n) size *= 2;
  const g = new Float64Array(size);
  g.set(a.subarray(0, keep));
  return g;
}

/**
 * Splits a column-thinned, x-monotone polyline (a curve drawn in mass order) into a thin line and the
 * envelope of its dense columns. A column (1/resolution scene px) is dense when it holds three or more
 * points spanning more than `minSpanPx` vertically. The envelope of a run of adjacent dense columns is the
 * union of the bounding boxes of their zig-zag segments' strokes (a third of a segment at a time), so it
 * covers every pixel the stroked zig-zag covers there, and more by at most a third of a column sideways
 * (next to nothing up or down: at a reversal the stroke's joins stop at the tip). The line keeps the
 * segments between columns, with their stroke, so a run joins the sparse stretches on either side.
 */
export function envelopeSplit(poly: Polyline, p: EnvelopeParams): EnvelopeSplit {
  const { xs, ys, n } = poly;
  buf.lineX = grow(buf.lineX, n, 0);
  buf.lineY = grow(buf.lineY, n, 0);
  const lx = buf.lineX;
  const ly = buf.lineY;
  let ln = 0;
  let bandN = 0;
  let runs = 0;
  let runLen = 0;
  let lastCol = NaN;
  const h = p.halfWidthPx;
  const res = p.resolution;
  let i = 0;
  while (i < n) {
    const col = Math.floor((xs[i] - p.originX) * res);
    let j = i + 1;
    let top = ys[i];
    let bot = top;
    while (j < n && Math.floor((xs[j] - p.originX) * res) === col) {
      const y = ys[j];
      if (y < top) top = y;
      else if (y > bot) bot = y;
      j++;
    }
    const dense = j - i >= 3 && bot - top > p.minSpanPx;
    // A run continues into the next column only if the boxes touch (adjacent columns, no gap).
    if (runLen > 0 && !(dense && col === lastCol + 1 && xs[i] - h <= buf.right[runLen - 1])) {
      bandN = closeRun(runLen, bandN, runs++);
      runLen = 0;
    }
    if (dense) {
      if (runLen + SPLIT * (j - i) >= buf.left.length) growRun(2 * (runLen + SPLIT * (j - i)));
      for (let k = i; k < j - 1; k++) runLen = segmentBoxes(xs[k], ys[k], xs[k + 1], ys[k + 1], h, res, runLen);
      lx[ln] = xs[i];
      ly[ln++] = ys[i];
      lx[ln] = xs[j - 1];
      ly[ln++] = ys[j - 1];
    } else {
      for (let k = i; k < j; k++) {
        lx[ln] = xs[k];
        ly[ln++] = ys[k];
      }
    }
    lastCol = col;
    i = j;
  }
  if (runLen > 0) closeRun(runLen, bandN, runs++);
  return {
    line: { xs: lx.subarray(0, ln), ys: ly.subarray(0, ln), n: ln, closed: poly.closed },
    band: { xs: buf.bandX, ys: buf.bandY, ends: buf.ends, count: runs },
  };
}

/** Segments wider than a twentieth of a column are boxed in this many parts. */
const SPLIT = 3;

/**
 * The bounding boxes of a segment's stroke (butt ends) in parts of a third of its width, appended to the
 * run's boxes. A box is widened by the full half width sideways, so that box edges grow
 * monotonically along an x-monotone line (the sweep in {@link chain} relies on it), and by the stroke's
 * own reach up and down (h·|dx|/length). Steep segments, the zig-zag's bulk, are covered to within a third
 * of a column of their stroke.
 */
function segmentBoxes(x0: number, y0: number, x1: number, y1: number, h: number, res: number, at: number): number {
  const dx = x1 - x0;
  const dy = y1 - y0;
  const len = Math.sqrt(dx * dx + dy * dy);
  const hy = len > 0 ? (h * Math.abs(dx)) / len : h;
  const parts = Math.abs(dx) * res > 0.05 ? SPLIT : 1;
  for (let q = 0; q < parts; q++) {
    const xa = x0 + (dx * q) / parts;
    const ya = y0 + (dy * q) / parts;
    const xb = q === parts - 1 ? x1 : x0 + (dx * (q + 1)) / parts;
    const yb = q === parts - 1 ? y1 : y0 + (dy * (q + 1)) / parts;
    buf.left[at] = xa - h;
    buf.right[at] = xb + h;
    buf.top[at] = (ya < yb ? ya : yb) - hy;
    buf.bot[at] = (ya < yb ? yb : ya) + hy;
    at++;
  }
  return at;
}

function growRun(size: number): void {
  buf.left = grow(buf.left, size, buf.left.length);
  buf.right = grow(buf.right, size, buf.right.length);
  buf.top = grow(buf.top, size, buf.top.length);
  buf.bot = grow(buf.bot, size, buf.bot.length);
}

/** Appends the run's polygon (upper chain left to right, lower chain back) to the band; returns its new length. */
function closeRun(m: number, at: number, run: number): number {
  // Each chain has at most 4 vertices per box (a step where a box starts and where one ends).
  buf.bandX = grow(buf.bandX, at + 8 * m + 8, at);
  buf.bandY = grow(buf.bandY, at + 8 * m + 8, at);
  let w = chain(m, at, false);
  const upperEnd = w;
  w = chain(m, w, true);
  // The lower chain was written left to right: reverse it in place.
  for (let a = upperEnd, z = w - 1; a < z; a++, z--) {
    const tx = buf.bandX[a];
    buf.bandX[a] = buf.bandX[z];
    buf.bandX[z] = tx;
    const ty = buf.bandY[a];
    buf.bandY[a] = buf.bandY[z];
    buf.bandY[z] = ty;
  }
  if (run >= buf.ends.length) {
    const g = new Int32Array(buf.ends.length * 2);
    g.set(buf.ends);
    buf.ends = g;
  }
  buf.ends[run] = w;
  return w;
}

/**
 * The upper (lowest y) or lower (highest y) edge of the union of the run's boxes, left to right, as a
 * staircase. Left and right edges both increase along the run, so the boxes over any x are a contiguous
 * range [a, b) that a sweep moves forward, and a monotone deque holds its extreme.
 */
// A hot loop, long on purpose: the sweep over the rectangle edges with its output inlined.
function chain(m: number, at: number, lower: boolean): number {
  const { left, right } = buf;
  const val = lower ? buf.bot : buf.top;
  const ox = buf.bandX;
  const oy = buf.bandY;
  if (buf.deque.length < m) buf.deque = new Int32Array(2 * m);
  // The boxes over x whose extreme can still matter, extremes first (a monotone deque: O(1) per box).
  const dq = buf.deque;
  let head = 0;
  let tail = 0;
  let w = at;
  let a = 0;
  let b = 0;
  let cur = val[0];
  ox[w] = left[0];
  oy[w++] = cur;
  while (a < m) {
    // The next edge: a box starting (ties: starts first, so the range never empties in between) or ending.
    const x = b < m && left[b] <= right[a] ? left[b] : right[a];
    for (; b < m && left[b] <= x; b++) {
      const y = val[b];
      while (tail > head && (lower ? val[dq[tail - 1]] <= y : val[dq[tail - 1]] >= y)) tail--;
      dq[tail++] = b;
    }
    while (a < b && right[a] <= x) a++;
    while (tail > head && dq[head] < a) head++;
    if (a >= b) {
      ox[w] = x;
      oy[w++] = cur;
      break;
    }
    const v = val[dq[head]];
    if (v !== cur) {
      ox[w] = x;
      oy[w++] = cur;
      ox[w] = x;
      oy[w++] = v;
      cur = v;
    }
  }
  return w;
}
