// The overlap summary (and its intervals) written by the renderer: the format follows the file's extension.
import { overlapSummary } from "../analysis/overlap-summary";
import { projectConstants } from "../analysis/overlap-table";
import { markdownTextCell } from "../analysis/table-cells";
import {
  intervalsToCsv,
  intervalsToMarkdown,
  summaryCaption,
  summaryToCsv,
  summaryToMarkdown,
} from "../formats/overlap/exports";
import { summaryToLatex } from "../formats/overlap/latex";
import type { Project } from "../project/types";

/** "csv", "md" or "tex" from a path, or an error naming the accepted extensions. */
export function overlapFormat(flag: string, path: string, tex: boolean): "csv" | "md" | "tex" | string {
  const ext = /\.([a-z]+)$/i.exec(path)?.[1]?.toLowerCase();
  if (ext === "csv") return "csv";
  if (ext === "md" || ext === "markdown") return "md";
  if (ext === "tex" && tex) return "tex";
  return `${flag}: expected a file ending in .csv, .md${tex ? " or .tex" : ""}, got "${path}"`;
}

/** The text of the summary (rows that overlap, strongest first) and of its intervals, and a one-line report. */
export function overlapOutputs(project: Project, summaryPath?: string, intervalsPath?: string) {
  const rows = overlapSummary(project).filter((r) => r.verdict !== "none");
  const out: { path: string; data: string; report: string }[] = [];
  if (summaryPath) {
    const f = overlapFormat("--overlap", summaryPath, true);
    const data =
      f === "csv"
        ? summaryToCsv(rows)
        : f === "tex"
          ? summaryToLatex(rows)
          : `${summaryToMarkdown(rows)}\n${markdownTextCell(summaryCaption(rows, projectConstants(project)))}\n`;
    out.push({ path: summaryPath, data, report: `wrote ${summaryPath} (${rows.length} overlap row(s))` });
  }
  if (intervalsPath) {
    const f = overlapFormat("--overlap-intervals", intervalsPath, false);
    const data =
      f === "csv"
        ? intervalsToCsv(rows)
        : rows
            .map((r) => `### ${markdownTextCell(`${r.modelLabel} × ${r.curveLabel}`)}\n\n${intervalsToMarkdown(r)}`)
            .join("\n");
    const n = rows.reduce((s, r) => s + r.intervals.count, 0);
    out.push({ path: intervalsPath, data, report: `wrote ${intervalsPath} (${n} interval(s))` });
  }
  return out;
}
