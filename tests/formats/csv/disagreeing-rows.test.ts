// Rows that disagree with the header on the number of columns (a decimal comma in a comma-separated file,
// repro/dec_comma_comma.csv) or with the detected delimiter (repro/mixed_sep.csv) stop the file with a
// `file:row:column` message instead of importing wrong numbers; choosing the delimiter reads the rows that fit.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { formatProblem, parseCurveText } from "../../../src/formats/csv";

const repro = (name: string) => readFileSync(join(__dirname, "repro", name), "utf8");

describe("a decimal comma with a comma delimiter (dec_comma_comma.csv)", () => {
  const r = parseCurveText(repro("dec_comma_comma.csv"), { fileName: "dec_comma_comma.csv" });
  test("refused at the first row with more fields than the header names, nothing imported", () => {
    expect(r.fatal?.code).toBe("column-count");
    expect(r.massEv.length).toBe(0);
    // Line 2 is "1,0000,1,0000e-14": 4 fields under a 2-column header; the first extra one is column 3.
    expect(formatProblem("dec_comma_comma.csv", r.fatal!)).toMatch(/^dec_comma_comma\.csv:2:3: /);
    expect(r.fatal?.message).toMatch(/4 fields/);
    expect(r.fatal?.message).toMatch(/decimal comma/);
  });
  test("a trailing delimiter is no extra field", () => {
    const ok = parseCurveText("m [eV],g [1/GeV]\n1,2,\n3,4\n");
    expect(ok.fatal).toBeNull();
    expect(Array.from(ok.massEv)).toEqual([1, 3]);
  });
  test("a header naming more columns than are read leaves longer rows alone", () => {
    const ok = parseCurveText("m [eV],g [1/GeV],note\n1,2,x\n3,4,y\n");
    expect(ok.fatal).toBeNull();
    expect(Array.from(ok.gInvGeV)).toEqual([2, 4]);
  });
});

describe("mixed delimiters (mixed_sep.csv: comma, semicolon, tab and space in turn)", () => {
  test("refused at the first row another delimiter splits into the header's columns", () => {
    const r = parseCurveText(repro("mixed_sep.csv"), { fileName: "mixed_sep.csv" });
    expect(r.fatal?.code).toBe("mixed-delimiters");
    expect(r.massEv.length).toBe(0);
    expect(formatProblem("mixed_sep.csv", r.fatal!)).toMatch(/^mixed_sep\.csv:[2-5]:1: /);
    expect(r.fatal?.message).toMatch(/mixes delimiters/);
  });
  test("a comma file with one semicolon row is refused too; an unreadable row alone is only rejected", () => {
    const mixed = parseCurveText("1,2\n3;4\n5,6\n", { fileName: "f.csv" });
    expect(mixed.fatal?.code).toBe("mixed-delimiters");
    expect(formatProblem("f.csv", mixed.fatal!)).toMatch(/^f\.csv:2:1: /);
    const typo = parseCurveText("1,2\nx,4\n5,6\n");
    expect(typo.fatal).toBeNull();
    expect(typo.rejected).toEqual([{ row: 2, column: 1, reason: 'not a number: "x"' }]);
  });
  test("a delimiter chosen by the user is a named interpretation: rows that do not fit are rejected rows", () => {
    const r = parseCurveText(repro("mixed_sep.csv"), { delimiter: "," });
    expect(r.fatal).toBeNull();
    // Lines 2, 6, 10, … (every fourth) are the comma-separated ones.
    expect(r.massEv[0]).toBe(1e-6);
    expect(r.massEv.length + r.rejectedCount).toBe(r.dataRows);
    expect(r.rejectedCount).toBeGreaterThan(0);
  });
});
