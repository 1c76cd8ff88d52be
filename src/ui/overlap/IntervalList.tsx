// The intervals of one summary row as a windowed list: only the rows in view (plus a margin) are in the DOM.
import { useState } from "react";
import type { OverlapSummaryRow } from "../../analysis/overlap-summary";
import { intervalView, rowView } from "../../formats/overlap/view";

const ROW_PX = 26;
const VIEW_PX = 260;
const MARGIN = 8;

// Hand-written (about 60 lines): the list has a fixed row height, which is the whole of what a virtualisation
// library would add here.
export function IntervalList(props: {
  row: OverlapSummaryRow;
  id: string;
  selected: number | null;
  onPick: (i: number) => void;
}) {
  const { row } = props;
  const [top, setTop] = useState(0);
  const view = rowView(row);
  const n = row.intervals.count;
  const first = Math.max(0, Math.floor(top / ROW_PX) - MARGIN);
  const last = Math.min(n, Math.ceil((top + VIEW_PX) / ROW_PX) + MARGIN);
  const items = [];
  for (let i = first; i < last; i++) {
    const iv = intervalView(row, view, i);
    items.push(
      <div role="row" aria-rowindex={i + 2} key={i} className="ax-iv-row" style={{ top: i * ROW_PX }}>
        <span role="cell" className="ax-num">
          <button
            type="button"
            aria-pressed={props.selected === i}
            onClick={() => props.onPick(i)}
            title="Highlight this interval on the figure"
          >
            {iv.lo}–{iv.hi} {view.unit.name}
          </button>
        </span>
        <span role="cell">{iv.kind}</span>
        <span role="cell">{iv.members ? `${iv.eOverN} (${iv.members} models)` : `E/N ${iv.eOverN}`}</span>
      </div>,
    );
  }
  return (
    <div
      id={props.id}
      role="table"
      aria-label={`Intervals of ${row.modelLabel} × ${row.curveLabel}`}
      aria-rowcount={n + 1}
      className="ax-iv"
      data-testid="overlap-intervals"
    >
      <div role="rowgroup">
        <div role="row" aria-rowindex={1} className="ax-iv-head">
          <span role="columnheader">Mass interval</span>
          <span role="columnheader">Kind</span>
          <span role="columnheader">E/N covered</span>
        </div>
      </div>
      <div
        role="rowgroup"
        className="ax-iv-scroll"
        style={{ height: Math.min(VIEW_PX, n * ROW_PX) }}
        onScroll={(e) => setTop(e.currentTarget.scrollTop)}
      >
        <div style={{ height: n * ROW_PX, position: "relative" }}>{items}</div>
      </div>
    </div>
  );
}
