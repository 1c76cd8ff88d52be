// Charges from the Lagrangian in the calculator: scalars beside the fermions, kept and forbidden terms (one per
// line, readable syntax), and "Solve", which fills the fermion table's PQ charges and reports what the terms fix.
import { useId, useState } from "react";
import type { ChargeSolved } from "../../physics/charges";
import { minus } from "../format";
import { termLines, solveDraft } from "./lagrangian";
import type { CalcAction, CalcState, FermionDraft } from "./calculator-state";
import { ColourCell, DraftInput, ElectroweakCell } from "./FermionRow";

const SYNTAX_HELP =
  "One term per line, fields separated by spaces: Qbar_L Phi Q_R · H2^† H1 Phi^†2 · conj(Phi)^2 · Q̄_L Φ Q_R. " +
  "Conjugate with bar, ^†, †, ^*, conj(…); powers with ^2 or ².";

function ScalarRow(props: { row: FermionDraft; index: number; dispatch: (a: CalcAction) => void }) {
  const { row, index, dispatch } = props;
  const edit = (patch: Partial<FermionDraft>) => dispatch({ type: "scalar-edit", key: row.key, patch });
  const label = row.name.trim() || `scalar ${index + 1}`;
  return (
    <tr data-scalar-row={index}>
      <td>
        <DraftInput row={row} edit={edit} field="name" className="narrow" label={`Name of scalar ${index + 1}`} />
      </td>
      <td>
        <ColourCell row={row} label={label} invalid={false} edit={edit} />
      </td>
      <ElectroweakCell row={row} label={label} edit={edit} bad={() => false} />
      <td>
        <button
          type="button"
          className="icon danger"
          aria-label={`Remove ${label}`}
          onClick={() => dispatch({ type: "scalar-remove", key: row.key })}
        >
          ✕
        </button>
      </td>
    </tr>
  );
}

function TermList(props: { label: string; value: string; onChange: (v: string) => void; testId: string }) {
  const id = useId();
  return (
    <div className="term-list">
      <label htmlFor={id} className="field-label">
        {props.label}
      </label>
      <textarea
        id={id}
        rows={3}
        spellCheck={false}
        value={props.value}
        data-testid={props.testId}
        onChange={(e) => props.onChange(e.target.value)}
      />
    </div>
  );
}

/** The fermion rows whose charges the terms leave free, set to a small list so the calculator scans them. */
function scanFree(r: ChargeSolved, state: CalcState, dispatch: (a: CalcAction) => void): void {
  for (const row of state.rows)
    if (r.free.includes(row.name.trim())) dispatch({ type: "edit", key: row.key, patch: { pq: "{-1, 0, 1}" } });
}

function Report({ r, state, dispatch }: { r: ChargeSolved; state: CalcState; dispatch: (a: CalcAction) => void }) {
  const forbidden = termLines(state.forbidden);
  // A table scan varies each free charge alone: offered only when that spans exactly the solutions' E/N.
  const scannable = r.scanExact && r.free.some((n) => state.rows.some((row) => row.name.trim() === n));
  return (
    <div className="charge-report" data-testid="charge-report">
      <p>
        PQ charges 𝒳 solved with 𝒳 = 1 for {state.normalize}, filled into the table:{" "}
        {Object.entries(r.charges)
          .map(([n, x]) => `${n} = ${minus(x)}`)
          .join(", ")}
        .
      </p>
      {!r.axion ? (
        <p className="warning">N = 0 for every choice the terms allow: no colour anomaly, no QCD axion.</p>
      ) : r.determined ? (
        <p>
          E/N = {minus(r.eOverN ?? "")} is determined by the terms
          {r.nDW ? `; N_DW = ${minus(r.nDW)}` : "; N (and N_DW) still depends on free charges"}.
        </p>
      ) : (
        <p className="warning">
          E/N is not determined: it depends on the charges of {r.free.join(", ")}, which the terms leave free.{" "}
          {r.scanExact
            ? "Vary them in the table (a charge scan) or add the terms that fix them. "
            : "Charges of other fields follow from them, so a scan of the table alone would break kept terms: " +
              "add the terms that fix them, or vary the charges together by hand. "}
          {scannable ? (
            <button type="button" onClick={() => scanFree(r, state, dispatch)} data-testid="scan-free">
              Scan them over {"{-1, 0, 1}"}
            </button>
          ) : null}
        </p>
      )}
      {r.forbiddenAllowed.map((i) => (
        <p key={`a${i}`} className="warning">
          Not forbidden by this symmetry: <code>{forbidden[i]?.text}</code>
        </p>
      ))}
      {r.forbiddenByGauge.map((i) => (
        <p key={`g${i}`} className="note">
          Already forbidden by gauge symmetry: <code>{forbidden[i]?.text}</code>
        </p>
      ))}
    </div>
  );
}

export function LagrangianPanel({ state, dispatch }: { state: CalcState; dispatch: (a: CalcAction) => void }) {
  const [report, setReport] = useState<ReturnType<typeof solveDraft> | null>(null);
  const normId = useId();
  const solve = () => {
    const r = solveDraft(state);
    setReport(r);
    if (r.ok) dispatch({ type: "solved", charges: r.result.charges });
  };
  const text = (field: "terms" | "forbidden") => (v: string) => dispatch({ type: "text", field, value: v });
  return (
    <details className="lagrangian" open={state.terms !== "" || undefined}>
      <summary>Charges from the Lagrangian</summary>
      <div className="table-scroll">
        <table className="fermion-table" aria-label="Scalars">
          <thead>
            <tr>
              <th scope="col">Scalar</th>
              <th scope="col">SU(3)_c</th>
              <th scope="col">Electroweak</th>
              <th scope="col">
                <span className="visually-hidden">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {state.scalars.map((row, i) => (
              <ScalarRow key={row.key} row={row} index={i} dispatch={dispatch} />
            ))}
          </tbody>
        </table>
      </div>
      <div className="inline-row">
        <button type="button" onClick={() => dispatch({ type: "scalar-add" })}>
          + Scalar
        </button>
        <label className="inline-label" htmlFor={normId}>
          PQ charge 𝒳 = 1 for
        </label>
        <select
          id={normId}
          value={state.normalize}
          onChange={(e) => dispatch({ type: "text", field: "normalize", value: e.target.value })}
        >
          {state.scalars.map((s) => (
            <option key={s.key} value={s.name.trim()}>
              {s.name.trim() || "(unnamed)"}
            </option>
          ))}
        </select>
      </div>
      <p className="note">{SYNTAX_HELP}</p>
      <TermList label="Kept terms" value={state.terms} onChange={text("terms")} testId="terms-kept" />
      <TermList label="Forbidden terms" value={state.forbidden} onChange={text("forbidden")} testId="terms-forbidden" />
      <button type="button" onClick={solve} data-testid="solve-charges">
        Solve charges
      </button>
      {report && !report.ok ? (
        // The alert role on a wrapper: a list given role="alert" stops being a list for assistive technology.
        <div role="alert" data-testid="solve-errors">
          <ul className="field-errors">
            {report.errors.map((e, k) => (
              <li key={k}>{e}</li>
            ))}
          </ul>
        </div>
      ) : null}
      {report?.ok ? <Report r={report.result} state={state} dispatch={dispatch} /> : null}
    </details>
  );
}
