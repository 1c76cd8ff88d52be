// Direct labels (legend "on-plot"): placement beside each line, clear of data, other labels and the plot edge.
import { describe, expect, it } from "vitest";
import { placeDirectLabels, leaderStart, type LabelItem } from "../../src/plot/direct-labels";
import { occupancyGrid, coveredFraction, type Shape } from "../../src/plot/occupancy";
import { buildScene } from "../../src/plot/scene";
import { writeSvg } from "../../src/plot/svg";
import { defaultProject } from "../../src/project/demo";
import type { Project } from "../../src/project/types";

const plot = { x: 50, y: 20, w: 400, h: 300 };

function line(xs: number[], ys: number[]): Shape {
  return { subpaths: [{ xs, ys, closed: false }], fill: false, stroke: true };
}

function item(key: string, shape: Shape, w = 80, h = 10): LabelItem {
  return { key, widthPx: w, heightPx: h, lines: shape.subpaths, shapes: [shape] };
}

const overlaps = (a: { x: number; y: number; w: number; h: number }, b: typeof a) =>
  Math.min(a.x + a.w, b.x + b.w) > Math.max(a.x, b.x) && Math.min(a.y + a.h, b.y + b.h) > Math.max(a.y, b.y);

const inPlot = (b: { x: number; y: number; w: number; h: number }) =>
  b.x >= plot.x - 1e-9 &&
  b.y >= plot.y - 1e-9 &&
  b.x + b.w <= plot.x + plot.w + 1e-9 &&
  b.y + b.h <= plot.y + plot.h + 1e-9;

describe("placeDirectLabels", () => {
  it("puts a label beside its line, clear of it, without a leader", () => {
    const s = line([50, 450], [300, 40]);
    const [p] = placeDirectLabels({ items: [item("a", s)], plot, gapPx: 4, sizePx: 10 });
    expect(p.leaderTo).toBeNull();
    expect(inPlot(p.box)).toBe(true);
    expect(coveredFraction(occupancyGrid([s], plot, 2), p.box)).toBe(0);
  });

  it("keeps many labels apart, inside the plot and off every line when there is room", () => {
    // Eight parallel lines 30 px apart, labels 60 × 10 px: room beside each.
    const shapes = Array.from({ length: 8 }, (_, i) => line([50, 450], [40 + i * 30, 80 + i * 30]));
    const placed = placeDirectLabels({
      items: shapes.map((s, i) => item(`l${i}`, s, 60)),
      plot,
      gapPx: 3,
      sizePx: 10,
    });
    expect(placed).toHaveLength(8);
    const grid = occupancyGrid(shapes, plot, 2);
    for (const [i, p] of placed.entries()) {
      expect(inPlot(p.box)).toBe(true);
      expect(coveredFraction(grid, p.box)).toBe(0);
      for (const q of placed.slice(i + 1)) expect(overlaps(p.box, q.box)).toBe(false);
    }
  });

  it("moves a label away with a leader when the space beside its line is taken, and avoids crossing lines", () => {
    // A short vertical line hemmed in by a comb of other vertical lines 6 px apart on both sides.
    const own = line([250, 250], [150, 190]);
    const comb = Array.from({ length: 30 }, (_, i) => line([160 + i * 6, 160 + i * 6], [120, 220])).filter(
      (s) => s.subpaths[0].xs[0] !== 250,
    );
    const items = [item("own", own, 40), ...comb.map((s, i) => ({ ...item(`c${i}`, s), widthPx: 0.1, heightPx: 0.1 }))];
    const [p] = placeDirectLabels({ items: items.slice(0, 1), plot, gapPx: 3, sizePx: 10 }).map((x) => x);
    expect(p.leaderTo).toBeNull(); // alone, room beside it
    const all = placeDirectLabels({
      items: [{ ...items[0], shapes: [own, ...comb] }],
      plot,
      gapPx: 3,
      sizePx: 10,
    });
    expect(coveredFraction(occupancyGrid(comb, plot, 2), all[0].box)).toBe(0);
    expect(all[0].leaderTo).not.toBeNull();
  });

  it("keeps a pinned label where the user put it (inside the plot) and leads it back to its line", () => {
    const s = line([50, 450], [300, 300]);
    const [p] = placeDirectLabels({
      items: [{ ...item("a", s), pinned: { x: 200, y: 60 } }],
      plot,
      gapPx: 4,
      sizePx: 10,
    });
    expect(p.pinned).toBe(true);
    expect(p.box.x + p.box.w / 2).toBeCloseTo(200);
    expect(p.box.y + p.box.h / 2).toBeCloseTo(60);
    expect(p.leaderTo?.y).toBeCloseTo(300);
    const [edge] = placeDirectLabels({
      items: [{ ...item("a", s), pinned: { x: 449, y: 21 } }],
      plot,
      gapPx: 4,
      sizePx: 10,
    });
    expect(inPlot(edge.box)).toBe(true);
  });

  it("gives no label to an item with no visible line", () => {
    const s = line([500, 600], [10, 10]);
    expect(placeDirectLabels({ items: [item("a", s)], plot, gapPx: 4, sizePx: 10 })).toEqual([]);
  });

  it("starts a leader on the box edge", () => {
    expect(leaderStart({ x: 0, y: 0, w: 10, h: 10 }, { x: 20, y: 5 })).toEqual({ x: 10, y: 5 });
  });
});

function onPlot(preset: Project["figure"]["preset"]): Project {
  const p = defaultProject();
  p.figure.legend = "on-plot";
  p.figure.preset = preset;
  return p;
}

describe("direct labels in the scene", () => {
  it("labels every visible curve and model of the demo, inside the plot, apart, and draws no legend box", () => {
    for (const preset of ["single-column", "slide"] as const) {
      const p = onPlot(preset);
      const scene = buildScene(p);
      const labels = scene.directLabels ?? [];
      expect(labels.map((l) => l.id).sort()).toEqual([...p.models, ...p.curves].map((x) => x.id).sort());
      const { plot: pl } = scene;
      for (const [i, l] of labels.entries()) {
        expect(l.box.x).toBeGreaterThanOrEqual(pl.x - 0.01);
        expect(l.box.y).toBeGreaterThanOrEqual(pl.y - 0.01);
        expect(l.box.x + l.box.w).toBeLessThanOrEqual(pl.x + pl.w + 0.01);
        expect(l.box.y + l.box.h).toBeLessThanOrEqual(pl.y + pl.h + 0.01);
        for (const m of labels.slice(i + 1)) expect(overlaps(l.box, m.box)).toBe(false);
      }
      const legend = scene.layers.find((l) => l.id === "legend");
      expect(legend?.nodes.some((n) => n.kind === "rect")).toBe(false);
      expect(legend?.nodes.filter((n) => n.kind === "text" && n.data?.["direct-label"]).length).toBeGreaterThan(6);
    }
  });

  it("is deterministic: the same project gives the same SVG bytes", () => {
    const a = writeSvg(buildScene(onPlot("single-column")));
    const b = writeSvg(buildScene(onPlot("single-column")));
    expect(a).toBe(b);
    expect(a).toContain('id="label-curve-1"');
  });

  it("held at their own data points (as while the view moves), labels stay where they were and are not 'moved'", () => {
    const p = onPlot("slide");
    const first = buildScene(p).directLabels ?? [];
    const hold = Object.fromEntries(first.map((l) => [`${l.kind}:${l.id}`, { at: l.at, variant: l.variant }]));
    const held = buildScene(p, { holdLabels: hold }).directLabels ?? [];
    expect(held.map((l) => l.id)).toEqual(first.map((l) => l.id));
    for (const [i, l] of held.entries()) {
      expect(l.pinned).toBe(false);
      expect(l.box.x).toBeCloseTo(first[i].box.x, 1);
      expect(l.box.y).toBeCloseTo(first[i].box.y, 1);
    }
  });

  it("keeps a dragged label at its data point whatever the figure size", () => {
    const p = onPlot("slide");
    p.curves[0].labelAt = [1e-4, 1e-12];
    for (const preset of ["slide", "single-column"] as const) {
      p.figure.preset = preset;
      const scene = buildScene(p);
      const l = scene.directLabels?.find((x) => x.id === p.curves[0].id);
      expect(l?.pinned).toBe(true);
      const { plot: pl, scales } = scene;
      const fx =
        Math.log10(1e-4 / scales.massDomainEv[0]) / Math.log10(scales.massDomainEv[1] / scales.massDomainEv[0]);
      const fy = Math.log10(scales.yDomain[1] / 1e-12) / Math.log10(scales.yDomain[1] / scales.yDomain[0]);
      expect(l!.box.x + l!.box.w / 2).toBeCloseTo(pl.x + fx * pl.w, 1);
      expect(l!.box.y + l!.box.h / 2).toBeCloseTo(pl.y + fy * pl.h, 1);
    }
  });
});
