// Checks of the curve-column units: spellings and header recognition (the importer's own spellings, SI prefixes), mass and frequency
// conversions against CODATA 2018 h, and the normalized coupling units against the physics core's g_aγγ.
import { describe, expect, test } from "vitest";
import {
  couplingContext,
  couplingFromInvGeV,
  couplingToInvGeV,
  headerUnit,
  massFromEv,
  massToEv,
  parseCouplingUnit,
  parseMassUnit,
  parseRational,
} from "../../src/formats/units";
import { gAgg } from "../../src/physics";

// CODATA 2018 (Tiesinga, Mohr, Newell, Taylor, Rev. Mod. Phys. 93 (2021) 025010): h = 6.62607015e-34 J s
// and e = 1.602176634e-19 C, both exact, so h = 4.135667696923859...e-15 eV s; the table prints it as
// "4.135 667 696... × 10⁻¹⁵ eV s", and the physics core keeps those printed digits (relative error 2.2e-10).
const H_EXACT_EV_S = 6.62607015e-34 / 1.602176634e-19;
const H_EV_S = 4.135667696e-15;
// CODATA 2018 fine-structure constant, same reference.
const ALPHA_CODATA = 7.2973525693e-3;

describe("mass unit spellings (SI prefixes)", () => {
  test("the three spellings of micro: u, Greek mu U+03BC, micro sign U+00B5 (Unicode code charts)", () => {
    expect(parseMassUnit("ueV")).toBe("ueV");
    expect(parseMassUnit("\u03bceV")).toBe("ueV");
    expect(parseMassUnit("\u00b5eV")).toBe("ueV");
  });
  test("every listed unit is recognised as written", () => {
    for (const u of ["eV", "meV", "neV", "peV", "keV", "GeV", "Hz", "kHz", "MHz", "GHz"])
      expect(parseMassUnit(u)).toBe(u);
  });
  test("case is forgiven only where no other unit fits (meV vs MeV, MHz vs mHz differ by 10⁹)", () => {
    expect(parseMassUnit("ev")).toBe("eV");
    expect(parseMassUnit("ghz")).toBe("GHz");
    expect(parseMassUnit("MeV")).toBe("MeV");
    expect(parseMassUnit("MEV")).toBeNull();
    expect(parseMassUnit("mhz")).toBeNull();
    expect(parseMassUnit("furlong")).toBeNull();
  });
});

describe("coupling unit spellings", () => {
  test("inverse GeV in its usual spellings", () => {
    for (const s of ["GeV^-1", "1/GeV", "GeV-1", "GeV^{-1}", "GeV\u207b\u00b9", "GeV^(-1)"]) {
      expect(parseCouplingUnit(s)?.unit, s).toBe("GeV^-1");
    }
  });
  test("normalized, g-gamma and model-line with an E/N", () => {
    expect(parseCouplingUnit("normalized")?.unit).toBe("normalized");
    expect(parseCouplingUnit("g-gamma")?.unit).toBe("g-gamma");
    expect(parseCouplingUnit("model-line E/N=8/3")).toEqual({ unit: "model-line", modelEOverN: 8 / 3 });
    expect(parseCouplingUnit("GeV")).toBeNull();
  });
  test("E/N as fraction or decimal", () => {
    expect(parseRational("8/3")).toBe(8 / 3);
    expect(parseRational("-1/3")).toBe(-1 / 3);
    expect(parseRational("\u22121/3")).toBe(-1 / 3);
    expect(parseRational("2.5")).toBe(2.5);
    expect(parseRational("1/0")).toBeNull();
    expect(parseRational("abc")).toBeNull();
  });
});

describe("units in header fields", () => {
  test.each([
    ["m_a [ueV]", { kind: "mass", unit: "ueV" }],
    ["m_a [\u03bceV]", { kind: "mass", unit: "ueV" }],
    ["mass (GHz)", { kind: "mass", unit: "GHz" }],
    ["mass_eV", { kind: "mass", unit: "eV" }],
    ["frequency in MHz", { kind: "mass", unit: "MHz" }],
    ["m / neV", { kind: "mass", unit: "neV" }],
    ["g [1/GeV]", { kind: "coupling", unit: "GeV^-1", modelEOverN: null }],
    ["g_GeV^-1", { kind: "coupling", unit: "GeV^-1", modelEOverN: null }],
    ["g (GeV-1)", { kind: "coupling", unit: "GeV^-1", modelEOverN: null }],
    ["|E/N - c_gamma| [normalized]", { kind: "coupling", unit: "normalized", modelEOverN: null }],
  ])("%s", (field, expected) => {
    expect(headerUnit(field)).toEqual(expected);
  });
  test("names without a unit give nothing", () => {
    expect(headerUnit("m_a")).toBeNull();
    expect(headerUnit("g_agg")).toBeNull();
    expect(headerUnit("limit")).toBeNull();
  });
});

describe("mass conversions", () => {
  test("h in the physics core is the CODATA 2018 value (printed digits, within 3e-10 of h/e)", () => {
    expect(massToEv(1, "Hz")).toBe(H_EV_S);
    expect(Math.abs(massToEv(1, "Hz") / H_EXACT_EV_S - 1)).toBeLessThan(3e-10);
  });
  test("1 GHz ↔ 4.135667696 μeV, from h (CODATA 2018)", () => {
    expect(Math.abs(massToEv(1, "GHz") / (H_EV_S * 1e9) - 1)).toBeLessThan(1e-15);
    expect(massToEv(1, "GHz")).toBeCloseTo(4.135667696e-6, 18);
    expect(massFromEv(4.135667696e-6, "GHz")).toBeCloseTo(1, 12);
    expect(massFromEv(massToEv(2.4179, "GHz"), "ueV")).toBeCloseTo(2.4179 * H_EV_S * 1e15, 10);
  });
  test("decimal prefixes (SI brochure, 9th edition, 2019, table 7)", () => {
    expect(massToEv(1, "meV")).toBe(1e-3);
    expect(massToEv(1, "ueV")).toBe(1e-6);
    expect(massToEv(1, "neV")).toBe(1e-9);
    expect(massToEv(1, "peV")).toBe(1e-12);
    expect(massToEv(1, "keV")).toBe(1e3);
    expect(massToEv(1, "GeV")).toBe(1e9);
    expect(Math.abs(massToEv(1, "kHz") / (H_EV_S * 1e3) - 1)).toBeLessThan(4e-16);
    expect(Math.abs(massToEv(1, "MHz") / (H_EV_S * 1e6) - 1)).toBeLessThan(4e-16);
  });
  test("massFromEv inverts massToEv for every unit", () => {
    for (const u of ["eV", "meV", "ueV", "neV", "peV", "keV", "GeV", "Hz", "kHz", "MHz", "GHz"] as const) {
      const v = 3.7;
      expect(Math.abs(massFromEv(massToEv(v, u), u) / v - 1), u).toBeLessThan(4e-16);
    }
  });
});

describe("coupling conversions through the physics core", () => {
  const ctx = couplingContext();
  const m = 2.5e-5;
  test("normalized |E/N − c_γ| = 1.92 is the KSVZ-type line E/N = 0 (Grilli di Cortona et al., JHEP 01 (2016) 034)", () => {
    const g = couplingToInvGeV(1.92, m, "normalized", ctx);
    expect(Math.abs(g / gAgg(m, 0) - 1)).toBeLessThan(1e-15);
    // By hand: g = α/(2π f_a)·1.92 with f_a = K·10⁶ eV·GeV / m and K = 5.691 (Gorghetto & Villadoro, JHEP 03 (2019) 033).
    const faGeV = (5.691e-6 * 1e12) / m;
    expect(Math.abs(g / ((ALPHA_CODATA / (2 * Math.PI * faGeV)) * 1.92) - 1)).toBeLessThan(1e-14);
  });
  test("|g_γ| = |E/N − c_γ|/2: g_γ = 0.96 gives the E/N = 0 line too (g_aγγ = (α/π) g_γ / f_a; Di Luzio, Giannotti, Nardi, Visinelli, Phys. Rept. 870 (2020) 1, from memory)", () => {
    const g = couplingToInvGeV(0.96, m, "g-gamma", ctx);
    expect(Math.abs(g / gAgg(m, 0) - 1)).toBeLessThan(1e-15);
    const faGeV = (5.691e-6 * 1e12) / m;
    expect(Math.abs(g / ((ALPHA_CODATA / Math.PI) * (0.96 / faGeV)) - 1)).toBeLessThan(1e-14);
  });
  test("multiple of a model line: 3 × the E/N = 8/3 line", () => {
    const c = couplingContext({}, "8/3");
    expect(Math.abs(couplingToInvGeV(3, m, "model-line", c) / (3 * gAgg(m, 8 / 3)) - 1)).toBeLessThan(1e-14);
  });
  test("the user's constants are used: the older K = 5.70 (JHEP 01 (2016) 034) moves g by 5.691/5.70", () => {
    const c2016 = couplingContext({ ref: "2016" });
    const ratio = couplingToInvGeV(1, m, "normalized", c2016) / couplingToInvGeV(1, m, "normalized", ctx);
    expect(ratio).toBeCloseTo(5.691 / 5.7, 14);
  });
  test("couplingFromInvGeV inverts couplingToInvGeV", () => {
    for (const u of ["GeV^-1", "normalized", "g-gamma"] as const) {
      const g = couplingToInvGeV(0.7, m, u, ctx);
      expect(Math.abs(couplingFromInvGeV(g, m, u, ctx) / 0.7 - 1), u).toBeLessThan(4e-16);
    }
  });
});
