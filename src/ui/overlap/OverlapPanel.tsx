// The overlap table: one summary row per visible model × curve that overlap (computed in the overlap worker), with
// its verdict, shares, interval count, widest interval and E/N; a row expands to its intervals (windowed list);
// a click highlights the row's intervals (or one of them) on the figure; exports and a caption for a paper.
import { useMemo, useState } from "react";
import type { OverlapSummaryRow } from "../../analysis/overlap-summary";
import { useOverlapSummary } from "./overlap-client";
import { useAxband } from "../store";
import { rowView } from "../../formats/overlap/view";
import { IntervalList } from "./IntervalList";
import { OverlapExports } from "./OverlapExports";
import { nextSort, rowKey, visibleRows, type SortKey, type SortState } from "./summary-logic";
import { ChoiceField, type Choice } from "../layout/ChoiceField";
import "../curves/curves.css";
import "./overlap.css";

const COLUMNS: { key: SortKey | null; label: string; title?: string }[] = [
  { key: null, label: "Details" },
  { key: "model", label: "Model" },
  { key: "curve", label: "Curve" },
  { key: "verdict", label: "Verdict" },
  { key: null, label: "Mass range", title: "Where the curve has data" },
  { key: "share", label: "Share of range", title: "Share of the mass range (log m_a) covered" },
  { key: "area", label: "Share of band area", title: "Share of the band's area in log m_a × log g covered" },
  { key: "count", label: "Intervals", title: "Separate covered intervals" },
  { key: null, label: "Widest" },
  { key: null, label: "E/N covered", title: "E/N covered at the best point; all = the whole band" },
];

function withAll(entries: [string, string][]): Choice[] {
  return [{ value: "", label: "all" }, ...entries.map(([value, label]) => ({ value, label }))];
}

function intervalsOf(r: OverlapSummaryRow, only: number | null): [number, number][] {
  const l = r.intervals;
  if (only !== null) return [[l.lo[only], l.hi[only]]];
  const out: [number, number][] = [];
  for (let i = 0; i < l.count; i++) if (!l.bridged[i]) out.push([l.lo[i], l.hi[i]]);
  return out;
}

function SummaryRow(props: {
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

/** The overlap table panel. */
export function OverlapPanel() {
  const models = useAxband((s) => s.project.models);
  const curves = useAxband((s) => s.project.curves);
  const physics = useAxband((s) => s.project.physics);
  const highlight = useAxband((s) => s.ui.highlight);
  const setHighlight = useAxband((s) => s.setHighlight);
  const [sort, setSort] = useState<SortState | null>(null);
  const [showNone, setShowNone] = useState(false);
  const [mergeGaps, setMergeGaps] = useState(false);
  const [modelId, setModelId] = useState<string | null>(null);
  const [curveId, setCurveId] = useState<string | null>(null);
  const [expanded, setExpanded] = useState<string | null>(null);
  const [picked, setPicked] = useState<number | null>(null);
  const { rows, pending } = useOverlapSummary(models, curves, physics, mergeGaps);
  const shown = useMemo(
    () => visibleRows(rows, { showNone, modelId, curveId, sort }),
    [rows, showNone, modelId, curveId, sort],
  );
  const modelChoices = useMemo(() => withAll([...new Map(rows.map((r) => [r.modelId, r.modelLabel]))]), [rows]);
  const curveChoices = useMemo(() => withAll([...new Map(rows.map((r) => [r.curveId, r.curveLabel]))]), [rows]);
  const overlapping = rows.filter((r) => r.verdict !== "none").length;
  const selectedKey =
    highlight?.modelId && highlight.curveId ? rowKey(highlight as { modelId: string; curveId: string }) : null;
  const open = shown.find((r) => rowKey(r) === expanded) ?? null;

  const select = (r: OverlapSummaryRow, only: number | null) => {
    const key = rowKey(r);
    if (only === null && selectedKey === key && picked === null) {
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
          <div className="ax-overlap-tools">
            <ChoiceField
              label="Model"
              ariaLabel="Filter by model"
              value={modelId ?? ""}
              choices={modelChoices}
              onChange={(v) => setModelId(v || null)}
            />
            <ChoiceField
              label="Curve"
              ariaLabel="Filter by curve"
              value={curveId ?? ""}
              choices={curveChoices}
              onChange={(v) => setCurveId(v || null)}
            />
            <label className="ax-field ax-check">
              <input type="checkbox" checked={showNone} onChange={(e) => setShowNone(e.target.checked)} />
              <span>also pairs without overlap</span>
            </label>
            <label
              className="ax-field ax-check"
              title="Gaps narrower than one curve sample are listed as bridged, never counted as excluded"
            >
              <input type="checkbox" checked={mergeGaps} onChange={(e) => setMergeGaps(e.target.checked)} />
              <span>mark one-sample gaps as bridged</span>
            </label>
          </div>
          <div className="ax-overlap-scroll">
            <table className="ax-overlap-table" data-testid="overlap-table">
              <caption className="visually-hidden">
                One row per model and curve; strongest verdict first. Use a row&apos;s details button to list its
                intervals.
              </caption>
              <thead>
                <tr>
                  {COLUMNS.map((c) => {
                    const active = c.key !== null && sort?.key === c.key;
                    return (
                      <th
                        key={c.label}
                        scope="col"
                        title={c.title}
                        aria-sort={active ? (sort?.dir === 1 ? "ascending" : "descending") : undefined}
                      >
                        {c.key ? (
                          <button
                            type="button"
                            className="ax-sort"
                            onClick={() => setSort(nextSort(sort, c.key as SortKey))}
                          >
                            {c.label}
                            <span aria-hidden="true" className="ax-sort-mark">
                              {active ? (sort?.dir === 1 ? "▲" : "▼") : ""}
                            </span>
                          </button>
                        ) : (
                          c.label
                        )}
                      </th>
                    );
                  })}
                </tr>
              </thead>
              <tbody>
                {shown.map((r) => (
                  <SummaryRow
                    key={rowKey(r)}
                    r={r}
                    expanded={expanded === rowKey(r)}
                    selected={selectedKey === rowKey(r)}
                    onExpand={() => {
                      setExpanded(expanded === rowKey(r) ? null : rowKey(r));
                      setPicked(null);
                    }}
                    onSelect={() => select(r, null)}
                  />
                ))}
              </tbody>
            </table>
          </div>
          {open ? (
            <IntervalList
              row={open}
              id="ax-overlap-intervals"
              selected={selectedKey === rowKey(open) ? picked : null}
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
