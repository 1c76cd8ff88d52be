// Checks of every catalogue model's E/N and N_DW, computed from its field content, against the heavy-quark
// table of Di Luzio, Mescia & Nardi and the two-doublet values of the reviews (both recalled: "from memory").
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { anomaly, catalogue, toFractionString, type FermionInput } from "../../src/physics";

/**
 * Di Luzio, Mescia, Nardi, "Redefining the axion window", PRL 118 (2017) 031801, Table I (E/N and N_DW of the
 * fifteen single heavy-quark representations; from memory, the text was not at hand). The neutral heavy quark
 * (3,1,0) has E/N = 0 (same paper; PDG review "Axions and other similar particles").
 */
const HEAVY_QUARK_TABLE: { id: string; rep: string; eOverN: string; nDW: number }[] = [
  { id: "ksvz-3-1-0", rep: "(3,1,0)", eOverN: "0", nDW: 1 },
  { id: "ksvz-r1", rep: "(3,1,−1/3)", eOverN: "2/3", nDW: 1 },
  { id: "ksvz-r2", rep: "(3,1,2/3)", eOverN: "8/3", nDW: 1 },
  { id: "ksvz-r3", rep: "(3,2,1/6)", eOverN: "5/3", nDW: 2 },
  { id: "ksvz-r4", rep: "(3,2,−5/6)", eOverN: "17/3", nDW: 2 },
  { id: "ksvz-r5", rep: "(3,2,7/6)", eOverN: "29/3", nDW: 2 },
  { id: "ksvz-r6", rep: "(3,3,−1/3)", eOverN: "14/3", nDW: 3 },
  { id: "ksvz-r7", rep: "(3,3,2/3)", eOverN: "20/3", nDW: 3 },
  { id: "ksvz-r8", rep: "(3,3,−4/3)", eOverN: "44/3", nDW: 3 },
  { id: "ksvz-r9", rep: "(6̄,1,−1/3)", eOverN: "4/15", nDW: 5 },
  { id: "ksvz-r10", rep: "(6̄,1,2/3)", eOverN: "16/15", nDW: 5 },
  { id: "ksvz-r11", rep: "(6̄,2,1/6)", eOverN: "2/3", nDW: 10 },
  { id: "ksvz-r12", rep: "(8,1,−1)", eOverN: "8/3", nDW: 6 },
  { id: "ksvz-r13", rep: "(8,2,−1/2)", eOverN: "4/3", nDW: 12 },
  { id: "ksvz-r14", rep: "(15,1,−1/3)", eOverN: "1/6", nDW: 20 },
  { id: "ksvz-r15", rep: "(15,1,2/3)", eOverN: "2/3", nDW: 20 },
];

/**
 * DFSZ-type E/N = 8/3 (leptons couple like down quarks) and 2/3 (like up quarks), N_DW = 6 (2 × 3 generations):
 * L. Di Luzio, M. Giannotti, E. Nardi, L. Visinelli, "The landscape of QCD axion models", Phys. Rept. 870 (2020) 1,
 * DFSZ-I and DFSZ-II; also the PDG review "Axions and other similar particles". From memory: neither text was
 * at hand; the property test below derives both values from the field content.
 */
const DFSZ_TABLE = [
  { id: "dfsz-i", eOverN: "8/3", nDW: 6 },
  { id: "dfsz-ii", eOverN: "2/3", nDW: 6 },
];

const entries = catalogue();
const byId = new Map(entries.map((e) => [e.id, e]));

function computed(id: string) {
  const e = byId.get(id);
  if (!e) throw new Error(`catalogue has no entry ${id}`);
  return anomaly(e.fermions, { scalarCharge: e.scalarCharge });
}

describe("catalogue shape", () => {
  test("the neutral heavy quark, R1…R15 and two DFSZ-type models, with unique ids and visible field content", () => {
    expect(entries.map((e) => e.id).sort()).toEqual([...HEAVY_QUARK_TABLE, ...DFSZ_TABLE].map((r) => r.id).sort());
    expect(new Set(entries.map((e) => e.id)).size).toBe(entries.length);
    for (const e of entries) {
      expect(e.fermions.length).toBeGreaterThan(0);
      expect(e.label.length).toBeGreaterThan(0);
      expect(e.note?.length ?? 0).toBeGreaterThan(10);
      for (const f of e.fermions) expect(f.name).toBeTruthy();
    }
    expect(entries.filter((e) => e.group === "ksvz")).toHaveLength(16);
    expect(entries.filter((e) => e.group === "dfsz")).toHaveLength(2);
  });
  test("the catalogue is rebuilt on every call, so callers cannot change each other's copy", () => {
    const a = catalogue();
    a[0].fermions.pop();
    expect(catalogue()[0].fermions).toHaveLength(2);
  });
});

describe("heavy-quark models against Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801, Table I (from memory)", () => {
  for (const row of HEAVY_QUARK_TABLE) {
    test(`${row.id} ${row.rep}: E/N = ${row.eOverN}, N_DW = ${row.nDW}`, () => {
      const r = computed(row.id);
      expect(r.eOverN && toFractionString(r.eOverN)).toBe(row.eOverN);
      expect(r.domainWall).toBe(row.nDW);
    });
  }
  test("N_DW: fundamental = 1, (8,1,−1) = 6, (15,1,−1/3) = 20 with X_S = 1 (Di Luzio, Mescia, Nardi, PRD 96 (2017) 075003, table of representations, from memory)", () => {
    expect(computed("ksvz-r1").domainWall).toBe(1);
    expect(computed("ksvz-r12").domainWall).toBe(6);
    expect(computed("ksvz-r14").domainWall).toBe(20);
  });
  test("the single-representation window spans 1/6 ≤ E/N ≤ 44/3 (R14 and R8; DLMN 2017, from memory)", () => {
    const values = HEAVY_QUARK_TABLE.slice(1).map((r) => computed(r.id).eOverN?.valueOf() ?? Number.NaN);
    expect(Math.min(...values)).toBeCloseTo(1 / 6, 12);
    expect(Math.max(...values)).toBeCloseTo(44 / 3, 12);
  });
});

describe("DFSZ-type models against Di Luzio, Giannotti, Nardi, Visinelli, Phys. Rept. 870 (2020) 1 (from memory)", () => {
  for (const row of DFSZ_TABLE) {
    test(`${row.id}: E/N = ${row.eOverN}, N_DW = ${row.nDW}`, () => {
      const r = computed(row.id);
      expect(r.eOverN && toFractionString(r.eOverN)).toBe(row.eOverN);
      expect(r.domainWall).toBe(row.nDW);
    });
  }
  test("E/N does not depend on how X_u + X_d = 2 is split between the doublets (property, fast-check)", () => {
    const dfsz = (xu: string, xd: string, leptonsLike: "down" | "up"): FermionInput[] => [
      { colour: "3", ew: { kind: "sm", dim: 2, y: "1/6" }, chirality: "L", pq: 0, copies: 3 },
      { colour: "3", ew: { kind: "sm", dim: 1, y: "2/3" }, chirality: "R", pq: negate(xu), copies: 3 },
      { colour: "3", ew: { kind: "sm", dim: 1, y: "-1/3" }, chirality: "R", pq: negate(xd), copies: 3 },
      { colour: "1", ew: { kind: "sm", dim: 2, y: "-1/2" }, chirality: "L", pq: 0, copies: 3 },
      {
        colour: "1",
        ew: { kind: "sm", dim: 1, y: "-1" },
        chirality: "R",
        pq: leptonsLike === "down" ? negate(xd) : xu,
        copies: 3,
      },
    ];
    fc.assert(
      fc.property(fc.integer({ min: -40, max: 40 }), fc.integer({ min: 1, max: 12 }), (num, den) => {
        // X_u = num/den, X_d = 2 − X_u; X_u = X_d = 1 is the catalogue's choice.
        const xu = `${num}/${den}`;
        const xd = `${2 * den - num}/${den}`;
        expect(ratio(dfsz(xu, xd, "down"))).toBe("8/3");
        expect(ratio(dfsz(xu, xd, "up"))).toBe("2/3");
        expect(anomaly(dfsz(xu, xd, "down")).domainWall).toBe(6);
      }),
    );
  });
});

function ratio(fermions: FermionInput[]): string | null {
  const r = anomaly(fermions).eOverN;
  return r && toFractionString(r);
}

function negate(r: string): string {
  return r.startsWith("-") ? r.slice(1) : `-${r}`;
}
