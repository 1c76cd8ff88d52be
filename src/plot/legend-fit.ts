// Fitting the legend into the figure: the room it has in each place (inner corner, outside right, below, above),
// the box measured for that room, the layout around it, and the automatic choice among the places.
import type { LegendPlace } from "../project/types";
import {
  cornerLegendOrigin,
  figurePadPx,
  legendGapPx,
  outsideLegendExtraPx,
  type Fonts,
  type Layout,
  type LegendCorner,
} from "./layout";
import { measureLegend, type LegendBox, type LegendEntry, type LegendLimits } from "./legend";
import { OUTSIDE_MIN_PLOT_FRACTION, type AutoLegendPlace } from "./legend-place";
import { MIN_TEXT_PX } from "./text";

/**
 * A legend outside right never squeezes the plot area under this fraction of the figure width: its entries
 * wrap into the room left (our own rule; a plot narrower than its legend reads badly in print).
 */
export const OUTSIDE_PLOT_SHARE = 0.5;

/**
 * A legend below or above the plot leaves the plot area (inside the axes) at least this share of the figure's
 * area: a little over the one third the preset checks ask for (our own rule), so rounding never breaks them.
 */
export const BAND_MIN_PLOT_AREA = 0.34;

/** Widest legend box in an inner corner, as a fraction of the plot width (wider entries wrap). */
const CORNER_MAX_WIDTH = 0.55;

/** What fitting the legend needs from the figure being built. */
export interface LegendFitInput {
  entries: LegendEntry[];
  widthPx: number;
  heightPx: number;
  fonts: Fonts;
  /** Half the width of the widest x tick label (as the layout has it). */
  xLabelHalfWidthPx: number;
  /** The figure's layout with a legend box of this size at this place. */
  layoutFor: (place: LegendPlace, size: { widthPx: number; heightPx: number }) => Layout;
}

/** A legend fitted to a place: its box and the figure's layout with it. */
export interface LegendFit {
  box: LegendBox;
  layout: Layout;
}

const NONE = { widthPx: 0, heightPx: 0 };

function measure(input: LegendFitInput, limits: LegendLimits, sizePx = input.fonts.legendPx): LegendBox {
  return measureLegend(input.entries, sizePx, limits);
}

/** The layout with the legend inside the plot area (no margin for it); every inner corner gives the same. */
export function insideLayout(input: LegendFitInput): Layout {
  return input.layoutFor("auto", NONE);
}

/** The legend box for an inner corner of `inside`'s plot area: at most 55 % of its width and its height. */
export function cornerBox(input: LegendFitInput, inside: Layout): LegendBox {
  const { plot } = inside;
  const inset = input.fonts.tickPx * 0.6;
  return measure(input, { widthPx: plot.w * CORNER_MAX_WIDTH, heightPx: plot.h - 2 * inset, columns: false });
}

function cornerFit(input: LegendFitInput, corner: LegendCorner): LegendFit {
  const inside = insideLayout(input);
  const box = cornerBox(input, inside);
  const at = cornerLegendOrigin(inside.plot, corner, box.widthPx, box.heightPx, input.fonts);
  return { box, layout: { ...inside, legendX: at.x, legendY: at.y } };
}

/**
 * Outside right: the entries wrap into the width that leaves the plot {@link OUTSIDE_PLOT_SHARE} of the figure
 * (more where the plot is short), set smaller (to 6 pt at least) when they do not fit the height in full.
 */
function outsideFit(input: LegendFitInput): LegendFit {
  const { widthPx: W, heightPx: H, fonts } = input;
  const inside = insideLayout(input);
  // Half the width, or more where the plot is short (a title, a top axis) so its area stays a third and more.
  const plotW = Math.max(OUTSIDE_PLOT_SHARE * W, (BAND_MIN_PLOT_AREA * W * H) / inside.plot.h);
  const box = measureToFit(input, {
    widthPx: W - inside.plot.x - plotW - outsideLegendExtraPx(fonts, input.xLabelHalfWidthPx),
    heightPx: H - inside.plot.y - figurePadPx(fonts),
    columns: false,
  });
  return { box, layout: input.layoutFor("outside-right", box) };
}

/**
 * The box for `limits`; when the entries do not fit in full, the text is set smaller, in half-pt steps down to
 * 6 pt (MIN_TEXT_PX), before any entry is shortened: the first size that shows them in full is kept.
 */
function measureToFit(input: LegendFitInput, limits: LegendLimits): LegendBox {
  const fits = (b: LegendBox) => b.heightPx <= limits.heightPx && b.shortened.length === 0;
  let box = measure(input, limits);
  const halfPt = 96 / 72 / 2;
  for (let size = input.fonts.legendPx - halfPt; !fits(box) && size >= MIN_TEXT_PX - 1e-9; size -= halfPt) {
    const smaller = measure(input, limits, size);
    if (fits(smaller) || size - halfPt < MIN_TEXT_PX - 1e-9) box = smaller;
  }
  return box;
}

/** Below or above: as many columns as the figure's width allows, no taller than {@link BAND_MIN_PLOT_AREA} leaves. */
function bandFit(input: LegendFitInput, place: "below" | "above"): LegendFit {
  const { widthPx: W, heightPx: H, fonts } = input;
  const bare = input.layoutFor(place, NONE);
  const minPlotH = (BAND_MIN_PLOT_AREA * W * H) / bare.plot.w;
  const box = measureToFit(input, {
    widthPx: W - 2 * figurePadPx(fonts),
    heightPx: bare.plot.h - minPlotH - legendGapPx(fonts),
    columns: true,
  });
  return { box, layout: input.layoutFor(place, box) };
}

/** The legend at a fixed place (or none: hidden, labels on the plot, or no entries). */
export function fitLegendAt(place: Exclude<LegendPlace, "auto">, input: LegendFitInput): LegendFit {
  if (place === "hidden" || place === "on-plot" || input.entries.length === 0)
    return {
      box: measure({ ...input, entries: [] }, { ...NONE, columns: false }),
      layout: input.layoutFor("hidden", NONE),
    };
  switch (place) {
    case "outside-right":
      return outsideFit(input);
    case "below":
    case "above":
      return bandFit(input, place);
    default:
      return cornerFit(input, place);
  }
}

/**
 * Whether an automatic legend may go outside right: the plot keeps {@link OUTSIDE_MIN_PLOT_FRACTION} of the
 * width, every entry fits on one line, and the box is no taller than the plot.
 */
export function outsideSuitsAuto(input: LegendFitInput): boolean {
  const { box, layout } = outsideFit(input);
  return (
    layout.plot.w >= OUTSIDE_MIN_PLOT_FRACTION * input.widthPx &&
    box.items.every((it) => it.lines.length === 1) &&
    box.sizePx === input.fonts.legendPx &&
    box.shortened.length === 0 &&
    box.heightPx <= layout.plot.h
  );
}

/**
 * The legend for a place setting: a fixed place as it is; "auto" at the place `choose` returns (given the
 * inside layout and the corner box it judges coverage with), laid out exactly as that fixed place would be.
 */
export function fitLegend(
  setting: LegendPlace,
  input: LegendFitInput,
  choose: (inside: Layout, box: LegendBox) => AutoLegendPlace,
): LegendFit & { autoPlace?: AutoLegendPlace } {
  if (setting !== "auto" || input.entries.length === 0)
    return fitLegendAt(setting === "auto" ? "top-right" : setting, input);
  const inside = insideLayout(input);
  const place = choose(inside, cornerBox(input, inside));
  const fit = fitLegendAt(place, input);
  if (place === "below" && !keepsPlotArea(fit, input)) {
    // A figure too small for its legend below (a long title, a top axis, many entries): outside right, wrapped
    // and set smaller, keeps the plot its share where below cannot.
    const outside = fitLegendAt("outside-right", input);
    if (keepsPlotArea(outside, input)) return { ...outside, autoPlace: "outside-right" };
  }
  return { ...fit, autoPlace: place };
}

/** Whether the plot area keeps at least a third of the figure (the preset checks' floor) with this legend. */
function keepsPlotArea(fit: LegendFit, input: LegendFitInput): boolean {
  const { w, h } = fit.layout.plot;
  return w * h >= (input.widthPx * input.heightPx) / 3;
}
