// The figure's view arithmetic in log10 space: zoom about a point, pan by decades, clamp to sane ranges, and the
// mapping between client, scene and data coordinates that the gestures use.
import type { Scene } from "../../plot/scene-types";

/** Smallest and largest visible span, in decades (keeps zoom away from degenerate or absurd ranges). */
const MIN_SPAN_DEC = 0.02;
const MAX_SPAN_DEC = 40;
/** |log10| bound of any range end. */
const MAX_ABS_LOG = 300;

export type Range = [number, number];
export interface View {
  mass: Range;
  y: Range;
}

/** Zooms a log range by `factor` (> 1 widens) about the log10 value `anchor`. */
export function zoomRange(r: Range, factor: number, anchor: number): Range {
  const l0 = Math.log10(r[0]);
  const l1 = Math.log10(r[1]);
  let span = (l1 - l0) * factor;
  if (span < MIN_SPAN_DEC || span > MAX_SPAN_DEC) {
    span = Math.min(MAX_SPAN_DEC, Math.max(MIN_SPAN_DEC, span));
    factor = span / (l1 - l0);
  }
  const a = Number.isFinite(anchor) ? Math.min(l1, Math.max(l0, anchor)) : (l0 + l1) / 2;
  return clampRange(a - (a - l0) * factor, a + (l1 - a) * factor);
}

/** Shifts a log range by `decades`. */
export function panRange(r: Range, decades: number): Range {
  return clampRange(Math.log10(r[0]) + decades, Math.log10(r[1]) + decades);
}

function clampRange(l0: number, l1: number): Range {
  const span = l1 - l0;
  if (l0 < -MAX_ABS_LOG) [l0, l1] = [-MAX_ABS_LOG, -MAX_ABS_LOG + span];
  if (l1 > MAX_ABS_LOG) [l0, l1] = [MAX_ABS_LOG - span, MAX_ABS_LOG];
  return [10 ** l0, 10 ** l1];
}

export function wheelPixels(e: WheelEvent, heightPx: number): number {
  // Some platforms turn Shift+wheel into a horizontal scroll.
  const d = e.deltaY !== 0 ? e.deltaY : e.deltaX;
  if (e.deltaMode === 1) return d * 16;
  if (e.deltaMode === 2) return d * heightPx;
  return d;
}

/** Scene coordinates (px) of a client point over the svg. */
export function scenePoint(svg: SVGSVGElement, scene: Scene, clientX: number, clientY: number) {
  const r = svg.getBoundingClientRect();
  return {
    x: ((clientX - r.left) * scene.widthPx) / (r.width || 1),
    y: ((clientY - r.top) * scene.heightPx) / (r.height || 1),
  };
}

/** log10 mass and log10 y under a scene point. */
export function logsAt(scene: Scene, x: number, y: number): { lm: number; ly: number } {
  const { plot, scales } = scene;
  const [m0, m1] = scales.massDomainEv.map(Math.log10);
  const [y0, y1] = scales.yDomain.map(Math.log10);
  return { lm: m0 + ((x - plot.x) / plot.w) * (m1 - m0), ly: y0 + ((plot.y + plot.h - y) / plot.h) * (y1 - y0) };
}

export function insidePlot(scene: Scene, x: number, y: number): boolean {
  const { plot } = scene;
  return x >= plot.x && x <= plot.x + plot.w && y >= plot.y && y <= plot.y + plot.h;
}
