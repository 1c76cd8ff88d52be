// Checks of g_aγγ(m_a), m_a·f_a, the band edges and the inverse against the published formula and constants.
import { describe, expect, test } from "vitest";
import { faFromMass, gAgg, massFromFa } from "../../src/physics";

describe("m_a·f_a", () => {
  test("f_a = 10¹² GeV gives m_a = 5.691 μeV (Gorghetto & Villadoro, JHEP 03 (2019) 033, eq. for m_a)", () => {
    expect(massFromFa(1e12)).toBeCloseTo(5.691e-6, 12);
    expect(massFromFa(1e12, "2016")).toBeCloseTo(5.7e-6, 12);
    expect(faFromMass(massFromFa(3.3e9))).toBeCloseTo(3.3e9, 0);
  });
  test("g_aγγ for KSVZ E/N = 0 at f_a = 10¹² GeV: α/(2π·10¹² GeV)·1.92 (Grilli di Cortona et al., JHEP 01 (2016) 034)", () => {
    const g = gAgg(5.691e-6, 0);
    expect(g).toBeCloseTo((7.2973525693e-3 / (2 * Math.PI * 1e12)) * 1.92, 25);
  });
});
