// The anomaly calculator: an editable table of Weyl fermions (colour rep, electroweak charges, chirality,
// PQ charge, copies) with E, N, E/N and N_DW shown live as exact fractions, a per-field breakdown, and
// messages that name the field at fault while the last valid result stays visible.
import { useId, useMemo, useReducer, useState } from "react";
import { tryAnomaly, type AnomalyFieldError, type AnomalyResult } from "../../physics/anomaly";
import type { ElectroweakInput, FermionInput } from "../../physics/anomaly-types";
import { COLOUR_NAMES, parseColour } from "../../physics/su3";
import { toFractionString, type Rational } from "../../physics/rational";
import { useAxband } from "../store";
import { colourDisplay, minus } from "../format";
import { useCatalogueRows } from "./Catalogue";

/** One table row as typed (strings, so half-typed values survive until they parse). */
export interface FermionDraft {
  key: number;
  name: string;
  /** A name from COLOUR_NAMES, or Dynkin labels "(p,q)". */
  colour: string;
  ewKind: ElectroweakInput["kind"];
  dim: string;
  y: string;
  rep: "1" | "3" | "3bar";
  x: string;
  b: string;
  /** Explicit charges, separated by commas or spaces. */
  charges: string;
  chirality: "L" | "R";
  pq: string;
  copies: string;
}

let keyCounter = 0;
function blankRow(patch: Partial<FermionDraft> = {}): FermionDraft {
  keyCounter += 1;
  return {
    key: keyCounter,
    name: "",
    colour: "3",
    ewKind: "sm",
    dim: "1",
    y: "0",
    rep: "3",
    x: "0",
    b: "1",
    charges: "0",
    chirality: "L",
    pq: "1",
    copies: "1",
    ...patch,
  };
}

function text(v: unknown): string {
  return v === undefined || v === null ? "" : String(v);
}

/** A table row for a FermionInput (catalogue load). */
export function draftFromFermion(f: FermionInput): FermionDraft {
  const colour = typeof f.colour === "string" ? f.colour : `(${f.colour.p},${f.colour.q})`;
  const base = blankRow({
    name: f.name ?? "",
    colour,
    chirality: f.chirality,
    pq: text(f.pq),
    copies: text(f.copies ?? 1),
    ewKind: f.ew.kind,
  });
  if (f.ew.kind === "sm") return { ...base, dim: text(f.ew.dim), y: text(f.ew.y) };
  if (f.ew.kind === "su3l") return { ...base, rep: f.ew.rep, x: text(f.ew.x), b: text(f.ew.b) };
  return { ...base, charges: f.ew.charges.map(text).join(", ") };
}

function intOrText(s: string): number {
  const t = s.trim();
  return /^[+-]?\d+$/.test(t) ? Number(t) : Number.NaN;
}

/** The FermionInput a row stands for; unreadable numbers are passed on so the calculator names them. */
export function fermionFromDraft(d: FermionDraft): FermionInput {
  let ew: ElectroweakInput;
  if (d.ewKind === "sm") ew = { kind: "sm", dim: intOrText(d.dim), y: d.y };
  else if (d.ewKind === "su3l") ew = { kind: "su3l", rep: d.rep, x: d.x, b: d.b };
  else ew = { kind: "explicit", charges: d.charges.split(/[\s,;]+/).filter((c) => c !== "") };
  const f: FermionInput = { colour: d.colour, ew, chirality: d.chirality, pq: d.pq, copies: intOrText(d.copies) };
  if (d.name.trim() !== "") f.name = d.name.trim();
  return f;
}

interface CalcState {
  rows: FermionDraft[];
  scalarCharge: string;
  /** The latest valid result (kept while the table has errors). */
  lastGood: AnomalyResult | null;
}

type CalcAction =
  | { type: "edit"; key: number; patch: Partial<FermionDraft> }
  | { type: "add" }
  | { type: "remove"; key: number }
  | { type: "scalar"; value: string }
  | { type: "load"; fermions: FermionInput[]; scalarCharge: string };

function evaluate(rows: FermionDraft[], scalarCharge: string) {
  return tryAnomaly(rows.map(fermionFromDraft), { scalarCharge });
}

function withResult(s: Omit<CalcState, "lastGood"> & { lastGood: AnomalyResult | null }): CalcState {
  const r = evaluate(s.rows, s.scalarCharge);
  return r.ok ? { ...s, lastGood: r.result } : s;
}

function reducer(s: CalcState, a: CalcAction): CalcState {
  switch (a.type) {
    case "edit":
      return withResult({ ...s, rows: s.rows.map((r) => (r.key === a.key ? { ...r, ...a.patch } : r)) });
    case "add":
      return withResult({ ...s, rows: [...s.rows, blankRow({ pq: "0" })] });
    case "remove":
      return withResult({ ...s, rows: s.rows.filter((r) => r.key !== a.key) });
    case "scalar":
      return withResult({ ...s, scalarCharge: a.value });
    case "load":
      return withResult({ ...s, rows: a.fermions.map(draftFromFermion), scalarCharge: a.scalarCharge });
  }
}

/** Start table: one vector-like heavy quark (3, 1, 0) as Q_L (X = 1) and Q_R (X = 0), X_S = 1. */
function initialState(): CalcState {
  return withResult({
    rows: [blankRow({ name: "Q_L", chirality: "L", pq: "1" }), blankRow({ name: "Q_R", chirality: "R", pq: "0" })],
    scalarCharge: "1",
    lastGood: null,
  });
}

const frac = (r: Rational) => minus(toFractionString(r));

function colourOptionLabel(name: string): string {
  const p = parseColour(name);
  return p.ok ? `${colourDisplay(name)}  (${p.irrep.p},${p.irrep.q})` : name;
}

function ColourCell({
  row,
  onChange,
  invalid,
  label,
}: {
  row: FermionDraft;
  onChange: (v: string) => void;
  invalid: boolean;
  label: string;
}) {
  const named = COLOUR_NAMES.includes(row.colour);
  const [other, setOther] = useState(!named);
  return (
    <span className="colour-cell">
      <select
        aria-label={`Colour representation of ${label}`}
        value={other ? "other" : row.colour}
        aria-invalid={invalid && !other ? true : undefined}
        onChange={(e) => {
          if (e.target.value === "other") {
            setOther(true);
            const c = parseColour(row.colour);
            onChange(c.ok ? `(${c.irrep.p},${c.irrep.q})` : row.colour);
          } else {
            setOther(false);
            onChange(e.target.value);
          }
        }}
      >
        {COLOUR_NAMES.map((n) => (
          <option key={n} value={n}>
            {colourOptionLabel(n)}
          </option>
        ))}
        <option value="other">Dynkin (p,q)…</option>
      </select>
      {other ? (
        <input
          type="text"
          className="narrow"
          aria-label={`Dynkin labels (p,q) of ${label}`}
          value={row.colour}
          aria-invalid={invalid ? true : undefined}
          onChange={(e) => onChange(e.target.value)}
        />
      ) : null}
    </span>
  );
}

function hasError(errors: AnomalyFieldError[], index: number, field: string): boolean {
  return errors.some((e) => e.index === index && (e.field === field || e.field.startsWith(`${field}[`)));
}

export function AnomalyCalculator() {
  const [state, dispatch] = useReducer(reducer, undefined, initialState);
  const addModel = useAxband((s) => s.addModel);
  const catalogueRows = useCatalogueRows();
  const [loadId, setLoadId] = useState(catalogueRows[0]?.entry.id ?? "");
  const current = useMemo(() => evaluate(state.rows, state.scalarCharge), [state.rows, state.scalarCharge]);
  const errors = current.ok ? [] : current.errors;
  const shown = current.ok ? current.result : state.lastGood;
  const stale = !current.ok && shown !== null;
  const scalarId = useId();
  const resultId = useId();

  const edit = (key: number, patch: Partial<FermionDraft>) => dispatch({ type: "edit", key, patch });

  const addAsModel = () => {
    if (!current.ok || !current.result.eOverN) return;
    const en = toFractionString(current.result.eOverN);
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
        <button
          type="button"
          onClick={() => {
            const row = catalogueRows.find((r) => r.entry.id === loadId);
            if (row)
              dispatch({ type: "load", fermions: row.entry.fermions, scalarCharge: String(row.entry.scalarCharge) });
          }}
        >
          Load
        </button>
      </div>

      <div className="table-scroll">
        <table className="fermion-table">
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
          <tbody>
            {state.rows.map((row, i) => {
              const label = row.name.trim() || `fermion ${i + 1}`;
              return (
                <tr key={row.key} data-fermion-row={i}>
                  <td>
                    <input
                      type="text"
                      className="narrow"
                      aria-label={`Name of fermion ${i + 1}`}
                      value={row.name}
                      onChange={(e) => edit(row.key, { name: e.target.value })}
                    />
                  </td>
                  <td>
                    <ColourCell
                      row={row}
                      label={label}
                      invalid={hasError(errors, i, "colour")}
                      onChange={(v) => edit(row.key, { colour: v })}
                    />
                  </td>
                  <td className="ew-cell">
                    <select
                      aria-label={`Electroweak kind of ${label}`}
                      value={row.ewKind}
                      onChange={(e) => edit(row.key, { ewKind: e.target.value as FermionDraft["ewKind"] })}
                    >
                      <option value="sm">SU(2)×U(1)</option>
                      <option value="su3l">SU(3)_L</option>
                      <option value="explicit">charges</option>
                    </select>
                    {row.ewKind === "sm" ? (
                      <>
                        <input
                          type="text"
                          className="tiny"
                          aria-label={`SU(2) dimension of ${label}`}
                          title="SU(2)_L dimension"
                          placeholder="dim"
                          value={row.dim}
                          aria-invalid={hasError(errors, i, "ew.dim") || undefined}
                          onChange={(e) => edit(row.key, { dim: e.target.value })}
                        />
                        <input
                          type="text"
                          className="narrow"
                          aria-label={`Hypercharge Y of ${label}`}
                          title="Hypercharge Y (Q = T₃ + Y)"
                          placeholder="Y"
                          value={row.y}
                          aria-invalid={hasError(errors, i, "ew.y") || undefined}
                          onChange={(e) => edit(row.key, { y: e.target.value })}
                        />
                      </>
                    ) : row.ewKind === "su3l" ? (
                      <>
                        <select
                          aria-label={`SU(3)_L representation of ${label}`}
                          value={row.rep}
                          onChange={(e) => edit(row.key, { rep: e.target.value as FermionDraft["rep"] })}
                        >
                          <option value="1">1</option>
                          <option value="3">3</option>
                          <option value="3bar">3̅</option>
                        </select>
                        <input
                          type="text"
                          className="narrow"
                          aria-label={`X charge of ${label}`}
                          title="X (Q = T₃ + βT₈ + X)"
                          value={row.x}
                          aria-invalid={hasError(errors, i, "ew.x") || undefined}
                          onChange={(e) => edit(row.key, { x: e.target.value })}
                        />
                        <input
                          type="text"
                          className="narrow"
                          aria-label={`b = β/√3 of ${label}`}
                          title="b = β/√3"
                          value={row.b}
                          aria-invalid={hasError(errors, i, "ew.b") || undefined}
                          onChange={(e) => edit(row.key, { b: e.target.value })}
                        />
                      </>
                    ) : (
                      <input
                        type="text"
                        aria-label={`Electric charges of ${label}`}
                        title="Component charges, e.g. 2/3, -1/3"
                        value={row.charges}
                        aria-invalid={hasError(errors, i, "ew.charges") || undefined}
                        onChange={(e) => edit(row.key, { charges: e.target.value })}
                      />
                    )}
                  </td>
                  <td>
                    <select
                      aria-label={`Chirality of ${label}`}
                      value={row.chirality}
                      onChange={(e) => edit(row.key, { chirality: e.target.value as "L" | "R" })}
                    >
                      <option value="L">L</option>
                      <option value="R">R</option>
                    </select>
                  </td>
                  <td>
                    <input
                      type="text"
                      className="narrow"
                      aria-label={`PQ charge of ${label}`}
                      value={row.pq}
                      aria-invalid={hasError(errors, i, "pq") || undefined}
                      onChange={(e) => edit(row.key, { pq: e.target.value })}
                    />
                  </td>
                  <td>
                    <input
                      type="text"
                      className="tiny"
                      aria-label={`Copies of ${label}`}
                      value={row.copies}
                      aria-invalid={hasError(errors, i, "copies") || undefined}
                      onChange={(e) => edit(row.key, { copies: e.target.value })}
                    />
                  </td>
                  <td>
                    <button
                      type="button"
                      className="icon danger"
                      aria-label={`Remove ${label}`}
                      onClick={() => dispatch({ type: "remove", key: row.key })}
                    >
                      ✕
                    </button>
                  </td>
                </tr>
              );
            })}
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

      <div id={resultId} className={`calc-result${stale ? " stale" : ""}`} aria-live="polite">
        {shown ? (
          <>
            <dl>
              <div>
                <dt>E</dt>
                <dd data-testid="calc-e">{frac(shown.E)}</dd>
              </div>
              <div>
                <dt>N</dt>
                <dd data-testid="calc-n">{frac(shown.N)}</dd>
              </div>
              <div>
                <dt>E/N</dt>
                <dd data-testid="calc-eovern">{shown.eOverN ? frac(shown.eOverN) : "undefined"}</dd>
              </div>
              <div>
                <dt>
                  N<sub>DW</sub>
                </dt>
                <dd data-testid="calc-ndw">{shown.domainWallExact ? frac(shown.domainWallExact) : "—"}</dd>
              </div>
            </dl>
            {stale ? <p className="note">Showing the last valid result; fix the entries above to update it.</p> : null}
            {shown.notes.map((n, k) => (
              <p key={k} className="note">
                {n}
              </p>
            ))}
            <details className="breakdown">
              <summary>Per-field breakdown</summary>
              <table>
                <thead>
                  <tr>
                    <th scope="col">Field</th>
                    <th scope="col">d(R)</th>
                    <th scope="col">T(R)</th>
                    <th scope="col">Q</th>
                    <th scope="col">X (as L)</th>
                    <th scope="col">×</th>
                    <th scope="col">ΔE</th>
                    <th scope="col">ΔN</th>
                  </tr>
                </thead>
                <tbody>
                  {shown.contributions.map((c) => (
                    <tr key={c.index}>
                      <td>{c.name}</td>
                      <td>{c.colourDim}</td>
                      <td>{frac(c.colourIndex)}</td>
                      <td>{c.charges.map(frac).join(", ")}</td>
                      <td>{frac(c.pqLeft)}</td>
                      <td>{c.copies}</td>
                      <td>{frac(c.dE)}</td>
                      <td>{frac(c.dN)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </details>
          </>
        ) : (
          <p className="note">Enter the fermions to see E, N and E/N.</p>
        )}
      </div>
      <button
        type="button"
        className="primary"
        onClick={addAsModel}
        disabled={!current.ok || !current.result.eOverN}
        data-testid="calc-add-model"
      >
        {current.ok && current.result.eOverN ? `Add E/N = ${frac(current.result.eOverN)} as model` : "Add as model"}
      </button>
    </div>
  );
}
