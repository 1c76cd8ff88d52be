// The share of a model band's area (in log m × log g, over the curve's mass range) that a curve excludes, reaches
// or contains. The shear v = ln g − ln m keeps areas, so the band is the strip lo ≤ v ≤ hi there.
import type { Levels } from "./levels";
import type { PolygonPrep, SortedPrep } from "./prepare";

/** The covered fraction clamp((hi − v)/(hi − lo), 0, 1) of the strip at sheared value v. */
function fraction(v: number, lo: number, hi: number): number {
  return Math.min(1, Math.max(0, (hi - v) / (hi - lo)));
}

/**
 * ∫ clamp((hi − v)/(hi − lo), 0, 1) dx over one segment where v runs linearly from a to b. Runs once per segment
 * of every curve against every band, so it allocates nothing and settles the common all-or-nothing cases first.
 */
function segmentCovered(x0: number, x1: number, a: number, b: number, lo: number, hi: number): number {
  if (a <= lo && b <= lo) return x1 - x0;
  if (a >= hi && b >= hi) return 0;
  if (a === b) return fraction(a, lo, hi) * (x1 - x0);
  // The clamped fraction is linear between the parameters where v crosses lo and hi, so the trapezoid rule on
  // the three pieces [0, t1], [t1, t2], [t2, 1] is exact.
  const tLo = Math.min(1, Math.max(0, (lo - a) / (b - a)));
  const tHi = Math.min(1, Math.max(0, (hi - a) / (b - a)));
  const t1 = Math.min(tLo, tHi);
  const t2 = Math.max(tLo, tHi);
  const f0 = fraction(a, lo, hi);
  const f1 = fraction(a + t1 * (b - a), lo, hi);
  const f2 = fraction(a + t2 * (b - a), lo, hi);
  const f3 = fraction(b, lo, hi);
  const sum = ((f0 + f1) / 2) * t1 + ((f1 + f2) / 2) * (t2 - t1) + ((f2 + f3) / 2) * (1 - t2);
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

/** Scratch for the clipped polygons: each clip at most doubles the vertex count; grown, never shrunk. */
let scratch = new Float64Array(0);

/**
 * Keeps the part of the closed polygon (x, v)[0..n) with sign·(v − level) ≥ 0 (one Sutherland–Hodgman pass),
 * written to ox/ov; returns its vertex count.
 */
function clip(
  x: Float64Array,
  v: Float64Array,
  n: number,
  level: number,
  sign: 1 | -1,
  ox: Float64Array,
  ov: Float64Array,
): number {
  let m = 0;
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    const inI = sign * (v[i] - level) >= 0;
    const inJ = sign * (v[j] - level) >= 0;
    if (inI) {
      ox[m] = x[i];
      ov[m++] = v[i];
    }
    if (inI !== inJ) {
      const t = (level - v[i]) / (v[j] - v[i]);
      ox[m] = x[i] + t * (x[j] - x[i]);
      ov[m++] = level;
    }
  }
  return m;
}

/**
 * Share of the band's area inside a closed region: area(region ∩ strip) / area(strip over the region's mass
 * range), by clipping to the strip and the shoelace formula (exact for a simple polygon; a self-crossing
 * outline counts its lobes with their winding sign).
 */
export function polygonAreaShare(p: PolygonPrep, L: Levels): number | null {
  if (!(L.hi > L.lo) || !Number.isFinite(L.lo) || !Number.isFinite(L.hi) || !(p.xMax > p.xMin)) return null;
  // Two clips: the first at most 2n vertices, the second at most 4n; four arrays side by side in one buffer.
  const n = p.n;
  if (scratch.length < 12 * n) scratch = new Float64Array(12 * n);
  const x1 = scratch.subarray(0, 2 * n);
  const v1 = scratch.subarray(2 * n, 4 * n);
  const x2 = scratch.subarray(4 * n, 8 * n);
  const v2 = scratch.subarray(8 * n, 12 * n);
  const m1 = clip(p.x, p.v, n, L.lo, 1, x1, v1);
  const m2 = clip(x1, v1, m1, L.hi, -1, x2, v2);
  let twice = 0;
  for (let i = 0; i < m2; i++) {
    const j = i + 1 === m2 ? 0 : i + 1;
    twice += x2[i] * v2[j] - x2[j] * v2[i];
  }
  return Math.min(1, Math.abs(twice) / 2 / ((L.hi - L.lo) * (p.xMax - p.xMin)));
}
