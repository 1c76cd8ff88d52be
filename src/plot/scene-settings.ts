// The figure settings a scene reads, each with its fallback (size, fonts, view, ranges, top axis), and the
// physical size it writes for export.
import { DEFAULT_MASS_RANGE_EV, defaultYRange } from "../project/defaults";
import type { Project, TopAxis, YView } from "../project/types";
import { fontsFor, presetOf, PX_PER_IN, type Preset } from "./layout";
import { sanitizeDomain } from "./scales";

/** The size a caller asks for (BuildSceneOpts), in CSS px; absent or not positive means the preset's. */
interface SizeOpts {
  widthPx?: number;
  heightPx?: number;
}

/**
 * The y view, the size (the preset's unless the caller gives one), the fonts, the ranges (an unusable range
 * falls back to the default figure's) and the top axis of a project's figure.
 */
export function figureSettings(project: Project, opts: SizeOpts) {
  const fig = project.figure;
  const view: YView = fig.yView === "normalized" || fig.yView === "g-gamma" ? fig.yView : "coupling";
  const preset = presetOf(fig);
  const widthPx = opts.widthPx && opts.widthPx > 0 ? opts.widthPx : preset.widthPx;
  const heightPx = opts.heightPx && opts.heightPx > 0 ? opts.heightPx : preset.heightPx;
  const fonts = fontsFor(fig.fontPt, preset.fontScale, fig.legendScale);
  const massDomainEv = sanitizeDomain(fig.massRangeEv, DEFAULT_MASS_RANGE_EV);
  const yDomain = sanitizeDomain(fig.yRange, defaultYRange(view));
  const topAxis: TopAxis = fig.topAxis === "fa" || fig.topAxis === "frequency" ? fig.topAxis : "none";
  return { view, preset, widthPx, heightPx, fonts, massDomainEv, yDomain, topAxis };
}

function physicalOf(px: number): string {
  return `${Math.round((px / PX_PER_IN) * 254) / 100}cm`;
}

/** The physical size written into an exported scene: the preset's own, or a custom size in cm. */
export function physicalSize(opts: SizeOpts, widthPx: number, heightPx: number, preset: Preset) {
  const custom = opts.widthPx !== undefined || opts.heightPx !== undefined;
  return {
    widthPhysical: custom ? physicalOf(widthPx) : preset.widthPhysical,
    heightPhysical: custom ? physicalOf(heightPx) : preset.heightPhysical,
  };
}
