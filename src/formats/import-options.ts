// The per-file choices of the import step as parser options: what a first parse (or preview) detected,
// pinned so that a re-parse with one choice changed, or the full parse after a preview, reads the same way.
import type { CurveParseOptions, CurveParseResult } from "./csv";
import { MASS_UNITS } from "./units";

/** Delimiter choices with their labels; "auto" lets the parser detect it. */
export const DELIMITER_CHOICES: readonly { value: string; label: string }[] = [
  { value: "auto", label: "auto-detect" },
  { value: ",", label: "comma" },
  { value: ";", label: "semicolon" },
  { value: "\t", label: "tab" },
  { value: " ", label: "spaces" },
];

/** Mass unit choices (value as the parser takes it, label with μ). */
export const MASS_UNIT_CHOICES: readonly { value: string; label: string }[] = MASS_UNITS.map((u) => ({
  value: u.id,
  label: u.label,
}));

/**
 * Options that read the file exactly as `result` did, with `changes` applied on top. Changing the delimiter
 * or the header flag drops the pinned columns and decimal mark (they were found with the old splitting),
 * so those are detected again.
 * @param changes options the user changed in the import step @default {}
 */
export function pinnedOptions(result: CurveParseResult, changes: Partial<CurveParseOptions> = {}): CurveParseOptions {
  const pinned: CurveParseOptions = {
    fileName: result.fileName,
    delimiter: result.delimiter,
    decimalComma: result.decimalComma,
    header: result.header !== null,
    massColumn: result.massColumn,
    couplingColumn: result.couplingColumn,
    massUnit: result.massUnit,
    couplingUnit: result.couplingUnit,
    log10Mass: result.log10Mass,
    log10Coupling: result.log10Coupling,
  };
  if (result.modelEOverN !== null) pinned.modelEOverN = result.modelEOverN;
  const resplit =
    (changes.delimiter !== undefined && changes.delimiter !== result.delimiter) ||
    (changes.header !== undefined && changes.header !== (result.header !== null));
  if (resplit) {
    delete pinned.decimalComma;
    delete pinned.massColumn;
    delete pinned.couplingColumn;
    if (changes.delimiter !== undefined) delete pinned.header;
  }
  const out: CurveParseOptions = { ...pinned, ...changes };
  if (out.delimiter === "auto") delete out.delimiter;
  return out;
}
