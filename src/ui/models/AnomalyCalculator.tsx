// The anomaly calculator: an editable table of Weyl fermions with E, N, E/N and N_DW shown live as exact
// fractions; the anomaly is computed once per edit, and the last valid result stays visible while a field is bad.
import { useId, useMemo, useReducer, useState } from "react";
import { tryAnomaly, type AnomalyResult } from "../../physics/anomaly";
import { toFractionString } from "../../physics/rational";
import { useAxband } from "../store";
import { minus } from "../format";
import { useCatalogueRows } from "./Catalogue";
import { calcReducer, fermionFromDraft, hasError, initialCalcState, type CalcAction } from "./calculator-state";
import { FermionRow } from "./FermionRow";
import { CalculatorResult, frac } from "./CalculatorResult";

function CatalogueLoad({ dispatch }: { dispatch: (a: CalcAction) => void }) {
  const catalogueRows = useCatalogueRows();
  const [loadId, setLoadId] = useState(catalogueRows[0]?.entry.id ?? "");
  const load = () => {
    const row = catalogueRows.find((r) => r.entry.id === loadId);
    if (row) dispatch({ type: "load", fermions: row.entry.fermions, scalarCharge: String(row.entry.scalarCharge) });
  };
  return (
    <div className="calc-load inline-row">
      <label>
        <span className="field-label">Load from catalogue</span>
        <select value={loadId} onChange={(e) => setLoadId(e.target.value)} aria-label="Catalogue entry to load">
          {catalogueRows.map((r) => (
            <option key={r.entry.id} value={r.entry.id}>
              {r.entry.label}
            </option>
          ))}
        </select>
      </label>
      <button type="button" onClick={load}>
        Load
      </button>
    </div>
  );
}

function TableHead() {
  return (
    <thead>
      <tr>
        <th scope="col">Name</th>
        <th scope="col">SU(3)_c</th>
        <th scope="col">
          Electroweak <span className="th-detail">(SU(2) dim, Y · SU(3)_L rep, X, b · charges)</span>
        </th>
        <th scope="col" title="Chirality of the Weyl field">
          L/R
        </th>
        <th scope="col">PQ charge</th>
        <th scope="col">Copies</th>
        <th scope="col">
          <span className="visually-hidden">Remove</span>
        </th>
      </tr>
    </thead>
  );
}

export function AnomalyCalculator() {
  const [state, dispatch] = useReducer(calcReducer, undefined, initialCalcState);
  const addModel = useAxband((s) => s.addModel);
  // The one computation per edit, shared by the result, the breakdown and "Add as model".
  const current = useMemo(
    () => tryAnomaly(state.rows.map(fermionFromDraft), { scalarCharge: state.scalarCharge }),
    [state.rows, state.scalarCharge],
  );
  // The last valid result, adjusted during render (React's pattern for state derived from a previous render).
  const [lastGood, setLastGood] = useState<AnomalyResult | null>(null);
  if (current.ok && current.result !== lastGood) setLastGood(current.result);
  const errors = current.ok ? [] : current.errors;
  const shown = current.ok ? current.result : lastGood;
  const stale = !current.ok && shown !== null;
  const eOverN = current.ok ? current.result.eOverN : null;
  const scalarId = useId();

  const addAsModel = () => {
    if (!eOverN) return;
    const en = toFractionString(eOverN);
    addModel({
      eOverNMin: en,
      eOverNMax: en,
      label: `Calculator model, E/N = ${minus(en)}`,
      source: {
        kind: "calculator",
        fermions: state.rows.map(fermionFromDraft),
        scalarCharge: state.scalarCharge.trim(),
      },
    });
  };

  return (
    <div className="calculator" data-testid="anomaly-calculator">
      <CatalogueLoad dispatch={dispatch} />
      <div className="table-scroll">
        <table className="fermion-table">
          <TableHead />
          <tbody>
            {state.rows.map((row, i) => (
              <FermionRow
                key={row.key}
                row={row}
                index={i}
                errors={errors}
                edit={(patch) => dispatch({ type: "edit", key: row.key, patch })}
                remove={() => dispatch({ type: "remove", key: row.key })}
              />
            ))}
          </tbody>
        </table>
      </div>
      <div className="inline-row">
        <button type="button" onClick={() => dispatch({ type: "add" })}>
          + Fermion
        </button>
        <label className="inline-label" htmlFor={scalarId}>
          Scalar PQ charge X_S
        </label>
        <input
          id={scalarId}
          type="text"
          className="narrow"
          value={state.scalarCharge}
          aria-invalid={hasError(errors, -1, "scalarCharge") || undefined}
          onChange={(e) => dispatch({ type: "scalar", value: e.target.value })}
        />
      </div>
      {errors.length > 0 ? (
        <ul className="field-errors" aria-live="polite" data-testid="calc-errors">
          {errors.map((e, k) => (
            <li key={k}>{e.message}</li>
          ))}
        </ul>
      ) : null}
      <CalculatorResult shown={shown} stale={stale} />
      <button type="button" className="primary" onClick={addAsModel} disabled={!eOverN} data-testid="calc-add-model">
        {eOverN ? `Add E/N = ${frac(eOverN)} as model` : "Add as model"}
      </button>
    </div>
  );
}
