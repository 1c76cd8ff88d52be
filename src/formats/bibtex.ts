// BibTeX for the sources panel: a small tolerant parser for the entries users paste as curve citations, and
// the writer (escaping, stable layout) behind the BibTeX export. Written here rather than taken from a
// library: the needs are small (entries, @string macros, # concatenation, @comment/@preamble skipped) and
// the pure core must run in plain Node and the browser without a parser generator.

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

/**
 * Parses BibTeX text: every `@type{key, field = value, …}` (or with parentheses), values in braces, in
 * double quotes, numbers or @string macros joined with `#`; month abbreviations expand. Text outside entries
 * is ignored, as BibTeX does, so an "@" in free text (an e-mail address) is harmless. An entry that cannot be
 * read is dropped and reported with its line; the others are kept.
 * @param text the input, e.g. what a user pasted as a curve's citation.
 */
export function parseBibtex(text: string): BibParse {
  const entries: BibEntry[] = [];
  const problems: BibProblem[] = [];
  const strings: Record<string, string> = {};
  const lineAt = (offset: number): number => {
    let line = 1;
    for (let k = 0; k < offset && k < text.length; k++) if (text.charCodeAt(k) === 10) line++;
    return line;
  };
  let i = 0;
  const n = text.length;

  const skipWs = (): void => {
    while (i < n && /\s/.test(text[i])) i++;
  };
  const readName = (): string => {
    const start = i;
    while (i < n && NAME_RE.test(text[i])) i++;
    return text.slice(start, i);
  };
  /** Reads a braced group starting at text[i] = "{"; returns its inner text. */
  const readBraced = (): string => {
    const start = i;
    let depth = 0;
    for (; i < n; i++) {
      const ch = text[i];
      if (ch === "{") depth++;
      else if (ch === "}") {
        depth--;
        if (depth === 0) {
          i++;
          return text.slice(start + 1, i - 1);
        }
      }
    }
    throw new ParseError("unbalanced braces: a '{' is never closed", start);
  };
  const readQuoted = (): string => {
    const start = i;
    i++;
    let depth = 0;
    for (; i < n; i++) {
      const ch = text[i];
      if (ch === "{") depth++;
      else if (ch === "}") {
        depth--;
        if (depth < 0) throw new ParseError("unbalanced braces inside a quoted value", i);
      } else if (ch === '"' && depth === 0) {
        i++;
        return text.slice(start + 1, i - 1);
      }
    }
    throw new ParseError('a quoted value is never closed with "', start);
  };
  const readValue = (): string => {
    const parts: string[] = [];
    for (;;) {
      skipWs();
      const ch = text[i];
      if (ch === "{") parts.push(readBraced());
      else if (ch === '"') parts.push(readQuoted());
      else if (ch !== undefined && /[0-9]/.test(ch)) {
        const start = i;
        while (i < n && /[0-9]/.test(text[i])) i++;
        parts.push(text.slice(start, i));
      } else if (ch !== undefined && NAME_RE.test(ch)) {
        const name = readName().toLowerCase();
        const value = strings[name] ?? MONTHS[name];
        if (value === undefined)
          problems.push({ line: lineAt(i), message: `unknown macro "${name}" kept as its name` });
        parts.push(value ?? name);
      } else {
        throw new ParseError("expected a value in braces, in quotes, a number or a macro", i);
      }
      skipWs();
      if (text[i] === "#") {
        i++;
        continue;
      }
      return parts.join("").replace(/\s+/g, " ").trim();
    }
  };

  while (i < n) {
    const at = text.indexOf("@", i);
    if (at < 0) break;
    i = at + 1;
    skipWs();
    const typeStart = i;
    while (i < n && /[A-Za-z]/.test(text[i])) i++;
    const type = text.slice(typeStart, i).toLowerCase();
    skipWs();
    const open = text[i];
    if (type === "" || (open !== "{" && open !== "(")) continue; // not an entry: free text around an "@"
    const close = open === "{" ? "}" : ")";
    try {
      if (type === "comment") {
        if (open === "{") readBraced();
        else i = Math.max(i + 1, text.indexOf(")", i) + 1);
        continue;
      }
      i++;
      skipWs();
      if (type === "preamble") {
        readValue();
        skipWs();
        if (text[i] !== close) throw new ParseError(`expected "${close}" after @preamble`, i);
        i++;
        continue;
      }
      if (type === "string") {
        const name = readName().toLowerCase();
        if (!name) throw new ParseError("expected a macro name after @string", i);
        skipWs();
        if (text[i] !== "=") throw new ParseError(`expected "=" after @string name "${name}"`, i);
        i++;
        strings[name] = readValue();
        skipWs();
        if (text[i] !== close) throw new ParseError(`expected "${close}" to end @string`, i);
        i++;
        continue;
      }
      const keyStart = i;
      while (i < n && !/[\s,]/.test(text[i]) && text[i] !== close && text[i] !== "{" && text[i] !== "}") i++;
      const key = text.slice(keyStart, i);
      if (!key) throw new ParseError(`@${type} has no citation key`, i);
      const keyEnd = i;
      skipWs();
      const fields: Record<string, string> = {};
      if (text[i] !== close) {
        if (text[i] !== ",") throw new ParseError(`expected "," after the key "${key}"`, i);
        for (;;) {
          while (i < n && (/\s/.test(text[i]) || text[i] === ",")) i++;
          if (i >= n) throw new ParseError(`@${type}{${key}, … is never closed`, at);
          if (text[i] === close) break;
          const name = readName().toLowerCase();
          if (!name) throw new ParseError(`unexpected "${text[i]}" where a field name should be`, i);
          skipWs();
          if (text[i] !== "=") throw new ParseError(`expected "=" after the field name "${name}"`, i);
          i++;
          const value = readValue();
          if (name in fields)
            problems.push({ line: lineAt(i), message: `field "${name}" given twice in "${key}"; the first is kept` });
          else fields[name] = value;
          skipWs();
          if (text[i] !== "," && text[i] !== close)
            throw new ParseError(`expected "," or "${close}" after the field "${name}"`, i);
        }
      }
      i++;
      entries.push({ type, key, fields, raw: text.slice(at, i), keyStart: keyStart - at, keyEnd: keyEnd - at });
    } catch (err) {
      if (!(err instanceof ParseError)) throw err;
      problems.push({ line: lineAt(err.at), message: err.message });
      // Resume after the failing entry's "@", so one broken entry does not hide the next ones.
      i = at + 1;
    }
  }
  return { entries, problems, strings };
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
