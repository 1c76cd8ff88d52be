// The state of one file (or pasted text) in the import step, and the pure steps on it: the first look at
// its head, the parser options its settings stand for, the wording of problems and rejected rows.
import type { CurveRole, PhysicsSettings } from "../../data/types";
import { headerUnit, type CouplingUnit, type MassUnit } from "../../data/units";
import { physicsOptsOf } from "../../plot/physics-settings";
import type { ParseOpts, ParseResult } from "./pending-data";
import { columnCount, contentLines, decodeHead, guessDelimiter, HEAD_BYTES, looksBinary, splitRow } from "./sniff";

/** Everything the user can change for one file in the import step. */
export interface ImportSettings {
  /** "auto" or the delimiter itself ("," ";" "\t" " "). */
  delimiter: string;
  massUnit: MassUnit;
  couplingUnit: CouplingUnit;
  /** E/N of the model line when couplingUnit is "model-line" (as typed: "8/3", "0"). */
  modelEOverN: string;
  log10Mass: boolean;
  log10Coupling: boolean;
  /** 1-based columns to read. */
  massColumn: number;
  couplingColumn: number;
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

export type ItemStatus = "reading" | "parsing" | "ready" | "failed";

export interface ImportItem {
  key: string;
  fileName: string;
  source: Blob;
  sizeBytes: number;
  /** A problem with the whole file: nothing of it will be imported. */
  problem: string | null;
  /** First content lines of the file for the preview (raw text) with their row numbers. */
  head: { row: number; text: string }[];
  /** Header cells found in the head (before parsing), with the units they name. */
  headHeader: string[] | null;
  columns: number;
  /** What the header said, so the step can say "from the header". */
  unitsFromHeader: { mass: boolean; coupling: boolean };
  settings: ImportSettings;
  status: ItemStatus;
  /** Fraction 0..1 of the current parse. */
  progress: number;
  result: ParseResult | null;
}

/** The 200 MB cap, in words. */
export function formatBytes(n: number): string {
  if (n >= 1e9) return `${(n / 1e9).toFixed(1)} GB`;
  if (n >= 1e6) return `${(n / 1e6).toFixed(1)} MB`;
  if (n >= 1e3) return `${(n / 1e3).toFixed(1)} kB`;
  return `${n} bytes`;
}

/** The file name without its last extension ("limits.v2.csv" → "limits.v2"). */
export function labelFromFileName(name: string): string {
  const base = name.replace(/^.*[\\/]/, "");
  const dot = base.lastIndexOf(".");
  return (dot > 0 ? base.slice(0, dot) : base) || "Curve";
}

function isNumberCell(cell: string): boolean {
  const t = cell.trim();
  return t !== "" && Number.isFinite(Number(t.replace(/^(-?\d+),(\d+)$/, "$1.$2")));
}

/** What the first look at a file's head finds; `problem` set when the file cannot be a curve. */
export interface HeadInfo {
  problem: string | null;
  head: { row: number; text: string }[];
  header: string[] | null;
  columns: number;
  delimiterGuess: string;
  massUnit: MassUnit | null;
  couplingUnit: CouplingUnit | null;
  modelEOverN: number | null;
  log10Mass: boolean;
  log10Coupling: boolean;
}

/**
 * Reads the head of a source: empty, binary, over the cap, or a single column give a problem;
 * otherwise the first rows, a header with its units (DESIGN.md §3 spellings), and log10 hints.
 * @param maxBytes the size cap in bytes
 */
export async function inspectHead(source: Blob, fileName: string, maxBytes: number): Promise<HeadInfo> {
  const none: HeadInfo = {
    problem: null,
    head: [],
    header: null,
    columns: 0,
    delimiterGuess: ",",
    massUnit: null,
    couplingUnit: null,
    modelEOverN: null,
    log10Mass: false,
    log10Coupling: false,
  };
  if (source.size === 0) return { ...none, problem: `${fileName} is empty: there is nothing to import.` };
  if (source.size > maxBytes) {
    return { ...none, problem: `${fileName} is ${formatBytes(source.size)}; the import limit is ${formatBytes(maxBytes)} per file.` };
  }
  const bytes = new Uint8Array(await source.slice(0, HEAD_BYTES).arrayBuffer());
  if (looksBinary(bytes)) {
    return { ...none, problem: `${fileName} is not a text file (it looks like binary data); export the table as CSV or plain text first.` };
  }
  const text = decodeHead(bytes, source.size <= HEAD_BYTES);
  const lines = contentLines(text, 200);
  if (lines.length === 0) return { ...none, problem: `${fileName} has no data rows (only blank lines or # comments).` };
  const delimiterGuess = guessDelimiter(lines[0].text);
  const rows = lines.map((l) => splitRow(l.text, delimiterGuess));
  const first = rows[0];
  const header = first.some((c) => !isNumberCell(c)) ? first : null;
  const dataRows = header ? rows.slice(1) : rows;
  const columns = columnCount(dataRows.length > 0 ? dataRows : rows);
  if (columns < 2) {
    return { ...none, head: lines.slice(0, 8), problem: `${fileName} has a single column; a curve needs two (mass and coupling).` };
  }
  let massUnit: MassUnit | null = null;
  let couplingUnit: CouplingUnit | null = null;
  let modelEOverN: number | null = null;
  if (header) {
    const m = headerUnit(header[0] ?? "");
    const c = headerUnit(header[1] ?? "");
    if (m?.kind === "mass") massUnit = m.unit;
    if (c?.kind === "coupling") {
      couplingUnit = c.unit;
      modelEOverN = c.modelEOverN;
    }
  }
  const isLog = (cell: string | undefined) => !!cell && /\blog(?:10)?\b|^log/i.test(cell);
  return {
    ...none,
    head: lines.slice(0, 8),
    header,
    columns,
    delimiterGuess,
    massUnit,
    couplingUnit,
    modelEOverN,
    log10Mass: isLog(header?.[0]),
    log10Coupling: isLog(header?.[1]),
  };
}

/** The parser options an item's settings stand for. */
export function parseOptsOf(item: Pick<ImportItem, "fileName" | "settings">, physics: PhysicsSettings): ParseOpts {
  const s = item.settings;
  return {
    fileName: item.fileName,
    massUnit: s.massUnit,
    couplingUnit: s.couplingUnit,
    modelEOverN: s.couplingUnit === "model-line" ? s.modelEOverN : undefined,
    physics: physicsOptsOf(physics),
    delimiter: s.delimiter === "auto" ? undefined : s.delimiter,
    log10Mass: s.log10Mass,
    log10Coupling: s.log10Coupling,
    massColumn: s.massColumn,
    couplingColumn: s.couplingColumn,
  };
}

/** How many rejected rows the step lists before it only counts the rest. */
export const REJECTED_SHOWN = 20;

/** Rejected rows as `file:row:column: reason`, the first {@link REJECTED_SHOWN}, and how many more there are. */
export function rejectionLines(fileName: string, rejected: ParseResult["rejected"]): { lines: string[]; more: number } {
  const lines = rejected.slice(0, REJECTED_SHOWN).map((r) => `${fileName}:${r.row}:${r.column}: ${r.reason}`);
  return { lines, more: Math.max(0, rejected.length - REJECTED_SHOWN) };
}

/** True when the item will become a curve on confirm. */
export function importable(item: ImportItem): boolean {
  return item.problem === null && item.status === "ready" && item.result !== null && item.result.massEv.length > 0;
}
