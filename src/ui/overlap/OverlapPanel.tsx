// The overlap table: for every visible model × visible curve, the mass intervals where the curve excludes,
// reaches or contains the whole model band, part of it, or none of it (computed by the data core, memoised
// on the models, curves and constants). Strongest verdict first by default, sorting by column, filters, CSV
// and Markdown export (rows in the order shown), and a click on a row highlights its interval on the figure.
import { useMemo, useState } from "react";
import { overlapTableToCsv, overlapTableToMarkdown, type OverlapRow } from "../../data";
import { useOverlapRows } from "./overlap-client";
import { siFormat, sciFormat } from "../format";
import { useAxband } from "../store";
import { downloadText, safeFileName } from "../export/download";
import { copyText } from "../share/clipboard";
import {
  filterRows,
  nextSort,
  NO_FILTER,
  rowKey,
  sortRows,
  VERDICT_GROUPS,
  verdictText,
  type RowFilter,
  type SortKey,
  type SortState,
} from "./table-logic";
import { ChoiceField, type Choice } from "../layout/ChoiceField";
import "../curves/curves.css";
import "./overlap.css";

/** Filter choices: "all" (the empty value) first, then the entries. */
function withAll(entries: [string, string][]): Choice[] {
  return [{ value: "", label: "all" }, ...entries.map(([value, label]) => ({ value, label }))];
}
const VERDICT_CHOICES: Choice[] = [{ value: "", label: "all" }, ...VERDICT_GROUPS];

const COLUMNS: { key: SortKey | null; label: string; title?: string }[] = [
  { key: "model", label: "Model" },
  { key: "curve", label: "Curve" },
  { key: "role", label: "Role" },
  { key: "verdict", label: "Verdict" },
  { key: "mass", label: "m_a range", title: "Axion mass interval" },
  { key: "fa", label: "f_a range (GeV)", title: "Decay constant interval (f_a falls as m_a grows)" },
  { key: "freq", label: "Frequency", title: "Photon frequency ν = m_a/h" },
  { key: null, label: "E/N excluded", title: "For a partial overlap: the E/N values of the band that are affected" },
  { key: null, label: "Notes" },
];

/** Rows drawn before "Show all" (a wiggly million-point curve can give hundreds of intervals). */
const ROWS_SHOWN = 100;

function range(lo: number, hi: number, fmt: (v: number) => string): string {
  return `${fmt(lo)} – ${fmt(hi)}`;
}

function eOverNText(r: OverlapRow): string {
  const pieces = r.eOverNSubs ?? (r.eOverNSub ? [r.eOverNSub] : []);
  if (pieces.length === 0) return "";
  return pieces.map(([a, b]) => (a === b ? sciFormat(a) : `${sciFormat(a)} … ${sciFormat(b)}`)).join(" and ");
}

/** The overlap table panel. */
export function OverlapPanel() {
  const models = useAxband((s) => s.project.models);
  const curves = useAxband((s) => s.project.curves);
  const physics = useAxband((s) => s.project.physics);
  const highlight = useAxband((s) => s.ui.highlight);
  const setHighlight = useAxband((s) => s.setHighlight);
  const pushMessage = useAxband((s) => s.pushMessage);
  const projectName = useAxband((s) => s.project.name);
  const [sort, setSort] = useState<SortState | null>(null);
  const [filter, setFilter] = useState<RowFilter>(NO_FILTER);

  const [showAll, setShowAll] = useState(false);
  // Only models, curves and constants change the table; the figure (zoom, preset) does not.
  const { rows, pending } = useOverlapRows(models, curves, physics);
  const shown = useMemo(() => sortRows(filterRows(rows, filter), sort), [rows, filter, sort]);
  const modelChoices = useMemo(
    () => withAll([...new Map(rows.map((r) => [r.modelId, r.modelLabel])).entries()]),
    [rows],
  );
  const curveChoices = useMemo(
    () => withAll([...new Map(rows.map((r) => [r.curveId, r.curveLabel])).entries()]),
    [rows],
  );
  const base = safeFileName(projectName === "Untitled" ? "axband" : projectName, "axband");

  const selectedKey =
    highlight &&
    shown.find(
      (r) =>
        r.massMinEv === highlight.massMinEv &&
        r.massMaxEv === highlight.massMaxEv &&
        r.modelId === highlight.modelId &&
        r.curveId === highlight.curveId,
    );

  const visibleModels = models.filter((m) => m.visible).length;
  const visibleCurves = curves.filter((c) => c.visible).length;

  return (
    <section className="ax-panel ax-overlap" aria-labelledby="ax-overlap-title">
      <div className="ax-overlap-head">
        <h2 id="ax-overlap-title">Overlap table</h2>
        <span className="ax-hint" aria-live="polite">
          {pending ? "updating… · " : ""}
          {shown.length === rows.length ? `${rows.length} rows` : `${shown.length} of ${rows.length} rows`} ·{" "}
          {visibleModels} model{visibleModels === 1 ? "" : "s"} × {visibleCurves} curve{visibleCurves === 1 ? "" : "s"}
        </span>
      </div>
      {rows.length === 0 ? (
        <p className="ax-empty">
          {visibleModels === 0 || visibleCurves === 0
            ? "Add a model and import a curve (both shown) to see where the model is excluded or within reach."
            : "No usable overlap: the curves have fewer than two usable points, or no model E/N could be read."}
        </p>
      ) : (
        <>
          <div className="ax-overlap-tools">
            <ChoiceField
              label="Model"
              ariaLabel="Filter by model"
              value={filter.modelId ?? ""}
              choices={modelChoices}
              onChange={(v) => setFilter({ ...filter, modelId: v || null })}
            />
            <ChoiceField
              label="Curve"
              ariaLabel="Filter by curve"
              value={filter.curveId ?? ""}
              choices={curveChoices}
              onChange={(v) => setFilter({ ...filter, curveId: v || null })}
            />
            <ChoiceField
              label="Verdict"
              ariaLabel="Filter by verdict"
              value={filter.verdict ?? ""}
              choices={VERDICT_CHOICES}
              onChange={(v) => setFilter({ ...filter, verdict: v || null })}
            />
            <span className="ax-overlap-export">
              <button
                type="button"
                data-testid="overlap-csv"
                onClick={() => downloadText(`${base}-overlap.csv`, overlapTableToCsv(shown), "text/csv")}
              >
                CSV
              </button>
              <button
                type="button"
                data-testid="overlap-md"
                onClick={() => downloadText(`${base}-overlap.md`, overlapTableToMarkdown(shown), "text/markdown")}
              >
                Markdown
              </button>
              <button
                type="button"
                data-testid="overlap-copy-md"
                onClick={() =>
                  void copyText(overlapTableToMarkdown(shown)).then((ok) =>
                    pushMessage(
                      ok ? "status" : "alert",
                      ok
                        ? "Overlap table copied as Markdown."
                        : "The browser gave no clipboard access; use the Markdown download instead.",
                    ),
                  )
                }
              >
                Copy Markdown
              </button>
            </span>
          </div>
          <div className="ax-overlap-scroll">
            <table className="ax-overlap-table" data-testid="overlap-table">
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
                {(showAll ? shown : shown.slice(0, ROWS_SHOWN)).map((r) => {
                  const key = rowKey(r);
                  const selected = selectedKey ? rowKey(selectedKey) === key : false;
                  return (
                    <tr
                      key={key}
                      className={`ax-kind-${r.kind}${selected ? " ax-selected" : ""}`}
                      aria-selected={selected}
                      tabIndex={0}
                      onClick={() =>
                        setHighlight(
                          selected
                            ? null
                            : {
                                massMinEv: r.massMinEv,
                                massMaxEv: r.massMaxEv,
                                modelId: r.modelId,
                                curveId: r.curveId,
                              },
                        )
                      }
                      onKeyDown={(e) => {
                        if (e.key === "Enter" || e.key === " ") {
                          e.preventDefault();
                          setHighlight(
                            selected
                              ? null
                              : {
                                  massMinEv: r.massMinEv,
                                  massMaxEv: r.massMaxEv,
                                  modelId: r.modelId,
                                  curveId: r.curveId,
                                },
                          );
                        }
                      }}
                    >
                      <td>{r.modelLabel}</td>
                      <td>{r.curveLabel}</td>
                      <td>{r.role}</td>
                      <td>
                        <span className={`ax-verdict ax-verdict-${r.kind.split("-")[0]}`}>{verdictText(r.kind)}</span>
                      </td>
                      <td className="ax-num">{range(r.massMinEv, r.massMaxEv, (v) => siFormat(v, "eV"))}</td>
                      <td className="ax-num">{range(r.faMinGeV, r.faMaxGeV, (v) => sciFormat(v))}</td>
                      <td className="ax-num">{range(r.freqMinHz, r.freqMaxHz, (v) => siFormat(v, "Hz"))}</td>
                      <td className="ax-num">{eOverNText(r)}</td>
                      <td className="ax-note">{r.note}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
          {shown.length > ROWS_SHOWN ? (
            <p className="ax-hint">
              Showing {showAll ? "all" : `the first ${ROWS_SHOWN}`} of {shown.length} rows (the exports always hold all
              of them).{" "}
              <button type="button" onClick={() => setShowAll(!showAll)}>
                {showAll ? `Show the first ${ROWS_SHOWN}` : "Show all"}
              </button>
            </p>
          ) : null}
          <p className="ax-hint">
            Click a row to highlight its interval on the figure. Curves are interpolated linearly in log–log between
            their points; nothing is claimed outside a curve&apos;s mass range.
          </p>
        </>
      )}
    </section>
  );
}
