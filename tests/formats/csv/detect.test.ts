// Checks of dialect and header detection against RFC 4180 (Shafranovich, "Common Format and MIME Type for
// Comma-Separated Values (CSV) Files", 2005): delimiters, header units, coupling units and column choice.
import { describe, expect, test } from "vitest";
import { parseCurveText } from "../../../src/data";
import { gAgg } from "../../../src/physics";

const H_EV_S = 4.135667696e-15; // CODATA 2018 (Tiesinga et al., Rev. Mod. Phys. 93 (2021) 025010)
const arr = (a: Float64Array) => Array.from(a);

describe("delimiters (auto-detected, overridable)", () => {
  test.each([
    ["comma", "1e-6,2e-12\n3e-6,4e-12\n", ","],
    ["semicolon", "1e-6;2e-12\n3e-6;4e-12\n", ";"],
    ["tab", "1e-6\t2e-12\n3e-6\t4e-12\n", "\t"],
    ["runs of spaces", "  1e-6    2e-12\n3e-6 \t 4e-12\n", " "],
    ["comma with spaces", "1e-6, 2e-12\n3e-6 ,  4e-12\n", ","],
  ])("%s", (_name, text, delimiter) => {
    const r = parseCurveText(text);
    expect(r.delimiter).toBe(delimiter);
    expect(arr(r.massEv)).toEqual([1e-6, 3e-6]);
    expect(arr(r.gInvGeV)).toEqual([2e-12, 4e-12]);
    expect(r.rejected).toEqual([]);
    expect(r.fatal).toBeNull();
  });
  test("an explicit delimiter wins over detection (names accepted too)", () => {
    const text = "1;2,5\n3;4,5\n";
    expect(arr(parseCurveText(text, { delimiter: ";" }).gInvGeV)).toEqual([2.5, 4.5]);
    expect(arr(parseCurveText("1\t2\n", { delimiter: "tab" }).massEv)).toEqual([1]);
    const asComma = parseCurveText(text, { delimiter: "," });
    expect(asComma.delimiter).toBe(",");
    expect(asComma.rejected[0]).toEqual({ row: 1, column: 1, reason: 'not a number: "1;2"' });
  });
  test("an unknown delimiter is a clear problem, not a crash", () => {
    const r = parseCurveText("1|2\n", { delimiter: "|" });
    expect(r.fatal?.code).toBe("bad-options");
    expect(r.fatal?.message).toContain('"|"');
  });
});

describe("header and units", () => {
  test("m_a [ueV], g [1/GeV]", () => {
    const r = parseCurveText("m_a [ueV],g [1/GeV]\n2.5,1e-13\n");
    expect(r.massUnit).toBe("ueV");
    expect(r.massUnitSource).toBe("header");
    expect(r.couplingUnit).toBe("GeV^-1");
    expect(r.headerRow).toBe(1);
    expect(arr(r.massEv)).toEqual([2.5e-6]);
  });
  test("mass (GHz): converted with h (CODATA 2018): 1 GHz = 4.135667696 μeV", () => {
    const r = parseCurveText("mass (GHz),g [1/GeV]\n1,1e-13\n");
    expect(r.massUnit).toBe("GHz");
    expect(r.massEv[0]).toBeCloseTo(4.135667696e-6, 18);
    expect(r.massEv[0]).toBe(1e9 * H_EV_S);
  });
  test("mass_eV,g_GeV^-1 (the bench files' header) and Greek mu / micro sign", () => {
    expect(parseCurveText("mass_eV,g_GeV^-1\n1,2\n").massUnit).toBe("eV");
    expect(parseCurveText("m [\u03bceV],g\n1,2\n").massEv[0]).toBe(1e-6);
    expect(parseCurveText("m [\u00b5eV],g\n1,2\n").massEv[0]).toBe(1e-6);
  });
  test("whitespace-separated header with units after a space", () => {
    const r = parseCurveText("m_a [neV]   g [1/GeV]\n1 2\n");
    expect(r.header).toEqual(["m_a [neV]", "g [1/GeV]"]);
    expect(r.massEv[0]).toBe(1e-9);
  });
  test("no unit in the header: eV and GeV⁻¹ assumed and said so", () => {
    const r = parseCurveText("mass,coupling\n1,2\n");
    expect(r.massUnitSource).toBe("default");
    expect(r.messages.some((m) => m.text.includes("assumed"))).toBe(true);
  });
  test("the chosen unit wins over the header, with a warning", () => {
    const r = parseCurveText("m [ueV],g\n1,2\n", { massUnit: "neV" });
    expect(r.massEv[0]).toBe(1e-9);
    expect(r.massUnitSource).toBe("option");
    expect(r.messages.some((m) => m.level === "warning" && m.text.includes("μeV"))).toBe(true);
  });
  test("header forced off: the first line is data", () => {
    const r = parseCurveText("x,y\n1,2\n", { header: false });
    expect(r.header).toBeNull();
    expect(r.rejected).toEqual([{ row: 1, column: 1, reason: 'not a number: "x"' }]);
  });
  test("unknown units are a clear problem", () => {
    expect(parseCurveText("1,2\n", { massUnit: "parsec" }).fatal?.message).toContain("parsec");
    expect(parseCurveText("1,2\n", { couplingUnit: "barn" }).fatal?.message).toContain("barn");
  });
});

describe("coupling units through the physics core", () => {
  const m = 1e-5;
  test("normalized |E/N − c_γ|: 1.92 at m is the E/N = 0 model line (Grilli di Cortona et al., JHEP 01 (2016) 034)", () => {
    const r = parseCurveText(`m,C\n${m},1.92\n`, { couplingUnit: "normalized" });
    expect(Math.abs(r.gInvGeV[0] / gAgg(m, 0) - 1)).toBeLessThan(1e-15);
  });
  test("|g_γ| = 0.96 is the same line (haloscope convention g_γ = C_aγ/2; Di Luzio, Giannotti, Nardi, Visinelli, Phys. Rept. 870 (2020) 1, from memory)", () => {
    const r = parseCurveText(`m,C\n${m},0.96\n`, { couplingUnit: "g-gamma" });
    expect(Math.abs(r.gInvGeV[0] / gAgg(m, 0) - 1)).toBeLessThan(1e-15);
  });
  test("multiple of a model line: 2 × the E/N = 8/3 line, with the older constants when chosen", () => {
    const r = parseCurveText(`m,C\n${m},2\n`, {
      couplingUnit: "model-line",
      modelEOverN: "8/3",
      physics: { ref: "2016" },
    });
    expect(Math.abs(r.gInvGeV[0] / (2 * gAgg(m, 8 / 3, { ref: "2016" })) - 1)).toBeLessThan(1e-14);
    expect(r.modelEOverN).toBe(8 / 3);
  });
  test("a model line without an E/N is a clear problem", () => {
    expect(parseCurveText("1,2\n", { couplingUnit: "model-line" }).fatal?.code).toBe("bad-options");
  });
});

describe("log10 columns and column choice", () => {
  test("log10 of the value in the column's unit (digitised figures)", () => {
    const r = parseCurveText("m [ueV],g [1/GeV]\n0,-10\n1,-12.5\n", { log10Mass: true, log10Coupling: true });
    expect(arr(r.massEv)).toEqual([1e-6, 1e-5]);
    expect(r.gInvGeV[0]).toBe(1e-10);
    expect(r.gInvGeV[1]).toBeCloseTo(10 ** -12.5, 25);
  });
  test("log10 of a frequency", () => {
    const r = parseCurveText("9,1\n", { massUnit: "Hz", log10Mass: true });
    expect(r.massEv[0]).toBeCloseTo(1e9 * H_EV_S, 20);
  });
  test("choose two of several columns; a missing one is reported with its number", () => {
    const r = parseCurveText("a,b,c,d\n9,9,1,2\n9,9,3\n", { massColumn: 3, couplingColumn: 4 });
    expect(r.columnCount).toBe(4);
    expect(arr(r.massEv)).toEqual([1]);
    expect(r.rejected).toEqual([{ row: 3, column: 4, reason: "missing column 4" }]);
    expect(r.massColumn).toBe(3);
    expect(r.couplingColumn).toBe(4);
  });
  test("the header's units pick the columns when the user has not: g first, mass second", () => {
    const r = parseCurveText("g [1/GeV],m_a [ueV]\n1e-12,3\n");
    expect(r.massColumn).toBe(2);
    expect(r.couplingColumn).toBe(1);
    expect(arr(r.massEv)).toEqual([3e-6]);
    expect(arr(r.gInvGeV)).toEqual([1e-12]);
  });
  test("the same column twice is refused", () => {
    expect(parseCurveText("1,2\n", { massColumn: 2, couplingColumn: 2 }).fatal?.code).toBe("bad-options");
  });
});
