// Direct labels as scene nodes: the label texts of the visible curves and models measured and wrapped, their drawn
// shapes read as the automatic legend reads them, placed by direct-labels.ts, written as text and leader nodes.
import type { Curve, LabelAt, Model, Project, YView } from "../project/types";
import type { PathNode, SceneNode, ScaleConfig, TextNode, TextRun } from "./scene-types";
import type { Fonts, PlotRect } from "./layout";
import type { LegendEntry } from "./legend";
import type { Shape, Subpath } from "./occupancy";
import { curveShape, exclusionMarkOf } from "./curves";
import { modelGeometry } from "./models";
import { PLACEMENT_RESOLUTION, placementCurve } from "./legend-place";
import { logAffine, viewTransform, gToView, viewToG, type LogAffine } from "./scales";
import { r2 } from "./format";
import { markupRuns } from "./markup";
import { CAP_HEIGHT, runsWidthPx, wrapText } from "./text";
import { hatchStyleFor } from "./hatch";
import { leaderStart, placeDirectLabels, type LabelItem, type PlacedLabel } from "./direct-labels";
import type { constantsOf } from "./physics-settings";

/** One label as the scene reports it (for the app's drag handles): which item, its box, whether the user placed it. */
export interface DirectLabelReport {
  kind: "curve" | "model";
  id: string;
  /** The label's text (plain, notes included), for the handle's accessible name. */
  text: string;
  box: PlotRect;
  /** Whether the user placed it (a held label is not). */
  pinned: boolean;
  /** The box centre as a data point, and the wrapping used (what holding the label keeps). */
  at: LabelAt;
  variant: number;
}

/** One thing to label, as the scene builder hands it over: text, colour, and its drawn shapes. */
interface Labelled {
  kind: "curve" | "model";
  id: string;
  /** Node id stem, "curve-2" / "model-1" (the data nodes' own). */
  stem: string;
  text: string;
  colour: string;
  labelAt: LabelAt | undefined;
  /** An exclusion: hatches stand out on its excluded side. */
  hatched: boolean;
  shapes: Shape[];
  lines: Subpath[];
}

/** What placing the labels needs from the figure being built. */
export interface DirectLabelFrame {
  constants: ReturnType<typeof constantsOf>;
  view: YView;
  scales: ScaleConfig;
  plot: PlotRect;
  fonts: Fonts;
  /** The legend's entries (text with notes, colour, and the item's id in `data`): what each label says. */
  entries: readonly Pick<LegendEntry, "text" | "colour" | "data">[];
  /**
   * Places to keep labels at (their centres as data points, by "curve:<id>" / "model:<id>") instead of placing them
   * afresh: the figure holds its labels still while the view moves (BuildSceneOpts.holdLabels).
   */
  hold?: Readonly<Record<string, { at: LabelAt; variant: number }>>;
}

/** Each entry's text and colour by "curve:<id>" / "model:<id>". */
function textsOf(entries: DirectLabelFrame["entries"]) {
  const texts = new Map<string, { text: string; colour: string }>();
  for (const e of entries) {
    const key = e.data["curve-id"] ? `curve:${e.data["curve-id"]}` : `model:${e.data["model-id"]}`;
    texts.set(key, { text: e.text, colour: e.colour });
  }
  return texts;
}

/** Line height of a wrapped label, as a multiple of its size (the legend's). */
const LINE_SPACING = 1.12;
/** Widest label line, as a fraction of the plot width (longer labels wrap, at most three lines). */
const MAX_WIDTH_FRACTION = 0.42;

/**
 * The colour a label is written in: its item's colour, darkened when that is too light to read as text on white
 * (relative luminance above 0.35, e.g. a yellow), so every label keeps the colour cue and stays legible.
 */
export function labelColour(hex: string): string {
  const m = /^#([0-9a-f]{6})$/i.exec(hex) ?? /^#([0-9a-f]{3})$/i.exec(hex);
  if (!m) return hex;
  const h = m[1].length === 3 ? [...m[1]].map((c) => c + c).join("") : m[1];
  const rgb = [0, 2, 4].map((i) => parseInt(h.slice(i, i + 2), 16) / 255);
  const lin = rgb.map((c) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
  const lum = 0.2126 * lin[0] + 0.7152 * lin[1] + 0.0722 * lin[2];
  if (lum <= 0.35) return hex;
  const k = Math.sqrt(0.35 / lum) ** (1 / 2.2) * 0.8;
  return `#${rgb
    .map((c) =>
      Math.round(c * k * 255)
        .toString(16)
        .padStart(2, "0"),
    )
    .join("")}`;
}

/** The subpaths of a shape that are its line (an exclusion's path without its closing run up past the plot top). */
function lineParts(shape: Shape, exclusion: boolean): Subpath[] {
  if (!shape.stroke) return [];
  return shape.subpaths.map((s) =>
    exclusion && s.xs.length > 2
      ? { xs: Array.from(s.xs).slice(0, -2), ys: Array.from(s.ys).slice(0, -2), closed: false }
      : s,
  );
}

type Texts = ReturnType<typeof textsOf>;

function curveItem(
  cv: Curve,
  i: number,
  f: DirectLabelFrame,
  texts: Texts,
  map: LogAffine,
  slope: number,
): Labelled | null {
  const t = texts.get(`curve:${cv.id}`);
  if (!t) return null;
  const shape = curveShape(placementCurve(cv, slope), {
    constants: f.constants,
    view: f.view,
    map,
    plot: f.plot,
    lineWidthPx: f.fonts.dataLinePx,
    resolution: PLACEMENT_RESOLUTION,
  });
  if (!shape) return null;
  const lines = lineParts(shape, cv.role === "exclusion");
  const hatched = cv.role === "exclusion" && exclusionMarkOf(cv) !== "fill";
  return {
    kind: "curve",
    id: cv.id,
    stem: `curve-${i + 1}`,
    ...t,
    labelAt: cv.labelAt,
    hatched,
    shapes: [shape],
    lines,
  };
}

function modelItem(m: Model, i: number, f: DirectLabelFrame, texts: Texts, map: LogAffine): Labelled | null {
  const t = texts.get(`model:${m.id}`);
  if (!t) return null;
  const frame = { ...f, map, massDomainEv: f.scales.massDomainEv, lineWidthPx: f.fonts.dataLinePx };
  const g = modelGeometry(m, frame, `label-model-${i + 1}`);
  if (!g) return null;
  const lines = g.shapes.flatMap((s) => (s.fill ? [] : lineParts(s, false)));
  return {
    kind: "model",
    id: m.id,
    stem: `model-${i + 1}`,
    ...t,
    labelAt: m.labelAt,
    hatched: false,
    shapes: g.shapes,
    lines,
  };
}

/** Scene px of a data point (mass eV, g_aγγ GeV⁻¹) in the frame's y view; null when not finite. */
function pinPx(at: LabelAt, f: DirectLabelFrame, map: LogAffine) {
  const y = gToView(f.view, at[0], at[1], f.constants);
  const x = map.ax + map.bx * Math.log10(at[0]);
  const py = map.ay + map.by * Math.log10(y);
  return Number.isFinite(x) && Number.isFinite(py) ? { x, y: py } : null;
}

/** The data point (mass eV, g_aγγ GeV⁻¹) under a scene point of a scene's plot: what a dragged label stores. */
export function labelAtOf(
  x: number,
  y: number,
  s: { plot: PlotRect; scales: ScaleConfig },
  constants: ReturnType<typeof constantsOf>,
): LabelAt {
  const map = logAffine(s.scales, s.plot);
  const massEv = 10 ** ((x - map.ax) / map.bx);
  const v = 10 ** ((y - map.ay) / map.by);
  return [massEv, viewToG(s.scales.yView ?? "coupling", massEv, v, constants)];
}

/** One way of setting a label: its lines (markup read, as the legend does) and its box size. */
interface LabelForm {
  lines: TextRun[][];
  widthPx: number;
  heightPx: number;
}

/**
 * The forms a label can take: wrapped at the widest line allowed, then narrower (0.6 and 0.4 of it, not under six
 * em), each kept only when it differs from the one before and needs no "…".
 */
function labelForms(text: string, sizePx: number, maxWidthPx: number): LabelForm[] {
  const forms: LabelForm[] = [];
  for (const f of [1, 0.6, 0.4]) {
    const w = wrapText(text, sizePx, Math.max(maxWidthPx * f, sizePx * 6), f === 1 ? 3 : 4);
    if (f !== 1 && (w.shortened || w.lines.length === forms[forms.length - 1].lines.length)) continue;
    const lines = w.lines.map((l) => markupRuns(l));
    const widthPx = Math.max(...lines.map((l) => runsWidthPx(l, sizePx)));
    const heightPx = (CAP_HEIGHT + 0.25 + (lines.length - 1) * LINE_SPACING) * sizePx;
    forms.push({ lines, widthPx, heightPx });
  }
  return forms;
}

function textNodes(it: Labelled, p: PlacedLabel, lines: TextRun[][], sizePx: number): SceneNode[] {
  const colour = labelColour(it.colour);
  const data = { [it.kind === "curve" ? "curve-id" : "model-id"]: it.id, "direct-label": p.pinned ? "moved" : "auto" };
  const out: SceneNode[] = [];
  if (p.leaderTo) {
    const from = leaderStart(p.box, p.leaderTo);
    const d = `M${r2(from.x)} ${r2(from.y)}L${r2(p.leaderTo.x)} ${r2(p.leaderTo.y)}`;
    const leader: PathNode = {
      kind: "path",
      id: `label-${it.stem}-leader`,
      d,
      stroke: colour,
      strokeWidth: 0.6,
      fill: "none",
    };
    out.push(leader);
  }
  lines.forEach((runs, k) => {
    const node: TextNode = {
      kind: "text",
      id: k === 0 ? `label-${it.stem}` : `label-${it.stem}-${k + 1}`,
      x: r2(p.box.x + p.box.w / 2),
      y: r2(p.box.y + CAP_HEIGHT * sizePx + k * LINE_SPACING * sizePx),
      runs,
      sizePx: r2(sizePx),
      anchor: "middle",
      baseline: "alphabetic",
      fill: colour,
      data: { ...data },
    };
    out.push(node);
  });
  return out;
}

/**
 * The direct labels of a figure whose legend is "on-plot": nodes (leader lines, then texts) for the legend
 * layer, and where each label went for the app. Curves are read at the automatic legend's fixed resolution
 * (PLACEMENT_RESOLUTION), so the screen and every export place them alike.
 */
export function directLabels(
  project: Project,
  f: DirectLabelFrame,
): { nodes: SceneNode[]; report: DirectLabelReport[] } {
  const map = logAffine(f.scales, f.plot);
  const slope = viewTransform(f.view, f.constants).slope;
  const texts = textsOf(f.entries);
  const labelled: Labelled[] = [];
  project.models.forEach((m, i) => {
    const it = m.visible ? modelItem(m, i, f, texts, map) : null;
    if (it) labelled.push(it);
  });
  project.curves.forEach((cv, i) => {
    const it = cv.visible ? curveItem(cv, i, f, texts, map, slope) : null;
    if (it) labelled.push(it);
  });
  const sizePx = f.fonts.legendPx;
  const lw = f.fonts.dataLinePx;
  const maxW = Math.max(f.plot.w * MAX_WIDTH_FRACTION, sizePx * 6);
  const forms = labelled.map((it) => labelForms(it.text, sizePx, maxW));
  const items: LabelItem[] = labelled.map((it, k) => {
    const held = it.labelAt ? undefined : f.hold?.[`${it.kind}:${it.id}`];
    const at = it.labelAt ?? held?.at;
    const pin = at ? pinPx(at, f, map) : null;
    const inPlot =
      pin && pin.x >= f.plot.x && pin.x <= f.plot.x + f.plot.w && pin.y >= f.plot.y && pin.y <= f.plot.y + f.plot.h;
    return {
      key: `${it.kind}:${it.id}`,
      widthPx: forms[k][0].widthPx,
      heightPx: forms[k][0].heightPx,
      alternatives: forms[k].slice(1),
      lines: it.lines,
      shapes: it.shapes,
      haloPx: it.hatched ? hatchStyleFor(lw).lengthPx + lw : lw,
      ...(inPlot ? { pinned: pin, pinnedVariant: held?.variant ?? 0 } : {}),
    };
  });
  // Clear of an exclusion's hatches (on its excluded side) and a little air beside any line.
  const gapPx = Math.max(0.35 * sizePx, hatchStyleFor(lw).lengthPx + lw);
  const placed = placeDirectLabels({ items, plot: f.plot, gapPx, sizePx });
  const byKey = new Map(placed.map((p) => [p.key, p]));
  const nodes: SceneNode[] = [];
  const report: DirectLabelReport[] = [];
  labelled.forEach((it, k) => {
    const p = byKey.get(items[k].key);
    if (!p) return;
    nodes.push(...textNodes(it, p, (forms[k][p.variant] ?? forms[k][0]).lines, sizePx));
    const box = { x: r2(p.box.x), y: r2(p.box.y), w: r2(p.box.w), h: r2(p.box.h) };
    const at = labelAtOf(box.x + box.w / 2, box.y + box.h / 2, f, f.constants);
    report.push({
      kind: it.kind,
      id: it.id,
      text: it.text,
      box,
      pinned: p.pinned && !!it.labelAt,
      at,
      variant: p.variant,
    });
  });
  return { nodes, report };
}
