// Clipping and culling in scene px: exact culling of loops beyond the plot, and Sutherland–Hodgman
// clipping to a rectangle a few plot sizes wide so no coordinate gets huge.

import { scratch } from "./scratch";

/** A polyline in scene px. */
export interface Polyline {
  xs: Float64Array;
  ys: Float64Array;
  n: number;
  closed: boolean;
}

/** Axis-aligned rectangle (scene px). */
export interface Rect {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

/**
 * Clip a polyline or polygon to a rectangle (Sutherland–Hodgman, one half-plane at a time). Used with a
 * rectangle a few plot sizes larger than the plot: whatever it removes lies outside the visible area, the
 * edges it adds run along its far-away border, so strokes and fills inside the plot are unchanged while no
 * coordinate gets huge and long invisible stretches collapse to two points.
 */
export function clipToRect(poly: Polyline, r: Rect): Polyline {
  let cur = poly;
  for (let side = 0; side < 4 && cur.n > 0; side++) cur = clipHalf(cur, side, r, null);
  return cur;
}

function inside(x: number, y: number, side: number, r: Rect): boolean {
  return side === 0 ? x >= r.x0 : side === 1 ? x <= r.x1 : side === 2 ? y >= r.y0 : y <= r.y1;
}

// Two scratch polylines the frame path (curvePixels with `reuse`) clips between, so a redraw allocates nothing.
export const clipScratch = [
  { xs: new Float64Array(4096), ys: new Float64Array(4096) },
  { xs: new Float64Array(4096), ys: new Float64Array(4096) },
];

/** One Sutherland–Hodgman pass; into `into` (grown as needed) or new arrays when it is null. */
export function clipHalf(
  p: Polyline,
  side: number,
  r: Rect,
  into: { xs: Float64Array; ys: Float64Array } | null,
): Polyline {
  const { xs, ys, n, closed } = p;
  let all = true;
  for (let i = 0; i < n && all; i++) if (!inside(xs[i], ys[i], side, r)) all = false;
  if (all) return p;
  const size = n * 2 + 2;
  if (into && into.xs.length < size) {
    into.xs = new Float64Array(size * 2);
    into.ys = new Float64Array(size * 2);
  }
  const ox = into ? into.xs : new Float64Array(size);
  const oy = into ? into.ys : new Float64Array(size);
  let k = 0;
  const edge = side === 0 ? r.x0 : side === 1 ? r.x1 : side === 2 ? r.y0 : r.y1;
  const cross = (i: number, j: number) => {
    const x0 = xs[i];
    const y0 = ys[i];
    const x1 = xs[j];
    const y1 = ys[j];
    if (side < 2) {
      const t = (edge - x0) / (x1 - x0);
      ox[k] = edge;
      oy[k] = y0 + t * (y1 - y0);
    } else {
      const t = (edge - y0) / (y1 - y0);
      ox[k] = x0 + t * (x1 - x0);
      oy[k] = edge;
    }
    k++;
  };
  let prev = closed ? n - 1 : 0;
  let prevIn = inside(xs[prev], ys[prev], side, r);
  let first = 0;
  if (!closed) {
    if (prevIn) {
      ox[k] = xs[0];
      oy[k] = ys[0];
      k++;
    }
    first = 1;
  }
  for (let i = first; i < n; i++) {
    const curIn = inside(xs[i], ys[i], side, r);
    if (curIn !== prevIn) cross(prev, i);
    if (curIn) {
      ox[k] = xs[i];
      oy[k] = ys[i];
      k++;
    }
    prev = i;
    prevIn = curIn;
  }
  return { xs: ox, ys: oy, n: k, closed };
}

/** How to turn a prepared curve into pixels. */

/**
 * Off-plot culling keeps everything within this many scene px of the plot area, more than half of any
 * stroke width with round joins, so culling never changes a visible pixel.
 */
export const CULL_MARGIN_PX = 16;

/**
 * Drops, in place, every interior point that lies beyond the same edge of the cull rectangle as the last
 * kept point and the next point. The removed loop lies in that outer half-plane, so fills (any winding rule)
 * and strokes inside the rectangle are unchanged — exact culling, not an approximation.
 * @returns the new count.
 */
export function cullOutside(n: number, r: Rect): number {
  if (n <= 2) return n;
  const bufX = scratch.x;
  const bufY = scratch.y;
  const bufC = scratch.code;
  for (let k = 0; k < n; k++) {
    const x = bufX[k];
    const y = bufY[k];
    bufC[k] = (x < r.x0 ? 1 : x > r.x1 ? 2 : 0) | (y < r.y0 ? 4 : y > r.y1 ? 8 : 0);
  }
  let w = 1;
  let last = bufC[0];
  for (let k = 1; k < n - 1; k++) {
    const c = bufC[k];
    if (last & c & bufC[k + 1]) continue;
    bufX[w] = bufX[k];
    bufY[w] = bufY[k];
    w++;
    last = c;
  }
  bufX[w] = bufX[n - 1];
  bufY[w] = bufY[n - 1];
  return w + 1;
}

export function allInside(xs: Float64Array, ys: Float64Array, n: number, r: Rect): boolean {
  for (let i = 0; i < n; i++) {
    const x = xs[i];
    const y = ys[i];
    if (x < r.x0 || x > r.x1 || y < r.y0 || y > r.y1) return false;
  }
  return true;
}
