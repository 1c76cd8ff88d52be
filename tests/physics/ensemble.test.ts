// Heavy-quark ensembles: the fifteen single representations and the multi-quark counts of the published
// catalogue, and analytic properties of additive and signed charge assignments.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { Fraction, heavyQuarkEnsemble, HEAVY_QUARK_TAGS, landauCheck, multisetCount } from "../../src/physics";

/**
 * Di Luzio, Mescia, Nardi, "Redefining the axion window", PRL 118 (2017) 031801, Table I: E/N of R1…R15
 * (from memory; the table itself was not reached, the abstract was: fifteen representations pass both criteria).
 * The fifteen (colour, SU(2), Y) triples, up to conjugation, are rows of the representation table in Plakkot & Hoof's
 * public catalogue code (github.com/sebhoof/ksvz_axion_catalogue, ksvz_models/data/rep_info.dat), checked; the E/N
 * then follow from the anomaly formula.
 */
const PRL_TABLE: Record<string, string> = {
  R1: "2/3",
  R2: "8/3",
  R3: "5/3",
  R4: "17/3",
  R5: "29/3",
  R6: "14/3",
  R7: "20/3",
  R8: "44/3",
  R9: "4/15",
  R10: "16/15",
  R11: "2/3",
  R12: "8/3",
  R13: "4/3",
  R14: "1/6",
  R15: "2/3",
};

const frac = (s: string) => new Fraction(s);

describe("single representations (Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801)", () => {
  test.each(Object.entries(PRL_TABLE))("%s has E/N = %s", (tag, eOverN) => {
    const r = heavyQuarkEnsemble({ reps: [tag], maxQuarks: 1 });
    expect(r.models).toBe(1);
    expect(r.distinct.map((d) => d.eOverN)).toEqual([eOverN]);
  });

  test("every one of the fifteen passes the Landau-pole criterion at the defaults (the paper's selection)", () => {
    const r = heavyQuarkEnsemble({ maxQuarks: 1 });
    expect(r.models).toBe(15);
    expect(r.distinct.reduce((s, d) => s + d.count, 0)).toBe(15);
  });
});

describe("counts of multisets (stars and bars: C(n + k − 1, k), e.g. Feller, Probability Theory I, §II.5)", () => {
  test("C(n + k − 1, k) against direct enumeration of non-decreasing index tuples", () => {
    const brute = (n: number, k: number): number =>
      k === 0 ? 1 : Array.from({ length: n }, (_, i) => brute(n - i, k - 1)).reduce((a, b) => a + b, 0);
    for (const [n, k] of [
      [15, 1],
      [15, 2],
      [15, 3],
      [4, 6],
      [7, 4],
    ])
      expect(multisetCount(n, k)).toBe(brute(n, k));
    expect(multisetCount(15, 2)).toBe(120); // C(16, 2)
  });

  test("without the criterion the ensemble holds every multiset of 1 … N_Q representations", () => {
    for (const [reps, maxQuarks] of [
      [HEAVY_QUARK_TAGS.slice(), 3],
      [["R1", "R3", "R9", "R14"], 5],
    ] as const) {
      const r = heavyQuarkEnsemble({ reps: [...reps], maxQuarks, landauPole: false });
      let expected = 0;
      for (let k = 1; k <= maxQuarks; k++) expected += multisetCount(reps.length, k);
      expect(r.models).toBe(expected);
    }
  });
});

describe("additive and signed charges (analytic: E = ΣE_i, N = ΣN_i for X = ±1)", () => {
  test("R1 + R8: additive (1/3 + 22)/(1/2 + 3/2) = 67/6; signed (1/3 − 22)/(1/2 − 3/2) = 65/3", () => {
    const add = heavyQuarkEnsemble({ reps: ["R1", "R8"], maxQuarks: 2, landauPole: false });
    expect(add.distinct.map((d) => d.eOverN)).toEqual(["2/3", "67/6", "44/3"]);
    const signed = heavyQuarkEnsemble({ reps: ["R1", "R8"], maxQuarks: 2, landauPole: false, charges: "signed" });
    expect(signed.distinct.map((d) => d.eOverN)).toContain("65/3");
  });

  test("additive E/N is the N-weighted mean of its members, so it stays within their [min, max]", () => {
    fc.assert(
      fc.property(fc.subarray(HEAVY_QUARK_TAGS.slice(), { minLength: 1, maxLength: 5 }), (reps) => {
        const singles = heavyQuarkEnsemble({ reps, maxQuarks: 1, landauPole: false }).distinct.map((d) =>
          frac(d.eOverN),
        );
        const lo = singles.reduce((a, b) => (a.compare(b) < 0 ? a : b));
        const hi = singles.reduce((a, b) => (a.compare(b) > 0 ? a : b));
        for (const d of heavyQuarkEnsemble({ reps, maxQuarks: 3, landauPole: false }).distinct) {
          expect(frac(d.eOverN).compare(lo)).toBeGreaterThanOrEqual(0);
          expect(frac(d.eOverN).compare(hi)).toBeLessThanOrEqual(0);
        }
      }),
      { numRuns: 20 },
    );
  });

  test("signed ensembles reach outside the members' range, and N = 0 models are dropped and counted", () => {
    const r = heavyQuarkEnsemble({ reps: ["R1", "R3"], maxQuarks: 2, charges: "signed", landauPole: false });
    // R3 − R1: (5/3 − 1/3)/(1 − 1/2) = 8/3, above both members (2/3 and 5/3).
    expect(r.distinct.map((d) => d.eOverN)).toContain("8/3");
    // {R1}, {R3}: one model each; {R1,R1}, {R3,R3}: same sign, or opposite (N = 0, dropped); {R1,R3}: same
    // sign or opposite (N = ±1/2). Kept: R1, R3, 2R1, 2R3, R1+R3, R3−R1 → 6; dropped: 2.
    expect(r.models).toBe(6);
    expect(r.zeroN).toBe(2);
  });
});

// V. Plakkot, S. Hoof, "Anomaly Ratio Distributions of Hadronic Axion Models with Multiple Heavy Quarks",
// arXiv:2107.12378, abstract (checked on the arXiv listing): "N_Q ≤ 28 and only 820 different anomaly ratios E/N exist
// (443 when considering additive representations, 12 when all new quarks transform under the same representation)".
// Journal reference Phys. Rev. D 104 (2021) 075017 from memory.
describe("multi-quark catalogue (Plakkot & Hoof, arXiv:2107.12378, abstract)", () => {
  test("additive: N_Q ≤ 28 and 443 distinct E/N", () => {
    const r = heavyQuarkEnsemble({ maxQuarks: 40 });
    expect(r.largestNQ).toBe(28);
    expect(r.distinct).toHaveLength(443);
  });

  test("all heavy quarks in one representation: 12 distinct E/N", () => {
    const all = new Set<string>();
    for (const tag of HEAVY_QUARK_TAGS)
      for (const d of heavyQuarkEnsemble({ reps: [tag], maxQuarks: 28 }).distinct) all.add(d.eOverN);
    expect(all.size).toBe(12);
  });

  test("signed charges: 820 distinct E/N", { timeout: 120_000 }, () => {
    const r = heavyQuarkEnsemble({ maxQuarks: 28, charges: "signed" });
    expect(r.distinct).toHaveLength(820);
  });
});

describe("Landau-pole criterion", () => {
  test("monotone in added matter and stricter for a lower pole scale", () => {
    const check = landauCheck();
    const low = landauCheck({ poleScaleGeV: 1e16 });
    const r1 = heavyQuarkEnsemble({ reps: ["R1"], maxQuarks: 60 });
    expect(r1.largestNQ).toBeLessThan(60);
    expect(
      heavyQuarkEnsemble({ reps: ["R1"], maxQuarks: 60, landauPole: { poleScaleGeV: 1e16 } }).largestNQ,
    ).toBeGreaterThanOrEqual(r1.largestNQ);
    expect(check.opts.heavyMassGeV).toBe(5e11);
    expect(low.opts.poleScaleGeV).toBe(1e16);
  });

  test("bad settings are refused with a message", () => {
    expect(() => landauCheck({ heavyMassGeV: 1e19 })).toThrow(/heavy-quark mass/);
    expect(() => heavyQuarkEnsemble({ maxQuarks: 0 })).toThrow(/largest number of heavy quarks/);
    expect(() => heavyQuarkEnsemble({ reps: ["R16"], maxQuarks: 1 })).toThrow(/unknown representation "R16"/);
    expect(() => heavyQuarkEnsemble({ maxQuarks: 28, landauPole: false })).toThrow(/multisets without the Landau-pole/);
  });
});
