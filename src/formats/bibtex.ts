// BibTeX for the sources panel: a small tolerant parser for pasted curve citations, and the writer behind the export.

/** One parsed entry. */
export interface BibEntry {
  /** Entry type, lower case ("article", "misc", …). */
  type: string;
  key: string;
  /** Field names in lower case → value with its outer delimiters removed, inner text as written, runs of white space collapsed. */
  fields: Record<string, string>;
  /** The entry's exact source text, from "@" to its closing delimiter. */
  raw: string;
  /** Offsets of the key inside `raw` (so a key can be replaced without touching the rest). */
  keyStart: number;
  keyEnd: number;
}

/** Something the parser could not read; the entry it belongs to is dropped. */
export interface BibProblem {
  /** 1-based line of the problem in the input. */
  line: number;
  message: string;
}

export interface BibParse {
  entries: BibEntry[];
  problems: BibProblem[];
  /** @string macros, lower-case names. */
  strings: Record<string, string>;
}

const MONTHS: Record<string, string> = {
  jan: "January",
  feb: "February",
  mar: "March",
  apr: "April",
  may: "May",
  jun: "June",
  jul: "July",
  aug: "August",
  sep: "September",
  oct: "October",
  nov: "November",
  dec: "December",
};

class ParseError extends Error {
  constructor(
    message: string,
    readonly at: number,
  ) {
    super(message);
  }
}

const NAME_RE = /[^\s"#%'(),={}]/;

/** A cursor over BibTeX text that collects entries, @string macros and problems as it reads. */
class BibReader {
  readonly entries: BibEntry[] = [];
  readonly problems: BibProblem[] = [];
  readonly strings: Record<string, string> = {};
  i = 0;
  private readonly n: number;

  constructor(private readonly text: string) {
    this.n = text.length;
  }

  lineAt(offset: number): number {
    let line = 1;
    for (let k = 0; k < offset && k < this.text.length; k++) if (this.text.charCodeAt(k) === 10) line++;
    return line;
  }

  private skipWs(): void {
    while (this.i < this.n && /\s/.test(this.text[this.i])) this.i++;
  }

  private readName(): string {
    const start = this.i;
    while (this.i < this.n && NAME_RE.test(this.text[this.i])) this.i++;
    return this.text.slice(start, this.i);
  }

  /** Reads a braced group starting at text[i] = "{"; returns its inner text. */
  private readBraced(): string {
    const { text, n } = this;
    const start = this.i;
    let depth = 0;
    for (; this.i < n; this.i++) {
      const ch = text[this.i];
      if (ch === "{") depth++;
      else if (ch === "}") {
        depth--;
        if (depth === 0) {
          this.i++;
          return text.slice(start + 1, this.i - 1);
        }
      }
    }
    throw new ParseError("unbalanced braces: a '{' is never closed", start);
  }

  /**
   * Reads a quoted value starting at text[i] = '"'. Not {@link readBraced}: a quoted value ends at a quote
   * outside braces, and a stray "}" inside it is an error instead of its end.
   */
  private readQuoted(): string {
    const { text, n } = this;
    const start = this.i;
    this.i++;
    let depth = 0;
    for (; this.i < n; this.i++) {
      const ch = text[this.i];
      if (ch === "{") depth++;
      else if (ch === "}") {
        depth--;
        if (depth < 0) throw new ParseError("unbalanced braces inside a quoted value", this.i);
      } else if (ch === '"' && depth === 0) {
        this.i++;
        return text.slice(start + 1, this.i - 1);
      }
    }
    throw new ParseError('a quoted value is never closed with "', start);
  }

  /** One part of a value: braced, quoted, a number or a macro (expanded; unknown ones kept as their name). */
  private readValuePart(): string {
    const { text, n } = this;
    const ch = text[this.i];
    if (ch === "{") return this.readBraced();
    if (ch === '"') return this.readQuoted();
    if (ch !== undefined && /[0-9]/.test(ch)) {
      const start = this.i;
      while (this.i < n && /[0-9]/.test(text[this.i])) this.i++;
      return text.slice(start, this.i);
    }
    if (ch !== undefined && NAME_RE.test(ch)) {
      const name = this.readName().toLowerCase();
      const value = this.strings[name] ?? MONTHS[name];
      if (value === undefined)
        this.problems.push({ line: this.lineAt(this.i), message: `unknown macro "${name}" kept as its name` });
      return value ?? name;
    }
    throw new ParseError("expected a value in braces, in quotes, a number or a macro", this.i);
  }

  private readValue(): string {
    const parts: string[] = [];
    for (;;) {
      this.skipWs();
      parts.push(this.readValuePart());
      this.skipWs();
      if (this.text[this.i] === "#") {
        this.i++;
        continue;
      }
      return parts.join("").replace(/\s+/g, " ").trim();
    }
  }

  private expectClose(close: string, message: string): void {
    this.skipWs();
    if (this.text[this.i] !== close) throw new ParseError(message, this.i);
    this.i++;
  }

  private readString(close: string): void {
    const name = this.readName().toLowerCase();
    if (!name) throw new ParseError("expected a macro name after @string", this.i);
    this.skipWs();
    if (this.text[this.i] !== "=") throw new ParseError(`expected "=" after @string name "${name}"`, this.i);
    this.i++;
    this.strings[name] = this.readValue();
    this.expectClose(close, `expected "${close}" to end @string`);
  }

  /** The fields after the key, up to (not past) the closing delimiter; text[i] is the "," after the key. */
  private readFields(type: string, key: string, close: string, at: number): Record<string, string> {
    const { text, n } = this;
    const fields: Record<string, string> = {};
    if (text[this.i] !== ",") throw new ParseError(`expected "," after the key "${key}"`, this.i);
    for (;;) {
      while (this.i < n && (/\s/.test(text[this.i]) || text[this.i] === ",")) this.i++;
      if (this.i >= n) throw new ParseError(`@${type}{${key}, … is never closed`, at);
      if (text[this.i] === close) return fields;
      const name = this.readName().toLowerCase();
      if (!name) throw new ParseError(`unexpected "${text[this.i]}" where a field name should be`, this.i);
      this.skipWs();
      if (text[this.i] !== "=") throw new ParseError(`expected "=" after the field name "${name}"`, this.i);
      this.i++;
      const value = this.readValue();
      if (name in fields)
        this.problems.push({
          line: this.lineAt(this.i),
          message: `field "${name}" given twice in "${key}"; the first is kept`,
        });
      else fields[name] = value;
      this.skipWs();
      if (text[this.i] !== "," && text[this.i] !== close)
        throw new ParseError(`expected "," or "${close}" after the field "${name}"`, this.i);
    }
  }

  private readEntry(type: string, close: string, at: number): void {
    const { text, n } = this;
    const keyStart = this.i;
    while (
      this.i < n &&
      !/[\s,]/.test(text[this.i]) &&
      text[this.i] !== close &&
      text[this.i] !== "{" &&
      text[this.i] !== "}"
    )
      this.i++;
    const key = text.slice(keyStart, this.i);
    if (!key) throw new ParseError(`@${type} has no citation key`, this.i);
    const keyEnd = this.i;
    this.skipWs();
    const fields = text[this.i] !== close ? this.readFields(type, key, close, at) : {};
    this.i++;
    this.entries.push({ type, key, fields, raw: text.slice(at, this.i), keyStart: keyStart - at, keyEnd: keyEnd - at });
  }

  /** Reads what follows "@type" and its opening delimiter (at text[i]); `at` is the "@". */
  private readItem(type: string, open: string, at: number): void {
    const close = open === "{" ? "}" : ")";
    if (type === "comment") {
      if (open === "{") this.readBraced();
      else this.i = Math.max(this.i + 1, this.text.indexOf(")", this.i) + 1);
      return;
    }
    this.i++;
    this.skipWs();
    if (type === "preamble") {
      this.readValue();
      this.expectClose(close, `expected "${close}" after @preamble`);
    } else if (type === "string") this.readString(close);
    else this.readEntry(type, close, at);
  }

  readAll(): void {
    const { text, n } = this;
    while (this.i < n) {
      const at = text.indexOf("@", this.i);
      if (at < 0) break;
      this.i = at + 1;
      this.skipWs();
      const typeStart = this.i;
      while (this.i < n && /[A-Za-z]/.test(text[this.i])) this.i++;
      const type = text.slice(typeStart, this.i).toLowerCase();
      this.skipWs();
      const open = text[this.i];
      if (type === "" || (open !== "{" && open !== "(")) continue; // not an entry: free text around an "@"
      try {
        this.readItem(type, open, at);
      } catch (err) {
        if (!(err instanceof ParseError)) throw err;
        this.problems.push({ line: this.lineAt(err.at), message: err.message });
        // Resume after the failing entry's "@", so one broken entry does not hide the next ones.
        this.i = at + 1;
      }
    }
  }
}

// Written here rather than taken from a library: the needs are small (entries, @string macros, # concatenation,
// @comment/@preamble skipped) and the pure core must run in plain Node and the browser without a parser generator.
/**
 * Parses BibTeX text: every `@type{key, field = value, …}` (or with parentheses), values in braces, in
 * double quotes, numbers or @string macros joined with `#`; month abbreviations expand. Text outside entries
 * is ignored, as BibTeX does, so an "@" in free text (an e-mail address) is harmless. An entry that cannot be
 * read is dropped and reported with its line; the others are kept.
 * @param text the input, e.g. what a user pasted as a curve's citation.
 */
export function parseBibtex(text: string): BibParse {
  const reader = new BibReader(text);
  reader.readAll();
  return { entries: reader.entries, problems: reader.problems, strings: reader.strings };
}

// ---------------------------------------------------------------------------------------------------------
// Writing.

// Braces are written as \textbraceleft{}/\textbraceright{} rather than \{ \}: BibTeX counts every brace,
// escaped or not, so \{ alone would unbalance the field.
const ESCAPES: Record<string, string> = {
  "\\": "\\textbackslash{}",
  "{": "\\textbraceleft{}",
  "}": "\\textbraceright{}",
  "&": "\\&",
  "%": "\\%",
  $: "\\$",
  "#": "\\#",
  _: "\\_",
  "~": "\\textasciitilde{}",
  "^": "\\textasciicircum{}",
};

/** Plain text → BibTeX field text: LaTeX's special characters escaped; other characters (UTF-8) kept. */
export function escapeBibtexValue(text: string): string {
  return text.replace(/[\\{}&%$#_~^]/g, (ch) => ESCAPES[ch]);
}

const UNESCAPES: Record<string, string> = Object.fromEntries(Object.entries(ESCAPES).map(([k, v]) => [v, k]));

/** Inverse of {@link escapeBibtexValue} for the escapes it writes. */
export function unescapeBibtexValue(text: string): string {
  return text.replace(
    /\\(?:textbackslash|textbraceleft|textbraceright|textasciitilde|textasciicircum)\{\}|\\[&%$#_]/g,
    (m) => UNESCAPES[m] ?? m,
  );
}

/** A field value as plain text: one protective pair of outer braces removed, escapes undone. */
export function bibtexFieldText(value: string): string {
  const v = value.trim();
  let inner = v;
  if (v.startsWith("{") && v.endsWith("}")) {
    // Only strip when the outer braces enclose everything (not "{A} and {B}").
    let depth = 0;
    let wraps = true;
    for (let k = 0; k < v.length; k++) {
      if (v[k] === "{") depth++;
      else if (v[k] === "}") depth--;
      if (depth === 0 && k < v.length - 1) {
        wraps = false;
        break;
      }
    }
    if (wraps) inner = v.slice(1, -1);
  }
  return unescapeBibtexValue(inner);
}

/** True for a key BibTeX and biber accept without trouble: letters, digits and - _ : . / + */
export function isSafeBibtexKey(key: string): boolean {
  return /^[A-Za-z0-9][A-Za-z0-9\-_:./+]*$/.test(key);
}

/**
 * One entry as BibTeX text: `@type{key,` then one field per line (`  name = {value},`), fields in the given
 * order. Values are written as they are: escape plain text with {@link escapeBibtexValue} first.
 * @param type entry type ("article", "misc"…); @param key citation key; @param fields [name, BibTeX value] pairs.
 */
export function formatBibtexEntry(type: string, key: string, fields: [string, string][]): string {
  const width = Math.max(0, ...fields.map(([name]) => name.length));
  const lines = fields.map(([name, value]) => `  ${name.padEnd(width)} = {${value}}`);
  return `@${type}{${key},\n${lines.join(",\n")}${lines.length ? "," : ""}\n}`;
}
