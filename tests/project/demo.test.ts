// The demo state and the defaults: textbook E/N values, the Okabe–Ito palette, invented curves that say so,
// physically plausible ranges checked against the published coupling formula, determinism, and the factories.
import { describe, expect, it, vi } from "vitest";
import {
  CURVE_COLOURS,
  DEMO_CITATION,
  MODEL_COLOURS,
  OKABE_ITO,
  OKABE_ITO_BY_NAME,
  defaultProject,
  mulberry32,
  newCurve,
  newModel,
  nextCurveColour,
  nextModelColour,
  projectsEqual,
  rationalValue,
} from "../../src/data/index";
import { gAgg } from "../../src/physics/index";

// Reference numbers, typed from the publications (not imported from src/physics):
// α: CODATA 2018 recommended value. c_γ = 1.92(4): Grilli di Cortona, Hardy, Pardo Vega, Villadoro, JHEP 01 (2016) 034.
// K = 5.691(51) μeV in m_a = K μeV·(10¹² GeV/f_a): Gorghetto & Villadoro, JHEP 03 (2019) 033.
const ALPHA = 7.2973525693e-3;
const C_GAMMA = 1.92;
const K_MU_EV = 5.691;
/** g_aγγ (GeV⁻¹) = α/(2π f_a)·|E/N − c_γ| with f_a = K·10⁶ eV·GeV / m_a (PDG review "Axions and other similar particles"). */
const gRef = (massEv: number, eOverN: number) =>
  (ALPHA / (2 * Math.PI * ((K_MU_EV * 1e6) / massEv))) * Math.abs(eOverN - C_GAMMA);

function hue(hex: string): number {
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255);
  const max = Math.max(r, g, b);
  const d = max - Math.min(r, g, b);
  if (d === 0) return Number.NaN;
  const h = max === r ? ((g - b) / d) % 6 : max === g ? (b - r) / d + 2 : (r - g) / d + 4;
  return (h * 60 + 360) % 360;
}

describe("palettes", () => {
  it("OKABE_ITO matches the published RGB values (Okabe & Ito, Color Universal Design, 2008)", () => {
    const rgb: Record<keyof typeof OKABE_ITO_BY_NAME, [number, number, number]> = {
      orange: [230, 159, 0],
      skyBlue: [86, 180, 233],
      bluishGreen: [0, 158, 115],
      yellow: [240, 228, 66],
      blue: [0, 114, 178],
      vermillion: [213, 94, 0],
      reddishPurple: [204, 121, 167],
      black: [0, 0, 0],
    };
    for (const [name, [r, g, b]] of Object.entries(rgb)) {
      const hex = `#${[r, g, b].map((v) => v.toString(16).padStart(2, "0")).join("")}`.toUpperCase();
      expect(OKABE_ITO_BY_NAME[name as keyof typeof OKABE_ITO_BY_NAME]).toBe(hex);
    }
    // The array form keeps the published order.
    expect(OKABE_ITO).toEqual(
      Object.values(rgb).map((c) => `#${c.map((v) => v.toString(16).padStart(2, "0")).join("")}`.toUpperCase()),
    );
    expect([...CURVE_COLOURS].sort()).toEqual([...OKABE_ITO].sort());
  });

  it("model colours are a teal/blue family (hue 170°–230°), never a curve colour", () => {
    for (const c of MODEL_COLOURS) {
      expect(hue(c)).toBeGreaterThanOrEqual(170);
      expect(hue(c)).toBeLessThanOrEqual(230);
      expect(CURVE_COLOURS).not.toContain(c);
    }
    expect(new Set(MODEL_COLOURS).size).toBe(MODEL_COLOURS.length);
  });

  it("next colours take the first unused one, then cycle", () => {
    expect(nextCurveColour({ curves: [] })).toBe(CURVE_COLOURS[0]);
    expect(nextCurveColour({ curves: [{ colour: CURVE_COLOURS[0].toLowerCase() }] })).toBe(CURVE_COLOURS[1]);
    expect(nextCurveColour({ curves: CURVE_COLOURS.map((colour) => ({ colour })) })).toBe(CURVE_COLOURS[0]);
    expect(nextModelColour(defaultProject())).toBe(MODEL_COLOURS[3]);
  });
});

describe("factories", () => {
  it("newModel fills every field; a missing max makes a line and the label follows E/N", () => {
    const m = newModel({ eOverNMin: "5/3", eOverNMax: "44/3" });
    expect(m).toMatchObject({
      label: "E/N = 5/3..44/3",
      source: { kind: "typed" },
      lineStyle: "solid",
      visible: true,
      sigmas: 0,
      colour: MODEL_COLOURS[0],
    });
    expect(m.id).toMatch(/^m-[0-9a-z]{8}$/);
    expect(newModel({ eOverNMin: "8/3" }).eOverNMax).toBe("8/3");
    expect(newModel({}, { models: [{ colour: MODEL_COLOURS[0] }] }).colour).toBe(MODEL_COLOURS[1]);
    expect(newModel().id).not.toBe(newModel().id);
  });

  it("newCurve fills every field, with no rescaling by default and dashed projections", () => {
    const c = newCurve({ role: "projection", rescale: { fraction: 0.5 } });
    expect(c.lineStyle).toBe("dashed");
    expect(c.rescale.rhoAssumed).toBe(c.rescale.rhoShown);
    expect(c.rescale.fraction).toBe(0.5);
    expect(c.massEv).toBeInstanceOf(Float64Array);
    expect(newCurve().lineStyle).toBe("solid");
  });
});

describe("defaultProject (the demo)", () => {
  const p = defaultProject();

  it("has a KSVZ-type line E/N = 0, a DFSZ-type line E/N = 8/3 and the window between 5/3 and 44/3", () => {
    // KSVZ with a heavy quark (3,1,0): E/N = 0; DFSZ-I: E/N = 8/3; preferred window of single heavy-quark models
    // between the E/N = 5/3 and E/N = 44/3 lines: Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801; Di Luzio,
    // Giannotti, Nardi, Visinelli, Phys. Rept. 870 (2020) 1.
    const values = p.models.map((m) => [rationalValue(m.eOverNMin), rationalValue(m.eOverNMax)]);
    expect(values).toEqual([
      [0, 0],
      [8 / 3, 8 / 3],
      [5 / 3, 44 / 3],
    ]);
    expect(p.models.map((m) => m.label)).toEqual(["KSVZ-type, E/N = 0", "DFSZ-type, E/N = 8/3", "Heavy-quark window"]);
    expect(p.models.map((m) => m.kind)).toEqual(["line", "line", "between"]);
    expect(p.models[2].members.map((m) => m.eOverN)).toEqual(["5/3", "44/3"]);
    expect(p.models.some((m) => /cancel/i.test(m.label))).toBe(false);
    for (const m of p.models) expect(MODEL_COLOURS).toContain(m.colour);
  });

  it("has invented curves of every role, each saying so in its name and citation", () => {
    expect(p.curves.map((c) => c.role).sort()).toEqual(["exclusion", "exclusion", "projection", "region"]);
    for (const c of p.curves) {
      expect(c.label).toMatch(/^Demo network: .+ \(invented\)$/);
      expect(c.citation).toBe(DEMO_CITATION);
      expect(c.citation).toBe("invented for the axband demo; not data from any experiment");
      expect(CURVE_COLOURS).toContain(c.colour);
      expect(c.massEv.length).toBe(c.gInvGeV.length);
      expect(c.massEv.length).toBeGreaterThanOrEqual(150);
      expect(c.massEv.length).toBeLessThanOrEqual(500);
    }
    expect(new Set(p.curves.map((c) => c.colour)).size).toBe(p.curves.length);
  });

  it("uses physically plausible ranges: 10⁻⁷–10⁻² eV, 10⁻¹⁶–10⁻⁸ GeV⁻¹ (10⁻⁸ marks 'off the plot')", () => {
    for (const c of p.curves) {
      for (let i = 0; i < c.massEv.length; i++) {
        expect(c.massEv[i]).toBeGreaterThanOrEqual(1e-7);
        expect(c.massEv[i]).toBeLessThanOrEqual(1e-2);
        expect(c.gInvGeV[i]).toBeGreaterThanOrEqual(1e-16);
        expect(c.gInvGeV[i]).toBeLessThanOrEqual(1e-8);
      }
    }
  });

  it("the haloscope-like exclusion reaches ~1–4× the KSVZ-type coupling of the published formula (≤ 12× at scan edges)", () => {
    const cavity = p.curves.find((c) => c.id === "demo-cavity");
    expect(cavity).toBeDefined();
    let inDips = 0;
    let best = Infinity;
    for (let i = 0; i < (cavity?.massEv.length ?? 0); i++) {
      const m = cavity!.massEv[i];
      const g = cavity!.gInvGeV[i];
      if (g >= 1e-9) continue; // between scan windows the limit leaves the plot
      inDips++;
      const ratio = g / gRef(m, 0);
      best = Math.min(best, ratio);
      expect(ratio).toBeGreaterThan(0.9);
      expect(ratio).toBeLessThan(12);
    }
    expect(best).toBeLessThan(1.5);
    expect(inDips).toBeGreaterThan(200);
    // The physics core's E/N = 0 line at 10 μeV, by hand: f_a = 5.691×10¹¹ GeV, α/2π = 1.16141×10⁻³,
    // × 1.92 / f_a = 3.918×10⁻¹⁵ GeV⁻¹ (haloscope papers quote ≈ 3.9·10⁻¹⁵ GeV⁻¹ there, from memory).
    expect(gAgg(1e-5, 0)).toBeCloseTo(3.918e-15, 18);
  });

  it("the projection is a smooth line in mass order; the region is a simple closed contour", () => {
    const reach = p.curves.find((c) => c.role === "projection")!;
    for (let i = 1; i < reach.massEv.length; i++) expect(reach.massEv[i]).toBeGreaterThan(reach.massEv[i - 1]);
    const region = p.curves.find((c) => c.role === "region")!;
    expect(region.keepOrder).toBe(true);
    const xs = Array.from(region.massEv, Math.log10);
    const ys = Array.from(region.gInvGeV, Math.log10);
    const cx = xs.reduce((a, b) => a + b) / xs.length;
    const cy = ys.reduce((a, b) => a + b) / ys.length;
    // Star-shaped about its centroid with angles turning one way: a simple polygon.
    const angles = xs.map((x, i) => Math.atan2(ys[i] - cy, x - cx));
    let turns = 0;
    for (let i = 0; i < angles.length; i++) {
      const d = angles[(i + 1) % angles.length] - angles[i];
      const wrapped = ((d + 3 * Math.PI) % (2 * Math.PI)) - Math.PI;
      expect(wrapped).toBeGreaterThan(0);
      turns += wrapped;
    }
    expect(turns).toBeCloseTo(2 * Math.PI, 9);
  });

  it("figure and constants defaults: slide, f_a on top, grid, the 2019 reference with custom seeded from it", () => {
    expect(p.figure).toMatchObject({
      preset: "slide",
      topAxis: "fa",
      grid: true,
      yView: "coupling",
      massRangeEv: [1e-7, 1e-2],
      yRange: [1e-17, 1e-9],
    });
    expect(p.physics.ref).toBe("2019");
    // Gorghetto & Villadoro, JHEP 03 (2019) 033: K = 5.691(51); c_γ = 1.92(4) from Grilli di Cortona et al. 2016.
    expect(p.physics.custom).toMatchObject({ cGamma: 1.92, cGammaSigma: 0.04, kMuEv: 5.691, kMuEvSigma: 0.051 });
  });

  it("is deterministic and does not use Math.random", () => {
    const spy = vi.spyOn(Math, "random").mockReturnValue(0.123);
    try {
      expect(projectsEqual(defaultProject(), p)).toBe(true);
      expect(spy).not.toHaveBeenCalled();
    } finally {
      spy.mockRestore();
    }
  });
});

describe("mulberry32", () => {
  it("repeats for a seed, differs between seeds, and is uniform (χ² over 20 bins, common practice)", () => {
    const a = mulberry32(42);
    const b = mulberry32(42);
    const c = mulberry32(43);
    const xs = Array.from({ length: 100_000 }, () => a());
    expect(Array.from({ length: 5 }, () => b())).toEqual(xs.slice(0, 5));
    expect(c()).not.toBe(xs[0]);
    expect(xs.every((x) => x >= 0 && x < 1)).toBe(true);
    const bins = new Array(20).fill(0);
    for (const x of xs) bins[Math.floor(x * 20)]++;
    const expected = xs.length / 20;
    const chi2 = bins.reduce((s, n) => s + (n - expected) ** 2 / expected, 0);
    // 19 degrees of freedom: the 99.9 % quantile is 43.8 (standard χ² tables).
    expect(chi2).toBeLessThan(43.8);
  });
});
