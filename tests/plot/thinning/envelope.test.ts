// Checks of the min–max envelope of dense pixel columns (src/plot/thinning/envelope.ts): the envelope covers
// the zig-zag it replaces, reaches no further than a stroke and one column from it, and the thin line that
// stays is the thinned line with only dense columns' interior points taken out.
import { describe, expect, test } from "vitest";
import { curvePixels, prepareCurve } from "../../../src/plot/index";
import type { Polyline } from "../../../src/plot/thinning/clip";
import { envelopeSplit, type EnvelopeParams } from "../../../src/plot/thinning/envelope";
import { parsePath, rng } from "../fixture";
import { compactPolygons } from "../../../src/plot/path-writer";

const PLOT = { x: 40, y: 20, w: 600, h: 400 };

/** An invented noisy scan (log10 g noise of ±0.2 decades, 1 % spikes of 1.5 decades), sorted by mass. */
function scanPixels(n: number, seed: number, res: number, noise = 0.4, spikes = 0.01): Polyline {
  const r = rng(seed);
  const m = new Float64Array(n);
  const g = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const x = -6 + (2 * i) / (n - 1);
    m[i] = 10 ** x;
    g[i] = 10 ** (-12 + 0.15 * Math.sin(40 * x) + noise * (r() - 0.5) + (r() < spikes ? 1.5 : 0));
  }
  const prep = prepareCurve(m, g, true);
  const pl = curvePixels(prep, false, {
    ax: PLOT.x + 6.5 * 150,
    bx: 150,
    ay: PLOT.y + -9 * 50,
    by: -50,
    slope: 0,
    yOffset: 0,
    plot: PLOT,
    resolution: res,
  });
  return { xs: pl.xs.slice(), ys: pl.ys.slice(), n: pl.n, closed: false };
}

function paramsFor(res: number, widthPx = 1.8): EnvelopeParams {
  return { originX: PLOT.x, resolution: res, halfWidthPx: widthPx / 2, minSpanPx: widthPx };
}

/** The dense columns as the split defines them: ≥ 3 points spanning more than minSpanPx; [first, end) each. */
function denseColumns(pl: Polyline, p: EnvelopeParams): [number, number][] {
  const out: [number, number][] = [];
  let i = 0;
  while (i < pl.n) {
    const c = Math.floor((pl.xs[i] - p.originX) * p.resolution);
    let j = i;
    let lo = Infinity;
    let hi = -Infinity;
    while (j < pl.n && Math.floor((pl.xs[j] - p.originX) * p.resolution) === c) {
      lo = Math.min(lo, pl.ys[j]);
      hi = Math.max(hi, pl.ys[j]);
      j++;
    }
    if (j - i >= 3 && hi - lo > p.minSpanPx) out.push([i, j]);
    i = j;
  }
  return out;
}

interface Poly {
  pts: [number, number][];
  x0: number;
  x1: number;
  /** Edges by the whole px columns they touch (1 px either side for the distance test). */
  edges: Map<number, [number, number, number, number][]>;
}

/** The envelope's polygons read back from the path data the scene writes, with their x extent. */
function polygons(split: ReturnType<typeof envelopeSplit>): Poly[] {
  const b = split.band;
  return parsePath(compactPolygons(b.xs, b.ys, b.ends, b.count)).map(({ points }) => {
    const edges: Poly["edges"] = new Map();
    for (let k = 0, l = points.length - 1; k < points.length; l = k++) {
      const e: [number, number, number, number] = [...points[k], ...points[l]];
      const lo = Math.floor(Math.min(e[0], e[2])) - 1;
      const hi = Math.floor(Math.max(e[0], e[2])) + 1;
      for (let c = lo; c <= hi; c++) edges.set(c, [...(edges.get(c) ?? []), e]);
    }
    const xs = points.map(([x]) => x);
    return { pts: points, x0: Math.min(...xs), x1: Math.max(...xs), edges };
  });
}

/**
 * Even–odd crossing of a ray cast upwards (Shimrat, CACM 5 (1962) 434, from memory), or within `eps` of an
 * edge; only the edges over x (bucketed by whole px) are looked at.
 */
function insideOrOn(polys: Poly[], x: number, y: number, eps: number): boolean {
  for (const { x0, x1, edges } of polys) {
    if (x < x0 - eps || x > x1 + eps) continue;
    let inside = false;
    for (const [xk, yk, xl, yl] of edges.get(Math.floor(x)) ?? []) {
      if (segmentDistance(x, y, xk, yk, xl, yl) <= eps) return true;
      if (xk > x !== xl > x && y > ((yl - yk) * (x - xk)) / (xl - xk) + yk) inside = !inside;
    }
    if (inside) return true;
  }
  return false;
}

function segmentDistance(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const dx = bx - ax;
  const dy = by - ay;
  const len2 = dx * dx + dy * dy;
  const t = len2 > 0 ? Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / len2)) : 0;
  return Math.hypot(ax + t * dx - px, ay + t * dy - py);
}

describe("min–max envelope of dense columns", () => {
  for (const [res, seed] of [
    [1, 1],
    [2, 2],
    [1.5, 3],
  ] as const) {
    test(`covers every segment of the dense columns' zig-zag (resolution ${res})`, () => {
      const pl = scanPixels(60000, seed, res);
      const p = paramsFor(res);
      const dense = denseColumns(pl, p);
      expect(dense.length).toBeGreaterThan(100);
      const polys = polygons(envelopeSplit(pl, p));
      expect(polys.length).toBeGreaterThan(0);
      // Points along each segment inside a dense column (what its stroke is centred on); 0.01 px is the
      // rounding of the written path data.
      let checked = 0;
      for (const [i, j] of dense)
        for (let k = i; k < j - 1; k++)
          for (const t of [0, 0.25, 0.5, 0.75, 1]) {
            const x = pl.xs[k] + t * (pl.xs[k + 1] - pl.xs[k]);
            const y = pl.ys[k] + t * (pl.ys[k + 1] - pl.ys[k]);
            expect(insideOrOn(polys, x, y, 0.011), `segment ${k} at t = ${t}`).toBe(true);
            checked++;
          }
      expect(checked).toBeGreaterThan(1000);
    });

    test(`reaches no further than the stroke's half width and one column from the zig-zag (resolution ${res})`, () => {
      // The stroke of a segment (butt caps) is the segment widened by half the line width either side
      // (W3C SVG 1.1, section 11.4, 'stroke-width'): its bounding box lies within h·√2 + the segment's own
      // horizontal extent (at most a column) of it.
      const pl = scanPixels(60000, seed + 10, res);
      const p = paramsFor(res);
      const bound = p.halfWidthPx * Math.SQRT2 + 1 / res + 0.011;
      const dense = denseColumns(pl, p);
      for (const poly of polygons(envelopeSplit(pl, p)))
        for (const [x, y] of poly.pts) {
          let best = Infinity;
          for (const [i, j] of dense) {
            if (pl.xs[j - 1] < x - bound - 1 || pl.xs[i] > x + bound + 1) continue;
            for (let k = i; k < j - 1; k++)
              best = Math.min(best, segmentDistance(x, y, pl.xs[k], pl.ys[k], pl.xs[k + 1], pl.ys[k + 1]));
          }
          expect(best).toBeLessThanOrEqual(bound);
        }
    });
  }

  test("the line keeps every point of sparse columns and the first and last point of dense ones, in order", () => {
    const pl = scanPixels(30000, 5, 1);
    const p = paramsFor(1);
    const dense = denseColumns(pl, p);
    const interior = new Set<number>();
    for (const [i, j] of dense) for (let k = i + 1; k < j - 1; k++) interior.add(k);
    const expected: number[] = [];
    for (let k = 0; k < pl.n; k++) if (!interior.has(k)) expected.push(k);
    const { line } = envelopeSplit(pl, p);
    expect(line.n).toBe(expected.length);
    expect(line.n).toBeLessThan(pl.n);
    expected.forEach((k, q) => {
      expect(line.xs[q]).toBe(pl.xs[k]);
      expect(line.ys[q]).toBe(pl.ys[k]);
    });
  });

  test("a smooth curve has no dense column: no envelope, the line unchanged", () => {
    const pl = scanPixels(30000, 6, 1, 0, 0);
    const split = envelopeSplit(pl, paramsFor(1));
    expect(split.band.count).toBe(0);
    expect(Array.from(split.line.xs)).toEqual(Array.from(pl.xs));
    expect(Array.from(split.line.ys)).toEqual(Array.from(pl.ys));
  });

  test("columns apart (a gap in the data) end a run: one polygon per stretch", () => {
    // Two dense stretches 50 columns apart, each of 10 columns with 4 points spanning 20 px.
    const xs: number[] = [];
    const ys: number[] = [];
    for (const start of [100, 160])
      for (let c = start; c < start + 10; c++)
        for (const [dx, y] of [
          [0.1, 200],
          [0.3, 190],
          [0.6, 210],
          [0.9, 200],
        ]) {
          xs.push(PLOT.x + c + dx);
          ys.push(y);
        }
    const pl: Polyline = { xs: Float64Array.from(xs), ys: Float64Array.from(ys), n: xs.length, closed: false };
    const polys = polygons(envelopeSplit(pl, paramsFor(1)));
    expect(polys.length).toBe(2);
    for (const { pts } of polys) {
      const top = Math.min(...pts.map(([, y]) => y));
      const bottom = Math.max(...pts.map(([, y]) => y));
      // Steep zig-zag segments: their boxes reach the extremes plus next to nothing (h·|dx|/length).
      expect(top).toBeGreaterThan(190 - 0.1);
      expect(top).toBeLessThanOrEqual(190);
      expect(bottom).toBeLessThan(210 + 0.1);
      expect(bottom).toBeGreaterThanOrEqual(210);
    }
  });
});
