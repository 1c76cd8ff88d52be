// The overlap summary as a table (data-testid="overlap-table"): sortable headers and one row per model × curve.
import type { OverlapSummaryRow } from "../../analysis/overlap-summary";
import { SummaryHead } from "./SummaryHead";
import { SummaryRow } from "./SummaryRow";
import { rowKey, type SortState } from "./summary-logic";

export function SummaryTable(props: {
  rows: OverlapSummaryRow[];
  sort: SortState | null;
  onSort: (s: SortState | null) => void;
  expandedKey: string | null;
  selectedKey: string | null;
  onExpand: (r: OverlapSummaryRow) => void;
  onSelect: (r: OverlapSummaryRow) => void;
}) {
  return (
    <div className="ax-overlap-scroll">
      <table className="ax-overlap-table" data-testid="overlap-table">
        <caption className="visually-hidden">
          One row per model and curve; strongest verdict first. Use a row&apos;s details button to list its intervals.
        </caption>
        <SummaryHead sort={props.sort} onSort={props.onSort} />
        <tbody>
          {props.rows.map((r) => (
            <SummaryRow
              key={rowKey(r)}
              r={r}
              expanded={props.expandedKey === rowKey(r)}
              selected={props.selectedKey === rowKey(r)}
              onExpand={() => props.onExpand(r)}
              onSelect={() => props.onSelect(r)}
            />
          ))}
        </tbody>
      </table>
    </div>
  );
}
