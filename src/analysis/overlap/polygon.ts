// Closed regions (a polygon in file order, even-odd rule) against the model levels.
import { bisectLeft } from "d3-array";
import { intersectFlat, pushMerged, subtractFlat, unionFlat, unionUnsorted, type Flat } from "./intervals";
import { finish, type Raw } from "./assemble";
import type { Levels } from "./levels";
import type { PolygonPrep } from "./prepare";
import { INSET } from "./sorted";

/**
 * Where the edge (xa, va)–(xb, vb) meets the level c, interpolated from the lower end in v so that the polygon
 * traced either way round gives the very same number.
 */
function crossingX(xa: number, va: number, xb: number, vb: number, c: number): number {
  return va < vb ? xa + ((c - va) / (vb - va)) * (xb - xa) : xb + ((c - vb) / (va - vb)) * (xa - xb);
}

/** Masses (ln) where the horizontal line v = c lies inside the polygon (even-odd rule). */
function insideAlongLevel(p: PolygonPrep, c: number): Flat {
  if (!Number.isFinite(c)) return [];
  const xs: number[] = [];
  for (let i = 0; i < p.n; i++) {
    const j = i + 1 === p.n ? 0 : i + 1;
    const vi = p.v[i];
    const vj = p.v[j];
    // Half-open rule: a vertex exactly on the level counts once, so the crossings always pair up.
    if (vi > c !== vj > c) xs.push(crossingX(p.x[i], vi, p.x[j], vj, c));
  }
  xs.sort((a, b) => a - b);
  const out: Flat = [];
  for (let k = 0; k + 1 < xs.length; k += 2) pushMerged(out, xs[k], xs[k + 1]);
  return out;
}

/** Masses (ln) of the polygon's boundary points with lo ≤ v ≤ hi (lo may be −∞). */
function boundaryInBand(p: PolygonPrep, lo: number, hi: number): Flat {
  const pieces: Flat = [];
  let curLo = NaN;
  let curHi = NaN;
  for (let i = 0; i < p.n; i++) {
    const j = i + 1 === p.n ? 0 : i + 1;
    // Each edge is read from its lower end in v, so the outline traced either way round gives the same pieces.
    const up = p.v[i] <= p.v[j];
    const va = up ? p.v[i] : p.v[j];
    const vb = up ? p.v[j] : p.v[i];
    const x0 = up ? p.x[i] : p.x[j];
    const dx = (up ? p.x[j] : p.x[i]) - x0;
    const dv = vb - va;
    let t0: number;
    let t1: number;
    if (dv === 0) {
      if (va < lo || va > hi) continue;
      t0 = 0;
      t1 = 1;
    } else {
      t0 = Math.max(0, (lo - va) / dv);
      t1 = Math.min(1, (hi - va) / dv);
      if (!(t0 <= t1)) continue;
    }
    const xa = x0 + t0 * dx;
    const xb = x0 + t1 * dx;
    const a = Math.min(xa, xb);
    const b = Math.max(xa, xb);
    // Consecutive pieces of one chain touch: grow the running piece instead of storing every edge.
    if (a <= curHi && b >= curLo) {
      curLo = Math.min(curLo, a);
      curHi = Math.max(curHi, b);
    } else {
      if (curHi >= curLo) pieces.push(curLo, curHi);
      curLo = a;
      curHi = b;
    }
  }
  if (curHi >= curLo) pieces.push(curLo, curHi);
  // Zero-length pieces (a vertex just touching a level, a vertical edge) drop out here: they cover no mass.
  return unionUnsorted(pieces);
}

/**
 * For each query abscissa (ascending), the smallest x-width of the polygon edges whose x-range holds it: the
 * local sample spacing of the region there (0 at a vertical edge, which is a deliberate sharp boundary).
 */
function polygonSpacingAt(p: PolygonPrep, xs: Float64Array): Float64Array {
  const width = new Float64Array(xs.length).fill(Infinity);
  for (let i = 0; i < p.n; i++) {
    const j = i + 1 === p.n ? 0 : i + 1;
    const e0 = Math.min(p.x[i], p.x[j]);
    const e1 = Math.max(p.x[i], p.x[j]);
    for (let q = bisectLeft(xs, e0); q < xs.length && xs[q] <= e1; q++) width[q] = Math.min(width[q], e1 - e0);
  }
  return width;
}

/** Bridge test for a region: the gap is narrower than the local spacing at both of its ends. */
function polygonBridge(p: PolygonPrep, lists: Flat[]): (lo: number, hi: number) => boolean {
  const ends: number[] = [];
  for (const list of lists) for (let i = 1; i + 1 < list.length; i += 2) ends.push(list[i], list[i + 1]);
  ends.sort((a, b) => a - b);
  const xs = Float64Array.from(ends);
  const width = polygonSpacingAt(p, xs);
  const at = (x: number): number => {
    const q = bisectLeft(xs, x);
    return q < xs.length && xs[q] === x ? width[q] : 0;
  };
  return (lo, hi) => hi - lo < Math.min(at(lo), at(hi));
}

export function polygonOverlap(p: PolygonPrep, L: Levels, merge: boolean): Raw {
  if (L.lo === L.hi) {
    const inside = insideAlongLevel(p, L.lo);
    return finish(inside, [], merge, merge ? polygonBridge(p, [inside]) : () => false, true);
  }
  const insideLo = insideAlongLevel(p, L.lo);
  const insideHi = insideAlongLevel(p, L.hi);
  const crossing = boundaryInBand(p, L.lo, L.hi);
  // The vertical segment [lo, hi] at m lies inside when both ends do and no boundary passes between them;
  // it meets the region when an end is inside or the boundary crosses it.
  const whole = subtractFlat(intersectFlat(insideLo, insideHi), crossing);
  const touch = unionFlat(unionFlat(insideLo, insideHi), crossing);
  return finish(whole, touch, merge, merge ? polygonBridge(p, [whole, touch]) : () => false);
}

/** Lowest and highest sheared value of the region within the interior of each interval of `parts` (one sweep over edges). */
export function polygonRangeOver(p: PolygonPrep, parts: Flat): { min: number[]; max: number[] } {
  const k = parts.length / 2;
  const min = new Array<number>(k).fill(Infinity);
  const max = new Array<number>(k).fill(-Infinity);
  if (k === 0) return { min, max };
  const his = Float64Array.from({ length: k }, (_, q) => parts[2 * q + 1]);
  for (let i = 0; i < p.n; i++) {
    const j = i + 1 === p.n ? 0 : i + 1;
    const xi = p.x[i];
    const xj = p.x[j];
    const e0 = Math.min(xi, xj);
    const e1 = Math.max(xi, xj);
    for (let q = bisectLeft(his, e0); q < k && parts[2 * q] <= e1; q++) {
      const inset = INSET * (parts[2 * q + 1] - parts[2 * q]);
      const a = Math.max(e0, parts[2 * q] + inset);
      const b = Math.min(e1, parts[2 * q + 1] - inset);
      if (!(a <= b)) continue;
      let va: number;
      let vb: number;
      if (xj === xi) {
        va = p.v[i];
        vb = p.v[j];
      } else {
        const s = (p.v[j] - p.v[i]) / (xj - xi);
        va = p.v[i] + (a - xi) * s;
        vb = p.v[i] + (b - xi) * s;
      }
      min[q] = Math.min(min[q], va, vb);
      max[q] = Math.max(max[q], va, vb);
    }
  }
  return { min, max };
}
