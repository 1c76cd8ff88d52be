// The anomaly calculator's table as typed: rows of strings (so half-typed values survive until they parse),
// their conversion to and from the physics input, and the reducer that edits them.
import type { AnomalyFieldError } from "../../physics/anomaly";
import type { ElectroweakInput, FermionInput } from "../../physics/anomaly-types";
import { formatBeta, parseBeta } from "../../physics/beta";
import type { ScalarInput } from "../../physics/charges/types";
import { parseRational, toFractionString } from "../../physics/rational";

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
  /** β as written in papers ("-1/√3", "√3"); the calculator gets b = β/√3. */
  beta: string;
  /** Explicit charges, separated by commas or spaces. */
  charges: string;
  chirality: "L" | "R";
  pq: string;
  copies: string;
}

let keyCounter = 0;
export function blankRow(patch: Partial<FermionDraft> = {}): FermionDraft {
  keyCounter += 1;
  const { key: _key, ...rest } = patch;
  return {
    key: keyCounter,
    name: "",
    colour: "3",
    ewKind: "sm",
    dim: "1",
    y: "0",
    rep: "3",
    x: "0",
    beta: "√3",
    charges: "0",
    chirality: "L",
    pq: "1",
    copies: "1",
    ...rest,
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
  if (f.ew.kind === "su3l") {
    const b = parseRational(f.ew.b);
    return { ...base, rep: f.ew.rep, x: text(f.ew.x), beta: b.ok ? formatBeta(b.value) : text(f.ew.b) };
  }
  return { ...base, charges: f.ew.charges.map(text).join(", ") };
}

function intOrText(s: string): number {
  const t = s.trim();
  return /^[+-]?\d+$/.test(t) ? Number(t) : Number.NaN;
}

/** b = β/√3 of a row; a β that cannot be read is passed on as text the calculator refuses (never as a number). */
function betaAsB(d: FermionDraft): string {
  if (d.rep === "1") return "0";
  const r = parseBeta(d.beta);
  return r.ok ? toFractionString(r.b) : `β ${d.beta}`;
}

/** The β problem of a row, or null (the calculator reports it as a bad b; the UI names β instead). */
export function betaProblem(d: FermionDraft): string | null {
  if (d.ewKind !== "su3l" || d.rep === "1") return null;
  const r = parseBeta(d.beta);
  return r.ok ? null : `β "${d.beta}" ${r.reason}`;
}

/** A draft row (name, colour, electroweak cell) read as a scalar. */
export function scalarFromDraft(d: FermionDraft): ScalarInput {
  const f = fermionFromDraft(d);
  return { name: d.name.trim(), colour: f.colour, ew: f.ew };
}

function draftFromScalar(s: ScalarInput): FermionDraft {
  return draftFromFermion({ name: s.name, colour: s.colour ?? "1", ew: s.ew, chirality: "L", pq: "0" });
}

/** The FermionInput a row stands for; unreadable numbers are passed on so the calculator names them. */
export function fermionFromDraft(d: FermionDraft): FermionInput {
  let ew: ElectroweakInput;
  if (d.ewKind === "sm") ew = { kind: "sm", dim: intOrText(d.dim), y: d.y };
  else if (d.ewKind === "su3l") ew = { kind: "su3l", rep: d.rep, x: d.x, b: betaAsB(d) };
  else ew = { kind: "explicit", charges: d.charges.split(/[\s,;]+/).filter((c) => c !== "") };
  const f: FermionInput = { colour: d.colour, ew, chirality: d.chirality, pq: d.pq, copies: intOrText(d.copies) };
  if (d.name.trim() !== "") f.name = d.name.trim();
  return f;
}

/** The table only: the result is derived from it once per edit by the component (not kept here). */
export interface CalcState {
  rows: FermionDraft[];
  scalarCharge: string;
  /** The model's name (its label in the model list). */
  name: string;
  scalars: FermionDraft[];
  /** Kept and forbidden terms, one per line. */
  terms: string;
  forbidden: string;
  /** The scalar whose PQ charge the solver sets to 1. */
  normalize: string;
  /** The model being edited ("Add" then updates it), or null for a new one. */
  editingId: string | null;
  /** Edited since the last load or add: "Load" asks before replacing. */
  dirty: boolean;
}

/** What a load brings besides the fermions (catalogue entry or a model reopened for editing). */
interface CalcLoad {
  fermions: FermionInput[];
  scalarCharge: string;
  name?: string;
  scalars?: ScalarInput[];
  terms?: string[];
  forbidden?: string[];
  normalize?: string;
  editingId?: string | null;
}

export type CalcAction =
  | { type: "edit"; key: number; patch: Partial<FermionDraft> }
  | { type: "add" }
  | { type: "remove"; key: number }
  | { type: "scalar"; value: string }
  | { type: "text"; field: "name" | "terms" | "forbidden" | "normalize"; value: string }
  | { type: "scalar-edit"; key: number; patch: Partial<FermionDraft> }
  | { type: "scalar-add" }
  | { type: "scalar-remove"; key: number }
  | { type: "solved"; charges: Record<string, string> }
  | { type: "saved"; editingId: string }
  | ({ type: "load" } & CalcLoad);

function loaded(a: CalcLoad): CalcState {
  return {
    rows: a.fermions.map(draftFromFermion),
    scalarCharge: a.scalarCharge,
    name: a.name ?? "",
    scalars: (a.scalars ?? []).map(draftFromScalar),
    terms: (a.terms ?? []).join("\n"),
    forbidden: (a.forbidden ?? []).join("\n"),
    normalize: a.normalize ?? a.scalars?.[0]?.name ?? "",
    editingId: a.editingId ?? null,
    dirty: false,
  };
}

/**
 * The normalised scalar follows its row: renamed, it keeps being the one set to 1; removed (or none chosen yet),
 * the first scalar takes its place, so the choice always names a scalar of the table.
 */
function withNormalize(before: CalcState, after: CalcState): CalcState {
  const names = after.scalars.map((r) => r.name.trim());
  if (names.includes(after.normalize)) return after;
  const row = before.scalars.find((r) => r.name.trim() === before.normalize);
  const same = row ? after.scalars.find((r) => r.key === row.key) : undefined;
  return { ...after, normalize: same ? same.name.trim() : (names[0] ?? "") };
}

function edited(s: CalcState, a: Exclude<CalcAction, { type: "load" | "saved" }>): CalcState {
  switch (a.type) {
    case "edit":
      return { ...s, rows: s.rows.map((r) => (r.key === a.key ? { ...r, ...a.patch } : r)) };
    case "add":
      return { ...s, rows: [...s.rows, blankRow({ pq: "0" })] };
    case "remove":
      return { ...s, rows: s.rows.filter((r) => r.key !== a.key) };
    case "scalar":
      return { ...s, scalarCharge: a.value };
    case "text":
      return { ...s, [a.field]: a.value };
    case "scalar-edit":
      return withNormalize(s, { ...s, scalars: s.scalars.map((r) => (r.key === a.key ? { ...r, ...a.patch } : r)) });
    case "scalar-add":
      return withNormalize(s, {
        ...s,
        scalars: [...s.scalars, blankRow({ colour: "1", name: s.scalars.length === 0 ? "Phi" : "" })],
      });
    case "scalar-remove":
      return withNormalize(s, { ...s, scalars: s.scalars.filter((r) => r.key !== a.key) });
    case "solved":
      // The solved charges fill the table; the normalised scalar has charge 1, so X_S = 1.
      return {
        ...s,
        rows: s.rows.map((r) => (a.charges[r.name.trim()] !== undefined ? { ...r, pq: a.charges[r.name.trim()] } : r)),
        scalarCharge: "1",
      };
  }
}

export function calcReducer(s: CalcState, a: CalcAction): CalcState {
  if (a.type === "load") return loaded(a);
  if (a.type === "saved") return { ...s, editingId: a.editingId, dirty: false };
  return { ...edited(s, a), dirty: true };
}

/** Start table: one vector-like heavy quark (3, 1, 0) as Q_L (X = 1) and Q_R (X = 0), X_S = 1. */
export function initialCalcState(): CalcState {
  return {
    rows: [blankRow({ name: "Q_L", chirality: "L", pq: "1" }), blankRow({ name: "Q_R", chirality: "R", pq: "0" })],
    scalarCharge: "1",
    name: "",
    scalars: [blankRow({ name: "Phi", colour: "1" })],
    terms: "",
    forbidden: "",
    normalize: "Phi",
    editingId: null,
    dirty: false,
  };
}

/** Whether the calculator names this field (or one of its parts, "field[k]") of row `index` (−1: the scalar). */
export function hasError(errors: AnomalyFieldError[], index: number, field: string): boolean {
  return errors.some((e) => e.index === index && (e.field === field || e.field.startsWith(`${field}[`)));
}
