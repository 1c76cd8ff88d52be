// Checks of the import step's pinned options: a re-parse with the detected choices pinned reads the file
// exactly as the first parse did, and one changed choice changes only what it should.
import { describe, expect, test } from "vitest";
import { DELIMITER_CHOICES, MASS_UNIT_CHOICES, pinnedOptions } from "../../src/formats/import-options";
import { parseCurveText } from "../../src/data";

const text = "# scan\nm_a [ueV];g [1/GeV];note\n1,5;2,5e-12;a\n3;4e-12;b\n";

describe("pinnedOptions", () => {
  const first = parseCurveText(text, { fileName: "s.csv" });
  test("pinned options reproduce the first parse", () => {
    const again = parseCurveText(text, pinnedOptions(first));
    expect(Array.from(again.massEv)).toEqual(Array.from(first.massEv));
    expect(again.delimiter).toBe(";");
    expect(again.decimalComma).toBe(true);
    expect(again.massUnitSource).toBe("option");
  });
  test("changing the mass unit keeps the rest: 1.5 neV instead of μeV is 10³ times smaller", () => {
    const r = parseCurveText(text, pinnedOptions(first, { massUnit: "neV" }));
    expect(Array.from(r.massEv)).toEqual([1.5e-9, 3e-9]);
    expect(Array.from(r.gInvGeV)).toEqual(Array.from(first.gInvGeV));
  });
  test("changing the delimiter lets columns and the decimal mark be detected again", () => {
    const o = pinnedOptions(first, { delimiter: "," });
    expect(o.massColumn).toBeUndefined();
    expect(o.decimalComma).toBeUndefined();
    expect(pinnedOptions(first, { delimiter: "auto" }).delimiter).toBeUndefined();
  });
  test("choices for the menus include every importer unit and every delimiter", () => {
    expect(MASS_UNIT_CHOICES.map((c) => c.value)).toEqual(
      expect.arrayContaining(["eV", "meV", "ueV", "neV", "peV", "keV", "GeV", "Hz", "kHz", "MHz", "GHz"]),
    );
    expect(DELIMITER_CHOICES.map((c) => c.value)).toEqual(["auto", ",", ";", "\t", " "]);
  });
});
