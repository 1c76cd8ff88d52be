// Typed axis range ends with units: SI prefixes (BIPM, The International System of Units, 9th ed. 2019,
// Table 7: m = 10⁻³, µ = 10⁻⁶, n = 10⁻⁹, G = 10⁹) and photon frequencies through E = hν with
// h = 4.135667696×10⁻¹⁵ eV·s (CODATA 2018, Tiesinga et al., Rev. Mod. Phys. 93 (2021) 025010; exact since the
// 2019 SI). Values written here, not taken from the unit table under test.
import { describe, expect, test } from "vitest";
import { checkRange, massRangeText, parseMassText } from "../../src/formats/axis-range";

const H_EV_S = 4.135667696e-15;

function ev(text: string, bare: Parameters<typeof parseMassText>[1] = "eV"): number {
  const r = parseMassText(text, bare);
  if (!r.ok) throw new Error(r.reason);
  return r.value;
}
function reason(text: string): string {
  const r = parseMassText(text, "eV");
  if (r.ok) throw new Error(`expected ${text} to be refused`);
  return r.reason;
}

describe("parseMassText", () => {
  test("micro in three spellings (micro sign U+00B5, Greek mu U+03BC, ASCII u), with or without a space", () => {
    for (const t of ["5 µeV", "5 μeV", "5 ueV", "5ueV", " 5   µeV "]) expect(ev(t) / 5e-6).toBeCloseTo(1, 14);
  });

  test("eV, meV and neV, scientific notation and the Unicode minus in the exponent", () => {
    expect(ev("3e-6 eV")).toBe(3e-6);
    expect(ev("3E\u22126 eV")).toBe(3e-6);
    expect(ev("10 meV") / 1e-2).toBeCloseTo(1, 14);
    expect(ev("40 neV") / 4e-8).toBeCloseTo(1, 14);
  });

  test("1.2 GHz is 1.2×10⁹ Hz × h = 4.9628×10⁻⁶ eV; 1 THz is 4.135667696 meV", () => {
    expect(ev("1.2 GHz") / (1.2e9 * H_EV_S)).toBeCloseTo(1, 14);
    expect(ev("1.2 GHz")).toBeCloseTo(4.9628e-6, 9);
    expect(ev("1 THz") / 4.135667696e-3).toBeCloseTo(1, 14);
    expect(ev("500 MHz") / (5e8 * H_EV_S)).toBeCloseTo(1, 14);
  });

  test("a bare number is in the field's unit", () => {
    expect(ev("5", "ueV") / 5e-6).toBeCloseTo(1, 14);
    expect(ev("0.1", "meV") / 1e-4).toBeCloseTo(1, 14);
    expect(ev("2e-7", "eV")).toBe(2e-7);
  });

  test("unreadable text is refused with the reason: not a number, unknown unit, ambiguous mev, empty", () => {
    expect(reason("five µeV")).toMatch(/“five µeV” is not a number/);
    expect(reason("5 parsec")).toMatch(/“parsec” is not a unit of mass or frequency/);
    expect(reason("5 mev")).toMatch(/ambiguous.*meV.*MeV/);
    expect(reason("  ")).toMatch(/empty/);
  });
});

describe("checkRange", () => {
  const mass = (t: string) => parseMassText(t, "ueV");
  test("ends in different units make one range in eV", () => {
    const r = checkRange("1.2 GHz", "50", "m_a", mass);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.range[0] / (1.2e9 * H_EV_S)).toBeCloseTo(1, 14);
    expect(r.range[1] / 5e-5).toBeCloseTo(1, 14);
  });

  test("errors name the field and the end", () => {
    expect(checkRange("5 foo", "1", "m_a", mass)).toEqual({
      ok: false,
      error: "m_a min: “foo” is not a unit of mass or frequency (use eV, meV, µeV or ueV, neV, Hz, kHz, MHz, GHz)",
    });
    expect(checkRange("1", "x", "g_aγγ")).toMatchObject({ ok: false, error: "g_aγγ max: “x” is not a number" });
    expect(checkRange("10 ueV", "1 ueV", "m_a", mass)).toMatchObject({ error: "m_a: min must be less than max" });
    expect(checkRange("-1", "1", "m_a", mass)).toMatchObject({ error: expect.stringMatching(/positive/) });
  });

  test("the fields show values in the axis unit: 5×10⁻⁶ eV reads 5 in µeV, 0.005 in meV, 5000 in neV", () => {
    expect(massRangeText(5e-6, "ueV")).toBe("5");
    expect(massRangeText(5e-6, "meV")).toBe("0.005");
    expect(massRangeText(5e-6, "neV")).toBe("5000");
    expect(massRangeText(5e-6, "eV")).toBe("5e-6");
  });
});
