// Where a model line or band meets a curve: the exact mass intervals where an exclusion curve excludes (a
// projection reaches, a closed region contains) the whole band, or only part of it.
// Everything happens in log-log space sheared by v = ln g − ln m: there the model edges are horizontal lines
// (g ∝ m) and every curve segment or polygon edge stays a straight line, so each crossing is solved exactly
// per segment, in one pass over the points (O(n) per model × curve, after a one-off preparation per curve).
import { ALPHA, resolveConstants, type AxionConstants, type RefId } from "../physics/constants";
import { normalizedRange } from "../physics/coupling";
import type { CurveRole } from "../project/types";

/** A closed mass interval [lo, hi] in eV, lo < hi. */
export type Interval = [number, number];

/** The model side of an overlap: an E/N interval (min = max for a model line) and its theory spread. */
export interface OverlapModel {
  eOverNMin: number;
  eOverNMax: number;
  /** k in ±kσ for the theory spread (c_γ and K varied). @default 0 */
  sigmas?: number;
  /** Published reference set. @default "2019" */
  ref?: RefId;
  /** A complete user-entered set of constants; wins over `ref`. */
  constants?: AxionConstants;
}

/** The curve side: data in internal units (eV, GeV⁻¹) and its role. */
export interface OverlapCurve {
  massEv: Float64Array;
  gInvGeV: Float64Array;
  role: CurveRole;
  /**
   * Multiplies every coupling of the curve before comparing (the rescaling √(ρ_assumed/ρ_shown)/√f), without
   * copying the data, so the per-curve preparation is reused. @default 1
   */
  gFactor?: number;
}

/** Extra options of {@link overlap} and {@link overlapDetail}. */
export interface OverlapOptions {
  /** A complete set of constants; wins over the model's `constants` and `ref`. */
  constants?: AxionConstants;
  /**
   * Merge intervals whose gap is narrower than one curve sample spacing (see {@link overlapDetail}).
   * @default true
   */
  mergeGaps?: boolean;
}

/** The two lists every caller gets: intervals in eV, ascending, disjoint and merged. */
export interface OverlapResult {
  /** Masses where every E/N of the band is excluded (within reach, inside the region). */
  whole: Interval[];
  /** Masses where some but not all E/N values are (always empty for a line without theory spread). */
  part: Interval[];
}

/** {@link OverlapResult} with the detail the overlap table shows. */
export interface OverlapDetail extends OverlapResult {
  /**
   * For each `part` interval (same order): the E/N values of the model's interval that are excluded (within
   * reach, inside) somewhere in that mass interval, as one or two ascending E/N intervals. With a theory
   * spread an E/N counts when its own spread band gets there. For a region this is the hull over the
   * region's cross-sections, so it may be wider than the truth when the region has several lobes.
   */
  partEOverN: [number, number][][];
  /**
   * For exclusion and projection curves: the E/N values excluded (within reach) at every mass of each `part`
   * interval, even at the worst end of the theory spread (often empty or a single point, because a part
   * interval usually runs from "none" to "whole"); null for regions.
   */
  partEOverNThroughout: [number, number][][] | null;
  /** Masses of the curve's range where nothing is claimed to overlap. */
  none: Interval[];
  /** The curve's mass range [min, max] in eV (null with fewer than two usable points). */
  massRangeEv: Interval | null;
  /**
   * True when the band's lower edge is g = 0: c_γ (or any c_γ ± kσ) lies in the E/N interval, the coupling
   * cancels, and no finite limit (no bounded region) can cover the whole band, so `whole` is empty.
   */
  cancels: boolean;
  /** True when E/N min = max (a model line; with a theory spread it still has a width). */
  line: boolean;
  /** Gaps (eV) that were bridged because they were narrower than one sample spacing. */
  bridgedGapsEv: Interval[];
  /** Points skipped because mass or coupling was not a positive finite number (cannot go on a log axis). */
  skippedPoints: number;
}

// ---------------------------------------------------------------------------------------------------------
// Interval lists: flat arrays [lo0, hi0, lo1, hi1, …], ascending and disjoint, in ln(mass).

type Flat = number[];

/** Appends [lo, hi] to an ascending list, merging with the last interval when they touch or overlap. */
function pushMerged(out: Flat, lo: number, hi: number): void {
  if (!(hi > lo)) return; // empty, or a single touching point: not reported
  const n = out.length;
  if (n > 0 && lo <= out[n - 1]) {
    if (hi > out[n - 1]) out[n - 1] = hi;
    return;
  }
  out.push(lo, hi);
}

function unionFlat(a: Flat, b: Flat): Flat {
  const out: Flat = [];
  let i = 0;
  let j = 0;
  while (i < a.length || j < b.length) {
    if (j >= b.length || (i < a.length && a[i] <= b[j])) {
      pushMerged(out, a[i], a[i + 1]);
      i += 2;
    } else {
      pushMerged(out, b[j], b[j + 1]);
      j += 2;
    }
  }
  return out;
}

function intersectFlat(a: Flat, b: Flat): Flat {
  const out: Flat = [];
  let i = 0;
  let j = 0;
  while (i < a.length && j < b.length) {
    const lo = Math.max(a[i], b[j]);
    const hi = Math.min(a[i + 1], b[j + 1]);
    pushMerged(out, lo, hi);
    if (a[i + 1] < b[j + 1]) i += 2;
    else j += 2;
  }
  return out;
}

function subtractFlat(a: Flat, b: Flat): Flat {
  const out: Flat = [];
  let j = 0;
  for (let i = 0; i < a.length; i += 2) {
    let lo = a[i];
    const hi = a[i + 1];
    while (j < b.length && b[j + 1] <= lo) j += 2;
    let k = j;
    while (k < b.length && b[k] < hi) {
      pushMerged(out, lo, b[k]);
      lo = Math.max(lo, b[k + 1]);
      k += 2;
    }
    pushMerged(out, lo, hi);
  }
  return out;
}

/** Union of intervals given in any order. */
function unionUnsorted(pairs: Flat): Flat {
  const count = pairs.length / 2;
  const order = Array.from({ length: count }, (_, k) => k);
  order.sort((p, q) => pairs[2 * p] - pairs[2 * q]);
  const out: Flat = [];
  for (const k of order) pushMerged(out, pairs[2 * k], pairs[2 * k + 1]);
  return out;
}

/**
 * Bridges every gap for which `bridge(lo, hi)` says yes; returns the merged list and the gaps bridged.
 */
function bridgeGaps(list: Flat, bridge: (lo: number, hi: number) => boolean): { merged: Flat; gaps: Flat } {
  const merged: Flat = [];
  const gaps: Flat = [];
  for (let i = 0; i < list.length; i += 2) {
    const n = merged.length;
    if (n > 0 && bridge(merged[n - 1], list[i])) {
      gaps.push(merged[n - 1], list[i]);
      merged[n - 1] = Math.max(merged[n - 1], list[i + 1]);
    } else {
      merged.push(list[i], list[i + 1]);
    }
  }
  return { merged, gaps };
}

// ---------------------------------------------------------------------------------------------------------
// Per-curve preparation, cached on the (never mutated) data arrays.

/** An exclusion or projection curve sorted by mass: x = ln m ascending, v = ln g − ln m. */
interface SortedPrep {
  n: number;
  x: Float64Array;
  v: Float64Array;
  mass: Float64Array;
  skipped: number;
}

/** A closed region in file order, same coordinates. */
interface PolygonPrep {
  n: number;
  x: Float64Array;
  v: Float64Array;
  xMin: number;
  xMax: number;
  massMin: number;
  massMax: number;
  skipped: number;
}

interface CacheEntry {
  g: Float64Array;
  sorted?: SortedPrep;
  polygon?: PolygonPrep;
}

const prepCache = new WeakMap<Float64Array, CacheEntry>();

function usable(m: number, g: number): boolean {
  return m > 0 && g > 0 && Number.isFinite(m) && Number.isFinite(g);
}

function cacheEntry(massEv: Float64Array, gInvGeV: Float64Array): CacheEntry {
  let entry = prepCache.get(massEv);
  if (!entry || entry.g !== gInvGeV) {
    entry = { g: gInvGeV };
    prepCache.set(massEv, entry);
  }
  return entry;
}

function prepareSorted(massEv: Float64Array, gInvGeV: Float64Array): SortedPrep {
  const entry = cacheEntry(massEv, gInvGeV);
  if (entry.sorted) return entry.sorted;
  const len = Math.min(massEv.length, gInvGeV.length);
  const idx: number[] = [];
  let ordered = true;
  for (let i = 0; i < len; i++) {
    if (!usable(massEv[i], gInvGeV[i])) continue;
    if (idx.length > 0 && massEv[i] < massEv[idx[idx.length - 1]]) ordered = false;
    idx.push(i);
  }
  // Array.prototype.sort is stable, so points of equal mass keep their file order (a vertical step).
  if (!ordered) idx.sort((p, q) => massEv[p] - massEv[q]);
  const n = idx.length;
  const x = new Float64Array(n);
  const v = new Float64Array(n);
  const mass = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const m = massEv[idx[k]];
    mass[k] = m;
    x[k] = Math.log(m);
    v[k] = Math.log(gInvGeV[idx[k]]) - x[k];
  }
  entry.sorted = { n, x, v, mass, skipped: len - n + Math.abs(massEv.length - gInvGeV.length) };
  return entry.sorted;
}

function preparePolygon(massEv: Float64Array, gInvGeV: Float64Array): PolygonPrep {
  const entry = cacheEntry(massEv, gInvGeV);
  if (entry.polygon) return entry.polygon;
  const len = Math.min(massEv.length, gInvGeV.length);
  const xs: number[] = [];
  const vs: number[] = [];
  let massMin = Infinity;
  let massMax = -Infinity;
  for (let i = 0; i < len; i++) {
    if (!usable(massEv[i], gInvGeV[i])) continue;
    const xi = Math.log(massEv[i]);
    xs.push(xi);
    vs.push(Math.log(gInvGeV[i]) - xi);
    massMin = Math.min(massMin, massEv[i]);
    massMax = Math.max(massMax, massEv[i]);
  }
  const n = xs.length;
  entry.polygon = {
    n,
    x: Float64Array.from(xs),
    v: Float64Array.from(vs),
    xMin: n > 0 ? Math.log(massMin) : NaN,
    xMax: n > 0 ? Math.log(massMax) : NaN,
    massMin,
    massMax,
    skipped: len - n + Math.abs(massEv.length - gInvGeV.length),
  };
  return entry.polygon;
}

// ---------------------------------------------------------------------------------------------------------
// The model's levels in the sheared plane.

interface Levels {
  /** ln(g_low/m) of the band's lower edge, −∞ when it cancels. */
  lo: number;
  /** ln(g_high/m) of the upper edge (+∞ when a huge spread makes K − kσ ≤ 0). */
  hi: number;
  cGamma: number;
  /** Spread of c_γ (kσ). */
  dc: number;
  kLow: number;
  kHigh: number;
  eMin: number;
  eMax: number;
}

/** ln of α/(2π K·10⁶) · n: the sheared level of |E/N − c_γ| = n with K in μeV (see gFromNormalized). */
function levelOf(n: number, kMuEv: number): number {
  if (!(kMuEv > 0)) return Infinity;
  return n > 0 ? Math.log((ALPHA * n) / (2 * Math.PI * kMuEv * 1e6)) : -Infinity;
}

/** |E/N − c_γ| whose line has sheared level v, for K in μeV (inverse of levelOf). */
function normalizedOfLevel(v: number, kMuEv: number): number {
  return (Math.exp(v) * 2 * Math.PI * kMuEv * 1e6) / ALPHA;
}

function modelLevels(model: OverlapModel, c: AxionConstants, lnFactor: number): Levels {
  const k = model.sigmas ?? 0;
  const eMin = Math.min(model.eOverNMin, model.eOverNMax);
  const eMax = Math.max(model.eOverNMin, model.eOverNMax);
  const [nMin, nMax] = normalizedRange(eMin, eMax, c, k);
  const kHigh = c.kMuEv + k * c.kMuEvSigma;
  const kLow = c.kMuEv - k * c.kMuEvSigma;
  // Scaling the curve by f is the same as lowering the model levels by ln f.
  return {
    lo: levelOf(nMin, kHigh) - lnFactor,
    hi: levelOf(nMax, kLow) - lnFactor,
    cGamma: c.cGamma,
    dc: k * c.cGammaSigma,
    kLow,
    kHigh,
    eMin,
    eMax,
  };
}

/**
 * E/N values of [eMin, eMax] with |E/N − c_γ| in [nA, nB] (nB may be ∞), as ascending intervals.
 */
function eOverNWithAbsIn(L: Levels, nA: number, nB: number): [number, number][] {
  const out: [number, number][] = [];
  const add = (lo: number, hi: number): void => {
    const a = Math.max(lo, L.eMin);
    const b = Math.min(hi, L.eMax);
    if (!(a <= b)) return;
    const last = out[out.length - 1];
    if (last && a <= last[1]) last[1] = Math.max(last[1], b);
    else out.push([a, b]);
  };
  const c = L.cGamma;
  const a = Math.max(0, nA);
  if (!(a <= nB)) return out;
  add(c - nB, c - a);
  add(c + a, c + nB);
  return out;
}

// ---------------------------------------------------------------------------------------------------------
// Exclusion and projection curves.

/** Appends the part of the segment (x0, a)–(x1, b) where v ≤ L. */
function segmentAtOrBelow(out: Flat, x0: number, x1: number, a: number, b: number, L: number): void {
  if (a <= L && b <= L) {
    pushMerged(out, x0, x1);
    return;
  }
  if (a > L && b > L) return;
  let xc = x0 + ((L - a) / (b - a)) * (x1 - x0);
  xc = Math.min(x1, Math.max(x0, xc));
  if (a <= L) pushMerged(out, x0, xc);
  else pushMerged(out, xc, x1);
}

/** Index of the first element ≥ value in an ascending array. */
function lowerBound(arr: Float64Array, value: number): number {
  let lo = 0;
  let hi = arr.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (arr[mid] < value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Index of the first element > value in an ascending array. */
function upperBound(arr: Float64Array, value: number): number {
  let lo = 0;
  let hi = arr.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (arr[mid] <= value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Sheared curve value at x by linear interpolation (x inside the range; on a step, the lower side). */
function sortedValueAt(p: SortedPrep, x: number): number {
  let i = upperBound(p.x, x) - 1;
  if (i < 0) i = 0;
  if (i >= p.n - 1) return p.v[p.n - 1];
  const x0 = p.x[i];
  const x1 = p.x[i + 1];
  if (!(x1 > x0)) return Math.min(p.v[i], p.v[i + 1]);
  return p.v[i] + ((x - x0) / (x1 - x0)) * (p.v[i + 1] - p.v[i]);
}

/** Width in ln m of the curve segment holding the gap's start (x_j ≤ lo < x_j+1) and end (x_k < hi ≤ x_k+1). */
function localSpacing(p: SortedPrep, lo: number, hi: number): number {
  const j = upperBound(p.x, lo) - 1;
  const k = lowerBound(p.x, hi) - 1;
  const w = (i: number): number => (i >= 0 && i + 1 < p.n ? p.x[i + 1] - p.x[i] : Infinity);
  return Math.min(w(j), w(k));
}

function sortedOverlap(p: SortedPrep, L: Levels, merge: boolean): Raw {
  const whole: Flat = [];
  const touch: Flat = [];
  for (let i = 0; i + 1 < p.n; i++) {
    const x0 = p.x[i];
    const x1 = p.x[i + 1];
    if (!(x1 > x0)) continue; // a vertical step: its two sides are handled by the neighbouring segments
    const a = p.v[i];
    const b = p.v[i + 1];
    segmentAtOrBelow(whole, x0, x1, a, b, L.lo);
    segmentAtOrBelow(touch, x0, x1, a, b, L.hi);
  }
  const bridge = (lo: number, hi: number): boolean => hi - lo < localSpacing(p, lo, hi);
  return finish(whole, touch, merge, bridge);
}

// The E/N detail is taken over the interval's interior: a vertical step or edge exactly at an end belongs to
// the neighbouring interval (it is what ends this one), so the ends are moved in by a negligible amount.
const INSET = 1e-12;

/** Lowest and highest sheared curve value over the interior of [lo, hi]: at its ends or at a sample inside. */
function sortedRangeOver(p: SortedPrep, lo: number, hi: number): [number, number] {
  const x0 = lo + INSET * (hi - lo);
  const x1 = hi - INSET * (hi - lo);
  const a = sortedValueAt(p, x0);
  const b = sortedValueAt(p, x1);
  let min = Math.min(a, b);
  let max = Math.max(a, b);
  for (let j = lowerBound(p.x, x0); j < p.n && p.x[j] <= x1; j++) {
    min = Math.min(min, p.v[j]);
    max = Math.max(max, p.v[j]);
  }
  return [min, max];
}

// ---------------------------------------------------------------------------------------------------------
// Closed regions.

/** Masses (ln) where the horizontal line v = c lies inside the polygon (even-odd rule). */
function insideAlongLevel(p: PolygonPrep, c: number): Flat {
  if (!Number.isFinite(c)) return [];
  const xs: number[] = [];
  for (let i = 0; i < p.n; i++) {
    const j = i + 1 === p.n ? 0 : i + 1;
    const vi = p.v[i];
    const vj = p.v[j];
    // Half-open rule: a vertex exactly on the level counts once, so the crossings always pair up.
    if (vi > c !== vj > c) xs.push(p.x[i] + ((c - vi) / (vj - vi)) * (p.x[j] - p.x[i]));
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
    const vi = p.v[i];
    const dv = p.v[j] - vi;
    let t0: number;
    let t1: number;
    if (dv === 0) {
      if (vi < lo || vi > hi) continue;
      t0 = 0;
      t1 = 1;
    } else {
      const ta = (lo - vi) / dv;
      const tb = (hi - vi) / dv;
      t0 = Math.max(0, Math.min(ta, tb));
      t1 = Math.min(1, Math.max(ta, tb));
      if (!(t0 <= t1)) continue;
    }
    const dx = p.x[j] - p.x[i];
    const xa = p.x[i] + t0 * dx;
    const xb = p.x[i] + t1 * dx;
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
    for (let q = lowerBound(xs, e0); q < xs.length && xs[q] <= e1; q++) width[q] = Math.min(width[q], e1 - e0);
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
    const q = lowerBound(xs, x);
    return q < xs.length && xs[q] === x ? width[q] : 0;
  };
  return (lo, hi) => hi - lo < Math.min(at(lo), at(hi));
}

function polygonOverlap(p: PolygonPrep, L: Levels, merge: boolean): Raw {
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
function polygonRangeOver(p: PolygonPrep, parts: Flat): { min: number[]; max: number[] } {
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
    for (let q = lowerBound(his, e0); q < k && parts[2 * q] <= e1; q++) {
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

// ---------------------------------------------------------------------------------------------------------
// Assembly.

interface Raw {
  whole: Flat;
  part: Flat;
  gaps: Flat;
}

function finish(
  whole: Flat,
  touch: Flat,
  merge: boolean,
  bridge: (lo: number, hi: number) => boolean,
  lineOnly = false,
): Raw {
  if (!merge) return { whole, part: lineOnly ? [] : subtractFlat(touch, whole), gaps: [] };
  const w = bridgeGaps(whole, bridge);
  if (lineOnly) return { whole: w.merged, part: [], gaps: w.gaps };
  const t = bridgeGaps(touch, bridge);
  // A bridged gap of `whole` may hold a narrower gap of `touch` that was not bridged; whole must stay in touch.
  const touched = unionFlat(t.merged, w.merged);
  return { whole: w.merged, part: subtractFlat(touched, w.merged), gaps: unionUnsorted([...w.gaps, ...t.gaps]) };
}

function toIntervals(flat: Flat, toMass: (x: number) => number): Interval[] {
  const out: Interval[] = [];
  for (let i = 0; i < flat.length; i += 2) {
    const lo = toMass(flat[i]);
    const hi = toMass(flat[i + 1]);
    if (hi > lo) out.push([lo, hi]);
  }
  return out;
}

function constantsFor(model: OverlapModel, opts: OverlapOptions): AxionConstants {
  return opts.constants ?? model.constants ?? resolveConstants({ ref: model.ref });
}

/**
 * The overlap of a model line or band with one curve, with the detail the overlap table needs.
 *
 * Semantics (closed convention: the curve itself belongs to the excluded side):
 * - exclusion: at a mass m inside the curve's mass range, with G(m) the curve interpolated linearly in
 *   log-log space, an E/N is excluded when its g(m) ≥ G(m). `whole` where the band's lower edge has
 *   g_low(m) ≥ G(m); `part` where g_high(m) ≥ G(m) > g_low(m). Points are sorted by mass first.
 * - projection: the same comparison, read as "within reach".
 * - region: the points in file order form a closed polygon in log-log space (even-odd rule, boundary
 *   included); `whole` where the band's vertical segment [g_low, g_high] at m lies inside it entirely
 *   (a line: where its point is inside), `part` where the segment meets the region without lying inside.
 * - the band edges are those of bandEdges (theory spread: c_γ ± kσ and K ± kσ). When the lower edge is 0
 *   (cancellation) `whole` is empty: no finite limit or bounded region covers g → 0.
 * - Nothing is claimed outside the curve's mass range; isolated touching points are not reported.
 * - Gap merging (`mergeGaps`, default on): two intervals of the same kind are joined when the gap between
 *   them is narrower (in ln m) than one sample spacing: for exclusion and projection curves the smaller
 *   width of the two curve segments holding the gap's ends; for regions the smallest x-width of the
 *   polygon edges spanning either end (0 at a vertical edge, so a drawn notch is never bridged). Such a
 *   gap rests on a single sample and is not resolved by the data. Whole intervals are merged first; what
 *   remains of the band's partial overlap fills the rest.
 *
 * Complexity: O(n) per call for n points (crossing lists of a region are sorted, O(k log k) for k crossings);
 * the per-curve preparation (logs, sorting) is cached on the curve's arrays, which must not be mutated.
 *
 * @param model E/N interval (min = max for a line), theory spread k (@default 0), reference (@default "2019").
 * @param curve masses in eV, couplings in GeV⁻¹, role; optional `gFactor` (@default 1) rescales the couplings.
 * @param opts custom constants; `mergeGaps` (@default true).
 */
export function overlapDetail(model: OverlapModel, curve: OverlapCurve, opts: OverlapOptions = {}): OverlapDetail {
  const c = constantsFor(model, opts);
  const factor = curve.gFactor ?? 1;
  const lnFactor = factor > 0 && Number.isFinite(factor) ? Math.log(factor) : 0;
  const merge = opts.mergeGaps ?? true;
  const L = modelLevels(model, c, lnFactor);
  const cancels = L.lo === -Infinity;
  const line = model.eOverNMin === model.eOverNMax;
  const empty: OverlapDetail = {
    whole: [],
    part: [],
    partEOverN: [],
    partEOverNThroughout: curve.role === "region" ? null : [],
    none: [],
    massRangeEv: null,
    cancels,
    line,
    bridgedGapsEv: [],
    skippedPoints: 0,
  };
  if (!Number.isFinite(model.eOverNMin) || !Number.isFinite(model.eOverNMax)) return empty;

  if (curve.role === "region") {
    const p = preparePolygon(curve.massEv, curve.gInvGeV);
    empty.skippedPoints = p.skipped;
    if (p.n < 3 || !(p.xMax > p.xMin)) return empty;
    const toMass = (x: number): number => (x <= p.xMin ? p.massMin : x >= p.xMax ? p.massMax : Math.exp(x));
    const raw = polygonOverlap(p, L, merge);
    const range = polygonRangeOver(p, raw.part);
    const partEOverN = range.min.map((vMin, q) =>
      eOverNWithAbsIn(
        L,
        normalizedOfLevel(vMin + lnFactor, L.kLow) - L.dc,
        normalizedOfLevel(range.max[q] + lnFactor, L.kHigh) + L.dc,
      ),
    );
    return assemble(raw, [p.xMin, p.xMax], toMass, partEOverN, null, cancels, line, p.skipped);
  }

  const p = prepareSorted(curve.massEv, curve.gInvGeV);
  empty.skippedPoints = p.skipped;
  if (p.n < 2 || !(p.x[p.n - 1] > p.x[0])) return empty;
  const toMass = (x: number): number => {
    // Boundaries at a sample keep the sample's own mass (no exp∘log round-off at the range ends).
    const j = lowerBound(p.x, x);
    if (j < p.n && p.x[j] === x) return p.mass[j];
    return Math.min(p.mass[p.n - 1], Math.max(p.mass[0], Math.exp(x)));
  };
  const raw = sortedOverlap(p, L, merge);
  const partEOverN: [number, number][][] = [];
  const throughout: [number, number][][] = [];
  for (let i = 0; i < raw.part.length; i += 2) {
    const [vMin, vMax] = sortedRangeOver(p, raw.part[i], raw.part[i + 1]);
    // Somewhere: the E/N's own spread top reaches the curve's lowest point; throughout: its spread bottom
    // stays above the curve's highest point.
    partEOverN.push(eOverNWithAbsIn(L, normalizedOfLevel(vMin + lnFactor, L.kLow) - L.dc, Infinity));
    throughout.push(eOverNWithAbsIn(L, normalizedOfLevel(vMax + lnFactor, L.kHigh) + L.dc, Infinity));
  }
  return assemble(raw, [p.x[0], p.x[p.n - 1]], toMass, partEOverN, throughout, cancels, line, p.skipped);
}

function assemble(
  raw: Raw,
  range: [number, number],
  toMass: (x: number) => number,
  partEOverN: [number, number][][],
  throughout: [number, number][][] | null,
  cancels: boolean,
  line: boolean,
  skipped: number,
): OverlapDetail {
  const whole = toIntervals(raw.whole, toMass);
  // Keep partEOverN aligned with the intervals that survive the conversion to eV.
  const part: Interval[] = [];
  const partE: [number, number][][] = [];
  const partT: [number, number][][] = [];
  for (let i = 0; i < raw.part.length; i += 2) {
    const lo = toMass(raw.part[i]);
    const hi = toMass(raw.part[i + 1]);
    if (hi > lo) {
      part.push([lo, hi]);
      partE.push(partEOverN[i / 2]);
      if (throughout) partT.push(throughout[i / 2]);
    }
  }
  const none = subtractFlat([range[0], range[1]], unionFlat(raw.whole, raw.part));
  return {
    whole,
    part,
    partEOverN: partE,
    partEOverNThroughout: throughout ? partT : null,
    none: toIntervals(none, toMass),
    massRangeEv: [toMass(range[0]), toMass(range[1])],
    cancels,
    line,
    bridgedGapsEv: toIntervals(raw.gaps, toMass),
    skippedPoints: skipped,
  };
}

/**
 * Mass intervals (eV) where a model line or band overlaps a curve: `whole` where every E/N of the interval
 * is excluded (within reach, inside the region), `part` where some but not all are. Ascending, disjoint,
 * merged across gaps narrower than one sample; `part` is empty for a line without theory spread. See
 * {@link overlapDetail} for the exact semantics and the extra detail (E/N sub-intervals, cancellation).
 * @param model E/N interval, theory spread `sigmas` (@default 0), `ref` (@default "2019").
 * @param curve masses in eV, couplings in GeV⁻¹, role.
 * @param opts custom constants (`constants`), `mergeGaps` (@default true).
 */
export function overlap(model: OverlapModel, curve: OverlapCurve, opts: OverlapOptions = {}): OverlapResult {
  const d = overlapDetail(model, curve, opts);
  return { whole: d.whole, part: d.part };
}
