// The decimal mark is what the file writes, not what its delimiter suggests: a semicolon file with decimal
// points is no "decimal comma" file (repro/dec_comma_semicolon.csv is one with commas), and a file whose rows
// disagree on the mark stops with `file:row:column` unless the user chose the mark.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { formatProblem, parseCurveText } from "../../../src/formats/csv";

describe("decimal mark detection", () => {
  test("a semicolon file with decimal points reads them and does not report a decimal comma", () => {
    const r = parseCurveText("m [eV];g [1/GeV]\n1.5;2e-14\n2.5;3e-14\n");
    expect(r.delimiter).toBe(";");
    expect(r.decimalComma).toBe(false);
    expect(Array.from(r.massEv)).toEqual([1.5, 2.5]);
    expect(r.messages[0].text).not.toMatch(/decimal comma/);
  });
  test("the same with the semicolon chosen by the user", () => {
    const r = parseCurveText("1.5;2e-14\n2.5;3e-14\n", { delimiter: ";" });
    expect(r.decimalComma).toBe(false);
    expect(Array.from(r.gInvGeV)).toEqual([2e-14, 3e-14]);
  });
  test("dec_comma_semicolon.csv writes decimal commas: reported and read as such", () => {
    const text = readFileSync(join(__dirname, "repro", "dec_comma_semicolon.csv"), "utf8");
    const r = parseCurveText(text);
    expect(r.decimalComma).toBe(true);
    expect(r.messages[0].text).toMatch(/semicolon, decimal comma/);
    // Line 3 "1,09854; 1,09816e-14" with the mass in µeV.
    expect(r.massEv[1]).toBe(1.09854e-6);
    expect(r.gInvGeV[1]).toBe(1.09816e-14);
  });
});

describe("rows that disagree on the decimal mark", () => {
  test("a decimal comma below decimal points stops the file at that field", () => {
    const r = parseCurveText("1.5;2e-14\n2.5;3e-14\n3,5;4e-14\n", { fileName: "f.csv" });
    expect(r.fatal?.code).toBe("mixed-decimal");
    expect(formatProblem("f.csv", r.fatal!)).toMatch(/^f\.csv:3:1: "3,5" /);
    expect(r.massEv.length).toBe(0);
  });
  test("a decimal point below decimal commas too", () => {
    const r = parseCurveText("1,5;2e-14\n2,5;3e-14\n3;4.5e-14\n", { fileName: "f.csv" });
    expect(r.fatal?.code).toBe("mixed-decimal");
    expect(formatProblem("f.csv", r.fatal!)).toMatch(/^f\.csv:3:2: "4\.5e-14" /);
  });
  test("with the mark chosen by the user, the other mark is a rejected row", () => {
    const r = parseCurveText("1.5;2e-14\n3,5;4e-14\n", { decimalComma: false });
    expect(r.fatal).toBeNull();
    expect(r.rejected).toEqual([{ row: 2, column: 1, reason: 'not a number: "3,5"' }]);
  });
});
