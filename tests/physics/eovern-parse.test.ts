// Checks of the E/N text field: single values, intervals in several spellings, sorting and clear errors.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { parseEOverN, rationalToNumber } from "../../src/physics";

describe("parseEOverN: single values", () => {
  const cases: [string, string, number][] = [
    ["8/3", "8/3", 8 / 3], // DFSZ-type I (PDG review)
    ["-1/3", "-1/3", -1 / 3],
    ["\u22121/3", "-1/3", -1 / 3], // Unicode minus as pasted from a PDF
    ["0.5", "0.5", 0.5],
    ["1e-1", "1e-1", 0.1],
    ["  44/3 ", "44/3", 44 / 3], // upper end of the single heavy-quark window (Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801)
    ["0", "0", 0], // KSVZ-type neutral heavy quark
    ["+2", "2", 2],
    ["5 / 3", "5/3", 5 / 3],
  ];
  for (const [text, min, value] of cases) {
    test(JSON.stringify(text), () => {
      const r = parseEOverN(text);
      expect(r).toEqual({ ok: true, min, max: min, minValue: value, maxValue: value, isBand: false });
    });
  }
});

describe("parseEOverN: intervals", () => {
  const cases: [string, string, string, number, number][] = [
    ["0.5..14.7", "0.5", "14.7", 0.5, 14.7],
    ["5/3..44/3", "5/3", "44/3", 5 / 3, 44 / 3], // preferred window (Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801)
    ["44/3 .. 5/3", "5/3", "44/3", 5 / 3, 44 / 3], // sorted
    ["0.25 – 12", "0.25", "12", 0.25, 12], // en dash
    ["1/6—44/3", "1/6", "44/3", 1 / 6, 44 / 3], // em dash
    ["2/3 to 8/3", "2/3", "8/3", 2 / 3, 8 / 3],
    ["-1 - -2", "-2", "-1", -2, -1], // hyphen with spaces both sides
    ["1e-1...1e1", "1e-1", "1e1", 0.1, 10],
  ];
  for (const [text, min, max, minValue, maxValue] of cases) {
    test(JSON.stringify(text), () => {
      expect(parseEOverN(text)).toEqual({ ok: true, min, max, minValue, maxValue, isBand: true });
    });
  }
  test("equal ends make a line, not a band", () => {
    const r = parseEOverN("8/3..8/3");
    expect(r.ok && r.isBand).toBe(false);
  });
  test("min ≤ max for any two numbers (property, fast-check)", () => {
    fc.assert(
      // "+ 0" turns −0 into 0: the text "${-0}" is "0".
      fc.property(
        fc.double({ min: -100, max: 100, noNaN: true }).map((x) => x + 0),
        fc.double({ min: -100, max: 100, noNaN: true }).map((x) => x + 0),
        (a, b) => {
          const r = parseEOverN(`${a}..${b}`);
          expect(r.ok).toBe(true);
          if (r.ok) {
            expect(r.minValue).toBe(Math.min(a, b));
            expect(r.maxValue).toBe(Math.max(a, b));
            expect(r.isBand).toBe(a !== b);
          }
        },
      ),
    );
  });
});

describe("parseEOverN: errors", () => {
  const cases: [string, string][] = [
    ["abc", 'E/N: "abc" is not a number or fraction'],
    ["1..abc", 'E/N interval: "abc" is not a number or fraction'],
    ["abc..2", 'E/N interval: "abc" is not a number or fraction'],
    ["1/0", 'E/N: "1/0" has a zero denominator'],
    ["1..", 'E/N interval: "1.." is missing an end'],
    ["1..2..3", "more than two ends"],
    ["", "E/N: empty"],
    ["   ", "E/N: empty"],
    ["1e999", "not a finite number"],
  ];
  for (const [text, message] of cases) {
    test(JSON.stringify(text), () => {
      const r = parseEOverN(text);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error).toContain(message);
    });
  }
});

describe("rationalToNumber", () => {
  test("fractions, decimals and scientific notation; NaN for anything else", () => {
    expect(rationalToNumber("8/3")).toBe(8 / 3);
    expect(rationalToNumber("-5/3")).toBe(-5 / 3);
    expect(rationalToNumber("2.5e-1")).toBe(0.25);
    expect(rationalToNumber(" 7 ")).toBe(7);
    expect(rationalToNumber(1.5)).toBe(1.5);
    for (const bad of ["abc", "1/0", "", "1/2/3", "0x10"]) expect(rationalToNumber(bad)).toBeNaN();
  });
});

describe("between lines (a | b)", () => {
  // The window of Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801: the region between the 5/3 and 44/3 lines.
  test('"44/3 | 5/3" gives the sorted lines 5/3, 44/3 with their values', () => {
    const r = parseEOverN("44/3 | 5/3");
    expect(r).toEqual({
      ok: true,
      min: "5/3",
      max: "44/3",
      minValue: 5 / 3,
      maxValue: 44 / 3,
      isBand: true,
      lines: ["5/3", "44/3"],
    });
  });
  test("three values, a Unicode minus and a repeated value (counted once)", () => {
    const r = parseEOverN("\u22121/3 | 2 | 44/3 | 2");
    expect(r.ok && r.lines).toEqual(["-1/3", "2", "44/3"]);
  });
  test.each(["5/3 |", "| 2", "2 | 2", "5/3 | x", "1 | 1/0"])("%j is refused with a message", (bad) => {
    const r = parseEOverN(bad);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toMatch(/^E\/N lines: /);
  });
});
