// Every unit of the unit table converted against values written here from outside the table: SI prefixes
// (BIPM, The International System of Units, 9th edition, 2019, Table 7) and CODATA 2018 h, c_γ and K from
// the papers named below; through the conversion functions, the CSV import and the CSV export alike.
import { describe, expect, test } from "vitest";
import {
  COUPLING_UNITS,
  couplingContext,
  couplingToInvGeV,
  MASS_UNITS,
  massFromEv,
  massToEv,
} from "../../src/formats/units";
import { curveToCsv } from "../../src/formats/curve-export";
import { parseCurveText } from "../../src/formats/csv";

// CODATA 2018 (Tiesinga, Mohr, Newell, Taylor, Rev. Mod. Phys. 93 (2021) 025010): h = 6.62607015e-34 J s and
// e = 1.602176634e-19 C are exact, so h = 4.135667696...e-15 eV s (printed digits of the table).
const H_EV_S = 4.135667696e-15;
// SI Brochure 9th ed. (2019), Table 7: the decimal prefixes.
const KILO = 1e3;
const MEGA = 1e6;
const GIGA = 1e9;
const TERA = 1e12;
const MILLI = 1e-3;
const MICRO = 1e-6;
const NANO = 1e-9;
const PICO = 1e-12;

/** eV per unit, written out independently of src/formats/units.ts. */
const EV_PER_UNIT: Record<string, number> = {
  eV: 1,
  meV: MILLI,
  ueV: MICRO,
  neV: NANO,
  peV: PICO,
  keV: KILO,
  MeV: MEGA,
  GeV: GIGA,
  // A photon of frequency ν has energy hν (Planck–Einstein relation).
  Hz: H_EV_S,
  kHz: KILO * H_EV_S,
  MHz: MEGA * H_EV_S,
  GHz: GIGA * H_EV_S,
  THz: TERA * H_EV_S,
};

// CODATA 2018 α (same reference); K = 5.691 μeV (Gorghetto & Villadoro, JHEP 03 (2019) 033, m_a = K·10¹² GeV/f_a
// in μeV); c_γ = 1.92 (Grilli di Cortona et al., JHEP 01 (2016) 034).
const ALPHA = 7.2973525693e-3;
const K_UEV = 5.691;
const C_GAMMA = 1.92;
const faGeV = (massEv: number) => (K_UEV * MICRO * 1e12) / massEv;
/** g_aγγ in GeV⁻¹ per unit of each coupling column at mass m, from g = α/(2π f_a)·|E/N − c_γ| by hand. */
const G_PER_UNIT: Record<string, (m: number) => number> = {
  "GeV^-1": () => 1,
  normalized: (m) => ALPHA / (2 * Math.PI * faGeV(m)),
  // |g_γ| = |E/N − c_γ|/2, so one unit of g_γ is two units of the normalized coupling.
  "g-gamma": (m) => ALPHA / (Math.PI * faGeV(m)),
  // One unit of the model line E/N = 8/3 (the DFSZ-I value, Kim & Carosi, Rev. Mod. Phys. 82 (2010) 557).
  "model-line": (m) => (ALPHA / (2 * Math.PI * faGeV(m))) * Math.abs(8 / 3 - C_GAMMA),
};

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe("mass units against SI prefixes and CODATA h", () => {
  test("the table holds exactly the units checked here (a new unit needs its own check)", () => {
    expect(MASS_UNITS.map((u) => u.id).sort()).toEqual(Object.keys(EV_PER_UNIT).sort());
  });
  test.each(Object.entries(EV_PER_UNIT))("1 %s = %s eV both ways", (unit, evPerUnit) => {
    const u = unit as (typeof MASS_UNITS)[number]["id"];
    expect(rel(massToEv(1, u), evPerUnit)).toBeLessThan(4e-16);
    expect(rel(massToEv(2.5, u), 2.5 * evPerUnit)).toBeLessThan(4e-16);
    expect(rel(massFromEv(7 * evPerUnit, u), 7)).toBeLessThan(4e-16);
  });
  test.each(Object.entries(EV_PER_UNIT))("a CSV column headed [%s] imports as %s eV per unit", (unit, evPerUnit) => {
    const r = parseCurveText(`m [${unit}],g [1/GeV]\n2.5,1e-12\n`);
    expect(r.massUnitSource).toBe("header");
    expect(rel(r.massEv[0], 2.5 * evPerUnit)).toBeLessThan(4e-16);
  });
  test.each(Object.entries(EV_PER_UNIT))("a CSV export in %s writes the mass divided by %s eV", (unit, evPerUnit) => {
    const text = curveToCsv(
      { massEv: Float64Array.of(2.5 * evPerUnit), gInvGeV: Float64Array.of(1e-12) },
      { massUnit: unit, couplingUnit: "GeV^-1" },
    );
    const row = text.trim().split("\n").pop() ?? "";
    expect(rel(Number(row.split(",")[0]), 2.5)).toBeLessThan(1e-15);
  });
});

describe("coupling units against g = α/(2π f_a)·|E/N − c_γ| by hand", () => {
  const ctx = couplingContext({}, "8/3");
  const m = 2.5e-5;
  test("the table holds exactly the units checked here", () => {
    expect(COUPLING_UNITS.map((u) => u.id).sort()).toEqual(Object.keys(G_PER_UNIT).sort());
  });
  test.each(Object.entries(G_PER_UNIT))("one unit of %s", (unit, perUnit) => {
    const u = unit as (typeof COUPLING_UNITS)[number]["id"];
    expect(rel(couplingToInvGeV(3, m, u, ctx), 3 * perUnit(m))).toBeLessThan(1e-13);
  });
  test.each(Object.entries(G_PER_UNIT))("a CSV column headed [%s] imports by the same factor", (unit, perUnit) => {
    const r = parseCurveText(`m [eV],g [${unit}]\n${m},3\n`, { modelEOverN: "8/3" });
    expect(r.couplingUnitSource).toBe("header");
    expect(rel(r.gInvGeV[0], 3 * perUnit(m))).toBeLessThan(1e-13);
  });
});
