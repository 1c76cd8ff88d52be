// Preset checks: the demo and a project with long legend entries, at every size preset (slide, single
// column, double column) and every legend place, checked at the figure's real size: every text inside the
// canvas, no text under 6 pt, the plot area at least a third of the figure, and an automatic legend never over
// drawn data. Sizes in pt from scene px at 96 px per inch (CSS; 72 pt per inch).
import { describe, expect, test } from "vitest";
import { defaultProject } from "../../src/project/demo";
import type { LegendPlace, Project, SizePreset } from "../../src/project/types";
import { buildScene } from "../../src/plot/scene";
import type { RectNode, Scene, TextNode } from "../../src/plot/scene-types";
import { CAP_HEIGHT, placeRuns, runsWidthPx, SUB_DROP, SUP_RAISE } from "../../src/plot/text";
import { coveredFraction, occupancyGrid } from "../../src/plot/occupancy";
import { LEGEND_MAX_COVERAGE } from "../../src/plot/legend-place";
import { curve, nodes, shapesOf, textNodes } from "./fixture";

const PRESETS: SizePreset[] = ["slide", "single-column", "double-column"];
const PLACES: LegendPlace[] = [
  "auto",
  "top-left",
  "top-right",
  "bottom-left",
  "bottom-right",
  "outside-right",
  "below",
  "above",
  "hidden",
];

/**
 * Smallest lettering in printed figures: 6 pt at the printed size (common practice; the journals' artwork
 * guidelines, e.g. APS and Elsevier, ask for no text under about 6 pt — from memory).
 */
const MIN_PT = 6;
/** The plot area inside the axes keeps at least this share of the figure (our own check of a usable plot). */
const MIN_PLOT_SHARE = 1 / 3;
const PT_PER_PX = 72 / 96;
/** The floor when a legend below or above cannot fit at all (our own check): the plot still dominates. */
const OVERFULL_PLOT_SHARE = 0.3;

/** The demo with a title, a rescaled curve and a model with a theory spread: long legend entries. */
function longEntries(): Project {
  const p = defaultProject();
  const m = Float64Array.from({ length: 40 }, (_, i) => 10 ** (-6 + (1.5 * i) / 39));
  const rescaled = curve({
    id: "long-rescaled",
    label: "Demo network: a long-running cavity search with several tuning rods (invented)",
    role: "exclusion",
    massEv: m,
    gInvGeV: Float64Array.from(m, (x) => 2e-14 * (x / 1e-6) ** 0.3),
    rescale: { rhoAssumed: 0.45, rhoShown: 0.3, fraction: 1 },
  });
  return {
    ...p,
    models: p.models.map((x) => (x.id === "dfsz" ? { ...x, sigmas: 2 } : x)),
    curves: [...p.curves, rescaled],
    figure: { ...p.figure, title: "Axion–photon coupling of the demo models" },
  };
}

const PROJECTS: [string, () => Project][] = [
  ["demo", defaultProject],
  ["long entries", longEntries],
];

function sceneOf(make: () => Project, preset: SizePreset, legend: LegendPlace): Scene {
  const p = make();
  return buildScene({ ...p, figure: { ...p.figure, preset, legend } });
}

/** Estimated box of a text node: width from the width table, height from cap height, superscripts and depth. */
function textBox(n: TextNode): { x0: number; x1: number; y0: number; y1: number } {
  const w = runsWidthPx(n.runs, n.sizePx);
  const { baselineY } = placeRuns(n);
  const sup = n.runs.some((r) => r.shift === "sup");
  const sub = n.runs.some((r) => r.shift === "sub");
  const up = sup ? (SUP_RAISE + CAP_HEIGHT * 0.7) * n.sizePx : CAP_HEIGHT * n.sizePx;
  const down = (sub ? SUB_DROP + 0.2 : 0.24) * n.sizePx;
  const along0 = n.anchor === "start" ? 0 : n.anchor === "middle" ? -w / 2 : -w;
  // Offsets along the text's own direction (a) and across it (b, down = positive) from its anchor point.
  const a = [along0, along0 + w];
  const b = [baselineY - n.y - up, baselineY - n.y + down];
  const rot = ((n.rotate ?? 0) * Math.PI) / 180;
  const xs: number[] = [];
  const ys: number[] = [];
  for (const u of a)
    for (const v of b) {
      xs.push(n.x + u * Math.cos(rot) - v * Math.sin(rot));
      ys.push(n.y + u * Math.sin(rot) + v * Math.cos(rot));
    }
  return { x0: Math.min(...xs), x1: Math.max(...xs), y0: Math.min(...ys), y1: Math.max(...ys) };
}

function legendBox(scene: Scene): RectNode | undefined {
  const n = nodes(scene, "legend").find((x) => x.id === "legend-box");
  return n?.kind === "rect" ? n : undefined;
}

describe.each(PROJECTS)("preset checks: %s", (name, make) => {
  describe.each(PRESETS)("%s", (preset) => {
    test.each(PLACES)("legend %s: text inside the canvas and at least 6 pt, plot area ≥ 1/3", (place) => {
      const scene = sceneOf(make, preset, place);
      for (const n of textNodes(scene)) {
        const b = textBox(n);
        const what = `${n.id} “${n.runs.map((r) => r.text).join("")}”`;
        expect(b.x0, what).toBeGreaterThanOrEqual(-0.5);
        expect(b.y0, what).toBeGreaterThanOrEqual(-0.5);
        expect(b.x1, what).toBeLessThanOrEqual(scene.widthPx + 0.5);
        expect(b.y1, what).toBeLessThanOrEqual(scene.heightPx + 0.5);
        for (const r of placeRuns(n).runs)
          expect((r.sizePx ?? n.sizePx) * PT_PER_PX, `${what} run “${r.text}”`).toBeGreaterThanOrEqual(MIN_PT - 1e-9);
      }
      const share = (scene.plot.w * scene.plot.h) / (scene.widthPx * scene.heightPx);
      // A legend below or above that cannot fit even at 6 pt with entries cut (the long-entries project on a single
      // column: a title, a top axis and seven entries on 8.6 × 6.45 cm) keeps one line per entry at the plot's
      // expense and says so; the demo keeps its third, and an automatic legend goes outside right instead.
      const overfull =
        (place === "below" || place === "above") &&
        scene.legendReducedToPt !== undefined &&
        (scene.shortenedLegendEntries?.length ?? 0) > 0;
      expect(share).toBeGreaterThanOrEqual(overfull && name !== "demo" ? OVERFULL_PLOT_SHARE : MIN_PLOT_SHARE);
      const box = legendBox(scene);
      if (place === "hidden") expect(box).toBeUndefined();
      else {
        expect(box).toBeDefined();
        expect(box!.x).toBeGreaterThanOrEqual(0);
        expect(box!.y).toBeGreaterThanOrEqual(0);
        expect(box!.x + box!.w).toBeLessThanOrEqual(scene.widthPx + 0.5);
        expect(box!.y + box!.h).toBeLessThanOrEqual(scene.heightPx + 0.5);
      }
      // Every line cut with "…" belongs to an entry the scene reports as shortened, and only those.
      const cut = new Set<string>();
      let entry = "";
      for (const n of textNodes(scene, "legend")) {
        entry = n.data?.["legend-entry"] ?? entry;
        if (n.runs.some((r) => r.text.endsWith("…"))) cut.add(entry);
      }
      expect([...cut].sort()).toEqual([...(scene.shortenedLegendEntries ?? [])].sort());
    });

    test("the automatic legend covers no drawn data (occupancy grid, at most the stated tolerance)", () => {
      const scene = sceneOf(make, preset, "auto");
      const box = legendBox(scene)!;
      const plot = scene.plot;
      const data = shapesOf([...nodes(scene, "curves"), ...nodes(scene, "models")]);
      const overlaps =
        box.x < plot.x + plot.w && box.x + box.w > plot.x && box.y < plot.y + plot.h && box.y + box.h > plot.y;
      const covered = overlaps ? coveredFraction(occupancyGrid(data, plot), box) : 0;
      expect(covered).toBeLessThanOrEqual(LEGEND_MAX_COVERAGE);
      // Outside the plot area, it sits clear of the frame entirely.
      if (scene.autoLegendPlace === "below" || scene.autoLegendPlace === "outside-right") expect(overlaps).toBe(false);
    });

    test("legend below, above and outside right never overlap the plot area; outside right keeps half the width", () => {
      for (const place of ["below", "above", "outside-right"] as const) {
        const scene = sceneOf(make, preset, place);
        const box = legendBox(scene)!;
        const p = scene.plot;
        const apart = box.x >= p.x + p.w || box.x + box.w <= p.x || box.y >= p.y + p.h || box.y + box.h <= p.y;
        expect(apart, place).toBe(true);
        if (place === "outside-right") expect(p.w).toBeGreaterThanOrEqual(0.5 * scene.widthPx - 0.5);
      }
    });
  });
});

describe("what the checks found, fixed", () => {
  test("double column, legend below: every entry of the long project is shown in full, in columns", () => {
    const scene = sceneOf(longEntries, "double-column", "below");
    expect(scene.shortenedLegendEntries).toBeUndefined();
    const firsts = textNodes(scene, "legend").filter((n) => n.data?.["legend-entry"] !== undefined);
    expect(new Set(firsts.map((n) => n.x)).size).toBeGreaterThan(1);
    const texts = firsts.map((n) => n.data!["legend-entry"]);
    expect(texts.some((t) => t.includes("rescaled: ρ = 0.3 GeV/cm³"))).toBe(true);
    expect(texts.some((t) => t.includes("±2σ spread"))).toBe(true);
  });

  test("single column: the automatic legend of the demo does not go outside right (it would squeeze the plot)", () => {
    const scene = sceneOf(defaultProject, "single-column", "auto");
    expect(scene.autoLegendPlace).not.toBe("outside-right");
  });
});
