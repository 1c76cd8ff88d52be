// Checks of the PQ-charge solver against published models built from their Lagrangians: heavy-quark (KSVZ-type)
// models from their Yukawa, two-doublet (DFSZ-type) models from their Yukawas and portal, and the gauge check.
import { describe, expect, test } from "vitest";
import Fraction from "fraction.js";
import {
  parseTerm,
  solvePqCharges,
  type ChargeProblem,
  type FermionInput,
  type ScalarInput,
  type Term,
} from "../../src/physics";

const singlet: ScalarInput = { name: "Phi", ew: { kind: "sm", dim: 1, y: 0 } };

function terms(texts: string[], fermions: FermionInput[], scalars: ScalarInput[]): Term[] {
  const names = [...fermions.map((f) => f.name ?? ""), ...scalars.map((s) => s.name)];
  return texts.map((t) => {
    const r = parseTerm(t, names);
    if (!r.ok) throw new Error(`${t}: ${r.message} at ${r.position}`);
    return r.term;
  });
}

function solved(p: ChargeProblem) {
  const r = solvePqCharges(p);
  if (!r.ok) throw new Error(r.errors.join("; "));
  return r;
}

function vectorLike(name: string, colour: string, dim: number, y: string): FermionInput[] {
  const ew = { kind: "sm" as const, dim, y };
  return [
    { name: `${name}_L`, colour, ew, chirality: "L", pq: 0 },
    { name: `${name}_R`, colour, ew, chirality: "R", pq: 0 },
  ];
}

/**
 * Di Luzio, Mescia, Nardi, "Redefining the axion window", PRL 118 (2017) 031801, arXiv:1610.07593, Table I:
 * E/N and N_DW of the single heavy-quark representations with the Yukawa Φ Q̄_L Q_R (from memory, the table
 * was not at hand); (3,1,0) has E/N = 0 and N_DW = 1 (same paper, the original KSVZ model).
 */
const DLMN: [string, number, string, string, string][] = [
  ["3", 1, "0", "0", "1"],
  ["3", 1, "-1/3", "2/3", "1"],
  ["3", 1, "2/3", "8/3", "1"],
  ["3", 2, "1/6", "5/3", "2"],
  ["3", 2, "-5/6", "17/3", "2"],
  ["3", 2, "7/6", "29/3", "2"],
  ["3", 3, "-1/3", "14/3", "3"],
  ["3", 3, "2/3", "20/3", "3"],
  ["3", 3, "-4/3", "44/3", "3"],
  ["6bar", 1, "-1/3", "4/15", "5"],
  ["6bar", 1, "2/3", "16/15", "5"],
  ["6bar", 2, "1/6", "2/3", "10"],
  ["8", 1, "-1", "8/3", "6"],
  ["8", 2, "-1/2", "4/3", "12"],
  ["15", 1, "-1/3", "1/6", "20"],
  ["15", 1, "2/3", "2/3", "20"],
];

describe("heavy-quark models from their Yukawa Φ Q̄_L Q_R (Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801, Table I; from memory)", () => {
  for (const [colour, dim, y, eOverN, nDW] of DLMN) {
    test(`(${colour}, ${dim}, ${y}): E/N = ${eOverN}, N_DW = ${nDW}; the bare mass Q̄_L Q_R stays forbidden`, () => {
      const fermions = vectorLike("Q", colour, dim, y);
      const scalars = [singlet];
      const r = solved({
        fermions,
        scalars,
        terms: terms(["Qbar_L Phi Q_R"], fermions, scalars),
        forbidden: terms(["Qbar_L Q_R", "Q_L^† Q_R Phi^2 Phi^†"], fermions, scalars),
        normalize: "Phi",
      });
      expect([r.axion, r.determined, r.eOverN, r.nDW]).toEqual([true, true, eOverN, nDW]);
      // The Yukawa fixes X_L − X_R = X_Φ = 1; the common shift of Q_L and Q_R is vector-like (no anomaly).
      expect(r.charges.Phi).toBe("1");
      expect(new Fraction(r.charges.Q_L).sub(new Fraction(r.charges.Q_R)).toFraction()).toBe("1");
      expect(r.forbiddenAllowed).toEqual([1]);
      expect(r.free).toEqual([]);
    });
  }

  test("a second heavy quark without a Yukawa leaves E/N undetermined: its charges are free (a charge scan)", () => {
    const fermions = [...vectorLike("Q1", "3", 1, "-1/3"), ...vectorLike("Q2", "3", 1, "2/3")];
    const r = solved({
      fermions,
      scalars: [singlet],
      terms: terms(["Q1bar_L Phi Q1_R"], fermions, [singlet]),
      normalize: "Phi",
    });
    expect(r.axion).toBe(true);
    expect(r.determined).toBe(false);
    expect(r.eOverN).toBeNull();
    expect(r.nDW).toBeNull();
    expect(r.free).toEqual(["Q2_L", "Q2_R"]);
    expect(r.scanExact).toBe(true);
    expect(r.undetermined).toEqual(expect.arrayContaining(["Q2_L", "Q2_R"]));
  });

  test("free charges that another fermion's charge follows from are not offered as a table scan (linear algebra: the solution direction also moves Q1_L)", () => {
    // ε Q1_L Q2_L Q3_L (three colour triplets, Y = −1/3 + 2/3 − 1/3 = 0) ties 𝒳(Q1_L) to 𝒳(Q2_L) + 𝒳(Q3_L).
    const fermions = [
      ...vectorLike("Q1", "3", 1, "-1/3"),
      ...vectorLike("Q2", "3", 1, "2/3"),
      ...vectorLike("Q3", "3", 1, "-1/3"),
    ];
    const r = solved({
      fermions,
      scalars: [singlet],
      terms: terms(["Q1_L Q2_L Q3_L", "Q3bar_L Phi Q3_R"], fermions, [singlet]),
      normalize: "Phi",
    });
    expect(r.determined).toBe(false);
    expect(r.free).toContain("Q2_L");
    expect(r.scanExact).toBe(false);
  });

  test("two heavy quarks coupling to Φ and to Φ* give N = 0 for every solution: no QCD axion (Plakkot, Hoof, PRD 104 (2021) 075017, arXiv:2107.12378, Sec. II: signed representations can cancel N)", () => {
    const fermions = [...vectorLike("Q1", "3", 1, "-1/3"), ...vectorLike("Q2", "3", 1, "-1/3")];
    const r = solved({
      fermions,
      scalars: [singlet],
      terms: terms(["Q1bar_L Phi Q1_R", "Q2bar_L Phi^† Q2_R"], fermions, [singlet]),
      normalize: "Phi",
    });
    expect([r.axion, r.determined, r.eOverN, r.nDW, r.N]).toEqual([false, false, null, null, "0"]);
  });
});

/** The Standard Model fermions of one generation (×3 copies) with their hypercharges (PDG review, "Electroweak model"). */
function smFermions(): FermionInput[] {
  return [
    { name: "q_L", colour: "3", ew: { kind: "sm", dim: 2, y: "1/6" }, chirality: "L", pq: 0, copies: 3 },
    { name: "u_R", colour: "3", ew: { kind: "sm", dim: 1, y: "2/3" }, chirality: "R", pq: 0, copies: 3 },
    { name: "d_R", colour: "3", ew: { kind: "sm", dim: 1, y: "-1/3" }, chirality: "R", pq: 0, copies: 3 },
    { name: "l_L", colour: "1", ew: { kind: "sm", dim: 2, y: "-1/2" }, chirality: "L", pq: 0, copies: 3 },
    { name: "e_R", colour: "1", ew: { kind: "sm", dim: 1, y: "-1" }, chirality: "R", pq: 0, copies: 3 },
  ];
}
const doublets: ScalarInput[] = [
  { name: "H1", ew: { kind: "sm", dim: 2, y: "1/2" } },
  { name: "H2", ew: { kind: "sm", dim: 2, y: "1/2" } },
  singlet,
];

describe("two-doublet models from their Yukawas and portal (Di Luzio, Giannotti, Nardi, Visinelli, Phys. Rept. 870 (2020) 1, arXiv:2003.01100, Sec. 2.7 on DFSZ; from memory)", () => {
  const quarkYukawas = ["qbar_L H1 d_R", "qbar_L H2^† u_R", "H2^† H1 Phi^†2"];
  test("leptons coupled like down quarks (l̄ H₁ e_R): E/N = 8/3, N_DW = 6", () => {
    const fermions = smFermions();
    const r = solved({
      fermions,
      scalars: doublets,
      terms: terms([...quarkYukawas, "lbar_L H1 e_R"], fermions, doublets),
      forbidden: terms(["H2^† H1 Phi^†", "H2^† H1 Phi^2", "qbar_L H1 u_R"], fermions, doublets),
      normalize: "Phi",
    });
    expect([r.axion, r.determined, r.eOverN, r.nDW]).toEqual([true, true, "8/3", "6"]);
    expect(r.forbiddenAllowed).toEqual([]);
    // X_u + X_d = 2 X_Φ (the portal), with X_u = X(q_L) − X(u_R) and X_d = X(q_L) − X(d_R) as in the review.
    const x = (n: string) => new Fraction(r.charges[n]);
    expect(
      x("u_R")
        .sub(x("q_L"))
        .add(x("d_R").sub(x("q_L")))
        .toFraction(),
    ).toBe("-2");
  });
  test("leptons coupled to the doublet of the up quarks (l̄ H₂ e_R): E/N = 2/3, N_DW = 6", () => {
    const fermions = smFermions();
    const r = solved({
      fermions,
      scalars: doublets,
      terms: terms([...quarkYukawas, "l̄_L H2 e_R"], fermions, doublets),
      normalize: "Phi",
    });
    expect([r.axion, r.determined, r.eOverN, r.nDW]).toEqual([true, true, "2/3", "6"]);
  });
  test("without the portal the doublets' PQ charge is not tied to Φ: E/N is left open (DFSZ needs the portal; same review)", () => {
    const fermions = smFermions();
    const r = solved({
      fermions,
      scalars: doublets,
      terms: terms(quarkYukawas.slice(0, 2), fermions, doublets),
      normalize: "Phi",
    });
    expect(r.axion).toBe(true);
    expect(r.determined).toBe(false);
  });
});
