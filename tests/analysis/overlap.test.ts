// Analytic checks of the overlap core: model lines and bands against flat and sloped exclusion curves,
// projections and closed regions, with exact crossing masses derived by hand in log-log space.
//
// Derivation used throughout (analytic, from g_aγγ = α/(2π f_a)·|E/N − c_γ| and m_a f_a = K·10⁶ eV·GeV,
// Grilli di Cortona et al., JHEP 01 (2016) 034; Gorghetto & Villadoro, JHEP 03 (2019) 033):
//   a model line is g = k·m with k = α |E/N − c_γ| / (2π K·10⁶ GeV·eV), i.e. ln g = ln m + ln k;
//   a flat limit ln g = ln G meets it at m = G/k, and the line is at or above G for m ≥ G/k.
import { describe, expect, test } from "vitest";
import { ALPHA, REF_2019, gAgg, gFromNormalized, type AxionConstants } from "../../src/physics";
import { overlap, overlapDetail, type Interval } from "../../src/analysis/overlap";

const C_GAMMA = 1.92; // Grilli di Cortona et al., JHEP 01 (2016) 034: c_γ = 1.92(4)

/** Slope k of the line g = k·m for E/N (from the physics core, itself checked against the papers). */
function slope(eOverN: number, ref: "2016" | "2019" = "2019"): number {
  return gAgg(1, eOverN, { ref });
}

/** Slope for a given |E/N − c_γ| and an explicit K in μeV. */
function slopeN(n: number, kMuEv: number): number {
  return gFromNormalized(1, n, kMuEv);
}

function flat(m1: number, m2: number, g: number, role: "exclusion" | "projection" = "exclusion") {
  return { massEv: Float64Array.from([m1, m2]), gInvGeV: Float64Array.from([g, g]), role };
}

function expectIntervals(actual: Interval[], expected: Interval[], rel = 1e-12): void {
  expect(actual.length).toBe(expected.length);
  actual.forEach(([lo, hi], i) => {
    expect(Math.abs(lo / expected[i][0] - 1)).toBeLessThan(rel);
    expect(Math.abs(hi / expected[i][1] - 1)).toBeLessThan(rel);
  });
}

describe("flat exclusion against a model line (analytic: crossing at m = G/k)", () => {
  const m1 = 1e-6;
  const m2 = 1e-4;
  const k = slope(0); // E/N = 0, the KSVZ-type (3,1,0) line

  test("crossing inside the range: whole = [G/k, m2], part empty", () => {
    const G = k * 1e-5;
    const r = overlap({ eOverNMin: 0, eOverNMax: 0 }, flat(m1, m2, G));
    expectIntervals(r.whole, [[G / k, m2]]);
    expect(r.part).toEqual([]);
    // The curve's own end is returned exactly, not through exp(log m).
    expect(r.whole[0][1]).toBe(m2);
  });

  test("hand-derived number: G = 1e-15 GeV⁻¹ meets the E/N = 0 line at m = 2.55212 μeV", () => {
    // k = α·|0 − c_γ|/(2π·K·10⁶) with α = 1/137.035999084 (CODATA 2018, Tiesinga et al., RMP 93 (2021) 025010),
    // c_γ = 1.92 (Grilli di Cortona et al., JHEP 01 (2016) 034), K = 5.691 μeV (Gorghetto & Villadoro, JHEP 03
    // (2019) 033): k = 1.92/(137.035999084 · 2π · 5.691·10⁶) = 3.91830·10⁻¹⁰ GeV⁻¹/eV, so m = G/k = 2.55212·10⁻⁶ eV
    // (worked by hand with a pocket calculator, not with the code under test).
    const r = overlap({ eOverNMin: 0, eOverNMax: 0 }, flat(m1, m2, 1e-15));
    expect(r.whole.length).toBe(1);
    expect(r.whole[0][0]).toBeCloseTo(2.55212e-6, 10);
    expect(r.whole[0][1]).toBe(m2);
    // E/N = 8/3: |8/3 − 1.92| = 0.746667, k = 1.52378·10⁻¹⁰, m = 6.56261·10⁻⁶ eV (same inputs, same way).
    expect(overlap({ eOverNMin: 8 / 3, eOverNMax: 8 / 3 }, flat(m1, m2, 1e-15)).whole[0][0]).toBeCloseTo(
      6.56261e-6,
      10,
    );
  });

  test("crossing below the range: the whole range [m1, m2] is excluded, nothing outside it", () => {
    const G = k * 1e-7;
    const r = overlap({ eOverNMin: 0, eOverNMax: 0 }, flat(m1, m2, G));
    expect(r.whole).toEqual([[m1, m2]]);
  });

  test("crossing above the range: nothing excluded", () => {
    const d = overlapDetail({ eOverNMin: 0, eOverNMax: 0 }, flat(m1, m2, k * 1e-3));
    expect(d.whole).toEqual([]);
    expect(d.part).toEqual([]);
    expect(d.none).toEqual([[m1, m2]]);
  });

  test("general formula [max(m1, G/k), m2] for several E/N values", () => {
    for (const eOverN of [0, 2 / 3, 8 / 3, 5 / 3, 44 / 3, -4]) {
      const kk = slope(eOverN);
      for (const mStar of [3e-7, 2e-6, 5e-5]) {
        const G = kk * mStar;
        const r = overlap({ eOverNMin: eOverN, eOverNMax: eOverN }, flat(m1, m2, G));
        expectIntervals(r.whole, mStar < m2 ? [[Math.max(m1, G / kk), m2]] : []);
        expect(r.part).toEqual([]);
      }
    }
  });

  test("ref 2016 vs 2019: the crossing moves as K does, m*(2016)/m*(2019) = 5.70/5.691 (JHEP 2016; JHEP 2019)", () => {
    const G = slope(0) * 1e-5;
    const a = overlap({ eOverNMin: 0, eOverNMax: 0, ref: "2016" }, flat(m1, m2, G)).whole[0][0];
    const b = overlap({ eOverNMin: 0, eOverNMax: 0, ref: "2019" }, flat(m1, m2, G)).whole[0][0];
    expect(a / b).toBeCloseTo(5.7 / 5.691, 12);
    expect(overlap({ eOverNMin: 0, eOverNMax: 0 }, flat(m1, m2, G)).whole[0][0]).toBe(b); // default is 2019
  });

  test("custom constants: c_γ = 1 and K = 6 μeV give the crossing α|0 − 1|m/(2π·6·10⁶) = G", () => {
    const custom: AxionConstants = { cGamma: 1, cGammaSigma: 0.1, kMuEv: 6, kMuEvSigma: 0.1, label: "test" };
    const kk = ALPHA / (2 * Math.PI * 6e6);
    const G = kk * 4e-6;
    const viaOpts = overlap({ eOverNMin: 0, eOverNMax: 0 }, flat(m1, m2, G), { constants: custom });
    const viaModel = overlap({ eOverNMin: 0, eOverNMax: 0, constants: custom }, flat(m1, m2, G));
    expectIntervals(viaOpts.whole, [[4e-6, m2]]);
    expect(viaModel).toEqual(viaOpts);
  });

  test("gFactor scales the curve: G·f meets the line at f·G/k", () => {
    const G = k * 1e-5;
    const r = overlap({ eOverNMin: 0, eOverNMax: 0 }, { ...flat(m1, m2, G), gFactor: 2.5 });
    expectIntervals(r.whole, [[2.5e-5, m2]]);
  });
});

describe("bands with both edges (analytic)", () => {
  const m1 = 1e-6;
  const m2 = 1e-4;

  test("E/N ∈ [3, 10]: whole where g_low = k(3)·m ≥ G, part between G/k(10) and G/k(3)", () => {
    const kLo = slope(3);
    const kHi = slope(10);
    const G = kLo * 2e-5;
    const d = overlapDetail({ eOverNMin: 3, eOverNMax: 10 }, flat(m1, m2, G));
    expectIntervals(d.whole, [[G / kLo, m2]]);
    expectIntervals(d.part, [[G / kHi, G / kLo]]);
    expectIntervals(d.none, [[m1, G / kHi]]);
    expect(d.cancels).toBe(false);
    // At the part interval's upper end the whole band touches the limit: every E/N is excluded somewhere.
    expect(d.partEOverN[0].length).toBe(1);
    expect(d.partEOverN[0][0][0]).toBeCloseTo(3, 9);
    expect(d.partEOverN[0][0][1]).toBe(10);
  });

  test("the ends may be given in either order", () => {
    const G = slope(3) * 2e-5;
    expect(overlap({ eOverNMin: 10, eOverNMax: 3 }, flat(m1, m2, G))).toEqual(
      overlap({ eOverNMin: 3, eOverNMax: 10 }, flat(m1, m2, G)),
    );
  });

  test("a limit parallel to the model lines at |E/N − c_γ| = 5 excludes E/N ≥ c_γ + 5 at every mass", () => {
    // G(m) = k_5·m: g(E/N) ≥ G  ⇔  |E/N − c_γ| ≥ 5 (analytic); the band [3, 10] is cut at E/N = 6.92.
    const k5 = slopeN(5, REF_2019.kMuEv);
    const curve = {
      massEv: Float64Array.from([m1, m2]),
      gInvGeV: Float64Array.from([k5 * m1, k5 * m2]),
      role: "exclusion" as const,
    };
    const d = overlapDetail({ eOverNMin: 3, eOverNMax: 10 }, curve);
    expect(d.whole).toEqual([]);
    expect(d.part).toEqual([[m1, m2]]);
    expect(d.partEOverN[0].length).toBe(1);
    expect(d.partEOverN[0][0][0]).toBeCloseTo(C_GAMMA + 5, 10);
    expect(d.partEOverN[0][0][1]).toBe(10);
    expect(d.partEOverNThroughout?.[0][0][0]).toBeCloseTo(C_GAMMA + 5, 10);
  });

  test("a V-shaped limit between |E/N − c_γ| = 6 and 4: somewhere E/N ≥ c_γ + 4, throughout E/N ≥ c_γ + 6", () => {
    const K = REF_2019.kMuEv;
    const mid = 1e-5;
    const curve = {
      massEv: Float64Array.from([m1, mid, m2]),
      gInvGeV: Float64Array.from([slopeN(6, K) * m1, slopeN(4, K) * mid, slopeN(6, K) * m2]),
      role: "exclusion" as const,
    };
    const d = overlapDetail({ eOverNMin: 3, eOverNMax: 10 }, curve);
    expect(d.part).toEqual([[m1, m2]]);
    expect(d.partEOverN[0][0][0]).toBeCloseTo(C_GAMMA + 4, 10);
    expect(d.partEOverNThroughout?.[0][0][0]).toBeCloseTo(C_GAMMA + 6, 10);
  });

  test("theory spread (c_γ ± kσ, K ± kσ): whole shrinks and part grows by the widened edges", () => {
    // Lower edge: |3 − c_γ| − kσ_c with K + kσ_K; upper edge: |10 − c_γ| + kσ_c with K − kσ_K
    // (σ_c = 0.04 from JHEP 01 (2016) 034; σ_K = 0.051 μeV from JHEP 03 (2019) 033).
    const s = 2;
    const kLo = slopeN(3 - C_GAMMA - s * 0.04, 5.691 + s * 0.051);
    const kHi = slopeN(10 - C_GAMMA + s * 0.04, 5.691 - s * 0.051);
    const G = slope(3) * 2e-5;
    const plain = overlapDetail({ eOverNMin: 3, eOverNMax: 10 }, flat(m1, m2, G));
    const spread = overlapDetail({ eOverNMin: 3, eOverNMax: 10, sigmas: s }, flat(m1, m2, G));
    expectIntervals(spread.whole, [[G / kLo, m2]], 1e-10);
    expectIntervals(spread.part, [[G / kHi, G / kLo]], 1e-10);
    expect(spread.whole[0][0]).toBeGreaterThan(plain.whole[0][0]);
    expect(spread.part[0][0]).toBeLessThan(plain.part[0][0]);
  });

  test("a line has no part without spread, and becomes a thin band with spread", () => {
    const G = slope(8 / 3) * 2e-5;
    expect(overlap({ eOverNMin: 8 / 3, eOverNMax: 8 / 3 }, flat(m1, m2, G)).part).toEqual([]);
    const d = overlapDetail({ eOverNMin: 8 / 3, eOverNMax: 8 / 3, sigmas: 1 }, flat(m1, m2, G));
    expect(d.line).toBe(true);
    expect(d.part.length).toBe(1);
    expect(d.part[0][0]).toBeLessThan(2e-5);
    expect(d.whole[0][0]).toBeGreaterThan(2e-5);
  });
});

describe("cancellation: c_γ inside the E/N interval", () => {
  const m1 = 1e-6;
  const m2 = 1e-4;

  test("E/N ∈ [0, 8/3] ∋ 1.92: whole is empty, part where the upper edge k(0)·m ≥ G", () => {
    // Upper edge: max(|0 − 1.92|, |8/3 − 1.92|) = 1.92, i.e. the E/N = 0 line (analytic).
    const G = slope(0) * 1e-5;
    const d = overlapDetail({ eOverNMin: 0, eOverNMax: 8 / 3 }, flat(m1, m2, G));
    expect(d.cancels).toBe(true);
    expect(d.whole).toEqual([]);
    expectIntervals(d.part, [[1e-5, m2]]);
  });

  test("even a limit far below every line excludes only part of a cancelling band", () => {
    const d = overlapDetail({ eOverNMin: 0, eOverNMax: 8 / 3 }, flat(m1, m2, 1e-30));
    expect(d.whole).toEqual([]);
    expect(d.part).toEqual([[m1, m2]]);
  });

  test("the excluded E/N are two pieces around c_γ: |E/N − c_γ| ≥ 0.5 for a limit at |E/N − c_γ| = 0.5", () => {
    const k = slopeN(0.5, REF_2019.kMuEv);
    const curve = {
      massEv: Float64Array.from([m1, m2]),
      gInvGeV: Float64Array.from([k * m1, k * m2]),
      role: "exclusion" as const,
    };
    const d = overlapDetail({ eOverNMin: 0, eOverNMax: 8 / 3 }, curve);
    const [lower, upper] = d.partEOverN[0];
    expect(lower[0]).toBe(0);
    expect(lower[1]).toBeCloseTo(C_GAMMA - 0.5, 10);
    expect(upper[0]).toBeCloseTo(C_GAMMA + 0.5, 10);
    expect(upper[1]).toBe(8 / 3);
  });

  test("the spread turns a near-c_γ line into a cancelling band: E/N = 1.9 with 1σ reaches c_γ ± 0.04", () => {
    const G = slope(0) * 1e-5;
    expect(overlapDetail({ eOverNMin: 1.9, eOverNMax: 1.9 }, flat(m1, m2, G)).cancels).toBe(false);
    const d = overlapDetail({ eOverNMin: 1.9, eOverNMax: 1.9, sigmas: 1 }, flat(m1, m2, G));
    expect(d.cancels).toBe(true);
    expect(d.whole).toEqual([]);
  });

  test("a line exactly at c_γ has g = 0 and is excluded nowhere", () => {
    const d = overlapDetail({ eOverNMin: C_GAMMA, eOverNMax: C_GAMMA }, flat(m1, m2, 1e-30));
    expect(d.whole).toEqual([]);
    expect(d.part).toEqual([]);
  });
});

describe("projection: the same comparison, read as within reach", () => {
  test("band [3, 10] against a flat projection gives the same intervals as an exclusion", () => {
    const G = slope(3) * 2e-5;
    const ex = overlap({ eOverNMin: 3, eOverNMax: 10 }, flat(1e-6, 1e-4, G, "exclusion"));
    const pr = overlap({ eOverNMin: 3, eOverNMax: 10 }, flat(1e-6, 1e-4, G, "projection"));
    expect(pr).toEqual(ex);
    expectIntervals(pr.whole, [[2e-5, 1e-4]]);
  });
});

describe("closed regions (analytic, polygon in log-log space)", () => {
  // A square in log-log: masses [m1, m2], couplings [G1, G2]. A line g = k·m is inside where
  // G1 ≤ k·m ≤ G2, i.e. m ∈ [max(m1, G1/k), min(m2, G2/k)] (analytic).
  const m1 = 1e-6;
  const m2 = 1e-4;
  const k = slope(0);
  const G1 = k * 5e-6;
  const G2 = k * 4e-5;
  const square = {
    massEv: Float64Array.from([m1, m2, m2, m1]),
    gInvGeV: Float64Array.from([G1, G1, G2, G2]),
    role: "region" as const,
  };

  test("a line enters at G1/k and leaves at G2/k", () => {
    const d = overlapDetail({ eOverNMin: 0, eOverNMax: 0 }, square);
    expectIntervals(d.whole, [[5e-6, 4e-5]]);
    expect(d.part).toEqual([]);
    expect(d.massRangeEv).toEqual([m1, m2]);
  });

  test("a band: whole where both edges are inside, part where only one is", () => {
    // E/N ∈ [0, 0.5]: edges k(0.5) (lower, |0.5 − 1.92| = 1.42) and k(0) (upper).
    const kLo = slope(0.5);
    const d = overlapDetail({ eOverNMin: 0, eOverNMax: 0.5 }, square);
    expectIntervals(d.whole, [[G1 / kLo, G2 / k]]);
    expectIntervals(d.part, [
      [G1 / k, G1 / kLo],
      [G2 / k, G2 / kLo],
    ]);
  });

  test("a cancelling band is never wholly inside a bounded region", () => {
    const d = overlapDetail({ eOverNMin: 0, eOverNMax: 8 / 3 }, square);
    expect(d.cancels).toBe(true);
    expect(d.whole).toEqual([]);
    // The band reaches g → 0, so it meets the square wherever its upper edge k(0)·m is above G1.
    expectIntervals(d.part, [[G1 / k, m2]]);
  });

  test("the vertex order (clockwise or not) does not matter", () => {
    const reversed = { ...square, massEv: square.massEv.slice().reverse(), gInvGeV: square.gInvGeV.slice().reverse() };
    expect(overlap({ eOverNMin: 0, eOverNMax: 0.5 }, reversed)).toEqual(
      overlap({ eOverNMin: 0, eOverNMax: 0.5 }, square),
    );
  });

  test("a U-shaped region: the line crosses both arms, the band's partial overlap fills the notch", () => {
    // Built in the sheared plane (x = ln m, v = ln g − ln m) where the model line is v = const: outer box
    // x ∈ [0, 4], v ∈ [0, 3] with a notch x ∈ [1.5, 2.5], v ∈ [1, 3] cut from the top.
    const x0 = Math.log(1e-6);
    const v0 = Math.log(k) - 1; // the E/N = 0 line sits at v0 + 1, |0 − c_γ| scaled by e^(v − v0 − 1)
    const pts: [number, number][] = [
      [0, 0],
      [4, 0],
      [4, 3],
      [2.5, 3],
      [2.5, 1],
      [1.5, 1],
      [1.5, 3],
      [0, 3],
    ];
    const region = {
      massEv: Float64Array.from(pts, ([x]) => Math.exp(x0 + x)),
      gInvGeV: Float64Array.from(pts, ([x, v]) => Math.exp(x0 + x + v0 + v)),
      role: "region" as const,
    };
    const at = (x: number): number => Math.exp(x0 + x);
    // A line at v = 2 (relative): |E/N − c_γ| = 1.92·e¹.
    const eOverN = C_GAMMA + C_GAMMA * Math.E;
    const line = overlapDetail({ eOverNMin: eOverN, eOverNMax: eOverN }, region);
    expectIntervals(
      line.whole,
      [
        [at(0), at(1.5)],
        [at(2.5), at(4)],
      ],
      1e-9,
    );
    // A band between v = 0.5 and v = 2 (relative): inside in the arms, only its lower part in the notch.
    const lo = C_GAMMA + C_GAMMA * Math.exp(-0.5);
    const band = overlapDetail({ eOverNMin: lo, eOverNMax: eOverN }, region);
    expectIntervals(
      band.whole,
      [
        [at(0), at(1.5)],
        [at(2.5), at(4)],
      ],
      1e-9,
    );
    expectIntervals(band.part, [[at(1.5), at(2.5)]], 1e-9);
    // In the notch the region reaches up to v = 1 (relative): E/N with |E/N − c_γ| ≤ 1.92·e⁰ are inside.
    const [piece] = band.partEOverN[0];
    expect(piece[0]).toBeCloseTo(lo, 9);
    expect(piece[1]).toBeCloseTo(C_GAMMA + C_GAMMA, 9);
  });
});

describe("mass range, ordering and gaps", () => {
  const k = slope(0);

  test("nothing is claimed outside the curve's mass range", () => {
    const d = overlapDetail({ eOverNMin: 0, eOverNMax: 0 }, flat(2e-6, 3e-6, 1e-30));
    expect(d.whole).toEqual([[2e-6, 3e-6]]);
    expect(d.none).toEqual([]);
    expect(d.massRangeEv).toEqual([2e-6, 3e-6]);
  });

  test("an exclusion curve is sorted by mass first: a shuffled file gives the same intervals", () => {
    const massEv = Float64Array.from([1e-6, 3e-6, 1e-5, 3e-5, 1e-4]);
    const gInvGeV = Float64Array.from(massEv, (m, i) => k * 1e-5 * (1 + 0.5 * (i % 2)) * (m / 1e-5) ** 0.3);
    const order = [3, 0, 4, 2, 1];
    const shuffled = {
      massEv: Float64Array.from(order, (i) => massEv[i]),
      gInvGeV: Float64Array.from(order, (i) => gInvGeV[i]),
      role: "exclusion" as const,
    };
    const sorted = { massEv, gInvGeV, role: "exclusion" as const };
    expect(overlap({ eOverNMin: 0, eOverNMax: 3 }, shuffled)).toEqual(overlap({ eOverNMin: 0, eOverNMax: 3 }, sorted));
  });

  test("two scan windows with the curve off the top in between give two intervals, not bridged", () => {
    // Like a haloscope with two runs: a vertical wall up to 10⁻⁸ GeV⁻¹ at each window edge.
    const deep = k * 1e-9; // far below the E/N = 0 line in both windows
    const top = 1e-8;
    const massEv = Float64Array.from([1e-6, 1e-6, 2e-6, 2e-6, 5e-6, 5e-6, 1e-5, 1e-5]);
    const gInvGeV = Float64Array.from([top, deep, deep, top, top, deep, deep, top]);
    const d = overlapDetail({ eOverNMin: 0, eOverNMax: 0 }, { massEv, gInvGeV, role: "exclusion" });
    expect(d.whole).toEqual([
      [1e-6, 2e-6],
      [5e-6, 1e-5],
    ]);
    expect(d.bridgedGapsEv).toEqual([]);
  });

  // A curve sampled every w in ln m, a depth d below the line except one sample a height h above it:
  // the crossings are at x_s ∓ w·h/(d + h), so the gap is 2w·h/(d + h) (analytic), narrower than one
  // sample (w) exactly when h < d.
  function spike(h: number, d: number) {
    const w = 0.1;
    const n = 21;
    const s = 10;
    const L = Math.log(k); // the E/N = 0 line in the sheared plane
    const x = Array.from({ length: n }, (_, i) => Math.log(1e-6) + i * w);
    const v = x.map((_, i) => (i === s ? L + h : L - d));
    const curve = {
      massEv: Float64Array.from(x, Math.exp),
      gInvGeV: Float64Array.from(x, (xi, i) => Math.exp(xi + v[i])),
      role: "exclusion" as const,
    };
    const gapLo = Math.exp(x[s] - (w * h) / (d + h));
    const gapHi = Math.exp(x[s] + (w * h) / (d + h));
    return { curve, gapLo, gapHi, first: curve.massEv[0], last: curve.massEv[n - 1] };
  }

  test("a gap narrower than one sample (h < d) is kept by default, merged and reported with mergeGaps", () => {
    const { curve, gapLo, gapHi, first, last } = spike(0.5, 1.5);
    const raw = overlapDetail({ eOverNMin: 0, eOverNMax: 0 }, curve);
    expectIntervals(
      raw.whole,
      [
        [first, gapLo],
        [gapHi, last],
      ],
      1e-9,
    );
    expect(raw.bridgedGapsEv).toEqual([]);
    const merged = overlapDetail({ eOverNMin: 0, eOverNMax: 0 }, curve, { mergeGaps: true });
    expect(merged.whole).toEqual([[first, last]]);
    expectIntervals(merged.bridgedGapsEv, [[gapLo, gapHi]], 1e-9);
  });

  test("a gap wider than one sample (h > d) is kept", () => {
    const { curve, gapLo, gapHi, first, last } = spike(1.5, 0.5);
    const d = overlapDetail({ eOverNMin: 0, eOverNMax: 0 }, curve, { mergeGaps: true });
    expectIntervals(
      d.whole,
      [
        [first, gapLo],
        [gapHi, last],
      ],
      1e-9,
    );
    expect(d.bridgedGapsEv).toEqual([]);
  });

  test("for a band, a merged gap of whole leaves no part inside it", () => {
    // Band E/N ∈ [0, 0.5]: lower edge k(0.5); the spike pokes above the lower edge only.
    const { curve } = spike(0.1, 1.5);
    const d = overlapDetail({ eOverNMin: 0, eOverNMax: 0.5 }, curve, { mergeGaps: true });
    const lowerEdgeShift = Math.log(slope(0) / slope(0.5)); // 0.30: the spike rises above the lower edge
    expect(lowerEdgeShift).toBeLessThan(1.5);
    // Gaps (analytic, as above): whole 2w·0.40/1.60 ≈ 0.50w and touch 2w·0.1/1.6 ≈ 0.13w, both bridged.
    expect(d.whole.length).toBe(1);
    expect(d.part).toEqual([]);
  });

  test("points with non-positive or non-finite values are skipped and counted", () => {
    const massEv = Float64Array.from([1e-6, -1, 2e-6, NaN, 4e-6]);
    const gInvGeV = Float64Array.from([1e-30, 1e-30, 0, 1e-30, 1e-30]);
    const d = overlapDetail({ eOverNMin: 0, eOverNMax: 0 }, { massEv, gInvGeV, role: "exclusion" });
    expect(d.skippedPoints).toBe(3);
    expect(d.whole).toEqual([[1e-6, 4e-6]]);
  });

  test("fewer than two usable points: nothing claimed", () => {
    const d = overlapDetail(
      { eOverNMin: 0, eOverNMax: 0 },
      { massEv: Float64Array.from([1e-6]), gInvGeV: Float64Array.from([1e-30]), role: "exclusion" },
    );
    expect(d.whole).toEqual([]);
    expect(d.massRangeEv).toBeNull();
  });
});

describe("performance (a property of the algorithm, not a timing assertion on shared machines)", () => {
  test("a 100 000-point curve is handled and the second call reuses the per-curve preparation", () => {
    const n = 100_000;
    const massEv = new Float64Array(n);
    const gInvGeV = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      massEv[i] = 10 ** (-6 + (3 * i) / n);
      gInvGeV[i] = 2 * gAgg(massEv[i], 0) * (1 + 0.8 * Math.sin(i / 50));
    }
    const curve = { massEv, gInvGeV, role: "exclusion" as const };
    const a = overlapDetail({ eOverNMin: 0, eOverNMax: 0 }, curve, { mergeGaps: false });
    // The line is at or above the curve where 2(1 + 0.8 sin) ≤ 1, i.e. sin ≤ −0.625: a fixed share of the
    // mass range per period (analytic: (π − 2·asin(0.625))/(2π) ≈ 0.285 of each period in i).
    const covered = a.whole.reduce((s, [lo, hi]) => s + Math.log10(hi / lo), 0);
    expect(covered / 3).toBeCloseTo((Math.PI - 2 * Math.asin(0.625)) / (2 * Math.PI), 2);
    const b = overlapDetail({ eOverNMin: 0, eOverNMax: 0 }, curve, { mergeGaps: false });
    expect(b.whole).toEqual(a.whole);
  });
});
