// The on-screen figure: the scene renderer (scene-dom.ts inside SceneSvg) draws exactly the elements and
// attributes the SVG writer writes (one scene, two outputs, so the export matches the screen),
// also after updating in place from one scene to the next, keyboard zoom and reset go
// through the store, and zooming does not re-render the sidebar panels (zustand's documented selector model:
// a component re-renders only when the slice it selects changes).
import { beforeEach, describe, expect, onTestFinished, test, vi } from "vitest";
import { Profiler } from "react";
import { act, fireEvent, render, screen } from "@testing-library/react";
import { buildScene } from "../../src/plot/scene";
import { writeSvg } from "../../src/plot/svg";
import { defaultProject } from "../../src/project/demo";
import { SceneSvg } from "../../src/ui/figure/SceneSvg";
import { FigureView } from "../../src/ui/figure/FigureView";
import { LEGEND_HOLD_MS } from "../../src/ui/figure/useFigureGestures";
import { newCurve } from "../../src/project/defaults";
import { ModelsPanel } from "../../src/ui/models/ModelsPanel";
import { FigureSettings } from "../../src/ui/settings/FigureSettings";
import { ConstantsPanel } from "../../src/ui/settings/ConstantsPanel";
import { useAxband } from "../../src/ui/store";
import { resetStore } from "./helpers";

beforeEach(() => resetStore(defaultProject()));

interface El {
  tag: string;
  attrs: Record<string, string>;
  text: string;
  children: El[];
}

function tree(node: Element): El {
  const attrs: Record<string, string> = {};
  for (const a of Array.from(node.attributes)) attrs[a.name] = a.value;
  const tag = node.tagName.toLowerCase();
  const raw = Array.from(node.childNodes)
    .filter((c) => c.nodeType === 3)
    .map((c) => c.textContent)
    .join("");
  // The writer puts newlines between elements; only text inside <text>/<tspan> is drawn.
  const text = tag === "text" || tag === "tspan" ? raw : raw.trim();
  return { tag, attrs, text, children: Array.from(node.children).map(tree) };
}

function parse(svgText: string): Element {
  return new DOMParser().parseFromString(svgText, "image/svg+xml").documentElement;
}

const nextFrame = () => act(() => new Promise<void>((r) => requestAnimationFrame(() => r())));

describe("screen and export agree", () => {
  test.each([
    ["the demo project", () => defaultProject()],
    [
      "normalized view, frequency top axis, legend outside, a spread, a highlight",
      () => {
        const p = defaultProject();
        p.figure = {
          ...p.figure,
          yView: "normalized",
          yRange: [1e-2, 1e2],
          topAxis: "frequency",
          legend: "outside-right",
          title: "A <title> & more",
        };
        p.models[0] = { ...p.models[0], sigmas: 2, lineStyle: "dashed" };
        return p;
      },
    ],
  ])("%s: every element and attribute on screen equals the writer's, also after updates in place", (_name, make) => {
    const project = make();
    const opts = { widthPx: 960, heightPx: 540, resolution: 1, physical: false } as const;
    const scene = buildScene(project, {
      ...opts,
      highlight: { massMinEv: 1e-5, massMaxEv: 1e-4, modelId: project.models[0].id },
    });
    // A different scene first (other range, no highlight, legend elsewhere), so the final one is an update.
    const other = buildScene(
      { ...project, figure: { ...project.figure, massRangeEv: [3e-9, 2e-3], legend: "top-left", title: "" } },
      opts,
    );
    const { container, rerender } = render(
      <SceneSvg scene={other} idPrefix="t-">
        <rect data-testid="overlay-mark" />
      </SceneSvg>,
    );
    rerender(
      <SceneSvg scene={scene} idPrefix="t-">
        <rect data-testid="overlay-mark" />
      </SceneSvg>,
    );
    const svg = container.querySelector("svg")!;
    // The screen-only overlays sit in one group after the scene; the rest must be the writer's content.
    const overlay = svg.querySelector(":scope > g[data-overlay]")!;
    expect(overlay.querySelector("[data-testid=overlay-mark]")).not.toBeNull();
    expect(svg.lastElementChild).toBe(overlay);
    overlay.remove();
    const fromWriter = tree(parse(writeSvg(scene, { idPrefix: "t-" })));
    const fromScreen = tree(svg);
    // Root attributes differ on purpose (the export has a physical size); the content must not.
    expect(fromScreen.attrs.viewBox).toBe(fromWriter.attrs.viewBox);
    expect(fromScreen.attrs["font-family"]).toBe(fromWriter.attrs["font-family"]);
    expect(fromScreen.children).toEqual(fromWriter.children);
    expect(fromScreen.children.length).toBeGreaterThan(5);
  });
});

describe("FigureView", () => {
  test("exposes the scales as data attributes, and keyboard zoom/reset goes through the store", async () => {
    render(<FigureView />);
    const svg = screen.getByTestId("plot").querySelector("svg")!;
    const f0 = useAxband.getState().project.figure;
    expect(svg.getAttribute("data-mass-domain")).toBe(`${f0.massRangeEv[0]},${f0.massRangeEv[1]}`);
    expect(svg.getAttribute("data-y-domain")).toBe(`${f0.yRange[0]},${f0.yRange[1]}`);
    expect(svg.getAttribute("data-plot-box")?.split(",").map(Number)).toHaveLength(4);
    expect(svg.querySelector('[data-testid="legend"]')).not.toBeNull();
    fireEvent.keyDown(svg, { key: "+" });
    fireEvent.keyDown(svg, { key: "+" });
    await nextFrame();
    const f1 = useAxband.getState().project.figure;
    const span = (r: [number, number]) => Math.log10(r[1] / r[0]);
    // Two presses within one frame are batched into one commit: 1.25² narrower.
    expect(span(f1.massRangeEv)).toBeCloseTo(span(f0.massRangeEv) / 1.25 ** 2, 9);
    expect(useAxband.getState().history.past).toHaveLength(1);
    fireEvent.keyDown(svg, { key: "0" });
    expect(useAxband.getState().project.figure.massRangeEv).toEqual(f0.massRangeEv);
  });

  test("an automatic legend holds its place while the view moves, and is placed afresh once the view rests", async () => {
    // An invented block over the top of the right part of the mass range: the legend starts top left. Panned
    // three decades to the right, the block sits top left and the free corner is top right.
    const p = defaultProject();
    p.models = [];
    p.curves = [
      newCurve({
        id: "block",
        label: "Block (invented)",
        role: "region",
        keepOrder: true,
        massEv: Float64Array.from([1e-4, 1e-2, 1e-2, 1e-4]),
        gInvGeV: Float64Array.from([1e-12, 1e-12, 1e-9, 1e-9]),
      }),
    ];
    p.figure = { ...p.figure, massRangeEv: [1e-7, 1e-2], yRange: [1e-17, 1e-9], legend: "auto" };
    resetStore(p);
    // Only the timeouts are faked: frames stay real (jsdom's requestAnimationFrame).
    vi.useFakeTimers({ toFake: ["setTimeout", "clearTimeout"] });
    onTestFinished(() => {
      vi.useRealTimers();
    });
    render(<FigureView />);
    const svg = screen.getByTestId("plot").querySelector("svg")!;
    const boxX = () => Number(svg.querySelector('rect[id$="legend-box"]')!.getAttribute("x"));
    const plotBox = () => svg.getAttribute("data-plot-box")!.split(",").map(Number);
    const [px, , pw] = plotBox();
    const start = boxX();
    expect(start).toBeLessThan(px + pw / 2);
    for (let k = 0; k < 6; k++) fireEvent.keyDown(svg, { key: "ArrowRight" });
    await nextFrame();
    const f = useAxband.getState().project.figure;
    expect(Math.log10(f.massRangeEv[0])).toBeCloseTo(-4, 6);
    // Moved, but the legend stays where it was...
    expect(boxX()).toBe(start);
    // ...until the view has rested: then it goes where a fresh placement puts it, as the export would.
    // The rest timer runs on fake time (no race with a real 300 ms timer on a busy machine).
    await act(() => vi.advanceTimersByTimeAsync(LEGEND_HOLD_MS - 1));
    expect(boxX()).toBe(start);
    await act(() => vi.advanceTimersByTimeAsync(1));
    const rested = boxX();
    expect(rested).toBeGreaterThan(px + pw / 2);
    const fresh = buildScene(useAxband.getState().project, { physical: false });
    expect(fresh.autoLegendPlace).toBe("top-right");
  });

  test("zooming re-renders the figure but not the models, constants or figure-settings panels (except the ranges)", async () => {
    const renders: Record<string, number> = {};
    const count = (id: string) => {
      renders[id] = (renders[id] ?? 0) + 1;
    };
    render(
      <>
        <Profiler id="models" onRender={count}>
          <ModelsPanel />
        </Profiler>
        <Profiler id="constants" onRender={count}>
          <ConstantsPanel />
        </Profiler>
        <Profiler id="settings" onRender={count}>
          <FigureSettings />
        </Profiler>
        <Profiler id="figure" onRender={count}>
          <FigureView />
        </Profiler>
      </>,
    );
    // The catalogue loads apart from the first figure: count from when it is in.
    await screen.findByTestId("catalogue-add-set");
    const before = { ...renders };
    await act(async () => {
      useAxband.getState().setView([1e-6, 1e-3], [1e-15, 1e-10]);
    });
    expect(renders.figure).toBeGreaterThan(before.figure);
    expect(renders.models).toBe(before.models);
    expect(renders.constants).toBe(before.constants);
    // Only the range fields inside the settings follow the view.
    expect(screen.getByTestId("range-mass-min")).toHaveValue("1e-6");
  });

  test("typed axis ranges: a bad range gives a message and keeps the previous one", async () => {
    render(<FigureSettings />);
    const min = screen.getByTestId("range-mass-min");
    const max = screen.getByTestId("range-mass-max");
    fireEvent.change(min, { target: { value: "1e-3" } });
    fireEvent.change(max, { target: { value: "1e-5" } });
    fireEvent.keyDown(max, { key: "Enter" });
    expect(screen.getByText(/min must be less than max/)).toBeInTheDocument();
    expect(useAxband.getState().project.figure.massRangeEv).toEqual([1e-7, 1e-2]);
    fireEvent.change(min, { target: { value: "-1" } });
    fireEvent.keyDown(min, { key: "Enter" });
    expect(screen.getByText(/must be positive/)).toBeInTheDocument();
    fireEvent.change(min, { target: { value: "1e-6" } });
    fireEvent.change(max, { target: { value: "1e-3" } });
    fireEvent.keyDown(max, { key: "Enter" });
    expect(useAxband.getState().project.figure.massRangeEv).toEqual([1e-6, 1e-3]);
  });
});
