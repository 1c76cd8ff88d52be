// The incremental curve parser: the first lines are held until the layout is detected (detect.ts), then
// every line is read in one pass straight into Float64Arrays; `# label:` and `# citation:` comments are kept.
import { PLANCK_EV_S } from "../../physics/constants";
import { gFromNormalized } from "../../physics/coupling";
import {
  couplingContext,
  massToEv,
  massUnitInfo,
  type CouplingContext,
  type CouplingUnit,
  type MassUnit,
} from "../units";
import { detectLayout, type SniffLine } from "./detect";
import { extraFields, mixedDelimiters, mixedMarks } from "./disagree";
import { fastLines } from "./fast-lines";
import { closingQuote, countColumns, isBlank, onlyDelimiters, splitFields, WS } from "./fields";
import { binaryProblem, looksBinary } from "./file-check";
import { ERR_NONE, ERR_RANGE, fieldReason, read, readNumber } from "./numbers";
import { parseResult } from "./result";
import type {
  CurveParseOptions,
  CurveParser,
  CurveParseResult,
  ImportMessage,
  ImportProblem,
  PreviewRow,
  RejectedRow,
  UnitSource,
} from "./types";

const SNIFF_LINES = 64;
const SNIFF_CHARS = 256 * 1024;
const COLUMN_COUNT_ROWS = 1000;
const MAX_NONPOSITIVE_ROWS = 100;
const MAX_COMMENTS = 200;

/** Numeric kinds of the conversion steps, fixed before the hot loop. */
const G_INV_GEV = 0;
const G_NORMALIZED = 1;
const G_GGAMMA = 2;
const G_MODEL = 3;

/** The parser behind createCurveParser; its state is read by parseResult (result.ts) once it finishes. */
export class Parser implements CurveParser {
  lines = 0;
  chars = 0;
  private readonly o: CurveParseOptions;
  readonly fileName: string;
  private started = false;
  private carry = "";
  /** Line end: 10 (LF) or 13 (CR), fixed by the first chunk holding one. */
  nl = 0;
  private phase: "sniff" | "data" | "stopped" = "sniff";
  private sniff: SniffLine[] = [];
  private sniffChars = 0;
  head = "";
  fatal: ImportProblem | null = null;
  messages: ImportMessage[] = [];

  // configuration fixed by decide()
  delim = 44;
  comma = false;
  headerRow = -1;
  header: string[] | null = null;
  massCol = 0;
  gCol = 1;
  need = 2;
  /** Fields the header names (0 without a header). */
  headerCols = 0;
  /** Look for rows split by another delimiter: only when the delimiter was detected, not chosen. */
  private readonly checkMixed: boolean;
  /** Look for fields written with the other decimal mark: only when the mark was detected, not chosen. */
  private readonly checkMark: boolean;
  massUnit: MassUnit = "eV";
  couplingUnit: CouplingUnit = "GeV^-1";
  massUnitSource: UnitSource = "default";
  couplingUnitSource: UnitSource = "default";
  massShift = 0;
  private massFreq = false;
  massLog = false;
  gLog = false;
  private gMode = G_INV_GEV;
  /** No conversion after reading (mass in a unit of energy, coupling in GeV⁻¹, neither as log10). */
  plain = false;
  /** Data lines may go through fastLines first (a layout it can read, no row limit). */
  private fast = false;
  ctx: CouplingContext = couplingContext();
  private kMuEv = 0;
  private modelAbs = 0;
  readonly previewMax: number;
  private readonly maxRows: number;
  private readonly maxRejected: number;

  // output
  m: Float64Array;
  g: Float64Array;
  n = 0;
  readonly rejected: RejectedRow[] = [];
  rejectedCount = 0;
  nonPositive = 0;
  npMass = 0;
  npCoupling = 0;
  readonly npRows: number[] = [];
  dataRows = 0;
  columnCount = 0;
  dataColumnMax = 0;
  readonly preview: PreviewRow[] = [];
  readonly comments: string[] = [];
  label: string | null = null;
  readonly citation: string[] = [];
  truncated = false;

  constructor(opts: CurveParseOptions) {
    this.o = opts;
    this.fileName = opts.fileName ?? "input";
    this.previewMax = opts.previewRows ?? 20;
    this.maxRows = opts.maxDataRows ?? Infinity;
    this.maxRejected = opts.maxRejected ?? 10000;
    this.checkMark = opts.decimalComma === undefined;
    this.checkMixed = opts.delimiter === undefined || opts.delimiter === "" || opts.delimiter === "auto";
    if (opts.encoding === "windows-1252") {
      this.messages.push({
        level: "warning",
        text: "the file is not valid UTF-8: read as Windows-1252 (Latin-1); check the units and labels it names",
      });
    }
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
      if (this.fast && this.phase === "data") {
        pos = fastLines(this, text, pos);
        if (this.isStopped()) {
          this.carry = "";
          return;
        }
      }
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
    return parseResult(this);
  }

  /** Whether the next data lines may be read as bytes by fastBytes (parse-bytes.ts). */
  takesBytes(): boolean {
    return this.phase === "data" && this.fast && this.plain && this.nl === 10;
  }

  // A method, so TypeScript does not narrow `phase` across calls that change it.
  isStopped(): boolean {
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
    const layout = detectLayout(lines, this.o);
    if ("code" in layout) {
      this.stop(layout);
      return;
    }
    this.delim = layout.delim;
    this.comma = layout.comma;
    this.headerRow = layout.headerRow;
    this.header = layout.header;
    if (layout.header) this.columnCount = this.headerCols = layout.header.length;
    this.massCol = layout.massCol;
    this.gCol = layout.gCol;
    this.need = Math.max(layout.massCol, layout.gCol) + 1;
    this.massUnit = layout.massUnit;
    this.massUnitSource = layout.massUnitSource;
    this.couplingUnit = layout.couplingUnit;
    this.couplingUnitSource = layout.couplingUnitSource;
    this.messages.push(...layout.messages);
    const eOverN = layout.eOverN;
    this.ctx = couplingContext(this.o.physics, eOverN);
    this.kMuEv = this.ctx.constants.kMuEv;
    this.modelAbs = eOverN === null ? 0 : Math.abs(eOverN - this.ctx.constants.cGamma);
    const mu = massUnitInfo(this.massUnit);
    this.massLog = this.o.log10Mass === true;
    this.gLog = this.o.log10Coupling === true;
    this.massShift = this.massLog ? 0 : mu.pow10;
    this.massFreq = mu.kind === "frequency";
    this.gMode = { "GeV^-1": G_INV_GEV, normalized: G_NORMALIZED, "g-gamma": G_GGAMMA, "model-line": G_MODEL }[
      this.couplingUnit
    ];
    this.plain = !this.massLog && !this.massFreq && !this.gLog && this.gMode === G_INV_GEV;
    this.fast = this.delim !== WS && this.need === 2 && this.massCol + this.gCol === 1 && this.maxRows === Infinity;

    for (const l of lines) {
      if (l.row === this.headerRow) continue;
      this.dataLine(l.text, 0, l.text.length, l.row);
      if (this.isStopped()) return;
    }
  }

  // Hot loop: long on purpose (one pass over each data line, cells split and read without substrings).
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
          if (read.err !== ERR_NONE || read.end !== fe)
            bad = fieldReason(t, fs, fe, read.err === ERR_RANGE && read.end === fe);
        }
      } else if (want) {
        // Read the number in place, then check that the field ends where the number does.
        const fs = p;
        v = readNumber(t, fs, e, shift, bareComma);
        let q = read.end;
        if (delim !== WS) while (q < e && ((c = t.charCodeAt(q)) === 32 || (c === 9 && delim !== 9))) q++;
        const boundary = q >= e || (delim === WS ? isBlank(t.charCodeAt(q)) : t.charCodeAt(q) === delim);
        if (read.err === ERR_NONE && boundary) p = q;
        else {
          const outOfRange = read.err === ERR_RANGE && boundary;
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
    if (errCol < 0 && p < e && this.headerCols === need && this.refuse(extraFields(this, t, s, e, p, row))) return;
    if (errCol >= 0) {
      if (onlyDelimiters(t, s, e, delim)) return;
      if (this.checkMixed && this.refuse(mixedDelimiters(this, t.slice(s, e), row))) return;
      // In a comma-separated file a decimal comma needs quotes; the column count check covers bare ones.
      if (this.checkMark && delim !== 44 && this.refuse(mixedMarks(this, t.slice(s, e), row, errCol))) return;
      this.dataRows++;
      this.reject(row, errCol + 1, reason, t, s, e);
      return;
    }
    this.dataRows++;
    this.keep(row, massV, gV, t, s, e);
  }

  /** Converts a readable row to eV and GeV⁻¹ and stores it (or rejects it when a conversion overflows). */
  keep(row: number, massV: number, gV: number, t: string, s: number, e: number): void {
    const massCol = this.massCol;
    const gCol = this.gCol;
    const delim = this.delim;

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

  /** Stops the file with `problem` when there is one. */
  private refuse(problem: ImportProblem | null): boolean {
    if (problem) this.stop(problem);
    return problem !== null;
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

  grow(): void {
    const m = new Float64Array(this.m.length * 2);
    m.set(this.m);
    this.m = m;
    const g = new Float64Array(this.g.length * 2);
    g.set(this.g);
    this.g = g;
  }
}

/** A parser that takes the text in pieces (see {@link CurveParser}); options as for {@link parseCurveText}. */
export function createCurveParser(opts: CurveParseOptions = {}): CurveParser {
  return new Parser(opts);
}

/**
 * Parses a whole curve file held in memory. Never throws on bad input: unreadable rows are listed in
 * `rejected`, and a file that gives no curve at all sets `fatal`.
 */
export function parseCurveText(text: string, opts: CurveParseOptions = {}): CurveParseResult {
  const p = new Parser({ sizeHint: text.length, ...opts });
  p.push(text);
  return p.finish();
}
