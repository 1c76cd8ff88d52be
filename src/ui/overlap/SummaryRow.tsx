// One summary row of the overlap table: the expand button, the model (a button that highlights the row's
// intervals on the figure), the curve, the verdict and the display numbers shared with the exports.
import type { OverlapSummaryRow } from "../../analysis/overlap-summary";
import { rowView } from "../../formats/overlap/view";

export function SummaryRow(props: {
  r: OverlapSummaryRow;
  expanded: boolean;
  selected: boolean;
  onExpand: () => void;
  onSelect: () => void;
}) {
  const { r } = props;
  const v = rowView(r);
  const u = v.unit.name;
  return (
    <tr
      className={`ax-kind-${r.verdict}${props.selected ? " ax-selected" : ""}`}
      aria-selected={props.selected}
      onClick={props.onSelect}
    >
      <td>
        <button
          type="button"
          data-testid="overlap-expand"
          aria-expanded={props.expanded}
          aria-controls={props.expanded ? "ax-overlap-intervals" : undefined}
          aria-label={`${props.expanded ? "Hide" : "List"} the ${r.intervalCount} intervals of ${r.modelLabel} × ${r.curveLabel}`}
          onClick={(e) => {
            e.stopPropagation();
            props.onExpand();
          }}
        >
          {props.expanded ? "▾" : "▸"}
        </button>
      </td>
      <td>
        <button
          type="button"
          className="ax-linkish"
          aria-pressed={props.selected}
          title="Highlight this row's intervals on the figure"
          onClick={(e) => {
            e.stopPropagation();
            props.onSelect();
          }}
        >
          {r.modelLabel}
        </button>
      </td>
      <td>{r.curveLabel}</td>
      <td>
        <span className={`ax-verdict ax-verdict-${r.verdict.split("-")[0]}`}>{v.verdict}</span>
      </td>
      <td className="ax-num">
        {v.range[0]}–{v.range[1]} {u}
      </td>
      <td className="ax-num">{v.shareWhole ? `${v.share} (whole band ${v.shareWhole})` : v.share}</td>
      <td className="ax-num">{v.areaShare}</td>
      <td className="ax-num">
        {r.intervalCount}
        {r.bridgedCount > 0 ? ` (+${r.bridgedCount} bridged)` : ""}
      </td>
      <td className="ax-num">{v.widest ? `${v.widest[0]}–${v.widest[1]} ${u}` : "—"}</td>
      <td className="ax-num">{v.eOverN}</td>
    </tr>
  );
}
