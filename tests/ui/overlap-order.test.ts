// Row order of the overlap panel (src/ui/overlap/table-logic.ts) on real overlapTable rows: by default the
// strongest verdict first (excluded, within reach, inside a region; whole before part; no overlap last), and
// within a verdict models and curves as listed in the project; an explicit column sort keeps that order
// among rows equal in its column. The ordering is our own convention (not physics, no external source); the
// rows come from invented flat curves and a rectangle whose crossings follow the line g = k·m of
// g_aγγ = α m |E/N − c_γ| / (2π K·10⁶ eV GeV) (Grilli di Cortona, Hardy, Pardo Vega, Villadoro, JHEP 01
// (2016) 034; K from Gorghetto & Villadoro, JHEP 03 (2019) 033).
import { describe, expect, test } from "vitest";
import { emptyProject, newCurve, newModel, overlapTable, type OverlapKind, type OverlapRow } from "../../src/data";
import { gAgg } from "../../src/physics";
import { defaultOrder, nextSort, sortRows, verdictRank, type SortState } from "../../src/ui/overlap/table-logic";

const ALL_KINDS: OverlapKind[] = [
  "excluded-whole",
  "excluded-part",
  "reach-whole",
  "reach-part",
  "inside-whole",
  "inside-part",
  "none",
];

/** Two models (listed Z before A, so project order and label order differ) against an exclusion, a projection and a region. */
function project() {
  const p = emptyProject("order test");
  const masses = Float64Array.from({ length: 21 }, (_, i) => 1e-6 * 10 ** (i / 10));
  const flat = (g: number) => new Float64Array(masses.length).fill(g);
  // Levels where the E/N = 8/3 line crosses at 10 μeV (exclusion) and at 3 μeV (projection, lower).
  const gExcl = gAgg(1e-5, 8 / 3, { ref: "2019" });
  const gProj = gAgg(3e-6, 8 / 3, { ref: "2019" });
  const k = gAgg(1, 8 / 3, { ref: "2019" }); // the line is g = k·m
  p.models = [
    newModel({ id: "m-z", label: "Zeta line", eOverNMin: "8/3" }),
    // Straddles c_γ = 1.92: never wholly excluded, reached or inside (cancellation), so its overlaps are parts.
    newModel({ id: "m-a", label: "Alpha band", eOverNMin: "0", eOverNMax: "4" }),
  ];
  p.curves = [
    newCurve({
      id: "c-region",
      label: "Box (invented)",
      role: "region",
      massEv: Float64Array.from([2e-6, 2e-5, 2e-5, 2e-6]),
      gInvGeV: Float64Array.from([k * 1e-6, k * 1e-6, k * 1e-4, k * 1e-4]),
    }),
    newCurve({ id: "c-excl", label: "Flat limit (invented)", role: "exclusion", massEv: masses, gInvGeV: flat(gExcl) }),
    newCurve({
      id: "c-proj",
      label: "Flat reach (invented)",
      role: "projection",
      massEv: masses,
      gInvGeV: flat(gProj),
    }),
  ];
  return p;
}

function indexer(p: ReturnType<typeof project>) {
  const model = new Map(p.models.map((m, i) => [m.id, i]));
  const curve = new Map(p.curves.map((c, i) => [c.id, i]));
  return (r: OverlapRow) =>
    [verdictRank(r.kind), model.get(r.modelId) ?? -1, curve.get(r.curveId) ?? -1, r.massMinEv] as const;
}

/** True when the keys of consecutive rows never decrease (lexicographically). */
function nondecreasing(keys: (readonly number[])[]): boolean {
  return keys.every((k, i) => {
    if (i === 0) return true;
    const prev = keys[i - 1];
    for (let j = 0; j < k.length; j++) if (k[j] !== prev[j]) return k[j] > prev[j];
    return true;
  });
}

describe("overlap table order", () => {
  const p = project();
  const rows = overlapTable(p);
  const key = indexer(p);

  test("the fixture has every verdict, so the order below is tested on all of them", () => {
    expect(new Set(rows.map((r) => r.kind))).toEqual(new Set(ALL_KINDS));
  });

  test("the verdict ranks: excluded, within reach, inside a region, whole before part, no overlap last", () => {
    expect([...ALL_KINDS].sort((a, b) => verdictRank(a) - verdictRank(b))).toEqual(ALL_KINDS);
    expect(new Set(ALL_KINDS.map(verdictRank)).size).toBe(ALL_KINDS.length);
  });

  test("default order: by verdict, then model and curve as listed in the project, then mass", () => {
    for (const shown of [defaultOrder(rows), sortRows(rows, null)]) {
      expect(shown).toHaveLength(rows.length);
      expect(new Set(shown)).toEqual(new Set(rows));
      expect(nondecreasing(shown.map(key))).toBe(true);
      expect(shown[0].kind).toBe("excluded-whole");
      expect(shown.at(-1)?.kind).toBe("none");
    }
    // Project order, not label order: "Zeta line" (listed first) before "Alpha band" within a verdict.
    const nones = sortRows(rows, null).filter((r) => r.kind === "none");
    expect(nones[0].modelLabel).toBe("Zeta line");
    expect(nones.at(-1)?.modelLabel).toBe("Alpha band");
  });

  test("an explicit sort orders by its column and keeps the default order among equal rows", () => {
    const byModel = sortRows(rows, { key: "model", dir: 1 });
    const labels = byModel.map((r) => r.modelLabel);
    expect(labels).toEqual([...labels].sort((a, b) => a.localeCompare(b)));
    expect(labels[0]).toBe("Alpha band");
    for (const label of new Set(labels)) {
      const mine = byModel.filter((r) => r.modelLabel === label);
      expect(mine).toEqual(sortRows(rows, null).filter((r) => r.modelLabel === label));
    }
    const byMass = sortRows(rows, { key: "mass", dir: -1 }).map((r) => r.massMinEv);
    expect(byMass).toEqual([...byMass].sort((a, b) => b - a));
    // Verdict ascending is the default order; descending puts "no overlap" first, pairs still as listed.
    expect(sortRows(rows, { key: "verdict", dir: 1 })).toEqual(sortRows(rows, null));
    const desc = sortRows(rows, { key: "verdict", dir: -1 });
    expect(desc[0].kind).toBe("none");
    expect(nondecreasing(desc.map(key).map(([rank, m, c, mass]) => [-rank, m, c, mass]))).toBe(true);
  });

  test("header clicks cycle ascending, descending, then back to the default order", () => {
    let s: SortState | null = null;
    s = nextSort(s, "curve");
    expect(s).toEqual({ key: "curve", dir: 1 });
    s = nextSort(s, "curve");
    expect(s).toEqual({ key: "curve", dir: -1 });
    s = nextSort(s, "curve");
    expect(s).toBeNull();
    expect(sortRows(rows, s)).toEqual(defaultOrder(rows));
  });
});
