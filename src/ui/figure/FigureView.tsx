// The interactive figure: the project's scene (the one the export writes) drawn by SceneSvg and moved by
// useFigureGestures; big curves still being prepared in the worker are left out, with a note.
import { useDeferredValue, useEffect, useId, useMemo, useRef, useState, type RefObject } from "react";
import { buildScene, type BuildSceneOpts } from "../../plot/scene";
import { presetOf } from "../../plot/layout";
import { shortenedLegendNote } from "../../plot/legend";
import type { Scene } from "../../plot/scene-types";
import type { Project } from "../../project/types";
import { selectHighlight, selectPreparing, selectProject, useAxband } from "../store";
import { withoutPreparing } from "../store/preparation";
import { SceneSvg } from "./SceneSvg";
import { Crosshair, PreparingNote } from "./FigureOverlays";
import { useFigureGestures } from "./useFigureGestures";
import { requestRuns, runsWorkerAvailable } from "../../worker/runs-client";
import type { RunDeferral, RunJob } from "../../plot/thinning/deferred-runs";
import { LabelHandles } from "./LabelHandles";

/** Device pixels per scene pixel, rounded to quarters so a small resize does not rebuild the scene. */
function resolutionFor(displayWidthPx: number, sceneWidthPx: number): number {
  const dpr = typeof window !== "undefined" && window.devicePixelRatio > 0 ? window.devicePixelRatio : 1;
  return Math.max(0.25, Math.round(((displayWidthPx || sceneWidthPx) / sceneWidthPx) * dpr * 4) / 4);
}

/** The width the figure is shown at, CSS px (0 until measured). */
function useDisplayWidth(boxRef: RefObject<HTMLDivElement | null>): number {
  const [displayWidth, setDisplayWidth] = useState(0);
  useEffect(() => {
    const el = boxRef.current;
    if (!el || typeof ResizeObserver === "undefined") return;
    const ro = new ResizeObserver((entries) => setDisplayWidth(entries[0]?.contentRect.width ?? 0));
    ro.observe(el);
    return () => ro.disconnect();
  }, [boxRef]);
  return displayWidth;
}

function figureLabel(scene: Scene, project: Project): string {
  const yView = scene.scales.yView;
  const axis = yView === "normalized" ? "|E/N − c_γ|" : yView === "g-gamma" ? "|g_γ|" : "g_aγγ";
  const models = project.models.filter((m) => m.visible).length;
  const curves = project.curves.filter((c) => c.visible).length;
  return `Figure: ${axis} against m_a, ${models} models and ${curves} curves`;
}

/**
 * The scene of the figure on screen at the display's resolution. While the view moves, an automatic legend keeps
 * the place it had when the view last rested; `sceneRef` always holds the latest scene for the gestures. A big
 * file-order curve's first thinning at a new zoom level goes to the runs worker, a stand-in drawn meanwhile
 * (`deferred` lists it); the scene is built again once the answers are in the cache.
 */
function useFigureScene(
  project: Project,
  opts: { displayWidth: number; highlight: BuildSceneOpts["highlight"]; moving: boolean },
  sceneRef: RefObject<Scene | null>,
): { scene: Scene; deferred: RunJob[] } {
  const { displayWidth, highlight, moving } = opts;
  const preset = presetOf(project.figure);
  const resolution = resolutionFor(displayWidth, preset.widthPx);
  const restingPlace = useRef<Scene["autoLegendPlace"]>(undefined);
  const holdLegend = moving ? restingPlace.current : undefined;
  // Direct labels likewise keep their data points while the view moves (placing them costs tens of ms).
  const restingLabels = useRef<BuildSceneOpts["holdLabels"]>(undefined);
  const holdLabels = moving ? restingLabels.current : undefined;
  // Bumped when the runs worker has put thinnings into the cache that this figure drew stand-ins for.
  const [runsInstalled, setRunsInstalled] = useState(0);
  const built = useMemo(() => {
    void runsInstalled; // built again when the cache has gained thinnings (the scene reads them from there)
    const deferRuns: RunDeferral | undefined = runsWorkerAvailable() ? { jobs: [] } : undefined;
    const scene = buildScene(project, {
      widthPx: preset.widthPx,
      heightPx: preset.heightPx,
      resolution,
      highlight,
      physical: false,
      holdLegend,
      holdLabels,
      // Dense zig-zags as filled envelopes: the same pixels, a fraction of the browser's painting.
      envelope: true,
      deferRuns,
    });
    return { scene, deferred: deferRuns?.jobs ?? [] };
  }, [project, preset.widthPx, preset.heightPx, resolution, highlight, holdLegend, holdLabels, runsInstalled]);
  const { scene, deferred } = built;
  useEffect(() => {
    if (deferred.length) requestRuns(deferred, () => setRunsInstalled((k) => k + 1));
  }, [deferred]);
  useEffect(() => {
    if (moving) return;
    restingPlace.current = scene.autoLegendPlace;
    restingLabels.current = scene.directLabels
      ? Object.fromEntries(scene.directLabels.map((l) => [`${l.kind}:${l.id}`, { at: l.at, variant: l.variant }]))
      : undefined;
  }, [scene, moving]);
  useEffect(() => {
    sceneRef.current = scene;
  }, [scene, sceneRef]);
  return built;
}

/** The lines under the figure: the scene's notes, the legend's shortened entries, and how to move the view. */
function FigureNotes({ scene, hintId }: { scene: Scene; hintId: string }) {
  const legendNote = shortenedLegendNote(scene);
  return (
    <>
      {scene.notes?.length ? (
        <p className="figure-note" data-testid="figure-notes" role="status">
          {scene.notes.join("; ")}
        </p>
      ) : null}
      {legendNote ? (
        <p className="figure-note" data-testid="legend-note" role="status">
          {legendNote}
        </p>
      ) : null}
      <p className="figure-hint" id={hintId}>
        Scroll to zoom (Shift: mass axis only, Alt: y axis only), drag to pan, double-click to reset. With the figure
        focused: + and − zoom, arrow keys pan, 0 resets.
      </p>
    </>
  );
}

export function FigureView() {
  // Deferred: a big change (a million-point curve arriving) builds the scene in its own task, after the
  // panels have updated, instead of adding to one long task; zoom steps may skip stale frames.
  const fullProject = useDeferredValue(useAxband(selectProject));
  const preparing = useAxband(selectPreparing);
  // Drawing a curve before its preparation arrives would build it here, a long task for a big curve.
  const { project, waiting } = useMemo(() => withoutPreparing(fullProject, preparing), [fullProject, preparing]);
  const highlight = useDeferredValue(useAxband(selectHighlight));
  const boxRef = useRef<HTMLDivElement>(null);
  const svgRef = useRef<SVGSVGElement>(null);
  const sceneRef = useRef<Scene | null>(null);
  const displayWidth = useDisplayWidth(boxRef);
  const hintId = useId();
  const idPrefix = `fig${useId().replace(/[^A-Za-z0-9]/g, "")}-`;
  const { moving, panning, handlers } = useFigureGestures(svgRef, sceneRef);
  const { scene, deferred } = useFigureScene(project, { displayWidth, highlight, moving }, sceneRef);

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
          aria-label={figureLabel(scene, project)}
          aria-describedby={hintId}
          data-mass-domain={`${scales.massDomainEv[0]},${scales.massDomainEv[1]}`}
          data-y-domain={`${scales.yDomain[0]},${scales.yDomain[1]}`}
          data-y-view={scales.yView ?? "coupling"}
          data-plot-box={`${plot.x},${plot.y},${plot.w},${plot.h}`}
          data-scene-size={`${scene.widthPx},${scene.heightPx}`}
          data-thinning-pending={deferred.length ? deferred.length : undefined}
          {...handlers}
        >
          <Crosshair scene={scene} />
        </SceneSvg>
        <PreparingNote scene={scene} waiting={waiting} />
        <LabelHandles scene={scene} boxRef={boxRef} />
      </div>
      <FigureNotes scene={scene} hintId={hintId} />
    </section>
  );
}
