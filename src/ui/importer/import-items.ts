// The state of one file (or pasted text) in the import step, and the pure steps on it: the parser options
// its settings stand for, the settings a first parse detected, and the wording of rejected rows.
import type { CurveRole, PhysicsSettings } from "../../project/types";
import {
  formatProblem,
  formatRejection,
  type CouplingUnit,
  type CurveParseOptions,
  type CurveParseResult,
  type MassUnit,
} from "../../data";
import { physicsOptsOf } from "../../plot/physics-settings";

/** Delimiter choices of the import step; "auto" lets the parser detect it. */
export const DELIMITERS: { value: string; label: string }[] = [
  { value: "auto", label: "auto-detect" },
  { value: ",", label: "comma" },
  { value: ";", label: "semicolon" },
  { value: "\t", label: "tab" },
  { value: " ", label: "spaces" },
];

/**
 * Everything the user can change for one file. `null` means "as detected" (from the header, or the
 * parser's default) until the first parse reports what it found; after that the step shows explicit values.
 */
export interface ImportSettings {
  /** "auto" or the delimiter itself ("," ";" "\t" " "). */
  delimiter: string;
  massUnit: MassUnit | null;
  couplingUnit: CouplingUnit | null;
  /** E/N of the model line when couplingUnit is "model-line" (as typed: "8/3", "0"). */
  modelEOverN: string;
  log10Mass: boolean;
  log10Coupling: boolean;
  /** 1-based columns to read; null = as detected. */
  massColumn: number | null;
  couplingColumn: number | null;
  role: CurveRole;
  keepOrder: boolean;
  label: string;
  citation: string;
}

/** Settings whose change needs a new parse (the others only label the curve). */
export const PARSE_KEYS: readonly (keyof ImportSettings)[] = [
  "delimiter",
  "massUnit",
  "couplingUnit",
  "modelEOverN",
  "log10Mass",
  "log10Coupling",
  "massColumn",
  "couplingColumn",
];

export type ItemStatus = "parsing" | "ready" | "failed";

export interface ImportItem {
  key: string;
  fileName: string;
  source: Blob;
  sizeBytes: number;
  /** A problem with the whole file (empty, binary, too large, one column…): nothing of it is imported. */
  problem: string | null;
  settings: ImportSettings;
  /** The label was typed by the user (so a detected `# label:` comment does not replace it). */
  labelEdited: boolean;
  status: ItemStatus;
  /** Fraction 0..1 of the current parse. */
  progress: number;
  result: CurveParseResult | null;
}

/** A byte count in words, in the binary units the import cap is set in (200 MB = 200 × 2²⁰ bytes). */
export function formatBytes(n: number): string {
  const trim = (v: number) => String(Number(v.toFixed(1)));
  if (n >= 2 ** 30) return `${trim(n / 2 ** 30)} GB`;
  if (n >= 2 ** 20) return `${trim(n / 2 ** 20)} MB`;
  if (n >= 2 ** 10) return `${trim(n / 2 ** 10)} kB`;
  return `${n} bytes`;
}

/** Default settings of a new source (everything detected, role exclusion, sorted by mass). */
export function initialSettings(label: string): ImportSettings {
  return {
    delimiter: "auto",
    massUnit: null,
    couplingUnit: null,
    modelEOverN: "0",
    log10Mass: false,
    log10Coupling: false,
    massColumn: null,
    couplingColumn: null,
    role: "exclusion",
    keepOrder: false,
    label,
    citation: "",
  };
}

/** The parser options an item's settings stand for (undefined fields are left to detection). */
export function parseOptsOf(
  item: Pick<ImportItem, "fileName" | "settings">,
  physics: PhysicsSettings,
): CurveParseOptions {
  const s = item.settings;
  const opts: CurveParseOptions = {
    fileName: item.fileName,
    physics: physicsOptsOf(physics),
    log10Mass: s.log10Mass,
    log10Coupling: s.log10Coupling,
  };
  if (s.delimiter !== "auto") opts.delimiter = s.delimiter;
  if (s.massUnit) opts.massUnit = s.massUnit;
  if (s.couplingUnit) opts.couplingUnit = s.couplingUnit;
  if (s.couplingUnit === "model-line") opts.modelEOverN = s.modelEOverN;
  if (s.massColumn !== null) opts.massColumn = s.massColumn;
  if (s.couplingColumn !== null) opts.couplingColumn = s.couplingColumn;
  return opts;
}

/**
 * The settings after a parse: detected values fill the `null` ones (so the menus show what was used), and a
 * citation written in the file (`# citation:`, as the CSV export writes it) fills an empty citation; a
 * `# label:` comment sets the label unless the user edited it.
 */
export function settingsAfterParse(s: ImportSettings, r: CurveParseResult, labelEdited = false): ImportSettings {
  return {
    ...s,
    // A `# label:` comment names the curve, as on the command line; a label the user typed wins.
    label: !labelEdited && r.label ? r.label : s.label,
    massUnit: s.massUnit ?? r.massUnit,
    couplingUnit: s.couplingUnit ?? r.couplingUnit,
    modelEOverN: s.couplingUnit === null && r.modelEOverN !== null ? String(r.modelEOverN) : s.modelEOverN,
    massColumn: s.massColumn ?? r.massColumn,
    couplingColumn: s.couplingColumn ?? r.couplingColumn,
    citation: s.citation === "" && r.citation ? r.citation : s.citation,
  };
}

/** The sentence for a file that gives no curve, or null. */
export function problemOf(fileName: string, r: CurveParseResult): string | null {
  if (r.fatal) return formatProblem(fileName, r.fatal);
  if (r.massEv.length === 0) return `${fileName}: no row could be read as two numbers, so there is nothing to import.`;
  return null;
}

/** How many rejected rows the step lists before it only counts the rest. */
export const REJECTED_SHOWN = 20;

/** Rejected rows as `file:row:column: reason`, the first {@link REJECTED_SHOWN}, and how many more there are. */
export function rejectionLines(
  fileName: string,
  r: Pick<CurveParseResult, "rejected" | "rejectedCount">,
): { lines: string[]; more: number } {
  const lines = r.rejected.slice(0, REJECTED_SHOWN).map((x) => formatRejection(fileName, x));
  return { lines, more: Math.max(0, r.rejectedCount - lines.length) };
}

/** True when the item will become a curve on confirm. */
export function importable(item: ImportItem): boolean {
  return item.problem === null && item.status === "ready" && item.result !== null && item.result.massEv.length > 0;
}
