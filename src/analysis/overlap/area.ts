// The share of a model band's area (in log m × log g, over the curve's mass range) that a curve excludes, reaches
// or contains. The shear v = ln g − ln m keeps areas, so the band is the strip lo ≤ v ≤ hi there.
import type { Levels } from "./levels";
import type { PolygonPrep, SortedPrep } from "./prepare";

/** ∫ clamp((hi − v)/(hi − lo), 0, 1) dx over one segment where v runs linearly from a to b. */
function segmentCovered(x0: number, x1: number, a: number, b: number, lo: number, hi: number): number {
  const f = (v: number): number => Math.min(1, Math.max(0, (hi - v) / (hi - lo)));
  const ts = [0, 1];
  if (b !== a) {
    for (const level of [lo, hi]) {
      const t = (level - a) / (b - a);
      if (t > 0 && t < 1) ts.push(t);
    }
  }
  ts.sort((p, q) => p - q);
  let sum = 0;
  // Between the breakpoints the clamped fraction is linear, so the trapezoid rule is exact.
  for (let i = 0; i + 1 < ts.length; i++) {
    const va = a + ts[i] * (b - a);
    const vb = a + ts[i + 1] * (b - a);
    sum += ((f(va) + f(vb)) / 2) * (ts[i + 1] - ts[i]);
  }
  return sum * (x1 - x0);
}

/** Share of the band's area at or above an exclusion (projection) curve; null for a line or an unbounded band. */
export function sortedAreaShare(p: SortedPrep, L: Levels): number | null {
  if (!(L.hi > L.lo) || !Number.isFinite(L.lo) || !Number.isFinite(L.hi)) return null;
  const width = p.x[p.n - 1] - p.x[0];
  if (!(width > 0)) return null;
  let covered = 0;
  for (let i = 0; i + 1 < p.n; i++) {
    if (p.x[i + 1] > p.x[i]) covered += segmentCovered(p.x[i], p.x[i + 1], p.v[i], p.v[i + 1], L.lo, L.hi);
  }
  return covered / width;
}

/** Keeps the part of a closed polygon with sign·(v − level) ≥ 0 (one Sutherland–Hodgman pass). */
function clip(xs: number[], vs: number[], level: number, sign: 1 | -1): [number[], number[]] {
  const ox: number[] = [];
  const ov: number[] = [];
  const n = xs.length;
  for (let i = 0; i < n; i++) {
    const j = (i + 1) % n;
    const inI = sign * (vs[i] - level) >= 0;
    const inJ = sign * (vs[j] - level) >= 0;
    if (inI) {
      ox.push(xs[i]);
      ov.push(vs[i]);
    }
    if (inI !== inJ) {
      const t = (level - vs[i]) / (vs[j] - vs[i]);
      ox.push(xs[i] + t * (xs[j] - xs[i]));
      ov.push(level);
    }
  }
  return [ox, ov];
}

/**
 * Share of the band's area inside a closed region: area(region ∩ strip) / area(strip over the region's mass
 * range), by clipping to the strip and the shoelace formula (exact for a simple polygon; a self-crossing
 * outline counts its lobes with their winding sign).
 */
export function polygonAreaShare(p: PolygonPrep, L: Levels): number | null {
  if (!(L.hi > L.lo) || !Number.isFinite(L.lo) || !Number.isFinite(L.hi) || !(p.xMax > p.xMin)) return null;
  let [xs, vs] = clip(Array.from(p.x), Array.from(p.v), L.lo, 1);
  [xs, vs] = clip(xs, vs, L.hi, -1);
  let twice = 0;
  for (let i = 0; i < xs.length; i++) {
    const j = (i + 1) % xs.length;
    twice += xs[i] * vs[j] - xs[j] * vs[i];
  }
  return Math.min(1, Math.abs(twice) / 2 / ((L.hi - L.lo) * (p.xMax - p.xMin)));
}
