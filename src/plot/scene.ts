// The scene builder: a project in, the complete figure out as plain layers of paths, rects and text, drawn the same on
// screen (SceneSvg, scene-dom.ts) and in the exported SVG (writeSvg). Settings and their fallbacks: scene-settings.ts.
import type { Curve, FigureFont, LegendPlace, Model, Project, YView } from "../project/types";
import type { PathNode, Scene, SceneLayer, SceneNode, ScaleConfig } from "./scene-types";
import { axesNodes, axisStyle, axisTicks, gridNodes, verticalTickOpts, yTitle, type AxesFrame } from "./axes";
import { curveGeometry, curveShape, exclusionMarkOf } from "./curves";
import { dashFor, plainOrScientificRuns, powerOfTenRuns, r2, safeColour, unitInterval } from "./format";
import {
  computeLayout,
  cornerLegendOrigin,
  figurePadPx,
  PX_PER_IN,
  type Fonts,
  type Layout,
  type LegendCorner,
  type PlotRect,
} from "./layout";
import { legendNodes, modelKindNote, type LegendBox, type LegendEntry } from "./legend";
import { fitLegend, outsideSuitsAuto } from "./legend-fit";
import {
  LEGEND_CORNERS,
  PLACEMENT_RESOLUTION,
  pickLegendPlace,
  placementCurve,
  type AutoLegendPlace,
} from "./legend-place";
import { modelShape, shapeCancels, shapeNormalizedRange } from "./model-shape";
import type { Shape } from "./occupancy";
import { markupRuns } from "./markup";
import { modelGeometry } from "./models";
import { constantsOf, rescaleNote } from "./physics-settings";
import { logAffine, viewTransform } from "./scales";
import { runsWidthPx } from "./text";
import { fitTitle, TITLE_LINE_SPACING, type TitleFit } from "./title";
import { logTicks } from "./ticks";
import { highlightNodes } from "./highlight";
import { figureSettings, physicalSize } from "./scene-settings";
import type { RunDeferral } from "./thinning/deferred-runs";
import { directLabels } from "./direct-label-nodes";

/**
 * The CSS font-family list of each figure font: the bundled Computer Modern Unicode face first (the app loads
 * its webfont, PNG and PDF use its files), then close system fonts. The width table (text.ts) is Helvetica's,
 * a few per cent wider than CMU's, so the layout's estimates err on the roomy side.
 */
export const FIGURE_FONT_CSS: Record<FigureFont, string> = {
  sans: "'CMU Sans Serif', Helvetica, Arial, 'Liberation Sans', 'DejaVu Sans', sans-serif",
  serif: "'CMU Serif', 'Latin Modern Roman', 'Times New Roman', 'Liberation Serif', 'DejaVu Serif', serif",
};

export interface BuildSceneOpts {
  /** Scene size in CSS px (96/in). @default the preset's size */
  widthPx?: number;
  heightPx?: number;
  /**
   * Device pixels per scene pixel: thinning keeps first/min/max/last per 1/resolution scene px. On screen
   * pass (displayed width / scene width) × devicePixelRatio; for export 1 (≤ 0.5 px error at the export
   * size) or the PNG's px per scene px. @default 1
   */
  resolution?: number;
  /** A mass interval to highlight (e.g. a row of the overlap table), optionally with its model or curve. */
  highlight?: {
    massMinEv: number;
    massMaxEv: number;
    modelId?: string;
    curveId?: string;
    /** Mark these intervals (eV) instead of the whole span; neighbours closer than a pixel share one mark. */
    intervalsEv?: [number, number][];
  } | null;
  /** Write the physical size (cm) into the scene, for export. @default true */
  physical?: boolean;
  /** Thin curves to pixel resolution; false draws every point (only for comparisons). @default true */
  thin?: boolean;
  /**
   * Draw the pixel columns where a solid curve zig-zags densely as a filled min–max envelope instead of the
   * zig-zag (the same pixels within antialiasing, far cheaper for the browser to paint; see
   * thinning/envelope.ts). The figure on screen sets it; exports keep the plain thinned line. @default false
   */
  envelope?: boolean;
  /**
   * For an "auto" legend: keep it at this place (a scene's `autoLegendPlace`) instead of choosing again. The
   * figure holds the legend still while the user zooms or pans, and places it afresh once the view rests;
   * exports never pass it. Ignored for a fixed place.
   */
  holdLegend?: AutoLegendPlace;
  /**
   * On screen: the first run thinning of a big file-order curve at a new zoom level is listed in `jobs` for a
   * worker, and a stand-in drawn meanwhile (thinning/deferred-runs.ts); the figure builds again once the worker
   * has answered. Exports never pass it, so they always draw the full thinning. @default none
   */
  deferRuns?: RunDeferral;
  /** Direct labels: keep them at these data points (a scene's `directLabels[].at` by "kind:id"), as holdLegend. */
  holdLabels?: Readonly<Record<string, { at: [number, number]; variant: number }>>;
}

function modelNotes(m: Model, c: ReturnType<typeof constantsOf>): string[] {
  const notes: string[] = [];
  const kindNote = modelKindNote(m);
  if (kindNote) notes.push(kindNote);
  const shape = modelShape(m, c);
  const sigmas = Number.isFinite(m.sigmas) && m.sigmas > 0 ? m.sigmas : 0;
  if (sigmas > 0) notes.push(`±${r2(sigmas)}σ spread`);
  if (!shape) return notes;
  if (shape.kind === "line" || shape.kind === "lines") {
    if (shapeCancels(shape, c)) notes.push(shape.kind === "line" ? "g = 0: not drawn" : "a line at g = 0 is not drawn");
  } else if (shapeCancels(shape, c)) {
    notes.push(shape.kind === "interval" ? "reaches g = 0: cancellation" : "a line reaches g = 0");
  } else if (sigmas > 0 && shapeNormalizedRange(shape, c, sigmas)[0] === 0) {
    notes.push("spread reaches g = 0");
  }
  return notes;
}

function curveNotes(cv: Curve): string[] {
  const note = rescaleNote(cv.rescale);
  return note ? [note] : [];
}

function withNotes(label: string, notes: string[]): string {
  return notes.length ? `${label} (${notes.join("; ")})` : label;
}

function legendEntries(project: Project, fonts: Fonts, c: ReturnType<typeof constantsOf>): LegendEntry[] {
  const entries: LegendEntry[] = [];
  for (const m of project.models) {
    if (!m.visible) continue;
    const shape = modelShape(m, c);
    if (!shape) continue;
    const isLine = shape.kind === "line" || shape.kind === "lines";
    const lw = isLine ? fonts.dataLinePx * 1.15 : fonts.dataLinePx;
    entries.push({
      kind: isLine ? "model-line" : "model-band",
      text: withNotes(m.label?.trim() || "(unnamed model)", modelNotes(m, c)),
      colour: safeColour(m.colour, "#117A8B"),
      dash: dashFor(m.lineStyle, lw),
      fillOpacity: unitInterval(m.fillOpacity, 0.25),
      lineWidthPx: lw,
      spread: m.sigmas > 0,
      data: { "model-id": m.id },
    });
  }
  for (const cv of project.curves) {
    if (!cv.visible) continue;
    const mark = cv.role === "exclusion" ? exclusionMarkOf(cv) : "fill";
    entries.push({
      kind: cv.role === "exclusion" ? "exclusion" : cv.role === "projection" ? "projection" : "region",
      text: withNotes(cv.label?.trim() || "(unnamed curve)", curveNotes(cv)),
      colour: safeColour(cv.colour, "#D55E00"),
      dash: dashFor(cv.lineStyle, fonts.dataLinePx),
      fillOpacity: mark === "hatch" ? 0 : unitInterval(cv.fillOpacity, 0.3),
      lineWidthPx: fonts.dataLinePx,
      hatched: mark !== "fill",
      data: { "curve-id": cv.id },
    });
  }
  return entries;
}

/** What the automatic legend placement needs from the figure being built. */
interface AutoLegendFrame {
  constants: ReturnType<typeof constantsOf>;
  view: YView;
  scales: ScaleConfig;
  fonts: Fonts;
  box: LegendBox;
  /** The layout with the legend inside (every inner corner gives the same plot area). */
  layout: Layout;
}

/**
 * The place of an "auto" legend (legend-place.ts): the curves (big file-order ones reduced by placementCurve)
 * are built again at the fixed PLACEMENT_RESOLUTION (the scene's own paths follow the display resolution, and the screen must pick the
 * corner the export picks); models come as vertices and do not depend on resolution. The highlight is left out (the
 * legend must not move when a table row is hovered).
 */
function autoLegendPlace(project: Project, f: AutoLegendFrame, outsideFits: () => boolean): AutoLegendPlace {
  const plot = roundedPlot(f.layout.plot);
  const map = logAffine(f.scales, plot);
  const slope = viewTransform(f.view, f.constants).slope;
  const shapes: Shape[] = [];
  project.curves.forEach((cv) => {
    if (!cv.visible) return;
    const shape = curveShape(placementCurve(cv, slope), {
      constants: f.constants,
      view: f.view,
      map,
      plot,
      lineWidthPx: f.fonts.dataLinePx,
      resolution: PLACEMENT_RESOLUTION,
    });
    if (shape) shapes.push(shape);
  });
  project.models.forEach((m, i) => {
    if (!m.visible) return;
    const g = modelGeometry(
      m,
      {
        constants: f.constants,
        view: f.view,
        map,
        massDomainEv: f.scales.massDomainEv,
        plot,
        lineWidthPx: f.fonts.dataLinePx,
      },
      `place-model-${i + 1}`,
    );
    if (g) shapes.push(...g.shapes);
  });
  const boxes = {} as Record<LegendCorner, { x: number; y: number; w: number; h: number }>;
  for (const corner of LEGEND_CORNERS) {
    const o = cornerLegendOrigin(f.layout.plot, corner, f.box.widthPx, f.box.heightPx, f.fonts);
    boxes[corner] = { x: o.x, y: o.y, w: f.box.widthPx, h: f.box.heightPx };
  }
  return pickLegendPlace({ shapes, plot, boxes, outsideFits }).place;
}

/** What laying out the figure around its legend needs. */
interface LayoutFrame {
  widthPx: number;
  heightPx: number;
  fonts: Fonts;
  constants: ReturnType<typeof constantsOf>;
  scales: ScaleConfig;
  topAxis: "none" | "fa" | "frequency";
  entries: LegendEntry[];
  holdLegend: AutoLegendPlace | undefined;
}

/**
 * The figure's layout with its legend fitted in (legend-fit.ts): margins from the tick labels and the legend's
 * place; an "auto" legend is placed where it covers no data (legend-place.ts) unless a place is held.
 */
function layoutWithLegend(project: Project, f: LayoutFrame) {
  const { widthPx, heightPx, fonts, entries, scales, topAxis, constants: c } = f;
  const [yDomain, view] = [scales.yDomain, scales.yView ?? "coupling"];
  const fig = project.figure;
  const legendSetting = fig.legend ?? "top-right";
  const ySpan = Math.log10(yDomain[1] / yDomain[0]);
  // Right margin: half of a wide decade label ("10⁻¹⁰"), fixed for the font size so the plot area does not
  // jump while zooming; a label that would still cross the figure edge is left out (axesNodes).
  const xHalf = runsWidthPx(powerOfTenRuns(-10), fonts.tickPx) / 2;
  const titleText = fig.title?.trim() ?? "";
  let title: TitleFit | null = titleText ? { lines: [markupRuns(titleText)], sizePx: fonts.headingPx } : null;
  const layoutFor = (place: LegendPlace, box: { widthPx: number; heightPx: number }) =>
    computeLayout({
      widthPx,
      heightPx,
      fonts,
      hasTopAxis: topAxis !== "none",
      hasTitle: !!title,
      ticks: fig.ticks,
      titleLines: title?.lines.length,
      titleSizePx: title?.sizePx,
      yLabelWidthPx: (plotH) =>
        logTicks(yDomain[0], yDomain[1], {
          ...verticalTickOpts(plotH / ySpan, fonts),
          format: view === "coupling" ? undefined : plainOrScientificRuns,
        }).reduce((w, t) => (t.label ? Math.max(w, runsWidthPx(t.label, fonts.tickPx)) : w), 0),
      xLabelHalfWidthPx: xHalf,
      legend: { place, widthPx: box.widthPx, heightPx: box.heightPx },
    });
  // The title is centred over the plot and moved in where that would put it off the figure (titleNodes), so it
  // has the figure's width less the pads.
  if (title) title = fitTitle(title.lines[0], fonts.headingPx, widthPx - 2 * figurePadPx(fonts));
  const fitInput = { entries, widthPx, heightPx, fonts, xLabelHalfWidthPx: xHalf, layoutFor };
  const fitted = fitLegend(legendSetting, fitInput, (inside, box) => {
    const frame = { constants: c, view, scales, fonts, box, layout: inside };
    return f.holdLegend ?? autoLegendPlace(project, frame, () => outsideSuitsAuto(fitInput));
  });
  return { ...fitted, title };
}

/** What drawing the curves and models needs. */
interface DataFrame {
  constants: ReturnType<typeof constantsOf>;
  view: YView;
  map: ReturnType<typeof logAffine>;
  massDomainEv: [number, number];
  plot: PlotRect;
  fonts: Fonts;
  resolution: number;
  thin: boolean | undefined;
  envelope: boolean | undefined;
  deferRuns: RunDeferral | undefined;
}

/** The curves' and models' fills and lines (each in project order), and each one's lines by id for halos. */
function dataNodes(project: Project, d: DataFrame) {
  // Curves: fills first, then lines, each in project order.
  const curveFills: SceneNode[] = [];
  const curveHatches: SceneNode[] = [];
  const curveLines: SceneNode[] = [];
  const curveLineById = new Map<string, PathNode[]>();
  project.curves.forEach((cv, i) => {
    if (!cv.visible) return;
    const g = curveGeometry(
      cv,
      {
        constants: d.constants,
        view: d.view,
        map: d.map,
        plot: d.plot,
        lineWidthPx: d.fonts.dataLinePx,
        resolution: d.resolution,
        thin: d.thin,
        envelope: d.envelope,
        deferRuns: d.deferRuns,
      },
      `curve-${i + 1}`,
    );
    curveFills.push(...g.fills);
    curveHatches.push(...g.hatches);
    curveLines.push(...g.lines);
    curveLineById.set(cv.id, g.lines.length ? g.lines : g.fills);
  });
  const modelFills: SceneNode[] = [];
  const modelLines: SceneNode[] = [];
  const modelLineById = new Map<string, PathNode[]>();
  project.models.forEach((m, i) => {
    if (!m.visible) return;
    const g = modelGeometry(m, { ...d, lineWidthPx: d.fonts.dataLinePx }, `model-${i + 1}`);
    if (!g) return;
    modelFills.push(...g.fills);
    modelLines.push(...g.lines);
    modelLineById.set(m.id, g.lines);
  });
  return { curveFills, curveHatches, curveLines, modelFills, modelLines, curveLineById, modelLineById };
}

/**
 * The figure title's lines (fitted by title.ts), centred over the plot area; moved in only where the plot's
 * centre would put them off the figure.
 */
function titleNodes(title: TitleFit | null, plot: PlotRect, layout: Layout, widthPx: number, fonts: Fonts) {
  if (!title) return [];
  const pad = figurePadPx(fonts);
  const half = Math.max(...title.lines.map((l) => runsWidthPx(l, title.sizePx))) / 2;
  const x = Math.min(Math.max(plot.x + plot.w / 2, pad + half), widthPx - pad - half);
  return title.lines.map((runs, k): SceneNode => ({
    kind: "text",
    id: k === 0 ? "figure-title" : `figure-title-${k + 1}`,
    x: r2(x),
    y: r2(layout.headingBaseline + k * title.sizePx * TITLE_LINE_SPACING),
    runs,
    sizePx: r2(title.sizePx),
    anchor: "middle",
    baseline: "alphabetic",
    fill: "#1a1a1a",
    weight: "bold",
  }));
}

/** What the scene says about its legend: where "auto" put it, entries shortened, text set smaller. */
function legendReport(entries: LegendEntry[], box: LegendBox, fonts: Fonts, autoPlace: AutoLegendPlace | undefined) {
  const report: Pick<Scene, "autoLegendPlace" | "shortenedLegendEntries" | "legendReducedToPt"> = {};
  if (autoPlace) report.autoLegendPlace = autoPlace;
  if (box.shortened.length) report.shortenedLegendEntries = box.shortened.map((i) => entries[i].text);
  if (entries.length && box.sizePx < fonts.legendPx - 1e-9)
    report.legendReducedToPt = Math.round(((box.sizePx * 72) / PX_PER_IN) * 10) / 10;
  return report;
}

/** The plot area at the scene's precision (both the scene and the legend placement map data into it). */
function roundedPlot(p: PlotRect): PlotRect {
  return { x: r2(p.x), y: r2(p.y), w: r2(p.w), h: r2(p.h) };
}

/** The white rectangle under the whole figure. */
function backgroundLayer(widthPx: number, heightPx: number): SceneLayer {
  return {
    id: "background",
    clip: false,
    nodes: [{ kind: "rect", id: "background-fill", x: 0, y: 0, w: r2(widthPx), h: r2(heightPx), fill: "#ffffff" }],
  };
}

/**
 * The scene of a project's figure. Layers, bottom to top: background, grid, curves (all curve fills in
 * project order, then all curve lines in project order, so no fill hides a line), models (fills, then
 * lines), highlight, axes, legend. Curves, models, highlight and grid are clipped to the plot area.
 * An "auto" legend goes to the inner corner where it covers the least of the curves and models, or outside
 * right when every corner is crowded and the figure has room (legend-place.ts); the choice depends on the
 * project and the scene size only, never on `resolution` or `highlight`, so screen and export agree.
 * @param project the whole project (figure settings, models, curves, physics constants).
 * @param opts size, resolution, highlight; see {@link BuildSceneOpts}.
 */
export function buildScene(project: Project, opts: BuildSceneOpts = {}): Scene {
  const fig = project.figure;
  const c = constantsOf(project.physics);
  const settings = figureSettings(project, opts);
  const { view, preset, widthPx, heightPx, fonts, massDomainEv, yDomain, topAxis } = settings;
  const legendSetting = fig.legend ?? "top-right";

  const allEntries = legendSetting === "hidden" ? [] : legendEntries(project, fonts, c);
  // "on-plot": no legend box; each entry's text is written beside its own line (direct-label-nodes.ts).
  const entries = legendSetting === "on-plot" ? [] : allEntries;

  const scales: ScaleConfig = { massDomainEv, yDomain, yView: view };
  const fitted = layoutWithLegend(project, { ...settings, constants: c, scales, entries, holdLegend: opts.holdLegend });
  const { layout, box: legendBox, autoPlace, title } = fitted;
  const plot = roundedPlot(layout.plot);
  const map = logAffine(scales, plot);
  const frame: AxesFrame = {
    map,
    plot,
    massDomainEv,
    yDomain,
    topAxis,
    constants: c,
    fonts,
    yView: view,
    ...axisStyle(fig),
  };
  const ticks = axisTicks(frame);

  const data = dataNodes(project, {
    constants: c,
    view,
    map,
    massDomainEv,
    plot,
    fonts,
    resolution: opts.resolution ?? 1,
    thin: opts.thin,
    envelope: opts.envelope,
    deferRuns: opts.deferRuns,
  });
  const highlight = highlightNodes(opts.highlight, { map, plot, fonts }, data.modelLineById, data.curveLineById);

  const axes = axesNodes(frame, ticks, layout, yTitle(view));
  axes.push(...titleNodes(title, plot, layout, widthPx, fonts));

  const layers: SceneLayer[] = [
    backgroundLayer(widthPx, heightPx),
    { id: "grid", clip: true, nodes: fig.grid ? gridNodes(frame, ticks) : [] },
    { id: "curves", clip: true, nodes: [...data.curveFills, ...data.curveHatches, ...data.curveLines] },
    { id: "models", clip: true, nodes: [...data.modelFills, ...data.modelLines] },
    { id: "highlight", clip: true, nodes: highlight },
    { id: "axes", clip: false, nodes: axes },
    {
      id: "legend",
      clip: false,
      nodes: legendNodes(entries, legendBox, layout.legendX, layout.legendY),
      data: { testid: "legend" },
    },
  ];
  const labels =
    legendSetting === "on-plot"
      ? directLabels(project, { constants: c, view, scales, plot, fonts, entries: allEntries, hold: opts.holdLabels })
      : null;
  if (labels) layers[layers.length - 1].nodes.push(...labels.nodes);
  const scene: Scene = {
    widthPx: r2(widthPx),
    heightPx: r2(heightPx),
    plot,
    scales,
    fontFamily: FIGURE_FONT_CSS[fig.font] ?? FIGURE_FONT_CSS.sans,
    layers,
  };
  Object.assign(scene, legendReport(entries, legendBox, fonts, autoPlace));
  if (title?.note) scene.notes = [title.note];
  if (labels?.report.length) scene.directLabels = labels.report;
  if (opts.physical !== false) Object.assign(scene, physicalSize(opts, widthPx, heightPx, preset));
  return scene;
}
