// The benchmark's renderers: the app's own figure component (SceneSvg with React 19, committed synchronously so
// that a zoom step's time includes React's render and commit), or its scene renderer alone (diagnostics).
import { createRoot } from "react-dom/client";
import { flushSync } from "react-dom";
import type { Scene } from "../../src/plot/index";
import { SceneSvg } from "../../src/ui/figure/SceneSvg";
import { createSceneDom } from "../../src/ui/figure/scene-dom";

/** A persistent renderer into `host`: call render(scene) for every frame. */
export function createAppRenderer(host: HTMLElement): (scene: Scene) => void {
  const root = createRoot(host);
  return (scene: Scene) => {
    flushSync(() => root.render(<SceneSvg scene={scene} idPrefix="bench-" style={{ width: "960px", height: "540px", display: "block" }} />));
  };
}

/** The app's scene renderer without React around it (diagnostics: React's share of a frame). */
export function createSceneDomRenderer(host: HTMLElement): (scene: Scene) => void {
  const svg = document.createElementNS("http://www.w3.org/2000/svg", "svg");
  svg.style.cssText = "width:960px;height:540px;display:block";
  host.appendChild(svg);
  const dom = createSceneDom(svg, null, "bench-");
  return (scene: Scene) => {
    // Only when it changes, as React does for SceneSvg: setting the viewBox, even to its old value, makes
    // the browser lay out every text of the figure again.
    const viewBox = `0 0 ${scene.widthPx} ${scene.heightPx}`;
    if (svg.getAttribute("viewBox") !== viewBox) svg.setAttribute("viewBox", viewBox);
    dom.update(scene);
  };
}
