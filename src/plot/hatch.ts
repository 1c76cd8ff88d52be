// Hatches on the excluded side of an exclusion edge: short strokes spaced evenly along the edge's path length
// in scene px, computed from the thinned and clipped pixels, so the screen and every export draw the same marks.
import { compactPolygons } from "./path-writer";

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
type PlotBox = { x: number; y: number; w: number; h: number };

/** Whether points a and b lie in one box grown by `pad` on every side (a cheap "may come near" test). */
function nearBox(ax: number, ay: number, bx: number, by: number, r: Box, pad: number) {
  return (
    Math.max(ax, bx) >= r.x0 - pad &&
    Math.min(ax, bx) <= r.x1 + pad &&
    Math.max(ay, by) >= r.y0 - pad &&
    Math.min(ay, by) <= r.y1 + pad
  );
}

/** What every hatch of one edge shares (set once per edge), and the tangents of the chord being hatched. */
interface HatchPass {
  /** The plot grown by the hatch reach: hatches outside it are not written. */
  r: Box;
  /** Vertex distance of the coarse path (2.5 spacings). */
  step: number;
  spacing: number;
  /** Path length over which a hatch turns from a vertex's bisector to the chord's own direction. */
  blend: number;
  /** Hatch length from the line's centre. */
  len: number;
  cosA: number;
  sinA: number;
  side: 1 | -1;
  /** Tangent at the current chord's start and end (unit vectors). */
  t0x: number;
  t0y: number;
  t1x: number;
  t1y: number;
  /** Both ends of every hatch (hatch k is points 2k and 2k + 1). */
  xs: number[];
  ys: number[];
}

/** Length of the coarse path's chords that come near the plot. */
function visibleLength(count: number, r: Box, step: number): number {
  let visibleLen = 0;
  for (let k = 0; k + 1 < count; k++) {
    const a0 = kept[k];
    const a1 = kept[k + 1];
    if (nearBox(edgeX[a0], edgeY[a0], edgeX[a1], edgeY[a1], r, step))
      visibleLen += hypot(edgeX[a1] - edgeX[a0], edgeY[a1] - edgeY[a0]);
  }
  return visibleLen;
}

/**
 * The shared sizes of one edge's hatches: the style's spacing, or wider where the visible edge would get more
 * than `4 · (plot.w + plot.h) / spacingPx` hatches.
 */
function hatchPass(side: 1 | -1, plot: PlotBox, style: HatchStyle, lineWidthPx: number, count: number): HatchPass {
  const step = 2.5 * style.spacingPx;
  const reach = style.lengthPx + lineWidthPx;
  const r = { x0: plot.x - reach, y0: plot.y - reach, x1: plot.x + plot.w + reach, y1: plot.y + plot.h + reach };
  const visibleLen = visibleLength(count, r, step);
  const cap = (4 * (plot.w + plot.h)) / style.spacingPx;
  const spacing = visibleLen / style.spacingPx > cap ? visibleLen / cap : style.spacingPx;
  const a = (style.angleDeg * Math.PI) / 180;
  const [cosA, sinA] = [Math.cos(a), Math.sin(a)];
  const len = style.lengthPx + lineWidthPx / 2;
  return { r, step, spacing, blend: step / 2, len, cosA, sinA, side, t0x: 0, t0y: 0, t1x: 0, t1y: 0, xs: [], ys: [] };
}

/**
 * Set p.t1x/t1y to the tangent at the end of chord k (direction ux, uy): the bisector of this chord and the
 * next, or this chord's own direction at the last vertex and where the two oppose.
 */
function endTangent(p: HatchPass, k: number, count: number, ux: number, uy: number): void {
  p.t1x = ux;
  p.t1y = uy;
  if (k + 2 >= count) return;
  const i1 = kept[k + 1];
  const vx = edgeX[kept[k + 2]] - edgeX[i1];
  const vy = edgeY[kept[k + 2]] - edgeY[i1];
  const vl = hypot(vx, vy);
  if (!(vl > 0)) return;
  const bx = ux + vx / vl;
  const by = uy + vy / vl;
  const bl = hypot(bx, by);
  if (bl > 1e-6) {
    p.t1x = bx / bl;
    p.t1y = by / bl;
  }
}

/**
 * The hatches on the chord between coarse vertices i0 and i1 (length chordLen, direction ux, uy), from path
 * length `next` along it on, every p.spacing; returns the path length of the next hatch past the chord's start.
 */
function chordHatches(p: HatchPass, i0: number, i1: number, chordLen: number, ux: number, uy: number, next: number) {
  const { r, blend, len, cosA, sinA, side } = p;
  const fine0 = edgeLen[i0];
  const fineLen = edgeLen[i1] - fine0;
  let j = i0;
  for (; next <= chordLen; next += p.spacing) {
    // The same fraction of the fine path between the two coarse vertices: a point on the drawn line.
    const at = fine0 + (next / chordLen) * fineLen;
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
    let tx = ws * p.t0x + we * p.t1x + wu * ux;
    let ty = ws * p.t0y + we * p.t1y + wu * uy;
    const tn = hypot(tx, ty);
    if (tn < 1e-6) {
      tx = ux;
      ty = uy;
    } else {
      tx /= tn;
      ty /= tn;
    }
    // Unit normal into the excluded side, turned by the style's angle towards the direction of travel.
    const nx = side * ty;
    const ny = -side * tx;
    p.xs.push(px, px + len * (cosA * nx + sinA * tx));
    p.ys.push(py, py + len * (cosA * ny + sinA * ty));
  }
  return next;
}

/**
 * Short strokes on the excluded side of an edge. They are spaced evenly along a coarse copy of the edge
 * (vertices 2.5 spacings apart) and square to it, turning towards the bisectors near its vertices so they turn
 * smoothly; each sits on the drawn line itself (the same fraction of the fine path between two coarse
 * vertices) and reaches `lengthPx` beyond the line (plus half the line width from its centre). Only hatches near
 * the plot are written, at most `4 · (plot.w + plot.h) / spacingPx` of them (a wild edge gets wider spacing):
 * the work is O(n), the output bounded by the plot size.
 */
export function hatchEdge(e: HatchEdge, plot: PlotBox, style: HatchStyle, lineWidthPx: number): Hatches {
  if (!(style.spacingPx > 0) || !(style.lengthPx > 0)) return { d: "", count: 0 };
  const m = gather(e);
  if (m < 2) return { d: "", count: 0 };
  const count = decimate(m, 2.5 * style.spacingPx);
  const p = hatchPass(e.side, plot, style, lineWidthPx, count);
  let started = false;
  // Path length (along the coarse path) to the next hatch: half a spacing in, so a short edge still gets one.
  let next = p.spacing / 2;
  for (let k = 0; k + 1 < count; k++) {
    const i0 = kept[k];
    const i1 = kept[k + 1];
    const dx = edgeX[i1] - edgeX[i0];
    const dy = edgeY[i1] - edgeY[i0];
    const chordLen = hypot(dx, dy);
    if (chordLen === 0) continue;
    const ux = dx / chordLen;
    const uy = dy / chordLen;
    if (!started) [p.t0x, p.t0y, started] = [ux, uy, true];
    endTangent(p, k, count, ux, uy);
    if (nearBox(edgeX[i0], edgeY[i0], edgeX[i1], edgeY[i1], p.r, p.step)) {
      next = chordHatches(p, i0, i1, chordLen, ux, uy, next);
    } else if (next <= chordLen) {
      next += Math.ceil((chordLen - next) / p.spacing + 1e-9) * p.spacing;
    }
    next -= chordLen;
    p.t0x = p.t1x;
    p.t0y = p.t1y;
  }
  // Written as the curves are (path-writer.ts: rounded ends, relative moves, h/v when level or upright).
  const hatches = p.xs.length / 2;
  const ends = new Int32Array(hatches).map((_, k) => 2 * k + 2);
  const d = compactPolygons(Float64Array.from(p.xs), Float64Array.from(p.ys), ends, hatches, false);
  return { d, count: hatches };
}
