// The catalogue picker: KSVZ-type and DFSZ-type models with E/N and N_DW from the anomaly calculator; "Add"
// makes a model, and the ticked entries together make one model set.
import { useMemo, useState } from "react";
import { newModelSet } from "../../project/defaults";
import { catalogue, type CatalogueEntry } from "../../physics/catalogue";
import { tryAnomaly } from "../../physics/anomaly";
import { toFractionString } from "../../physics/rational";
import { useAxband } from "../store";
import { fermionSummary, minus } from "../format";

export interface CatalogueRow {
  entry: CatalogueEntry;
  /** E/N as an exact fraction string, or null when the calculator gives none. */
  eOverN: string | null;
  domainWall: string | null;
}

/** The catalogue with E/N and N_DW of each entry, computed once. */
export function catalogueRows(): CatalogueRow[] {
  return catalogue().map((entry) => {
    const r = tryAnomaly(entry.fermions, { scalarCharge: entry.scalarCharge });
    const res = r.ok ? r.result : null;
    return {
      entry,
      eOverN: res?.eOverN ? toFractionString(res.eOverN) : null,
      domainWall: res?.domainWallExact ? toFractionString(res.domainWallExact) : null,
    };
  });
}

let cached: CatalogueRow[] | null = null;
/** {@link catalogueRows}, memoised for the session (the catalogue is fixed). */
export function useCatalogueRows(): CatalogueRow[] {
  return useMemo(() => (cached ??= catalogueRows()), []);
}

const GROUPS: { id: CatalogueEntry["group"]; title: string }[] = [
  { id: "ksvz", title: "KSVZ-type (heavy quarks)" },
  { id: "dfsz", title: "DFSZ-type (two Higgs doublets)" },
];

/** Terms of a Lagrangian as code, separated by commas. */
function TermList({ terms }: { terms: readonly string[] }) {
  return terms.map((t, k) => (
    <span key={k}>
      {k > 0 ? ", " : null}
      <code>{t}</code>
    </span>
  ));
}

/** One entry, opened: its fermions, the Lagrangian its charges follow from, X_S and N_DW. */
function EntryDetails({ row, group }: { row: CatalogueRow; group: CatalogueEntry["group"] }) {
  const { entry } = row;
  return (
    <details>
      <summary title={entry.note}>
        <span className="catalogue-label">
          {group === "ksvz" ? entry.label.replace(/^KSVZ-type /, "") : entry.label}
        </span>
        <span className="catalogue-eovern">E/N = {row.eOverN ? minus(row.eOverN) : "undefined"}</span>
      </summary>
      <div className="catalogue-fields">
        <ul>
          {entry.fermions.map((f, i) => (
            <li key={i}>{fermionSummary(f)}</li>
          ))}
        </ul>
        <p className="catalogue-terms">
          Charges follow from <TermList terms={entry.lagrangian.terms} /> with {entry.lagrangian.normalize} normalised
          to 1; forbidden: <TermList terms={entry.lagrangian.forbidden} />.
        </p>
        <p>
          𝒳_S = {minus(String(entry.scalarCharge))}, N_DW = {row.domainWall ? minus(row.domainWall) : "—"}
        </p>
        {entry.note ? <p className="note">{entry.note}</p> : null}
      </div>
    </details>
  );
}

/** The model set made of the chosen rows (all with an E/N), without id and colour (the store gives them). */
function catalogueSet(chosen: CatalogueRow[]) {
  const members = chosen.map((r) => ({
    eOverN: r.eOverN as string,
    count: 1,
    ...(r.domainWall ? { nDW: r.domainWall } : {}),
  }));
  // The source names the entries while they fit the id limit of a project (100 characters).
  let ids = "";
  for (const r of chosen) if (ids.length + r.entry.id.length + 1 <= 100) ids += (ids ? "," : "") + r.entry.id;
  const {
    id: _id,
    colour: _colour,
    ...set
  } = newModelSet(`Catalogue set (${chosen.length} models)`, members, {
    kind: "catalogue",
    catalogueId: ids,
  });
  return set;
}

/** The ids ticked for a model set, and a function that ticks or unticks one. */
function usePicked() {
  const [picked, setPicked] = useState<ReadonlySet<string>>(new Set());
  const toggle = (id: string, on: boolean) =>
    setPicked((old) => {
      const next = new Set(old);
      if (on) next.add(id);
      else next.delete(id);
      return next;
    });
  return { picked, toggle, clear: () => setPicked(new Set()) };
}

export function Catalogue() {
  const rows = useCatalogueRows();
  const addModel = useAxband((s) => s.addModel);
  const { picked, toggle, clear } = usePicked();
  const chosen = rows.filter((r) => picked.has(r.entry.id) && r.eOverN);
  const addSet = () => {
    if (chosen.length === 0) return;
    addModel(catalogueSet(chosen));
    clear();
  };
  const add = (row: CatalogueRow) => {
    if (!row.eOverN) return;
    addModel({
      eOverNMin: row.eOverN,
      eOverNMax: row.eOverN,
      label: `${row.entry.label}, E/N = ${minus(row.eOverN)}`,
      source: { kind: "catalogue", catalogueId: row.entry.id },
    });
  };
  return (
    <details className="catalogue">
      <summary>Catalogue</summary>
      {GROUPS.map((g) => (
        <div key={g.id} className="catalogue-group" role="group" aria-label={g.title}>
          <h3>{g.title}</h3>
          <ul>
            {rows
              .filter((r) => r.entry.group === g.id)
              .map((r) => (
                <li key={r.entry.id} className="catalogue-entry" data-catalogue-id={r.entry.id}>
                  <EntryDetails row={r} group={g.id} />
                  <input
                    type="checkbox"
                    data-testid="catalogue-pick"
                    aria-label={`Pick ${r.entry.label} for a model set`}
                    checked={picked.has(r.entry.id)}
                    disabled={!r.eOverN}
                    onChange={(e) => toggle(r.entry.id, e.target.checked)}
                  />
                  <button type="button" onClick={() => add(r)} disabled={!r.eOverN} aria-label={`Add ${r.entry.label}`}>
                    Add
                  </button>
                </li>
              ))}
          </ul>
        </div>
      ))}
      <p className="catalogue-set">
        <button type="button" data-testid="catalogue-add-set" onClick={addSet} disabled={chosen.length === 0}>
          Add {chosen.length > 0 ? `${chosen.length} picked` : "picked"} as model set
        </button>
      </p>
    </details>
  );
}
