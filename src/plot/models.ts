// Model lines and bands as scene nodes: a line g(m) ∝ m is straight in log-log (two points across the
// visible range), a band is the polygon between its edges, reaching below the plot when it cancels, with the
// theory spread as a lighter band around it.
import { bandCancels, bandEdges, gAgg, type AxionConstants } from "../physics/index";
import type { Model, YView } from "../project/types";
import type { PathNode } from "./scene-types";
import { clipToRect, pathData, type Polyline, type Rect } from "./thinning/index";
import { dashFor, safeColour, unitInterval } from "./format";
import { gToView, type LogAffine } from "./scales";
import { eOverNValue } from "./physics-settings";

/** What a model needs from the figure to be drawn. */
export interface ModelFrame {
  constants: AxionConstants;
  view: YView;
  map: LogAffine;
  massDomainEv: [number, number];
  plot: { x: number; y: number; w: number; h: number };
  lineWidthPx: number;
}

/** How a model is drawn, for its legend swatch. */
export interface ModelGeometry {
  kind: "line" | "band";
  /** The band (or, with a spread, the central band) reaches g = 0: its lower edge is off the plot bottom. */
  cancels: boolean;
  /** The line has g = 0 everywhere (E/N = c_γ exactly) and cannot be drawn on a log axis. */
  vanishes: boolean;
  spread: boolean;
  /** The theory spread (but not the central band) reaches g = 0. */
  spreadCancels: boolean;
  fills: PathNode[];
  lines: PathNode[];
}

function pxOf(f: ModelFrame, massEv: number, gInvGeV: number): number {
  return f.map.ay + f.map.by * Math.log10(gToView(f.view, massEv, gInvGeV, f.constants));
}

function farRect(f: ModelFrame): Rect {
  const m = 2 * Math.max(f.plot.w, f.plot.h);
  return { x0: f.plot.x - m, y0: f.plot.y - m, x1: f.plot.x + f.plot.w + m, y1: f.plot.y + f.plot.h + m };
}

function poly(xs: number[], ys: number[], closed: boolean, f: ModelFrame): Polyline {
  return clipToRect({ xs: Float64Array.from(xs), ys: Float64Array.from(ys), n: xs.length, closed }, farRect(f));
}

/** y (px) a little below the plot bottom: where a cancelling band's lower edge goes. */
function belowPlot(f: ModelFrame): number {
  return f.plot.y + f.plot.h + 4 * f.lineWidthPx + 2;
}

/** Edges (px) of the band for E/N ∈ [a, b] with k σ spread at both ends of the mass range. */
function bandPx(f: ModelFrame, a: number, b: number, sigmas: number) {
  const [m0, m1] = f.massDomainEv;
  const opts = { constants: f.constants, sigmas };
  const e0 = bandEdges(m0, a, b, opts);
  const e1 = bandEdges(m1, a, b, opts);
  const cancels = bandCancels(a, b, opts);
  const x0 = f.plot.x;
  const x1 = f.plot.x + f.plot.w;
  const hi = [pxOf(f, m0, e0.highInvGeV), pxOf(f, m1, e1.highInvGeV)];
  const lo = cancels ? [belowPlot(f), belowPlot(f)] : [pxOf(f, m0, e0.lowInvGeV), pxOf(f, m1, e1.lowInvGeV)];
  return { x0, x1, hi, lo, cancels };
}

/**
 * Scene nodes of one model (fills and lines separately, so fills can go under every line). Returns null
 * when its E/N does not read as a number.
 */
export function modelGeometry(model: Model, f: ModelFrame, nodeId: string): ModelGeometry | null {
  const a0 = eOverNValue(model.eOverNMin);
  const b0 = eOverNValue(model.eOverNMax ?? model.eOverNMin);
  if (!Number.isFinite(a0) || !Number.isFinite(b0)) return null;
  const [a, b] = a0 <= b0 ? [a0, b0] : [b0, a0];
  const colour = safeColour(model.colour, "#117A8B");
  const opacity = unitInterval(model.fillOpacity, 0.25);
  const sigmas = Number.isFinite(model.sigmas) && model.sigmas > 0 ? model.sigmas : 0;
  const isLine = a === b;
  const lw = isLine ? f.lineWidthPx * 1.15 : f.lineWidthPx;
  const dash = dashFor(model.lineStyle, lw);
  const base = { "model-id": model.id };
  const fills: PathNode[] = [];
  const lines: PathNode[] = [];

  let spreadCancels = false;
  if (sigmas > 0) {
    const s = bandPx(f, a, b, sigmas);
    spreadCancels = s.cancels && !bandCancels(a, b, { constants: f.constants });
    const d = pathData(poly([s.x0, s.x1, s.x1, s.x0], [s.hi[0], s.hi[1], s.lo[1], s.lo[0]], true, f));
    fills.push({
      kind: "path",
      id: `${nodeId}-spread`,
      d,
      fill: colour,
      fillOpacity: Math.max(0.06, opacity * 0.45),
      data: { ...base, spread: String(sigmas) },
    });
  }

  if (isLine) {
    const [m0, m1] = f.massDomainEv;
    const g0 = gAgg(m0, a, { constants: f.constants });
    const g1 = gAgg(m1, a, { constants: f.constants });
    const vanishes = !(g0 > 0 && g1 > 0);
    if (!vanishes) {
      const pl = poly([f.plot.x, f.plot.x + f.plot.w], [pxOf(f, m0, g0), pxOf(f, m1, g1)], false, f);
      lines.push({
        kind: "path",
        id: `${nodeId}-line`,
        d: pathData(pl),
        stroke: colour,
        strokeWidth: lw,
        dash,
        fill: "none",
        data: { ...base, eovern: model.eOverNMin },
      });
    }
    return { kind: "line", cancels: vanishes, vanishes, spread: sigmas > 0, spreadCancels, fills, lines };
  }

  const c = bandPx(f, a, b, 0);
  fills.push({
    kind: "path",
    id: `${nodeId}-band`,
    d: pathData(poly([c.x0, c.x1, c.x1, c.x0], [c.hi[0], c.hi[1], c.lo[1], c.lo[0]], true, f)),
    fill: colour,
    fillOpacity: opacity,
    data: { ...base, "eovern-min": model.eOverNMin, "eovern-max": model.eOverNMax, cancels: String(c.cancels) },
  });
  let d = pathData(poly([c.x0, c.x1], c.hi, false, f));
  if (!c.cancels) d += pathData(poly([c.x0, c.x1], c.lo, false, f));
  lines.push({
    kind: "path",
    id: `${nodeId}-edges`,
    d,
    stroke: colour,
    strokeWidth: lw,
    dash,
    fill: "none",
    data: { ...base },
  });
  return { kind: "band", cancels: c.cancels, vanishes: false, spread: sigmas > 0, spreadCancels, fills, lines };
}
