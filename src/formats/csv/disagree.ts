// Rows that disagree with the layout detected from the first lines: more fields than the header names,
// another delimiter, or the other decimal mark. Each gives the problem that stops the file, or null.
import { countColumns, delimText, isBlank, splitFields, WS } from "./fields";
import { isNumberText } from "./numbers";
import { delimiterName, type ImportProblem } from "./types";

/** What the checks need to know of the layout. */
interface LayoutFacts {
  delim: number;
  comma: boolean;
  headerRow: number;
  headerCols: number;
  need: number;
}

/** A row whose text goes on after its last read field (at `p`) with more fields than the header names. */
export function extraFields(
  l: LayoutFacts,
  t: string,
  s: number,
  e: number,
  p: number,
  row: number,
): ImportProblem | null {
  const delim = l.delim;
  let q = p;
  while (q < e && isBlank(t.charCodeAt(q))) q++;
  if (delim !== WS && q < e && t.charCodeAt(q) === delim) q++;
  while (q < e && isBlank(t.charCodeAt(q))) q++;
  if (q >= e) return null;
  const k = countColumns(t, s, e, delim);
  const name = delimiterName(delimText(delim));
  const hint =
    delim === 44 ? "; a decimal comma in a comma-separated file? Quote such numbers, or use a semicolon or tab" : "";
  return {
    code: "column-count",
    row,
    column: l.headerCols + 1,
    message: `this row has ${k} fields (${name}-separated) where the header on line ${l.headerRow} names ${l.headerCols}${hint}`,
  };
}

/** An unreadable row that another delimiter splits into the expected numeric columns. */
export function mixedDelimiters(l: LayoutFacts, line: string, row: number): ImportProblem | null {
  const want = l.headerCols >= 2 ? l.headerCols : l.need;
  for (const d of [44, 59, 9, WS]) {
    if (d === l.delim) continue;
    const f = splitFields(line, d);
    if (f.length !== want || !f.every((x) => isNumberText(x, d !== 44))) continue;
    return {
      code: "mixed-delimiters",
      row,
      column: 1,
      message: `this row is split by ${delimiterName(delimText(d))}, the file was detected as ${delimiterName(delimText(l.delim))}-separated: the file mixes delimiters; use one throughout, or choose the delimiter to read only the rows that fit`,
    };
  }
  return null;
}

/** An unreadable field (0-based `col`) that reads with the other decimal mark. */
export function mixedMarks(l: LayoutFacts, line: string, row: number, col: number): ImportProblem | null {
  const field = splitFields(line, l.delim)[col];
  if (field === undefined || isNumberText(field, l.comma) || !isNumberText(field, !l.comma)) return null;
  const [here, above] = l.comma ? ["a decimal point", "decimal commas"] : ["a decimal comma", "decimal points"];
  return {
    code: "mixed-decimal",
    row,
    column: col + 1,
    message: `"${field}" writes ${here} where the rows above use ${above}: the file mixes decimal marks; choose the decimal mark`,
  };
}
