// The parse result and the sentences the import step shows about it: what was detected or assumed, how
// many rows cannot be read (with the first as file:row:column), values ≤ 0, and problems that stop a file.
import { massUnitInfo } from "../units";
import { delimText } from "./fields";
import type { Parser } from "./parser";
import {
  delimiterName,
  formatProblem,
  formatRejection,
  type CurveParseResult,
  type ImportMessage,
  type UnitSource,
} from "./types";

/** The result of a finished parse (arrays cut to length; empty when a problem stopped the file). */
export function parseResult(p: Parser): CurveParseResult {
  const f = p.fileName;
  let fatal = p.fatal;
  if (!fatal && p.dataRows === 0) {
    const onlyBlank = p.head.trim() === "" && p.lines <= 1 && p.comments.length === 0;
    fatal = onlyBlank
      ? { code: "empty", message: "the file is empty" }
      : p.header
        ? { code: "no-data", message: "the file has a header but no data rows" }
        : { code: "no-data", message: "the file has no data rows (only comments or blank lines)" };
  }
  if (!fatal && p.n === 0 && p.dataColumnMax <= 1) {
    fatal = {
      code: "single-column",
      message: `only one column found (delimiter: ${delimiterName(delimText(p.delim))}); a curve needs two, mass and coupling`,
    };
  }
  const messages: ImportMessage[] = fatal ? [{ level: "error", text: formatProblem(f, fatal) }] : summaryMessages(p);
  const keep = fatal ? 0 : p.n;
  return {
    massEv: p.m.slice(0, keep),
    gInvGeV: p.g.slice(0, keep),
    rejected: fatal ? [] : p.rejected,
    rejectedCount: fatal ? 0 : p.rejectedCount,
    nonPositive: fatal ? 0 : p.nonPositive,
    nonPositiveMass: fatal ? 0 : p.npMass,
    nonPositiveCoupling: fatal ? 0 : p.npCoupling,
    nonPositiveRows: fatal ? [] : p.npRows,
    delimiter: delimText(p.delim),
    decimalComma: p.comma,
    header: p.header,
    headerRow: p.headerRow > 0 ? p.headerRow : null,
    massUnit: p.massUnit,
    couplingUnit: p.couplingUnit,
    massUnitSource: p.massUnitSource,
    couplingUnitSource: p.couplingUnitSource,
    modelEOverN: p.ctx.modelEOverN,
    log10Mass: p.massLog,
    log10Coupling: p.gLog,
    massColumn: p.massCol + 1,
    couplingColumn: p.gCol + 1,
    columnCount: p.columnCount,
    dataRows: p.dataRows,
    lineCount: p.lines,
    preview: p.preview,
    comments: p.comments,
    label: p.label,
    citation: p.citation.length > 0 ? p.citation.join("\n") : null,
    fileName: f,
    truncated: p.truncated,
    fatal,
    messages,
  };
}

/** What was detected or assumed, then the parser's own notes and the warnings about rows. */
function summaryMessages(p: Parser): ImportMessage[] {
  const f = p.fileName;
  const messages: ImportMessage[] = [];
  messages.push({
    level: "info",
    text: `delimiter: ${delimiterName(delimText(p.delim))}${p.comma ? ", decimal comma" : ""}; ${p.header ? `header on line ${p.headerRow}` : "no header"}`,
  });
  const mLabel = massUnitInfo(p.massUnit).label + (p.massLog ? " (log10)" : "");
  const gLabel = p.couplingUnit + (p.gLog ? " (log10)" : "");
  const src = (s: UnitSource) =>
    s === "header" ? "from the header" : s === "option" ? "as chosen" : "assumed: no unit in the header";
  messages.push({ level: "info", text: `mass in ${mLabel} (${src(p.massUnitSource)})` });
  messages.push({ level: "info", text: `coupling in ${gLabel} (${src(p.couplingUnitSource)})` });
  messages.push(...p.messages);
  if (p.rejectedCount > 0) {
    const firstRow = p.rejected[0];
    messages.push({
      level: "warning",
      text: `${p.rejectedCount} row${p.rejectedCount === 1 ? "" : "s"} cannot be read; the first: ${formatRejection(f, firstRow)}`,
    });
  }
  if (p.nonPositive > 0) {
    messages.push({
      level: "warning",
      text: `${p.nonPositive} row${p.nonPositive === 1 ? " has" : "s have"} a value ≤ 0 (first on line ${p.npRows[0]}); kept, but a log axis cannot show ${p.nonPositive === 1 ? "it" : "them"}`,
    });
  }
  if (p.truncated) messages.push({ level: "info", text: `read only the first ${p.dataRows} data rows` });
  return messages;
}
