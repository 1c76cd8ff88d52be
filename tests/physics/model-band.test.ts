// Checks of the between-lines band and of model sets (extreme lines, central share) against hand-derived
// numbers: the heavy-quark window of Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801 and small invented sets.
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import {
  bandCancels,
  bandEdges,
  centralBand,
  gAgg,
  linesBandEdges,
  linesRange,
  normalizedLinesRange,
  type AxionConstants,
} from "../../src/physics";

// Numbers typed in from the sources, independent of src/physics/constants.ts.
const ALPHA_CODATA2018 = 7.2973525693e-3; // CODATA 2018 recommended value
const C_GAMMA = 1.92; // Grilli di Cortona et al., JHEP 01 (2016) 034: c_γ = 1.92(4)
const C_GAMMA_SIGMA = 0.04;
const K_2019 = 5.691; // Gorghetto & Villadoro, JHEP 03 (2019) 033: K = 5.691(51) μeV
const K_2019_SIGMA = 0.051;
const REF: AxionConstants = {
  cGamma: C_GAMMA,
  cGammaSigma: C_GAMMA_SIGMA,
  kMuEv: K_2019,
  kMuEvSigma: K_2019_SIGMA,
  label: "test",
};

/** g_aγγ = α/(2π f_a)·n with f_a = K·10⁶ GeV·eV/m_a (JHEP 01 (2016) 034, eq. 2.5 with n = |E/N − c_γ|). */
function gOfNormalized(massEv: number, n: number, k = K_2019): number {
  return (ALPHA_CODATA2018 / (2 * Math.PI * ((k * 1e6) / massEv))) * n;
}

function relClose(a: number, b: number, rel = 1e-12): void {
  expect(Math.abs(a - b)).toBeLessThanOrEqual(rel * Math.max(Math.abs(a), Math.abs(b)));
}

const masses = fc.double({ min: 1e-9, max: 1, noNaN: true });

describe("the heavy-quark window as a between-lines band (PRL 118 (2017) 031801)", () => {
  // The PRL's window is bounded by the E/N = 5/3 and E/N = 44/3 lines. By hand, with c_γ = 1.92 = 48/25:
  //   |5/3 − 1.92| = |125 − 144|/75 = 19/75 = 0.25333…   (the paper's "about 0.25")
  //   |44/3 − 1.92| = |1100 − 144|/75 = 956/75 = 12.74666…  (the paper's "about 12.75")
  const LOW = 19 / 75;
  const HIGH = 956 / 75;

  test("|E/N − c_γ| runs from 19/75 ≈ 0.253 to 956/75 ≈ 12.747", () => {
    const [lo, hi] = normalizedLinesRange([5 / 3, 44 / 3], REF);
    relClose(lo, LOW);
    relClose(hi, HIGH);
    expect(lo).toBeCloseTo(0.25, 2);
    expect(hi).toBeCloseTo(12.75, 2);
  });

  test("at 10 μeV the edges are 5.170e-16 and 2.6013e-14 GeV⁻¹ (worked by hand)", () => {
    // f_a = 5.691e6/1e-5 = 5.691e11 GeV; α/(2π f_a) = 7.2973525693e-3/3.57576e12 = 2.04078e-15 GeV⁻¹;
    // × 0.253333 = 5.1700e-16; × 12.746667 = 2.6013e-14.
    const e = bandEdges(1e-5, 5 / 3, 44 / 3, { between: true, constants: REF });
    expect(e.lowInvGeV).toBeCloseTo(5.17e-16, 19);
    expect(e.highInvGeV).toBeCloseTo(2.6013e-14, 17);
  });

  test("the lower edge equals the lower (5/3) line and the upper the 44/3 line at every mass", () => {
    fc.assert(
      fc.property(masses, (m) => {
        const e = bandEdges(m, 5 / 3, 44 / 3, { between: true, constants: REF });
        relClose(e.lowInvGeV, gAgg(m, 5 / 3, { constants: REF }));
        relClose(e.highInvGeV, gAgg(m, 44 / 3, { constants: REF }));
        relClose(e.lowInvGeV, gOfNormalized(m, LOW));
      }),
    );
  });

  test("is never 0 for 5/3 | 44/3, while the interval 5/3..44/3 cancels (it contains c_γ)", () => {
    for (const sigmas of [0, 1, 2, 3, 6]) {
      expect(bandCancels(5 / 3, 44 / 3, { between: true, constants: REF, sigmas })).toBe(false);
      expect(bandEdges(1e-6, 5 / 3, 44 / 3, { between: true, constants: REF, sigmas }).lowInvGeV).toBeGreaterThan(0);
      expect(bandCancels(5 / 3, 44 / 3, { constants: REF, sigmas })).toBe(true);
      expect(bandEdges(1e-6, 5 / 3, 44 / 3, { constants: REF, sigmas }).lowInvGeV).toBe(0);
    }
  });

  test("the spread widens each line outward; 0 only once the 5/3 line itself reaches 0", () => {
    // With kσ: the 5/3 line's lower edge is 19/75 − 0.04k and the 44/3 line's upper 956/75 + 0.04k, with K ∓ kσ.
    // 19/75 / 0.04 = 6.33: at k = 6 the floor is 0.01333…, at k = 7 c_γ − 0.28 = 1.64 < 5/3 and it is 0.
    const e2 = bandEdges(1e-5, 5 / 3, 44 / 3, { between: true, constants: REF, sigmas: 2 });
    relClose(e2.lowInvGeV, gOfNormalized(1e-5, LOW - 0.08, K_2019 + 2 * K_2019_SIGMA), 1e-12);
    relClose(e2.highInvGeV, gOfNormalized(1e-5, HIGH + 0.08, K_2019 - 2 * K_2019_SIGMA), 1e-12);
    relClose(normalizedLinesRange([5 / 3, 44 / 3], REF, 6)[0], 1 / 75, 1e-9);
    expect(bandCancels(5 / 3, 44 / 3, { between: true, constants: REF, sigmas: 7 })).toBe(true);
  });
});

describe("between-lines band in general", () => {
  test("lines on both sides of c_γ: the lower edge is the nearer line, not 0", () => {
    // 1 and 3 around c_γ = 1.92: |1 − 1.92| = 0.92, |3 − 1.92| = 1.08 (by hand).
    const [lo, hi] = linesRange([1, 3], 1.92, 1.92);
    expect(lo).toBeCloseTo(0.92, 14);
    expect(hi).toBeCloseTo(1.08, 14);
  });

  test("with more than two values the band runs between the extreme |E/N − c_γ| of the members", () => {
    // 5/3 | 2 | 44/3: |2 − 1.92| = 0.08 is the smallest, below the two outer lines.
    const [lo, hi] = normalizedLinesRange([5 / 3, 2, 44 / 3], REF);
    expect(lo).toBeCloseTo(0.08, 14);
    relClose(hi, 956 / 75);
    const e = linesBandEdges(1e-4, [5 / 3, 2, 44 / 3], { constants: REF });
    relClose(e.lowInvGeV, gOfNormalized(1e-4, 0.08), 1e-12);
  });

  test("a line at c_γ makes it reach 0; the band of one value is that line", () => {
    expect(linesRange([1.92, 3], 1.92, 1.92)[0]).toBe(0);
    fc.assert(
      fc.property(masses, fc.double({ min: -50, max: 50, noNaN: true }), (m, e) => {
        const b = linesBandEdges(m, [e], { constants: REF });
        relClose(b.lowInvGeV, gAgg(m, e, { constants: REF }));
        relClose(b.highInvGeV, b.lowInvGeV);
      }),
    );
  });

  test("never below the interval band's lower edge, never above its upper edge (same two ends)", () => {
    fc.assert(
      fc.property(
        masses,
        fc.double({ min: -30, max: 30, noNaN: true }),
        fc.double({ min: -30, max: 30, noNaN: true }),
        fc.integer({ min: 0, max: 3 }),
        (m, a, b, sigmas) => {
          const [lo, hi] = a <= b ? [a, b] : [b, a];
          const between = bandEdges(m, lo, hi, { between: true, constants: REF, sigmas });
          const interval = bandEdges(m, lo, hi, { constants: REF, sigmas });
          expect(between.lowInvGeV).toBeGreaterThanOrEqual(interval.lowInvGeV);
          relClose(between.highInvGeV, interval.highInvGeV);
        },
      ),
    );
  });
});

describe("central band of a model set", () => {
  test("holds the chosen share counted with multiplicities, in the narrowest window of |E/N − c_γ|", () => {
    // Invented set, c_γ = 1.92: x = |E/N − c_γ| for E/N = 2 (0.08, ×5), 3 (1.08, ×3), 8/3 (0.7467, ×1),
    // 10 (8.08, ×1). 10 models; 68 % → 7 models. Sorted x: 0.08 (5), 0.7467 (1), 1.08 (3), 8.08 (1).
    // Windows holding ≥ 7: [0.08, 1.08] (9 models, width 1.0) or [0.7467, 8.08] (5, too few) → [0.08, 1.08].
    const b = centralBand(
      [
        { eOverN: 2, count: 5 },
        { eOverN: 3, count: 3 },
        { eOverN: 8 / 3, count: 1 },
        { eOverN: 10, count: 1 },
      ],
      0.68,
      { constants: REF },
    );
    expect(b).not.toBeNull();
    expect(b?.total).toBe(10);
    expect(b?.held).toBe(9);
    expect(b?.nMin).toBeCloseTo(0.08, 14);
    expect(b?.nMax).toBeCloseTo(1.08, 14);
    expect(b?.values.sort((x, y) => x - y)).toEqual([2, 8 / 3, 3]);
  });

  test("68 % of 100 models asks for 68, not 69 (floating-point 0.68 · 100)", () => {
    // 100 members at E/N = c_γ + i (i = 1…100), one model each: the narrowest 68 are i = 1…68, x from 1 to 68.
    const members = Array.from({ length: 100 }, (_, i) => ({ eOverN: C_GAMMA + i + 1, count: 1 }));
    const b = centralBand(members, 0.68, { constants: REF });
    expect(b?.held).toBe(68);
    expect(b?.nMin).toBeCloseTo(1, 12);
    expect(b?.nMax).toBeCloseTo(68, 12);
  });

  test("share 1 is the band between the extreme lines; an empty set has none", () => {
    const members = [
      { eOverN: -64 / 3, count: 2 },
      { eOverN: 8 / 3, count: 5 },
      { eOverN: 1 / 6, count: 1 },
    ];
    const b = centralBand(members, 1, { constants: REF });
    const [lo, hi] = normalizedLinesRange(
      members.map((m) => m.eOverN),
      REF,
    );
    expect(b?.nMin).toBeCloseTo(lo, 14);
    expect(b?.nMax).toBeCloseTo(hi, 14);
    expect(b?.held).toBe(8);
    expect(centralBand([], 0.68)).toBeNull();
  });

  test("any share: the band holds at least ⌈share · total⌉ models and every member inside its range", () => {
    const member = fc.record({
      eOverN: fc.double({ min: -40, max: 40, noNaN: true }),
      count: fc.integer({ min: 1, max: 9 }),
    });
    fc.assert(
      fc.property(
        fc.array(member, { minLength: 1, maxLength: 30 }),
        fc.double({ min: 0.01, max: 1, noNaN: true }),
        (ms, share) => {
          const b = centralBand(ms, share, { constants: REF });
          if (!b) throw new Error("expected a band");
          const total = ms.reduce((s, m) => s + m.count, 0);
          expect(b.total).toBe(total);
          expect(b.held).toBeGreaterThanOrEqual(Math.ceil(share * total - 1e-9));
          const inside = ms.filter((m) => {
            const x = Math.abs(m.eOverN - C_GAMMA);
            return x >= b.nMin && x <= b.nMax;
          });
          expect(inside.reduce((s, m) => s + m.count, 0)).toBeGreaterThanOrEqual(b.held);
        },
      ),
    );
  });
});
