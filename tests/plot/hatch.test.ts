// Hatches on the excluded side of exclusion edges: spacing along the path, direction (square to a straight edge,
// into the side the fill covers), bounded counts for huge noisy curves, the marks of a curve in the scene, and
// old files without the setting. Geometry checks are elementary vector algebra (common practice).
import { describe, expect, test } from "vitest";
import { hatchEdge, hatchStyleFor, insideSide } from "../../src/plot/hatch";
import { buildScene } from "../../src/plot/index";
import { restoreProject } from "../../src/project/restore";
import { decodeLink, encodeLink } from "../../src/data/index";
import { curve, fixtureProject, parsePath, paths } from "./fixture";

const plot = { x: 0, y: 0, w: 400, h: 300 };
const style = { lengthPx: 5, spacingPx: 10, widthPx: 1, angleDeg: 0 };

function hatchesOf(d: string): { x: number; y: number; dx: number; dy: number }[] {
  return parsePath(d).map(({ points: [[x, y], [x2, y2]] }) => ({ x, y, dx: x2 - x, dy: y2 - y }));
}

/** Even–odd ray casting (common practice): whether (x, y) lies inside the polygon. */
function inside(poly: [number, number][], x: number, y: number): boolean {
  let inPoly = false;
  for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
    const [xi, yi] = poly[i];
    const [xj, yj] = poly[j];
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inPoly = !inPoly;
  }
  return inPoly;
}

describe("hatchEdge", () => {
  test("a straight edge gets hatches every spacing along it, square to it, on the (dy, −dx) side", () => {
    const xs = Float64Array.from([50, 250]);
    const ys = Float64Array.from([100, 100]);
    const h = hatchesOf(hatchEdge({ xs, ys, n: 2, side: 1 }, plot, style, 2).d);
    // 200 px long, the first half a spacing in: 20 hatches.
    expect(h.length).toBe(20);
    h.forEach((k, i) => {
      expect(k.x).toBeCloseTo(55 + 10 * i, 6);
      expect(k.y).toBe(100);
      expect(k.dx).toBeCloseTo(0, 6);
      // Travelling in +x on a y-down screen, (dy, −dx) points up: length 5 beyond the line plus half its width.
      expect(k.dy).toBeCloseTo(-6, 6);
    });
    const other = hatchesOf(hatchEdge({ xs, ys, n: 2, side: -1 }, plot, style, 2).d);
    expect(other.every((k) => Math.abs(k.dy - 6) < 1e-6)).toBe(true);
  });

  test("an angle turns every hatch by that angle from the normal towards the direction of travel", () => {
    const xs = Float64Array.from([50, 250]);
    const ys = Float64Array.from([100, 100]);
    const h = hatchesOf(hatchEdge({ xs, ys, n: 2, side: 1 }, plot, { ...style, angleDeg: 45 }, 0).d);
    for (const k of h) {
      expect(k.dx).toBeCloseTo(5 * Math.SQRT1_2, 2);
      expect(k.dy).toBeCloseTo(-5 * Math.SQRT1_2, 2);
    }
  });

  test("insideSide follows the shoelace sign: the inside of a polygon traced either way", () => {
    // Along the bottom left to right, up, back along the top: the inside is above the first side, the (dy, −dx) side.
    const xs = [0, 10, 10, 0];
    const ys = [10, 10, 0, 0];
    expect(insideSide({ xs, ys, n: 4 })).toBe(1);
    expect(insideSide({ xs: [...xs].reverse(), ys: [...ys].reverse(), n: 4 })).toBe(-1);
  });

  test("the extra end vertices are part of the edge: a vertical end is hatched too", () => {
    const xs = Float64Array.from([100, 200]);
    const ys = Float64Array.from([200, 200]);
    const e = { xs, ys, n: 2, from: [100, 50] as const, to: [200, 50] as const };
    const h = hatchesOf(hatchEdge({ ...e, side: insideSide(e) }, plot, style, 0).d);
    const down = h.filter((k) => k.x === 100 && k.y < 195);
    expect(down.length).toBeGreaterThan(10);
    // The region between the ends is inside: hatches on the left end point right, on the bottom up.
    expect(down.every((k) => k.dx > 4.9)).toBe(true);
    expect(h.filter((k) => k.y === 200 && k.x > 110 && k.x < 190).every((k) => k.dy < -4.9)).toBe(true);
  });

  test("nothing far outside the plot is hatched", () => {
    const xs = Float64Array.from([-900, -500]);
    const ys = Float64Array.from([100, 100]);
    expect(hatchEdge({ xs, ys, n: 2, side: 1 }, plot, style, 1).count).toBe(0);
  });

  test("a 100 000-point noisy edge gets a bounded count: ≤ 4 (w + h) / spacing, and about its mean length / spacing", () => {
    const n = 100_000;
    const xs = new Float64Array(n);
    const ys = new Float64Array(n);
    let seed = 12345;
    const rnd = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31 - 0.5;
    for (let i = 0; i < n; i++) {
      xs[i] = (400 * i) / (n - 1);
      ys[i] = 150 + 60 * rnd();
    }
    const h = hatchEdge({ xs, ys, n, side: 1 }, plot, style, 1);
    expect(h.count).toBeLessThanOrEqual((4 * (plot.w + plot.h)) / style.spacingPx);
    expect(h.count).toBeGreaterThan(400 / style.spacingPx);
    // The same edge with no noise: exactly its length over the spacing.
    ys.fill(150);
    expect(hatchEdge({ xs, ys, n, side: 1 }, plot, style, 1).count).toBe(40);
  });

  test("the style scales with the line width (which follows the preset)", () => {
    const slide = hatchStyleFor(16 / 9);
    const column = hatchStyleFor(1.19);
    expect(column.lengthPx / slide.lengthPx).toBeCloseTo(1.19 / (16 / 9), 6);
    expect(slide.lengthPx).toBeGreaterThanOrEqual(3);
    expect(slide.lengthPx).toBeLessThanOrEqual(6);
  });
});

describe("exclusions in the scene", () => {
  const hatchNode = (scene: ReturnType<typeof buildScene>) =>
    paths(scene, "curves").find((n) => n.id?.endsWith("-hatch"));

  test("by default an exclusion is outlined and hatched in its colour, each hatch ending inside the region the fill covers", () => {
    const p = fixtureProject();
    const scene = buildScene(p);
    const excl = paths(scene, "curves").find((n) => n.id?.endsWith("-exclusion"))!;
    expect(excl.fill).toBe("none");
    const hatch = hatchNode(scene)!;
    expect(hatch.stroke).toBe("#D55E00");
    expect(hatch.data?.["curve-id"]).toBe("dip");
    const polygon = parsePath(excl.d)[0].points;
    const h = hatchesOf(hatch.d);
    expect(h.length).toBeGreaterThan(10);
    for (const k of h) expect(inside(polygon, k.x + k.dx, k.y + k.dy)).toBe(true);
  });

  test("a file-order exclusion traced right to left is hatched on the same side", () => {
    const p = fixtureProject();
    const dip = p.curves[0];
    p.curves = [
      { ...dip, keepOrder: true, massEv: dip.massEv.slice().reverse(), gInvGeV: dip.gInvGeV.slice().reverse() },
    ];
    const scene = buildScene(p);
    const polygon = parsePath(paths(scene, "curves").find((n) => n.id?.endsWith("-exclusion"))!.d)[0].points;
    for (const k of hatchesOf(hatchNode(scene)!.d)) expect(inside(polygon, k.x + k.dx, k.y + k.dy)).toBe(true);
  });

  test("fill draws the translucent fill and no hatches; hatch-fill both; the legend swatch follows", () => {
    const p = fixtureProject();
    p.curves = [{ ...p.curves[0], exclusionMark: "fill" }];
    let scene = buildScene(p);
    expect(hatchNode(scene)).toBeUndefined();
    expect(paths(scene, "curves")[0].fill).toBe("#D55E00");
    expect(paths(scene, "legend").some((n) => n.id?.endsWith("-hatch"))).toBe(false);
    p.curves = [{ ...p.curves[0], exclusionMark: "hatch-fill" }];
    scene = buildScene(p);
    expect(hatchNode(scene)).toBeDefined();
    expect(paths(scene, "curves")[0].fill).toBe("#D55E00");
    expect(paths(scene, "legend").some((n) => n.id?.endsWith("-hatch"))).toBe(true);
  });

  test("projections and regions are never hatched", () => {
    const p = fixtureProject();
    p.curves = p.curves.filter((c) => c.role !== "exclusion");
    expect(hatchNode(buildScene(p))).toBeUndefined();
  });
});

describe("exclusionMark in old files and links", () => {
  function oldFile(fillOpacity: number) {
    const c = curve({ id: "a", massEv: Float64Array.from([1e-6, 2e-6]), gInvGeV: Float64Array.from([1e-13, 1e-13]) });
    const { exclusionMark: _m, ...old } = { ...c, fillOpacity, massEv: [1e-6, 2e-6], gInvGeV: [1e-13, 1e-13] };
    const p = fixtureProject();
    return { ...JSON.parse(JSON.stringify({ ...p, curves: [] })), curves: [old] };
  }

  test("a curve without the key reads as hatch (the old default fill 0.3 or none) with no repair note", () => {
    for (const o of [0.3, 0]) {
      const r = restoreProject(oldFile(o));
      expect(r.ok && r.project.curves[0].exclusionMark).toBe("hatch");
      expect(r.ok && r.repairs).toEqual([]);
    }
  });

  test("a curve without the key that set a fill opacity of its own keeps its fill", () => {
    const r = restoreProject(oldFile(0.5));
    expect(r.ok && r.project.curves[0].exclusionMark).toBe("fill");
    expect(r.ok && r.project.curves[0].fillOpacity).toBe(0.5);
  });

  test("an unknown value is repaired to hatch with a note; links keep every value", () => {
    const raw = oldFile(0.3);
    raw.curves[0].exclusionMark = "stripes";
    const r = restoreProject(raw);
    expect(r.ok && r.project.curves[0].exclusionMark).toBe("hatch");
    expect(r.ok && r.repairs.join(" ")).toMatch(/exclusion mark/);
    const p = fixtureProject();
    for (const mark of ["hatch", "fill", "hatch-fill"] as const)
      for (const fillOpacity of [0.3, 0.5]) {
        const q = { ...p, curves: [{ ...p.curves[0], exclusionMark: mark, fillOpacity }] };
        const back = decodeLink(encodeLink(q, { includeCurves: true }));
        expect(back.ok && back.project.curves[0].exclusionMark).toBe(mark);
      }
  });
});
