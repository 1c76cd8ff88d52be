// β of SU(3)_L × U(1)_X models as papers write it, read exactly as b = β/√3: the usual values β = −√3
// (F. Pisano, V. Pleitez, PRD 46 (1992) 410; P. H. Frampton, PRL 69 (1992) 2889) and β = −1/√3 (R. Foot,
// H. N. Long, T. A. Tran, PRD 50 (1994) R34), from memory.
import { describe, expect, test } from "vitest";
import { formatBeta, parseBeta, toFractionString } from "../../src/physics";

const b = (t: string) => {
  const r = parseBeta(t);
  return r.ok ? toFractionString(r.b) : r.reason;
};

describe("β as written in papers", () => {
  test("the usual spellings of ±√3 and ±1/√3 give b = ±1 and ±1/3", () => {
    expect(["-√3", "−√3", "-sqrt(3)", "- sqrt3", "√3", "√(3)"].map(b)).toEqual(["-1", "-1", "-1", "-1", "1", "1"]);
    expect(["-1/√3", "−1/√3", "1/sqrt(3)", "√3/3", "1/3·√3", "1/3 √3"].map(b)).toEqual([
      "-1/3",
      "-1/3",
      "1/3",
      "1/3",
      "1/3",
      "1/3",
    ]);
    expect([b("2√3"), b("2/√3"), b("0")]).toEqual(["2", "2/3", "0"]);
  });
  test("a rational non-zero β, text and a zero denominator are refused with a reason", () => {
    expect(b("1/3")).toMatch(/rational multiple of √3/);
    expect(b("abc")).toMatch(/rational multiple of √3/);
    expect(b("√3/0")).toMatch(/zero denominator/);
    expect(b("")).toMatch(/empty/);
  });
  test("formatBeta writes β back as parseBeta reads it", () => {
    for (const t of ["-1/√3", "√3", "−√3", "2/√3", "2√3", "0", "1/(3√3)", "5√3/2"]) {
      const r = parseBeta(t);
      expect(r.ok).toBe(true);
      if (r.ok) expect(b(formatBeta(r.b)), t).toBe(toFractionString(r.b));
    }
  });
});
