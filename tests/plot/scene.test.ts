// Checks of the scene builder against the physics: model lines where g_aγγ = α/(2π f_a)·|E/N − c_γ| puts
// them, the normalized views, cancelling bands, curve roles and rescaling, the legend, presets and layers.
import { describe, expect, test } from "vitest";
import { gAgg } from "../../src/physics/index";
import { buildScene, constantsOf, massToX, xToMass, yToPx, pxToY, PRESETS, presetOf } from "../../src/plot/index";
import { curve, fixtureProject, model, parsePath, paths, textNodes, textOf } from "./fixture";

/** α, CODATA 2018 recommended value. */
const ALPHA_CODATA_2018 = 7.2973525693e-3;
/** K of m_a = K μeV·10¹² GeV/f_a, Gorghetto & Villadoro, JHEP 03 (2019) 033. */
const K_2019 = 5.691;
/** c_γ, Grilli di Cortona, Hardy, Pardo Vega, Villadoro, JHEP 01 (2016) 034. */
const C_GAMMA = 1.92;

function lineOf(scene: ReturnType<typeof buildScene>, modelId: string) {
  const node = paths(scene, "models").find((p) => p.data?.["model-id"] === modelId && p.id?.endsWith("-line"));
  expect(node, `line of ${modelId}`).toBeDefined();
  return parsePath(node!.d)[0].points;
}

describe("model lines", () => {
  test("path points invert back to g = gAgg(m, E/N) within 0.01 px (coupling view)", () => {
    const scene = buildScene(fixtureProject());
    for (const [id, en] of [
      ["ksvz", 0],
      ["dfsz", 8 / 3],
    ] as const) {
      const pts = lineOf(scene, id);
      expect(pts.length).toBe(2);
      for (const [x, y] of pts) {
        const m = xToMass(scene, x);
        expect(Math.abs(yToPx(scene, gAgg(m, en)) - y)).toBeLessThan(0.01);
      }
    }
  });

  test("the E/N = 0 line passes through g = α·1.92/(2π·10¹² GeV) at m = 5.691 μeV (JHEP 01 (2016) 034; JHEP 03 (2019) 033)", () => {
    const scene = buildScene(fixtureProject());
    const [[x0, y0], [x1, y1]] = lineOf(scene, "ksvz");
    const x = massToX(scene, 5.691e-6);
    const yOnPath = y0 + ((y1 - y0) * (x - x0)) / (x1 - x0);
    const expected = (ALPHA_CODATA_2018 * C_GAMMA) / (2 * Math.PI * 1e12);
    // path data carry 2 decimals, so compare in px: 0.01 px is ~2·10⁻⁴ of g on this slide
    expect(Math.abs(yOnPath - yToPx(scene, expected))).toBeLessThan(0.01);
  });

  test("normalized view: the E/N = 8/3 line is horizontal at |8/3 − 1.92| (c_γ from JHEP 01 (2016) 034)", () => {
    const p = fixtureProject();
    p.figure.yView = "normalized";
    p.figure.yRange = [1e-2, 1e2];
    const scene = buildScene(p);
    const pts = lineOf(scene, "dfsz");
    const yPx = yToPx(scene, Math.abs(8 / 3 - C_GAMMA));
    for (const [, y] of pts) expect(Math.abs(y - yPx)).toBeLessThan(0.01);
    expect(scene.scales.yView).toBe("normalized");
  });

  test("g-gamma view: E/N = 8/3 sits at |g_γ| = 0.37 (g_γ = (E/N − c_γ)/2: (8/3 − 1.92)/2 = 0.373, c_γ from JHEP 01 (2016) 034)", () => {
    const p = fixtureProject();
    p.figure.yView = "g-gamma";
    p.figure.yRange = [5e-3, 50];
    const scene = buildScene(p);
    for (const [, y] of lineOf(scene, "dfsz")) expect(pxToY(scene, y)).toBeCloseTo(0.37, 2);
    for (const [, y] of lineOf(scene, "ksvz")) expect(pxToY(scene, y)).toBeCloseTo(0.96, 2);
  });

  test("a curve point maps to 2π f_a g/α in the normalized view (f_a = K·10⁶ GeV·eV/m, K = 5.691)", () => {
    const p = fixtureProject();
    p.figure.yView = "normalized";
    p.figure.yRange = [1e-2, 1e3];
    const m = Float64Array.from([1e-5, 2e-5]);
    const g = Float64Array.from([3e-14, 5e-14]);
    p.curves = [curve({ id: "two", role: "projection", massEv: m, gInvGeV: g })];
    const scene = buildScene(p);
    const node = paths(scene, "curves").find((n) => n.data?.["curve-id"] === "two")!;
    const pts = parsePath(node.d)[0].points;
    expect(pts.length).toBe(2);
    pts.forEach(([x, y], i) => {
      const fa = (K_2019 * 1e6) / m[i];
      const expected = (2 * Math.PI * fa * g[i]) / ALPHA_CODATA_2018;
      expect(Math.abs(x - massToX(scene, m[i]))).toBeLessThan(0.01);
      expect(Math.abs(y - yToPx(scene, expected))).toBeLessThan(0.01);
    });
  });

  test("custom constants are used everywhere: c_γ = 2.5 puts E/N = 8/3 at |8/3 − 2.5| in the normalized view", () => {
    const p = fixtureProject();
    p.physics = { ref: "custom", custom: { cGamma: 2.5, cGammaSigma: 0.1, kMuEv: 6, kMuEvSigma: 0.1, label: "mine" } };
    p.figure.yView = "normalized";
    p.figure.yRange = [1e-2, 1e2];
    const scene = buildScene(p);
    expect(constantsOf(p.physics).cGamma).toBe(2.5);
    for (const [, y] of lineOf(scene, "dfsz")) expect(pxToY(scene, y)).toBeCloseTo(8 / 3 - 2.5, 4);
  });
});

describe("model bands", () => {
  test("a band whose interval contains c_γ reaches the plot bottom and its legend says so (g ∝ |E/N − c_γ| vanishes at E/N = c_γ, JHEP 01 (2016) 034)", () => {
    const p = fixtureProject();
    p.models = [model({ id: "w", label: "Window", eOverNMin: "5/3", eOverNMax: "44/3" })];
    const scene = buildScene(p);
    const band = paths(scene, "models").find((n) => n.id?.endsWith("-band"))!;
    expect(band.data?.cancels).toBe("true");
    const ys = parsePath(band.d)[0].points.map(([, y]) => y);
    expect(Math.max(...ys)).toBeGreaterThanOrEqual(scene.plot.y + scene.plot.h);
    const entry = textNodes(scene, "legend").find((t) => t.data?.["model-id"] === "w")!;
    expect(entry.data?.["legend-entry"]).toMatch(/cancellation/);
  });

  test("a band that does not cancel has its lower edge at min |E/N − c_γ| of the interval", () => {
    const p = fixtureProject();
    p.models = [model({ id: "b", label: "Band", eOverNMin: "2.5", eOverNMax: "3" })];
    const scene = buildScene(p);
    const band = paths(scene, "models").find((n) => n.id?.endsWith("-band"))!;
    expect(band.data?.cancels).toBe("false");
    const pts = parsePath(band.d)[0].points;
    const mLeft = xToMass(scene, scene.plot.x);
    const ys = pts
      .filter(([x]) => Math.abs(x - scene.plot.x) < 0.01)
      .map(([, y]) => y)
      .sort((a, b) => a - b);
    expect(Math.abs(ys[0] - yToPx(scene, gAgg(mLeft, 3)))).toBeLessThan(0.01); // upper edge (smaller px)
    expect(Math.abs(ys[1] - yToPx(scene, gAgg(mLeft, 2.5)))).toBeLessThan(0.01); // lower edge
    const entry = textNodes(scene, "legend").find((t) => t.data?.["model-id"] === "b")!;
    expect(entry.data?.["legend-entry"]).toBe("Band");
  });

  test("a theory spread draws a lighter band that is wider than the central one", () => {
    const p = fixtureProject();
    p.models = [model({ id: "s", label: "Spread", eOverNMin: "8/3", sigmas: 2 })];
    const scene = buildScene(p);
    const spread = paths(scene, "models").find((n) => n.id?.endsWith("-spread"))!;
    expect(spread.fillOpacity!).toBeLessThan(0.25);
    const line = lineOf(scene, "s");
    const xs = parsePath(spread.d)[0]
      .points.filter(([x]) => Math.abs(x - line[0][0]) < 0.01)
      .map(([, y]) => y);
    expect(Math.min(...xs)).toBeLessThan(line[0][1]);
    expect(Math.max(...xs)).toBeGreaterThan(line[0][1]);
  });

  test("line styles become dash arrays; a model with an unreadable E/N is left out", () => {
    const p = fixtureProject();
    p.models.push(model({ id: "bad", label: "Bad", eOverNMin: "eight thirds" }));
    const scene = buildScene(p);
    const dfsz = paths(scene, "models").find((n) => n.data?.["model-id"] === "dfsz")!;
    expect(dfsz.dash).toMatch(/^\d+(\.\d+)? \d+(\.\d+)?$/);
    expect(paths(scene, "models").some((n) => n.data?.["model-id"] === "bad")).toBe(false);
    expect(dfsz.data?.eovern).toBe("8/3");
  });
});

describe("curves", () => {
  test("an exclusion (fill mark) is one path filled from the curve up past the plot top and stroked; a region is closed", () => {
    const p = fixtureProject();
    p.curves[0].exclusionMark = "fill";
    const scene = buildScene(p);
    const excl = paths(scene, "curves").find((n) => n.id?.endsWith("-exclusion"))!;
    expect(excl.data?.["curve-id"]).toBe("dip");
    expect(excl.data?.["curve-role"]).toBe("exclusion");
    const ys = parsePath(excl.d)[0].points.map(([, y]) => y);
    expect(Math.min(...ys)).toBeLessThan(scene.plot.y);
    expect(excl.fill).toBe("#D55E00");
    expect(excl.stroke).toBe("#D55E00");
    expect(excl.d.endsWith("Z")).toBe(true);
    const region = paths(scene, "curves").find((n) => n.data?.["curve-id"] === "blob")!;
    expect(region.d.endsWith("Z")).toBe(true);
    expect(region.fill).toBe("#009E73");
    expect(region.stroke).toBe("#009E73");
  });

  test("filled curves (exclusions, regions) come before lines (projections) in the curves layer", () => {
    const scene = buildScene(fixtureProject());
    const ids = paths(scene, "curves").map((n) => n.id ?? "");
    const lastFill = Math.max(...ids.map((id, i) => (id.endsWith("-exclusion") || id.endsWith("-region") ? i : -1)));
    const firstLine = ids.findIndex((id) => id.endsWith("-line"));
    expect(lastFill).toBeLessThan(firstLine);
  });

  test("rescaling multiplies g by √(ρ₀/ρ)/√f (common practice) and the legend says so", () => {
    const p = fixtureProject();
    const m = Float64Array.from([1e-5, 2e-5]);
    const g = Float64Array.from([3e-13, 3e-13]);
    p.curves = [
      curve({
        id: "r",
        label: "Scaled",
        role: "projection",
        massEv: m,
        gInvGeV: g,
        rescale: { rhoAssumed: 0.45, rhoShown: 0.3, fraction: 0.5 },
      }),
    ];
    const scene = buildScene(p);
    const pts = parsePath(paths(scene, "curves")[0].d)[0].points;
    const expected = (3e-13 * Math.sqrt(0.45 / 0.3)) / Math.sqrt(0.5);
    expect(Math.abs(pts[0][1] - yToPx(scene, expected))).toBeLessThan(0.01);
    const entry = textNodes(scene, "legend").find((t) => t.data?.["curve-id"] === "r")!;
    expect(entry.data?.["legend-entry"]).toMatch(/^Scaled \(rescaled.*ρ = 0\.3 GeV\/cm³, f = 0\.5\)$/);
  });

  test("non-positive points are skipped, never drawn as NaN", () => {
    const p = fixtureProject();
    p.curves = [
      curve({
        id: "z",
        role: "exclusion",
        massEv: Float64Array.from([1e-6, 2e-6, 3e-6, 4e-6]),
        gInvGeV: Float64Array.from([1e-13, 0, -1, 2e-13]),
      }),
    ];
    const scene = buildScene(p);
    const excl = paths(scene, "curves").find((n) => n.id?.endsWith("-exclusion"))!;
    expect(excl.d).not.toMatch(/NaN|Infinity/);
    // two data points, then the two points that close the fill above the plot
    expect(parsePath(excl.d)[0].points.length).toBe(4);
  });

  test("hidden curves and models are not drawn and have no legend entry", () => {
    const p = fixtureProject();
    p.curves[0].visible = false;
    p.models[0].visible = false;
    const scene = buildScene(p);
    expect(paths(scene, "curves").some((n) => n.data?.["curve-id"] === "dip")).toBe(false);
    const entries = textNodes(scene, "legend").map((t) => t.data?.["legend-entry"]);
    expect(entries).not.toContain("KSVZ-type, E/N = 0");
    expect(entries).toContain("DFSZ-type, E/N = 8/3");
  });
});

describe("legend, layers and sizes", () => {
  test("one legend entry per visible model and curve, in a layer marked testid=legend on a translucent white box", () => {
    const p = fixtureProject();
    const scene = buildScene(p);
    const legend = scene.layers.find((l) => l.id === "legend")!;
    expect(legend.data).toEqual({ testid: "legend" });
    const entries = textNodes(scene, "legend").filter((t) => t.data?.["legend-entry"] !== undefined);
    expect(entries).toHaveLength(p.models.length + p.curves.length);
    expect(entries.map(textOf)[0]).toBe("KSVZ-type, E/N = 0");
    const box = legend.nodes.find((n) => n.kind === "rect" && n.id === "legend-box");
    expect(box && box.kind === "rect" && box.fill === "#ffffff" && (box.fillOpacity ?? 1) < 1).toBe(true);
  });

  test("legend placement: inside corners, outside right (plot area shrinks), hidden", () => {
    const p = fixtureProject();
    const inside = buildScene(p);
    p.figure.legend = "outside-right";
    const outside = buildScene(p);
    expect(outside.plot.w).toBeLessThan(inside.plot.w);
    const box = outside.layers.find((l) => l.id === "legend")!.nodes[0];
    expect(box.kind === "rect" && box.x >= outside.plot.x + outside.plot.w).toBe(true);
    p.figure.legend = "top-left";
    const tl = buildScene(p).layers.find((l) => l.id === "legend")!.nodes[0];
    expect(tl.kind === "rect" && tl.x > inside.plot.x && tl.x < inside.plot.x + 30).toBe(true);
    p.figure.legend = "hidden";
    expect(buildScene(p).layers.find((l) => l.id === "legend")!.nodes).toHaveLength(0);
  });

  test("presets: slide 10 in × 5.625 in = 960 × 540 px; 8.6 cm and 17.8 cm columns (CSS: 1 in = 96 px; APS column widths, from memory)", () => {
    expect(PRESETS.slide.widthPx).toBe(960);
    expect(PRESETS.slide.heightPx).toBe(540);
    expect(PRESETS.slide.widthPhysical).toBe("25.4cm");
    expect(PRESETS.slide.heightPhysical).toBe("14.29cm");
    expect(PRESETS["single-column"].widthPhysical).toBe("8.6cm");
    expect(PRESETS["single-column"].widthPx).toBeCloseTo((8.6 / 2.54) * 96, 1);
    expect(PRESETS["double-column"].widthPhysical).toBe("17.8cm");
    const custom = presetOf({ preset: "custom", customWidthMm: 120, customHeightMm: 80 });
    expect(custom.widthPx).toBeCloseTo((120 / 25.4) * 96, 1);
    const p = fixtureProject();
    p.figure.preset = "single-column";
    const s = buildScene(p);
    expect(s.widthPhysical).toBe("8.6cm");
    expect(s.widthPx).toBeCloseTo(325.04, 2);
    // 12 pt base × 2/3 = 8 pt tick labels in a single column (8 pt · 96/72 = 10.67 px)
    expect(textNodes(s, "axes").find((t) => t.id?.startsWith("xlabel-"))!.sizePx).toBeCloseTo(10.67, 2);
    expect(textNodes(s, "axes").find((t) => t.id === "xlabel-1e-6")).toBeDefined();
  });

  test("layers in order with the plot-area clip on curves, models, highlight and grid; axis titles with sub/superscripts", () => {
    const scene = buildScene(fixtureProject(), { highlight: { massMinEv: 1e-5, massMaxEv: 2e-5, modelId: "dfsz" } });
    expect(scene.layers.map((l) => l.id)).toEqual([
      "background",
      "grid",
      "curves",
      "models",
      "highlight",
      "axes",
      "legend",
    ]);
    expect(scene.layers.filter((l) => l.clip).map((l) => l.id)).toEqual(["grid", "curves", "models", "highlight"]);
    const hl = scene.layers.find((l) => l.id === "highlight")!.nodes;
    const rect = hl.find((n) => n.kind === "rect")!;
    expect(rect.kind === "rect" && Math.abs(rect.x - massToX(scene, 1e-5)) < 0.01).toBe(true);
    expect(hl.some((n) => n.kind === "path" && n.data?.["model-id"] === "dfsz")).toBe(true);
    const yt = textNodes(scene, "axes").find((t) => t.id === "ytitle")!;
    expect(yt.runs).toEqual([
      { text: "g", italic: true },
      { text: "aγγ", shift: "sub" },
      { text: " [GeV" },
      { text: "−1", shift: "sup" },
      { text: "]" },
    ]);
    expect(yt.rotate).toBe(-90);
    const xt = textNodes(scene, "axes").find((t) => t.id === "xtitle")!;
    expect(xt.runs).toEqual([{ text: "m", italic: true }, { text: "a", shift: "sub" }, { text: " [eV]" }]);
  });

  test("no tick label overlaps another on any preset (estimated widths)", () => {
    for (const preset of ["slide", "single-column", "double-column", "custom"] as const) {
      const p = fixtureProject();
      p.figure.preset = preset;
      const scene = buildScene(p);
      const xl = textNodes(scene, "axes")
        .filter((t) => t.id?.startsWith("xlabel-"))
        .map((t) => t.x);
      for (let i = 1; i < xl.length; i++)
        expect(xl[i] - xl[i - 1]).toBeGreaterThan(textNodes(scene, "axes")[0].sizePx * 2);
      const yl = textNodes(scene, "axes")
        .filter((t) => t.id?.startsWith("ylabel-"))
        .map((t) => t.y);
      for (let i = 1; i < yl.length; i++)
        expect(Math.abs(yl[i] - yl[i - 1])).toBeGreaterThan(textNodes(scene, "axes")[0].sizePx);
    }
  });

  test("the plot area stays put while zooming the mass axis (no jumping frame on screen), labels stay inside the figure", () => {
    const p = fixtureProject();
    const rects = new Set<string>();
    for (const range of [
      [1e-7, 1e-2],
      [2.1e-5, 9.5e-5],
      [1.2e-9, 3e-3],
      [3.1e-6, 3.4e-6],
    ] as [number, number][]) {
      p.figure.massRangeEv = range;
      const scene = buildScene(p);
      rects.add(JSON.stringify(scene.plot));
      for (const t of textNodes(scene, "axes").filter(
        (n) => n.id?.startsWith("xlabel-") || n.id?.startsWith("toplabel-"),
      )) {
        expect(t.x).toBeGreaterThan(0);
        expect(t.x).toBeLessThan(scene.widthPx);
      }
    }
    expect(rects.size).toBe(1);
  });

  test("the same project gives the same scene", () => {
    expect(JSON.stringify(buildScene(fixtureProject()))).toBe(JSON.stringify(buildScene(fixtureProject())));
  });
});
