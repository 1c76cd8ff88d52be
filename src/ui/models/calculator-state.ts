// The anomaly calculator's table as typed: rows of strings (so half-typed values survive until they parse),
// their conversion to and from the physics input, and the reducer that edits them.
import type { AnomalyFieldError } from "../../physics/anomaly";
import type { ElectroweakInput, FermionInput } from "../../physics/anomaly-types";

/** One table row as typed. */
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
function draftFromFermion(f: FermionInput): FermionDraft {
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

/** The table only: the result is derived from it once per edit by the component (not kept here). */
export interface CalcState {
  rows: FermionDraft[];
  scalarCharge: string;
}

export type CalcAction =
  | { type: "edit"; key: number; patch: Partial<FermionDraft> }
  | { type: "add" }
  | { type: "remove"; key: number }
  | { type: "scalar"; value: string }
  | { type: "load"; fermions: FermionInput[]; scalarCharge: string };

export function calcReducer(s: CalcState, a: CalcAction): CalcState {
  switch (a.type) {
    case "edit":
      return { ...s, rows: s.rows.map((r) => (r.key === a.key ? { ...r, ...a.patch } : r)) };
    case "add":
      return { ...s, rows: [...s.rows, blankRow({ pq: "0" })] };
    case "remove":
      return { ...s, rows: s.rows.filter((r) => r.key !== a.key) };
    case "scalar":
      return { ...s, scalarCharge: a.value };
    case "load":
      return { rows: a.fermions.map(draftFromFermion), scalarCharge: a.scalarCharge };
  }
}

/** Start table: one vector-like heavy quark (3, 1, 0) as Q_L (X = 1) and Q_R (X = 0), X_S = 1. */
export function initialCalcState(): CalcState {
  return {
    rows: [blankRow({ name: "Q_L", chirality: "L", pq: "1" }), blankRow({ name: "Q_R", chirality: "R", pq: "0" })],
    scalarCharge: "1",
  };
}

/** Whether the calculator names this field (or one of its parts, "field[k]") of row `index` (−1: the scalar). */
export function hasError(errors: AnomalyFieldError[], index: number, field: string): boolean {
  return errors.some((e) => e.index === index && (e.field === field || e.field.startsWith(`${field}[`)));
}
