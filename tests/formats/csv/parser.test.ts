// Checks of the curve CSV parser against RFC 4180 (Shafranovich, "Common Format and MIME Type for
// Comma-Separated Values (CSV) Files", 2005): BOM, comments, CRLF, quoting, row/column numbers of rejections,
// non-positive values, and the files that give no curve at all.
import { describe, expect, test } from "vitest";
import { formatProblem, formatRejection, labelFromFileName, parseCurveText } from "../../../src/data";

const arr = (a: Float64Array) => Array.from(a);

describe("encoding, comments, line ends", () => {
  test("UTF-8 BOM is tolerated (Unicode Standard §23.8: U+FEFF at the start is a signature, not content)", () => {
    const r = parseCurveText("\uFEFFm_a [eV],g [1/GeV]\n1,2\n");
    expect(r.header).toEqual(["m_a [eV]", "g [1/GeV]"]);
    expect(arr(r.massEv)).toEqual([1]);
  });
  test("# comment lines anywhere, blank lines, trailing blank lines", () => {
    const r = parseCurveText("# from a paper\n#\n1,2\n\n# middle\n3,4\n\n\n   \n");
    expect(arr(r.massEv)).toEqual([1, 3]);
    expect(r.comments).toEqual(["from a paper", "", "middle"]);
    expect(r.dataRows).toBe(2);
    expect(r.rejectedCount).toBe(0);
  });
  test("CRLF (RFC 4180 §2.1) and old-style CR line ends give the same rows and row numbers", () => {
    const lf = parseCurveText("# c\n1,2\nx,4\n5,6\n");
    const crlf = parseCurveText("# c\r\n1,2\r\nx,4\r\n5,6\r\n");
    const cr = parseCurveText("# c\r1,2\rx,4\r5,6\r");
    for (const r of [crlf, cr]) {
      expect(arr(r.massEv)).toEqual(arr(lf.massEv));
      expect(r.rejected).toEqual(lf.rejected);
    }
    expect(lf.rejected).toEqual([{ row: 3, column: 1, reason: 'not a number: "x"' }]);
  });
  test("no newline at the end of the last row", () => {
    expect(arr(parseCurveText("1,2\n3,4").massEv)).toEqual([1, 3]);
  });
  test("spreadsheet padding rows of bare delimiters count as blank", () => {
    const r = parseCurveText("1,2\n,\n3,4\n,,\n");
    expect(arr(r.massEv)).toEqual([1, 3]);
    expect(r.rejectedCount).toBe(0);
  });
});

describe("quoted fields (RFC 4180 §2.5–2.7)", () => {
  test('"1.0","2e-10" and quoted header cells with the delimiter inside', () => {
    const r = parseCurveText('"mass, [eV]","g [1/GeV]"\n"1.0","2e-10"\n" 3 ",4e-10\n');
    expect(r.header).toEqual(["mass, [eV]", "g [1/GeV]"]);
    expect(arr(r.massEv)).toEqual([1, 3]);
    expect(arr(r.gInvGeV)).toEqual([2e-10, 4e-10]);
  });
  test("doubled quotes are an escaped quote; an unterminated quote is reported", () => {
    const r = parseCurveText('a,b\n"1""",2\n"3,4\n5,6\n');
    expect(r.rejected).toEqual([
      { row: 2, column: 1, reason: 'not a number: "1"""' },
      { row: 3, column: 1, reason: "unterminated quote" },
    ]);
    expect(arr(r.massEv)).toEqual([5]);
  });
  test("decimal comma inside quotes with a comma delimiter when asked", () => {
    const r = parseCurveText('"1,5","2,5e-12"\n', { decimalComma: true, delimiter: "," });
    expect(arr(r.massEv)).toEqual([1.5]);
    expect(arr(r.gInvGeV)).toEqual([2.5e-12]);
  });
});

describe("rejected rows: file:row:column: reason", () => {
  const text = "\uFEFF# comment\nmass_eV,g_GeV^-1\n1,2\n\nabc,4\n5\n6,\n7,8e\n9,10\n";
  const r = parseCurveText(text, { fileName: "limit.csv" });
  test("rows counted from 1 as in the file (comment, header, blank lines count), columns from 1", () => {
    expect(r.rejected).toEqual([
      { row: 5, column: 1, reason: 'not a number: "abc"' },
      { row: 6, column: 2, reason: "missing column 2" },
      { row: 7, column: 2, reason: "empty field" },
      { row: 8, column: 2, reason: 'not a number: "8e"' },
    ]);
    expect(r.rejectedCount).toBe(4);
    expect(arr(r.massEv)).toEqual([1, 9]);
    expect(r.dataRows).toBe(6);
  });
  test("the formatter writes file:row:column: reason", () => {
    expect(formatRejection("limit.csv", r.rejected[0])).toBe('limit.csv:5:1: not a number: "abc"');
    expect(r.messages.some((m) => m.text.includes('limit.csv:5:1: not a number: "abc"'))).toBe(true);
  });
  test("the list is capped but the count stays exact", () => {
    const many = "1,2\n" + "x,1\n".repeat(50);
    const c = parseCurveText(many, { maxRejected: 10 });
    expect(c.rejected.length).toBe(10);
    expect(c.rejectedCount).toBe(50);
  });
});

describe("values ≤ 0: counted exactly, kept in the arrays", () => {
  test("zeros and negatives in either column", () => {
    const r = parseCurveText("1,2\n0,1\n-1,1\n1,0\n1,-1e-12\n-0,-0\n3,4\n");
    expect(r.nonPositive).toBe(5);
    expect(r.nonPositiveMass).toBe(3);
    expect(r.nonPositiveCoupling).toBe(3);
    expect(r.nonPositiveRows).toEqual([2, 3, 4, 5, 6]);
    expect(r.massEv.length).toBe(7);
    expect(arr(r.massEv)).toEqual([1, 0, -1, 1, 1, -0, 3]);
    expect(r.messages.some((m) => m.level === "warning" && m.text.startsWith("5 rows have a value ≤ 0"))).toBe(true);
  });
  test("a value that underflows to 0 is counted too", () => {
    expect(parseCurveText("1e-400,1\n").nonPositive).toBe(1);
  });
});

describe("files that give no curve", () => {
  test("empty text", () => {
    const r = parseCurveText("");
    expect(r.fatal).toEqual({ code: "empty", message: "the file is empty" });
    expect(r.massEv.length).toBe(0);
  });
  test("only comments; header without data", () => {
    expect(parseCurveText("# nothing\n\n").fatal?.code).toBe("no-data");
    expect(parseCurveText("mass_eV,g_GeV^-1\n").fatal?.message).toBe("the file has a header but no data rows");
  });
  test("a single column", () => {
    const r = parseCurveText("m [eV]\n1\n2\n3\n");
    expect(r.fatal?.code).toBe("single-column");
    expect(r.fatal?.message).toContain("a curve needs two");
  });
  test("binary data: NUL characters or mostly control characters", () => {
    expect(parseCurveText("1,2\n\u0000\u0000\u0001").fatal?.code).toBe("binary");
    expect(parseCurveText("\u0001\u0002\u0003\u0004\u0005\u0006xyz,1\n").fatal?.code).toBe("binary");
  });
  test("formatProblem prefixes the file name", () => {
    expect(formatProblem("a.csv", { code: "empty", message: "the file is empty" })).toBe("a.csv: the file is empty");
  });
});

describe("preview, label and citation for the import step", () => {
  test("preview rows with raw fields, parsed values and problems", () => {
    const r = parseCurveText("m [ueV],g\n1,2\nx,3\n", { previewRows: 5 });
    expect(r.preview).toEqual([
      { row: 2, fields: ["1", "2"], massEv: 1e-6, gInvGeV: 2, problem: null },
      { row: 3, fields: ["x", "3"], massEv: null, gInvGeV: null, problem: 'not a number: "x"' },
    ]);
  });
  test("maxDataRows stops early and says so", () => {
    const r = parseCurveText("1,2\n".repeat(100), { maxDataRows: 10 });
    expect(r.massEv.length).toBe(10);
    expect(r.truncated).toBe(true);
  });
  test("label and citation comment lines (as the CSV export writes them)", () => {
    const r = parseCurveText("# label: My limit\n# citation: @article{x,\n# citation:   title = {T}}\n1,2\n");
    expect(r.label).toBe("My limit");
    expect(r.citation).toBe("@article{x,\n  title = {T}}");
  });
  test("the default curve label is the file name without folders and extension", () => {
    expect(labelFromFileName("data/limits.v2.csv")).toBe("limits.v2");
    expect(labelFromFileName("C:\\x\\scan.txt")).toBe("scan");
    expect(labelFromFileName(".hidden")).toBe(".hidden");
  });
});
