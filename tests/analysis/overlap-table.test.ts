// The overlap table on a small project: rows per visible model × visible curve, f_a and frequency columns,
// the project's constants and each curve's rescaling, and the CSV and Markdown exports.
// Sources: m_a f_a = K·10⁶ eV·GeV with K = 5.691 μeV (Gorghetto & Villadoro, JHEP 03 (2019) 033) or the
// user's K; ν = m_a/h with h = 4.135667696×10⁻¹⁵ eV·s (CODATA 2018, Tiesinga et al., Rev. Mod. Phys. 93
// (2021) 025010); rescaling g·√(ρ₀/ρ)/√f (common practice); crossing masses from the analytic derivation in
// tests/analysis/overlap.test.ts (a flat limit G meets the line g = k·m at m = G/k).
import { describe, expect, test } from "vitest";
import { gAgg } from "../../src/physics";
import { emptyProject, newCurve, newModel } from "../../src/project/defaults";
import {
  formatSignificant,
  overlapTable,
  overlapTableToCsv,
  overlapTableToMarkdown,
  type OverlapRow,
} from "../../src/analysis/overlap-table";
import type { Project } from "../../src/project/types";

const H_EV_S = 4.135667696e-15;

function flatCurve(id: string, G: number, extra: Parameters<typeof newCurve>[0] = {}) {
  return newCurve({
    id,
    label: `Flat ${id}`,
    massEv: Float64Array.from([1e-6, 1e-4]),
    gInvGeV: Float64Array.from([G, G]),
    ...extra,
  });
}

function smallProject(): Project {
  const p = emptyProject("table test");
  const G = gAgg(1e-5, 0); // the E/N = 0 line reaches G at 10 μeV
  p.models = [
    newModel({ id: "line0", label: "E/N = 0", eOverNMin: "0" }),
    newModel({ id: "band", label: "E/N ∈ [0, 8/3]", eOverNMin: "0", eOverNMax: "8/3" }),
    newModel({ id: "hidden", label: "hidden", eOverNMin: "5/3", visible: false }),
  ];
  p.curves = [
    flatCurve("x", G, { label: 'Flat, "invented"' }),
    flatCurve("y", G, { role: "projection", visible: false }),
  ];
  return p;
}

function rowsOf(rows: OverlapRow[], modelId: string, curveId: string): OverlapRow[] {
  return rows.filter((r) => r.modelId === modelId && r.curveId === curveId);
}

describe("overlapTable", () => {
  test("only visible models × visible curves, rows ascending in mass and covering the curve's range", () => {
    const rows = overlapTable(smallProject());
    expect(new Set(rows.map((r) => `${r.modelId}×${r.curveId}`))).toEqual(new Set(["line0×x", "band×x"]));
    const line = rowsOf(rows, "line0", "x");
    expect(line.map((r) => r.kind)).toEqual(["none", "excluded-whole"]);
    expect(line[0].massMinEv).toBe(1e-6);
    expect(line[1].massMinEv).toBeCloseTo(1e-5, 18);
    expect(line[1].massMaxEv).toBe(1e-4);
    expect(line[1].massMinEv).toBe(line[0].massMaxEv);
  });

  test("rows in the project's order: models as listed, then curves as listed, then ascending mass", () => {
    const p = smallProject();
    p.curves[1].visible = true;
    p.models.reverse(); // now listed: hidden (skipped), band, line0
    const rows = overlapTable(p);
    const pairs = [...new Set(rows.map((r) => `${r.modelId}×${r.curveId}`))];
    expect(pairs).toEqual(["band×x", "band×y", "line0×x", "line0×y"]);
    for (const pair of pairs) {
      const lows = rows.filter((r) => `${r.modelId}×${r.curveId}` === pair).map((r) => r.massMinEv);
      expect(lows).toEqual([...lows].sort((a, b) => a - b));
    }
    // Each pair's rows are contiguous (the panel's default order keeps this order within a verdict).
    const firsts = pairs.map((pair) => rows.findIndex((r) => `${r.modelId}×${r.curveId}` === pair));
    expect(firsts).toEqual([...firsts].sort((a, b) => a - b));
  });

  test("f_a and frequency at the interval ends: m·f_a = 5.691·10⁶ eV·GeV (JHEP 2019), ν = m/h (CODATA 2018)", () => {
    const [, whole] = rowsOf(overlapTable(smallProject()), "line0", "x");
    expect(whole.faMinGeV * whole.massMaxEv).toBeCloseTo(5.691e6, 6);
    expect(whole.faMaxGeV * whole.massMinEv).toBeCloseTo(5.691e6, 6);
    expect(whole.freqMinHz / (whole.massMinEv / H_EV_S)).toBeCloseTo(1, 12);
    expect(whole.freqMaxHz).toBeCloseTo(1e-4 / H_EV_S, 0);
  });

  test("a cancelling band: part only, with the cancellation note and the two E/N pieces", () => {
    const rows = rowsOf(overlapTable(smallProject()), "band", "x");
    expect(rows.map((r) => r.kind)).toEqual(["none", "excluded-part"]);
    for (const r of rows)
      expect(r.note).toMatch(/cancellation: E\/N near c_γ has g → 0; no finite limit excludes the whole band/);
    const part = rows[1];
    expect(part.eOverNSubs?.length).toBe(2);
    expect(part.eOverNSub).toBeUndefined();
    expect(part.note).toMatch(/E\/N \[0, .*\] ∪ \[.*, 2\.667\] excluded somewhere/);
  });

  test("the curve's rescaling moves the crossing: ρ shown = ρ assumed/4 doubles g, crossing at 2·10⁻⁵ eV", () => {
    const p = smallProject();
    p.curves[0].rescale = { rhoAssumed: 0.45, rhoShown: 0.45 / 4, fraction: 1 };
    const [, whole] = rowsOf(overlapTable(p), "line0", "x");
    expect(whole.massMinEv).toBeCloseTo(2e-5, 15);
  });

  test("an invalid rescaling is ignored and said so", () => {
    const p = smallProject();
    p.curves[0].rescale = { rhoAssumed: 0.45, rhoShown: 0.45, fraction: 0 };
    const rows = rowsOf(overlapTable(p), "line0", "x");
    expect(rows[1].massMinEv).toBeCloseTo(1e-5, 18);
    expect(rows[0].note).toMatch(/rescaling ignored/);
  });

  test("reference 2016 and custom constants set K: m·f_a = 5.70·10⁶ (JHEP 2016) or the user's K", () => {
    const p = smallProject();
    p.physics.ref = "2016";
    const r2016 = rowsOf(overlapTable(p), "line0", "x")[1];
    expect(r2016.faMinGeV * r2016.massMaxEv).toBeCloseTo(5.7e6, 6);
    // The line moves with K: the crossing is at m* ∝ K (analytic), so 10 μeV · 5.70/5.691.
    expect(r2016.massMinEv / 1e-5).toBeCloseTo(5.7 / 5.691, 12);
    p.physics.ref = "custom";
    p.physics.custom = { cGamma: 1.92, cGammaSigma: 0.04, kMuEv: 6, kMuEvSigma: 0.1, label: "mine" };
    const rc = rowsOf(overlapTable(p), "line0", "x")[1];
    expect(rc.faMinGeV * rc.massMaxEv).toBeCloseTo(6e6, 6);
  });

  test("a theory spread on the model gives a partial row between none and whole", () => {
    const p = smallProject();
    p.models[0].sigmas = 2;
    const kinds = rowsOf(overlapTable(p), "line0", "x").map((r) => r.kind);
    expect(kinds).toEqual(["none", "excluded-part", "excluded-whole"]);
  });

  test("projection and region curves use their own kinds", () => {
    const p = smallProject();
    p.curves[1].visible = true;
    const k = gAgg(1, 0);
    p.curves.push(
      newCurve({
        id: "z",
        role: "region",
        massEv: Float64Array.from([1e-6, 1e-4, 1e-4, 1e-6]),
        gInvGeV: Float64Array.from([k * 5e-6, k * 5e-6, k * 4e-5, k * 4e-5]),
      }),
    );
    const rows = overlapTable(p);
    expect(rowsOf(rows, "line0", "y").map((r) => r.kind)).toEqual(["none", "reach-whole"]);
    expect(rowsOf(rows, "line0", "z").map((r) => r.kind)).toEqual(["none", "inside-whole", "none"]);
    expect(rowsOf(rows, "band", "z").every((r) => r.note.includes("no closed region contains the whole band"))).toBe(
      true,
    );
  });

  test("models whose E/N cannot be read and curves without data give no rows", () => {
    const p = smallProject();
    p.models.push(newModel({ id: "bad", eOverNMin: "eight thirds" }));
    p.curves.push(newCurve({ id: "empty" }));
    const rows = overlapTable(p);
    expect(rows.some((r) => r.modelId === "bad" || r.curveId === "empty")).toBe(false);
  });
});

describe("exports", () => {
  test("CSV: header with units, one line per row, full precision, RFC 4180 quoting", () => {
    const rows = overlapTable(smallProject());
    const csv = overlapTableToCsv(rows);
    const lines = csv.trimEnd().split("\n");
    expect(lines[0]).toBe(
      "model_id,model,curve_id,curve,role,kind,m_a_min_eV,m_a_max_eV,f_a_min_GeV,f_a_max_GeV,freq_min_Hz,freq_max_Hz,EN_sub_min,EN_sub_max,note",
    );
    expect(lines.length).toBe(rows.length + 1);
    // The label with a comma and quotes is quoted with doubled quotes.
    expect(lines[1]).toContain('"Flat, ""invented"""');
    // Numbers read back to the same doubles.
    const whole = rows.find((r) => r.kind === "excluded-whole")!;
    const line = lines[rows.indexOf(whole) + 1];
    expect(line).toContain(`,${String(whole.massMinEv)},${String(whole.massMaxEv)},`);
    expect(Number(String(whole.faMinGeV))).toBe(whole.faMinGeV);
  });

  test("Markdown: units in the header, 4 significant digits, pipes in labels escaped", () => {
    const p = smallProject();
    p.models[0].label = "E/N = 0 | KSVZ-type";
    const md = overlapTableToMarkdown(overlapTable(p));
    const lines = md.trimEnd().split("\n");
    expect(lines[0]).toContain("m_a min (eV)");
    expect(lines[0]).toContain("f_a max (GeV)");
    expect(lines[0]).toContain("ν min (Hz)");
    expect(lines[1]).toMatch(/^\| --- \| --- \|/);
    expect(md).toContain("E/N = 0 \\| KSVZ-type");
    // 10 μeV → f_a = 5.691·10¹¹ GeV, ν = 2.418·10⁹ Hz at 4 significant digits.
    expect(md).toContain("| 5.691e11 |");
    expect(md).toContain("| 2.418e9 |");
  });

  test("formatSignificant: plain between 10⁻³ and 10⁴, exponent otherwise, 4 significant digits", () => {
    expect(formatSignificant(1234.56)).toBe("1235");
    expect(formatSignificant(0.00123456)).toBe("0.001235");
    expect(formatSignificant(5.6914e-6)).toBe("5.691e-6");
    expect(formatSignificant(2.41798e14)).toBe("2.418e14");
    expect(formatSignificant(0)).toBe("0");
    expect(formatSignificant(1e-5)).toBe("1e-5");
  });
});
