// The overlap summary as a LaTeX table that compiles as is with booktabs (and siunitx unless plain math is
// chosen): labels escaped, Greek letters and common symbols of labels turned into LaTeX.
import type { OverlapSummaryRow } from "../../analysis/overlap-summary";
import { rowView } from "./view";

export interface LatexOptions {
  /** "siunitx": \num{}, \SI{}{}; "plain": $…$ math only. @default "siunitx" */
  numbers?: "siunitx" | "plain";
}

const SYMBOLS: Record<string, string> = {
  α: "\\ensuremath{\\alpha}",
  β: "\\ensuremath{\\beta}",
  γ: "\\ensuremath{\\gamma}",
  δ: "\\ensuremath{\\delta}",
  μ: "\\ensuremath{\\mu}",
  µ: "\\ensuremath{\\mu}",
  ν: "\\ensuremath{\\nu}",
  ρ: "\\ensuremath{\\rho}",
  σ: "\\ensuremath{\\sigma}",
  Φ: "\\ensuremath{\\Phi}",
  "–": "--",
  "—": "---",
  "−": "\\ensuremath{-}",
  "×": "\\ensuremath{\\times}",
  "·": "\\ensuremath{\\cdot}",
  "±": "\\ensuremath{\\pm}",
  "≤": "\\ensuremath{\\le}",
  "≥": "\\ensuremath{\\ge}",
  "∪": "\\ensuremath{\\cup}",
  "…": "\\ldots{}",
  "→": "\\ensuremath{\\to}",
  "’": "'",
  "“": "``",
  "”": "''",
};

/** Text safe in a LaTeX table cell: the ten special characters escaped, symbols as macros, other non-ASCII dropped to "?". */
export function latexEscape(text: string): string {
  let out = "";
  for (const ch of text) {
    if (ch === "\\") out += "\\textbackslash{}";
    else if ("%&_#$".includes(ch)) out += `\\${ch}`;
    else if (ch === "{" || ch === "}") out += `\\${ch}`;
    else if (ch === "^") out += "\\textasciicircum{}";
    else if (ch === "~") out += "\\textasciitilde{}";
    else if (ch === "<") out += "\\textless{}";
    else if (ch === ">") out += "\\textgreater{}";
    else if (ch === "\n" || ch === "\r" || ch === "\t") out += " ";
    else if (SYMBOLS[ch]) out += SYMBOLS[ch];
    else if (/[\u00a0-\u00ff]/.test(ch) || (ch >= " " && ch <= "~")) out += ch;
    else out += "?";
  }
  return out;
}

/** "1.23e-5" as siunitx (\num{1.23e-5}) or plain math (1.23\times10^{-5}). */
function number(text: string, plain: boolean): string {
  if (!plain) return `\\num{${text}}`;
  const [m, e] = text.split("e");
  return e === undefined ? m : `${m}\\times10^{${Number(e)}}`;
}

function percentCell(text: string, plain: boolean): string {
  if (text === "—") return "---";
  const lt = text.startsWith("<");
  const value = text.replace(/[<%\s]/g, "");
  const body = plain ? `$${lt ? "<" : ""}${value}\\,\\%$` : `${lt ? "$<$" : ""}\\SI{${value}}{\\percent}`;
  return body;
}

/**
 * A complete tabular (booktabs rules) of the summary, one line per row, for a document that loads booktabs
 * and (unless `numbers: "plain"`) siunitx. Mass ranges carry each row's unit; shares in percent.
 */
export function summaryToLatex(rows: readonly OverlapSummaryRow[], opts: LatexOptions = {}): string {
  const plain = opts.numbers === "plain";
  const lines = [
    "% Overlap summary written by axband; needs \\usepackage{booktabs}" + (plain ? "" : " and \\usepackage{siunitx}"),
    "\\begin{tabular}{lllllrrl}",
    "\\toprule",
    "Model & Curve & Verdict & Mass range & Share of range & Share of area & Intervals & $E/N$ covered \\\\",
    "\\midrule",
  ];
  for (const r of rows) {
    const v = rowView(r);
    const unit = plain ? `\\,${v.unit.math}` : "";
    const range = plain
      ? `$${number(v.range[0], true)}$--$${number(v.range[1], true)}${unit}$`
      : `\\SIrange{${v.range[0]}}{${v.range[1]}}{${v.unit.si}}`;
    const cells = [
      latexEscape(r.modelLabel),
      latexEscape(r.curveLabel),
      latexEscape(v.verdict),
      range,
      percentCell(v.share, plain),
      percentCell(v.areaShare, plain),
      plain ? `$${r.intervalCount}$` : `\\num{${r.intervalCount}}`,
      latexEscape(v.eOverN),
    ];
    lines.push(`${cells.join(" & ")} \\\\`);
  }
  lines.push("\\bottomrule", "\\end{tabular}");
  return lines.join("\n") + "\n";
}
