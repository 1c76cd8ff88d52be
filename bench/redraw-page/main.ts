// Benchmark page: loads the invented benchmark curves, then times zoom steps (buildScene + the app's SceneSvg update +
// forced geometry) against a plain full-resolution draw of the same data. Driven by bench/redraw.mjs.
import { buildScene, massScale, yScale, type PathNode, type Scene } from "../../src/plot/index";
import type { Curve, CurveRole, Model, Project } from "../../src/project/types";
import { createAppRenderer, createSceneDomRenderer } from "./render-app";

interface Manifest {
  curves: { file: string; kind: string; points: number }[];
}

const ROLE: Record<string, CurveRole> = {
  scan: "exclusion",
  plateau: "exclusion",
  projection: "projection",
  region: "region",
};
const COLOURS = ["#D55E00", "#CC79A7", "#E69F00", "#009E73", "#000000", "#56B4E9", "#0072B2", "#F0E442"];

async function loadProject(legend: Project["figure"]["legend"] = "outside-right"): Promise<Project> {
  const manifest: Manifest = await (await fetch("./curves.json")).json();
  const buf = new Float64Array(await (await fetch("./curves.bin")).arrayBuffer());
  let off = 0;
  const curves: Curve[] = manifest.curves.map((c, i) => {
    const massEv = buf.slice(off, off + c.points);
    off += c.points;
    const gInvGeV = buf.slice(off, off + c.points);
    off += c.points;
    const role = ROLE[c.kind] ?? "exclusion";
    return {
      id: `bench-${i}`,
      label: `Bench ${c.kind} ${i} (invented)`,
      role,
      massEv,
      gInvGeV,
      keepOrder: role === "region",
      colour: COLOURS[i % COLOURS.length],
      lineStyle: role === "projection" ? "dashed" : "solid",
      fillOpacity: 0.25,
      exclusionMark: "hatch",
      visible: true,
      rescale: { rhoAssumed: 0.45, rhoShown: 0.45, fraction: 1 },
      citation: "invented benchmark curve",
      fileName: c.file,
    };
  });
  const model = (id: string, min: string, max: string, colour: string): Model => ({
    id,
    label: `E/N = ${min === max ? min : `${min}..${max}`}`,
    kind: min === max ? "line" : "interval",
    eOverNMin: min,
    eOverNMax: max,
    members: [],
    setDraw: "extremes",
    setShare: 0.68,
    source: { kind: "typed" },
    colour,
    lineStyle: "solid",
    fillOpacity: 0.2,
    visible: true,
    sigmas: 0,
  });
  let mLo = Infinity;
  let mHi = 0;
  let gLo = Infinity;
  let gHi = 0;
  for (const c of curves) {
    for (let i = 0; i < c.massEv.length; i++) {
      const m = c.massEv[i];
      const g = c.gInvGeV[i];
      if (m < mLo) mLo = m;
      if (m > mHi) mHi = m;
      if (g < gLo) gLo = g;
      if (g > gHi) gHi = g;
    }
  }
  return {
    version: 2,
    name: "redraw benchmark",
    physics: {
      ref: "2019",
      custom: { cGamma: 1.92, cGammaSigma: 0.04, kMuEv: 5.691, kMuEvSigma: 0.051, label: "custom" },
    },
    models: [
      model("ksvz", "0", "0", "#117A8B"),
      model("dfsz", "8/3", "8/3", "#1F4E8C"),
      model("window", "5/3", "44/3", "#2A9D8F"),
    ],
    curves,
    figure: {
      preset: "slide",
      customWidthMm: 160,
      customHeightMm: 90,
      massRangeEv: [mLo / 1.5, mHi * 1.5],
      yRange: [gLo / 3, gHi * 3],
      yView: "coupling",
      topAxis: "fa",
      grid: true,
      legend,
      legendScale: 1,
      fontPt: 12,
      font: "sans",
      title: "",
      massUnit: "eV",
      frequencyUnit: "auto",
      ticks: "out",
    },
  };
}

/** Mass ranges of a zoom in (×0.8 of the span per step) around the middle, then back out. */
function zoomSequence(full: [number, number], steps: number): [number, number][] {
  const l0 = Math.log10(full[0]);
  const l1 = Math.log10(full[1]);
  const centre = (l0 + l1) / 2 + 0.37;
  const out: [number, number][] = [];
  const half = steps / 2;
  for (let k = 0; k < steps; k++) {
    const depth = k < half ? k : steps - 1 - k;
    const span = (l1 - l0) * 0.8 ** depth;
    out.push([10 ** (centre - span / 2), 10 ** (centre + span / 2)]);
  }
  return out;
}

/** The plain full-resolution draw: every point of every curve through the D3 scales into one path each. */
function plainScene(project: Project, range: [number, number]): Scene {
  const hidden = {
    ...project,
    curves: project.curves.map((c) => ({ ...c, visible: false })),
    figure: { ...project.figure, massRangeEv: range },
  };
  const scene = buildScene(hidden);
  const xs = massScale(scene);
  const ys = yScale(scene);
  const fills: PathNode[] = [];
  const lines: PathNode[] = [];
  project.curves.forEach((c, i) => {
    let order: number[] | null = null;
    if (c.role !== "region") {
      order = Array.from(c.massEv.keys()).sort((a, b) => c.massEv[a] - c.massEv[b]);
    }
    let d = "";
    const n = c.massEv.length;
    for (let k = 0; k < n; k++) {
      const j = order ? order[k] : k;
      d += (k ? "L" : "M") + Math.round(xs(c.massEv[j]) * 100) / 100 + " " + Math.round(ys(c.gInvGeV[j]) * 100) / 100;
    }
    if (c.role === "region")
      fills.push({
        kind: "path",
        id: `curve-${i + 1}-region`,
        d: d + "Z",
        fill: c.colour,
        fillOpacity: 0.25,
        stroke: c.colour,
        strokeWidth: 1.8,
      });
    else {
      if (c.role === "exclusion")
        fills.push({
          kind: "path",
          id: `curve-${i + 1}-fill`,
          d: `${d}L${xs(c.massEv[order![n - 1]])} ${scene.plot.y - 10}L${xs(c.massEv[order![0]])} ${scene.plot.y - 10}Z`,
          fill: c.colour,
          fillOpacity: 0.25,
        });
      lines.push({ kind: "path", id: `curve-${i + 1}-line`, d, stroke: c.colour, strokeWidth: 1.8, fill: "none" });
    }
  });
  const layer = scene.layers.find((l) => l.id === "curves")!;
  layer.nodes = [...fills, ...lines];
  return scene;
}

function median(a: number[]): number {
  const s = [...a].sort((x, y) => x - y);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

export interface BenchResult {
  points: number;
  curves: number;
  steps: number;
  firstDrawMs: number;
  thinned: { buildMs: number; domMs: number; setMs: number; totalMs: number; pathChars: number };
  plain: { buildMs: number; domMs: number; totalMs: number; pathChars: number; steps: number };
  devicePixelRatio: number;
}

async function run(opts: {
  steps: number;
  plainSteps: number;
  legend?: Project["figure"]["legend"];
  warmSteps?: number;
  profile?: boolean;
  repeat?: number;
  renderer?: "app" | "scene-dom";
  strip?: "text" | "curves";
  settleMs?: number;
  look?: "nofill" | "nostroke" | "noclip" | "noopacity" | "nodash" | "thin" | "boxfill";
}): Promise<BenchResult> {
  const project = await loadProject(opts.legend);
  const host = document.getElementById("plot")!;
  host.textContent = "";
  // The app's renderer by default: what the figure does on every zoom step.
  const render = opts.renderer === "scene-dom" ? createSceneDomRenderer(host) : createAppRenderer(host);
  const sync = () => (host.querySelector("#bench-curves") as SVGGElement | null)?.getBBox();
  // repeat > 1 runs the same zoom sequence again (for profiling: more samples of the same steps).
  const ranges = Array.from({ length: opts.repeat ?? 1 }, () =>
    zoomSequence(project.figure.massRangeEv, opts.steps),
  ).flat();
  const resolution = window.devicePixelRatio || 1;
  const at = (r: [number, number]): Project => ({ ...project, figure: { ...project.figure, massRangeEv: r } });
  const pathChars = (s: Scene) =>
    s.layers.reduce((n, l) => n + l.nodes.reduce((k, nd) => k + (nd.kind === "path" ? nd.d.length : 0), 0), 0);

  let t = performance.now();
  // As the figure draws: dense columns as envelopes.
  const resting = buildScene(at(ranges[0]), { resolution, envelope: true });
  render(resting);
  // The zoom steps are one gesture: an automatic legend keeps this first frame's place meanwhile, as the app's
  // figure holds it (useFigureGestures, LEGEND_HOLD_MS); a fixed place is unaffected.
  const holdLegend = resting.autoLegendPlace;
  sync();
  const firstDrawMs = performance.now() - t;
  // Warm-up: the whole zoom sequence once, unmeasured, so that the steps below run the engine's optimised
  // code as a figure in use does (and the unsorted curves' thinning levels of this sequence exist; they
  // are built on the first visit of a zoom level and reused).
  for (const r of ranges.slice(0, opts.warmSteps ?? ranges.length)) {
    render(buildScene(at(r), { resolution, holdLegend, envelope: true }));
    sync();
    await new Promise((res) => requestAnimationFrame(() => res(null)));
  }

  const b: number[] = [];
  const set: number[] = [];
  const d: number[] = [];
  const tot: number[] = [];
  const chars: number[] = [];
  // Marks for a trace of this run (bench/redraw.mjs counts the painting between them).
  performance.mark("axband-zoom-start");
  // Diagnostics: a CPU profile of the zoom steps alone (read over the DevTools protocol, Profiler domain).
  if (opts.profile) console.profile("axband-zoom");
  for (const r of ranges) {
    const t0 = performance.now();
    const scene = buildScene(at(r), { resolution, holdLegend, envelope: true });
    // Diagnostics: leave out all text or all curves before drawing (the build time above stays whole).
    if (opts.strip)
      for (const l of scene.layers)
        l.nodes = l.nodes.filter((n) => (opts.strip === "text" ? n.kind !== "text" : l.id !== "curves"));
    // Diagnostics: how the look of the curves changes the browser's painting (raster) cost.
    if (opts.look) {
      for (const l of scene.layers) {
        if (opts.look === "noclip") l.clip = false;
        if (l.id !== "curves") continue;
        const boxes: PathNode[] = [];
        for (const nd of l.nodes) {
          if (nd.kind !== "path") continue;
          // The same fills as plain boxes of half the plot (what filling costs apart from the curve's edges).
          if (opts.look === "boxfill" && nd.stroke && nd.fill && nd.fill !== "none") {
            const { x, y, w, h } = scene.plot;
            boxes.push({
              kind: "path",
              id: `${nd.id}-box`,
              d: `M${x} ${y}h${w}v${h / 2}h${-w}Z`,
              fill: nd.fill,
              fillOpacity: nd.fillOpacity,
            });
            nd.fill = "none";
          }
          if (opts.look === "nofill" && nd.stroke) nd.fill = "none";
          if (opts.look === "nostroke" && nd.fill && nd.fill !== "none") nd.stroke = undefined;
          if (opts.look === "noopacity" && nd.fillOpacity !== undefined) nd.fillOpacity = 1;
          if (opts.look === "nodash") nd.dash = undefined;
          if (opts.look === "thin" && nd.strokeWidth) nd.strokeWidth = 1;
        }
        l.nodes = [...boxes, ...l.nodes];
      }
    }
    const t1 = performance.now();
    render(scene);
    const tSet = performance.now();
    sync();
    const t2 = performance.now();
    set.push(tSet - t1);
    b.push(t1 - t0);
    d.push(t2 - t1);
    tot.push(t2 - t0);
    chars.push(pathChars(scene));
    await new Promise((res) => requestAnimationFrame(() => res(null)));
    // Diagnostics: let the compositor finish painting the frame before the next step.
    if (opts.settleMs) await new Promise((res) => setTimeout(res, opts.settleMs));
  }

  if (opts.profile) console.profileEnd("axband-zoom");
  performance.mark("axband-zoom-end");
  const pb: number[] = [];
  const pd: number[] = [];
  const pt: number[] = [];
  const pc: number[] = [];
  const stride = Math.max(1, Math.floor(ranges.length / opts.plainSteps));
  for (let k = 0; k < ranges.length && pt.length < opts.plainSteps; k += stride) {
    t = performance.now();
    const scene = plainScene(project, ranges[k]);
    const t1 = performance.now();
    render(scene);
    sync();
    const t2 = performance.now();
    pb.push(t1 - t);
    pd.push(t2 - t1);
    pt.push(t2 - t);
    pc.push(pathChars(scene));
    await new Promise((res) => requestAnimationFrame(() => res(null)));
  }
  (window as unknown as { benchSteps: unknown }).benchSteps = ranges.map((r, i) => ({
    span: Math.log10(r[1] / r[0]),
    build: b[i],
    set: set[i],
    dom: d[i],
    chars: chars[i],
  }));
  return {
    points: project.curves.reduce((n, c) => n + c.massEv.length, 0),
    curves: project.curves.length,
    steps: ranges.length,
    firstDrawMs,
    thinned: {
      buildMs: median(b),
      domMs: median(d),
      setMs: median(set),
      totalMs: median(tot),
      pathChars: median(chars),
    },
    plain: { buildMs: median(pb), domMs: median(pd), totalMs: median(pt), pathChars: median(pc), steps: pt.length },
    devicePixelRatio: resolution,
  };
}

(window as unknown as { runBench: typeof run }).runBench = run;

/**
 * Continuous zoom as a trackpad gives it: one zoom step per animation frame, built and handed to the app's
 * figure component inside the frame callback (as the figure's gesture handler batches wheel events per frame),
 * with no forced layout, so the browser paces the steps by the frames it manages to paint. Frames per second =
 * steps / elapsed time; bench/redraw.mjs also counts the frames the compositor drew in a trace.
 */
async function continuous(opts: {
  steps: number;
  legend?: Project["figure"]["legend"];
  envelope?: boolean;
  /** Diagnostics: draw only the curves of these kinds (scan, plateau, projection, region). */
  kinds?: string[];
}): Promise<{ steps: number; elapsedMs: number; fps: number; buildMs: number; renderMs: number }> {
  const project = await loadProject(opts.legend);
  const kinds = opts.kinds;
  if (kinds) project.curves = project.curves.filter((c) => kinds.some((k) => c.fileName.includes(k)));
  const host = document.getElementById("plot")!;
  host.textContent = "";
  const render = createAppRenderer(host);
  const ranges = zoomSequence(project.figure.massRangeEv, opts.steps);
  const resolution = window.devicePixelRatio || 1;
  const at = (r: [number, number]): Project => ({ ...project, figure: { ...project.figure, massRangeEv: r } });
  const frame = () => new Promise<number>((res) => requestAnimationFrame(res));
  const resting = buildScene(at(ranges[0]), { resolution, envelope: opts.envelope });
  render(resting);
  const holdLegend = resting.autoLegendPlace;
  const step = (r: [number, number], times?: { b: number[]; d: number[] }) => {
    const t0 = performance.now();
    const scene = buildScene(at(r), { resolution, holdLegend, envelope: opts.envelope });
    const t1 = performance.now();
    render(scene);
    times?.b.push(t1 - t0);
    times?.d.push(performance.now() - t1);
  };
  // Warm-up: the sequence once (optimised code, thinning levels built), then a rest for the last paints.
  for (const r of ranges) {
    await frame();
    step(r);
  }
  await new Promise((res) => setTimeout(res, 500));
  const times = { b: [] as number[], d: [] as number[] };
  await frame();
  performance.mark("axband-continuous-start");
  const t0 = performance.now();
  for (const r of ranges) {
    await frame();
    step(r, times);
  }
  // The last step's frame: wait for the next frame callback, which follows its paint.
  await frame();
  const elapsedMs = performance.now() - t0;
  performance.mark("axband-continuous-end");
  return {
    steps: ranges.length,
    elapsedMs,
    fps: (ranges.length * 1000) / elapsedMs,
    buildMs: median(times.b),
    renderMs: median(times.d),
  };
}
(window as unknown as { continuous: typeof continuous }).continuous = continuous;

/** Diagnostics: the fastest of `reps` builds of the scene at each depth of the zoom sequence (no drawing). */
async function buildOnly(opts: { reps: number; depths: number[] }): Promise<{ depth: number; ms: number }[]> {
  const project = await loadProject();
  const ranges = zoomSequence(project.figure.massRangeEv, 40);
  buildScene(project);
  return opts.depths.map((depth) => {
    const p = { ...project, figure: { ...project.figure, massRangeEv: ranges[depth] } };
    let best = Infinity;
    for (let k = 0; k < opts.reps; k++) {
      const t = performance.now();
      buildScene(p);
      best = Math.min(best, performance.now() - t);
    }
    return { depth, ms: best };
  });
}
(window as unknown as { buildOnly: typeof buildOnly }).buildOnly = buildOnly;
document.body.dataset.ready = "1";

/** DOM-only timing (diagnostics): prebuilt scenes put into a fresh <svg>, optionally with parts stripped. */
async function domOnly(opts: {
  steps: number;
  strip?: "text" | "fill" | "stroke" | "clip" | "legend-text" | "axes-text" | "curves";
}): Promise<{ setMs: number; domMs: number }> {
  const project = await loadProject();
  const host = document.createElement("div");
  document.body.appendChild(host);
  const render = createSceneDomRenderer(host);
  const ranges = zoomSequence(project.figure.massRangeEv, opts.steps);
  const scenes = ranges.map((r) => {
    const s = buildScene({ ...project, figure: { ...project.figure, massRangeEv: r } });
    for (const l of s.layers) {
      if (opts.strip === "text") l.nodes = l.nodes.filter((n) => n.kind !== "text");
      if (opts.strip === "legend-text" && l.id === "legend") l.nodes = l.nodes.filter((n) => n.kind !== "text");
      if (opts.strip === "axes-text" && l.id === "axes") l.nodes = l.nodes.filter((n) => n.kind !== "text");
      if (opts.strip === "curves" && l.id === "curves") l.nodes = [];
      if (opts.strip === "clip") l.clip = false;
      for (const n of l.nodes) {
        if (n.kind !== "path") continue;
        if (opts.strip === "fill" && n.stroke) n.fill = "none";
        if (opts.strip === "stroke" && n.fill && n.fill !== "none") n.stroke = undefined;
      }
    }
    return s;
  });
  const sync = () => (host.querySelector("#bench-curves") as SVGGElement | null)?.getBBox();
  render(scenes[0]);
  sync();
  const set: number[] = [];
  const dom: number[] = [];
  for (const s of scenes) {
    const t0 = performance.now();
    render(s);
    const t1 = performance.now();
    sync();
    const t2 = performance.now();
    set.push(t1 - t0);
    dom.push(t2 - t0);
    await new Promise((res) => requestAnimationFrame(() => res(null)));
  }
  host.remove();
  return { setMs: median(set), domMs: median(dom) };
}
(window as unknown as { domOnly: typeof domOnly }).domOnly = domOnly;
