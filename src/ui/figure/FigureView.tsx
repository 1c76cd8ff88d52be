// The interactive figure: the scene of the project (the same one the export writes) drawn by SceneSvg (scene-dom.ts),
// with wheel zoom about the cursor, drag to pan, keyboard zoom/pan, double-click reset and a hover point.
// Zoom and pan go through setView (one undo step per burst) and are batched to one commit per frame.
// Big curves whose drawing preparation is still being built in the worker are left out, with a note.
import {
  useCallback,
  useDeferredValue,
  useEffect,
  useId,
  useMemo,
  useRef,
  useState,
  type KeyboardEvent,
  type PointerEvent,
} from "react";
import { buildScene } from "../../plot/scene";
import { presetOf } from "../../plot/layout";
import type { Scene } from "../../plot/scene-types";
import type { Curve } from "../../project/types";
import { selectHighlight, selectHover, selectPreparing, selectProject, useAxband } from "../store";
import { withoutPreparing } from "../store/preparation";
import { SceneSvg } from "./SceneSvg";

/** Smallest and largest visible span, in decades (keeps zoom away from degenerate or absurd ranges). */
const MIN_SPAN_DEC = 0.02;
const MAX_SPAN_DEC = 40;
/** |log10| bound of any range end. */
const MAX_ABS_LOG = 300;
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

type Range = [number, number];
interface View {
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

function wheelPixels(e: WheelEvent, heightPx: number): number {
  // Some platforms turn Shift+wheel into a horizontal scroll.
  const d = e.deltaY !== 0 ? e.deltaY : e.deltaX;
  if (e.deltaMode === 1) return d * 16;
  if (e.deltaMode === 2) return d * heightPx;
  return d;
}

/** Scene coordinates (px) of a client point over the svg. */
function scenePoint(svg: SVGSVGElement, scene: Scene, clientX: number, clientY: number): { x: number; y: number } {
  const r = svg.getBoundingClientRect();
  return {
    x: ((clientX - r.left) * scene.widthPx) / (r.width || 1),
    y: ((clientY - r.top) * scene.heightPx) / (r.height || 1),
  };
}

/** log10 mass and log10 y under a scene point. */
function logsAt(scene: Scene, x: number, y: number): { lm: number; ly: number } {
  const { plot, scales } = scene;
  const [m0, m1] = scales.massDomainEv.map(Math.log10);
  const [y0, y1] = scales.yDomain.map(Math.log10);
  return { lm: m0 + ((x - plot.x) / plot.w) * (m1 - m0), ly: y0 + ((plot.y + plot.h - y) / plot.h) * (y1 - y0) };
}

function insidePlot(scene: Scene, x: number, y: number): boolean {
  const { plot } = scene;
  return x >= plot.x && x <= plot.x + plot.w && y >= plot.y && y <= plot.y + plot.h;
}

/** Device pixels per scene pixel, rounded to quarters so a small resize does not rebuild the scene. */
function resolutionFor(displayWidthPx: number, sceneWidthPx: number): number {
  const dpr = typeof window !== "undefined" && window.devicePixelRatio > 0 ? window.devicePixelRatio : 1;
  return Math.max(0.25, Math.round(((displayWidthPx || sceneWidthPx) / sceneWidthPx) * dpr * 4) / 4);
}

/** Inside the top left of the plot area (placed from the scene), so the figure does not move for it. */
const PREPARING_STYLE = {
  position: "absolute",
  margin: 0,
  padding: "2px 8px",
  background: "rgba(255, 255, 255, 0.92)",
  border: "1px solid var(--line)",
  borderRadius: 4,
  pointerEvents: "none",
  // Centred at the top of the plot: the legend sits in a corner.
  transform: "translateX(-50%)",
  maxWidth: "60%",
} as const;

/** Thin crosshair at the hover point (screen only; the export has none). Re-renders alone on hover. */
function Crosshair({ scene }: { scene: Scene }) {
  const hover = useAxband(selectHover);
  if (!hover) return null;
  const { plot, scales } = scene;
  const [m0, m1] = scales.massDomainEv.map(Math.log10);
  const [y0, y1] = scales.yDomain.map(Math.log10);
  const x = plot.x + ((Math.log10(hover.massEv) - m0) / (m1 - m0)) * plot.w;
  const y = plot.y + plot.h - ((Math.log10(hover.y) - y0) / (y1 - y0)) * plot.h;
  if (!(x >= plot.x && x <= plot.x + plot.w && y >= plot.y && y <= plot.y + plot.h)) return null;
  return (
    <g className="crosshair" pointerEvents="none" aria-hidden="true">
      <path
        d={`M${plot.x},${y}H${plot.x + plot.w}M${x},${plot.y}V${plot.y + plot.h}`}
        stroke="#2b3440"
        strokeOpacity={0.45}
        strokeWidth={0.75}
        strokeDasharray="3 3"
        fill="none"
      />
      <circle cx={x} cy={y} r={2.5} fill="none" stroke="#2b3440" strokeWidth={1} />
    </g>
  );
}

/** The note over the plot while curves are being prepared for drawing. */
function preparingNote(waiting: readonly Curve[]): string {
  const names = waiting.map((c) => `“${c.label}”`);
  if (names.length === 1) return `Preparing curve ${names[0]} for drawing…`;
  return `Preparing ${names.length} curves for drawing: ${names.join(", ")}…`;
}

export function FigureView() {
  // Deferred: a big change (a million-point curve arriving) builds the scene in its own task, after the
  // panels have updated, instead of adding to one long task; zoom steps may skip stale frames.
  const fullProject = useDeferredValue(useAxband(selectProject));
  const preparing = useAxband(selectPreparing);
  // Drawing a curve before its preparation arrives would build it here, a long task for a big curve.
  const { project, waiting } = useMemo(() => withoutPreparing(fullProject, preparing), [fullProject, preparing]);
  const highlight = useDeferredValue(useAxband(selectHighlight));
  const setHover = useAxband((s) => s.setHover);
  const boxRef = useRef<HTMLDivElement>(null);
  const svgRef = useRef<SVGSVGElement>(null);
  const [displayWidth, setDisplayWidth] = useState(0);
  const hintId = useId();
  const idPrefix = `fig${useId().replace(/[^A-Za-z0-9]/g, "")}-`;

  const preset = presetOf(project.figure);
  const resolution = resolutionFor(displayWidth, preset.widthPx);
  // While the view moves, an automatic legend keeps the place it had when the view last rested.
  const [moving, setMoving] = useState(false);
  const restingPlace = useRef<Scene["autoLegendPlace"]>(undefined);
  const holdLegend = moving ? restingPlace.current : undefined;
  const scene = useMemo(
    () =>
      buildScene(project, {
        widthPx: preset.widthPx,
        heightPx: preset.heightPx,
        resolution,
        highlight,
        physical: false,
        holdLegend,
      }),
    [project, preset.widthPx, preset.heightPx, resolution, highlight, holdLegend],
  );
  useEffect(() => {
    if (!moving) restingPlace.current = scene.autoLegendPlace;
  }, [scene, moving]);
  const sceneRef = useRef(scene);
  useEffect(() => {
    sceneRef.current = scene;
  }, [scene]);

  useEffect(() => {
    const el = boxRef.current;
    if (!el || typeof ResizeObserver === "undefined") return;
    const ro = new ResizeObserver((entries) => setDisplayWidth(entries[0]?.contentRect.width ?? 0));
    ro.observe(el);
    return () => ro.disconnect();
  }, []);

  // One commit per animation frame: wheel and drag events only update the pending view.
  const pending = useRef<View | null>(null);
  const frame = useRef<number | null>(null);
  const currentView = (): View => {
    if (pending.current) return pending.current;
    const f = useAxband.getState().project.figure;
    return { mass: f.massRangeEv, y: f.yRange };
  };
  const restTimer = useRef<ReturnType<typeof setTimeout> | null>(null);
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
  useEffect(
    () => () => {
      if (frame.current !== null) cancelAnimationFrame(frame.current);
      if (restTimer.current !== null) clearTimeout(restTimer.current);
    },
    [],
  );

  // Pending hover point, also once per frame.
  const hoverFrame = useRef<number | null>(null);
  const hoverAt = useRef<{ x: number; y: number } | null>(null);
  const scheduleHover = useCallback(
    (pt: { x: number; y: number } | null) => {
      hoverAt.current = pt;
      if (hoverFrame.current !== null) return;
      hoverFrame.current = requestAnimationFrame(() => {
        hoverFrame.current = null;
        const p = hoverAt.current;
        const sc = sceneRef.current;
        if (!p || !insidePlot(sc, p.x, p.y)) return setHover(null);
        const { lm, ly } = logsAt(sc, p.x, p.y);
        setHover({ massEv: 10 ** lm, y: 10 ** ly });
      });
    },
    [setHover],
  );

  useEffect(() => {
    const svg = svgRef.current;
    if (!svg) return;
    const onWheel = (e: WheelEvent) => {
      const sc = sceneRef.current;
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
  }, [schedule]);

  const drag = useRef<{ id: number; x: number; y: number; start: View; moved: boolean } | null>(null);
  const [panning, setPanning] = useState(false);

  const onPointerDown = (e: PointerEvent<SVGSVGElement>) => {
    if (e.button !== 0) return;
    drag.current = { id: e.pointerId, x: e.clientX, y: e.clientY, start: currentView(), moved: false };
  };
  const onPointerMove = (e: PointerEvent<SVGSVGElement>) => {
    const svg = svgRef.current;
    if (!svg) return;
    const sc = sceneRef.current;
    const d = drag.current;
    if (d && d.id === e.pointerId) {
      if (!d.moved && Math.hypot(e.clientX - d.x, e.clientY - d.y) < DRAG_SLOP) return;
      if (!d.moved) {
        d.moved = true;
        svg.setPointerCapture?.(e.pointerId);
        setPanning(true);
      }
      const r = svg.getBoundingClientRect();
      const dx = ((e.clientX - d.x) * sc.widthPx) / (r.width || 1);
      const dy = ((e.clientY - d.y) * sc.heightPx) / (r.height || 1);
      const spanM = Math.log10(d.start.mass[1] / d.start.mass[0]);
      const spanY = Math.log10(d.start.y[1] / d.start.y[0]);
      schedule({
        mass: panRange(d.start.mass, (-dx / sc.plot.w) * spanM),
        y: panRange(d.start.y, (dy / sc.plot.h) * spanY),
      });
      return;
    }
    scheduleHover(scenePoint(svg, sc, e.clientX, e.clientY));
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
    const v = currentView();
    const mid = (r: Range) => (Math.log10(r[0]) + Math.log10(r[1])) / 2;
    const span = (r: Range) => Math.log10(r[1] / r[0]);
    let next: View;
    switch (e.key) {
      case "+":
      case "=":
        next = { mass: zoomRange(v.mass, 1 / KEY_ZOOM, mid(v.mass)), y: zoomRange(v.y, 1 / KEY_ZOOM, mid(v.y)) };
        break;
      case "-":
      case "_":
      case "\u2212":
        next = { mass: zoomRange(v.mass, KEY_ZOOM, mid(v.mass)), y: zoomRange(v.y, KEY_ZOOM, mid(v.y)) };
        break;
      case "ArrowLeft":
        next = { mass: panRange(v.mass, -KEY_PAN * span(v.mass)), y: v.y };
        break;
      case "ArrowRight":
        next = { mass: panRange(v.mass, KEY_PAN * span(v.mass)), y: v.y };
        break;
      case "ArrowUp":
        next = { mass: v.mass, y: panRange(v.y, KEY_PAN * span(v.y)) };
        break;
      case "ArrowDown":
        next = { mass: v.mass, y: panRange(v.y, -KEY_PAN * span(v.y)) };
        break;
      case "0":
        e.preventDefault();
        pending.current = null;
        useAxband.getState().resetView();
        return;
      default:
        return;
    }
    e.preventDefault();
    schedule(next);
  };

  const { plot, scales } = scene;
  const aspect = scene.widthPx / scene.heightPx;
  return (
    <section className="figure-card" aria-label="Figure">
      <div
        className="figure-box"
        ref={boxRef}
        data-testid="plot"
        style={{ maxWidth: `max(320px, calc((100vh - 190px) * ${aspect.toFixed(4)}))` }}
      >
        <SceneSvg
          ref={svgRef}
          scene={scene}
          idPrefix={idPrefix}
          className={panning ? "panning" : undefined}
          tabIndex={0}
          role="img"
          aria-label={`Figure: ${scales.yView === "normalized" ? "|E/N − c_γ|" : scales.yView === "g-gamma" ? "|g_γ|" : "g_aγγ"} against m_a, ${project.models.filter((m) => m.visible).length} models and ${project.curves.filter((c) => c.visible).length} curves`}
          aria-describedby={hintId}
          data-mass-domain={`${scales.massDomainEv[0]},${scales.massDomainEv[1]}`}
          data-y-domain={`${scales.yDomain[0]},${scales.yDomain[1]}`}
          data-y-view={scales.yView ?? "coupling"}
          data-plot-box={`${plot.x},${plot.y},${plot.w},${plot.h}`}
          data-scene-size={`${scene.widthPx},${scene.heightPx}`}
          onPointerDown={onPointerDown}
          onPointerMove={onPointerMove}
          onPointerUp={endDrag}
          onPointerCancel={endDrag}
          onPointerLeave={() => scheduleHover(null)}
          onDoubleClick={() => {
            pending.current = null;
            useAxband.getState().resetView();
          }}
          onKeyDown={onKeyDown}
        >
          <Crosshair scene={scene} />
        </SceneSvg>
        {waiting.length > 0 ? (
          <p
            className="note figure-preparing"
            data-testid="figure-preparing"
            aria-live="polite"
            style={{
              ...PREPARING_STYLE,
              left: `${((plot.x + plot.w / 2) / scene.widthPx) * 100}%`,
              top: `${((plot.y + 8) / scene.heightPx) * 100}%`,
            }}
          >
            {preparingNote(waiting)}
          </p>
        ) : null}
      </div>
      <p className="figure-hint" id={hintId}>
        Scroll to zoom (Shift: mass axis only, Alt: y axis only), drag to pan, double-click to reset. With the figure
        focused: + and − zoom, arrow keys pan, 0 resets.
      </p>
    </section>
  );
}
