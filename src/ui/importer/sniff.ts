// First look at a file before it is parsed: is it text at all, what do its first lines say, how many columns
// does it have. Works on the first few kilobytes only, so it is instant even for a 200 MB file.

/** How much of a file the import step reads for its preview. */
export const HEAD_BYTES = 64 * 1024;

/** Delimiter choices of the import step; "auto" lets the parser detect it. */
export const DELIMITERS: { value: string; label: string }[] = [
  { value: "auto", label: "auto-detect" },
  { value: ",", label: "comma" },
  { value: ";", label: "semicolon" },
  { value: "\t", label: "tab" },
  { value: " ", label: "spaces" },
];

/** Human name of a delimiter as the parser reports it. */
export function delimiterName(d: string | null | undefined): string {
  if (d === "\t" || d === "tab") return "tab";
  if (d === ",") return "comma";
  if (d === ";") return "semicolon";
  if (d === " " || d === "whitespace" || d === "space" || d === "spaces") return "spaces";
  return d ? JSON.stringify(d) : "none";
}

/**
 * True when the bytes are not text: a NUL byte, or more than 2 % other control characters (PDF, images,
 * spreadsheets and archives all trip this within their first kilobytes; UTF-8 text never does).
 */
export function looksBinary(bytes: Uint8Array): boolean {
  let control = 0;
  const n = Math.min(bytes.length, HEAD_BYTES);
  for (let i = 0; i < n; i++) {
    const b = bytes[i];
    if (b === 0) return true;
    if (b < 32 && b !== 9 && b !== 10 && b !== 12 && b !== 13) control++;
  }
  return n > 0 && control / n > 0.02;
}

/** Decodes the head of a file, dropping a BOM and a last line that the byte cut may have broken. */
export function decodeHead(bytes: Uint8Array, complete: boolean): string {
  let text = new TextDecoder("utf-8").decode(bytes);
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (!complete) {
    const nl = text.lastIndexOf("\n");
    text = nl >= 0 ? text.slice(0, nl + 1) : text;
  }
  return text;
}

/** Lines that carry content: not blank and not `#` comments, with their 1-based row numbers in the file. */
export function contentLines(text: string, max = Infinity): { row: number; text: string }[] {
  const out: { row: number; text: string }[] = [];
  const lines = text.split(/\r\n|\r|\n/);
  for (let i = 0; i < lines.length && out.length < max; i++) {
    const t = lines[i].trim();
    if (t === "" || t.startsWith("#")) continue;
    out.push({ row: i + 1, text: lines[i] });
  }
  return out;
}

/** Splits one line for display by a delimiter ("auto" guesses the same way a person would). */
export function splitRow(line: string, delimiter: string): string[] {
  const d = delimiter === "auto" ? guessDelimiter(line) : delimiter;
  const t = line.trim();
  if (d === " ") return t.split(/\s+/);
  return t.split(d).map((c) => c.trim().replace(/^"(.*)"$/, "$1"));
}

/** A quick guess for the preview: tab, semicolon, comma, then runs of spaces. */
export function guessDelimiter(line: string): string {
  if (line.includes("\t")) return "\t";
  if (line.includes(";")) return ";";
  if (line.includes(",")) return ",";
  return " ";
}

/** The parser's delimiter in the step's terms ("," ";" "\t" " "). */
export function normaliseDelimiter(d: string | null | undefined): string {
  const name = delimiterName(d);
  return name === "tab" ? "\t" : name === "comma" ? "," : name === "semicolon" ? ";" : name === "spaces" ? " " : (d ?? ",");
}

/** Largest number of fields in the given rows. */
export function columnCount(rows: string[][]): number {
  return rows.reduce((m, r) => Math.max(m, r.length), 0);
}
