// Axes of the figure: frame, ticks, tick labels, axis titles with real sub/superscripts, the optional top axis
// (f_a or frequency, in step with the mass axis) and the decade grid.
import type { AxionConstants } from "../physics/constants";
import { AXIS_MASS_UNITS, FREQUENCY_AXIS_UNITS, massToEv, massUnitInfo, type AxisMassUnit } from "../physics/units";
import type { Figure, FrequencyUnitSetting, TickSides, TopAxis, YView } from "../project/types";
import type { PathNode, SceneNode, TextNode, TextRun } from "./scene-types";
import { plainOrScientificRuns, r2 } from "./format";
import type { Fonts, Layout } from "./layout";
import type { LogAffine } from "./scales";
import { runsWidthPx } from "./text";
import {
  faTicks,
  frequencyTicks,
  logTicks,
  massTicks,
  type FrequencyUnit,
  type LogTick,
  type LogTickOpts,
} from "./ticks";

/** Title of the mass axis in its unit: m_a [μeV]. */
export function massTitle(unit: AxisMassUnit = "eV"): TextRun[] {
  return [{ text: "m", italic: true }, { text: "a", shift: "sub" }, { text: ` [${massUnitInfo(unit).label}]` }];
}
/** Title of the f_a top axis: f_a [GeV]. */
export const FA_TITLE: TextRun[] = [{ text: "f", italic: true }, { text: "a", shift: "sub" }, { text: " [GeV]" }];

/** Title of the y axis for a y view. */
export function yTitle(view: YView): TextRun[] {
  if (view === "normalized") return [{ text: "|E/N − c" }, { text: "γ", shift: "sub" }, { text: "|" }];
  if (view === "g-gamma") return [{ text: "|g" }, { text: "γ", shift: "sub" }, { text: "|" }];
  return [
    { text: "g", italic: true },
    { text: "aγγ", shift: "sub" },
    { text: " [GeV" },
    { text: "−1", shift: "sup" },
    { text: "]" },
  ];
}

/** Title of the frequency top axis in its unit: ν [GHz]. */
export function frequencyTitle(unit: FrequencyUnit): TextRun[] {
  return [{ text: "ν", italic: true }, { text: ` [${unit.unit}]` }];
}

/** Tick options of a horizontal axis (labels need their width) and a vertical one (their height). */
export function horizontalTickOpts(pxPerDecade: number, fonts: Fonts): Omit<LogTickOpts, "format"> {
  return { pxPerDecade, labelExtentPx: (r) => runsWidthPx(r, fonts.tickPx), labelGapPx: fonts.tickPx * 0.8 };
}
export function verticalTickOpts(pxPerDecade: number, fonts: Fonts): Omit<LogTickOpts, "format"> {
  return { pxPerDecade, labelExtentPx: () => fonts.tickPx * 1.05, labelGapPx: fonts.tickPx * 0.35 };
}

/** Ticks of the axes for a frame, positioned in scene px. */
export interface AxisTicks {
  x: (LogTick & { px: number })[];
  y: (LogTick & { px: number })[];
  top: (LogTick & { px: number })[] | null;
  topTitle: TextRun[] | null;
  frequencyUnit: FrequencyUnit | null;
  xTitle: TextRun[];
}

/** How the axes are labelled and ticked (figure settings). */
export interface AxisStyle {
  massUnit: AxisMassUnit;
  frequencyUnit: FrequencyUnitSetting;
  ticks: TickSides;
}

export interface AxesFrame extends Partial<AxisStyle> {
  map: LogAffine;
  plot: { x: number; y: number; w: number; h: number };
  massDomainEv: [number, number];
  yDomain: [number, number];
  topAxis: TopAxis;
  constants: AxionConstants;
  fonts: Fonts;
  /** Dimensionless views get plain labels (0.1, 1, 10) where they are short. @default "coupling" */
  yView?: YView;
}

/** The figure's axis settings as the frame takes them, unknown values (a hand-made project) read as defaults. */
export function axisStyle(fig: Partial<Pick<Figure, "massUnit" | "frequencyUnit" | "ticks">>): AxisStyle {
  const freq = fig.frequencyUnit;
  return {
    massUnit: AXIS_MASS_UNITS.find((u) => u === fig.massUnit) ?? "eV",
    frequencyUnit: freq === "auto" || FREQUENCY_AXIS_UNITS.some((u) => u === freq) ? (freq ?? "auto") : "auto",
    ticks: fig.ticks === "all" ? "all" : "out",
  };
}

/** Positioned ticks of all axes (values in the mass unit, y-view units, GeV or Hz). */
export function axisTicks(f: AxesFrame): AxisTicks {
  const { map, massDomainEv, yDomain, fonts } = f;
  const ppdX = map.bx;
  const xPx = (m: number) => map.ax + map.bx * Math.log10(m);
  const unit = f.massUnit ?? "eV";
  const x = massTicks(massDomainEv, unit, horizontalTickOpts(ppdX, fonts)).map((t) => ({
    ...t,
    px: xPx(massToEv(t.value, unit)),
  }));
  const yFormat = f.yView && f.yView !== "coupling" ? plainOrScientificRuns : undefined;
  const y = logTicks(yDomain[0], yDomain[1], { ...verticalTickOpts(-map.by, fonts), format: yFormat }).map((t) => ({
    ...t,
    px: map.ay + map.by * Math.log10(t.value),
  }));
  const out: AxisTicks = { x, y, top: null, topTitle: null, frequencyUnit: null, xTitle: massTitle(unit) };
  if (f.topAxis === "fa") {
    const k = f.constants.kMuEv * 1e6;
    out.top = faTicks(massDomainEv, f.constants, horizontalTickOpts(ppdX, fonts)).map((t) => ({
      ...t,
      px: xPx(k / t.value),
    }));
    out.topTitle = FA_TITLE;
  } else if (f.topAxis === "frequency") {
    const ft = frequencyTicks(massDomainEv, horizontalTickOpts(ppdX, fonts), f.frequencyUnit);
    out.top = ft.ticks.map((t) => ({ ...t, px: xPx(massToEv(t.value, "Hz")) }));
    out.topTitle = frequencyTitle(ft.unit);
    out.frequencyUnit = ft.unit;
  }
  return out;
}

/** A tick value as an id part: "1e-6", "2_5e-7" (only [A-Za-z0-9_-]). */
function valueKey(v: number): string {
  return Number(v.toPrecision(6))
    .toExponential()
    .replace("+", "")
    .replace(/[^A-Za-z0-9-]/g, "_");
}

function text(
  id: string,
  x: number,
  y: number,
  runs: TextRun[],
  sizePx: number,
  anchor: TextNode["anchor"],
  extra: Partial<TextNode> = {},
): TextNode {
  return {
    kind: "text",
    id,
    x: r2(x),
    y: r2(y),
    runs,
    sizePx: r2(sizePx),
    anchor,
    baseline: "alphabetic",
    fill: "#1a1a1a",
    ...extra,
  };
}

type Positioned = LogTick & { px: number };
const seg = (ax: number, ay: number, bx: number, by: number) => `M${r2(ax)} ${r2(ay)}L${r2(bx)} ${r2(by)}`;

/** Whether a tick lies on the frame (with a hair of slack for rounding). */
function onFrame(plot: AxesFrame["plot"]) {
  return {
    inX: (px: number) => px >= plot.x - 0.01 && px <= plot.x + plot.w + 0.01,
    inY: (py: number) => py >= plot.y - 0.01 && py <= plot.y + plot.h + 0.01,
  };
}

/**
 * Tick marks pointing out of the frame: bottom, left and a top axis always; with "all" also the right side
 * (mirroring the left) and the top (mirroring the bottom unless a top axis has its own).
 */
function tickNodes(f: AxesFrame, t: AxisTicks, layout: Layout): PathNode[] {
  const { plot } = f;
  const { inX, inY } = onFrame(plot);
  const all = f.ticks === "all";
  const [x0, x1, y0, y1] = [plot.x, plot.x + plot.w, plot.y, plot.y + plot.h];
  const d = { major: "", minor: "" };
  const len = (tk: Positioned) => (tk.major ? layout.tickMajorPx : layout.tickMinorPx);
  const add = (tk: Positioned, s: string) => (d[tk.major ? "major" : "minor"] += s);
  for (const tk of t.x) {
    if (!inX(tk.px)) continue;
    add(tk, seg(tk.px, y1, tk.px, y1 + len(tk)));
    if (all && !t.top) add(tk, seg(tk.px, y0, tk.px, y0 - len(tk)));
  }
  for (const tk of t.top ?? []) if (inX(tk.px)) add(tk, seg(tk.px, y0, tk.px, y0 - len(tk)));
  for (const tk of t.y) {
    if (!inY(tk.px)) continue;
    add(tk, seg(x0, tk.px, x0 - len(tk), tk.px));
    if (all) add(tk, seg(x1, tk.px, x1 + len(tk), tk.px));
  }
  const lw = r2(f.fonts.axisLinePx);
  const path = (id: string, path: string, w: number): PathNode => ({
    kind: "path",
    id,
    d: path,
    stroke: "#1a1a1a",
    strokeWidth: w,
    fill: "none",
  });
  return [
    ...(d.minor ? [path("ticks-minor", d.minor, r2(lw * 0.8))] : []),
    ...(d.major ? [path("ticks-major", d.major, lw)] : []),
  ];
}

/** Tick labels; ids follow the tick value, so a label keeps its id (and its element on screen) while zooming. */
function labelNodes(f: AxesFrame, t: AxisTicks, layout: Layout): TextNode[] {
  const { fonts } = f;
  const { inX, inY } = onFrame(f.plot);
  // Labels of the horizontal axes that would cross the figure edge are left out.
  const fitsX = (tk: Positioned) => {
    const half = runsWidthPx(tk.label ?? [], fonts.tickPx) / 2;
    return tk.px - half >= 0 && tk.px + half <= layout.figureWidthPx;
  };
  const nodes: TextNode[] = [];
  const horizontal = (ticks: Positioned[], prefix: string, baseline: number) => {
    for (const tk of ticks)
      if (tk.label && inX(tk.px) && fitsX(tk))
        nodes.push(text(`${prefix}-${valueKey(tk.value)}`, tk.px, baseline, tk.label, fonts.tickPx, "middle"));
  };
  horizontal(t.x, "xlabel", layout.xLabelBaseline);
  for (const tk of t.y)
    if (tk.label && inY(tk.px)) {
      const y = tk.px + 0.36 * fonts.tickPx;
      nodes.push(text(`ylabel-${valueKey(tk.value)}`, layout.yLabelRight, y, tk.label, fonts.tickPx, "end"));
    }
  horizontal(t.top ?? [], "toplabel", layout.topLabelBaseline);
  return nodes;
}

/** Frame, ticks, tick labels and titles. */
export function axesNodes(f: AxesFrame, t: AxisTicks, layout: Layout, yTitleRuns: TextRun[]): SceneNode[] {
  const { plot, fonts } = f;
  const nodes: SceneNode[] = tickNodes(f, t, layout);
  nodes.push({
    kind: "rect",
    id: "frame",
    x: r2(plot.x),
    y: r2(plot.y),
    w: r2(plot.w),
    h: r2(plot.h),
    fill: "none",
    stroke: "#1a1a1a",
    strokeWidth: r2(fonts.axisLinePx),
  });
  nodes.push(...labelNodes(f, t, layout));
  const midX = plot.x + plot.w / 2;
  nodes.push(text("xtitle", midX, layout.xTitleBaseline, t.xTitle, fonts.titlePx, "middle"));
  nodes.push(text("ytitle", layout.yTitleX, plot.y + plot.h / 2, yTitleRuns, fonts.titlePx, "middle", { rotate: -90 }));
  if (t.top && t.topTitle)
    nodes.push(text("toptitle", midX, layout.topTitleBaseline, t.topTitle, fonts.titlePx, "middle"));
  return nodes;
}

/** Light grid lines at every decade of both axes. */
export function gridNodes(f: AxesFrame, t: AxisTicks): PathNode[] {
  const { plot } = f;
  let d = "";
  for (const tk of t.x)
    if (tk.major && tk.px > plot.x + 0.5 && tk.px < plot.x + plot.w - 0.5)
      d += `M${r2(tk.px)} ${r2(plot.y)}V${r2(plot.y + plot.h)}`;
  for (const tk of t.y)
    if (tk.major && tk.px > plot.y + 0.5 && tk.px < plot.y + plot.h - 0.5)
      d += `M${r2(plot.x)} ${r2(tk.px)}H${r2(plot.x + plot.w)}`;
  return d
    ? [
        {
          kind: "path",
          id: "grid-decades",
          d,
          stroke: "#000000",
          strokeOpacity: 0.1,
          strokeWidth: r2(Math.max(0.5, f.fonts.axisLinePx * 0.8)),
          fill: "none",
        },
      ]
    : [];
}
