// Checks of SU(3) dimensions, Casimirs and Dynkin indices against Slansky's tables and textbook identities,
// and of the colour-representation parser.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { COLOUR_NAMES, parseColour, su3Casimir, su3Dimension, su3Index, toFractionString } from "../../src/physics";

/**
 * Slansky, "Group theory for unified model building", Phys. Rept. 79 (1981) 1, SU(3) irreps table:
 * Dynkin labels, dimension, index ℓ with ℓ(3) = 1, i.e. T = ℓ/2. All rows are from memory (written down
 * without the table at hand).
 */
const SLANSKY: { p: number; q: number; dim: number; ell: number }[] = [
  { p: 0, q: 0, dim: 1, ell: 0 },
  { p: 1, q: 0, dim: 3, ell: 1 },
  { p: 2, q: 0, dim: 6, ell: 5 },
  { p: 1, q: 1, dim: 8, ell: 6 },
  { p: 3, q: 0, dim: 10, ell: 15 },
  { p: 2, q: 1, dim: 15, ell: 20 },
  { p: 4, q: 0, dim: 15, ell: 35 },
  { p: 2, q: 2, dim: 27, ell: 54 },
  { p: 5, q: 0, dim: 21, ell: 70 },
  { p: 3, q: 1, dim: 24, ell: 50 },
  { p: 6, q: 0, dim: 28, ell: 126 },
  { p: 4, q: 1, dim: 35, ell: 105 },
];

describe("SU(3) irreps against Slansky, Phys. Rept. 79 (1981) 1", () => {
  for (const row of SLANSKY) {
    test(`(${row.p},${row.q}): d = ${row.dim}, T = ${row.ell}/2 (Slansky 1981, from memory)`, () => {
      expect(su3Dimension(row.p, row.q)).toBe(row.dim);
      expect(su3Index(row.p, row.q).equals(row.ell / 2)).toBe(true);
      // The conjugate (q,p) has the same dimension and index.
      expect(su3Dimension(row.q, row.p)).toBe(row.dim);
      expect(su3Index(row.q, row.p).equals(row.ell / 2)).toBe(true);
    });
  }
  test("T(3) = 1/2, T(6) = 5/2, T(8) = 3, T(10) = 15/2, T(15) = 10, T(15') = 35/2, T(27) = 27 as exact fractions (R. Slansky, Phys. Rept. 79 (1981) 1, Table 6, index ℓ/2; from memory)", () => {
    const byName = ["3", "6", "8", "10", "15", "15'", "27"].map((n) => {
      const c = parseColour(n);
      if (!c.ok) throw new Error(c.reason);
      return toFractionString(su3Index(c.irrep.p, c.irrep.q));
    });
    expect(byName).toEqual(["1/2", "5/2", "3", "15/2", "10", "35/2", "27"]);
  });
  test("Casimirs C₂(3) = 4/3 = (N²−1)/2N and C₂(8) = N = 3 (Peskin & Schroeder, QFT (1995) §15.4; from memory)", () => {
    expect(toFractionString(su3Casimir(1, 0))).toBe("4/3");
    expect(toFractionString(su3Casimir(0, 1))).toBe("4/3");
    expect(toFractionString(su3Casimir(1, 1))).toBe("3");
    expect(toFractionString(su3Casimir(0, 0))).toBe("0");
  });
});

/** Tensor-product decompositions (Slansky 1981, SU(3) tensor-product table; from memory). */
const PRODUCTS: { a: [number, number]; b: [number, number]; sum: [number, number][]; label: string }[] = [
  {
    label: "3⊗3 = 6⊕3̄",
    a: [1, 0],
    b: [1, 0],
    sum: [
      [2, 0],
      [0, 1],
    ],
  },
  {
    label: "3⊗3̄ = 8⊕1",
    a: [1, 0],
    b: [0, 1],
    sum: [
      [1, 1],
      [0, 0],
    ],
  },
  {
    label: "3⊗6 = 10⊕8",
    a: [1, 0],
    b: [2, 0],
    sum: [
      [3, 0],
      [1, 1],
    ],
  },
  {
    label: "3̄⊗6 = 15⊕3",
    a: [0, 1],
    b: [2, 0],
    sum: [
      [2, 1],
      [1, 0],
    ],
  },
  {
    label: "3⊗8 = 15⊕6̄⊕3",
    a: [1, 0],
    b: [1, 1],
    sum: [
      [2, 1],
      [0, 2],
      [1, 0],
    ],
  },
  {
    label: "6⊗6 = 15'⊕15⊕6̄",
    a: [2, 0],
    b: [2, 0],
    sum: [
      [4, 0],
      [2, 1],
      [0, 2],
    ],
  },
  {
    label: "8⊗8 = 27⊕10⊕10̄⊕8⊕8⊕1",
    a: [1, 1],
    b: [1, 1],
    sum: [
      [2, 2],
      [3, 0],
      [0, 3],
      [1, 1],
      [1, 1],
      [0, 0],
    ],
  },
];

describe("index sum rule T(R₁⊗R₂) = d₁T₂ + d₂T₁ on SU(3) tensor products (Slansky 1981; from memory)", () => {
  for (const { label, a, b, sum } of PRODUCTS) {
    test(label, () => {
      const dims = sum.reduce((acc, [p, q]) => acc + su3Dimension(p, q), 0);
      expect(dims).toBe(su3Dimension(...a) * su3Dimension(...b));
      const lhs = su3Index(...a)
        .mul(su3Dimension(...b))
        .add(su3Index(...b).mul(su3Dimension(...a)));
      const rhs = sum.reduce((acc, [p, q]) => acc.add(su3Index(p, q)), su3Index(0, 0));
      expect(rhs.equals(lhs)).toBe(true);
    });
  }
});

describe("general properties (property tests, fast-check)", () => {
  test("2T(p,q) is a non-negative integer and d, T are conjugation-invariant (Slansky 1981: indices ℓ are integers)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 40 }), fc.integer({ min: 0, max: 40 }), (p, q) => {
        const ell = su3Index(p, q).mul(2);
        expect(ell.d).toBe(1n);
        expect(ell.s >= 0n).toBe(true);
        expect(Number.isInteger(su3Dimension(p, q))).toBe(true);
        expect(su3Dimension(q, p)).toBe(su3Dimension(p, q));
        expect(su3Index(q, p).equals(su3Index(p, q))).toBe(true);
      }),
    );
  });
  test("symmetric tensors (n,0) have d = (n+1)(n+2)/2 (counting of symmetric 3-index tensors; common practice)", () => {
    for (let n = 0; n <= 12; n++) expect(su3Dimension(n, 0)).toBe(((n + 1) * (n + 2)) / 2);
  });
  test("bad Dynkin labels throw", () => {
    expect(() => su3Dimension(-1, 0)).toThrow(RangeError);
    expect(() => su3Index(1.5, 0)).toThrow(RangeError);
  });
});

describe("parseColour", () => {
  test("names, conjugates and label strings", () => {
    const cases: [unknown, [number, number]][] = [
      ["1", [0, 0]],
      ["3", [1, 0]],
      ["3bar", [0, 1]],
      ["3̄", [0, 1]],
      ["3*", [0, 1]],
      ["6", [2, 0]],
      ["6bar", [0, 2]],
      ["8", [1, 1]],
      ["10", [3, 0]],
      ["10bar", [0, 3]],
      ["15", [2, 1]],
      ["15bar", [1, 2]],
      ["15'", [4, 0]],
      ["15′", [4, 0]],
      ["27", [2, 2]],
      ["(2,1)", [2, 1]],
      [" ( 3 , 1 ) ", [3, 1]],
      ["5,0", [5, 0]],
      [{ p: 2, q: 2 }, [2, 2]],
      [8, [1, 1]],
    ];
    for (const [input, [p, q]] of cases) {
      const c = parseColour(input);
      expect(c.ok, String(input)).toBe(true);
      if (c.ok) expect(c.irrep).toEqual({ p, q });
    }
  });
  test("every listed shortcut name parses, with the dimension its name says", () => {
    for (const name of COLOUR_NAMES) {
      const c = parseColour(name);
      expect(c.ok).toBe(true);
      if (c.ok) expect(su3Dimension(c.irrep.p, c.irrep.q)).toBe(Number(name.replace(/\D/g, "")));
    }
  });
  test("unknown names and bad labels give a reason", () => {
    for (const bad of ["xyz", "7", "", "(1,-1)", { p: -1, q: 0 }, { p: 1.5, q: 0 }, null]) {
      const c = parseColour(bad);
      expect(c.ok).toBe(false);
      if (!c.ok) expect(c.reason.length).toBeGreaterThan(3);
    }
    const c = parseColour("xyz");
    if (!c.ok) expect(c.reason).toContain('"xyz" is not a known SU(3) representation');
  });
});
