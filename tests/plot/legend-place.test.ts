// Automatic legend placement ("auto", legend-place.ts): the inner corner whose legend box covers the least
// drawn content. The rule is our own (keeping the legend off the data is common practice); the occupancy grid
// it rests on is checked in occupancy.test.ts. Scene paths are read back with the tests' reference reader.
import { describe, expect, test, vi } from "vitest";
import { defaultProject } from "../../src/project/demo";
import type { Curve, LegendPlace, Project, SizePreset } from "../../src/project/types";
import { exportFigureSvg, exportScene, rasterResolution } from "../../src/formats/figure-file";
import type { LegendCorner } from "../../src/plot/layout";
import {
  LEGEND_MAX_COVERAGE,
  LEGEND_CORNERS,
  OUTSIDE_MIN_PLOT_FRACTION,
  pickLegendPlace,
  placementCurve,
  PLACEMENT_MAX_POINTS,
} from "../../src/plot/legend-place";
import { buildScene } from "../../src/plot/scene";
import type { RectNode, Scene } from "../../src/plot/scene-types";
import { curve, fixtureProject, model, nodes, rng, shapesOf } from "./fixture";

// ------------------------------------------------------------------------------------------------ helpers

function legendBox(scene: Scene): RectNode {
  const box = scene.layers.find((l) => l.id === "legend")!.nodes[0];
  if (!box || box.kind !== "rect") throw new Error("no legend box");
  return box;
}

/** Which corner of the plot area the legend box sits in (or outside right). */
function placeOf(scene: Scene): LegendCorner | "outside-right" {
  const b = legendBox(scene);
  const p = scene.plot;
  if (b.x >= p.x + p.w) return "outside-right";
  const left = b.x + b.w / 2 < p.x + p.w / 2;
  const top = b.y + b.h / 2 < p.y + p.h / 2;
  return `${top ? "top" : "bottom"}-${left ? "left" : "right"}`;
}

/** A closed region (file order) through the given (mass eV, g GeV⁻¹) corners: an invented block of data. */
function block(
  id: string,
  massEv: [number, number],
  gInvGeV: [number, number],
  label = `Block ${id} (invented)`,
): Curve {
  const [m0, m1] = massEv;
  const [g0, g1] = gInvGeV;
  return curve({
    id,
    label,
    role: "region",
    keepOrder: true,
    massEv: Float64Array.from([m0, m1, m1, m0]),
    gInvGeV: Float64Array.from([g0, g0, g1, g1]),
  });
}

/** A slide figure over 10⁻⁷..10⁻² eV × 10⁻¹⁷..10⁻⁹ GeV⁻¹ with the given curves and an "auto" legend. */
function project(curves: Curve[], preset: SizePreset = "slide", models: Project["models"] = []): Project {
  const p = fixtureProject();
  p.curves = curves;
  p.models = models;
  p.figure = { ...p.figure, preset, legend: "auto" };
  return p;
}

/** The coverage of each corner as the scene builder sees it (the scene's own content and legend box). */
function coverageOf(scene: Scene): Record<LegendCorner, number> {
  const b = legendBox(scene);
  const p = scene.plot;
  const inset =
    0.6 *
    (
      scene.layers
        .find((l) => l.id === "axes")!
        .nodes.find((n) => n.kind === "text" && n.id?.startsWith("xlabel-")) as { sizePx: number }
    ).sizePx;
  const boxes = {
    "top-left": { x: p.x + inset, y: p.y + inset, w: b.w, h: b.h },
    "top-right": { x: p.x + p.w - inset - b.w, y: p.y + inset, w: b.w, h: b.h },
    "bottom-left": { x: p.x + inset, y: p.y + p.h - inset - b.h, w: b.w, h: b.h },
    "bottom-right": { x: p.x + p.w - inset - b.w, y: p.y + p.h - inset - b.h, w: b.w, h: b.h },
  };
  return pickLegendPlace({
    shapes: shapesOf([...nodes(scene, "curves"), ...nodes(scene, "models")]),
    plot: p,
    boxes,
    outsideFits: () => false,
  }).coverage;
}

// Far outside the plot on every side, so a block reaching them fills a corner (regions are clipped to the plot).
const M_LO = 1e-9;
const M_HI = 1;
const G_LO = 1e-19;
const G_HI = 1e-7;

// ------------------------------------------------------------------------------------------ choice in scenes

describe("automatic legend placement in the scene", () => {
  test("a curve filling the top-right corner sends the legend elsewhere (the first free corner in tie order)", () => {
    // An exclusion limit at 10⁻¹³ GeV⁻¹ above 10⁻⁴ eV: everything above it, up to the plot top, is filled.
    const m = Float64Array.from({ length: 50 }, (_, i) => 10 ** (-4 + (3 * i) / 49));
    const g = Float64Array.from(m, () => 1e-13);
    const limit = curve({ id: "x", label: "Limit (invented)", role: "exclusion", massEv: m, gInvGeV: g });
    const scene = buildScene(project([{ ...limit, exclusionMark: "fill" }]));
    const cov = coverageOf(scene);
    expect(cov["top-right"]).toBeGreaterThan(0.95);
    expect(cov["top-left"]).toBe(0);
    expect(placeOf(scene)).not.toBe("top-right");
    // Top-left, bottom-right and bottom-left are all empty: the tie goes to top-left (LEGEND_CORNERS order).
    expect(placeOf(scene)).toBe("top-left");
    // Only hatched at its edge, the excluded region still counts as covered: the legend goes to the same place.
    expect(placeOf(buildScene(project([{ ...limit, exclusionMark: "hatch" }])))).toBe("top-left");
  });

  test("data in every corner but the bottom left puts the legend bottom left", () => {
    const curves = [
      block("tr", [1e-4, M_HI], [1e-13, G_HI]),
      block("tl", [M_LO, 1e-5], [1e-13, G_HI]),
      block("br", [1e-4, M_HI], [G_LO, 1e-14]),
    ];
    const scene = buildScene(project(curves));
    const cov = coverageOf(scene);
    for (const c of ["top-right", "top-left", "bottom-right"] as const) expect(cov[c]).toBeGreaterThan(0.9);
    expect(cov["bottom-left"]).toBe(0);
    expect(placeOf(scene)).toBe("bottom-left");
  });

  test("a model band counts as drawn content: a cancelling band covering both bottom corners sends the legend out of the plot", () => {
    const curves = [block("tr", [1e-4, M_HI], [1e-13, G_HI]), block("tl", [M_LO, 1e-5], [1e-13, G_HI])];
    // Without models both bottom corners are empty and the tie goes to bottom right.
    expect(placeOf(buildScene(project(curves)))).toBe("bottom-right");
    // E/N ∈ [1.8, 2.1] contains c_γ = 1.92 (Grilli di Cortona et al., JHEP 01 (2016) 034), so the band reaches
    // g = 0 and fills everything below its upper edge g ∝ m·|2.1 − c_γ|, which rises to the right.
    const band = buildScene(
      project(curves, "slide", [model({ id: "b", label: "Band", eOverNMin: "1.8", eOverNMax: "2.1" })]),
    );
    const inside = buildScene({
      ...project(curves, "slide", [model({ id: "b", label: "Band", eOverNMin: "1.8", eOverNMax: "2.1" })]),
      figure: { ...project(curves).figure, legend: "bottom-left" },
    });
    const cov = coverageOf(inside);
    expect(cov["bottom-right"]).toBe(1);
    expect(cov["bottom-left"]).toBeGreaterThan(LEGEND_MAX_COVERAGE);
    // No corner is free: the legend goes beside the plot (a slide has room), never over the band.
    expect(placeOf(band)).toBe("outside-right");
  });

  test("partly covered corners are not free: the legend leaves the plot rather than cover any of them", () => {
    // Blocks of different depth into each corner: the bottom right one is the shallowest.
    const curves = [
      block("tr", [3e-4, M_HI], [1e-11, G_HI]),
      block("tl", [M_LO, 1e-6], [1e-11, G_HI]),
      block("bl", [M_LO, 1e-6], [G_LO, 1e-15]),
      block("br", [3e-3, M_HI], [G_LO, 1e-16]),
    ];
    const inside = buildScene({ ...project(curves), figure: { ...project(curves).figure, legend: "bottom-right" } });
    const cov = coverageOf(inside);
    const least = LEGEND_CORNERS.reduce((a, b) => (cov[b] < cov[a] ? b : a));
    expect(least).toBe("bottom-right");
    expect(cov["bottom-right"]).toBeGreaterThan(LEGEND_MAX_COVERAGE);
    expect(placeOf(buildScene(project(curves)))).toBe("outside-right");
  });

  test("every corner crowded: outside right on a slide with short labels, below the plot on a single column", () => {
    const curves = [block("all", [M_LO, M_HI], [G_LO, G_HI], "A"), block("b", [1e-4, M_HI], [G_LO, G_HI], "B")];
    const slide = buildScene(project(curves));
    expect(placeOf(slide)).toBe("outside-right");
    const inside = buildScene({ ...project(curves), figure: { ...project(curves).figure, legend: "top-right" } });
    expect(slide.plot.w).toBeLessThan(inside.plot.w);
    expect(slide.plot.w).toBeGreaterThanOrEqual(OUTSIDE_MIN_PLOT_FRACTION * slide.widthPx);
    // Exactly the figure a fixed "outside-right" legend gives, and the scene says where it went.
    const { autoLegendPlace: slidePlace, ...slideRest } = slide;
    expect(slidePlace).toBe("outside-right");
    expect(slideRest).toEqual(
      buildScene({ ...project(curves), figure: { ...project(curves).figure, legend: "outside-right" } }),
    );
    // The same content with the demo's seven long labels on the single-column preset (8.6 cm): outside right
    // would squeeze the plot or wrap every entry, so the legend goes below the plot.
    const demo = defaultProject();
    const crowded = {
      ...demo,
      curves: [...demo.curves, block("all", [M_LO, M_HI], [G_LO, G_HI])],
      figure: { ...demo.figure, preset: "single-column" as const, legend: "auto" as const },
    };
    const column = buildScene(crowded);
    expect(column.autoLegendPlace).toBe("below");
    const box = legendBox(column);
    expect(box.y).toBeGreaterThan(column.plot.y + column.plot.h);
    const { autoLegendPlace: _p, ...columnRest } = column;
    expect(columnRest).toEqual(buildScene({ ...crowded, figure: { ...crowded.figure, legend: "below" } }));
  });

  test("an auto legend lands exactly where the chosen fixed corner would put it, and the rest of the figure is unchanged", () => {
    const p = project([block("tr", [1e-4, M_HI], [1e-13, G_HI]), block("tl", [M_LO, 1e-5], [1e-13, G_HI])]);
    const auto = buildScene(p);
    const place = placeOf(auto);
    expect(place).toBe("bottom-right");
    const fixed = buildScene({ ...p, figure: { ...p.figure, legend: place as LegendPlace } });
    const { autoLegendPlace, ...rest } = auto;
    expect(autoLegendPlace).toBe(place);
    expect(fixed.autoLegendPlace).toBeUndefined();
    expect(rest).toEqual(fixed);
  });

  test("a held place (the figure during a zoom or pan) is used as given, for an auto legend only", () => {
    const p = project([block("tr", [1e-4, M_HI], [1e-13, G_HI]), block("tl", [M_LO, 1e-5], [1e-13, G_HI])]);
    expect(buildScene(p).autoLegendPlace).toBe("bottom-right");
    // Held at the top left, where the placement would not put it: the figure of a fixed top-left legend.
    const held = buildScene(p, { holdLegend: "top-left" });
    const { autoLegendPlace, ...rest } = held;
    expect(autoLegendPlace).toBe("top-left");
    expect(rest).toEqual(buildScene({ ...p, figure: { ...p.figure, legend: "top-left" } }));
    const heldOutside = buildScene(p, { holdLegend: "outside-right" });
    expect(placeOf(heldOutside)).toBe("outside-right");
    // A fixed place ignores the hold.
    const fixed = { ...p, figure: { ...p.figure, legend: "bottom-left" as const } };
    expect(buildScene(fixed, { holdLegend: "top-left" })).toEqual(buildScene(fixed));
  });

  test("deterministic: the same scene twice, no Math.random, no dependence on the highlight", () => {
    const spy = vi.spyOn(Math, "random");
    try {
      const p = defaultProject();
      p.figure.preset = "single-column";
      const a = buildScene(p);
      const b = buildScene(p);
      expect(a).toEqual(b);
      const hl = buildScene(p, { highlight: { massMinEv: 1e-6, massMaxEv: 1e-3, modelId: p.models[0].id } });
      expect(legendBox(hl)).toEqual(legendBox(a));
      expect(spy).not.toHaveBeenCalled();
    } finally {
      spy.mockRestore();
    }
  });

  test("screen and export pick the same corner at every display resolution (demo and a noisy 20,000-point curve)", () => {
    const noisy = (() => {
      const r = rng(11);
      const n = 20_000;
      const m = new Float64Array(n);
      const g = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        const x = -7 + (5 * i) / (n - 1);
        m[i] = 10 ** x;
        // An invented limit with a deep, noisy dip in the middle of the range.
        g[i] = 10 ** (-10.5 - 5 * Math.exp(-(((x + 4.5) / 0.8) ** 2)) + 0.6 * (r() - 0.5));
      }
      return curve({ id: "noisy", label: "Noisy (invented)", role: "exclusion", massEv: m, gInvGeV: g });
    })();
    const projects: Project[] = [
      defaultProject(),
      project([noisy, block("br", [1e-4, M_HI], [G_LO, 1e-15])], "slide", [model({ id: "k", eOverNMin: "0" })]),
    ];
    for (const base of projects) {
      for (const preset of ["slide", "single-column", "double-column", "custom"] as const) {
        const p = { ...base, figure: { ...base.figure, preset, legend: "auto" as const } };
        const exported = exportScene(p);
        const svgBox = /<rect id="legend-box" x="([\d.]+)" y="([\d.]+)"/.exec(
          exportFigureSvg(p, { embedProject: false }),
        );
        expect(svgBox && [Number(svgBox[1]), Number(svgBox[2])]).toEqual([
          legendBox(exported).x,
          legendBox(exported).y,
        ]);
        for (const resolution of [0.25, 0.75, 1, 1.25, 3, rasterResolution(300)]) {
          const screen = buildScene(p, {
            widthPx: exported.widthPx,
            heightPx: exported.heightPx,
            resolution,
            physical: false,
          });
          expect(legendBox(screen), `${preset} at resolution ${resolution}`).toEqual(legendBox(exported));
        }
        // Unthinned drawing (comparisons) picks the same corner as well.
        expect(legendBox(buildScene(p, { thin: false }))).toEqual(legendBox(exported));
      }
    }
  });

  test("near ties: the scene's own paths at different display resolutions would disagree, the builder never does", () => {
    // Two invented wavy projections, one the mirror image of the other about the middle of the mass range,
    // cross the two top corners almost equally; a block fills the lower half.
    const mirrored = (seed: number) => {
      const r = rng(seed);
      const n = 4000;
      const lm = Float64Array.from({ length: n }, (_, i) => -7 + (2 * i) / (n - 1));
      const lg = Float64Array.from(lm, (x) => -10 + 0.3 * Math.sin(7 * x) + 0.06 * (r() - 0.5));
      const left = curve({
        id: "a",
        label: "Left (invented)",
        role: "projection",
        massEv: lm.map((x) => 10 ** x),
        gInvGeV: lg.map((y) => 10 ** y),
      });
      const right = curve({
        id: "b",
        label: "Right (invented)",
        role: "projection",
        massEv: lm.map((_, i) => 10 ** (-9 - lm[n - 1 - i])),
        gInvGeV: lg.map((_, i) => 10 ** lg[n - 1 - i]),
      });
      return project([left, right, block("low", [M_LO, M_HI], [G_LO, 1e-13])]);
    };
    let disagreements = 0;
    // Seeds 1 … 30, the two found to be near ties (9 and 22) first: the search for one near tie (the second scene
    // per resolution, only needed until one is found) then usually ends with the first seed.
    const seeds = [9, 22, ...Array.from({ length: 30 }, (_, i) => i + 1).filter((s) => s !== 9 && s !== 22)];
    for (const seed of seeds) {
      const p = mirrored(seed);
      const boxes = new Set<string>();
      const own = new Set<string>();
      for (const resolution of [0.25, 0.75, 1, 1.25, 2, 3, 6.25]) {
        const scene = buildScene(p, { resolution, physical: false });
        boxes.add(JSON.stringify(legendBox(scene)));
        if (disagreements > 0) continue;
        // The corners' coverage read from the scene's own paths, with the plot area of an inside legend.
        const inCorner = buildScene(
          { ...p, figure: { ...p.figure, legend: "top-right" } },
          { resolution, physical: false },
        );
        const cov = coverageOf(inCorner);
        own.add(LEGEND_CORNERS.reduce((a, b) => (cov[b] < cov[a] ? b : a)));
      }
      expect(boxes.size, `seed ${seed}`).toBe(1);
      if (own.size > 1) disagreements++;
    }
    // Without this the check above would be vacuous (thinning that no longer depends on resolution would end it).
    expect(
      disagreements,
      "no near tie among the seeds: the test no longer exercises the fixed placement resolution",
    ).toBeGreaterThan(0);
  });

  test("the demo on the single-column preset (7 entries) gets the corner that covers least of it", () => {
    const p = defaultProject();
    expect(p.figure.legend).toBe("auto");
    p.figure.preset = "single-column";
    const scene = buildScene(p);
    expect(scene.layers.find((l) => l.id === "legend")!.nodes.filter((n) => n.kind === "text")).toHaveLength(7);
    const cov = coverageOf(scene);
    const place = placeOf(scene);
    expect(place).not.toBe("outside-right");
    for (const c of LEGEND_CORNERS) expect(cov[place as LegendCorner]).toBeLessThanOrEqual(cov[c]);
    // The heavy-quark window is drawn between its lines (it no longer fills the bottom of the plot), so the
    // bottom right, below the model lines, is now as free as any corner.
    expect(cov[place as LegendCorner]).toBeLessThanOrEqual(cov["bottom-right"]);
  });

  test("no entries, no legend: auto with nothing to list draws no box", () => {
    expect(buildScene(project([])).layers.find((l) => l.id === "legend")!.nodes).toHaveLength(0);
  });
});

// ---------------------------------------------------------------------------------------- pure choice rule

describe("big file-order curves and regions", () => {
  /** An invented noisy closed contour of n points filling the top right of the figure. */
  function bigRegion(n: number): Curve {
    const massEv = new Float64Array(n);
    const gInvGeV = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const a = (2 * Math.PI * i) / n;
      const r = 1 + 0.03 * Math.sin(i / 37);
      massEv[i] = 10 ** (-3 + 1.4 * r * Math.cos(a));
      gInvGeV[i] = 10 ** (-11 + 1.6 * r * Math.sin(a));
    }
    return curve({ id: "big", label: "Big contour (invented)", role: "region", keepOrder: true, massEv, gInvGeV });
  }

  test("are read through their most important points, in file order with the ends, cached per view", () => {
    const big = bigRegion(5 * PLACEMENT_MAX_POINTS);
    const a = placementCurve(big, 0);
    expect(a.massEv).toHaveLength(PLACEMENT_MAX_POINTS);
    expect(a.massEv[0]).toBeCloseTo(big.massEv[0], 12);
    // The same arrays on the next frame (the plot cache is keyed by them), other arrays for another view.
    expect(placementCurve(big, 0).massEv).toBe(a.massEv);
    expect(placementCurve(big, -1).massEv).not.toBe(a.massEv);
    // Every point kept is a point of the curve, met in the curve's own order.
    let j = 0;
    for (let k = 0; k < a.massEv.length; k++) {
      while (j < big.massEv.length && Math.abs(big.massEv[j] / a.massEv[k] - 1) > 1e-12) j++;
      expect(j).toBeLessThan(big.massEv.length);
      expect(a.gInvGeV[k] / big.gInvGeV[j]).toBeCloseTo(1, 12);
    }
    // Small ones and curves drawn in mass order are read as they are.
    const small = bigRegion(PLACEMENT_MAX_POINTS);
    expect(placementCurve(small, 0)).toBe(small);
    const sorted = { ...big, role: "exclusion" as const, keepOrder: false };
    expect(placementCurve(sorted, 0)).toBe(sorted);
  });

  test("the corner chosen for a big contour is the one its full outline gives, at every resolution", () => {
    const big = bigRegion(10 * PLACEMENT_MAX_POINTS);
    const places = [0.5, 1, 2, 6.25].map((resolution) => placeOf(buildScene(project([big]), { resolution })));
    expect(new Set(places).size).toBe(1);
    expect(places[0]).not.toBe("top-right");
    // Reference: the same contour cut to PLACEMENT_MAX_POINTS by plain striding, read whole by the placement.
    const stride = Math.ceil(big.massEv.length / PLACEMENT_MAX_POINTS);
    const every = (a: Float64Array) => a.filter((_, i) => i % stride === 0);
    const strided = { ...big, id: "strided", massEv: every(big.massEv), gInvGeV: every(big.gInvGeV) };
    expect(placeOf(buildScene(project([strided])))).toBe(places[0]);
  });
});

describe("pickLegendPlace", () => {
  const plot = { x: 0, y: 0, w: 200, h: 100 };
  const boxes = {
    "top-left": { x: 4, y: 4, w: 60, h: 30 },
    "top-right": { x: 136, y: 4, w: 60, h: 30 },
    "bottom-left": { x: 4, y: 66, w: 60, h: 30 },
    "bottom-right": { x: 136, y: 66, w: 60, h: 30 },
  };
  const rect = (x: number, y: number, w: number, h: number) => ({
    kind: "path" as const,
    d: `M${x} ${y}H${x + w}V${y + h}H${x}Z`,
    fill: "#000",
  });

  test("ties go top-right, top-left, bottom-right, bottom-left", () => {
    expect(LEGEND_CORNERS).toEqual(["top-right", "top-left", "bottom-right", "bottom-left"]);
    const none = pickLegendPlace({ shapes: shapesOf([]), plot, boxes, outsideFits: () => true });
    expect(none).toMatchObject({ place: "top-right", crowded: false });
    expect(
      pickLegendPlace({ shapes: shapesOf([rect(100, 0, 100, 50)]), plot, boxes, outsideFits: () => true }).place,
    ).toBe("top-left");
    expect(
      pickLegendPlace({ shapes: shapesOf([rect(0, 0, 200, 50)]), plot, boxes, outsideFits: () => true }).place,
    ).toBe("bottom-right");
    expect(
      pickLegendPlace({
        shapes: shapesOf([rect(0, 0, 200, 50), rect(100, 50, 100, 50)]),
        plot,
        boxes,
        outsideFits: () => true,
      }).place,
    ).toBe("bottom-left");
  });

  test("crowded above the tolerance: outside right when it fits, else below; room is asked only then", () => {
    const fits = vi.fn(() => true);
    // Everything filled except a 20 × 100 strip on the left: top-left and bottom-left are 16/60 uncovered.
    const most = [rect(20, 0, 180, 100)];
    const a = pickLegendPlace({ shapes: shapesOf(most), plot, boxes, outsideFits: fits });
    expect(a.coverage["top-left"]).toBeCloseTo(44 / 60, 12);
    expect(a).toMatchObject({ place: "outside-right", crowded: true });
    const b = pickLegendPlace({ shapes: shapesOf(most), plot, boxes, outsideFits: () => false });
    expect(b.place).toBe("below");
    fits.mockClear();
    // A 4 px wide strip (one cell column) in the top-left box is 1/15 of it: above the 2 % tolerance.
    const c = pickLegendPlace({ shapes: shapesOf([rect(60, 0, 140, 100)]), plot, boxes, outsideFits: () => false });
    expect(c.coverage["top-left"]).toBeCloseTo(4 / 60, 12);
    expect(c.place).toBe("below");
    // Nothing in the top-left box: a free corner, no question about room.
    const d = pickLegendPlace({ shapes: shapesOf([rect(64, 0, 136, 100)]), plot, boxes, outsideFits: fits });
    expect(d).toMatchObject({ place: "top-left", crowded: false });
    expect(fits).not.toHaveBeenCalled();
  });

  test("lines count by the cells they cross, unpainted paths not at all", () => {
    const line = { kind: "path" as const, d: "M0 10H200", stroke: "#000", strokeWidth: 1, fill: "none" };
    const r = pickLegendPlace({ shapes: shapesOf([line]), plot, boxes, outsideFits: () => false });
    // The row of cells 8..12 px: 4 of the box's 30 px height (the box spans y 4..34).
    expect(r.coverage["top-left"]).toBeCloseTo(4 / 30, 12);
    expect(r.coverage["bottom-left"]).toBe(0);
    expect(r.place).toBe("bottom-right");
    const ghost = [
      { ...line, stroke: "none" },
      { kind: "path" as const, d: "M0 0H200V100H0Z", fill: "none" },
      { kind: "path" as const, d: "M0 0H200V100H0Z", fill: "#000", fillOpacity: 0 },
      {
        kind: "text" as const,
        x: 10,
        y: 10,
        runs: [{ text: "hello" }],
        sizePx: 40,
        anchor: "start" as const,
        baseline: "middle" as const,
      },
    ];
    expect(
      Object.values(pickLegendPlace({ shapes: shapesOf(ghost), plot, boxes, outsideFits: () => false }).coverage),
    ).toEqual([0, 0, 0, 0]);
  });
});
