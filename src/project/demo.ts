// The demo state a new visitor sees: three textbook model lines/bands and four invented curves from an
// imaginary haloscope network ("the demo network"). No experiment's data: every curve is generated here.
import { gAgg } from "../physics/coupling";
import { defaultFigure, defaultPhysics, newCurve, newModel, MODEL_COLOURS, CURVE_COLOURS } from "./defaults";
import { PROJECT_VERSION, type Curve, type Model, type Project } from "./types";

/** Citation every demo curve carries, so no one mistakes it for a measurement. */
export const DEMO_CITATION = "invented for the axband demo; not data from any experiment";

/**
 * mulberry32, a small 32-bit seeded generator (public-domain algorithm by Tommy Ettinger): the same seed
 * gives the same stream on every JavaScript engine, because it uses only 32-bit integer arithmetic.
 * @returns a function giving uniform numbers in [0, 1).
 */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Rounded to 4 significant digits, like a digitised published curve (and compact in links). */
function sig4(x: number): number {
  return Number(x.toPrecision(4));
}

function toCurveData(points: [number, number][]): { massEv: Float64Array; gInvGeV: Float64Array } {
  return {
    massEv: Float64Array.from(points, (p) => sig4(p[0])),
    gInvGeV: Float64Array.from(points, (p) => sig4(p[1])),
  };
}

// Off the top of the default figure (10⁻⁹ GeV⁻¹): where an exclusion curve "leaves" the plot between scans.
const G_OFF_TOP = 1e-8;

/**
 * Haloscope-like exclusion: narrow scan windows between 1.5 μeV and 40 μeV, each reaching 1–4× the
 * KSVZ-type coupling with scan-to-scan noise, and rising off the plot between windows.
 */
function cavityRuns(): [number, number][] {
  const rand = mulberry32(20240611);
  const pts: [number, number][] = [];
  const windows: [number, number, number][] = [
    // [log10 m start, log10 m end, depth as a multiple of the E/N = 0 line]
    [-5.82, -5.74, 3.2],
    [-5.6, -5.45, 1.6],
    [-5.3, -5.22, 2.5],
    [-5.05, -4.85, 1.2],
    [-4.7, -4.62, 3.8],
    [-4.5, -4.4, 2.1],
  ];
  for (const [lo, hi, depth] of windows) {
    const n = 45;
    pts.push([10 ** lo, G_OFF_TOP]);
    for (let i = 0; i <= n; i++) {
      const m = 10 ** (lo + ((hi - lo) * i) / n);
      // A scan is least sensitive at its edges: the limit rises towards both ends.
      const u = (2 * i) / n - 1;
      const edge = 1 + 1.5 * u ** 8;
      const noise = 1 + 0.35 * (rand() - 0.5);
      pts.push([m, depth * edge * noise * gAgg(m, 0)]);
    }
    pts.push([10 ** hi, G_OFF_TOP]);
  }
  return pts;
}

/** Broadband exclusion at higher masses (40 μeV – 1 meV) near 3·10⁻¹² GeV⁻¹ with slow ripples and noise. */
function dishBound(): [number, number][] {
  const rand = mulberry32(7051);
  const pts: [number, number][] = [];
  const lo = -4.4;
  const hi = -3.0;
  const n = 240;
  pts.push([10 ** lo, G_OFF_TOP]);
  for (let i = 0; i <= n; i++) {
    const x = lo + ((hi - lo) * i) / n;
    const ripple = 1 + 0.25 * Math.sin(17 * x) + 0.12 * Math.sin(53 * x);
    const u = (2 * i) / n - 1;
    pts.push([10 ** x, 3e-12 * ripple * (1 + 4 * u ** 12) * (1 + 0.2 * (rand() - 0.5))]);
  }
  pts.push([10 ** hi, G_OFF_TOP]);
  return pts;
}

/** Projected reach of an upgrade: a smooth line from 1 μeV to 300 μeV, touching below the E/N = 8/3 line mid-range. */
function upgradeReach(): [number, number][] {
  const pts: [number, number][] = [];
  const lo = -6.0;
  const hi = -3.5;
  const n = 200;
  for (let i = 0; i <= n; i++) {
    const x = lo + ((hi - lo) * i) / n;
    const m = 10 ** x;
    const w = (x - -4.9) / 0.9;
    pts.push([m, 0.7 * gAgg(m, 8 / 3) * (1 + w ** 4)]);
  }
  return pts;
}

/** A closed "candidate region" around 2.5 meV and 2.5·10⁻¹¹ GeV⁻¹: a jittered, tilted ellipse in log–log. */
function candidateRegion(): [number, number][] {
  const rand = mulberry32(424242);
  const pts: [number, number][] = [];
  const n = 180;
  const [cx, cy, ax, ay, tilt] = [-2.6, -10.6, 0.28, 0.22, 0.5];
  for (let i = 0; i < n; i++) {
    const t = (2 * Math.PI * i) / n;
    const r = 1 + 0.06 * (rand() - 0.5);
    const ex = ax * r * Math.cos(t);
    const ey = ay * r * Math.sin(t);
    const x = cx + ex * Math.cos(tilt) - ey * Math.sin(tilt);
    const y = cy + ex * Math.sin(tilt) + ey * Math.cos(tilt);
    pts.push([10 ** x, 10 ** y]);
  }
  return pts;
}

/** The four invented curves of the demo network (exclusion ×2, projection, region). */
export function demoCurves(): Curve[] {
  const specs: {
    id: string;
    label: string;
    role: Curve["role"];
    pts: [number, number][];
    keepOrder: boolean;
    fileName: string;
  }[] = [
    {
      id: "demo-cavity",
      label: "Demo network: cavity runs (invented)",
      role: "exclusion",
      pts: cavityRuns(),
      keepOrder: false,
      fileName: "demo-cavity-runs.csv",
    },
    {
      id: "demo-dish",
      label: "Demo network: dish antenna bound (invented)",
      role: "exclusion",
      pts: dishBound(),
      keepOrder: false,
      fileName: "demo-dish-bound.csv",
    },
    {
      id: "demo-reach",
      label: "Demo network: upgrade reach (invented)",
      role: "projection",
      pts: upgradeReach(),
      keepOrder: false,
      fileName: "demo-upgrade-reach.csv",
    },
    {
      id: "demo-region",
      label: "Demo network: candidate region (invented)",
      role: "region",
      pts: candidateRegion(),
      keepOrder: true,
      fileName: "demo-candidate-region.csv",
    },
  ];
  return specs.map((s, i) =>
    newCurve({
      id: s.id,
      label: s.label,
      role: s.role,
      keepOrder: s.keepOrder,
      colour: CURVE_COLOURS[i],
      citation: DEMO_CITATION,
      fileName: s.fileName,
      ...toCurveData(s.pts),
    }),
  );
}

/**
 * The demo models: a KSVZ-type line, a DFSZ-type line and the preferred window of heavy-quark models, drawn as
 * the region between the E/N = 5/3 and E/N = 44/3 lines (Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801).
 */
export function demoModels(): Model[] {
  return [
    newModel({ id: "ksvz", label: "KSVZ-type, E/N = 0", eOverNMin: "0", colour: MODEL_COLOURS[0] }),
    newModel({ id: "dfsz", label: "DFSZ-type, E/N = 8/3", eOverNMin: "8/3", colour: MODEL_COLOURS[1] }),
    newModel({
      id: "window",
      label: "Heavy-quark window",
      kind: "between",
      members: [
        { eOverN: "5/3", count: 1 },
        { eOverN: "44/3", count: 1 },
      ],
      colour: MODEL_COLOURS[2],
      fillOpacity: 0.2,
    }),
  ];
}

/** The state a first visit starts from: demo models and invented curves over the default figure and constants. */
export function defaultProject(): Project {
  return {
    version: PROJECT_VERSION,
    name: "axband demo",
    physics: defaultPhysics(),
    models: demoModels(),
    curves: demoCurves(),
    figure: defaultFigure(),
  };
}
