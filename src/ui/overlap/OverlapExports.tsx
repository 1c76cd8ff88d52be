// Exports of the overlap summary as shown: CSV (summary and intervals), Markdown, LaTeX (siunitx or plain math),
// and the caption paragraph with a copy button; every control is a labelled button or field.
import { useMemo, useState } from "react";
import type { OverlapSummaryRow } from "../../analysis/overlap-summary";
import { projectConstants } from "../../analysis/overlap-table";
import { intervalsToCsv, summaryCaption, summaryToCsv, summaryToMarkdown } from "../../formats/overlap/exports";
import { summaryToLatex } from "../../formats/overlap/latex";
import { useAxband } from "../store";
import { downloadText } from "../export/download";
import { fileBaseName } from "../export/file-base-name";
import { copyText } from "../share/clipboard";

export function OverlapExports({ rows }: { rows: OverlapSummaryRow[] }) {
  const project = useAxband((s) => s.project);
  const pushMessage = useAxband((s) => s.pushMessage);
  const [plain, setPlain] = useState(false);
  const base = fileBaseName(project, "axband");
  const physics = project.physics;
  // The caption reads every row: build it when the rows or the constants change, not on every edit elsewhere.
  const caption = useMemo(() => summaryCaption(rows, projectConstants({ physics })), [rows, physics]);
  const copy = (text: string, what: string) =>
    void copyText(text).then((ok) =>
      pushMessage(
        ok ? "status" : "alert",
        ok ? `${what} copied.` : "The browser gave no clipboard access; use the download instead.",
      ),
    );
  const latex = () => summaryToLatex(rows, { numbers: plain ? "plain" : "siunitx" });
  return (
    <div className="ax-overlap-exports" role="group" aria-label="Export the overlap table">
      <span className="ax-overlap-export">
        <button
          type="button"
          data-testid="overlap-csv"
          onClick={() => downloadText(`${base}-overlap.csv`, summaryToCsv(rows), "text/csv")}
        >
          CSV
        </button>
        <button
          type="button"
          data-testid="overlap-intervals-csv"
          onClick={() => downloadText(`${base}-overlap-intervals.csv`, intervalsToCsv(rows), "text/csv")}
        >
          Intervals CSV
        </button>
        <button
          type="button"
          data-testid="overlap-md"
          onClick={() => downloadText(`${base}-overlap.md`, summaryToMarkdown(rows), "text/markdown")}
        >
          Markdown
        </button>
        <button
          type="button"
          data-testid="overlap-latex"
          onClick={() => downloadText(`${base}-overlap.tex`, latex(), "application/x-tex")}
        >
          LaTeX
        </button>
        <button type="button" data-testid="overlap-copy-latex" onClick={() => copy(latex(), "LaTeX table")}>
          Copy LaTeX
        </button>
        <label className="ax-field ax-check">
          <input type="checkbox" checked={plain} onChange={(e) => setPlain(e.target.checked)} />
          <span>LaTeX numbers as plain math (no siunitx)</span>
        </label>
      </span>
      <p className="ax-overlap-caption">
        <span id="ax-overlap-caption-label">Caption: </span>
        <output data-testid="overlap-caption" aria-labelledby="ax-overlap-caption-label">
          {caption}
        </output>{" "}
        <button type="button" onClick={() => copy(caption, "Caption")}>
          Copy caption
        </button>
      </p>
    </div>
  );
}
