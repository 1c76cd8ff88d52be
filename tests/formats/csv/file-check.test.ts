// Checks of the file pre-checks (size cap, empty file, binary formats by their magic numbers, UTF-16 byte
// order marks, Unicode Standard §23.8).
import { describe, expect, test } from "vitest";
import { checkImportFile, MAX_IMPORT_BYTES } from "../../../src/data";

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
