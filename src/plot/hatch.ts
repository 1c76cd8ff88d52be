// Hatches on the excluded side of an exclusion edge: short strokes spaced evenly along the edge's path length
// in scene px, computed from the thinned and clipped pixels, so the screen and every export draw the same marks.
import { r2 } from "./format";

/** Size of the hatches of one figure, in scene px. */
export interface HatchStyle {
  /** Visible length of a hatch beyond the edge line's centre. */
  lengthPx: number;
  /** Distance between neighbouring hatches along the edge. */
  spacingPx: number;
  /** Stroke width of a hatch. */
  widthPx: number;
  /** Angle between a hatch and the edge's normal, degrees (0 = perpendicular; positive leans along the path). */
  angleDeg: number;
}

/**
 * Hatch size from the curve line width, which follows the preset's font scale (slide: 1.78 px line, 5.3 px
 * hatches every 6.2 px; single column: 1.19 px line, 3.6 px every 4.2 px). Chosen by eye on print and slide.
 */
export function hatchStyleFor(lineWidthPx: number): HatchStyle {
  return { lengthPx: 3 * lineWidthPx, spacingPx: 3.5 * lineWidthPx, widthPx: 0.6 * lineWidthPx, angleDeg: 0 };
}

/** The edge of an excluded region: vertices in scene px, and which side of the path is excluded. */
export interface HatchEdge {
  xs: ArrayLike<number>;
  ys: ArrayLike<number>;
  n: number;
  /** Extra vertices before and after xs/ys (the vertical ends of an exclusion), without copying the curve. */
  from?: readonly [number, number];
  to?: readonly [number, number];
  /** +1: the excluded side is the path's (dy, −dx) side (left of travel on screen, y down); −1 the other. */
  side: 1 | -1;
}

/** Hatches for one edge as path data, and how many there are. */
export interface Hatches {
  d: string;
  count: number;
}

/**
 * Which side of the closed polygon through an edge's vertices (from, xs/ys, to) its inside lies on: +1 when it
 * is the (dy, −dx) side of travel (a negative shoelace sum in y-down scene coordinates), else −1. The exclusion
 * path is such a polygon (the curve, then up past the plot top and back), so its orientation says where the
 * fill goes, for any curve order.
 */
export function insideSide(e: Omit<HatchEdge, "side">): 1 | -1 {
  let twiceArea = 0;
  let px = e.to ? e.to[0] : e.xs[e.n - 1];
  let py = e.to ? e.to[1] : e.ys[e.n - 1];
  const add = (x: number, y: number) => {
    twiceArea += px * y - x * py;
    px = x;
    py = y;
  };
  if (e.from) add(e.from[0], e.from[1]);
  for (let i = 0; i < e.n; i++) add(e.xs[i], e.ys[i]);
  if (e.to) add(e.to[0], e.to[1]);
  return twiceArea <= 0 ? 1 : -1;
}

// The edge as one array (the vertical ends included) with its cumulative length, and the kept vertices of its
// decimation: module buffers reused between calls (hatching runs once per curve per frame).
let edgeX = new Float64Array(1024);
let edgeY = new Float64Array(1024);
let edgeLen = new Float64Array(1024);
let kept = new Int32Array(1024);

/** Copy the edge (from, xs/ys, to) into edgeX/edgeY with the path length up to each vertex; returns the count. */
function gather(e: HatchEdge): number {
  const total = e.n + (e.from ? 1 : 0) + (e.to ? 1 : 0);
  if (edgeX.length < total) {
    edgeX = new Float64Array(total * 2);
    edgeY = new Float64Array(total * 2);
    edgeLen = new Float64Array(total * 2);
    kept = new Int32Array(total * 2);
  }
  let k = 0;
  const put = (x: number, y: number) => {
    edgeX[k] = x;
    edgeY[k] = y;
    edgeLen[k] = k === 0 ? 0 : edgeLen[k - 1] + hypot(x - edgeX[k - 1], y - edgeY[k - 1]);
    k++;
  };
  if (e.from) put(e.from[0], e.from[1]);
  for (let i = 0; i < e.n; i++) put(e.xs[i], e.ys[i]);
  if (e.to) put(e.to[0], e.to[1]);
  return k;
}

/**
 * The edge's vertices closer than `step` to the last kept one dropped (the first and last always kept), as
 * indices in `kept`; returns their count. Hatches are spaced and turned along this coarse path, so a noisy edge
 * gets evenly spaced, parallel hatches along its mean course, not a tuft at every wiggle.
 */
function decimate(m: number, step: number): number {
  const step2 = step * step;
  let k = 0;
  for (let i = 0; i < m; i++) {
    if (k > 0 && i < m - 1) {
      const dx = edgeX[i] - edgeX[kept[k - 1]];
      const dy = edgeY[i] - edgeY[kept[k - 1]];
      if (dx * dx + dy * dy < step2) continue;
    }
    kept[k++] = i;
  }
  return k;
}

// Math.hypot guards against overflow we cannot have in scene px, and is several times slower in V8.
function hypot(x: number, y: number): number {
  return Math.sqrt(x * x + y * y);
}

type Box = { x0: number; y0: number; x1: number; y1: number };

/** Whether points a and b lie in one box grown by `pad` on every side (a cheap "may come near" test). */
function nearBox(ax: number, ay: number, bx: number, by: number, r: Box, pad: number) {
  return (
    Math.max(ax, bx) >= r.x0 - pad &&
    Math.min(ax, bx) <= r.x1 + pad &&
    Math.max(ay, by) >= r.y0 - pad &&
    Math.min(ay, by) <= r.y1 + pad
  );
}

/**
 * Short strokes on the excluded side of an edge. They are spaced evenly along a coarse copy of the edge
 * (vertices 2.5 spacings apart) and square to it, turning towards the bisectors near its vertices so they turn
 * smoothly; each sits on the drawn line itself (the same fraction of the fine path between two coarse
 * vertices) and reaches `lengthPx` beyond the line (plus half the line width from its centre). Only hatches near
 * the plot are written, at most `4 · (plot.w + plot.h) / spacingPx` of them (a wild edge gets wider spacing):
 * the work is O(n), the output bounded by the plot size.
 */
// Hot loop: long on purpose (one pass per chord with the tangents in locals, no allocation per hatch).
export function hatchEdge(
  e: HatchEdge,
  plot: { x: number; y: number; w: number; h: number },
  style: HatchStyle,
  lineWidthPx: number,
): Hatches {
  if (!(style.spacingPx > 0) || !(style.lengthPx > 0)) return { d: "", count: 0 };
  const m = gather(e);
  if (m < 2) return { d: "", count: 0 };
  const step = 2.5 * style.spacingPx;
  const K = decimate(m, step);
  const reach = style.lengthPx + lineWidthPx;
  const r = { x0: plot.x - reach, y0: plot.y - reach, x1: plot.x + plot.w + reach, y1: plot.y + plot.h + reach };
  let visibleLen = 0;
  for (let k = 0; k + 1 < K; k++) {
    const a0 = kept[k];
    const a1 = kept[k + 1];
    if (nearBox(edgeX[a0], edgeY[a0], edgeX[a1], edgeY[a1], r, step))
      visibleLen += hypot(edgeX[a1] - edgeX[a0], edgeY[a1] - edgeY[a0]);
  }
  const cap = (4 * (plot.w + plot.h)) / style.spacingPx;
  const spacing = visibleLen / style.spacingPx > cap ? visibleLen / cap : style.spacingPx;
  const len = style.lengthPx + lineWidthPx / 2;
  const blend = step / 2;
  const a = (style.angleDeg * Math.PI) / 180;
  const cosA = Math.cos(a);
  const sinA = Math.sin(a);
  const parts: string[] = [];
  // Directions as plain numbers (no arrays in the loop): the tangent at the chord's start (t0x, t0y).
  let t0x = 0;
  let t0y = 0;
  let hasPrev = false;
  // Path length (along the coarse path) to the next hatch: half a spacing in, so a short edge still gets one.
  let next = spacing / 2;
  for (let k = 0; k + 1 < K; k++) {
    const i0 = kept[k];
    const i1 = kept[k + 1];
    const dx = edgeX[i1] - edgeX[i0];
    const dy = edgeY[i1] - edgeY[i0];
    const chordLen = hypot(dx, dy);
    if (chordLen === 0) continue;
    const ux = dx / chordLen;
    const uy = dy / chordLen;
    if (!hasPrev) {
      t0x = ux;
      t0y = uy;
    }
    // Tangent at the chord's end: bisector of this chord and the next (this chord's own where they oppose).
    let t1x = ux;
    let t1y = uy;
    if (k + 2 < K) {
      const vx = edgeX[kept[k + 2]] - edgeX[i1];
      const vy = edgeY[kept[k + 2]] - edgeY[i1];
      const vl = hypot(vx, vy);
      if (vl > 0) {
        const bx = ux + vx / vl;
        const by = uy + vy / vl;
        const bl = hypot(bx, by);
        if (bl > 1e-6) {
          t1x = bx / bl;
          t1y = by / bl;
        }
      }
    }
    if (nearBox(edgeX[i0], edgeY[i0], edgeX[i1], edgeY[i1], r, step)) {
      const fine0 = edgeLen[i0];
      const fineLen = edgeLen[i1] - fine0;
      let j = i0;
      for (; next <= chordLen; next += spacing) {
        const t = next / chordLen;
        // The same fraction of the fine path between the two coarse vertices: a point on the drawn line.
        const at = fine0 + t * fineLen;
        while (j + 1 < i1 && edgeLen[j + 1] < at) j++;
        const seg = edgeLen[j + 1] - edgeLen[j];
        const f = seg > 0 ? (at - edgeLen[j]) / seg : 0;
        const px = edgeX[j] + f * (edgeX[j + 1] - edgeX[j]);
        const py = edgeY[j] + f * (edgeY[j + 1] - edgeY[j]);
        if (px < r.x0 || px > r.x1 || py < r.y0 || py > r.y1) continue;
        // Turn from the start's bisector to the chord's own direction over the first half step, and on to the
        // end's bisector over the last: a long straight chord keeps its hatches square to it.
        const ws = Math.max(0, 1 - next / blend);
        const we = Math.max(0, 1 - (chordLen - next) / blend);
        const wu = Math.max(0, 1 - ws - we);
        let tx = ws * t0x + we * t1x + wu * ux;
        let ty = ws * t0y + we * t1y + wu * uy;
        const tn = hypot(tx, ty);
        if (tn < 1e-6) {
          tx = ux;
          ty = uy;
        } else {
          tx /= tn;
          ty /= tn;
        }
        // Unit normal into the excluded side, turned by the style's angle towards the direction of travel.
        const nx = e.side * ty;
        const ny = -e.side * tx;
        parts.push(`M${r2(px)} ${r2(py)}l${r2(len * (cosA * nx + sinA * tx))} ${r2(len * (cosA * ny + sinA * ty))}`);
      }
    } else if (next <= chordLen) {
      next += Math.ceil((chordLen - next) / spacing + 1e-9) * spacing;
    }
    next -= chordLen;
    t0x = t1x;
    t0y = t1y;
    hasPrev = true;
  }
  return { d: parts.join(""), count: parts.length };
}
