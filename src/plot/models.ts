// Model lines and bands as scene nodes: a line is straight in log-log, a band the polygon between its edges (below
// the plot where it cancels) with its theory spread; a model set drawn as lines is one path.
import { gAgg, gFromNormalized, type AxionConstants } from "../physics/index";
import type { Model, YView } from "../project/types";
import type { PathNode } from "./scene-types";
import { clipToRect, pathData, type Polyline, type Rect } from "./thinning/index";
import { atHundredths, pathShape, type Shape } from "./occupancy";
import { dashFor, safeColour, unitInterval } from "./format";
import { gToView, type LogAffine } from "./scales";
import { modelShape, shapeCancels, shapeNormalizedRange, type ModelShape } from "./model-shape";

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
  /** The same fills and lines as vertices, for the automatic legend placement (no path data read back). */
  shapes: Shape[];
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

/** Normalized |E/N − c_γ| range → band edges (px) at both ends of the mass range, with K ± kσ as in bandEdges. */
function bandPx(f: ModelFrame, shape: ModelShape, sigmas: number) {
  const [m0, m1] = f.massDomainEv;
  const [nMin, nMax] = shapeNormalizedRange(shape, f.constants, sigmas);
  const c = f.constants;
  const kHigh = c.kMuEv + sigmas * c.kMuEvSigma;
  const kLow = c.kMuEv - sigmas * c.kMuEvSigma;
  const cancels = nMin === 0;
  const x0 = f.plot.x;
  const x1 = f.plot.x + f.plot.w;
  const hi = [pxOf(f, m0, gFromNormalized(m0, nMax, kLow)), pxOf(f, m1, gFromNormalized(m1, nMax, kLow))];
  const lo = cancels
    ? [belowPlot(f), belowPlot(f)]
    : [pxOf(f, m0, gFromNormalized(m0, nMin, kHigh)), pxOf(f, m1, gFromNormalized(m1, nMin, kHigh))];
  return { x0, x1, hi, lo, cancels };
}

function outlineOf(f: ModelFrame, b: ReturnType<typeof bandPx>): Polyline {
  return poly([b.x0, b.x1, b.x1, b.x0], [b.hi[0], b.hi[1], b.lo[1], b.lo[0]], true, f);
}

/** The lines of `values` as polylines (lines with g = 0 are skipped: they cannot be drawn on a log axis). */
function linePolys(f: ModelFrame, values: readonly number[]): Polyline[] {
  const [m0, m1] = f.massDomainEv;
  const out: Polyline[] = [];
  for (const v of values) {
    const g0 = gAgg(m0, v, { constants: f.constants });
    const g1 = gAgg(m1, v, { constants: f.constants });
    if (g0 > 0 && g1 > 0) out.push(poly([f.plot.x, f.plot.x + f.plot.w], [pxOf(f, m0, g0), pxOf(f, m1, g1)], false, f));
  }
  return out;
}

/** Data attributes of a model's band fill: its E/N range, kind and whether it reaches g = 0. */
function bandData(model: Model, shape: ModelShape, cancels: boolean): Record<string, string> {
  const data: Record<string, string> = {
    "model-id": model.id,
    "eovern-min": model.eOverNMin,
    "eovern-max": model.eOverNMax,
    cancels: String(cancels),
  };
  if (model.kind && model.kind !== "interval") data["model-kind"] = model.kind;
  if (shape.kind === "lines-band" && model.kind === "set") data["set-draw"] = model.setDraw;
  return data;
}

/**
 * Scene nodes of one model (fills and lines separately, so fills can go under every line). Returns null
 * when its E/N does not read as a number.
 */
export function modelGeometry(model: Model, f: ModelFrame, nodeId: string): ModelGeometry | null {
  const shape = modelShape(model, f.constants);
  if (!shape) return null;
  const colour = safeColour(model.colour, "#117A8B");
  const opacity = unitInterval(model.fillOpacity, 0.25);
  const sigmas = Number.isFinite(model.sigmas) && model.sigmas > 0 ? model.sigmas : 0;
  const isLine = shape.kind === "line";
  // Many lines of a set would merge into a dark block at full width.
  const lw = isLine ? f.lineWidthPx * 1.15 : shape.kind === "lines" ? f.lineWidthPx * 0.6 : f.lineWidthPx;
  const dash = dashFor(model.lineStyle, lw);
  const base = { "model-id": model.id };
  const fills: PathNode[] = [];
  const lines: PathNode[] = [];
  const shapes: Shape[] = [];
  // Each node with the polylines its path data is written from.
  const add = (to: PathNode[], node: Omit<PathNode, "d">, polys: Polyline[]) => {
    const d = polys.map((p) => pathData(p)).join("");
    const full: PathNode = { ...node, d, writtenD: d };
    to.push(full);
    shapes.push(pathShape(full, polys.map(atHundredths)));
  };

  let spreadCancels = false;
  if (sigmas > 0) {
    // A set drawn as lines gets one spread band per line; every other shape one band around the whole.
    const parts = shape.kind === "lines" ? shape.values.map((v): ModelShape => ({ kind: "line", value: v })) : [shape];
    const outlines: Polyline[] = [];
    for (const part of parts) {
      const s = bandPx(f, part, sigmas);
      spreadCancels ||= s.cancels;
      outlines.push(outlineOf(f, s));
    }
    spreadCancels &&= !shapeCancels(shape, f.constants);
    add(
      fills,
      {
        kind: "path",
        id: `${nodeId}-spread`,
        fill: colour,
        fillOpacity: Math.max(0.06, opacity * 0.45),
        data: { ...base, spread: String(sigmas) },
      },
      outlines,
    );
  }

  if (isLine || shape.kind === "lines") {
    const polys = linePolys(f, isLine ? [shape.value] : shape.values);
    const vanishes = polys.length === 0;
    if (!vanishes) {
      const data: Record<string, string> = isLine
        ? { ...base, eovern: model.eOverNMin }
        : { ...base, "model-kind": "set", "set-draw": "lines", lines: String(polys.length) };
      add(
        lines,
        { kind: "path", id: `${nodeId}-line`, stroke: colour, strokeWidth: lw, dash, fill: "none", data },
        polys,
      );
    }
    return { kind: "line", cancels: vanishes, vanishes, spread: sigmas > 0, spreadCancels, fills, lines, shapes };
  }

  const c = bandPx(f, shape, 0);
  add(
    fills,
    { kind: "path", id: `${nodeId}-band`, fill: colour, fillOpacity: opacity, data: bandData(model, shape, c.cancels) },
    [outlineOf(f, c)],
  );
  const edges = [poly([c.x0, c.x1], c.hi, false, f)];
  if (!c.cancels) edges.push(poly([c.x0, c.x1], c.lo, false, f));
  add(
    lines,
    { kind: "path", id: `${nodeId}-edges`, stroke: colour, strokeWidth: lw, dash, fill: "none", data: { ...base } },
    edges,
  );
  return { kind: "band", cancels: c.cancels, vanishes: false, spread: sigmas > 0, spreadCancels, fills, lines, shapes };
}
