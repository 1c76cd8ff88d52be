// The overlap summary on analytic cases: a comb of N equal windows below a model line, shares in log m and of the
// band's area, the verdicts, and model sets. Exact numbers come from the geometry of each case, derived by hand:
// a curve at g = k·m·e^(±h) is parallel to the line g = k·m (g_aγγ = α/(2π f_a)·|E/N − c_γ| with m_a f_a fixed,
// Grilli di Cortona et al., JHEP 01 (2016) 034), so it lies above the line where +h, below where −h.
import { describe, expect, test } from "vitest";
import { gAgg } from "../../src/physics";
import { emptyProject, newCurve, newModel } from "../../src/project/defaults";
import { intervalEOverN, overlapSummary, type OverlapSummaryRow } from "../../src/analysis/overlap-summary";
import type { Model, Project } from "../../src/project/types";

const X0 = Math.log(1e-6);
const X1 = Math.log(1e-4);

/** A curve parallel to the E/N = `e` line, a factor e^h above it except in N equal windows (below by e^h). */
function comb(n: number, widthLn: number, e = 0, h = 1, hWindow = -h) {
  const k = gAgg(1, e, { ref: "2019" });
  const mass: number[] = [];
  const g: number[] = [];
  const at = (x: number, s: number) => {
    mass.push(Math.exp(x));
    g.push(k * Math.exp(x) * Math.exp(s * h));
  };
  at(X0, 1);
  const step = (X1 - X0) / n;
  for (let j = 0; j < n; j++) {
    const a = X0 + (j + 0.5) * step - widthLn / 2;
    // Vertical steps: two points at one mass keep their file order.
    at(a, 1);
    at(a, hWindow / h);
    at(a + widthLn, hWindow / h);
    at(a + widthLn, 1);
  }
  at(X1, 1);
  return newCurve({ id: "comb", label: "comb", massEv: Float64Array.from(mass), gInvGeV: Float64Array.from(g) });
}

function project(models: Model[], curve = comb(10, 0.05)): Project {
  const p = emptyProject("summary test");
  p.models = models;
  p.curves = [curve];
  return p;
}

function only(rows: OverlapSummaryRow[]): OverlapSummaryRow {
  expect(rows.length).toBe(1);
  return rows[0];
}

describe("a comb of N equal windows over a line", () => {
  test.each([1, 7, 40])("N = %i windows give N intervals and the share N·w/(ln 10⁻⁴ − ln 10⁻⁶)", (n) => {
    const w = 0.02;
    const row = only(overlapSummary(project([newModel({ id: "l", eOverNMin: "0" })], comb(n, w))));
    expect(row.verdict).toBe("excluded-whole");
    expect(row.intervalCount).toBe(n);
    expect(row.intervals.count).toBe(n);
    expect(row.shareAny).toBeCloseTo((n * w) / (X1 - X0), 12);
    expect(row.shareWhole).toBeCloseTo((n * w) / (X1 - X0), 12);
    expect(row.areaShare).toBeNull(); // a line has no area
    expect(row.massRangeEv[0]).toBeCloseTo(1e-6, 18);
    expect(row.massRangeEv[1]).toBeCloseTo(1e-4, 16);
    expect(Math.log(row.widestEv![1] / row.widestEv![0])).toBeCloseTo(w, 12);
    expect(intervalEOverN(row.intervals, 0)).toBe("all");
  });

  test("a row's intervals sum to its share", () => {
    const row = only(overlapSummary(project([newModel({ id: "l", eOverNMin: "0" })], comb(25, 0.013))));
    let sum = 0;
    for (let i = 0; i < row.intervals.count; i++) sum += Math.log(row.intervals.hi[i] / row.intervals.lo[i]);
    expect(sum / (X1 - X0)).toBeCloseTo(row.shareAny, 12);
  });

  test("a line that never reaches the comb gives the verdict none", () => {
    // E/N = 2: |2 − 1.92| = 0.08 puts its line ln(1.92/0.08) = 3.18 below the E/N = 0 line, under the comb's −1.
    const row = only(overlapSummary(project([newModel({ id: "l", eOverNMin: "2" })])));
    expect(row.verdict).toBe("none");
    expect(row.intervalCount).toBe(0);
    expect(row.shareAny).toBe(0);
    expect(row.eOverNBest).toEqual([]);
  });
});

describe("bands: area share and E/N at the best point", () => {
  test("E/N ∈ [2.88, 5.76] with the comb's windows on the E/N = 0 line: half of the band's height", () => {
    // |E/N − 1.92| runs over [0.96, 3.84]; the windows sit at |E/N − c_γ| = 1.92, so the covered share of the
    // band's log height is ln(3.84/1.92)/ln(3.84/0.96) = ln 2/ln 4 = 1/2; outside the windows the curve lies
    // e¹ above the E/N = 0 line, above the band's top (ln 2 < 1).
    const n = 12;
    const w = 0.03;
    const band = newModel({ id: "b", eOverNMin: "2.88", eOverNMax: "5.76" });
    const row = only(overlapSummary(project([band], comb(n, w, 0, 1, 0))));
    expect(row.verdict).toBe("excluded-part");
    expect(row.intervalCount).toBe(n);
    expect(row.shareWhole).toBe(0);
    expect(row.shareAny).toBeCloseTo((n * w) / (X1 - X0), 12);
    expect(row.areaShare).toBeCloseTo((0.5 * n * w) / (X1 - X0), 12);
    // Excluded: |E/N − 1.92| ≥ 1.92 within the band, i.e. E/N ∈ [3.84, 5.76].
    expect(row.eOverNBest).toHaveLength(1);
    const [[a, b]] = row.eOverNBest as [number, number][];
    expect(a).toBeCloseTo(3.84, 10);
    expect(b).toBe(5.76);
  });
});

describe("band area share over a sloped curve", () => {
  test("a straight curve rising through the band: share (1 + ln 2)/(4 + 2 ln 2)", () => {
    // Band E/N ∈ [2.88, 5.76]: in v = ln g − ln m its edges lie ln 2 below and above the E/N = 0 line (|E/N − c_γ|
    // from 0.96 to 3.84 around 1.92). The curve runs straight from 1 below the lower edge at m = 10⁻⁶ eV to 3 above
    // the upper edge at 10⁻⁴ eV, so in the parameter t ∈ [0, 1] it leaves the lower edge at t₁ = 1/(ln 4 + 4) and
    // the upper at t₂ = (1 + ln 4)/(ln 4 + 4); the covered fraction is 1 before t₁ and falls linearly to 0 at t₂:
    // share = t₁ + (t₂ − t₁)/2 = (1 + ln 2)/(4 + 2 ln 2) (derived by hand from this geometry).
    const k = gAgg(1, 0, { ref: "2019" });
    const rel = [-Math.LN2 - 1, Math.LN2 + 3];
    const massEv = Float64Array.from([Math.exp(X0), Math.exp(X1)]);
    const gInvGeV = Float64Array.from([0, 1].map((i) => k * massEv[i] * Math.exp(rel[i])));
    const curve = newCurve({ id: "slope", label: "slope", massEv, gInvGeV });
    const band = newModel({ id: "b", eOverNMin: "2.88", eOverNMax: "5.76" });
    const row = only(overlapSummary(project([band], curve)));
    expect(row.areaShare).toBeCloseTo((1 + Math.LN2) / (4 + 2 * Math.LN2), 12);
    // Wholly excluded up to t₁, partly up to t₂ (the band's top reaches the curve there).
    expect(row.shareWhole).toBeCloseTo(1 / (2 * Math.LN2 + 4), 12);
    expect(row.shareAny).toBeCloseTo((1 + 2 * Math.LN2) / (2 * Math.LN2 + 4), 12);
  });
});

describe("band area share inside a region", () => {
  // Regions drawn in the sheared plane (x = ln m, v measured from the E/N = 0 line), over x ∈ [ln 10⁻⁶, ln 10⁻⁴];
  // the band E/N ∈ [2.88, 5.76] is the strip |v| ≤ ln 2 there (see above). Shares are area ratios worked by hand.
  function region(vertices: [number, number][]) {
    const k = gAgg(1, 0, { ref: "2019" });
    const xs = vertices.map(([t]) => X0 + t * (X1 - X0));
    const massEv = Float64Array.from(xs, (x) => Math.exp(x));
    const gInvGeV = Float64Array.from(vertices, ([, rel], i) => k * massEv[i] * Math.exp(rel));
    return newCurve({ id: "r", label: "r", role: "region", massEv, gInvGeV });
  }
  const band = () => newModel({ id: "b", eOverNMin: "2.88", eOverNMax: "5.76" });

  test("a parallelogram v ∈ [−1, 0.5] over the whole range: share (0.5 + ln 2)/(2 ln 2)", () => {
    const curve = region([
      [0, -1],
      [1, -1],
      [1, 0.5],
      [0, 0.5],
    ]);
    const row = only(overlapSummary(project([band()], curve)));
    expect(row.areaShare).toBeCloseTo((0.5 + Math.LN2) / (2 * Math.LN2), 12);
  });

  test("a triangle from v = −2 along the bottom to v = 3 at the left end: share 3/5", () => {
    // Its top edge v = 3 − 5t leaves the strip's top at t = (3 − ln 2)/5 and its bottom at (3 + ln 2)/5: covered
    // area 2 ln 2 · (3 − ln 2)/5 + (2 ln 2)²/10 = 6 ln 2/5 (in units of the range), strip 2 ln 2.
    const curve = region([
      [0, -2],
      [1, -2],
      [0, 3],
    ]);
    const row = only(overlapSummary(project([band()], curve)));
    expect(row.areaShare).toBeCloseTo(3 / 5, 12);
  });
});

describe("model sets (wholly where all members are, partly where some are)", () => {
  function set(members: { eOverN: string; count: number }[]): Model {
    const values = members.map((m) => m.eOverN);
    return {
      ...newModel({ id: "s", eOverNMin: values[0], eOverNMax: values[values.length - 1] }),
      kind: "set",
      members,
    } as Model;
  }

  test("members E/N = 0 (×2) and 2 (×3): partly excluded, 2 of 5 models in each window", () => {
    const row = only(
      overlapSummary(
        project([
          set([
            { eOverN: "0", count: 2 },
            { eOverN: "2", count: 3 },
          ]),
        ]),
      ),
    );
    expect(row.modelKind).toBe("set");
    expect(row.verdict).toBe("excluded-part");
    expect(row.intervalCount).toBe(10);
    expect(row.membersTotal).toBe(5);
    expect(row.membersBest).toBe(2);
    expect(row.eOverNBest).toEqual([[0, 0]]);
  });

  test("members E/N = 0 and 3.84 lie on one line (|E/N − 1.92| = 1.92): wholly excluded in every window", () => {
    const row = only(
      overlapSummary(
        project([
          set([
            { eOverN: "0", count: 1 },
            { eOverN: "3.84", count: 1 },
          ]),
        ]),
      ),
    );
    expect(row.verdict).toBe("excluded-whole");
    expect(row.membersBest).toBe(2);
    expect(row.shareWhole).toBeCloseTo((10 * 0.05) / (X1 - X0), 12);
    expect(row.eOverNBest).toBe("all");
  });
});
