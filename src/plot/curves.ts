// Curves as scene nodes by role: exclusion (edge hatched on the excluded side and/or filled up past the plot top),
// projection (a line), region (a closed, filled and outlined polygon), at pixel resolution via thinning/.
import type { Curve, YView } from "../project/types";
import type { AxionConstants } from "../physics/constants";
import type { PathNode } from "./scene-types";
import type { Shape } from "./occupancy";
import { curvePixels, pathDataCompact, prepareCurve, type PreparedCurve } from "./thinning/index";
import { envelopeSplit } from "./thinning/envelope";
import type { Polyline } from "./thinning/clip";
import type { RunDeferral } from "./thinning/deferred-runs";
import { compactPolygons } from "./path-writer";
import { dashFor, r2, safeColour, unitInterval } from "./format";
import { viewTransform, type LogAffine } from "./scales";
import { rescaleFactor } from "./physics-settings";
import { hatchEdge, hatchStyleFor, insideSide } from "./hatch";

export interface CurveFrame {
  constants: AxionConstants;
  view: YView;
  map: LogAffine;
  plot: { x: number; y: number; w: number; h: number };
  lineWidthPx: number;
  /** Device pixels per scene pixel. @default 1 */
  resolution: number;
  /** Draw every point (no thinning), for comparisons. @default true */
  thin?: boolean;
  /** Dense columns of solid sorted curves as a filled min–max envelope (see BuildSceneOpts). @default false */
  envelope?: boolean;
  /** On screen: big first run thinnings left to a worker, a stand-in drawn meanwhile (see BuildSceneOpts). */
  deferRuns?: RunDeferral;
}

export interface CurveGeometry {
  role: Curve["role"];
  /** Points that could not be drawn on log axes (≤ 0 or not finite). */
  skipped: number;
  /** Points drawn after thinning and clipping. */
  drawn: number;
  fills: PathNode[];
  /** Hatches on the excluded side (drawn over all fills, under all lines). */
  hatches: PathNode[];
  lines: PathNode[];
}

/** How an exclusion marks its excluded side (an unknown value reads as the house style's hatches). */
export function exclusionMarkOf(curve: Pick<Curve, "exclusionMark">): Curve["exclusionMark"] {
  const m = curve.exclusionMark;
  return m === "fill" || m === "hatch-fill" ? m : "hatch";
}

/** Whether a curve is drawn in mass order: exclusions and projections unless keepOrder; regions never. */
export function drawsSorted(curve: Pick<Curve, "role" | "keepOrder">): boolean {
  return curve.role !== "region" && !curve.keepOrder;
}

/** The cached log arrays a curve is drawn from. */
export function preparedOf(curve: Pick<Curve, "role" | "keepOrder" | "massEv" | "gInvGeV">): PreparedCurve {
  return prepareCurve(curve.massEv, curve.gInvGeV, drawsSorted(curve));
}

/**
 * A curve's pixels for this frame, in the thinning's scratch buffers: valid until the next curve is thinned,
 * so callers use them at once.
 */
function framePixels(curve: Curve, prep: PreparedCurve, f: CurveFrame) {
  const t = viewTransform(f.view, f.constants);
  return curvePixels(prep, curve.role === "region", {
    ...f.map,
    slope: t.slope,
    yOffset: t.log10Factor + Math.log10(rescaleFactor(curve.rescale)),
    plot: f.plot,
    resolution: f.resolution,
    thin: f.thin,
    reuse: true,
    deferRuns: f.deferRuns,
  });
}

/**
 * With `f.envelope`, a solid curve drawn in mass order keeps a thin line and, for its densely zig-zagging
 * columns, a filled envelope node of the line's colour (see thinning/envelope.ts); dashes would not survive
 * the change, so dashed curves keep their zig-zag.
 */
function withEnvelope(
  pl: Polyline,
  curve: Curve,
  f: CurveFrame,
  dash: string | undefined,
  node: Omit<PathNode, "d" | "kind">,
): { line: Polyline; band: PathNode | null } {
  if (!f.envelope || dash || !drawsSorted(curve) || f.lineWidthPx <= 0) return { line: pl, band: null };
  const split = envelopeSplit(pl, {
    originX: f.plot.x,
    resolution: f.resolution,
    halfWidthPx: f.lineWidthPx / 2,
    minSpanPx: f.lineWidthPx * ENVELOPE_MIN_SPAN,
  });
  const b = split.band;
  if (b.count === 0) return { line: pl, band: null };
  const d = compactPolygons(b.xs, b.ys, b.ends, b.count);
  return { line: split.line, band: { ...node, kind: "path", d, writtenD: d } };
}

/** A column is dense (envelope) when its points span more than this many line widths vertically. */
const ENVELOPE_MIN_SPAN = 1;

/** Scene nodes of one curve (fills and lines apart, so that every line can go over every fill). */
export function curveGeometry(curve: Curve, f: CurveFrame, nodeId: string): CurveGeometry {
  const prep = preparedOf(curve);
  const raw = framePixels(curve, prep, f);
  const colour = safeColour(curve.colour, "#D55E00");
  const opacity = unitInterval(curve.fillOpacity, 0.3);
  const lw = f.lineWidthPx;
  const dash = dashFor(curve.lineStyle, lw);
  const data = { "curve-id": curve.id, "curve-role": curve.role };
  const fills: PathNode[] = [];
  const lines: PathNode[] = [];
  const hatches: PathNode[] = [];
  const out: CurveGeometry = { role: curve.role, skipped: prep.skipped, drawn: raw.n, fills, hatches, lines };
  if (raw.n === 0) return out;
  const { line: pl, band } = withEnvelope(raw, curve, f, dash, {
    id: `${nodeId}-envelope`,
    fill: colour,
    data: { ...data },
  });
  /** A path of the curve in its colour, line width and dash; fills are stroked too (their edge is the curve). */
  const path = (suffix: string, d: string, fill: Pick<PathNode, "fill" | "fillOpacity">): PathNode => ({
    kind: "path",
    id: `${nodeId}-${suffix}`,
    d,
    writtenD: d,
    ...fill,
    stroke: colour,
    strokeWidth: lw,
    dash,
    data: { ...data },
  });
  if (curve.role === "exclusion") {
    // One path, stroked and (with a fill mark) filled: the curve, then up past the plot top (outside the clip)
    // and back. Its stroke also marks the vertical ends of the excluded region where they lie inside the plot.
    const topY = r2(f.plot.y - 4 * lw - 2);
    const closeUp = `L${r2(pl.xs[pl.n - 1])} ${topY}L${r2(pl.xs[0])} ${topY}Z`;
    const mark = exclusionMarkOf(curve);
    fills.push(
      path("exclusion", pathDataCompact(pl, closeUp), {
        fill: mark === "hatch" ? "none" : colour,
        fillOpacity: mark === "hatch" ? undefined : opacity,
      }),
    );
    if (band) fills.push(band);
    if (mark !== "fill") hatches.push(...hatchNodes(raw, topY, f, lw, colour, `${nodeId}-hatch`, data));
  } else if (curve.role === "projection") {
    lines.push(path("line", pathDataCompact(pl), { fill: "none" }));
    if (band) lines.push(band);
  } else fills.push(path("region", pathDataCompact(pl), { fill: colour, fillOpacity: opacity }));
  return out;
}

/**
 * What {@link curveGeometry} draws, as vertices (rounded to 0.01 px as the path data is) with its painted fill
 * and stroke, for the automatic legend placement: the same shape, without writing path data and reading it
 * back. Null when nothing is drawn.
 */
export function curveShape(curve: Curve, f: CurveFrame): Shape | null {
  const closed = curve.role === "region";
  const pl = framePixels(curve, preparedOf(curve), f);
  if (pl.n === 0) return null;
  const exclusion = curve.role === "exclusion";
  const m = pl.n + (exclusion ? 2 : 0);
  const xs = new Float64Array(m);
  const ys = new Float64Array(m);
  for (let k = 0; k < pl.n; k++) {
    xs[k] = Math.round(pl.xs[k] * 100) / 100;
    ys[k] = Math.round(pl.ys[k] * 100) / 100;
  }
  if (exclusion) {
    // Up past the plot top and back, as the drawn exclusion path closes.
    const topY = r2(f.plot.y - 4 * f.lineWidthPx - 2);
    xs[m - 2] = r2(pl.xs[pl.n - 1]);
    ys[m - 2] = topY;
    xs[m - 1] = r2(pl.xs[0]);
    ys[m - 1] = topY;
  }
  // A hatched exclusion's region counts as covered too: it is excluded even where only its edge is marked.
  const filled = curve.role !== "projection" && (unitInterval(curve.fillOpacity, 0.3) > 0 || exclusion);
  return { subpaths: [{ xs, ys, closed: closed || exclusion }], fill: filled, stroke: f.lineWidthPx > 0 };
}

/**
 * The hatches along an exclusion's edge (the full thinned edge, not the envelope's line): the vertical ends,
 * then the curve; the top is outside the clip.
 */
function hatchNodes(
  pl: Polyline,
  topY: number,
  f: CurveFrame,
  lw: number,
  colour: string,
  id: string,
  data: Record<string, string>,
): PathNode[] {
  const edge = {
    xs: pl.xs,
    ys: pl.ys,
    n: pl.n,
    from: [r2(pl.xs[0]), topY],
    to: [r2(pl.xs[pl.n - 1]), topY],
  } as const;
  const style = hatchStyleFor(lw);
  const h = hatchEdge({ ...edge, side: insideSide(edge) }, f.plot, style, lw);
  if (h.count === 0) return [];
  const node: PathNode = {
    kind: "path",
    id,
    d: h.d,
    writtenD: h.d,
    stroke: colour,
    strokeWidth: r2(style.widthPx),
    fill: "none",
    data: { ...data, "curve-part": "hatch" },
  };
  return [node];
}
