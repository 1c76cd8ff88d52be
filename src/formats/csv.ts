// Curve CSV import (DESIGN.md §3): one pass over the text straight into Float64Arrays, chunk by chunk so a
// worker can report progress and stay responsive; delimiter, header, units and decimal comma are detected.
//
// Hand-written instead of a CSV library: the job is two numeric columns into typed arrays, and general
// parsers (d3-dsv's csvParseRows and the like) first build a string array per row and then leave the
// number conversion, the `file:row:column` bookkeeping, comment lines, runs-of-spaces delimiters and the
// decimal comma to the caller. Scanning the characters once and reading the digits in place (Clinger's
// exact fast path, W. D. Clinger, "How to read floating point numbers accurately", PLDI 1990; anything
// longer goes to the engine's own correctly rounded Number()) allocates nothing per row. bench/import.mjs
// measures it against d3-dsv in the same run: 4–5× the throughput of csvParseRows + Number() on the
// invented bench files (Node 20, identical arrays), and faster than csvParseRows alone building strings.
//
// Values ≤ 0 stay in the arrays (counted exactly in `nonPositive`; a log axis skips them), so an export
// gives back every row that was read. Quoted fields may not span lines (numeric tables never need it).
import type { PhysicsOpts } from "../physics/constants";
import { PLANCK_EV_S } from "../physics/constants";
import {
  couplingContext,
  headerUnit,
  massToEv,
  massUnitInfo,
  parseCouplingUnit,
  parseMassUnit,
  parseRational,
  type CouplingContext,
  type CouplingUnit,
  type HeaderUnit,
  type MassUnit,
} from "./units";
import { gFromNormalized } from "../physics/coupling";

/** Largest file the import accepts: 200 MB (200 × 2²⁰ bytes), about 8 million rows of two numbers. */
export const MAX_IMPORT_BYTES = 200 * 1024 * 1024;

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
  /** Accept `,` as the decimal point. @default true for `;`, detected for tab and spaces, false for `,` */
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

export type ImportProblemCode = "empty" | "no-data" | "single-column" | "binary" | "too-large" | "bad-options";

/** Why a file gave no curve at all. */
export interface ImportProblem {
  code: ImportProblemCode;
  /** A plain sentence for the user. */
  message: string;
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
  return `${fileName}: ${p.message}`;
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

// ---------------------------------------------------------------------------------------------------------
// Number reading

const POW10 = [
  1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20,
  1e21, 1e22,
];
const ERR_NONE = 0;
const ERR_EMPTY = 1;
const ERR_NAN = 2;
const ERR_RANGE = 3;
let numErr = ERR_NONE;
/** Where the last readNumber stopped: the first character that cannot continue the number. */
let numEnd = 0;

/**
 * Reads a number starting at t[s] and stopping at the first character that cannot continue it (numEnd),
 * times 10^shift, correctly rounded; NaN with `numErr` set when no number starts there. Accepts a leading
 * + or − (also U+2212) and `,` as the decimal point when `comma`. The shift is applied to the decimal
 * exponent, so `1.5` μeV becomes exactly the double nearest 1.5e-6. Callers check what follows numEnd.
 */
function readNumber(t: string, s: number, e: number, shift: number, comma: boolean): number {
  numErr = ERR_NONE;
  numEnd = s;
  if (s >= e) {
    numErr = ERR_EMPTY;
    return NaN;
  }
  let i = s;
  let c = t.charCodeAt(i);
  let neg = false;
  if (c === 45 || c === 0x2212) {
    neg = true;
    i++;
  } else if (c === 43) i++;
  let mant = 0;
  let sig = 0;
  let exp10 = 0;
  let digits = 0;
  let point = false;
  let long = false;
  let hasExp = false;
  for (; i < e; i++) {
    c = t.charCodeAt(i);
    if (c >= 48 && c <= 57) {
      digits++;
      if (sig === 0 && c === 48) {
        if (point) exp10--;
      } else if (sig < 15) {
        mant = mant * 10 + (c - 48);
        sig++;
        if (point) exp10--;
      } else {
        long = true;
      }
    } else if ((c === 46 || (c === 44 && comma)) && !point) {
      point = true;
    } else {
      hasExp = c === 101 || c === 69;
      break;
    }
  }
  const mantEnd = i;
  numEnd = i;
  if (digits === 0) {
    numErr = ERR_NAN;
    return NaN;
  }
  let exp = 0;
  if (hasExp) {
    i++;
    let eneg = false;
    c = i < e ? t.charCodeAt(i) : 0;
    if (c === 45 || c === 0x2212) {
      eneg = true;
      i++;
    } else if (c === 43) i++;
    const first = i;
    for (; i < e; i++) {
      c = t.charCodeAt(i);
      if (c < 48 || c > 57) break;
      if (exp < 100000) exp = exp * 10 + (c - 48);
    }
    numEnd = i;
    if (i === first) {
      numErr = ERR_NAN;
      return NaN;
    }
    if (eneg) exp = -exp;
  }
  if (!long) {
    if (mant === 0) return neg ? -0 : 0;
    const total = exp10 + exp + shift;
    // Clinger's fast path: an integer below 10¹⁵ and 10^|total| ≤ 10²² are exact doubles, so one IEEE
    // multiplication or division gives the correctly rounded result.
    if (total >= 0 && total <= 22) return neg ? -(mant * POW10[total]) : mant * POW10[total];
    if (total < 0 && total >= -22) return neg ? -(mant / POW10[-total]) : mant / POW10[-total];
  }
  let str = t.slice(s, mantEnd);
  if (comma) str = str.replace(",", ".");
  if (str.charCodeAt(0) === 0x2212) str = "-" + str.slice(1);
  if (exp !== 0 || shift !== 0) str += "e" + (exp + shift);
  const v = Number(str);
  if (!Number.isFinite(v)) {
    numErr = ERR_RANGE;
    return NaN;
  }
  return v;
}

/**
 * True when the whole string is written as a plain or scientific number (with `,` as decimal point when
 * `comma`), even one beyond the range of a double (it may fit once the unit's prefix is applied).
 */
export function isNumberText(text: string, comma = false): boolean {
  const s = text.trim();
  readNumber(s, 0, s.length, 0, comma);
  return (numErr === ERR_NONE || numErr === ERR_RANGE) && numEnd === s.length;
}

/** The number a string holds (same grammar as the importer), or NaN. */
export function readNumberText(text: string, comma = false): number {
  const s = text.trim();
  const v = readNumber(s, 0, s.length, 0, comma);
  return numErr === ERR_NONE && numEnd === s.length ? v : NaN;
}

/** The rejection reason for the field t[s, e). */
function fieldReason(t: string, s: number, e: number, outOfRange: boolean): string {
  if (s >= e) return "empty field";
  const raw = t.slice(s, e);
  const shown = raw.length > 40 ? raw.slice(0, 40) + "…" : raw;
  return outOfRange ? `out of range: "${shown}"` : `not a number: "${shown}"`;
}

// ---------------------------------------------------------------------------------------------------------
// Field splitting for the slow paths (detection, header, preview)

const WS = -1;

/** The fields of one line (quotes removed, blanks trimmed); `delim` is a char code or WS for runs of blanks. */
function splitFields(line: string, delim: number): string[] {
  const out: string[] = [];
  const e = line.length;
  let p = 0;
  const blank = (c: number) => c === 32 || (c === 9 && delim !== 9);
  if (delim === WS) {
    while (p < e) {
      while (p < e && isBlank(line.charCodeAt(p))) p++;
      if (p >= e) break;
      if (line.charCodeAt(p) === 34) {
        const q = closingQuote(line, p + 1, e);
        out.push(unquote(line.slice(p + 1, q)));
        p = q + 1;
        while (p < e && !isBlank(line.charCodeAt(p))) p++;
      } else {
        const fs = p;
        while (p < e && !isBlank(line.charCodeAt(p))) p++;
        out.push(line.slice(fs, p));
      }
    }
    return out;
  }
  for (;;) {
    while (p < e && blank(line.charCodeAt(p))) p++;
    if (p < e && line.charCodeAt(p) === 34) {
      const q = closingQuote(line, p + 1, e);
      out.push(unquote(line.slice(p + 1, q)));
      p = q + 1;
      while (p < e && line.charCodeAt(p) !== delim) p++;
    } else {
      const fs = p;
      while (p < e && line.charCodeAt(p) !== delim) p++;
      let fe = p;
      while (fe > fs && blank(line.charCodeAt(fe - 1))) fe--;
      out.push(line.slice(fs, fe));
    }
    if (p >= e) break;
    p++;
  }
  return out;
}

function isBlank(c: number): boolean {
  return c === 32 || c === 9;
}

/** Index of the quote closing a field that opened before `p` ("" is an escaped quote), or `e` if none. */
function closingQuote(t: string, p: number, e: number): number {
  for (;;) {
    const q = t.indexOf('"', p);
    if (q < 0 || q >= e) return e;
    if (q + 1 < e && t.charCodeAt(q + 1) === 34) {
      p = q + 2;
      continue;
    }
    return q;
  }
}

function unquote(s: string): string {
  return s.includes('""') ? s.replace(/""/g, '"') : s;
}

// Whitespace-separated headers often put the unit after a space ("m_a [ueV]  g [1/GeV]"): join such tokens.
function splitHeader(line: string, delim: number, dataColumns: number): string[] {
  const plain = splitFields(line, delim);
  if (delim !== WS || plain.length === dataColumns) return plain;
  const merged: string[] = [];
  for (const f of plain) {
    if (merged.length > 0 && /^[[(]/.test(f)) merged[merged.length - 1] += " " + f;
    else merged.push(f);
  }
  if (merged.length === dataColumns) return merged;
  const wide = line.trim().split(/\t+| {2,}/);
  return wide.length === dataColumns ? wide.map((f) => f.trim()) : merged;
}

// ---------------------------------------------------------------------------------------------------------
// Pre-checks on the raw file

/** What the importer learns from a file's name, size and first bytes before reading it. */
export type FileCheck =
  { ok: true; encoding: "utf-8" | "utf-16le" | "utf-16be" } | { ok: false; problem: ImportProblem };

const MAGIC: [number[], string][] = [
  [
    [0x50, 0x4b, 0x03, 0x04],
    "a ZIP archive (a spreadsheet workbook such as .xlsx or .ods?); save the sheet as CSV first",
  ],
  [[0x25, 0x50, 0x44, 0x46], "a PDF document, not a text table"],
  [[0x1f, 0x8b], "gzip-compressed; unpack it first"],
  [[0x89, 0x50, 0x4e, 0x47], "a PNG image, not a text table"],
  [[0xff, 0xd8, 0xff], "a JPEG image, not a text table"],
  [[0xd0, 0xcf, 0x11, 0xe0], "an old binary spreadsheet (.xls?); save the sheet as CSV first"],
];

/**
 * Checks before reading a file: size cap ({@link MAX_IMPORT_BYTES}), empty file, known binary formats, NUL
 * bytes or mostly non-text in the first bytes (pass at least the first 4 KiB). Detects a UTF-16 BOM.
 */
export function checkImportFile(file: { name?: string; size: number; firstBytes: Uint8Array }): FileCheck {
  if (file.size === 0) return { ok: false, problem: { code: "empty", message: "the file is empty" } };
  if (file.size > MAX_IMPORT_BYTES) {
    const mb = (file.size / (1024 * 1024)).toFixed(0);
    return {
      ok: false,
      problem: {
        code: "too-large",
        message: `the file is ${mb} MB; the import takes files up to ${MAX_IMPORT_BYTES / (1024 * 1024)} MB`,
      },
    };
  }
  const b = file.firstBytes;
  if (b.length >= 2 && b[0] === 0xff && b[1] === 0xfe) return { ok: true, encoding: "utf-16le" };
  if (b.length >= 2 && b[0] === 0xfe && b[1] === 0xff) return { ok: true, encoding: "utf-16be" };
  for (const [sig, what] of MAGIC) {
    if (b.length >= sig.length && sig.every((x, i) => b[i] === x)) {
      return { ok: false, problem: { code: "binary", message: `the file looks like ${what}` } };
    }
  }
  if (b.includes(0)) return { ok: false, problem: binaryProblem() };
  // Cut a character split at the end of the sample so it does not count as an error.
  let end = b.length;
  for (let k = 1; k <= 3 && end - k >= 0; k++) {
    const x = b[end - k];
    if ((x & 0xc0) === 0xc0) {
      end -= k;
      break;
    }
    if ((x & 0x80) === 0) break;
  }
  const text = new TextDecoder("utf-8").decode(b.subarray(0, end));
  if (looksBinary(text)) return { ok: false, problem: binaryProblem() };
  return { ok: true, encoding: "utf-8" };
}

function binaryProblem(): ImportProblem {
  return { code: "binary", message: "the file holds binary data, not a text table (CSV, UTF-8)" };
}

/** NUL characters, or more than 10 % control characters or undecodable bytes (U+FFFD). */
function looksBinary(sample: string): boolean {
  let bad = 0;
  const n = Math.min(sample.length, 8192);
  for (let i = 0; i < n; i++) {
    const c = sample.charCodeAt(i);
    if (c === 0) return true;
    if ((c < 32 && c !== 9 && c !== 10 && c !== 12 && c !== 13) || c === 0xfffd) bad++;
  }
  return n > 0 && bad / n > 0.1;
}

// ---------------------------------------------------------------------------------------------------------
// The parser

const SNIFF_LINES = 64;
const SNIFF_CHARS = 256 * 1024;
const COLUMN_COUNT_ROWS = 1000;
const MAX_NONPOSITIVE_ROWS = 100;
const MAX_COMMENTS = 200;

const DELIM_NAMES: Record<string, number> = {
  ",": 44,
  comma: 44,
  ";": 59,
  semicolon: 59,
  "\t": 9,
  tab: 9,
  "\\t": 9,
  " ": WS,
  space: WS,
  spaces: WS,
  whitespace: WS,
};

function delimText(d: number): string {
  return d === WS ? " " : String.fromCharCode(d);
}

/** Numeric kinds of the conversion steps, fixed before the hot loop. */
const G_INV_GEV = 0;
const G_NORMALIZED = 1;
const G_GGAMMA = 2;
const G_MODEL = 3;

class Parser implements CurveParser {
  lines = 0;
  chars = 0;
  private readonly o: CurveParseOptions;
  private readonly fileName: string;
  private started = false;
  private carry = "";
  private nl = 0;
  private phase: "sniff" | "data" | "stopped" = "sniff";
  private sniff: { row: number; text: string }[] = [];
  private sniffChars = 0;
  private head = "";
  private fatal: ImportProblem | null = null;
  private readonly messages: ImportMessage[] = [];

  // configuration fixed by decide()
  private delim = 44;
  private comma = false;
  private headerRow = -1;
  private header: string[] | null = null;
  private massCol = 0;
  private gCol = 1;
  private need = 2;
  private massUnit: MassUnit = "eV";
  private couplingUnit: CouplingUnit = "GeV^-1";
  private massUnitSource: UnitSource = "default";
  private couplingUnitSource: UnitSource = "default";
  private massShift = 0;
  private massFreq = false;
  private massLog = false;
  private gLog = false;
  private gMode = G_INV_GEV;
  private ctx: CouplingContext = couplingContext();
  private kMuEv = 0;
  private modelAbs = 0;
  private readonly previewMax: number;
  private readonly maxRows: number;
  private readonly maxRejected: number;

  // output
  private m: Float64Array;
  private g: Float64Array;
  private n = 0;
  private readonly rejected: RejectedRow[] = [];
  private rejectedCount = 0;
  private nonPositive = 0;
  private npMass = 0;
  private npCoupling = 0;
  private readonly npRows: number[] = [];
  private dataRows = 0;
  private columnCount = 0;
  private dataColumnMax = 0;
  private readonly preview: PreviewRow[] = [];
  private readonly comments: string[] = [];
  private label: string | null = null;
  private citation: string[] = [];
  private truncated = false;

  constructor(opts: CurveParseOptions) {
    this.o = opts;
    this.fileName = opts.fileName ?? "input";
    this.previewMax = opts.previewRows ?? 20;
    this.maxRows = opts.maxDataRows ?? Infinity;
    this.maxRejected = opts.maxRejected ?? 10000;
    const cap = Math.max(16, Math.min(1 << 24, Math.ceil((opts.sizeHint ?? 0) / 24)));
    this.m = new Float64Array(cap);
    this.g = new Float64Array(cap);
  }

  push(chunk: string): void {
    if (this.phase === "stopped" || chunk.length === 0) return;
    this.chars += chunk.length;
    if (!this.started) {
      this.started = true;
      if (chunk.charCodeAt(0) === 0xfeff) chunk = chunk.slice(1);
    }
    if (this.head.length < 8192) this.head += chunk.slice(0, 8192 - this.head.length);
    const text = this.carry.length > 0 ? this.carry + chunk : chunk;
    if (this.nl === 0) {
      const cr = text.indexOf("\r");
      if (text.includes("\n")) this.nl = 10;
      // A lone CR at the very end may be the first half of a CRLF split between chunks: wait for more.
      else if (cr >= 0 && cr < text.length - 1) this.nl = 13;
      else {
        this.carry = text;
        return;
      }
    }
    const nlChar = this.nl === 10 ? "\n" : "\r";
    let pos = 0;
    for (;;) {
      const end = text.indexOf(nlChar, pos);
      if (end < 0) break;
      this.lines++;
      if (this.phase === "data") this.dataLine(text, pos, end, this.lines);
      else this.sniffLine(text, pos, end, this.lines);
      pos = end + 1;
      if (this.isStopped()) {
        this.carry = "";
        return;
      }
    }
    this.carry = pos === 0 ? text : text.slice(pos);
  }

  finish(): CurveParseResult {
    if (this.phase !== "stopped" && this.carry.length > 0) {
      const text = this.carry;
      this.carry = "";
      this.lines++;
      if (this.phase === "data") this.dataLine(text, 0, text.length, this.lines);
      else this.sniffLine(text, 0, text.length, this.lines);
    }
    if (this.phase === "sniff") this.decide();
    return this.result();
  }

  // A method, so TypeScript does not narrow `phase` across calls that change it.
  private isStopped(): boolean {
    return this.phase === "stopped";
  }

  private stop(problem: ImportProblem): void {
    this.fatal = problem;
    this.phase = "stopped";
  }

  private sniffLine(t: string, s: number, e: number, row: number): void {
    if (e > s && t.charCodeAt(e - 1) === 13) e--;
    let p = s;
    while (p < e && isBlank(t.charCodeAt(p))) p++;
    if (p === e) return;
    if (t.charCodeAt(p) === 35) {
      this.comment(t, p + 1, e);
      return;
    }
    const line = t.slice(s, e);
    this.sniff.push({ row, text: line });
    this.sniffChars += line.length;
    if (this.sniff.length >= SNIFF_LINES || this.sniffChars >= SNIFF_CHARS) this.decide();
  }

  private comment(t: string, s: number, e: number): void {
    if (this.comments.length >= MAX_COMMENTS) return;
    const raw = t.slice(s, e);
    this.comments.push(raw.trim());
    // Keep the citation's own indentation (BibTeX entries), so export → import gives it back unchanged.
    const m = /^\s*(label|citation)\s*:\s?(.*)$/i.exec(raw);
    if (!m) return;
    if (m[1].toLowerCase() === "label") this.label ??= m[2].trim();
    else this.citation.push(m[2]);
  }

  /** Fixes delimiter, header, columns and units from the first lines, then reads those lines as data. */
  private decide(): void {
    const lines = this.sniff;
    this.sniff = [];
    this.phase = "data";
    if (looksBinary(this.head)) {
      this.stop(binaryProblem());
      return;
    }
    const o = this.o;
    const userMass = o.massColumn !== undefined ? Math.floor(o.massColumn) - 1 : null;
    const userG = o.couplingColumn !== undefined ? Math.floor(o.couplingColumn) - 1 : null;
    if (
      (userMass !== null && !(userMass >= 0)) ||
      (userG !== null && !(userG >= 0)) ||
      (userMass !== null && userMass === userG)
    ) {
      this.stop({
        code: "bad-options",
        message: "the mass and coupling columns must be two different columns, counted from 1",
      });
      return;
    }
    const probeM = userMass ?? (userG === 0 ? 1 : 0);
    const probeG = userG ?? (probeM === 0 ? 1 : 0);

    // Header candidate: a first line with letters whose data columns are not numbers.
    const first = lines[0]?.text ?? "";
    const letters = /\p{L}/u.test(first.replace(/[eE][+-]?\d/g, ""));
    const sample = letters && lines.length > 1 ? lines.slice(1) : lines;

    // Delimiter and decimal comma.
    let delim: number;
    let comma: boolean;
    if (o.delimiter !== undefined && o.delimiter !== "" && o.delimiter !== "auto") {
      const d = DELIM_NAMES[o.delimiter] ?? DELIM_NAMES[o.delimiter.toLowerCase()];
      if (d === undefined) {
        this.stop({
          code: "bad-options",
          message: `unknown delimiter "${o.delimiter}" (use comma, semicolon, tab or spaces)`,
        });
        return;
      }
      delim = d;
      comma =
        o.decimalComma ??
        (d === 59
          ? true
          : d === 44
            ? false
            : score(sample, d, true, probeM, probeG) > score(sample, d, false, probeM, probeG));
    } else {
      const candidates: [number, boolean][] =
        o.decimalComma === undefined
          ? [
              [44, false],
              [59, true],
              [9, false],
              [9, true],
              [WS, false],
              [WS, true],
            ]
          : [
              [44, o.decimalComma],
              [59, o.decimalComma],
              [9, o.decimalComma],
              [WS, o.decimalComma],
            ];
      let best = candidates[0];
      let bestScore = -1;
      for (const cand of candidates) {
        const sc = score(sample, cand[0], cand[1], probeM, probeG);
        if (sc > bestScore) {
          best = cand;
          bestScore = sc;
        }
      }
      if (bestScore === 0) {
        // Nothing numeric: take the delimiter that splits the lines most consistently into several fields.
        let bestCount = 0;
        best = [WS, false];
        for (const d of [44, 59, 9, WS]) {
          const k = consistentFields(sample, d);
          if (k > bestCount) {
            bestCount = k;
            best = [d, d === 59];
          }
        }
      }
      [delim, comma] = best;
      if (o.decimalComma === undefined && delim === 59) comma = true;
    }
    this.delim = delim;
    this.comma = comma;

    // Header.
    let isHeader = o.header;
    if (isHeader === undefined && lines.length > 0) {
      const f = splitFields(first, delim);
      isHeader =
        letters &&
        !(f.length > Math.max(probeM, probeG) && isNumberText(f[probeM], comma) && isNumberText(f[probeG], comma));
    }
    const dataCols = sample.length > 0 && sample !== lines ? splitFields(sample[0].text, delim).length : 0;
    let units: HeaderUnit[] = [];
    if (isHeader && lines.length > 0) {
      this.headerRow = lines[0].row;
      this.header = splitHeader(first, delim, dataCols);
      units = this.header.map(headerUnit);
      this.columnCount = this.header.length;
    }

    // Columns: the user's, else the ones the header units point at, else 1 and 2.
    let massCol = userMass;
    let gCol = userG;
    const headerMass = units.findIndex((u) => u?.kind === "mass");
    const headerG = units.findIndex((u) => u?.kind === "coupling");
    if (massCol === null && headerMass >= 0 && headerMass !== gCol) massCol = headerMass;
    if (gCol === null && headerG >= 0 && headerG !== massCol) gCol = headerG;
    if (massCol === null) massCol = gCol === 0 ? 1 : 0;
    if (gCol === null) gCol = firstOther(massCol, units);
    this.massCol = massCol;
    this.gCol = gCol;
    this.need = Math.max(massCol, gCol) + 1;
    if (userMass === null && userG === null && (massCol !== 0 || gCol !== 1)) {
      this.messages.push({
        level: "info",
        text: `the header names the units of columns ${massCol + 1} (mass) and ${gCol + 1} (coupling); those are read`,
      });
    }

    // Units.
    const hm = units[massCol] ?? null;
    const hg = units[gCol] ?? null;
    if (o.massUnit !== undefined && o.massUnit !== "" && o.massUnit !== "auto") {
      const u = parseMassUnit(o.massUnit);
      if (!u) {
        this.stop({ code: "bad-options", message: `unknown mass unit "${o.massUnit}"` });
        return;
      }
      this.massUnit = u;
      this.massUnitSource = "option";
      if (hm?.kind === "mass" && hm.unit !== u) {
        this.messages.push({
          level: "warning",
          text: `the header says the mass is in ${massUnitInfo(hm.unit).label}; reading it in ${massUnitInfo(u).label} as chosen`,
        });
      }
    } else if (hm?.kind === "mass") {
      this.massUnit = hm.unit;
      this.massUnitSource = "header";
    }
    if (hm?.kind === "coupling") {
      this.messages.push({
        level: "warning",
        text: `the header of column ${massCol + 1}, read as the mass, names a coupling unit`,
      });
    }
    let eOverN: number | null = null;
    if (o.couplingUnit !== undefined && o.couplingUnit !== "" && o.couplingUnit !== "auto") {
      const u = parseCouplingUnit(o.couplingUnit);
      if (!u) {
        this.stop({ code: "bad-options", message: `unknown coupling unit "${o.couplingUnit}"` });
        return;
      }
      this.couplingUnit = u.unit;
      this.couplingUnitSource = "option";
      eOverN = u.modelEOverN;
      if (hg?.kind === "coupling" && hg.unit !== u.unit) {
        this.messages.push({
          level: "warning",
          text: `the header says the coupling is "${hg.unit}"; reading it as "${u.unit}" as chosen`,
        });
      }
    } else if (hg?.kind === "coupling") {
      this.couplingUnit = hg.unit;
      this.couplingUnitSource = "header";
      eOverN = hg.modelEOverN;
    }
    if (hg?.kind === "mass") {
      this.messages.push({
        level: "warning",
        text: `the header of column ${gCol + 1}, read as the coupling, names a mass unit`,
      });
    }
    if (o.modelEOverN !== undefined) {
      eOverN = parseRational(o.modelEOverN);
      if (eOverN === null) {
        this.stop({
          code: "bad-options",
          message: `the model line's E/N "${o.modelEOverN}" is not a number or fraction`,
        });
        return;
      }
    }
    if (this.couplingUnit === "model-line" && eOverN === null) {
      this.stop({
        code: "bad-options",
        message: "the coupling is a multiple of a model line: choose the model line's E/N",
      });
      return;
    }
    this.ctx = couplingContext(o.physics, eOverN);
    this.kMuEv = this.ctx.constants.kMuEv;
    this.modelAbs = eOverN === null ? 0 : Math.abs(eOverN - this.ctx.constants.cGamma);
    const mu = massUnitInfo(this.massUnit);
    this.massLog = o.log10Mass === true;
    this.gLog = o.log10Coupling === true;
    this.massShift = this.massLog ? 0 : mu.pow10;
    this.massFreq = mu.kind === "frequency";
    this.gMode = { "GeV^-1": G_INV_GEV, normalized: G_NORMALIZED, "g-gamma": G_GGAMMA, "model-line": G_MODEL }[
      this.couplingUnit
    ];

    for (const l of lines) {
      if (l.row === this.headerRow) continue;
      this.dataLine(l.text, 0, l.text.length, l.row);
      if (this.isStopped()) return;
    }
  }

  /** One line in data mode: the hot path, no allocation unless the row is rejected or previewed. */
  private dataLine(t: string, s: number, e: number, row: number): void {
    if (e > s && t.charCodeAt(e - 1) === 13) e--;
    const delim = this.delim;
    let p = s;
    let c = 0;
    while (p < e) {
      c = t.charCodeAt(p);
      if (c === 32 || (c === 9 && delim !== 9)) p++;
      else break;
    }
    if (p === e) return;
    if (c === 35) {
      this.comment(t, p + 1, e);
      return;
    }
    const comma = this.comma;
    // With a comma delimiter a decimal comma can only live inside quotes.
    const bareComma = comma && delim !== 44;
    const massCol = this.massCol;
    const gCol = this.gCol;
    const need = this.need;
    let massV = NaN;
    let gV = NaN;
    let errCol = -1;
    let reason = "";
    let col = 0;
    for (;;) {
      const want = col === massCol || col === gCol;
      const shift = col === massCol ? this.massShift : 0;
      let bad = "";
      let v = NaN;
      if (p < e && t.charCodeAt(p) === 34) {
        let fs = p + 1;
        let fe = closingQuote(t, fs, e);
        if (fe >= e) bad = "unterminated quote";
        p = fe + 1;
        while (p < e && (c = t.charCodeAt(p)) !== delim && !(delim === WS && isBlank(c))) {
          if (!isBlank(c) && bad === "")
            bad = `text after the closing quote: "${t.slice(fe + 1, Math.min(e, p + 10))}"`;
          p++;
        }
        if (p > e) p = e;
        if (want && bad === "") {
          // Blanks inside the quotes cannot change a number's meaning: drop them.
          while (fs < fe && isBlank(t.charCodeAt(fs))) fs++;
          while (fe > fs && isBlank(t.charCodeAt(fe - 1))) fe--;
          v = readNumber(t, fs, fe, shift, comma);
          if (numErr !== ERR_NONE || numEnd !== fe) bad = fieldReason(t, fs, fe, numErr === ERR_RANGE && numEnd === fe);
        }
      } else if (want) {
        // Read the number in place, then check that the field ends where the number does.
        const fs = p;
        v = readNumber(t, fs, e, shift, bareComma);
        let q = numEnd;
        if (delim !== WS) while (q < e && ((c = t.charCodeAt(q)) === 32 || (c === 9 && delim !== 9))) q++;
        const boundary = q >= e || (delim === WS ? isBlank(t.charCodeAt(q)) : t.charCodeAt(q) === delim);
        if (numErr === ERR_NONE && boundary) p = q;
        else {
          const outOfRange = numErr === ERR_RANGE && boundary;
          p = fs;
          if (delim === WS) while (p < e && !isBlank(t.charCodeAt(p))) p++;
          else while (p < e && t.charCodeAt(p) !== delim) p++;
          let fe = p;
          while (fe > fs && ((c = t.charCodeAt(fe - 1)) === 32 || (c === 9 && delim !== 9))) fe--;
          bad = fieldReason(t, fs, fe, outOfRange);
          v = NaN;
        }
      } else if (delim === WS) {
        while (p < e && !isBlank(t.charCodeAt(p))) p++;
      } else {
        while (p < e && t.charCodeAt(p) !== delim) p++;
      }
      if (bad !== "" && errCol < 0) {
        errCol = col;
        reason = bad;
      }
      if (col === massCol) massV = v;
      else if (col === gCol) gV = v;
      col++;
      if (col >= need || p >= e) break;
      if (delim === WS) {
        while (p < e && isBlank(t.charCodeAt(p))) p++;
        if (p >= e) break;
      } else {
        p++;
        while (p < e && ((c = t.charCodeAt(p)) === 32 || (c === 9 && delim !== 9))) p++;
      }
    }
    if (this.dataRows < COLUMN_COUNT_ROWS) {
      const k = countColumns(t, s, e, delim);
      if (k > this.columnCount) this.columnCount = k;
      if (k > this.dataColumnMax) this.dataColumnMax = k;
    }
    if (errCol < 0 && col < need) {
      errCol = col;
      reason = `missing column ${col + 1}`;
    }
    if (errCol >= 0) {
      if (onlyDelimiters(t, s, e, delim)) return;
      this.dataRows++;
      this.reject(row, errCol + 1, reason, t, s, e);
      return;
    }
    this.dataRows++;

    let mEv = massV;
    if (this.massLog) mEv = massToEv(10 ** massV, this.massUnit);
    else if (this.massFreq) mEv = massV * PLANCK_EV_S;
    let gv = this.gLog ? 10 ** gV : gV;
    const mode = this.gMode;
    if (mode === G_NORMALIZED) gv = gFromNormalized(mEv, gv, this.kMuEv);
    else if (mode === G_GGAMMA) gv = gFromNormalized(mEv, 2 * gv, this.kMuEv);
    else if (mode === G_MODEL) gv = gv * gFromNormalized(mEv, this.modelAbs, this.kMuEv);
    if (!Number.isFinite(mEv) || !Number.isFinite(gv)) {
      const mBad = !Number.isFinite(mEv);
      this.reject(
        row,
        (mBad ? massCol : gCol) + 1,
        `out of range after conversion to ${mBad ? "eV" : "GeV⁻¹"}`,
        t,
        s,
        e,
      );
      return;
    }
    if (this.n === this.m.length) this.grow();
    this.m[this.n] = mEv;
    this.g[this.n] = gv;
    this.n++;
    if (!(mEv > 0) || !(gv > 0)) {
      this.nonPositive++;
      if (!(mEv > 0)) this.npMass++;
      if (!(gv > 0)) this.npCoupling++;
      if (this.npRows.length < MAX_NONPOSITIVE_ROWS) this.npRows.push(row);
    }
    if (this.preview.length < this.previewMax) {
      this.preview.push({ row, fields: splitFields(t.slice(s, e), delim), massEv: mEv, gInvGeV: gv, problem: null });
    }
    if (this.dataRows >= this.maxRows) {
      this.truncated = true;
      this.phase = "stopped";
    }
  }

  private reject(row: number, column: number, reason: string, t: string, s: number, e: number): void {
    this.rejectedCount++;
    if (this.rejected.length < this.maxRejected) this.rejected.push({ row, column, reason });
    if (this.preview.length < this.previewMax) {
      this.preview.push({
        row,
        fields: splitFields(t.slice(s, e), this.delim),
        massEv: null,
        gInvGeV: null,
        problem: reason,
      });
    }
    if (this.dataRows >= this.maxRows) {
      this.truncated = true;
      this.phase = "stopped";
    }
  }

  private grow(): void {
    const m = new Float64Array(this.m.length * 2);
    m.set(this.m);
    this.m = m;
    const g = new Float64Array(this.g.length * 2);
    g.set(this.g);
    this.g = g;
  }

  private result(): CurveParseResult {
    const f = this.fileName;
    let fatal = this.fatal;
    if (!fatal && this.dataRows === 0) {
      const onlyBlank = this.head.trim() === "" && this.lines <= 1 && this.comments.length === 0;
      fatal = onlyBlank
        ? { code: "empty", message: "the file is empty" }
        : this.header
          ? { code: "no-data", message: "the file has a header but no data rows" }
          : { code: "no-data", message: "the file has no data rows (only comments or blank lines)" };
    }
    if (!fatal && this.n === 0 && this.dataColumnMax <= 1) {
      fatal = {
        code: "single-column",
        message: `only one column found (delimiter: ${delimiterName(delimText(this.delim))}); a curve needs two, mass and coupling`,
      };
    }
    const messages: ImportMessage[] = [];
    if (fatal) messages.push({ level: "error", text: formatProblem(f, fatal) });
    else {
      messages.push({
        level: "info",
        text: `delimiter: ${delimiterName(delimText(this.delim))}${this.comma ? ", decimal comma" : ""}; ${this.header ? `header on line ${this.headerRow}` : "no header"}`,
      });
      const mLabel = massUnitInfo(this.massUnit).label + (this.massLog ? " (log10)" : "");
      const gLabel = this.couplingUnit + (this.gLog ? " (log10)" : "");
      const src = (s: UnitSource) =>
        s === "header" ? "from the header" : s === "option" ? "as chosen" : "assumed: no unit in the header";
      messages.push({ level: "info", text: `mass in ${mLabel} (${src(this.massUnitSource)})` });
      messages.push({ level: "info", text: `coupling in ${gLabel} (${src(this.couplingUnitSource)})` });
      messages.push(...this.messages);
      if (this.rejectedCount > 0) {
        const firstRow = this.rejected[0];
        messages.push({
          level: "warning",
          text: `${this.rejectedCount} row${this.rejectedCount === 1 ? "" : "s"} cannot be read; the first: ${formatRejection(f, firstRow)}`,
        });
      }
      if (this.nonPositive > 0) {
        messages.push({
          level: "warning",
          text: `${this.nonPositive} row${this.nonPositive === 1 ? " has" : "s have"} a value ≤ 0 (first on line ${this.npRows[0]}); kept, but a log axis cannot show ${this.nonPositive === 1 ? "it" : "them"}`,
        });
      }
      if (this.truncated) messages.push({ level: "info", text: `read only the first ${this.dataRows} data rows` });
    }
    const keep = fatal ? 0 : this.n;
    return {
      massEv: this.m.slice(0, keep),
      gInvGeV: this.g.slice(0, keep),
      rejected: fatal ? [] : this.rejected,
      rejectedCount: fatal ? 0 : this.rejectedCount,
      nonPositive: fatal ? 0 : this.nonPositive,
      nonPositiveMass: fatal ? 0 : this.npMass,
      nonPositiveCoupling: fatal ? 0 : this.npCoupling,
      nonPositiveRows: fatal ? [] : this.npRows,
      delimiter: delimText(this.delim),
      decimalComma: this.comma,
      header: this.header,
      headerRow: this.headerRow > 0 ? this.headerRow : null,
      massUnit: this.massUnit,
      couplingUnit: this.couplingUnit,
      massUnitSource: this.massUnitSource,
      couplingUnitSource: this.couplingUnitSource,
      modelEOverN: this.ctx.modelEOverN,
      log10Mass: this.massLog,
      log10Coupling: this.gLog,
      massColumn: this.massCol + 1,
      couplingColumn: this.gCol + 1,
      columnCount: this.columnCount,
      dataRows: this.dataRows,
      lineCount: this.lines,
      preview: this.preview,
      comments: this.comments,
      label: this.label,
      citation: this.citation.length > 0 ? this.citation.join("\n") : null,
      fileName: f,
      truncated: this.truncated,
      fatal,
      messages,
    };
  }
}

function firstOther(massCol: number, units: HeaderUnit[]): number {
  for (let i = 0; i < units.length; i++) if (i !== massCol && units[i]?.kind === "coupling") return i;
  return massCol === 0 ? 1 : 0;
}

/** How many sample lines read as numbers in both columns with this delimiter and decimal mark. */
function score(lines: { text: string }[], delim: number, comma: boolean, c1: number, c2: number): number {
  let ok = 0;
  for (const l of lines) {
    const f = splitFields(l.text, delim);
    if (f.length > Math.max(c1, c2) && isNumberText(f[c1], comma) && isNumberText(f[c2], comma)) ok++;
  }
  return ok;
}

/** The field count shared by most sample lines when it is at least 2, weighted by how many share it. */
function consistentFields(lines: { text: string }[], delim: number): number {
  const counts = new Map<number, number>();
  for (const l of lines) {
    const k = splitFields(l.text, delim).length;
    counts.set(k, (counts.get(k) ?? 0) + 1);
  }
  let best = 0;
  for (const [k, n] of counts) if (k >= 2 && n > best) best = n;
  return best;
}

function countColumns(t: string, s: number, e: number, delim: number): number {
  return splitFields(t.slice(s, e), delim).length;
}

// Spreadsheets pad tables with rows such as ",,": nothing is lost by treating them as blank lines.
function onlyDelimiters(t: string, s: number, e: number, delim: number): boolean {
  for (let i = s; i < e; i++) {
    const c = t.charCodeAt(i);
    if (c !== delim && c !== 32 && c !== 9 && c !== 34) return false;
  }
  return true;
}

/** A parser that takes the text in pieces (see {@link CurveParser}); options as for {@link parseCurveText}. */
export function createCurveParser(opts: CurveParseOptions = {}): CurveParser {
  return new Parser(opts);
}

/**
 * Parses a whole curve file held in memory (DESIGN.md §3). Never throws on bad input: unreadable rows are
 * listed in `rejected`, and a file that gives no curve at all sets `fatal`.
 */
export function parseCurveText(text: string, opts: CurveParseOptions = {}): CurveParseResult {
  const p = new Parser({ sizeHint: text.length, ...opts });
  p.push(text);
  return p.finish();
}

// ---------------------------------------------------------------------------------------------------------
// Reading a source in slices (worker, or the main thread when no worker is available)

export interface ImportProgress {
  /** 0..1 of the input read. */
  fraction: number;
  /** Lines read so far. */
  lines: number;
}

export interface ParseSourceHooks {
  onProgress?: (p: ImportProgress) => void;
  signal?: AbortSignal;
  /** Characters per slice of a string source. @default 1 << 20 */
  sliceChars?: number;
  /** Bytes per slice of a Blob/File source. @default 1 << 20 */
  blobSliceBytes?: number;
  /** Give the event loop a turn after this much work, so cancel and other messages get through. @default 50 */
  yieldMs?: number;
}

/** Error thrown (as a rejection) when an import is cancelled through its AbortSignal. */
export class ImportCancelled extends Error {
  override name = "AbortError";
  constructor() {
    super("import cancelled");
  }
}

/** True for the rejection of a cancelled import. */
export function isImportCancelled(err: unknown): boolean {
  return err instanceof Error && err.name === "AbortError";
}

function emptyResult(opts: CurveParseOptions, problem: ImportProblem): CurveParseResult {
  const r = parseCurveText("", opts);
  return {
    ...r,
    fatal: problem,
    messages: [{ level: "error", text: formatProblem(opts.fileName ?? "input", problem) }],
  };
}

function turn(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 0));
}

/**
 * Parses a string, bytes or a Blob/File in slices, reporting progress and yielding to the event loop so the
 * caller's thread stays responsive; rejects with {@link ImportCancelled} when `signal` aborts. Files go
 * through {@link checkImportFile} first (size cap, binary data, UTF-16 BOM).
 */
export async function parseCurveSource(
  source: string | ArrayBuffer | Uint8Array | Blob,
  opts: CurveParseOptions = {},
  hooks: ParseSourceHooks = {},
): Promise<CurveParseResult> {
  const { onProgress, signal } = hooks;
  const yieldMs = hooks.yieldMs ?? 50;
  let last = Date.now();
  let lastReport = -1;
  const step = async (parser: CurveParser, fraction: number) => {
    if (signal?.aborted) throw new ImportCancelled();
    if (onProgress && fraction - lastReport >= 0.005) {
      lastReport = fraction;
      onProgress({ fraction, lines: parser.lines });
    }
    if (Date.now() - last >= yieldMs) {
      await turn();
      last = Date.now();
      if (signal?.aborted) throw new ImportCancelled();
    }
  };
  const done = (parser: CurveParser) => {
    const r = parser.finish();
    onProgress?.({ fraction: 1, lines: parser.lines });
    return r;
  };

  if (typeof source === "string") {
    const parser = createCurveParser({ sizeHint: source.length, ...opts });
    const slice = hooks.sliceChars ?? 1 << 20;
    for (let i = 0; i < source.length; i += slice) {
      parser.push(source.slice(i, i + slice));
      await step(parser, Math.min(1, (i + slice) / source.length));
    }
    return done(parser);
  }

  const size = source instanceof Blob ? source.size : source.byteLength;
  const headBytes =
    source instanceof Blob
      ? new Uint8Array(await source.slice(0, 4096).arrayBuffer())
      : source instanceof Uint8Array
        ? source.subarray(0, 4096)
        : new Uint8Array(source, 0, Math.min(4096, source.byteLength));
  const check = checkImportFile({ name: opts.fileName, size, firstBytes: headBytes });
  if (!check.ok) return emptyResult(opts, check.problem);
  const decoder = new TextDecoder(check.encoding);
  const parser = createCurveParser({ sizeHint: size, ...opts });

  if (source instanceof Blob) {
    // 1 MB slices: fewer round trips to the blob store than a stream's 64 KB chunks, still a smooth progress bar.
    const slice = hooks.blobSliceBytes ?? 1 << 20;
    for (let i = 0; i < size; i += slice) {
      const bytes = new Uint8Array(await source.slice(i, Math.min(size, i + slice)).arrayBuffer());
      if (signal?.aborted) throw new ImportCancelled();
      parser.push(decoder.decode(bytes, { stream: true }));
      await step(parser, Math.min(1, (i + slice) / size));
    }
  } else {
    const bytes = source instanceof Uint8Array ? source : new Uint8Array(source);
    const slice = (hooks.sliceChars ?? 1 << 20) * 2;
    for (let i = 0; i < bytes.length; i += slice) {
      parser.push(decoder.decode(bytes.subarray(i, i + slice), { stream: true }));
      await step(parser, Math.min(1, (i + slice) / bytes.length));
    }
  }
  parser.push(decoder.decode());
  return done(parser);
}
