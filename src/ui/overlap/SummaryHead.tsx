// The overlap table's column headers: the sortable ones are buttons that cycle ascending, descending and the
// default order (strongest verdict first), announced through aria-sort.
import { nextSort, type SortKey, type SortState } from "./summary-logic";

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

export function SummaryHead({ sort, onSort }: { sort: SortState | null; onSort: (s: SortState | null) => void }) {
  return (
    <thead>
      <tr>
        {COLUMNS.map(({ key, label, title }) => {
          const active = key !== null && sort?.key === key;
          return (
            <th
              key={label}
              scope="col"
              title={title}
              aria-sort={active ? (sort?.dir === 1 ? "ascending" : "descending") : undefined}
            >
              {key ? (
                <button type="button" className="ax-sort" onClick={() => onSort(nextSort(sort, key))}>
                  {label}
                  <span aria-hidden="true" className="ax-sort-mark">
                    {active ? (sort?.dir === 1 ? "▲" : "▼") : ""}
                  </span>
                </button>
              ) : (
                label
              )}
            </th>
          );
        })}
      </tr>
    </thead>
  );
}
