// The hover readout and the point-in-curve test behind it. Expected numbers are computed here from the
// published constants, independently of the app: f_a = K·10⁶ eV·GeV / m_a with K = 5.691 μeV (Gorghetto &
// Villadoro, JHEP 03 (2019) 033), ν = m_a/h with h = 4.135667696×10⁻¹⁵ eV·s (CODATA 2018), and the two E/N of
// the lines through a point, c_γ ± 2π f_a g/α with c_γ = 1.92 (Grilli di Cortona et al., JHEP 01 (2016) 034)
// and α = 7.2973525693×10⁻³ (CODATA 2018). Curves are interpolated linearly in log-log space (common practice).
import { beforeEach, describe, expect, test } from "vitest";
import { act, render, screen } from "@testing-library/react";
import { HoverReadout } from "../../src/ui/figure/HoverReadout";
import { curveGAt, curvesAtPoint, insideRegion } from "../../src/ui/figure/hit";
import { newCurve } from "../../src/project/defaults";
import { useAxband } from "../../src/ui/store";
import { blankProject, resetStore } from "./helpers";

const K_MU_EV = 5.691;
const H_EV_S = 4.135667696e-15;
const ALPHA = 7.2973525693e-3;
const C_GAMMA = 1.92;

const exclusion = newCurve({
  id: "ex",
  label: "Invented limit",
  role: "exclusion",
  massEv: new Float64Array([1e-6, 1e-4]),
  gInvGeV: new Float64Array([1e-12, 1e-14]),
});
const reach = newCurve({
  id: "pr",
  label: "Invented reach",
  role: "projection",
  massEv: new Float64Array([1e-6, 1e-4]),
  gInvGeV: new Float64Array([1e-15, 1e-15]),
});
const region = newCurve({
  id: "rg",
  label: "Invented region",
  role: "region",
  keepOrder: true,
  massEv: new Float64Array([1e-6, 1e-5, 1e-5, 1e-6]),
  gInvGeV: new Float64Array([1e-12, 1e-12, 1e-11, 1e-11]),
});

describe("point tests", () => {
  test("an exclusion curve is interpolated in log-log: halfway in log m gives the geometric mean of g", () => {
    expect(curveGAt(exclusion, 1e-5)).toBeCloseTo(1e-13, 25);
    expect(curveGAt(exclusion, 1e-7)).toBeNull(); // nothing is claimed outside the curve
    const hits = curvesAtPoint([exclusion, reach, region], 1e-5, 2e-13);
    expect(hits.map((h) => h.curveId)).toEqual(["ex", "pr"]);
    expect(curvesAtPoint([exclusion], 1e-5, 5e-14)).toEqual([]);
  });

  test("a region contains the points inside its polygon only; hidden curves are ignored", () => {
    expect(insideRegion(region, 3e-6, 3e-12)).toBe(true);
    expect(insideRegion(region, 3e-5, 3e-12)).toBe(false);
    expect(insideRegion(region, 3e-6, 3e-11)).toBe(false);
    expect(curvesAtPoint([{ ...region, visible: false }], 3e-6, 3e-12)).toEqual([]);
  });

  test("a rescaled limit moves: ρ shown = ρ assumed / 4 doubles g (g ∝ ρ^−1/2, common practice)", () => {
    const weaker = { ...exclusion, rescale: { rhoAssumed: 0.4, rhoShown: 0.1, fraction: 1 } };
    expect(curveGAt(weaker, 1e-5)).toBeCloseTo(2e-13, 25);
  });
});

describe("readout", () => {
  beforeEach(() => resetStore({ ...blankProject(), curves: [exclusion, reach, region] }));

  test("shows m_a, g_aγγ, f_a, frequency, the two E/N and the curves at the point", () => {
    render(<HoverReadout />);
    expect(screen.getByTestId("hover-readout")).toHaveTextContent(/Point at the figure/);
    act(() => useAxband.getState().setHover({ massEv: 1e-5, y: 2e-13 }));
    expect(screen.getByTestId("hover-mass")).toHaveTextContent("10.0 μeV");
    expect(screen.getByTestId("hover-g")).toHaveTextContent("2.00×10⁻¹³ GeV⁻¹");
    // f_a = K·(10¹² GeV)·(1 μeV/m_a) = 5.691 × 10¹² GeV / 10 = 5.691×10¹¹ GeV (K of Gorghetto & Villadoro,
    // JHEP 03 (2019) 033), printed to three figures.
    expect(screen.getByTestId("hover-fa")).toHaveTextContent("5.69×10¹¹ GeV");
    expect(screen.getByTestId("hover-freq")).toHaveTextContent(`${(1e-5 / H_EV_S / 1e9).toPrecision(3)} GHz`);
    const faGeV = 5.691e11;
    const d = (2 * Math.PI * faGeV * 2e-13) / ALPHA;
    const text = screen.getByTestId("hover-eovern").textContent ?? "";
    expect(text).toContain((C_GAMMA + d).toPrecision(3));
    expect(text).toContain((C_GAMMA - d).toPrecision(3).replace("-", "−"));
    expect(screen.getByTestId("hover-curves")).toHaveTextContent(
      "excluded by Invented limit; within reach of Invented reach",
    );
  });

  test("in the normalized view the y value is |E/N − c_γ| and g_aγγ is derived from it", () => {
    act(() => useAxband.getState().setFigure({ yView: "normalized" }));
    render(<HoverReadout />);
    // |E/N − c_γ| = 10 at 10 μeV: g = α·10/(2π f_a)
    act(() => useAxband.getState().setHover({ massEv: 1e-5, y: 10 }));
    const g = (ALPHA * 10) / (2 * Math.PI * ((K_MU_EV * 1e6) / 1e-5));
    const m = g / 10 ** Math.floor(Math.log10(g));
    expect(screen.getByTestId("hover-g")).toHaveTextContent(m.toPrecision(3));
    expect(screen.getByTestId("hover-eovern")).toHaveTextContent(
      `${(C_GAMMA - 10).toPrecision(3).replace("-", "−")} or ${(C_GAMMA + 10).toPrecision(3)}`,
    );
  });
});
