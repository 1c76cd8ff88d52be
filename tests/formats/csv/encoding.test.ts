// Checks of the text encoding of imported files: UTF-8 when the bytes are valid UTF-8, else Windows-1252
// (WHATWG Encoding Standard, §4.2: the labels "latin1" and "iso-8859-1" name windows-1252, where byte 0xB5 is
// U+00B5 MICRO SIGN), said in a warning; a unit the header names but the import does not know stops the file.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { checkImportFile, decodeImportBytes, parseCurveSource, parseCurveText } from "../../../src/formats/csv";

const repro = (name: string) => new Uint8Array(readFileSync(join(__dirname, "repro", name)));

describe("a Latin-1 µ in the header (repro/latin1_mu.csv)", () => {
  const bytes = repro("latin1_mu.csv");
  test("the file check names Windows-1252 when the first bytes are not valid UTF-8", () => {
    const c = checkImportFile({ size: bytes.length, firstBytes: bytes.subarray(0, 4096) });
    expect(c).toEqual({ ok: true, encoding: "windows-1252" });
  });
  test("read as µeV in the browser's path (bytes in slices), with a warning naming the encoding", async () => {
    const r = await parseCurveSource(bytes, { fileName: "latin1_mu.csv" });
    expect(r.fatal).toBeNull();
    expect(r.massUnit).toBe("ueV");
    expect(r.massUnitSource).toBe("header");
    // First data row "1, 1e-14": 1 µeV = 1e-6 eV (SI Brochure 9th ed., Table 7).
    expect(r.massEv[0]).toBe(1e-6);
    expect(r.messages.some((m) => m.level === "warning" && /Windows-1252/.test(m.text))).toBe(true);
  });
  test("decodeImportBytes (the command line's path) gives the same text", () => {
    const d = decodeImportBytes(bytes);
    expect(d.ok && d.encoding).toBe("windows-1252");
    if (!d.ok) return;
    expect(d.text.startsWith("m_a [\u00b5eV], g [1/GeV]\n")).toBe(true);
    const r = parseCurveText(d.text, { encoding: d.encoding });
    expect(r.massEv[0]).toBe(1e-6);
  });
  test("an invalid UTF-8 byte after the first 4 KiB also switches to Windows-1252, losing nothing", async () => {
    const head = "m_a [eV],g [1/GeV]\n" + "1,2\n".repeat(2000);
    const tail = new Uint8Array([...new TextEncoder().encode("# caf"), 0xe9, 10, 0x33, 0x2c, 0x34, 10]);
    const all = new Uint8Array([...new TextEncoder().encode(head), ...tail]);
    const r = await parseCurveSource(all, { fileName: "late.csv" }, { sliceChars: 1024 });
    expect(r.massEv.length).toBe(2001);
    expect(r.comments).toContain("caf\u00e9");
    expect(r.messages.some((m) => /Windows-1252/.test(m.text))).toBe(true);
  });
  test("valid UTF-8 stays UTF-8: a UTF-8 µ needs no warning", async () => {
    const r = await parseCurveSource(new TextEncoder().encode("m_a [\u00b5eV],g [1/GeV]\n1,2\n"));
    expect(r.massEv[0]).toBe(1e-6);
    expect(r.messages.some((m) => /Windows-1252/.test(m.text))).toBe(false);
  });
});

describe("a unit the header names but the import does not know is never replaced by a default", () => {
  test("an undecodable µ (U+FFFD) stops the file with a message naming column and unit", () => {
    const r = parseCurveText("m_a [\ufffdeV], g [1/GeV]\n1, 1e-14\n", { fileName: "f.csv" });
    expect(r.fatal?.code).toBe("unknown-unit");
    expect(r.fatal?.message).toContain("column 1");
    expect(r.fatal?.message).toContain("\ufffdeV");
    expect(r.massEv.length).toBe(0);
  });
  test("an unknown prefix on eV or GeV is refused too; a unit chosen by the user is taken", () => {
    expect(parseCurveText("m [xeV],g [1/GeV]\n1,2\n").fatal?.code).toBe("unknown-unit");
    expect(parseCurveText("m [eV],g [1/TeV]\n1,2\n").fatal?.code).toBe("unknown-unit");
    const chosen = parseCurveText("m [xeV],g [1/GeV]\n1,2\n", { massUnit: "ueV" });
    expect(chosen.fatal).toBeNull();
    expect(chosen.massEv[0]).toBe(1e-6);
  });
  test("a header word in brackets that is not a unit is no unit: eV assumed as before", () => {
    const r = parseCurveText("mass (approx),coupling (upper)\n1,2\n");
    expect(r.fatal).toBeNull();
    expect(r.massUnitSource).toBe("default");
  });
});
