// A fixed small project for the plot tests (invented curves generated from formulas, textbook E/N values),
// and helpers to read path data and text back out of a scene.
import type { Curve, Model, Project } from "../../src/project/types";
import type { PathNode, Scene, SceneNode, TextNode } from "../../src/plot/scene-types";
import { mulberry32 } from "../../src/project/demo";
import { pathShape, type Shape } from "../../src/plot/occupancy";

/** Deterministic 32-bit generator (the demo's mulberry32), so fixtures and property tests are reproducible. */
export const rng = mulberry32;

export function model(partial: Partial<Model> & Pick<Model, "id" | "eOverNMin">): Model {
  return {
    label: `E/N = ${partial.eOverNMin}`,
    kind: partial.eOverNMax === undefined || partial.eOverNMax === partial.eOverNMin ? "line" : "interval",
    eOverNMax: partial.eOverNMin,
    members: [],
    setDraw: "extremes",
    setShare: 0.68,
    source: { kind: "typed" },
    colour: "#117A8B",
    lineStyle: "solid",
    fillOpacity: 0.25,
    visible: true,
    sigmas: 0,
    ...partial,
  };
}

export function curve(partial: Partial<Curve> & Pick<Curve, "id" | "massEv" | "gInvGeV">): Curve {
  return {
    label: `Curve ${partial.id} (invented)`,
    role: "exclusion",
    keepOrder: false,
    colour: "#D55E00",
    lineStyle: "solid",
    fillOpacity: 0.3,
    exclusionMark: "hatch",
    visible: true,
    rescale: { rhoAssumed: 0.45, rhoShown: 0.45, fraction: 1 },
    citation: "invented for the tests",
    fileName: `${partial.id}.csv`,
    ...partial,
  };
}

/** An invented exclusion dip, a smooth projection and a closed region (all formula-made, seeded noise). */
export function fixtureCurves(): Curve[] {
  const r = rng(7);
  const n = 300;
  const m1 = new Float64Array(n);
  const g1 = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const x = -5.6 + (1.2 * i) / (n - 1);
    m1[i] = 10 ** x;
    g1[i] = 10 ** (-13.5 + 2.5 * ((x + 5) / 0.6) ** 2 + 0.1 * (r() - 0.5));
  }
  const m2 = new Float64Array(120);
  const g2 = new Float64Array(120);
  for (let i = 0; i < 120; i++) {
    const x = -6.5 + (3 * i) / 119;
    m2[i] = 10 ** x;
    g2[i] = 10 ** (-15.2 + 0.4 * Math.cos(1.5 * (x + 5)) + 0.5 * (x + 6.5));
  }
  const m3 = new Float64Array(90);
  const g3 = new Float64Array(90);
  for (let i = 0; i < 90; i++) {
    const t = (2 * Math.PI * i) / 90;
    m3[i] = 10 ** (-3.2 + 0.35 * Math.cos(t));
    g3[i] = 10 ** (-11 + 0.3 * Math.sin(t) * (1 + 0.05 * Math.sin(7 * t)));
  }
  return [
    curve({ id: "dip", label: "Test dip (invented)", role: "exclusion", massEv: m1, gInvGeV: g1, colour: "#D55E00" }),
    curve({
      id: "reach",
      label: "Test reach (invented)",
      role: "projection",
      massEv: m2,
      gInvGeV: g2,
      colour: "#CC79A7",
      lineStyle: "dashed",
    }),
    curve({
      id: "blob",
      label: "Test region (invented)",
      role: "region",
      massEv: m3,
      gInvGeV: g3,
      colour: "#009E73",
      keepOrder: true,
    }),
  ];
}

export function fixtureProject(): Project {
  return {
    version: 2,
    name: "plot fixture",
    physics: {
      ref: "2019",
      custom: { cGamma: 1.92, cGammaSigma: 0.04, kMuEv: 5.691, kMuEvSigma: 0.051, label: "custom" },
    },
    models: [
      model({ id: "ksvz", label: "KSVZ-type, E/N = 0", eOverNMin: "0", colour: "#117A8B" }),
      model({ id: "dfsz", label: "DFSZ-type, E/N = 8/3", eOverNMin: "8/3", colour: "#1F4E8C", lineStyle: "dashed" }),
      // The window of Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801: the region between two lines.
      model({
        id: "window",
        label: "Window",
        kind: "between",
        eOverNMin: "5/3",
        eOverNMax: "44/3",
        members: [
          { eOverN: "5/3", count: 1 },
          { eOverN: "44/3", count: 1 },
        ],
        colour: "#2A9D8F",
        fillOpacity: 0.2,
        sigmas: 1,
      }),
      // An interval holding c_γ = 1.92: it reaches g = 0 (cancellation).
      model({
        id: "interval",
        label: "Interval, E/N = 1..3",
        kind: "interval",
        eOverNMin: "1",
        eOverNMax: "3",
        colour: "#4062BB",
        fillOpacity: 0.15,
      }),
    ],
    curves: fixtureCurves(),
    figure: {
      preset: "slide",
      customWidthMm: 120,
      customHeightMm: 80,
      massRangeEv: [1e-7, 1e-2],
      yRange: [1e-17, 1e-9],
      yView: "coupling",
      topAxis: "fa",
      grid: true,
      legend: "bottom-right",
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

/** Every node of a scene (all layers) or of one layer. */
export function nodes(scene: Scene, layer?: string): SceneNode[] {
  return scene.layers.filter((l) => !layer || l.id === layer).flatMap((l) => l.nodes);
}

export function paths(scene: Scene, layer?: string): PathNode[] {
  return nodes(scene, layer).filter((n): n is PathNode => n.kind === "path");
}

export function textNodes(scene: Scene, layer?: string): TextNode[] {
  return nodes(scene, layer).filter((n): n is TextNode => n.kind === "text");
}

export function textOf(n: TextNode): string {
  return n.runs.map((r) => r.text).join("");
}

/**
 * Subpaths of path data as absolute point lists. Reads the commands the scene writes: M L H V Z (absolute)
 * and m l h v z (relative), numbers with or without separators before a minus sign.
 */
export function parsePath(d: string): { points: [number, number][]; closed: boolean }[] {
  const out: { points: [number, number][]; closed: boolean }[] = [];
  const re = /([MLHVZmlhvz])([^MLHVZmlhvz]*)/g;
  let cur: { points: [number, number][]; closed: boolean } | null = null;
  let x = 0;
  let y = 0;
  let m: RegExpExecArray | null;
  while ((m = re.exec(d))) {
    const cmd = m[1];
    const nums = (m[2].match(/-?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?/gi) ?? []).map(Number);
    const rel = cmd === cmd.toLowerCase();
    const C = cmd.toUpperCase();
    if (C === "Z") {
      if (cur) cur.closed = true;
      continue;
    }
    const step = C === "H" || C === "V" ? 1 : 2;
    for (let i = 0; i < nums.length; i += step) {
      if (C === "H") x = rel ? x + nums[i] : nums[i];
      else if (C === "V") y = rel ? y + nums[i] : nums[i];
      else {
        x = rel ? x + nums[i] : nums[i];
        y = rel ? y + nums[i + 1] : nums[i + 1];
      }
      if (C === "M" && i === 0) {
        cur = { points: [[x, y]], closed: false };
        out.push(cur);
      } else cur?.points.push([x, y]);
    }
  }
  return out;
}

/**
 * Scene nodes as the legend placement's shapes: path data read with {@link parsePath} (the reference reader
 * above), painted as pathShape decides; other nodes (text, rects) are left out.
 */
export function shapesOf(list: readonly SceneNode[]): Shape[] {
  return list
    .filter((n): n is PathNode => n.kind === "path")
    .map((n) =>
      pathShape(
        n,
        parsePath(n.d).map((s) => ({
          xs: s.points.map((p) => p[0]),
          ys: s.points.map((p) => p[1]),
          closed: s.closed,
        })),
      ),
    );
}

/** The projects behind the figure goldens: the fixture at every size preset, and a normalized view with a frequency axis. */
export function goldenVariants(): [string, Project][] {
  const out: [string, Project][] = [];
  for (const preset of ["slide", "single-column", "double-column", "custom"] as const) {
    const p = fixtureProject();
    p.figure.preset = preset;
    out.push([preset, p]);
  }
  const n = fixtureProject();
  n.figure.preset = "double-column";
  n.figure.yView = "normalized";
  n.figure.yRange = [1e-2, 1e3];
  n.figure.topAxis = "frequency";
  n.figure.legend = "outside-right";
  n.figure.title = "Normalized view";
  out.push(["normalized-frequency", n]);
  return out;
}
