// Figure sizes and layout: the size presets with their physical sizes, font sizes per preset, and the
// margins around the plot area computed from font sizes and estimated label widths (no DOM needed).
import type { Figure, LegendPlace, SizePreset, TickSides } from "../project/types";
import { CAP_HEIGHT, MIN_TEXT_PX, SUP_RAISE, SHIFT_SCALE } from "./text";
import { CUSTOM_MM_LIMITS } from "../project/limits";
import { TITLE_LINE_SPACING } from "./title";

/** CSS pixels per inch: scene coordinates are CSS px at 96 per inch. */
export const PX_PER_IN = 96;
/** Pixels per millimetre at 96 px/in. */
export const PX_PER_MM = PX_PER_IN / 25.4;

/** A size preset: physical size (for the SVG width/height), pixel size and font scale. */
export interface Preset {
  id: SizePreset;
  label: string;
  widthMm: number;
  heightMm: number;
  /** Physical width/height as written into the SVG, e.g. "8.6cm". */
  widthPhysical: string;
  heightPhysical: string;
  /** Scene size in CSS px at 96 px/in. */
  widthPx: number;
  heightPx: number;
  /**
   * Factor on Figure.fontPt. Figure.fontPt is the base size on a slide; printed column figures want
   * ~8–9 pt at their physical size (common practice for journal figures), hence 2/3 and 3/4.
   */
  fontScale: number;
}

function cm(mm: number): string {
  return `${Math.round(mm * 10) / 100}cm`;
}

function preset(id: SizePreset, label: string, widthMm: number, heightMm: number, fontScale: number): Preset {
  return {
    id,
    label,
    widthMm,
    heightMm,
    widthPhysical: cm(widthMm),
    heightPhysical: cm(heightMm),
    widthPx: Math.round(widthMm * PX_PER_MM * 100) / 100,
    heightPx: Math.round(heightMm * PX_PER_MM * 100) / 100,
    fontScale,
  };
}

/**
 * The fixed presets. Slide: 16:9 at 10 in × 5.625 in (960 × 540 px). Single column: 8.6 cm wide, aspect
 * 0.75 (the column width of the APS journals, common practice). Double column: 17.8 cm wide, aspect 0.6.
 */
export const PRESETS: Readonly<Record<Exclude<SizePreset, "custom">, Preset>> = {
  slide: preset("slide", "Slide 16:9", 254, 142.875, 1),
  "single-column": preset("single-column", "Single column (8.6 cm)", 86, 64.5, 2 / 3),
  "double-column": preset("double-column", "Double column (17.8 cm)", 178, 106.8, 0.75),
};

/**
 * The preset a figure stands for; "custom" is built from Figure.customWidthMm × customHeightMm (clamped to
 * {@link CUSTOM_MM_LIMITS}) with font scale 1.
 */
export function presetOf(figure: Pick<Figure, "preset" | "customWidthMm" | "customHeightMm">): Preset {
  if (figure.preset !== "custom") return PRESETS[figure.preset] ?? PRESETS.slide;
  const clamp = (v: number, d: number) =>
    Number.isFinite(v) ? Math.min(CUSTOM_MM_LIMITS[1], Math.max(CUSTOM_MM_LIMITS[0], v)) : d;
  return preset("custom", "Custom", clamp(figure.customWidthMm, 160), clamp(figure.customHeightMm, 90), 1);
}

/** Font sizes (px) and line widths (px) of one figure. */
export interface Fonts {
  /** Tick labels. */
  tickPx: number;
  /** Axis titles. */
  titlePx: number;
  /** Legend entries. */
  legendPx: number;
  /** Figure title. */
  headingPx: number;
  /** Axis frame and tick stroke width. */
  axisLinePx: number;
  /** Stroke width of curves and model lines. */
  dataLinePx: number;
}

/**
 * Font sizes from the base size in pt (pt → px × 96/72) and the preset's font scale. The legend text is 0.88
 * of the tick labels times `legendScale` (0.7–1.5), never scaled below 6 pt (MIN_TEXT_PX) unless its
 * default size already is.
 * @param fontPt Figure.fontPt. @default 12
 * @param legendScale Figure.legendScale. @default 1
 */
export function fontsFor(fontPt: number, fontScale: number, legendScale = 1): Fonts {
  const pt = Number.isFinite(fontPt) && fontPt > 0 ? Math.min(72, Math.max(4, fontPt)) : 12;
  const base = (pt * fontScale * PX_PER_IN) / 72;
  const scale = Number.isFinite(legendScale) ? Math.min(1.5, Math.max(0.7, legendScale)) : 1;
  const legendDefault = base * 0.88;
  return {
    tickPx: base,
    titlePx: base * 1.08,
    legendPx: Math.max(legendDefault * scale, Math.min(legendDefault, MIN_TEXT_PX)),
    headingPx: base * 1.2,
    axisLinePx: Math.max(0.6, base / 16),
    dataLinePx: Math.max(0.9, base / 9),
  };
}

export interface PlotRect {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** What the margins depend on. */
export interface LayoutInput {
  widthPx: number;
  heightPx: number;
  fonts: Fonts;
  hasTopAxis: boolean;
  hasTitle: boolean;
  /** Outward ticks on the left and bottom (and a top axis), or on all four sides. @default "out" */
  ticks?: TickSides;
  /** A title fitted by title.ts: its lines (default 1) and size (default the heading size). */
  titleLines?: number;
  titleSizePx?: number;
  /** Widest y tick label (px) for a given plot height (labels thin out on short axes). */
  yLabelWidthPx: (plotHeightPx: number) => number;
  /** Half the width of the widest x tick label (it may stick out right of the plot area). */
  xLabelHalfWidthPx: number;
  legend: { place: LegendPlace; widthPx: number; heightPx: number };
}

/** Positions of everything around the plot area, in scene px. */
export interface Layout {
  plot: PlotRect;
  /** Width of the whole figure (labels must stay inside it). */
  figureWidthPx: number;
  /** Outward tick lengths, major and minor. */
  tickMajorPx: number;
  tickMinorPx: number;
  /** Gap between the frame and tick labels. */
  labelGapPx: number;
  /** Baseline of the bottom tick labels, of the x title, of the top tick labels, of the top title. */
  xLabelBaseline: number;
  xTitleBaseline: number;
  topLabelBaseline: number;
  topTitleBaseline: number;
  /** x of the right edge of the y tick labels and of the (rotated) y title baseline. */
  yLabelRight: number;
  yTitleX: number;
  /** Baseline of the figure title's first line. */
  headingBaseline: number;
  /** Top-left corner of the legend box. */
  legendX: number;
  legendY: number;
}

/** An inner corner of the plot area where the legend box can sit. */
export type LegendCorner = "top-left" | "top-right" | "bottom-left" | "bottom-right";

/**
 * Top-left corner (scene px) of a legend box of the given size in an inner corner of the plot area, inset
 * by 0.6 tick-label sizes from the frame.
 */
export function cornerLegendOrigin(
  plot: PlotRect,
  corner: LegendCorner,
  widthPx: number,
  heightPx: number,
  fonts: Pick<Fonts, "tickPx">,
): { x: number; y: number } {
  const inset = fonts.tickPx * 0.6;
  const left = corner === "top-left" || corner === "bottom-left";
  const top = corner === "top-left" || corner === "top-right";
  return {
    x: left ? plot.x + inset : plot.x + plot.w - inset - widthPx,
    y: top ? plot.y + inset : plot.y + plot.h - inset - heightPx,
  };
}

/** Space between the figure's edge and anything drawn, px. */
export function figurePadPx(fonts: Pick<Fonts, "tickPx">): number {
  return Math.max(2, fonts.tickPx * 0.5);
}

/** Gap between the plot's labels and a legend beside, below or above it, px. */
export function legendGapPx(fonts: Pick<Fonts, "tickPx">): number {
  return fonts.tickPx * 0.6;
}

/** Gap between the plot's frame and a legend outside right: clear of the x label sticking out right of the frame. */
function outsideLegendGapPx(fonts: Pick<Fonts, "tickPx">, xLabelHalfWidthPx: number): number {
  return Math.max(figurePadPx(fonts), xLabelHalfWidthPx) + fonts.tickPx * 0.4;
}

/** Horizontal room a legend outside right needs besides its own width, px (gap to the plot, pad to the edge). */
export function outsideLegendExtraPx(fonts: Pick<Fonts, "tickPx">, xLabelHalfWidthPx: number): number {
  return outsideLegendGapPx(fonts, xLabelHalfWidthPx) + figurePadPx(fonts);
}

/** Height above the baseline of a label with a superscript ("10⁻⁶"), as a fraction of its size. */
const SUP_TOP = SUP_RAISE + SHIFT_SCALE * CAP_HEIGHT + 0.04;
/** Depth below the baseline of brackets and subscripts. */
const DESCENT = 0.24;

/** Top-left corner of the legend box for a fixed place; (0, 0) for "auto", which the scene builder resolves. */
function legendOrigin(input: LayoutInput, plot: PlotRect, belowY: number, aboveY: number): { x: number; y: number } {
  const { legend: lg, fonts: f, widthPx: W } = input;
  const pad = figurePadPx(f);
  switch (lg.place) {
    case "top-left":
    case "top-right":
    case "bottom-left":
    case "bottom-right":
      return cornerLegendOrigin(plot, lg.place, lg.widthPx, lg.heightPx, f);
    case "outside-right":
      return { x: plot.x + plot.w + outsideLegendGapPx(f, input.xLabelHalfWidthPx), y: plot.y };
    case "below":
    case "above":
      // Centred under (over) the plot area, moved in where it would cross the figure's edge.
      return {
        x: Math.max(pad, Math.min(W - pad - lg.widthPx, plot.x + (plot.w - lg.widthPx) / 2)),
        y: lg.place === "below" ? belowY : aboveY,
      };
    default:
      return { x: 0, y: 0 };
  }
}

/**
 * Margins and positions for a figure. Vertical margins first (they need no label widths; a legend below or
 * above takes its height from the plot), then the y label width for that plot height, then the horizontal
 * margins (legend outside right shrinks the plot area). An "auto" legend is laid out like an inner corner (no
 * margin) and left at (0, 0): the scene builder picks its place.
 */
export function computeLayout(input: LayoutInput): Layout {
  const { widthPx: W, heightPx: H, fonts: f } = input;
  const pad = figurePadPx(f);
  const gap = f.tickPx * 0.4;
  const tickMajorPx = f.tickPx * 0.45;
  const tickMinorPx = f.tickPx * 0.25;
  // Outward ticks take room between the frame and the labels: bottom, left and any top axis always, the
  // mirrored top and right ticks with "all".
  const all = input.ticks === "all";
  const tickOut = tickMajorPx;
  const lg = input.legend;
  const band = lg.widthPx > 0 && (lg.place === "below" || lg.place === "above");

  let top = pad;
  let headingBaseline = 0;
  if (input.hasTitle) {
    const hs = input.titleSizePx ?? f.headingPx;
    headingBaseline = top + hs * CAP_HEIGHT;
    const below = ((input.titleLines ?? 1) - 1) * hs * TITLE_LINE_SPACING;
    top = headingBaseline + below + hs * DESCENT + f.tickPx * 0.4;
  }
  // A legend above sits between the title and the plot (its top axis included).
  const aboveY = top;
  if (band && lg.place === "above") top += lg.heightPx + legendGapPx(f);
  const minTop = band && lg.place === "above" ? top : pad;
  let topTitleBaseline = 0;
  let topLabelBaseline = 0;
  if (input.hasTopAxis) {
    topTitleBaseline = top + f.titlePx * SUP_TOP;
    topLabelBaseline = topTitleBaseline + f.titlePx * DESCENT + gap + f.tickPx * SUP_TOP;
    top = topLabelBaseline + gap + tickOut;
  } else {
    // Room for the top of the highest y label, which is centred on the frame's top edge.
    top = Math.max(top + (all ? tickOut : 0), minTop + f.tickPx * 0.6);
  }
  const xLabelOffset = gap + tickOut + f.tickPx * SUP_TOP;
  const xTitleOffset = xLabelOffset + f.tickPx * 0.25 + gap + f.titlePx * CAP_HEIGHT;
  const belowOffset = xTitleOffset + f.titlePx * DESCENT + legendGapPx(f);
  const bottom =
    band && lg.place === "below" ? belowOffset + lg.heightPx + pad : xTitleOffset + f.titlePx * DESCENT + pad;
  const plotH = Math.max(20, H - top - bottom);

  const yLabelW = input.yLabelWidthPx(plotH);
  const yTitleDepth = f.titlePx * DESCENT;
  const left = pad + f.titlePx * SUP_TOP + yTitleDepth + gap * 1.6 + yLabelW + gap + tickOut;
  let right = Math.max(pad + (all ? tickOut : 0), input.xLabelHalfWidthPx + 2);
  const outside = lg.place === "outside-right" && lg.widthPx > 0;
  if (outside) right = Math.max(right, lg.widthPx + outsideLegendExtraPx(f, input.xLabelHalfWidthPx));
  const plotW = Math.max(20, W - left - right);
  const plot: PlotRect = { x: left, y: top, w: plotW, h: plotH };

  const { x: legendX, y: legendY } = legendOrigin(input, plot, plot.y + plot.h + belowOffset, aboveY);
  return {
    plot,
    figureWidthPx: W,
    tickMajorPx,
    tickMinorPx,
    labelGapPx: gap,
    xLabelBaseline: plot.y + plot.h + xLabelOffset,
    xTitleBaseline: plot.y + plot.h + xTitleOffset,
    topLabelBaseline,
    topTitleBaseline,
    yLabelRight: plot.x - gap - tickOut,
    yTitleX: plot.x - gap - tickOut - yLabelW - gap * 1.6 - yTitleDepth,
    headingBaseline,
    legendX,
    legendY,
  };
}
