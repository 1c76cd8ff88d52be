// Sorting and filtering of overlap summary rows for the panel (the rows come from the analysis core, already in
// the default order: strongest verdict first, then by share). Pure, so the component stays small and testable.
import { compareSummary, summaryRank, type OverlapSummaryRow } from "../../analysis/overlap-summary";

export type SortKey = "model" | "curve" | "verdict" | "share" | "area" | "count";
export interface SortState {
  key: SortKey;
  dir: 1 | -1;
}

function compare(a: OverlapSummaryRow, b: OverlapSummaryRow, key: SortKey): number {
  switch (key) {
    case "model":
      return a.modelLabel.localeCompare(b.modelLabel);
    case "curve":
      return a.curveLabel.localeCompare(b.curveLabel);
    case "verdict":
      return summaryRank(a.verdict) - summaryRank(b.verdict);
    case "share":
      return a.shareAny - b.shareAny;
    case "area":
      return (a.areaShare ?? -1) - (b.areaShare ?? -1);
    case "count":
      return a.intervalCount - b.intervalCount;
  }
}

/** Rows to show: those that overlap (all with `showNone`), by model and curve, sorted (null: default order). */
export function visibleRows(
  rows: readonly OverlapSummaryRow[],
  opts: { showNone: boolean; modelId: string | null; curveId: string | null; sort: SortState | null },
): OverlapSummaryRow[] {
  const kept = rows.filter(
    (r) =>
      (opts.showNone || r.verdict !== "none") &&
      (opts.modelId === null || r.modelId === opts.modelId) &&
      (opts.curveId === null || r.curveId === opts.curveId),
  );
  const sort = opts.sort;
  if (!sort) return kept.sort(compareSummary);
  return kept.sort((a, b) => sort.dir * compare(a, b, sort.key) || compareSummary(a, b));
}

/** Next sort state after a click on a column header: ascending, descending, then the default order. */
export function nextSort(current: SortState | null, key: SortKey): SortState | null {
  if (!current || current.key !== key) return { key, dir: 1 };
  return current.dir === 1 ? { key, dir: -1 } : null;
}

/** A stable key for a row. */
export function rowKey(r: Pick<OverlapSummaryRow, "modelId" | "curveId">): string {
  return `${r.modelId}|${r.curveId}`;
}
