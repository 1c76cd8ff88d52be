// Curves as scene nodes by role: exclusion (its edge, hatched on the excluded side and/or filled from the curve up
// past the plot top), projection (a line), region (a closed, filled and outlined polygon), at pixel resolution via thinning/.
import type { Curve, YView } from "../project/types";
import type { AxionConstants } from "../physics/constants";
import type { PathNode } from "./scene-types";
import type { Shape } from "./occupancy";
import { curvePixels, pathDataCompact, prepareCurve, type PreparedCurve } from "./thinning/index";
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
  });
}

/** Scene nodes of one curve (fills and lines apart, so that every line can go over every fill). */
export function curveGeometry(curve: Curve, f: CurveFrame, nodeId: string): CurveGeometry {
  const prep = preparedOf(curve);
  const pl = framePixels(curve, prep, f);
  const colour = safeColour(curve.colour, "#D55E00");
  const opacity = unitInterval(curve.fillOpacity, 0.3);
  const lw = f.lineWidthPx;
  const dash = dashFor(curve.lineStyle, lw);
  const data = { "curve-id": curve.id, "curve-role": curve.role };
  const fills: PathNode[] = [];
  const lines: PathNode[] = [];
  const hatches: PathNode[] = [];
  const out: CurveGeometry = { role: curve.role, skipped: prep.skipped, drawn: pl.n, fills, hatches, lines };
  if (pl.n === 0) return out;
  if (curve.role === "exclusion") {
    // One path, stroked and (with a fill mark) filled: the curve, then up past the plot top (outside the clip)
    // and back. Its stroke also marks the vertical ends of the excluded region where they lie inside the plot.
    const topY = r2(f.plot.y - 4 * lw - 2);
    const closeUp = `L${r2(pl.xs[pl.n - 1])} ${topY}L${r2(pl.xs[0])} ${topY}Z`;
    const exclusionD = pathDataCompact(pl, closeUp);
    const mark = exclusionMarkOf(curve);
    fills.push({
      kind: "path",
      id: `${nodeId}-exclusion`,
      d: exclusionD,
      writtenD: exclusionD,
      fill: mark === "hatch" ? "none" : colour,
      fillOpacity: mark === "hatch" ? undefined : opacity,
      stroke: colour,
      strokeWidth: lw,
      dash,
      data: { ...data },
    });
    if (mark !== "fill") {
      // The hatches run along the same edge: the vertical ends, then the curve (the top is outside the clip).
      const edge = {
        xs: pl.xs,
        ys: pl.ys,
        n: pl.n,
        from: [r2(pl.xs[0]), topY],
        to: [r2(pl.xs[pl.n - 1]), topY],
      } as const;
      const style = hatchStyleFor(lw);
      const h = hatchEdge({ ...edge, side: insideSide(edge) }, f.plot, style, lw);
      if (h.count > 0)
        hatches.push({
          kind: "path",
          id: `${nodeId}-hatch`,
          d: h.d,
          writtenD: h.d,
          stroke: colour,
          strokeWidth: r2(style.widthPx),
          fill: "none",
          data: { ...data, "curve-part": "hatch" },
        });
    }
  } else if (curve.role === "projection") {
    const d = pathDataCompact(pl);
    lines.push({
      kind: "path",
      id: `${nodeId}-line`,
      d,
      writtenD: d,
      stroke: colour,
      strokeWidth: lw,
      dash,
      fill: "none",
      data: { ...data },
    });
  } else {
    const d = pathDataCompact(pl);
    fills.push({
      kind: "path",
      id: `${nodeId}-region`,
      d,
      writtenD: d,
      fill: colour,
      fillOpacity: opacity,
      stroke: colour,
      strokeWidth: lw,
      dash,
      data: { ...data },
    });
  }
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
