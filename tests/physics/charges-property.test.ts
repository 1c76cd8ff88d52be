// Property test of the PQ-charge solver against the anomaly calculator: for random heavy-quark models whose
// charges satisfy random invariant Yukawa terms, the solver's E/N and N_DW are the calculator's.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import Fraction from "fraction.js";
import {
  anomaly,
  solvePqCharges,
  toFractionString,
  type FermionInput,
  type ScalarInput,
  type Term,
} from "../../src/physics";

// Representations (colour, SU(2) dimension, Y) of the heavy-quark table of Di Luzio, Mescia, Nardi, PRL 118 (2017)
// 031801 (from memory); any gauge representation would do for the property.
const REPS: [string, number, string][] = [
  ["3", 1, "-1/3"],
  ["3", 2, "1/6"],
  ["3", 3, "2/3"],
  ["6bar", 1, "2/3"],
  ["8", 1, "-1"],
  ["15", 1, "-1/3"],
];

const quarkArb = fc.record({
  rep: fc.integer({ min: 0, max: REPS.length - 1 }),
  sign: fc.constantFrom(1, -1),
  viaSigma: fc.boolean(),
  xR: fc.integer({ min: -5, max: 5 }),
  copies: fc.integer({ min: 1, max: 3 }),
});

describe("solver E/N = anomaly calculator E/N on charges that satisfy the terms (independent computation)", () => {
  test("random heavy quarks coupling to Φ, Φ*, σ or σ* with σ ~ Φ^k", () => {
    fc.assert(
      fc.property(fc.array(quarkArb, { minLength: 1, maxLength: 4 }), fc.integer({ min: 1, max: 3 }), (qs, k) => {
        const scalars: ScalarInput[] = [
          { name: "Phi", ew: { kind: "sm", dim: 1, y: 0 } },
          { name: "sigma", ew: { kind: "sm", dim: 1, y: 0 } },
        ];
        // Hand-made charges: X_Φ = 1, X_σ = k (term σ† Φ^k), X_L = X_R + s·X_scalar (Yukawa Q̄_L S^(s) Q_R).
        const terms: Term[] = [
          [
            { field: "sigma", conj: true },
            { field: "Phi", power: k },
          ],
        ];
        const fermions: FermionInput[] = [];
        qs.forEach((q, i) => {
          const [colour, dim, y] = REPS[q.rep];
          const ew = { kind: "sm" as const, dim, y };
          const xs = q.viaSigma ? k : 1;
          const L = `Q${i}_L`;
          const R = `Q${i}_R`;
          fermions.push({ name: L, colour, ew, chirality: "L", pq: q.xR + q.sign * xs, copies: q.copies });
          fermions.push({ name: R, colour, ew, chirality: "R", pq: q.xR, copies: q.copies });
          terms.push([
            { field: L, conj: true },
            { field: q.viaSigma ? "sigma" : "Phi", conj: q.sign < 0 },
            { field: R },
          ]);
        });
        const byHand = anomaly(fermions);
        const r = solvePqCharges({ fermions, scalars, terms, normalize: "Phi" });
        expect(r.ok).toBe(true);
        if (!r.ok) return;
        if (byHand.eOverN === null) {
          expect(r.axion).toBe(false);
        } else {
          expect(r.axion).toBe(true);
          expect(r.determined).toBe(true);
          expect(r.eOverN).toBe(toFractionString(byHand.eOverN));
          expect(r.nDW).toBe(toFractionString(byHand.domainWallExact!));
        }
        // The representative satisfies every kept term.
        for (const t of terms) {
          const sum = t.reduce(
            (a, f) => a.add(new Fraction(r.charges[f.field]).mul((f.conj ? -1 : 1) * (f.power ?? 1))),
            new Fraction(0),
          );
          expect(sum.equals(0)).toBe(true);
        }
      }),
      { numRuns: 200 },
    );
  });
});
