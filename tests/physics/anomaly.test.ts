// Checks of the anomaly calculator: electric charges of SM-like and SU(3)_L multiplets against the models they
// come from, the E and N sums, invariances (fast-check), N = 0, and input errors that name the field.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import Fraction from "fraction.js";
import {
  AnomalyInputError,
  anomaly,
  electricCharges,
  parseRational,
  toFractionString,
  tryAnomaly,
  type FermionInput,
} from "../../src/physics";

const str = (rs: Fraction[]) => rs.map((r) => toFractionString(r));
const frac = (r: Fraction | null) => (r === null ? null : toFractionString(r));

describe("exact rationals", () => {
  test("toFractionString gives reduced p/q with the sign on p", () => {
    expect(toFractionString(new Fraction(-4, 6))).toBe("-2/3");
    expect(toFractionString(new Fraction(8, -2))).toBe("-4");
    expect(toFractionString(new Fraction(0))).toBe("0");
    expect(toFractionString(new Fraction(44, 3))).toBe("44/3");
  });
  test("parseRational accepts integers and p/q, refuses decimals and text", () => {
    const ok: [unknown, string][] = [
      [3, "3"],
      ["-1/3", "-1/3"],
      ["\u22121/3", "-1/3"],
      [" 2 / 6 ", "1/3"],
      ["1/-3", "-1/3"],
      ["+5", "5"],
    ];
    for (const [input, expected] of ok) {
      const r = parseRational(input);
      expect(r.ok && toFractionString(r.value)).toBe(expected);
    }
    for (const bad of ["abc", "0.3333", 0.5, "1/0", "", "1/3/4", NaN, undefined])
      expect(parseRational(bad).ok).toBe(false);
  });
});

describe("electric charges", () => {
  test("SM-like Q = T₃ + Y: quark doublet (2/3, −1/3), lepton doublet (0, −1), triplet Y = 0 (1, 0, −1) (Gell-Mann–Nishijima; PDG)", () => {
    expect(str(electricCharges({ kind: "sm", dim: 2, y: "1/6" }))).toEqual(["2/3", "-1/3"]);
    expect(str(electricCharges({ kind: "sm", dim: 2, y: "-1/2" }))).toEqual(["0", "-1"]);
    expect(str(electricCharges({ kind: "sm", dim: 3, y: 0 }))).toEqual(["1", "0", "-1"]);
    expect(str(electricCharges({ kind: "sm", dim: 1, y: "2/3" }))).toEqual(["2/3"]);
  });
  test("SU(3)_L with β = −√3 (b = −1): (ν, e, e^c), (u, d, J) with Q_J = 5/3, antitriplet with −4/3 (Pisano & Pleitez, PRD 46 (1992) 410; Frampton, PRL 69 (1992) 2889; from memory)", () => {
    expect(str(electricCharges({ kind: "su3l", rep: "3", x: 0, b: -1 }))).toEqual(["0", "-1", "1"]);
    expect(str(electricCharges({ kind: "su3l", rep: "3", x: "2/3", b: -1 }))).toEqual(["2/3", "-1/3", "5/3"]);
    expect(str(electricCharges({ kind: "su3l", rep: "3bar", x: "-1/3", b: -1 }))).toEqual(["-1/3", "2/3", "-4/3"]);
  });
  test("SU(3)_L with β = −1/√3 (b = −1/3): (ν, e, N⁰), (u, d, U), (d, u, D) (Foot, Long, Tran, PRD 50 (1994) R34; from memory)", () => {
    expect(str(electricCharges({ kind: "su3l", rep: "3", x: "-1/3", b: "-1/3" }))).toEqual(["0", "-1", "0"]);
    expect(str(electricCharges({ kind: "su3l", rep: "3", x: "1/3", b: "-1/3" }))).toEqual(["2/3", "-1/3", "2/3"]);
    expect(str(electricCharges({ kind: "su3l", rep: "3bar", x: 0, b: "-1/3" }))).toEqual(["-1/3", "2/3", "-1/3"]);
    expect(str(electricCharges({ kind: "su3l", rep: "1", x: "2/3", b: "-1/3" }))).toEqual(["2/3"]);
  });
  test("the SU(3)_L charges sum to 3X (T₃ and T₈ are traceless; Q = T₃ + βT₈ + X as in Pisano, Pleitez, PRD 46 (1992) 410, from memory)", () => {
    fc.assert(
      fc.property(rational(), rational(), fc.constantFrom("3" as const, "3bar" as const), (x, b, rep) => {
        const sum = electricCharges({ kind: "su3l", rep, x, b }).reduce((a, c) => a.add(c), new Fraction(0));
        expect(sum.equals(new Fraction(x).mul(3))).toBe(true);
      }),
    );
  });
});

describe("E and N (N = Σ X·T·n_w, E = Σ X·d·ΣQ²: Di Luzio, Giannotti, Nardi, Visinelli, Phys. Rept. 870 (2020) 1, eqs. 2.44–2.45 from memory)", () => {
  test("one heavy quark (3,1,−1/3) with X_L = 1: E = 1/3, N = 1/2, E/N = 2/3, N_DW = 1 (Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801; from memory)", () => {
    const r = anomaly([
      { name: "Q_L", colour: "3", ew: { kind: "sm", dim: 1, y: "-1/3" }, chirality: "L", pq: 1 },
      { name: "Q_R", colour: "3", ew: { kind: "sm", dim: 1, y: "-1/3" }, chirality: "R", pq: 0 },
    ]);
    expect([frac(r.E), frac(r.N), frac(r.eOverN), r.domainWall]).toEqual(["1/3", "1/2", "2/3", 1]);
    expect(r.contributions.map((c) => [c.name, frac(c.dE), frac(c.dN)])).toEqual([
      ["Q_L", "1/3", "1/2"],
      ["Q_R", "0", "0"],
    ]);
  });
  test("colour by Dynkin labels, by name and by label string give the same result", () => {
    const mk = (colour: FermionInput["colour"]): FermionInput => ({
      colour,
      ew: { kind: "sm", dim: 1, y: "2/3" },
      chirality: "L",
      pq: 1,
    });
    const a = anomaly([mk("6bar")]);
    for (const c of [{ p: 0, q: 2 }, "(0,2)", "6̄"] as const) expect(anomaly([mk(c)]).E.equals(a.E)).toBe(true);
    // (6̄,1,2/3): E/N = 16/15 (DLMN 2017, Table I; from memory).
    expect(frac(a.eOverN)).toBe("16/15");
  });
  test("SU(3)_L triplet equals the explicit multiplet with the same charges (minimal 3-3-1 quark triplet, Pisano & Pleitez 1992)", () => {
    const base = { colour: "3", chirality: "L", pq: "1/2", copies: 2 } as const;
    const a = anomaly([{ ...base, ew: { kind: "su3l", rep: "3", x: "2/3", b: -1 } }]);
    const b = anomaly([{ ...base, ew: { kind: "explicit", charges: ["2/3", "-1/3", "5/3"] } }]);
    expect(a.E.equals(b.E) && a.N.equals(b.N)).toBe(true);
    // E = X·d·ΣQ²·copies = 1/2·3·(4+1+25)/9·2 = 10, N = X·T·n_w·copies = 1/2·1/2·3·2 = 3/2.
    expect([frac(a.E), frac(a.N)]).toEqual(["10", "3/2"]);
  });
  test("N_DW = |2N/X_S| with the scalar charge as given (common practice; e.g. Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801)", () => {
    const q: FermionInput[] = [{ colour: "8", ew: { kind: "sm", dim: 1, y: -1 }, chirality: "L", pq: 1 }];
    expect(anomaly(q).domainWall).toBe(6);
    expect(anomaly(q, { scalarCharge: 2 }).domainWall).toBe(3);
    expect(anomaly(q, { scalarCharge: "-1/2" }).domainWall).toBe(12);
    const odd = anomaly(q, { scalarCharge: 4 });
    expect(frac(odd.domainWallExact)).toBe("3/2");
    expect(odd.notes.join(" ")).toContain("not an integer");
  });
  test("N = 0 (colour singlets only) gives E/N undefined: eOverN null, N_DW null, no division by zero", () => {
    const r = anomaly([
      { colour: "1", ew: { kind: "sm", dim: 1, y: -1 }, chirality: "L", pq: 1 },
      { colour: "1", ew: { kind: "sm", dim: 2, y: "-1/2" }, chirality: "R", pq: 3 },
    ]);
    expect(frac(r.N)).toBe("0");
    expect(r.eOverN).toBeNull();
    expect(r.domainWall).toBeNull();
    expect(r.notes.join(" ")).toContain("E/N undefined");
    expect(anomaly([]).eOverN).toBeNull();
  });
});

/** A small rational as a string "p/q". */
function rational(maxNum = 12, maxDen = 6) {
  return fc
    .tuple(fc.integer({ min: -maxNum, max: maxNum }), fc.integer({ min: 1, max: maxDen }))
    .map(([p, q]) => `${p}/${q}`);
}

function nonZeroRational() {
  return fc
    .tuple(fc.integer({ min: 1, max: 9 }), fc.integer({ min: 1, max: 6 }), fc.boolean())
    .map(([p, q, neg]) => `${neg ? "-" : ""}${p}/${q}`);
}

const ewArb = fc.oneof(
  fc.record({ kind: fc.constant("sm" as const), dim: fc.integer({ min: 1, max: 4 }), y: rational() }),
  fc.record({
    kind: fc.constant("su3l" as const),
    rep: fc.constantFrom("1" as const, "3" as const, "3bar" as const),
    x: rational(),
    b: fc.constantFrom("1/3", "-1/3", "1", "-1"),
  }),
  fc.record({ kind: fc.constant("explicit" as const), charges: fc.array(rational(), { minLength: 1, maxLength: 3 }) }),
);

const fermionArb: fc.Arbitrary<FermionInput> = fc.record({
  colour: fc.record({ p: fc.integer({ min: 0, max: 3 }), q: fc.integer({ min: 0, max: 3 }) }),
  ew: ewArb,
  chirality: fc.constantFrom("L" as const, "R" as const),
  pq: rational(),
  copies: fc.integer({ min: 0, max: 3 }),
});

const modelArb = fc.array(fermionArb, { minLength: 1, maxLength: 5 });

function sameRatio(a: Fraction | null, b: Fraction | null): boolean {
  return a === null ? b === null : b !== null && a.equals(b);
}

describe("invariances (property tests, fast-check)", () => {
  test("E/N and N_DW are unchanged when every PQ charge and X_S are rescaled by a non-zero rational (E, N linear in X)", () => {
    fc.assert(
      fc.property(modelArb, nonZeroRational(), (model, lambda) => {
        const l = new Fraction(lambda);
        const scaled = model.map((f) => ({ ...f, pq: new Fraction(f.pq).mul(l).toFraction() }));
        const a = anomaly(model);
        const b = anomaly(scaled, { scalarCharge: l.toFraction() });
        expect(sameRatio(a.eOverN, b.eOverN)).toBe(true);
        expect(b.E.equals(a.E.mul(l))).toBe(true);
        expect(b.domainWall).toBe(a.domainWall);
      }),
    );
  });
  test("adding a vector-like pair (same rep, L and R with equal PQ charge) changes nothing", () => {
    fc.assert(
      fc.property(modelArb, fermionArb, (model, pair) => {
        const a = anomaly(model);
        const b = anomaly([...model, { ...pair, chirality: "L" }, { ...pair, chirality: "R" }]);
        expect(b.E.equals(a.E) && b.N.equals(a.N)).toBe(true);
        expect(sameRatio(a.eOverN, b.eOverN)).toBe(true);
      }),
    );
  });
  test("a right-handed field equals the left-handed conjugate: (q,p), −Q, −X", () => {
    fc.assert(
      fc.property(fermionArb, fc.array(rational(), { minLength: 1, maxLength: 3 }), (f, charges) => {
        const right: FermionInput = { ...f, chirality: "R", ew: { kind: "explicit", charges } };
        const { p, q } = f.colour as { p: number; q: number };
        const left: FermionInput = {
          ...f,
          colour: { p: q, q: p },
          chirality: "L",
          pq: new Fraction(f.pq).neg().toFraction(),
          ew: { kind: "explicit", charges: charges.map((c) => new Fraction(c).neg().toFraction()) },
        };
        const a = anomaly([right]);
        const b = anomaly([left]);
        expect(a.E.equals(b.E) && a.N.equals(b.N)).toBe(true);
      }),
    );
  });
  test("copies = n is n repeated entries, and E, N add over fields", () => {
    fc.assert(
      fc.property(modelArb, fc.integer({ min: 0, max: 4 }), (model, n) => {
        const one = model.map((f) => ({ ...f, copies: 1 }));
        const many = one.map((f) => ({ ...f, copies: n }));
        const a = anomaly(one);
        const b = anomaly(many);
        expect(b.E.equals(a.E.mul(n)) && b.N.equals(a.N.mul(n))).toBe(true);
        const sumE = a.contributions.reduce((s, c) => s.add(c.dE), new Fraction(0));
        expect(sumE.equals(a.E)).toBe(true);
      }),
    );
  });
  test("electrically neutral coloured fields give E = 0, so E/N = 0 (e.g. the (3,1,0) heavy quark, DLMN 2017)", () => {
    const neutral = fc.record({
      colour: fc.record({ p: fc.integer({ min: 0, max: 4 }), q: fc.integer({ min: 0, max: 4 }) }),
      ew: fc.oneof(
        fc.constant({ kind: "sm" as const, dim: 1, y: 0 }),
        fc.integer({ min: 1, max: 4 }).map((n) => ({ kind: "explicit" as const, charges: Array(n).fill("0") })),
      ),
      chirality: fc.constantFrom("L" as const, "R" as const),
      pq: nonZeroRational(),
      copies: fc.integer({ min: 1, max: 3 }),
    });
    fc.assert(
      fc.property(fc.array(neutral, { minLength: 1, maxLength: 4 }), (model) => {
        const r = anomaly(model);
        expect(r.E.equals(0)).toBe(true);
        if (!r.N.equals(0)) expect(frac(r.eOverN)).toBe("0");
        else expect(r.eOverN).toBeNull();
      }),
    );
  });
  test("colour singlets only always give N = 0 and E/N null (T(1) = 0)", () => {
    fc.assert(
      fc.property(
        fc.array(
          fermionArb.map((f) => ({ ...f, colour: "1" })),
          { minLength: 1, maxLength: 4 },
        ),
        (model) => {
          const r = anomaly(model);
          expect(r.N.equals(0)).toBe(true);
          expect(r.eOverN).toBeNull();
          expect(r.domainWall).toBeNull();
        },
      ),
    );
  });
});

describe("bad input gives errors that name the fermion and the field", () => {
  const good: FermionInput = { name: "Q_L", colour: "3", ew: { kind: "sm", dim: 1, y: 0 }, chirality: "L", pq: 1 };
  const cases: { input: Partial<FermionInput> & Record<string, unknown>; field: string; text: string }[] = [
    { input: { pq: "abc" }, field: "pq", text: 'fermion 2 (Q_R): PQ charge "abc" is not a rational number' },
    { input: { pq: "0.3333" }, field: "pq", text: 'fermion 2 (Q_R): PQ charge "0.3333" is not a rational number' },
    { input: { pq: 0.5 }, field: "pq", text: "fermion 2 (Q_R): PQ charge 0.5 is not an exact rational" },
    { input: { pq: "1/0" }, field: "pq", text: "zero denominator" },
    {
      input: { colour: "7" },
      field: "colour",
      text: 'fermion 2 (Q_R): colour "7" is not a known SU(3) representation',
    },
    { input: { colour: { p: -1, q: 0 } }, field: "colour", text: "fermion 2 (Q_R): colour (-1,0)" },
    { input: { copies: -1 }, field: "copies", text: "fermion 2 (Q_R): copies -1 must be a non-negative integer" },
    { input: { copies: 1.5 }, field: "copies", text: "copies 1.5 must be a non-negative integer" },
    { input: { ew: { kind: "sm", dim: 0, y: 0 } }, field: "ew.dim", text: "fermion 2 (Q_R): SU(2) dimension 0" },
    { input: { ew: { kind: "sm", dim: 2.5, y: 0 } }, field: "ew.dim", text: "SU(2) dimension 2.5" },
    {
      input: { ew: { kind: "sm", dim: 1, y: "x" } },
      field: "ew.y",
      text: 'hypercharge Y "x" is not a rational number',
    },
    { input: { ew: { kind: "su3l", rep: "3", x: "1/3", b: "q" } }, field: "ew.b", text: 'b = β/√3 "q"' },
    {
      input: { ew: { kind: "su3l", rep: "6", x: 0, b: 0 } as never },
      field: "ew.rep",
      text: 'SU(3)_L representation "6"',
    },
    { input: { ew: { kind: "explicit", charges: [] } }, field: "ew.charges", text: "at least one component charge" },
    {
      input: { ew: { kind: "explicit", charges: ["1/3", "2/3"], dim: 3 } as never },
      field: "ew.charges",
      text: "2 charges given for a multiplet of dimension 3",
    },
    {
      input: { ew: { kind: "explicit", charges: ["1/3", "z"] } },
      field: "ew.charges[1]",
      text: 'electric charge 2 "z"',
    },
    { input: { ew: { kind: "weird" } as never }, field: "ew.kind", text: 'electroweak kind "weird"' },
    { input: { chirality: "X" as never }, field: "chirality", text: 'chirality "X" must be "L" or "R"' },
  ];
  for (const { input, field, text } of cases) {
    test(`${field}: ${text}`, () => {
      const bad = { ...good, name: "Q_R", chirality: "R", ...input } as FermionInput;
      const r = tryAnomaly([good, bad]);
      expect(r.ok).toBe(false);
      if (!r.ok) {
        expect(r.errors).toHaveLength(1);
        expect(r.errors[0]).toMatchObject({ index: 1, field });
        expect(r.errors[0].message).toContain(text);
      }
      let thrown: unknown;
      try {
        anomaly([good, bad]);
      } catch (e) {
        thrown = e;
      }
      expect(thrown).toBeInstanceOf(AnomalyInputError);
      expect(thrown).toBeInstanceOf(Error);
      const err = thrown as AnomalyInputError;
      expect([err.index, err.field]).toEqual([1, field]);
      expect(err.message).toContain(text);
    });
  }
  test("all problems are listed, not only the first; an unnamed field is called by its row number", () => {
    const r = tryAnomaly([{ colour: "nope", ew: { kind: "sm", dim: 0, y: "?" }, chirality: "L", pq: "x", copies: -2 }]);
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.errors.map((e) => e.field).sort()).toEqual(["colour", "copies", "ew.dim", "ew.y", "pq"]);
      for (const e of r.errors) expect(e.message.startsWith("fermion 1: ")).toBe(true);
    }
  });
  test("a bad or zero scalar charge is an error on the option, not a division by zero", () => {
    for (const scalarCharge of [0, "0", "abc", "0.5"]) {
      const r = tryAnomaly([good], { scalarCharge });
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.errors[0]).toMatchObject({ index: -1, field: "scalarCharge" });
    }
    expect(() => anomaly([good], { scalarCharge: 0 })).toThrow(/𝒳_S/);
  });
});
