// Which summary row (and which of its intervals) is marked on the figure: the store's highlight holds the marked
// intervals; a second click on the marked row clears it.
import { useState } from "react";
import type { OverlapSummaryRow } from "../../analysis/overlap-summary";
import { useAxband } from "../store";
import { rowKey } from "./summary-logic";

/** The row's intervals to mark (bridged gaps left out), or only interval `only`. */
function intervalsOf(r: OverlapSummaryRow, only: number | null): [number, number][] {
  const l = r.intervals;
  if (only !== null) return [[l.lo[only], l.hi[only]]];
  const out: [number, number][] = [];
  for (let i = 0; i < l.count; i++) if (!l.bridged[i]) out.push([l.lo[i], l.hi[i]]);
  return out;
}

export function useRowHighlight() {
  const highlight = useAxband((s) => s.ui.highlight);
  const setHighlight = useAxband((s) => s.setHighlight);
  const [picked, setPicked] = useState<number | null>(null);
  const selectedKey =
    highlight?.modelId && highlight.curveId ? rowKey(highlight as { modelId: string; curveId: string }) : null;

  /** Marks the row's intervals (or interval `only`); the marked row clicked again is unmarked. */
  const select = (r: OverlapSummaryRow, only: number | null) => {
    if (only === null && selectedKey === rowKey(r) && picked === null) {
      setHighlight(null);
      return;
    }
    const ivs = intervalsOf(r, only);
    setPicked(only);
    setHighlight({
      massMinEv: ivs.length ? ivs[0][0] : r.massRangeEv[0],
      massMaxEv: ivs.length ? ivs[ivs.length - 1][1] : r.massRangeEv[1],
      modelId: r.modelId,
      curveId: r.curveId,
      intervalsEv: ivs,
    });
  };
  /** The interval marked in row r, if r is the marked row and one interval was picked. */
  const pickedIn = (r: OverlapSummaryRow) => (selectedKey === rowKey(r) ? picked : null);
  return { selectedKey, select, pickedIn, clearPick: () => setPicked(null) };
}
