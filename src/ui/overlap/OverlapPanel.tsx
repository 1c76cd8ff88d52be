// The overlap table panel: one summary row per overlapping visible model × curve (from the overlap worker), rows
// that expand to their intervals and highlight them on the figure, exports and a caption.
import { useMemo, useState } from "react";
import { useOverlapSummary } from "./overlap-client";
import { useAxband } from "../store";
import { IntervalList } from "./IntervalList";
import { OverlapExports } from "./OverlapExports";
import { OverlapFilters, type Filters } from "./OverlapFilters";
import { SummaryTable } from "./SummaryTable";
import { useRowHighlight } from "./useRowHighlight";
import { rowKey, visibleRows, type SortState } from "./summary-logic";
import "../curves/curves.css";
import "./overlap.css";

const NO_FILTERS: Filters = { modelId: null, curveId: null, showNone: false, mergeGaps: false };

/** The overlap table panel. */
export function OverlapPanel() {
  const models = useAxband((s) => s.project.models);
  const curves = useAxband((s) => s.project.curves);
  const physics = useAxband((s) => s.project.physics);
  const [sort, setSort] = useState<SortState | null>(null);
  const [filters, setFilters] = useState<Filters>(NO_FILTERS);
  const [expanded, setExpanded] = useState<string | null>(null);
  const { selectedKey, select, pickedIn, clearPick } = useRowHighlight();
  const { rows, pending } = useOverlapSummary(models, curves, physics, filters.mergeGaps);
  const shown = useMemo(() => visibleRows(rows, { ...filters, sort }), [rows, filters, sort]);
  const overlapping = rows.filter((r) => r.verdict !== "none").length;
  const open = shown.find((r) => rowKey(r) === expanded) ?? null;

  return (
    <section className="ax-panel ax-overlap" aria-labelledby="ax-overlap-title">
      <div className="ax-overlap-head">
        <h2 id="ax-overlap-title">Overlap table</h2>
        <span className="ax-hint" aria-live="polite">
          {pending ? "updating… · " : ""}
          {overlapping} of {rows.length} model × curve pairs overlap
          {shown.length !== overlapping ? ` · ${shown.length} shown` : ""}
        </span>
      </div>
      {rows.length === 0 ? (
        <p className="ax-empty">
          Add a model and import a curve (both shown) to see where the model is excluded or within reach.
        </p>
      ) : (
        <>
          <OverlapFilters rows={rows} filters={filters} onChange={(c) => setFilters({ ...filters, ...c })} />
          <SummaryTable
            rows={shown}
            sort={sort}
            onSort={setSort}
            expandedKey={expanded}
            selectedKey={selectedKey}
            onExpand={(r) => {
              setExpanded(expanded === rowKey(r) ? null : rowKey(r));
              clearPick();
            }}
            onSelect={(r) => select(r, null)}
          />
          {open ? (
            <IntervalList
              row={open}
              id="ax-overlap-intervals"
              selected={pickedIn(open)}
              onPick={(i) => select(open, i)}
            />
          ) : null}
          <OverlapExports rows={shown} />
          <p className="ax-hint">
            Click a row to highlight its intervals on the figure, or an interval in the expanded list for that one.
            Curves are interpolated linearly in log–log between their points; gaps between samples are never bridged
            silently, and nothing is claimed outside a curve&apos;s mass range.
          </p>
        </>
      )}
    </section>
  );
}
