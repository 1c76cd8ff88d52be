// Command-line reading of awkward CSV files (the repro files of tests/formats/csv/repro): the same encoding
// detection, refusals and label as the app's import, so a file means the same thing in both.
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { parseArgs } from "../../src/cli/args";
import { loadCsvProject } from "../../src/cli/inputs";
import { InputError } from "../../src/cli/read-input";

const REPRO = join(__dirname, "../formats/csv/repro");

function load(...files: string[]) {
  const a = parseArgs([...files.map((f) => join(REPRO, f)), "-o", "/tmp/unused.svg"]);
  if (!a.ok) throw new Error(a.error);
  return loadCsvProject(a.options);
}

function refusal(file: string): string {
  try {
    load(file);
  } catch (e) {
    if (e instanceof InputError) return e.message;
    throw e;
  }
  return "";
}

describe("encodings", () => {
  it("a Latin-1 µ in the header is read as µeV, with a note naming Windows-1252 (latin1_mu.csv)", () => {
    const r = load("latin1_mu.csv");
    // First row "1, 1e-14" in µeV: 1e-6 eV (SI Brochure 9th ed., Table 7).
    expect(r.project.curves[0].massEv[0]).toBe(1e-6);
    expect(r.notes.join("\n")).toMatch(/latin1_mu\.csv: .*Windows-1252/);
  });
  it("UTF-16 with a byte order mark opens as in the browser (utf16.csv)", () => {
    const r = load("utf16.csv");
    expect(r.project.curves[0].massEv.length).toBeGreaterThan(10);
    // Header "m_a [ueV]", first row "1, 1e-14".
    expect(r.project.curves[0].massEv[0]).toBe(1e-6);
    expect(r.project.curves[0].gInvGeV[0]).toBe(1e-14);
  });
});

describe("rows that disagree with the header are refused with file:row:column", () => {
  it("mixed delimiters (mixed_sep.csv)", () => {
    expect(refusal("mixed_sep.csv")).toMatch(/mixed_sep\.csv:2:1: .*mixes delimiters/);
  });
  it("a decimal comma with a comma delimiter (dec_comma_comma.csv)", () => {
    expect(refusal("dec_comma_comma.csv")).toMatch(/dec_comma_comma\.csv:2:3: this row has 4 fields/);
  });
});
