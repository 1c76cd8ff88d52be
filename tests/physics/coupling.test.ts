// Checks of g_aγγ(m_a), m_a·f_a, the band edges and the inverse against the published formula and constants.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import {
  ALPHA,
  PLANCK_EV_S,
  bandCancels,
  bandEdges,
  eOverNAt,
  faFromMass,
  frequencyFromMass,
  gAgg,
  gGamma,
  massFromFa,
  massFromFrequency,
  REF_2016,
} from "../../src/physics";

// Numbers typed in from the sources, independent of src/physics/constants.ts.
const ALPHA_CODATA2018 = 7.2973525693e-3; // CODATA 2018 recommended value
const INV_ALPHA_CODATA2018 = 137.035999084; // CODATA 2018: α⁻¹ = 137.035999084(21)
const H_J_S = 6.62607015e-34; // SI 2019 / CODATA 2018: h exact
const E_C = 1.602176634e-19; // SI 2019 / CODATA 2018: e exact
const C_GAMMA_2016 = 1.92; // Grilli di Cortona et al., JHEP 01 (2016) 034: c_γ = 1.92(4)
const C_GAMMA_SIGMA = 0.04;
const K_2016 = 5.7; // same paper: m_a = 5.70(6)(4) μeV·10¹² GeV/f_a
const K_2019 = 5.691; // Gorghetto & Villadoro, JHEP 03 (2019) 033: 5.691(51)
const K_2019_SIGMA = 0.051;

/** g_aγγ = α/(2π f_a)·|E/N − c_γ| with f_a = K·10¹² GeV·μeV/m_a, written out from the JHEP 2016 formula. */
function gReference(massEv: number, eOverN: number, k: number, cGamma: number): number {
  const faGeV = (k * 1e-6 * 1e12) / massEv;
  return (ALPHA_CODATA2018 / (2 * Math.PI * faGeV)) * Math.abs(eOverN - cGamma);
}

function relClose(a: number, b: number, rel = 1e-12): void {
  expect(Math.abs(a - b)).toBeLessThanOrEqual(rel * Math.max(Math.abs(a), Math.abs(b)));
}

describe("2016 reference: σ_K from the two errors of K", () => {
  test("σ_K = √(0.06² + 0.04²) = 0.072 (Grilli di Cortona et al., JHEP 01 (2016) 034: K = 5.70(6)(4))", () => {
    // By hand: 0.0036 + 0.0016 = 0.0052, √0.0052 = 0.07211 → 0.072 at the errors' precision.
    expect(REF_2016.kMuEvSigma).toBeCloseTo(0.072, 6);
    expect(Math.abs(REF_2016.kMuEvSigma - Math.hypot(0.06, 0.04))).toBeLessThan(5e-4);
  });
});

describe("constants", () => {
  test("α against CODATA 2018 (α = 7.2973525693(11)×10⁻³, α⁻¹ = 137.035999084(21))", () => {
    expect(ALPHA).toBe(ALPHA_CODATA2018);
    // The two published forms agree within the CODATA uncertainty of the last digits.
    expect(Math.abs(1 / ALPHA - INV_ALPHA_CODATA2018)).toBeLessThan(3e-8);
  });
  test("h in eV·s equals h/e from the exact SI 2019 values (CODATA 2018)", () => {
    relClose(PLANCK_EV_S, H_J_S / E_C, 1e-9);
  });
});

describe("m_a·f_a", () => {
  test("f_a = 10¹² GeV gives m_a = 5.691 μeV (Gorghetto & Villadoro, JHEP 03 (2019) 033, eq. for m_a)", () => {
    expect(massFromFa(1e12)).toBeCloseTo(5.691e-6, 12);
    expect(massFromFa(1e12, "2016")).toBeCloseTo(5.7e-6, 12);
    expect(faFromMass(massFromFa(3.3e9))).toBeCloseTo(3.3e9, 0);
  });
  test("m_a = 1 μeV ↔ f_a = 5.691×10¹² GeV (JHEP 2019) and 5.70×10¹² GeV (JHEP 2016)", () => {
    relClose(faFromMass(1e-6), K_2019 * 1e12);
    relClose(faFromMass(1e-6, "2016"), K_2016 * 1e12);
    // m_a·f_a is a constant: doubling the mass halves f_a.
    relClose(faFromMass(2e-6) * 2, faFromMass(1e-6));
  });
  test("the newer reference (JHEP 2019) is the default", () => {
    expect(faFromMass(1e-5)).toBe(faFromMass(1e-5, "2019"));
  });
});

describe("frequency", () => {
  test("m_a = 1 μeV ↔ 241.799 MHz, computed from h and e (exact, CODATA 2018 / SI 2019)", () => {
    const expectedHz = 1e-6 / (H_J_S / E_C);
    relClose(frequencyFromMass(1e-6), expectedHz, 1e-9);
    // The commonly quoted 241.799 MHz per μeV, to its six digits.
    expect(Math.abs(frequencyFromMass(1e-6) - 241.799e6)).toBeLessThan(1e3);
    relClose(massFromFrequency(frequencyFromMass(3.7e-5)), 3.7e-5);
  });
});

describe("g_aγγ", () => {
  test("g_aγγ for KSVZ E/N = 0 at f_a = 10¹² GeV: α/(2π·10¹² GeV)·1.92 (Grilli di Cortona et al., JHEP 01 (2016) 034)", () => {
    const g = gAgg(5.691e-6, 0);
    expect(g).toBeCloseTo((7.2973525693e-3 / (2 * Math.PI * 1e12)) * 1.92, 25);
  });
  test("g = α/(2π f_a)·|E/N − c_γ| over masses and E/N (JHEP 2016 formula; K from JHEP 2016 and JHEP 2019)", () => {
    for (const massEv of [1e-9, 3.3e-6, 2.5e-5, 1e-3, 0.1]) {
      for (const eOverN of [0, 2 / 3, 5 / 3, 8 / 3, 44 / 3, -4]) {
        relClose(gAgg(massEv, eOverN), gReference(massEv, eOverN, K_2019, C_GAMMA_2016));
        relClose(gAgg(massEv, eOverN, { ref: "2016" }), gReference(massEv, eOverN, K_2016, C_GAMMA_2016));
      }
    }
  });
  test("numerical form g_aγγ = (0.203(3)·E/N − 0.39(1))·m_a/GeV² (PDG review 'Axions and other similar particles'; from memory)", () => {
    for (const eOverN of [0, 8 / 3, 44 / 3]) {
      const massEv = 1e-5;
      const massGeV = massEv * 1e-9;
      const pdg = Math.abs(0.203 * eOverN - 0.39) * massGeV;
      const tolerance = (0.003 * eOverN + 0.01) * massGeV;
      expect(Math.abs(gAgg(massEv, eOverN, { ref: "2016" }) - pdg)).toBeLessThanOrEqual(tolerance);
    }
  });
  test("a user-entered c_γ replaces the published one (g_aγγ = α/(2π f_a)·(E/N − c_γ), Grilli di Cortona et al., JHEP 01 (2016) 034, eq. 2.9 from memory)", () => {
    relClose(gAgg(1e-5, 8 / 3, { cGamma: 2.1 }), gReference(1e-5, 8 / 3, K_2019, 2.1));
  });
  test("the coupling vanishes at E/N = c_γ (cancellation; JHEP 2016)", () => {
    expect(gAgg(1e-5, C_GAMMA_2016)).toBe(0);
  });
});

describe("haloscope convention g_γ = (E/N − c_γ)/2 (g_aγγ = (α/π)·g_γ/f_a; PDG review “Axions and other similar particles”, from memory)", () => {
  test("g_γ = −0.96 (E/N = 0) and 0.37 (E/N = 8/3) with c_γ = 1.92 (JHEP 2016)", () => {
    expect(gGamma(0)).toBeCloseTo(-0.96, 10);
    expect(gGamma(8 / 3)).toBeCloseTo(0.37, 2);
  });
  test("the often-quoted −0.97 and 0.36 follow from the older coefficient 1.95 (from memory)", () => {
    // (0 − 1.95)/2 = −0.975, quoted truncated as −0.97; (8/3 − 1.95)/2 = 0.358 → 0.36.
    expect(Math.abs(gGamma(0, { cGamma: 1.95 }) - -0.97)).toBeLessThanOrEqual(0.0051);
    expect(gGamma(8 / 3, { cGamma: 1.95 })).toBeCloseTo(0.36, 2);
  });
  test("g_aγγ = (α/π)·|g_γ|/f_a reproduces the model line (PDG review “Axions and other similar particles”, from memory)", () => {
    const massEv = 4e-6;
    for (const eOverN of [0, 8 / 3, 1.5]) {
      relClose(((ALPHA_CODATA2018 / Math.PI) * Math.abs(gGamma(eOverN))) / faFromMass(massEv), gAgg(massEv, eOverN));
    }
  });
});

describe("band edges (Di Luzio, Giannotti, Nardi, Visinelli, Phys. Rept. 870 (2020) 1, sec. 6, from memory; constants from JHEP 2016 / JHEP 2019)", () => {
  const m = 2e-5;
  test("lower edge is exactly 0 when c_γ = 1.92 lies inside [E/N_min, E/N_max] (cancellation)", () => {
    expect(bandEdges(m, 0, 8 / 3).lowInvGeV).toBe(0);
    expect(bandEdges(m, 5 / 3, 44 / 3).lowInvGeV).toBe(0);
    expect(bandCancels(0, 8 / 3)).toBe(true);
    relClose(bandEdges(m, 0, 8 / 3).highInvGeV, gReference(m, 0, K_2019, C_GAMMA_2016));
  });
  test("without spread the edges are the model lines of the interval ends", () => {
    const e = bandEdges(m, 8 / 3, 44 / 3, { sigmas: 0 });
    relClose(e.lowInvGeV, gReference(m, 8 / 3, K_2019, C_GAMMA_2016));
    relClose(e.highInvGeV, gReference(m, 44 / 3, K_2019, C_GAMMA_2016));
    // Below c_γ the roles of the ends swap: the end nearer c_γ gives the lower edge.
    const below = bandEdges(m, -1, 0);
    relClose(below.lowInvGeV, gReference(m, 0, K_2019, C_GAMMA_2016));
    relClose(below.highInvGeV, gReference(m, -1, K_2019, C_GAMMA_2016));
  });
  test("theory spread with k σ: c_γ ± kσ(c_γ) and K ± kσ(K) widen both edges (σ from JHEP 2016, JHEP 2019)", () => {
    const k = 2;
    const e0 = bandEdges(m, 8 / 3, 44 / 3, { sigmas: 0 });
    const e2 = bandEdges(m, 8 / 3, 44 / 3, { sigmas: k });
    expect(e2.lowInvGeV).toBeLessThan(e0.lowInvGeV);
    expect(e2.highInvGeV).toBeGreaterThan(e0.highInvGeV);
    const low = gReference(m, 8 / 3, K_2019 + k * K_2019_SIGMA, C_GAMMA_2016 + k * C_GAMMA_SIGMA);
    const high = gReference(m, 44 / 3, K_2019 - k * K_2019_SIGMA, C_GAMMA_2016 - k * C_GAMMA_SIGMA);
    relClose(e2.lowInvGeV, low);
    relClose(e2.highInvGeV, high);
  });
  test("the spread can reach the cancellation: [1.95, 3] touches c_γ + 1σ = 1.96", () => {
    expect(bandEdges(m, 1.95, 3, { sigmas: 0 }).lowInvGeV).toBeGreaterThan(0);
    expect(bandEdges(m, 1.95, 3, { sigmas: 1 }).lowInvGeV).toBe(0);
  });
  test("a single E/N value with sigmas = 0 is the model line itself", () => {
    const e = bandEdges(m, 8 / 3, 8 / 3);
    expect(e.lowInvGeV).toBe(e.highInvGeV);
    relClose(e.lowInvGeV, gAgg(m, 8 / 3));
  });
});

describe("inverse: eOverNAt (E/N = c_γ ± 2π f_a g/α, inverting eq. 2.9 of Grilli di Cortona et al., JHEP 01 (2016) 034, from memory)", () => {
  test("round trip E/N → g at m → two E/N, one equals the input (property, fast-check)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -30, max: 30, noNaN: true }),
        fc.double({ min: -10, max: -1, noNaN: true }),
        (eOverN, log10Mass) => {
          const massEv = 10 ** log10Mass;
          const [lo, hi] = eOverNAt(massEv, gAgg(massEv, eOverN));
          expect(lo).toBeLessThanOrEqual(hi);
          const tol = 1e-9 * (1 + Math.abs(eOverN));
          expect(Math.min(Math.abs(lo - eOverN), Math.abs(hi - eOverN))).toBeLessThan(tol);
          // The two solutions lie symmetric about c_γ.
          expect(Math.abs(lo + hi - 2 * C_GAMMA_2016)).toBeLessThan(tol);
        },
      ),
    );
  });
  test("KSVZ E/N = 0 maps back to {0, 2c_γ = 3.84} (JHEP 2016 c_γ)", () => {
    const [lo, hi] = eOverNAt(1e-5, gAgg(1e-5, 0));
    expect(lo).toBeCloseTo(0, 10);
    expect(hi).toBeCloseTo(3.84, 10);
  });
});
