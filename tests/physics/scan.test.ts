// Charge scans: every combination of listed PQ charges, copies and scalar charges, checked against hand-computed
// anomaly coefficients, and the list/range syntax of the calculator fields.
import { describe, expect, test } from "vitest";
import { parseScanField, scanAnomaly, type ScanFermion } from "../../src/physics";

const quark = (y: string, pq: ScanFermion["pq"], chirality: "L" | "R" = "L", copies?: number[]): ScanFermion => ({
  colour: "3",
  ew: { kind: "sm", dim: 1, y },
  chirality,
  pq,
  copies,
});

// Anomaly coefficients of a colour triplet singlet of charge Q with PQ charge X: N = X/2, E = 3·X·Q²
// (Di Luzio, Giannotti, Nardi, Visinelli, Phys. Rept. 870 (2020) 1, eqs. for E and N; from memory).
describe("scanAnomaly", () => {
  test("a heavy quark (3,1,−1/3) with X_L ∈ {−1, 0, 1}: E/N = 2/3 twice, N = 0 once", () => {
    const r = scanAnomaly([quark("-1/3", [-1, 0, 1]), quark("-1/3", 0, "R")]);
    expect(r.combinations).toBe(3);
    expect(r.zeroN).toBe(1);
    expect(r.distinct).toEqual([{ eOverN: "2/3", count: 2, nDWMin: 1, nDWMax: 1 }]);
  });

  test("two quarks Q = −1/3 (X = 1) and Q = 2/3 (X = ±1): (1/3 + 4/3)/(1/2 + 1/2) = 5/3, or N = 0", () => {
    const r = scanAnomaly([quark("-1/3", 1), quark("2/3", ["1", "-1"])]);
    expect(r.distinct.map((d) => d.eOverN)).toEqual(["5/3"]);
    expect(r.zeroN).toBe(1);
  });

  test("copies and scalar charge lists multiply the combinations; N_DW = |2N/X_S| spans the list", () => {
    const r = scanAnomaly([quark("-1/3", 1, "L", [1, 2, 3])], [1, 2]);
    expect(r.combinations).toBe(6);
    // N = c/2 for c copies: N_DW = |2N/X_S| = c/X_S from 1/2 (c = 1, X_S = 2) to 3 (c = 3, X_S = 1).
    expect(r.distinct).toEqual([{ eOverN: "2/3", count: 6, nDWMin: 0.5, nDWMax: 3, nonIntegerNDW: 2 }]);
    expect(r.nonIntegerNDW).toBe(2);
  });

  // N_DW = |2N/𝒳_S| (L. Di Luzio, M. Giannotti, E. Nardi, L. Visinelli, Phys. Rept. 870 (2020) 1, eq. for N_DW;
  // from memory; common practice). A Yukawa term Q̄_L Q_R Φ ties 𝒳_L − 𝒳_R = 𝒳_S, and then 2N/𝒳_S is an integer;
  // a fractional N_DW means no renormalisable coupling links the fermion charges to the scalar's.
  test("𝒳_Q = 1 with 𝒳_S = 2 gives N_DW = 1/2, counted as not an integer; 𝒳_S = 1 is an integer", () => {
    const half = scanAnomaly([quark("-1/3", 1), quark("-1/3", 0, "R")], [1, 2]);
    expect(half.distinct).toEqual([{ eOverN: "2/3", count: 2, nDWMin: 0.5, nDWMax: 1, nonIntegerNDW: 1 }]);
    expect(half.nonIntegerNDW).toBe(1);
    // 𝒳_Q = 2 with 𝒳_S = 2: N = 1, N_DW = 1; no note.
    const whole = scanAnomaly([quark("-1/3", 2), quark("-1/3", 0, "R")], 2);
    expect(whole.distinct).toEqual([{ eOverN: "2/3", count: 1, nDWMin: 1, nDWMax: 1 }]);
    expect(whole.nonIntegerNDW).toBe(0);
    // 𝒳_S = 3 with N = 1: N_DW = 2/3.
    expect(scanAnomaly([quark("-1/3", [2, 3])], 3).nonIntegerNDW).toBe(1);
  });

  test("bad entries name the fermion and the field; too many combinations is refused", () => {
    expect(() => scanAnomaly([quark("-1/3", [1, "0.5"])])).toThrow(/fermion 1: PQ charge 2 of the list/);
    expect(() => scanAnomaly([quark("-1/3", 1)], [0])).toThrow(/must not be 0/);
    const many = Array.from({ length: 61 }, (_, i) => i);
    expect(() => scanAnomaly([1, 2, 3, 4].map(() => quark("-1/3", many)))).toThrow(/more than 1,000,000/);
  });
});

describe("parseScanField", () => {
  test("single values, ranges and braced lists", () => {
    expect(parseScanField("-1/3")).toEqual({ ok: true, values: ["-1/3"], isList: false });
    expect(parseScanField("1..3")).toEqual({ ok: true, values: ["1", "2", "3"], isList: true });
    expect(parseScanField("{-1, 0, 1}")).toEqual({ ok: true, values: ["-1", "0", "1"], isList: true });
    expect(parseScanField("{1/3, −2..-1}")).toEqual({ ok: true, values: ["1/3", "-2", "-1"], isList: true });
  });

  test("errors say which item and why", () => {
    expect(parseScanField("{1, 2")).toMatchObject({ ok: false, reason: expect.stringMatching(/both braces/) });
    expect(parseScanField("{1, , 2}")).toMatchObject({ ok: false, reason: expect.stringMatching(/item 2/) });
    expect(parseScanField("3..1")).toMatchObject({ ok: false, reason: expect.stringMatching(/upward/) });
    expect(parseScanField("1/2..3")).toMatchObject({ ok: false, reason: expect.stringMatching(/integers/) });
    expect(parseScanField("{0.5}")).toMatchObject({ ok: false, reason: expect.stringMatching(/decimals/) });
  });
});
