// The occupancy grid of the automatic legend placement (occupancy.ts), checked against brute-force
// references: fills by the nonzero winding rule (W3C, "Scalable Vector Graphics (SVG) 1.1 (Second Edition)",
// 2011, §11.3 'fill-rule'), line cells by exact segment–cell intersection (the grid walk of Amanatides & Woo,
// "A fast voxel traversal algorithm for ray tracing", Eurographics 1987, clipped as in Liang & Barsky, ACM
// TOG 3 (1984) 1); model shapes against the model paths drawn, read with the reference reader (SVG 1.1 §8.3).
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { defaultProject } from "../../src/project/demo";
import { buildScene } from "../../src/plot/scene";
import { constantsOf } from "../../src/plot/physics-settings";
import { logAffine } from "../../src/plot/scales";
import { fontsFor, presetOf } from "../../src/plot/layout";
import { modelGeometry } from "../../src/plot/models";
import {
  coveredFraction,
  emptyGrid,
  markFill,
  markSegment,
  occupancyGrid,
  type OccupancyGrid,
} from "../../src/plot/occupancy";
import { parsePath, paths, shapesOf } from "./fixture";

// ------------------------------------------------------------------------------------------ geometry pieces

/** Cells of the grid a segment meets (closed cells), by clipping it to each cell: the brute-force reference. */
function cellsMetBySegment(g: OccupancyGrid, xa: number, ya: number, xb: number, yb: number): Set<number> {
  const out = new Set<number>();
  for (let r = 0; r < g.rows; r++) {
    for (let c = 0; c < g.cols; c++) {
      const x0 = g.x0 + c * g.cellPx;
      const y0 = g.y0 + r * g.cellPx;
      let t0 = 0;
      let t1 = 1;
      const dx = xb - xa;
      const dy = yb - ya;
      const ok = (
        [
          [-dx, xa - x0],
          [dx, x0 + g.cellPx - xa],
          [-dy, ya - y0],
          [dy, y0 + g.cellPx - ya],
        ] as const
      ).every(([p, q]) => {
        if (p === 0) return q >= 0;
        const t = q / p;
        if (p < 0) t0 = Math.max(t0, t);
        else t1 = Math.min(t1, t);
        return true;
      });
      if (ok && t0 <= t1) out.add(r * g.cols + c);
    }
  }
  return out;
}

/** Winding number of a closed polygon around a point (the nonzero rule's count, by upward/downward crossings). */
function winding(xs: number[], ys: number[], px: number, py: number): number {
  let w = 0;
  for (let i = 0; i < xs.length; i++) {
    const j = (i + 1) % xs.length;
    const [xa, ya, xb, yb] = [xs[i], ys[i], xs[j], ys[j]];
    if (ya <= py !== yb <= py) {
      const x = xa + ((py - ya) * (xb - xa)) / (yb - ya);
      if (x < px) w += yb > ya ? 1 : -1;
    }
  }
  return w;
}

function marked(g: OccupancyGrid): Set<number> {
  const s = new Set<number>();
  g.cells.forEach((v, i) => v && s.add(i));
  return s;
}

describe("occupancy grid", () => {
  const plot = { x: 10.3, y: 5.7, w: 61, h: 43 };
  const coord = (lo: number, span: number) => fc.double({ min: lo - 20, max: lo + span + 20, noNaN: true });

  test("a segment marks exactly the cells it meets (property, 300 random segments in and around the grid)", () => {
    fc.assert(
      fc.property(
        coord(plot.x, plot.w),
        coord(plot.y, plot.h),
        coord(plot.x, plot.w),
        coord(plot.y, plot.h),
        (xa, ya, xb, yb) => {
          const g = emptyGrid(plot, 4);
          markSegment(g, xa, ya, xb, yb);
          expect(marked(g)).toEqual(cellsMetBySegment(g, xa, ya, xb, yb));
        },
      ),
      { numRuns: 300, seed: 42 },
    );
  });

  test("a fill marks exactly the cells whose centre has nonzero winding (property, random self-crossing polygons)", () => {
    const pt = fc.tuple(coord(plot.x, plot.w), coord(plot.y, plot.h));
    fc.assert(
      fc.property(fc.array(pt, { minLength: 3, maxLength: 12 }), (pts) => {
        const g = emptyGrid(plot, 4);
        const xs = pts.map((p) => p[0]);
        const ys = pts.map((p) => p[1]);
        markFill(g, [{ xs, ys, closed: false }]);
        const expected = new Set<number>();
        for (let r = 0; r < g.rows; r++)
          for (let c = 0; c < g.cols; c++)
            if (winding(xs, ys, g.x0 + (c + 0.5) * 4, g.y0 + (r + 0.5) * 4) !== 0) expected.add(r * g.cols + c);
        expect(marked(g)).toEqual(expected);
      }),
      { numRuns: 300, seed: 7 },
    );
  });

  test("nonzero, not even-odd: a square drawn twice the same way round stays filled (SVG 1.1 §11.3)", () => {
    const g = occupancyGrid(
      shapesOf([{ kind: "path", d: "M0 0H40V40H0ZM0 0H40V40H0Z", fill: "#000" }]),
      { x: 0, y: 0, w: 40, h: 40 },
      4,
    );
    expect(g.cells.every((v) => v === 1)).toBe(true);
    const holed = occupancyGrid(
      shapesOf([{ kind: "path", d: "M0 0H40V40H0ZM10 10V30H30V10Z", fill: "#000" }]),
      { x: 0, y: 0, w: 40, h: 40 },
      4,
    );
    // The inner square runs the other way round: a hole of 20 px, five 4-px cells each way.
    expect(holed.cells.reduce((a, v) => a + v, 0)).toBe(100 - 25);
  });

  test("covered fraction weighs partly covered cells by their overlap", () => {
    const g = emptyGrid({ x: 0, y: 0, w: 40, h: 40 }, 4);
    for (let r = 0; r < g.rows; r++) for (let c = 0; c < 5; c++) g.cells[r * g.cols + c] = 1; // x < 20 px
    expect(coveredFraction(g, { x: 0, y: 0, w: 40, h: 40 })).toBe(0.5);
    expect(coveredFraction(g, { x: 10, y: 3, w: 20, h: 17 })).toBeCloseTo(0.5, 12);
    expect(coveredFraction(g, { x: 18, y: 0, w: 4, h: 4 })).toBeCloseTo(0.5, 12);
    // Outside the grid counts as empty.
    expect(coveredFraction(g, { x: -40, y: 0, w: 80, h: 40 })).toBeCloseTo(0.25, 12);
  });
});

describe("model shapes", () => {
  test("are the model paths as drawn: the same vertices (to 0.01 px) and closure, read back with the reference reader", () => {
    const project = defaultProject();
    const scene = buildScene(project);
    const c = constantsOf(project.physics);
    const map = logAffine(scene.scales, scene.plot);
    const drawn = paths(scene, "models");
    let compared = 0;
    project.models.forEach((m, i) => {
      if (!m.visible) return;
      const frame = {
        constants: c,
        view: scene.scales.yView ?? "coupling",
        map,
        massDomainEv: scene.scales.massDomainEv,
        plot: scene.plot,
        lineWidthPx: fontsFor(project.figure.fontPt, presetOf(project.figure).fontScale).dataLinePx,
      };
      const g = modelGeometry(m, frame, `model-${i + 1}`);
      if (!g) return;
      const nodes = [...g.fills, ...g.lines];
      expect(g.shapes).toHaveLength(nodes.length);
      nodes.forEach((node, k) => {
        const ref = parsePath(drawn.find((n) => n.id === node.id)!.d);
        const shape = g.shapes[k];
        expect(shape.subpaths.map((s) => s.closed)).toEqual(ref.map((s) => s.closed));
        shape.subpaths.forEach((s, j) => {
          expect(Array.from(s.xs)).toEqual(ref[j].points.map((p) => p[0]));
          expect(Array.from(s.ys)).toEqual(ref[j].points.map((p) => p[1]));
        });
        compared++;
      });
    });
    expect(compared).toBeGreaterThan(3);
  });
});
