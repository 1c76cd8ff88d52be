// Checks of the thinning to pixel resolution: the first/min/max/last envelope per pixel column (the "M4"
// aggregation of Jugel, Jerzak, Hackenbroich, Markl, PVLDB 7 (2014) 797, from memory), the pyramid shortcut,
// Douglas–Peucker error bounds for regions, and Sutherland–Hodgman clipping.
import { describe, expect, test } from "vitest";
import {
  buildPyramid,
  clipToRect,
  curvePixels,
  dpImportance,
  pathData,
  pathDataCompact,
  pixelColumn,
  prepareCurve,
  simplifyIndices,
  thinColumns,
  thinRunsLog,
  viewArrays,
  type PixelParams,
} from "../../../src/plot/index";
import { parsePath, rng } from "../fixture";

/** Random sorted log-mass data with noise and a few tall spikes. */
function sortedData(n: number, seed: number) {
  const r = rng(seed);
  const lm = new Float64Array(n);
  const v = new Float64Array(n);
  let x = -8;
  for (let i = 0; i < n; i++) {
    x += r() * (6 / n) * 2 * (r() < 0.01 ? 20 : 1); // uneven spacing, occasional gaps
    lm[i] = x;
    v[i] = -12 + Math.sin(3 * x) + 0.3 * (r() - 0.5) + (r() < 0.002 ? 3 : 0) - (r() < 0.002 ? 3 : 0);
  }
  return { lm, v };
}

/** Per pixel column: first and last index, min and max value, over the indices given (or all of [start, end)). */
function envelope(lm: Float64Array, v: Float64Array, idx: ArrayLike<number>, colL0: number, colK: number) {
  const cols = new Map<number, { first: number; last: number; min: number; max: number; count: number }>();
  for (let k = 0; k < idx.length; k++) {
    const i = idx[k];
    const c = pixelColumn(lm[i], colL0, colK);
    const e = cols.get(c);
    if (!e) cols.set(c, { first: i, last: i, min: v[i], max: v[i], count: 1 });
    else {
      e.first = Math.min(e.first, i);
      e.last = Math.max(e.last, i);
      e.min = Math.min(e.min, v[i]);
      e.max = Math.max(e.max, v[i]);
      e.count++;
    }
  }
  return cols;
}

describe("column thinning of sorted curves", () => {
  for (const [n, res, seed] of [
    [20000, 1, 1],
    [20000, 2.5, 2],
    [3000, 0.5, 3],
    [100000, 1.25, 4],
  ] as const) {
    test(`same first/last/min/max per pixel column as the full data (n = ${n}, resolution ${res})`, () => {
      const { lm, v } = sortedData(n, seed);
      const pyr = buildPyramid(v);
      const colL0 = lm[0] + 0.7;
      const lmHi = lm[n - 1] - 0.9;
      const colK = (800 / (lmHi - colL0)) * res;
      const kept = thinColumns(lm, v, pyr, { lmLo: colL0, lmHi, colL0, colK });
      // the full data of the window, plus one point either side (so lines enter the frame)
      const start = lm.findIndex((x) => x >= colL0) - 1;
      let end = lm.findIndex((x) => x > lmHi) + 1;
      if (end === 0) end = n;
      const all = Array.from({ length: end - start }, (_, k) => start + k);
      const full = envelope(lm, v, all, colL0, colK);
      const thin = envelope(lm, v, kept, colL0, colK);
      expect([...thin.keys()].sort((a, b) => a - b)).toEqual([...full.keys()].sort((a, b) => a - b));
      for (const [c, e] of full) {
        const t = thin.get(c)!;
        expect(t.first).toBe(e.first);
        expect(t.last).toBe(e.last);
        expect(t.min).toBe(e.min);
        expect(t.max).toBe(e.max);
        expect(t.count).toBeLessThanOrEqual(4);
      }
      // indices strictly increasing: the path keeps the data order
      for (let k = 1; k < kept.length; k++) expect(kept[k]).toBeGreaterThan(kept[k - 1]);
      expect(kept[0]).toBe(start);
      expect(kept[kept.length - 1]).toBe(end - 1);
    });
  }

  test("the pyramid gives the same envelope as a plain scan", () => {
    const { lm, v } = sortedData(50000, 9);
    const p = { lmLo: lm[0], lmHi: lm[lm.length - 1], colL0: lm[0], colK: 120 };
    const a = thinColumns(lm, v, buildPyramid(v), p);
    const b = thinColumns(lm, v, null, p);
    const ea = envelope(lm, v, a, p.colL0, p.colK);
    const eb = envelope(lm, v, b, p.colL0, p.colK);
    expect(ea.size).toBe(eb.size);
    for (const [c, e] of eb) {
      expect(ea.get(c)!.min).toBe(e.min);
      expect(ea.get(c)!.max).toBe(e.max);
    }
  });

  test("a single spike among 100,000 points survives zooming out to a few columns", () => {
    const n = 100000;
    const lm = new Float64Array(n);
    const v = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      lm[i] = -6 + (2 * i) / n;
      v[i] = -12;
    }
    v[61234] = -8;
    v[7777] = -15;
    const kept = thinColumns(lm, v, buildPyramid(v), { lmLo: -6, lmHi: -4, colL0: -6, colK: 3 });
    expect(Array.from(kept)).toContain(61234);
    expect(Array.from(kept)).toContain(7777);
    expect(kept.length).toBeLessThanOrEqual(4 * 7);
  });

  test("thinned path through curvePixels: at most 4 points per device-pixel column, numbers with ≤ 2 decimals", () => {
    const r = rng(5);
    const n = 40000;
    const m = new Float64Array(n);
    const g = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      m[i] = 10 ** (-7 + (5 * i) / n);
      g[i] = 10 ** (-13 + r());
    }
    const prep = prepareCurve(m, g, true);
    const plot = { x: 50, y: 20, w: 500, h: 300 };
    const bx = plot.w / 5;
    const params: PixelParams = {
      ax: plot.x + 7 * bx,
      bx,
      ay: plot.y + plot.h - (-300 / 8) * -17,
      by: -300 / 8,
      slope: 0,
      yOffset: 0,
      plot,
      resolution: 2,
    };
    const d = pathData(curvePixels(prep, false, params));
    expect(d).not.toMatch(/\d\.\d{3}/);
    const pts = parsePath(d)[0].points;
    // Rounding to 0.01 px can move a point across a column edge, so columns are counted over the points
    // that are more than 0.006 px from an edge; those must never exceed 4.
    const perCol = new Map<number, number>();
    for (const [x] of pts) {
      const u = (x - plot.x) * 2;
      if (Math.abs(u - Math.round(u)) < 0.012) continue;
      const c = Math.floor(u);
      perCol.set(c, (perCol.get(c) ?? 0) + 1);
    }
    expect(Math.max(...perCol.values())).toBeLessThanOrEqual(4);
    expect(pts.length).toBeLessThanOrEqual(4 * 1000 + 8);
    expect(pts.length).toBeGreaterThan(1000);
  });
});

describe("simplification of unsorted curves and closed regions", () => {
  /** Distance from a point to a segment. */
  function segDist(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
    const dx = bx - ax;
    const dy = by - ay;
    const l2 = dx * dx + dy * dy;
    const t = l2 === 0 ? 0 : Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / l2));
    return Math.hypot(px - ax - t * dx, py - ay - t * dy);
  }

  /** An ellipse in log space (around 10⁻⁴ eV, 10⁻¹¹ GeV⁻¹) with a slow wobble and a little noise. */
  function wobblyRegion(n: number, seed: number) {
    const r = rng(seed);
    const m = new Float64Array(n);
    const g = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const t = (2 * Math.PI * i) / (n - 1);
      const w = 1 + 0.05 * Math.sin(17 * t) + 0.001 * (r() - 0.5);
      m[i] = 10 ** (-4 + 0.8 * w * Math.cos(t));
      g[i] = 10 ** (-11 + 0.6 * w * Math.sin(t));
    }
    return { m, g };
  }

  test("a wobbly region stays closed and within 0.5 px of the original (Douglas & Peucker, Canadian Cartographer 10 (1973) 112)", () => {
    const n = 20000;
    const { m, g } = wobblyRegion(n, 11);
    const prep = prepareCurve(m, g, false);
    const plot = { x: 0, y: 0, w: 900, h: 600 };
    const bx = 900 / 2; // 2 decades across
    const by = -600 / 2;
    const params: PixelParams = { ax: -bx * -5, bx, ay: 600 - by * -12, by, slope: 0, yOffset: 0, plot, resolution: 1 };
    const poly = curvePixels(prep, true, params);
    expect(poly.closed).toBe(true);
    expect(poly.n).toBeLessThan(n / 4);
    const d = pathData(poly);
    expect(d.endsWith("Z")).toBe(true);
    const sub = parsePath(d)[0].points;
    // every original point lies within 0.5 px (+0.01 px rounding) of the simplified closed outline
    let worst = 0;
    for (let i = 0; i < n; i += 7) {
      const px = params.ax + bx * Math.log10(m[i]);
      const py = params.ay + by * Math.log10(g[i]);
      let best = Infinity;
      for (let k = 0; k < sub.length; k++) {
        const [ax, ay] = sub[k];
        const [qx, qy] = sub[(k + 1) % sub.length];
        best = Math.min(best, segDist(px, py, ax, ay, qx, qy));
      }
      worst = Math.max(worst, best);
    }
    expect(worst).toBeLessThanOrEqual(0.5 + 0.01);
    // and the simplified outline only uses original points (no point is moved)
    const orig = new Set<string>();
    for (let i = 0; i < n; i++)
      orig.add(
        `${Math.round((params.ax + bx * Math.log10(m[i])) * 100)},${Math.round((params.ay + by * Math.log10(g[i])) * 100)}`,
      );
    expect(sub.every(([x, y]) => orig.has(`${Math.round(x * 100)},${Math.round(y * 100)}`))).toBe(true);
  });

  test("zooming in and out, each frame's simplification equals that of a fresh copy of the curve", () => {
    // The Douglas–Peucker selection is carried from frame to frame (grown or cut as the tolerance changes);
    // a fresh copy has no history. The tolerances cover both directions and repeats.
    const { m, g } = wobblyRegion(30000, 12);
    const prep = prepareCurve(m, g, false);
    const plot = { x: 0, y: 0, w: 900, h: 600 };
    const at = (decades: number): PixelParams => {
      const bx = 900 / decades;
      const by = -600 / (0.75 * decades);
      return {
        ax: -bx * (-4 - decades / 2),
        bx,
        ay: 600 - by * (-11 - 0.375 * decades),
        by,
        slope: 0,
        yOffset: 0,
        plot,
        resolution: 1,
        reuse: true,
      };
    };
    const points = (pl: { xs: Float64Array; ys: Float64Array; n: number }) => [
      Array.from(pl.xs.subarray(0, pl.n)),
      Array.from(pl.ys.subarray(0, pl.n)),
    ];
    let kinds = 0;
    for (const decades of [2, 1.8, 1.65, 1.65, 1.8, 2, 2.5, 4, 1.7, 3]) {
      const carried = points(curvePixels(prep, true, at(decades)));
      const fresh = points(curvePixels(prepareCurve(m.slice(), g.slice(), false), true, at(decades)));
      expect(carried[0].length).toBeGreaterThan(40);
      expect(carried).toEqual(fresh);
      kinds++;
    }
    expect(kinds).toBe(10);
  });

  test("importance is parent-clamped: the kept set shrinks monotonically with the tolerance", () => {
    const r = rng(3);
    const n = 5000;
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      x[i] = i / n + 0.001 * r();
      y[i] = Math.sin(9 * x[i]) + 0.05 * r();
    }
    const imp = dpImportance(x, y);
    expect(imp[0]).toBe(Infinity);
    expect(imp[n - 1]).toBe(Infinity);
    let prev = n + 1;
    for (const tol of [1e-5, 1e-4, 1e-3, 1e-2, 1e-1]) {
      const k = simplifyIndices(imp, tol).length;
      expect(k).toBeLessThanOrEqual(prev);
      prev = k;
    }
    expect(prev).toBeLessThan(60);
  });
});

describe("run thinning and path encoding", () => {
  test("run thinning of a noisy outline stays within τ of the original, both ways (Hausdorff)", () => {
    const r = rng(21);
    const n = 6000;
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const t = (2 * Math.PI * i) / n;
      x[i] = 300 + 200 * Math.cos(t) + 3 * (r() - 0.5); // ±1.5 px noise across the outline
      y[i] = 200 + 120 * Math.sin(t) + 3 * (r() - 0.5);
    }
    const tau = 0.5;
    const kept = thinRunsLog(x, y, tau, tau);
    expect(kept.length).toBeLessThan(n);
    expect(kept[0]).toBe(0);
    expect(kept[kept.length - 1]).toBe(n - 1);
    const segDist = (px: number, py: number, k: number) => {
      const ax = x[kept[k]];
      const ay = y[kept[k]];
      const dx = x[kept[k + 1]] - ax;
      const dy = y[kept[k + 1]] - ay;
      const l2 = dx * dx + dy * dy;
      const t = l2 === 0 ? 0 : Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / l2));
      return Math.hypot(px - ax - t * dx, py - ay - t * dy);
    };
    // original → simplified: each original point lies near one of the kept segments of its run (the run
    // keeps at most 4 points, so the segments within 3 of its position in the order)
    let k = 0;
    let worst = 0;
    for (let i = 0; i < n; i++) {
      while (k < kept.length - 2 && kept[k + 1] <= i) k++;
      let d = Infinity;
      for (let q = Math.max(0, k - 3); q <= Math.min(kept.length - 2, k + 3); q++)
        d = Math.min(d, segDist(x[i], y[i], q));
      worst = Math.max(worst, d);
    }
    expect(worst).toBeLessThanOrEqual(tau + 1e-9);
    // simplified → original: every kept segment's midpoint lies within τ of the original polyline
    for (let q = 0; q + 1 < kept.length; q++) {
      const mx = (x[kept[q]] + x[kept[q + 1]]) / 2;
      const my = (y[kept[q]] + y[kept[q + 1]]) / 2;
      let best = Infinity;
      for (let i = kept[q]; i < kept[q + 1]; i++) {
        const dx = x[i + 1] - x[i];
        const dy = y[i + 1] - y[i];
        const l2 = dx * dx + dy * dy;
        const t = l2 === 0 ? 0 : Math.max(0, Math.min(1, ((mx - x[i]) * dx + (my - y[i]) * dy) / l2));
        best = Math.min(best, Math.hypot(mx - x[i] - t * dx, my - y[i] - t * dy));
      }
      expect(best).toBeLessThanOrEqual(tau + 1e-9);
    }
  });

  test("compact path data (relative moves) lands on the same rounded vertices as absolute path data", () => {
    const r = rng(8);
    const n = 2000;
    const xs = new Float64Array(n);
    const ys = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      xs[i] = i % 7 === 0 && i > 0 ? xs[i - 1] : 20 + 900 * r();
      ys[i] = i % 5 === 0 && i > 0 ? ys[i - 1] : -50 + 600 * r();
    }
    const poly = { xs, ys, n, closed: true };
    const abs = parsePath(pathData(poly))[0];
    const rel = parsePath(pathDataCompact(poly))[0];
    expect(rel.closed).toBe(true);
    // repeated vertices are dropped by the compact form; compare the distinct sequence
    const distinct = abs.points.filter(
      (p, i) => i === 0 || p[0] !== abs.points[i - 1][0] || p[1] !== abs.points[i - 1][1],
    );
    expect(rel.points.length).toBe(distinct.length);
    rel.points.forEach(([x, y], i) => {
      expect(x).toBeCloseTo(distinct[i][0], 6);
      expect(y).toBeCloseTo(distinct[i][1], 6);
    });
    expect(pathDataCompact(poly).length).toBeLessThan(pathData(poly).length);
  });
});

describe("clipping and caching", () => {
  test("Sutherland–Hodgman keeps the part of a polygon inside the rectangle (Sutherland & Hodgman, CACM 17 (1974) 32)", () => {
    const sq = {
      xs: Float64Array.from([-10, 10, 10, -10]),
      ys: Float64Array.from([-10, -10, 10, 10]),
      n: 4,
      closed: true,
    };
    const c = clipToRect(sq, { x0: 0, y0: 0, x1: 100, y1: 100 });
    let area = 0;
    for (let i = 0; i < c.n; i++) {
      const j = (i + 1) % c.n;
      area += c.xs[i] * c.ys[j] - c.xs[j] * c.ys[i];
    }
    expect(Math.abs(area / 2)).toBeCloseTo(100, 9);
    for (let i = 0; i < c.n; i++) {
      expect(c.xs[i]).toBeGreaterThanOrEqual(0);
      expect(c.ys[i]).toBeGreaterThanOrEqual(0);
    }
  });

  test("points far off the plot are clipped to a few plot sizes, the visible part of the line unchanged", () => {
    const line = { xs: Float64Array.from([0, 100]), ys: Float64Array.from([50, -1e9]), n: 2, closed: false };
    const c = clipToRect(line, { x0: -300, y0: -300, x1: 400, y1: 400 });
    expect(c.n).toBe(2);
    expect(c.ys[1]).toBe(-300);
    // slope preserved: the clipped end lies on the original line
    expect(c.xs[1]).toBeCloseTo((100 * 350) / (1e9 + 50), 9);
  });

  test("prepared arrays are cached per data array; non-positive points are skipped and counted", () => {
    const m = Float64Array.from([3e-6, 1e-6, 0, 2e-6, -1, 4e-6]);
    const g = Float64Array.from([1e-12, 2e-12, 1e-12, 0, 5e-12, NaN]);
    const a = prepareCurve(m, g, true);
    expect(prepareCurve(m, g, true)).toBe(a);
    expect(a.n).toBe(2);
    expect(a.skipped).toBe(4);
    expect(Array.from(a.lm)).toEqual([Math.log10(1e-6), Math.log10(3e-6)]);
    expect(prepareCurve(m, Float64Array.from(g), true)).not.toBe(a);
    const unsorted = prepareCurve(m, g, false);
    expect(Array.from(unsorted.lm)).toEqual([Math.log10(3e-6), Math.log10(1e-6)]);
    const va = viewArrays(a, -1);
    expect(va.v[0]).toBeCloseTo(Math.log10(2e-12) - Math.log10(1e-6), 12);
  });
});
