// Axes of the figure: frame, inward ticks on all four sides, tick labels, axis titles with real
// sub/superscripts, the optional top axis (f_a or frequency, in step with the mass axis) and the decade grid.
import { PLANCK_EV_S, type AxionConstants } from "../physics/constants";
import type { TopAxis, YView } from "../project/types";
import type { PathNode, SceneNode, TextNode, TextRun } from "./scene-types";
import { plainOrScientificRuns, r2 } from "./format";
import type { Fonts, Layout } from "./layout";
import type { LogAffine } from "./scales";
import { runsWidthPx } from "./text";
import { faTicks, frequencyTicks, logTicks, type FrequencyUnit, type LogTick, type LogTickOpts } from "./ticks";

/** Title of the mass axis: m_a [eV]. */
export const MASS_TITLE: TextRun[] = [{ text: "m", italic: true }, { text: "a", shift: "sub" }, { text: " [eV]" }];
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
}

export interface AxesFrame {
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

/** Positioned ticks of all axes (values in eV, y-view units, GeV or Hz). */
export function axisTicks(f: AxesFrame): AxisTicks {
  const { map, massDomainEv, yDomain, fonts } = f;
  const ppdX = map.bx;
  const ppdY = -map.by;
  const xPx = (m: number) => map.ax + map.bx * Math.log10(m);
  const x = logTicks(massDomainEv[0], massDomainEv[1], horizontalTickOpts(ppdX, fonts)).map((t) => ({
    ...t,
    px: xPx(t.value),
  }));
  const yFormat = f.yView && f.yView !== "coupling" ? plainOrScientificRuns : undefined;
  const y = logTicks(yDomain[0], yDomain[1], { ...verticalTickOpts(ppdY, fonts), format: yFormat }).map((t) => ({
    ...t,
    px: map.ay + map.by * Math.log10(t.value),
  }));
  let top: AxisTicks["top"] = null;
  let topTitle: TextRun[] | null = null;
  let frequencyUnit: FrequencyUnit | null = null;
  if (f.topAxis === "fa") {
    const k = f.constants.kMuEv * 1e6;
    top = faTicks(massDomainEv, f.constants, horizontalTickOpts(ppdX, fonts)).map((t) => ({
      ...t,
      px: xPx(k / t.value),
    }));
    topTitle = FA_TITLE;
  } else if (f.topAxis === "frequency") {
    const ft = frequencyTicks(massDomainEv, horizontalTickOpts(ppdX, fonts));
    top = ft.ticks.map((t) => ({ ...t, px: xPx(t.value * PLANCK_EV_S) }));
    topTitle = frequencyTitle(ft.unit);
    frequencyUnit = ft.unit;
  }
  return { x, y, top, topTitle, frequencyUnit };
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

/** Frame, ticks, tick labels and titles. */
export function axesNodes(f: AxesFrame, t: AxisTicks, layout: Layout, yTitleRuns: TextRun[]): SceneNode[] {
  const { plot, fonts } = f;
  const x0 = plot.x;
  const x1 = plot.x + plot.w;
  const y0 = plot.y;
  const y1 = plot.y + plot.h;
  const inX = (px: number) => px >= x0 - 0.01 && px <= x1 + 0.01;
  const inY = (py: number) => py >= y0 - 0.01 && py <= y1 + 0.01;
  let major = "";
  let minor = "";
  const seg = (ax: number, ay: number, bx: number, by: number) => `M${r2(ax)} ${r2(ay)}L${r2(bx)} ${r2(by)}`;
  for (const tk of t.x) {
    if (!inX(tk.px)) continue;
    const len = tk.major ? layout.tickMajorPx : layout.tickMinorPx;
    const s = seg(tk.px, y1, tk.px, y1 - len) + (t.top ? "" : seg(tk.px, y0, tk.px, y0 + len));
    if (tk.major) major += s;
    else minor += s;
  }
  for (const tk of t.top ?? []) {
    if (!inX(tk.px)) continue;
    const s = seg(tk.px, y0, tk.px, y0 + (tk.major ? layout.tickMajorPx : layout.tickMinorPx));
    if (tk.major) major += s;
    else minor += s;
  }
  for (const tk of t.y) {
    if (!inY(tk.px)) continue;
    const len = tk.major ? layout.tickMajorPx : layout.tickMinorPx;
    const s = seg(x0, tk.px, x0 + len, tk.px) + seg(x1, tk.px, x1 - len, tk.px);
    if (tk.major) major += s;
    else minor += s;
  }
  const lw = r2(fonts.axisLinePx);
  const nodes: SceneNode[] = [];
  if (minor)
    nodes.push({
      kind: "path",
      id: "ticks-minor",
      d: minor,
      stroke: "#1a1a1a",
      strokeWidth: r2(lw * 0.8),
      fill: "none",
    });
  if (major)
    nodes.push({ kind: "path", id: "ticks-major", d: major, stroke: "#1a1a1a", strokeWidth: lw, fill: "none" });
  nodes.push({
    kind: "rect",
    id: "frame",
    x: r2(x0),
    y: r2(y0),
    w: r2(plot.w),
    h: r2(plot.h),
    fill: "none",
    stroke: "#1a1a1a",
    strokeWidth: lw,
  });

  // Label ids follow the tick value, so a label keeps its id (and its element on screen) while zooming.
  // Labels of the horizontal axes that would cross the figure edge are left out.
  const fitsX = (tk: { px: number; label: TextRun[] | null }) => {
    const half = runsWidthPx(tk.label ?? [], fonts.tickPx) / 2;
    return tk.px - half >= 0 && tk.px + half <= layout.figureWidthPx;
  };
  for (const tk of t.x)
    if (tk.label && inX(tk.px) && fitsX(tk))
      nodes.push(text(`xlabel-${valueKey(tk.value)}`, tk.px, layout.xLabelBaseline, tk.label, fonts.tickPx, "middle"));
  for (const tk of t.y)
    if (tk.label && inY(tk.px))
      nodes.push(
        text(
          `ylabel-${valueKey(tk.value)}`,
          layout.yLabelRight,
          tk.px + 0.36 * fonts.tickPx,
          tk.label,
          fonts.tickPx,
          "end",
        ),
      );
  for (const tk of t.top ?? [])
    if (tk.label && inX(tk.px) && fitsX(tk))
      nodes.push(
        text(`toplabel-${valueKey(tk.value)}`, tk.px, layout.topLabelBaseline, tk.label, fonts.tickPx, "middle"),
      );

  nodes.push(text("xtitle", x0 + plot.w / 2, layout.xTitleBaseline, MASS_TITLE, fonts.titlePx, "middle"));
  nodes.push(text("ytitle", layout.yTitleX, y0 + plot.h / 2, yTitleRuns, fonts.titlePx, "middle", { rotate: -90 }));
  if (t.top && t.topTitle)
    nodes.push(text("toptitle", x0 + plot.w / 2, layout.topTitleBaseline, t.topTitle, fonts.titlePx, "middle"));
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
