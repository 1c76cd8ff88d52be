// The anomaly calculator: an editable table of Weyl fermions with E, N, E/N and N_DW shown live as exact
// fractions; the anomaly is computed once per edit, and the last valid result stays visible while a field is bad.
import { useEffect, useId, useMemo, useReducer, useState } from "react";
import { tryAnomaly, type AnomalyFieldError, type AnomalyResult } from "../../physics/anomaly";
import { toFractionString, type Rational } from "../../physics/rational";
import { useAxband } from "../store";
import { minus } from "../format";
import { useCatalogueRows } from "./Catalogue";
import {
  betaProblem,
  calcReducer,
  fermionFromDraft,
  hasError,
  scalarFromDraft,
  type CalcAction,
  type CalcState,
} from "./calculator-state";
import { loadDraft, saveDraft, useCalculatorRequest } from "./calculator-draft";
import { LagrangianPanel } from "./LagrangianPanel";
import { termLines } from "./lagrangian";
import { FermionRow } from "./FermionRow";
import { CalculatorResult, frac } from "./CalculatorResult";
import { isScanState } from "./calculator-scan";
import { CalculatorScan } from "./CalculatorScan";

function CatalogueLoad({ dispatch, dirty }: { dispatch: (a: CalcAction) => void; dirty: boolean }) {
  const catalogueRows = useCatalogueRows();
  const [loadId, setLoadId] = useState(catalogueRows[0]?.entry.id ?? "");
  const load = () => {
    const row = catalogueRows.find((r) => r.entry.id === loadId);
    if (!row) return;
    if (dirty && !window.confirm(`Replace the calculator's current model with "${row.entry.label}"?`)) return;
    const { scalars, terms, forbidden, normalize } = row.entry.lagrangian;
    dispatch({
      type: "load",
      fermions: row.entry.fermions,
      scalarCharge: String(row.entry.scalarCharge),
      name: row.entry.label,
      scalars,
      terms,
      forbidden,
      normalize,
    });
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
          Electroweak <span className="th-detail">(SU(2) dim, Y · SU(3)_L rep, X, β · charges)</span>
        </th>
        <th scope="col" title="Chirality of the Weyl field">
          L/R
        </th>
        <th scope="col" title="Peccei–Quinn charge 𝒳 (distinct from the U(1)_X charge X of SU(3)_L models)">
          PQ charge 𝒳
        </th>
        <th scope="col">Copies</th>
        <th scope="col">
          <span className="visually-hidden">Remove</span>
        </th>
      </tr>
    </thead>
  );
}

/** β problems of the rows, reported as the calculator's own errors would be (they replace its "b" errors). */
function withBetaErrors(state: CalcState, errors: AnomalyFieldError[]): AnomalyFieldError[] {
  const beta: AnomalyFieldError[] = [];
  state.rows.forEach((r, i) => {
    const p = betaProblem(r);
    if (p)
      beta.push({
        index: i,
        field: "ew.b",
        message: `fermion ${i + 1}${r.name.trim() ? ` (${r.name.trim()})` : ""}: ${p}`,
      });
  });
  return [...errors.filter((e) => !(e.field === "ew.b" && beta.some((b) => b.index === e.index))), ...beta];
}

/** Take a model the list asked to reopen: its fields and terms fill the calculator. */
function useEditRequest(dispatch: (a: CalcAction) => void, dirty: boolean) {
  const edit = useCalculatorRequest((s) => s.edit);
  const takeEdit = useCalculatorRequest((s) => s.takeEdit);
  useEffect(() => {
    if (!edit || edit.source.kind !== "calculator") return;
    takeEdit();
    if (dirty && !window.confirm(`Replace the calculator's current model with "${edit.label}"?`)) return;
    const src = edit.source;
    // The label carries ", E/N = …" (added on save); the name is what precedes it.
    dispatch({ type: "load", ...src, name: edit.label.replace(/, E\/N = [^,]*$/, ""), editingId: edit.id });
  }, [edit, takeEdit, dispatch, dirty]);
}

/** "Add as model": a new model, or an update of the model being edited; terms go with it when there are any. */
function useAddAsModel(
  state: CalcState,
  eOverN: Rational | null,
  editing: boolean,
  dispatch: (a: CalcAction) => void,
): () => void {
  const addModel = useAxband((s) => s.addModel);
  const updateModel = useAxband((s) => s.updateModel);
  return () => {
    if (!eOverN) return;
    const en = toFractionString(eOverN);
    const terms = termLines(state.terms).map((t) => t.text);
    const source = {
      kind: "calculator" as const,
      fermions: state.rows.map(fermionFromDraft),
      scalarCharge: state.scalarCharge.trim(),
      ...(terms.length > 0
        ? {
            scalars: state.scalars.map(scalarFromDraft),
            terms,
            forbidden: termLines(state.forbidden).map((t) => t.text),
            normalize: state.normalize,
          }
        : {}),
    };
    const label = `${state.name.trim() || "Calculator model"}, E/N = ${minus(en)}`;
    if (editing && state.editingId) {
      updateModel(state.editingId, { eOverNMin: en, eOverNMax: en, label, source });
      dispatch({ type: "saved", editingId: state.editingId });
    } else {
      dispatch({ type: "saved", editingId: addModel({ eOverNMin: en, eOverNMax: en, label, source }) });
    }
  };
}

/**
 * The anomaly of the calculator's rows, computed once per edit and shared by the result, the breakdown and
 * "Add as model"; the last valid result stays shown (marked stale) while a field is bad.
 */
function useAnomaly(state: CalcState) {
  const computed = useMemo(
    () => tryAnomaly(state.rows.map(fermionFromDraft), { scalarCharge: state.scalarCharge }),
    [state.rows, state.scalarCharge],
  );
  const betaErrors = useMemo(() => withBetaErrors(state, computed.ok ? [] : computed.errors), [state, computed]);
  const current = betaErrors.length > 0 ? { ok: false as const, errors: betaErrors } : computed;
  // The last valid result, adjusted during render (React's pattern for state derived from a previous render).
  const [lastGood, setLastGood] = useState<AnomalyResult | null>(null);
  if (current.ok && current.result !== lastGood) setLastGood(current.result);
  const scanning = isScanState(state);
  const shown = current.ok ? current.result : lastGood;
  return {
    scanning,
    // In scan mode the lists are read by the scan, which reports its own errors.
    errors: current.ok || scanning ? [] : current.errors,
    shown,
    stale: !current.ok && shown !== null,
    eOverN: current.ok ? current.result.eOverN : null,
  };
}

function FermionTable({
  state,
  errors,
  dispatch,
}: {
  state: CalcState;
  errors: AnomalyFieldError[];
  dispatch: (a: CalcAction) => void;
}) {
  return (
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
  );
}

function NameField({ name, dispatch }: { name: string; dispatch: (a: CalcAction) => void }) {
  const nameId = useId();
  return (
    <div className="inline-row">
      <label className="inline-label" htmlFor={nameId}>
        Model name
      </label>
      <input
        id={nameId}
        type="text"
        value={name}
        placeholder="Calculator model"
        onChange={(e) => dispatch({ type: "text", field: "name", value: e.target.value })}
      />
    </div>
  );
}

export function AnomalyCalculator() {
  const [state, dispatch] = useReducer(calcReducer, undefined, loadDraft);
  useEffect(() => saveDraft(state), [state]);
  useEditRequest(dispatch, state.dirty);
  const { scanning, errors, shown, stale, eOverN } = useAnomaly(state);
  const scalarId = useId();
  const editing = useAxband((s) => s.project.models.some((m) => m.id === state.editingId));
  const addAsModel = useAddAsModel(state, eOverN, editing, dispatch);

  return (
    <div className="calculator" data-testid="anomaly-calculator">
      <CatalogueLoad dispatch={dispatch} dirty={state.dirty} />
      <NameField name={state.name} dispatch={dispatch} />
      <FermionTable state={state} errors={errors} dispatch={dispatch} />
      <div className="inline-row">
        <button type="button" onClick={() => dispatch({ type: "add" })}>
          + Fermion
        </button>
        <label className="inline-label" htmlFor={scalarId}>
          PQ charge 𝒳_S of the scalar that sets f_a
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
      <p className="note">
        A PQ charge, copies or 𝒳_S may be a list or range ({"{-1, 0, 1}"}, {"1..3"}): the calculator then scans every
        combination.
      </p>
      {scanning ? <CalculatorScan state={state} /> : null}
      {errors.length > 0 ? (
        <ul className="field-errors" aria-live="polite" data-testid="calc-errors">
          {errors.map((e, k) => (
            <li key={k}>{e.message}</li>
          ))}
        </ul>
      ) : null}
      <LagrangianPanel state={state} dispatch={dispatch} />
      <CalculatorResult shown={shown} stale={stale} />
      <button type="button" className="primary" onClick={addAsModel} disabled={!eOverN} data-testid="calc-add-model">
        {eOverN
          ? `${editing ? "Update model with" : "Add"} E/N = ${frac(eOverN)}${editing ? "" : " as model"}`
          : "Add as model"}
      </button>
    </div>
  );
}
