// Text cells of exported tables made inert: CSV cells a spreadsheet would run as a formula, and Markdown
// cells a renderer would read as HTML. Shared by every table export (overlap table, model and curve CSV).

// OWASP, "CSV Injection" (common practice): cells starting with these run as formulas in spreadsheets.
const FORMULA_START = /^[=+\-@\t\r]/;

/**
 * A text cell for CSV (RFC 4180 quoting): a cell that starts with `=`, `+`, `-`, `@`, tab or CR gets a
 * leading `'` and quotes, so a spreadsheet shows it as text. Numbers are not text cells: write them as numbers.
 */
export function csvTextCell(text: string): string {
  const inert = FORMULA_START.test(text) ? `'${text}` : text;
  return inert !== text || /[",\n\r]/.test(inert) ? `"${inert.replace(/"/g, '""')}"` : inert;
}

/** A text cell for a Markdown table: HTML's `&`, `<`, `>` as entities, `|` and `\` escaped, one line. */
export function markdownTextCell(text: string): string {
  return text
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/\\/g, "\\\\")
    .replace(/\|/g, "\\|")
    .replace(/\r?\n|\r/g, " ");
}
