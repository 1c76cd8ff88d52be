// The curve import's public shapes: options, the result, rejected rows and problems, and the small helpers
// that turn them into the `file:row:column: reason` sentences the import step and the command line print.
import type { PhysicsOpts } from "../../physics/constants";
import type { CouplingUnit, MassUnit } from "../units";

/** Options of one file's import; every field is optional and the parser detects what is not given. */
export interface CurveParseOptions {
  /** Shown in messages (`file:row:column: reason`). @default "input" */
  fileName?: string;
  /** Unit of the mass column (any spelling {@link parseMassUnit} knows); overrides the header. @default from the header, else "eV" */
  massUnit?: string;
  /** Unit of the coupling column ({@link parseCouplingUnit}); overrides the header. @default from the header, else "GeV^-1" */
  couplingUnit?: string;
  /** `,` `;` tab or ` ` (runs of spaces and tabs); also the names comma, semicolon, tab, space, whitespace. @default auto-detected */
  delimiter?: string;
  /** `,` is the decimal point (and `.` is not). @default detected for `;`, tab and spaces; false for `,` */
  decimalComma?: boolean;
  /** Whether the first non-comment line names the columns. @default detected (a line with letters that is not numeric) */
  header?: boolean;
  /** 1-based column holding the mass. @default the column whose header names a mass unit, else 1 */
  massColumn?: number;
  /** 1-based column holding the coupling. @default the column whose header names a coupling unit, else the first other column */
  couplingColumn?: number;
  /** The mass column holds log10 of the value in `massUnit` (common in digitised figures). @default false */
  log10Mass?: boolean;
  /** The coupling column holds log10 of the value in `couplingUnit`. @default false */
  log10Coupling?: boolean;
  /** E/N of the model line for couplingUnit "model-line": a number or a fraction such as "8/3". */
  modelEOverN?: number | string;
  /** Constants for the normalized units (c_γ, K). @default the physics core's default reference */
  physics?: PhysicsOpts;
  /** How many data rows to keep as preview (raw fields and parsed values). @default 20 */
  previewRows?: number;
  /** Stop after this many data rows (for a quick preview of a large file); the result says `truncated`. */
  maxDataRows?: number;
  /** Keep at most this many rejected rows in the list (rejectedCount stays exact). @default 10000 */
  maxRejected?: number;
  /** The encoding the text was decoded from (set by parseCurveSource and decodeImportBytes); a warning names it when it is not UTF-8 or UTF-16. */
  encoding?: string;
  /** Expected number of characters, to size the arrays once. */
  sizeHint?: number;
}

export interface RejectedRow {
  /** 1-based line number in the file (comment, blank and header lines count). */
  row: number;
  /** 1-based column. */
  column: number;
  reason: string;
}

type ImportProblemCode =
  | "empty"
  | "no-data"
  | "single-column"
  | "mixed-decimal"
  | "binary"
  | "too-large"
  | "bad-options"
  | "unknown-unit"
  | "column-count"
  | "mixed-delimiters";

/** Why a file gave no curve at all. */
export interface ImportProblem {
  code: ImportProblemCode;
  /** A plain sentence for the user. */
  message: string;
  /** 1-based line and column the problem was found at, for problems of one row. */
  row?: number;
  column?: number;
}

export interface ImportMessage {
  level: "info" | "warning" | "error";
  text: string;
}

export interface PreviewRow {
  row: number;
  /** Fields as written (quotes removed, blanks trimmed). */
  fields: string[];
  /** Parsed values in internal units, null when the row was rejected. */
  massEv: number | null;
  gInvGeV: number | null;
  /** Reason the row was rejected, or null. */
  problem: string | null;
}

export type UnitSource = "option" | "header" | "default";

export interface CurveParseResult {
  /**
   * Masses in eV and couplings in GeV⁻¹ of every readable row in file order. Rows with a value ≤ 0 stay in
   * (they are counted in `nonPositive`; a log axis skips them), so nothing the file holds is lost.
   */
  massEv: Float64Array;
  gInvGeV: Float64Array;
  /** Unreadable rows (at most `maxRejected` of them), one entry per row at its first bad column. */
  rejected: RejectedRow[];
  /** Exact number of unreadable rows. */
  rejectedCount: number;
  /** Exact number of kept rows whose mass or coupling is ≤ 0 (after unit conversion). */
  nonPositive: number;
  nonPositiveMass: number;
  nonPositiveCoupling: number;
  /** Line numbers of the first (up to 100) rows counted in `nonPositive`. */
  nonPositiveRows: number[];
  /** `,` `;` `\t`, or ` ` for runs of spaces/tabs. */
  delimiter: string;
  decimalComma: boolean;
  header: string[] | null;
  headerRow: number | null;
  massUnit: MassUnit;
  couplingUnit: CouplingUnit;
  massUnitSource: UnitSource;
  couplingUnitSource: UnitSource;
  /** E/N of the model line when couplingUnit is "model-line". */
  modelEOverN: number | null;
  log10Mass: boolean;
  log10Coupling: boolean;
  /** 1-based columns read. */
  massColumn: number;
  couplingColumn: number;
  /** Most columns seen in a row (over the first 1000 data rows and the header). */
  columnCount: number;
  /** Data rows read (kept + rejected; not comments, blank lines or the header). */
  dataRows: number;
  /** Lines in the input. */
  lineCount: number;
  preview: PreviewRow[];
  /** Comment lines without the `#` (the first 200). */
  comments: string[];
  /** From `# label:` and `# citation:` comment lines (as the CSV export writes them). */
  label: string | null;
  citation: string | null;
  fileName: string;
  /** True when `maxDataRows` stopped the parse early. */
  truncated: boolean;
  /** Set when the file gives no curve (empty, binary, one column…); the arrays are then empty. */
  fatal: ImportProblem | null;
  /** What was detected or assumed, and warnings, as sentences for the import step. */
  messages: ImportMessage[];
}

/** An incremental parser: feed text in pieces of any size, then call finish() once. */
export interface CurveParser {
  push(chunk: string): void;
  finish(): CurveParseResult;
  /** Lines seen so far. */
  readonly lines: number;
  /** Characters pushed so far. */
  readonly chars: number;
}

/** `file:row:column: reason`, the form the import step lists unreadable rows in. */
export function formatRejection(fileName: string, r: RejectedRow): string {
  return `${fileName}:${r.row}:${r.column}: ${r.reason}`;
}

/** `file: message` for a problem that stopped the import of a whole file. */
export function formatProblem(fileName: string, p: ImportProblem): string {
  return `${fileName}${p.row === undefined ? "" : `:${p.row}:${p.column ?? 1}`}: ${p.message}`;
}

/** Human name of a delimiter for the import step. */
export function delimiterName(delimiter: string): string {
  return delimiter === "," ? "comma" : delimiter === ";" ? "semicolon" : delimiter === "\t" ? "tab" : "spaces";
}

/** A curve label from a file name: the name without folders and without its extension. */
export function labelFromFileName(fileName: string): string {
  const base = fileName.split(/[\\/]/).pop() ?? fileName;
  const dot = base.lastIndexOf(".");
  return dot > 0 ? base.slice(0, dot) : base;
}
