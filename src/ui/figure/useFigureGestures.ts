// The figure's gestures: wheel zoom about the cursor, drag to pan, keyboard zoom/pan/reset, double-click reset and
// the hover point. Views go through setView (one undo step per burst), batched to one commit per animation frame.
import { useCallback, useEffect, useRef, useState, type KeyboardEvent, type PointerEvent, type RefObject } from "react";
import type { Scene } from "../../plot/scene-types";
import { useAxband } from "../store";
import { insidePlot, logsAt, panRange, scenePoint, wheelPixels, zoomRange, type Range, type View } from "./view-math";

/** Zoom factor per wheel pixel (exp(k·Δ)); a notch of 100 px zooms by ~1.22. */
const WHEEL_K = 0.002;
/** Zoom factor of one + / − key press. */
const KEY_ZOOM = 1.25;
/** Fraction of the span one arrow key press pans. */
const KEY_PAN = 0.1;
/** Pointer travel (CSS px) below which a press is a click, not a drag. */
const DRAG_SLOP = 3;

/**
 * An automatic legend holds its place while the view keeps changing (wheel, drag, keys) and is placed afresh
 * once the view has rested this long, ms: it does not jump about under the cursor, and a zoom step does not
 * pay for placing it (2–4 ms a frame with 20 curves of 100,000 points, bench/redraw.mjs).
 */
export const LEGEND_HOLD_MS = 300;

const mid = (r: Range) => (Math.log10(r[0]) + Math.log10(r[1])) / 2;
const span = (r: Range) => Math.log10(r[1] / r[0]);

/** The view a key asks for, or null for a key the figure does not use. */
function keyView(key: string, v: View): View | null {
  switch (key) {
    case "+":
    case "=":
      return { mass: zoomRange(v.mass, 1 / KEY_ZOOM, mid(v.mass)), y: zoomRange(v.y, 1 / KEY_ZOOM, mid(v.y)) };
    case "-":
    case "_":
    case "\u2212":
      return { mass: zoomRange(v.mass, KEY_ZOOM, mid(v.mass)), y: zoomRange(v.y, KEY_ZOOM, mid(v.y)) };
    case "ArrowLeft":
      return { mass: panRange(v.mass, -KEY_PAN * span(v.mass)), y: v.y };
    case "ArrowRight":
      return { mass: panRange(v.mass, KEY_PAN * span(v.mass)), y: v.y };
    case "ArrowUp":
      return { mass: v.mass, y: panRange(v.y, KEY_PAN * span(v.y)) };
    case "ArrowDown":
      return { mass: v.mass, y: panRange(v.y, -KEY_PAN * span(v.y)) };
    default:
      return null;
  }
}

/** Views batched to one store commit per frame; `moving` stays true until the view has rested LEGEND_HOLD_MS. */
function useViewScheduler() {
  const [moving, setMoving] = useState(false);
  const pending = useRef<View | null>(null);
  const frame = useRef<number | null>(null);
  const restTimer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const currentView = useCallback((): View => {
    if (pending.current) return pending.current;
    const f = useAxband.getState().project.figure;
    return { mass: f.massRangeEv, y: f.yRange };
  }, []);
  const schedule = useCallback((v: View) => {
    setMoving(true);
    if (restTimer.current !== null) clearTimeout(restTimer.current);
    restTimer.current = setTimeout(() => {
      restTimer.current = null;
      setMoving(false);
    }, LEGEND_HOLD_MS);
    pending.current = v;
    if (frame.current !== null) return;
    frame.current = requestAnimationFrame(() => {
      frame.current = null;
      const p = pending.current;
      pending.current = null;
      if (p) useAxband.getState().setView(p.mass, p.y);
    });
  }, []);
  const reset = useCallback(() => {
    pending.current = null;
    useAxband.getState().resetView();
  }, []);
  useEffect(
    () => () => {
      if (frame.current !== null) cancelAnimationFrame(frame.current);
      if (restTimer.current !== null) clearTimeout(restTimer.current);
    },
    [],
  );
  return { moving, currentView, schedule, reset };
}

/** The hover point, set in the store once per frame. */
function useHoverScheduler(sceneRef: RefObject<Scene | null>) {
  const setHover = useAxband((s) => s.setHover);
  const hoverFrame = useRef<number | null>(null);
  const hoverAt = useRef<{ x: number; y: number } | null>(null);
  useEffect(
    () => () => {
      if (hoverFrame.current !== null) cancelAnimationFrame(hoverFrame.current);
    },
    [],
  );
  return useCallback(
    (pt: { x: number; y: number } | null) => {
      hoverAt.current = pt;
      if (hoverFrame.current !== null) return;
      hoverFrame.current = requestAnimationFrame(() => {
        hoverFrame.current = null;
        const p = hoverAt.current;
        const sc = sceneRef.current;
        if (!sc) return;
        if (!p || !insidePlot(sc, p.x, p.y)) return setHover(null);
        const { lm, ly } = logsAt(sc, p.x, p.y);
        setHover({ massEv: 10 ** lm, y: 10 ** ly });
      });
    },
    [setHover, sceneRef],
  );
}

/** Wheel zoom about the cursor; a native listener, since React's wheel listener is passive and cannot prevent. */
function useWheelZoom(
  svgRef: RefObject<SVGSVGElement | null>,
  sceneRef: RefObject<Scene | null>,
  currentView: () => View,
  schedule: (v: View) => void,
) {
  useEffect(() => {
    const svg = svgRef.current;
    if (!svg) return;
    const onWheel = (e: WheelEvent) => {
      const sc = sceneRef.current;
      if (!sc) return;
      const p = scenePoint(svg, sc, e.clientX, e.clientY);
      e.preventDefault();
      const factor = Math.exp(wheelPixels(e, sc.heightPx) * WHEEL_K);
      const v = currentView();
      // Zoom about the cursor in the current (possibly pending) view, so fast wheels stay anchored.
      const vs: Scene = { ...sc, scales: { ...sc.scales, massDomainEv: v.mass, yDomain: v.y } };
      const { lm, ly } = logsAt(vs, p.x, p.y);
      schedule({
        mass: e.altKey ? v.mass : zoomRange(v.mass, factor, lm),
        y: e.shiftKey ? v.y : zoomRange(v.y, factor, ly),
      });
    };
    svg.addEventListener("wheel", onWheel, { passive: false });
    return () => svg.removeEventListener("wheel", onWheel);
  }, [svgRef, sceneRef, currentView, schedule]);
}

/**
 * All gestures of the figure's svg. `sceneRef` holds the scene last drawn (read by events, never in render);
 * returns whether the view is moving (the legend holds its place), whether a drag pans, and the svg's handlers.
 */
export function useFigureGestures(svgRef: RefObject<SVGSVGElement | null>, sceneRef: RefObject<Scene | null>) {
  const { moving, currentView, schedule, reset } = useViewScheduler();
  const scheduleHover = useHoverScheduler(sceneRef);
  useWheelZoom(svgRef, sceneRef, currentView, schedule);
  const drag = useRef<{ id: number; x: number; y: number; start: View; moved: boolean } | null>(null);
  const [panning, setPanning] = useState(false);

  const onPointerDown = (e: PointerEvent<SVGSVGElement>) => {
    if (e.button !== 0) return;
    drag.current = { id: e.pointerId, x: e.clientX, y: e.clientY, start: currentView(), moved: false };
  };
  const onPointerMove = (e: PointerEvent<SVGSVGElement>) => {
    const svg = svgRef.current;
    const sc = sceneRef.current;
    if (!svg || !sc) return;
    const d = drag.current;
    if (!d || d.id !== e.pointerId) return scheduleHover(scenePoint(svg, sc, e.clientX, e.clientY));
    if (!d.moved && Math.hypot(e.clientX - d.x, e.clientY - d.y) < DRAG_SLOP) return;
    if (!d.moved) {
      d.moved = true;
      svg.setPointerCapture?.(e.pointerId);
      setPanning(true);
    }
    const r = svg.getBoundingClientRect();
    const dx = ((e.clientX - d.x) * sc.widthPx) / (r.width || 1);
    const dy = ((e.clientY - d.y) * sc.heightPx) / (r.height || 1);
    schedule({
      mass: panRange(d.start.mass, (-dx / sc.plot.w) * span(d.start.mass)),
      y: panRange(d.start.y, (dy / sc.plot.h) * span(d.start.y)),
    });
  };
  const endDrag = (e: PointerEvent<SVGSVGElement>) => {
    const d = drag.current;
    if (!d || d.id !== e.pointerId) return;
    drag.current = null;
    if (d.moved) {
      svgRef.current?.releasePointerCapture?.(e.pointerId);
      setPanning(false);
    }
  };
  const onKeyDown = (e: KeyboardEvent<SVGSVGElement>) => {
    if (e.ctrlKey || e.metaKey || e.altKey) return;
    if (e.key === "0") {
      e.preventDefault();
      return reset();
    }
    const next = keyView(e.key, currentView());
    if (!next) return;
    e.preventDefault();
    schedule(next);
  };

  const handlers = {
    onPointerDown,
    onPointerMove,
    onPointerUp: endDrag,
    onPointerCancel: endDrag,
    onPointerLeave: () => scheduleHover(null),
    onDoubleClick: reset,
    onKeyDown,
  };
  return { moving, panning, handlers };
}
