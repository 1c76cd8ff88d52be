// Checks of the term syntax (ASCII and Unicode forms, errors with positions), the gauge check of terms (group
// theory from textbooks) and the solver's input errors.
import { describe, expect, test } from "vitest";
import { formatTerm, parseTerm, solvePqCharges, type FermionInput, type ScalarInput } from "../../src/physics";

const NAMES = ["Q_L", "Q_R", "Phi", "H1", "H2", "sigma"];
const term = (t: string) => {
  const r = parseTerm(t, NAMES);
  if (!r.ok) throw new Error(`${r.message} at ${r.position}`);
  return r.term;
};

describe("term syntax (notation as in the heavy-quark and DFSZ literature, e.g. Di Luzio et al., Phys. Rept. 870 (2020) 1)", () => {
  test("ASCII and Unicode spellings of the heavy-quark Yukawa Q̄_L Φ Q_R read the same", () => {
    const want = [
      { field: "Q_L", conj: true },
      { field: "Phi", conj: false },
      { field: "Q_R", conj: false },
    ];
    for (const t of [
      "Qbar_L Phi Q_R",
      "Q̄_L Φ Q_R",
      "Q_L^† Phi Q_R",
      "conj(Q_L) Phi Q_R",
      "Q_L^dag · Phi · Q_R",
      "Q_L* Phi * Q_R",
    ])
      expect(term(t), t).toEqual(want);
  });
  test("the portal H₂† H₁ Φ†² in its spellings, powers as ^2, ² or conj(…)^2", () => {
    const want = [
      { field: "H2", conj: true },
      { field: "H1", conj: false },
      { field: "Phi", conj: true, power: 2 },
    ];
    for (const t of ["H2^† H1 Phi^†2", "H₂† H₁ Φ†²", "H_2^+ H_1 conj(Phi)^2", "H2^{dag} H1 Phi^{†2}", "H̃2 H1 Phi^*^2"])
      expect(term(t), t).toEqual(want);
    expect(term("σ^3")).toEqual([{ field: "sigma", conj: false, power: 3 }]);
  });
  test("formatTerm writes what parseTerm reads back", () => {
    const t = term("H2^† H1 Phi^†2");
    expect(formatTerm(t)).toBe("H2† H1 Phi†^2");
    expect(term(formatTerm(t))).toEqual(t);
  });
  test("errors name the 1-based character position", () => {
    expect(parseTerm("Q_L Foo Q_R", NAMES)).toEqual({ ok: false, message: 'unknown field "Foo"', position: 5 });
    expect(parseTerm("Q_L Phi^", NAMES)).toMatchObject({ ok: false, position: 8 });
    expect(parseTerm("Q_L Phi^2x", NAMES)).toMatchObject({ ok: false, message: 'unexpected "x"', position: 10 });
    expect(parseTerm("conj(Phi Q_L", NAMES)).toMatchObject({ ok: false, position: 10 });
    expect(parseTerm("Phi^0", NAMES)).toMatchObject({ ok: false, position: 1 });
    expect(parseTerm("  ", NAMES)).toMatchObject({ ok: false, message: "the term is empty" });
  });
});

const phi: ScalarInput = { name: "Phi", ew: { kind: "sm", dim: 1, y: 0 } };
const doublet = (name: string, y = "1/2"): ScalarInput => ({ name, ew: { kind: "sm", dim: 2, y } });
const triplet = (name: string, y = "0"): ScalarInput => ({ name, ew: { kind: "sm", dim: 3, y } });
const quark = (name: string, colour: string, y: string, chirality: "L" | "R" = "L"): FermionInput => ({
  name,
  colour,
  ew: { kind: "sm", dim: 1, y },
  chirality,
  pq: 0,
});

function errorsOf(scalars: ScalarInput[], fermions: FermionInput[], texts: string[]): string[] {
  const names = [...scalars.map((s) => s.name), ...fermions.map((f) => f.name ?? "")];
  const terms = texts.map((t) => {
    const r = parseTerm(t, names);
    if (!r.ok) throw new Error(r.message);
    return r.term;
  });
  const r = solvePqCharges({ fermions, scalars, terms, normalize: scalars[0].name });
  return r.ok ? [] : r.errors;
}

describe("gauge check of every term before solving", () => {
  test("hypercharge must add up to 0; the failing term is named with the reason and nothing is solved", () => {
    const errs = errorsOf([phi], [quark("Q_L", "3", "-1/3"), quark("Q_R", "3", "2/3", "R")], ["Qbar_L Phi Q_R"]);
    expect(errs).toEqual(["term 1 (Q_L† Phi Q_R): hypercharge adds up to 1, not 0"]);
  });
  test("colour: triality (p − q mod 3) must vanish, and two factors need conjugate irreps (Slansky, Phys. Rept. 79 (1981) 1)", () => {
    const q = (n: string, c: string) => quark(n, c, "0");
    expect(errorsOf([phi], [q("A", "3"), q("B", "3")], ["A B Phi"])[0]).toMatch(/colour: triality 2 ≠ 0/);
    expect(errorsOf([phi], [q("A", "3"), q("B", "6bar")], ["A^† B Phi"])[0]).toMatch(
      /colour: 3bar × 6bar has no singlet/,
    );
    expect(errorsOf([phi], [q("A", "8")], ["A Phi"])[0]).toMatch(/a single 8 has no singlet/);
    // 3 × 3 × 3 contains the ε singlet; 6̄ × 6 and 8 × 8 contain a singlet.
    expect(errorsOf([phi], [q("A", "3")], ["A^3 Phi"])).toEqual([]);
    expect(errorsOf([phi], [q("A", "6bar"), q("B", "6bar")], ["A^† B Phi"])).toEqual([]);
    expect(errorsOf([phi], [q("A", "8")], ["A^2 Phi"])).toEqual([]);
  });
  test("SU(2): a singlet needs an integer total spin and the largest spin ≤ the sum of the others (angular-momentum addition, e.g. Sakurai, Modern Quantum Mechanics, Sec. 3.8)", () => {
    const s = [
      phi,
      doublet("H1"),
      doublet("H2"),
      triplet("T"),
      { name: "F", ew: { kind: "sm", dim: 4, y: "1/2" } } as ScalarInput,
    ];
    expect(errorsOf(s, [], ["H1^† H2"])).toEqual([]);
    expect(errorsOf(s, [], ["H1^† H2 T"])).toEqual([]); // ½ ⊗ ½ ∋ 1
    expect(errorsOf(s, [], ["H1^† H2 H1"]).join(" ")).toMatch(/SU\(2\)_L: an odd number/);
    expect(errorsOf(s, [], ["H1^† F T^2"])).toEqual([]); // ½ ⊗ 3/2 ⊗ 1 ⊗ 1 ∋ 0
    expect(errorsOf(s, [], ["F^† H1 Phi"])[0]).toMatch(
      /SU\(2\)_L: SU\(2\) multiplets of dimensions 4 × 2 have no singlet/,
    );
    expect(errorsOf(s, [], ["F^† H1 T"])).toEqual([]); // 3/2 ⊗ ½ ∋ 1
  });
  test("SU(3)_L × U(1)_X terms: X adds up to 0, SU(3)_L allows a singlet; a singlet Φ entered as SU(2) × U(1) fits (3-3-1 scalar triplets η, ρ, χ with β = −1/√3: Foot, Long, Tran, PRD 50 (1994) R34; from memory)", () => {
    const t = (name: string, x: string): ScalarInput => ({ name, ew: { kind: "su3l", rep: "3", x, b: "-1/3" } });
    const s = [phi, t("eta", "-1/3"), t("rho", "2/3"), t("chi", "-1/3")];
    // ε_ijk η^i ρ^j χ^k: three triplets contain a singlet and X = −1/3 + 2/3 − 1/3 = 0.
    expect(errorsOf(s, [], ["eta rho chi Phi^† Phi"])).toEqual([]);
    expect(errorsOf(s, [], ["eta^† chi Phi"])).toEqual([]);
    expect(errorsOf(s, [], ["rho^† eta Phi"])).toEqual(["term 1 (rho† eta Phi): U(1)_X charge adds up to -1, not 0"]);
    expect(errorsOf(s, [], ["eta chi Phi"]).join(" ")).toMatch(/SU\(3\)_L: triality 2 ≠ 0/);
    // An SU(3)_L singlet with X = 0 is the same field as an SU(2) × U(1) singlet with Y = 0.
    const su3lPhi: ScalarInput = { name: "Phi", ew: { kind: "su3l", rep: "1", x: "0", b: "0" } };
    expect(errorsOf([su3lPhi, t("eta", "-1/3"), t("chi", "-1/3")], [], ["eta^† chi Phi"])).toEqual([]);
    // A doublet and a triplet of different weak groups cannot share a term.
    expect(errorsOf([phi, doublet("H"), t("eta", "1/2")], [], ["H^† eta"])[0]).toBe(
      "term 1 (H† eta): mixes SU(2)_L × U(1)_Y multiplets with SU(3)_L × U(1)_X multiplets",
    );
  });
  test("unknown fields, unnamed fermions, a repeated name and a normalised field that is no scalar are named", () => {
    const r = solvePqCharges({
      fermions: [quark("Q_L", "3", "0"), { ...quark("", "3", "0"), name: undefined }, quark("Phi", "1", "0")],
      scalars: [phi],
      terms: [[{ field: "X" }]],
      normalize: "Psi",
    });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors).toEqual([
      "fermion 2 has no name (terms refer to fields by name)",
      'fermion 3: the name "Phi" is used twice',
      'the normalised field "Psi" is not one of the scalars',
      'term 1 (X): unknown field "X"',
    ]);
  });
  test("terms that force the normalised charge to 0 are refused (Φ² alone admits no U(1) with X_Φ = 1)", () => {
    expect(errorsOf([phi], [], ["Phi^2"])).toEqual([
      "the kept terms force the PQ charge of Phi to 0: no PQ symmetry is left",
    ]);
  });
});
