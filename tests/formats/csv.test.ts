// Checks of the curve CSV importer against the file convention of DESIGN.md §3 and RFC 4180 (Shafranovich,
// "Common Format and MIME Type for Comma-Separated Values (CSV) Files", 2005): delimiters, BOM, comments,
// header units, decimal comma, CRLF, quoting, row/column numbers of rejections, non-positive values, and the
// files that give no curve at all.
import { describe, expect, test } from "vitest";
import {
  checkImportFile,
  formatProblem,
  formatRejection,
  labelFromFileName,
  MAX_IMPORT_BYTES,
  parseCurveText,
  readNumberText,
} from "../../src/data";
import { gAgg } from "../../src/physics";

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

describe("numbers", () => {
  test("plain and scientific, e or E, signs, leading/trailing point (ECMAScript Number() as reference)", () => {
    for (const s of [
      "1",
      "-1",
      "+1",
      "1.5",
      ".5",
      "5.",
      "1e-10",
      "1E-10",
      "1.2e+3",
      "-0.000123",
      "123456789012345678901234",
      "4.9e-324",
    ]) {
      expect(readNumberText(s), s).toBe(Number(s));
    }
  });
  test("not numbers: words, hex, Infinity, NaN, two points, a bare exponent", () => {
    for (const s of ["abc", "0x10", "Infinity", "NaN", "1.2.3", "1e", "e5", "--1", "1,5", ""])
      expect(readNumberText(s), s).toBeNaN();
  });
  test("decimal comma with ; (dot also accepted there)", () => {
    const r = parseCurveText("m_a [ueV];g [1/GeV]\n1,5;2,5e-12\n3.5;4e-12\n");
    expect(r.decimalComma).toBe(true);
    expect(arr(r.massEv)).toEqual([1.5e-6, 3.5e-6]);
    expect(arr(r.gInvGeV)).toEqual([2.5e-12, 4e-12]);
  });
  test("decimal comma is detected with tabs too", () => {
    const r = parseCurveText("1,5\t2,5\n3,5\t4,5\n");
    expect(r.delimiter).toBe("\t");
    expect(r.decimalComma).toBe(true);
    expect(arr(r.massEv)).toEqual([1.5, 3.5]);
  });
  test("a value too large for a double is out of range", () => {
    const r = parseCurveText("1,2\n1e400,3\n");
    expect(r.rejected).toEqual([{ row: 2, column: 1, reason: 'out of range: "1e400"' }]);
  });
  test("unit prefixes shift the decimal exponent, so 1.1 μeV is exactly the double nearest 1.1e-6", () => {
    const r = parseCurveText("m [ueV],g\n1.1,1\n0.3,1\n");
    expect(arr(r.massEv)).toEqual([1.1e-6, 3e-7]);
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
  test("|g_γ| = 0.96 is the same line (haloscope convention g_γ = C_aγ/2, DESIGN.md §4)", () => {
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

describe("pre-checks on the raw file (checkImportFile)", () => {
  const text = new TextEncoder().encode("m,g\n1,2\n");
  test("size cap is 200 MB (MAX_IMPORT_BYTES = 200 × 2²⁰)", () => {
    expect(MAX_IMPORT_BYTES).toBe(200 * 1024 * 1024);
    expect(checkImportFile({ name: "a", size: MAX_IMPORT_BYTES, firstBytes: text }).ok).toBe(true);
    const big = checkImportFile({ name: "a", size: MAX_IMPORT_BYTES + 1, firstBytes: text });
    expect(big.ok ? null : big.problem.code).toBe("too-large");
    expect(big.ok ? "" : big.problem.message).toContain("200 MB");
  });
  test("empty file", () => {
    const r = checkImportFile({ size: 0, firstBytes: new Uint8Array() });
    expect(r.ok ? null : r.problem.code).toBe("empty");
  });
  test("known binary formats by signature: ZIP 'PK\\3\\4' (PKWARE APPNOTE §4.3.7), PDF '%PDF' (ISO 32000-1 §7.5.2), PNG (ISO/IEC 15948 §5.2)", () => {
    const zip = checkImportFile({ size: 100, firstBytes: new Uint8Array([0x50, 0x4b, 0x03, 0x04, 1, 2]) });
    expect(zip.ok ? "" : zip.problem.message).toContain("ZIP");
    const pdf = checkImportFile({ size: 100, firstBytes: new TextEncoder().encode("%PDF-1.7\n") });
    expect(pdf.ok ? "" : pdf.problem.message).toContain("PDF");
    const png = checkImportFile({
      size: 100,
      firstBytes: new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    });
    expect(png.ok ? null : png.problem.code).toBe("binary");
  });
  test("NUL bytes and invalid UTF-8 are binary; UTF-8 text with a multi-byte character cut at the end is not", () => {
    expect(checkImportFile({ size: 10, firstBytes: new Uint8Array([49, 44, 0, 50]) }).ok).toBe(false);
    const junk = new Uint8Array(200).map((_, i) => 0x80 + (i % 60));
    expect(checkImportFile({ size: 200, firstBytes: junk }).ok).toBe(false);
    const mu = new TextEncoder().encode("m [\u03bceV],g\n1,2\n\u03bc");
    expect(checkImportFile({ size: 1000, firstBytes: mu.subarray(0, mu.length - 1) }).ok).toBe(true);
  });
  test("UTF-16 byte-order marks FF FE / FE FF (Unicode Standard §23.8) select the decoder", () => {
    expect(checkImportFile({ size: 10, firstBytes: new Uint8Array([0xff, 0xfe, 0x31, 0]) })).toEqual({
      ok: true,
      encoding: "utf-16le",
    });
    expect(checkImportFile({ size: 10, firstBytes: new Uint8Array([0xfe, 0xff, 0, 0x31]) })).toEqual({
      ok: true,
      encoding: "utf-16be",
    });
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
