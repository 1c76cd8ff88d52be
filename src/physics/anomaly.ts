// The anomaly calculator: exact E, N, E/N and N_DW of a list of Weyl multiplets, with a
// per-field breakdown for the UI and input errors that name the fermion and the field at fault.
import Fraction from "fraction.js";
import type { ElectroweakInput, FermionInput } from "./anomaly-types";
import { parseRational, type Rational } from "./rational";
import { colourName, parseColour, su3Dimension, su3Index, type Su3Irrep } from "./su3";

/** One field's share of the anomaly coefficients (copies included). */
export interface AnomalyContribution {
  /** Position in the input list (0-based). */
  index: number;
  /** The field's name, or "fermion k" (1-based) when it has none. */
  name: string;
  colour: Su3Irrep;
  colourName: string;
  /** d(R_c). */
  colourDim: number;
  /** T(R_c), normalised to T(3) = 1/2. */
  colourIndex: Rational;
  /** Electric charges of the electroweak components. */
  charges: Rational[];
  /** PQ charge as a left-handed field: X for L, −X for R. */
  pqLeft: Rational;
  copies: number;
  /** X·d(R_c)·Σ Q²·copies. */
  dE: Rational;
  /** X·T(R_c)·n_w·copies. */
  dN: Rational;
}

/** What the calculator returns for a valid field content. */
export interface AnomalyResult {
  E: Rational;
  N: Rational;
  /** E/N, or null when N = 0 (the ratio is undefined: no QCD anomaly, no QCD axion). */
  eOverN: Rational | null;
  /** N_DW = |2N/X_S| as a number; null when N = 0. Not always an integer for inconsistent charge choices. */
  domainWall: number | null;
  /** N_DW as an exact rational; null when N = 0. */
  domainWallExact: Rational | null;
  /** X_S used for N_DW. */
  scalarCharge: Rational;
  contributions: AnomalyContribution[];
  /** Human-readable remarks, e.g. "E/N undefined (N = 0)" or a non-integer N_DW. */
  notes: string[];
}

/** One problem with the input: which fermion (0-based; −1 for options), which field, and a full sentence. */
export interface AnomalyFieldError {
  index: number;
  field: string;
  message: string;
}

/** Options of the calculator. */
export interface AnomalyOpts {
  /** PQ charge X_S of the scalar whose VEV sets f_a, for N_DW = |2N/X_S|. @default 1 */
  scalarCharge?: string | number;
}

/** Thrown by {@link anomaly} for bad input; `errors` lists every problem found, the first one is in `message`. */
export class AnomalyInputError extends Error {
  readonly field: string;
  readonly index: number;
  readonly errors: AnomalyFieldError[];
  constructor(errors: AnomalyFieldError[]) {
    const first = errors[0] ?? { index: -1, field: "fermions", message: "invalid input" };
    super(errors.length > 1 ? `${first.message} (and ${errors.length - 1} more)` : first.message);
    this.name = "AnomalyInputError";
    this.field = first.field;
    this.index = first.index;
    this.errors = errors;
  }
}

/** Largest SU(2) or explicit multiplet accepted; far beyond any model, small enough to keep sums exact. */
const MAX_COMPONENTS = 1000;

function show(v: unknown): string {
  return typeof v === "string" ? JSON.stringify(v) : String(v);
}

function fermionLabel(f: FermionInput | undefined, i: number): string {
  const name = typeof f?.name === "string" && f.name.trim() !== "" ? ` (${f.name.trim()})` : "";
  return `fermion ${i + 1}${name}`;
}

/** Collects errors for one fermion while reading its fields. */
class FieldReader {
  constructor(
    private readonly errors: AnomalyFieldError[],
    private readonly index: number,
    private readonly label: string,
  ) {}

  fail(field: string, message: string): void {
    this.errors.push({ index: this.index, field, message: `${this.label}: ${message}` });
  }

  rational(field: string, what: string, value: unknown): Rational | null {
    const r = parseRational(value);
    if (r.ok) return r.value;
    this.fail(field, value === undefined ? `${what} is missing` : `${what} ${show(value)} ${r.reason}`);
    return null;
  }
}

/** T₃ eigenvalues (n−1)/2, …, −(n−1)/2 of an SU(2) multiplet of dimension n. */
function isospin(n: number): Rational[] {
  return Array.from({ length: n }, (_, k) => new Fraction(n - 1 - 2 * k, 2));
}

function readCharges(ew: ElectroweakInput | undefined, rd: FieldReader): Rational[] | null {
  if (typeof ew !== "object" || ew === null) {
    rd.fail("ew", "electroweak charges are missing");
    return null;
  }
  switch (ew.kind) {
    case "sm": {
      const dimOk = Number.isSafeInteger(ew.dim) && ew.dim >= 1 && ew.dim <= MAX_COMPONENTS;
      if (!dimOk) rd.fail("ew.dim", `SU(2) dimension ${show(ew.dim)} must be an integer from 1 to ${MAX_COMPONENTS}`);
      const y = rd.rational("ew.y", "hypercharge Y", ew.y);
      if (!dimOk || !y) return null;
      return isospin(ew.dim).map((t3) => t3.add(y));
    }
    case "su3l": {
      const x = rd.rational("ew.x", "SU(3)_L charge X", ew.x);
      const b = ew.rep === "1" && ew.b === undefined ? new Fraction(0) : rd.rational("ew.b", "b = β/√3", ew.b);
      if (ew.rep !== "1" && ew.rep !== "3" && ew.rep !== "3bar") {
        rd.fail("ew.rep", `SU(3)_L representation ${show(ew.rep)} must be "1", "3" or "3bar"`);
        return null;
      }
      if (!x || !b) return null;
      if (ew.rep === "1") return [x];
      // On a triplet T₃ = diag(1/2, −1/2, 0) and βT₈ = (b/2)·diag(1, 1, −2); the antitriplet flips both signs.
      const s = ew.rep === "3" ? 1 : -1;
      const half = new Fraction(1, 2);
      const bHalf = b.div(2);
      return [half.add(bHalf).mul(s).add(x), half.neg().add(bHalf).mul(s).add(x), b.mul(-s).add(x)];
    }
    case "explicit": {
      const list: unknown = ew.charges;
      if (!Array.isArray(list) || list.length === 0) {
        rd.fail("ew.charges", "explicit charges: at least one component charge is needed");
        return null;
      }
      if (list.length > MAX_COMPONENTS) {
        rd.fail("ew.charges", `explicit charges: ${list.length} components is more than ${MAX_COMPONENTS}`);
        return null;
      }
      // A caller (e.g. the UI table) may state the multiplet size next to the list; it must agree.
      const dim: unknown = (ew as { dim?: unknown }).dim;
      if (dim !== undefined && dim !== list.length) {
        rd.fail(
          "ew.charges",
          `explicit charges: ${list.length} charges given for a multiplet of dimension ${show(dim)}`,
        );
        return null;
      }
      const out = list.map((c, k) => rd.rational(`ew.charges[${k}]`, `electric charge ${k + 1}`, c));
      return out.every((c): c is Rational => c !== null) ? out : null;
    }
    default: {
      const kind: unknown = (ew as { kind?: unknown }).kind;
      rd.fail("ew.kind", `electroweak kind ${show(kind)} must be "sm", "su3l" or "explicit"`);
      return null;
    }
  }
}

function readFermion(f: FermionInput, i: number, errors: AnomalyFieldError[]): AnomalyContribution | null {
  const label = fermionLabel(f, i);
  const rd = new FieldReader(errors, i, label);
  if (typeof f !== "object" || f === null) {
    rd.fail("fermion", "is not an object");
    return null;
  }
  const colour = parseColour(f.colour);
  if (!colour.ok) {
    rd.fail("colour", f.colour === undefined ? "colour representation is missing" : `colour ${colour.reason}`);
  }
  const charges = readCharges(f.ew, rd);
  if (f.chirality !== "L" && f.chirality !== "R")
    rd.fail("chirality", `chirality ${show(f.chirality)} must be "L" or "R"`);
  const pq = rd.rational("pq", "PQ charge", f.pq);
  const copies = f.copies ?? 1;
  const copiesOk = Number.isSafeInteger(copies) && copies >= 0;
  if (!copiesOk) rd.fail("copies", `copies ${show(copies)} must be a non-negative integer`);
  if (!colour.ok || !charges || !pq || !copiesOk || (f.chirality !== "L" && f.chirality !== "R")) return null;

  const { p, q } = colour.irrep;
  const d = su3Dimension(p, q);
  const t = su3Index(p, q);
  // A right-handed field is the conjugate of a left-handed one: same d, T and Q², opposite PQ charge.
  const x = f.chirality === "R" ? pq.neg() : pq;
  const sumQ2 = charges.reduce((acc, c) => acc.add(c.mul(c)), new Fraction(0));
  return {
    index: i,
    name: typeof f.name === "string" && f.name.trim() !== "" ? f.name.trim() : `fermion ${i + 1}`,
    colour: { p, q },
    colourName: colourName({ p, q }),
    colourDim: d,
    colourIndex: t,
    charges,
    pqLeft: x,
    copies,
    dE: x.mul(d).mul(sumQ2).mul(copies),
    dN: x.mul(t).mul(charges.length).mul(copies),
  };
}

/**
 * Validate and compute; never throws for bad input. Use this from the UI, {@link anomaly} from code.
 * @param fermions left- or right-handed Weyl multiplets; an empty list gives E = N = 0.
 * @param opts.scalarCharge X_S for N_DW = |2N/X_S|. @default 1
 */
export function tryAnomaly(
  fermions: readonly FermionInput[],
  opts: AnomalyOpts = {},
): { ok: true; result: AnomalyResult } | { ok: false; errors: AnomalyFieldError[] } {
  const errors: AnomalyFieldError[] = [];
  if (!Array.isArray(fermions)) {
    return { ok: false, errors: [{ index: -1, field: "fermions", message: "fermions: expected a list of fermions" }] };
  }
  let xs: Rational | null = new Fraction(1);
  if (opts.scalarCharge !== undefined) {
    const r = parseRational(opts.scalarCharge);
    xs = r.ok ? r.value : null;
    if (!r.ok)
      errors.push({
        index: -1,
        field: "scalarCharge",
        message: `scalar PQ charge 𝒳_S ${show(opts.scalarCharge)} ${r.reason}`,
      });
    else if (r.value.equals(0)) {
      xs = null;
      errors.push({
        index: -1,
        field: "scalarCharge",
        message: "scalar PQ charge 𝒳_S must not be 0 (N_DW = |2N/𝒳_S|)",
      });
    }
  }
  const contributions = fermions.map((f, i) => readFermion(f, i, errors));
  if (errors.length > 0 || !xs) return { ok: false, errors };

  const rows = contributions as AnomalyContribution[];
  const E = rows.reduce((acc, c) => acc.add(c.dE), new Fraction(0));
  const N = rows.reduce((acc, c) => acc.add(c.dN), new Fraction(0));
  const notes: string[] = [];
  let eOverN: Rational | null = null;
  let domainWallExact: Rational | null = null;
  if (N.equals(0)) {
    notes.push("E/N undefined: N = 0 (no colour anomaly, so no QCD axion and no domain-wall number)");
  } else {
    eOverN = E.div(N);
    domainWallExact = N.mul(2).div(xs).abs();
    if (!domainWallExact.equals(domainWallExact.floor())) {
      notes.push(
        `N_DW = |2N/𝒳_S| = ${domainWallExact.toFraction()} is not an integer: check the PQ charges against 𝒳_S`,
      );
    }
  }
  return {
    ok: true,
    result: {
      E,
      N,
      eOverN,
      domainWall: domainWallExact ? domainWallExact.valueOf() : null,
      domainWallExact,
      scalarCharge: xs,
      contributions: rows,
      notes,
    },
  };
}

/**
 * E, N, E/N and N_DW of a field content: N = Σ X·T(R_c)·n_w·copies,
 * E = Σ X·d(R_c)·Σ Q²·copies, with X negated for right-handed fields.
 * @param opts.scalarCharge X_S for N_DW = |2N/X_S|. @default 1
 * @throws AnomalyInputError naming the first bad field (all problems in `errors`).
 */
export function anomaly(fermions: readonly FermionInput[], opts: AnomalyOpts = {}): AnomalyResult {
  const r = tryAnomaly(fermions, opts);
  if (!r.ok) throw new AnomalyInputError(r.errors);
  return r.result;
}

/**
 * Electric charges of the components of one electroweak multiplet (SM-like, SU(3)_L or explicit).
 * @throws AnomalyInputError when the input is bad.
 */
export function electricCharges(ew: ElectroweakInput): Rational[] {
  const errors: AnomalyFieldError[] = [];
  const charges = readCharges(ew, new FieldReader(errors, 0, "electroweak multiplet"));
  if (!charges) throw new AnomalyInputError(errors);
  return charges;
}
