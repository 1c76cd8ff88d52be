// The PQ-charge solver: from the terms a model keeps, the exact charges (null space of the invariance
// equations, one scalar normalised to 1), E/N and N_DW through the anomaly calculator, and what stays open.
import Fraction from "fraction.js";
import type { FermionInput } from "../anomaly-types";
import { tryAnomaly } from "../anomaly";
import { toFractionString, type Rational } from "../rational";
import { gaugeProblems, readGauge, type FieldGauge, type GaugeFactor } from "./gauge";
import { dot, solveAffine } from "./linalg";
import { formatTerm } from "./syntax";
import type { ChargeProblem, ChargeSolution, Term } from "./types";

interface Field {
  name: string;
  gauge: FieldGauge;
  /** Index in the fermion list, or −1 for a scalar. */
  fermion: number;
}

/** Check names and gauge data of every field; the normalised scalar goes first so it is never a free column. */
function readFields(p: ChargeProblem, errors: string[]): Field[] {
  const fields: Field[] = [];
  const seen = new Set<string>();
  const add = (name: unknown, label: string, gauge: FieldGauge | string, fermion: number) => {
    if (typeof name !== "string" || name.trim() === "") {
      errors.push(`${label} has no name (terms refer to fields by name)`);
      return;
    }
    if (seen.has(name.trim())) errors.push(`${label}: the name "${name.trim()}" is used twice`);
    seen.add(name.trim());
    if (typeof gauge === "string") errors.push(`${label} (${name.trim()}): ${gauge}`);
    else fields.push({ name: name.trim(), gauge, fermion });
  };
  const scalars = Array.isArray(p.scalars) ? p.scalars : [];
  const order = [...scalars.keys()].sort(
    (a, b) => Number(scalars[b]?.name === p.normalize) - Number(scalars[a]?.name === p.normalize),
  );
  for (const k of order) add(scalars[k]?.name, `scalar ${k + 1}`, readGauge(scalars[k]?.colour, scalars[k]?.ew), -1);
  (Array.isArray(p.fermions) ? p.fermions : []).forEach((f, i) =>
    add(f?.name, `fermion ${i + 1}`, readGauge(f?.colour, f?.ew), i),
  );
  if (!scalars.some((s) => s?.name?.trim() === p.normalize))
    errors.push(`the normalised field "${String(p.normalize)}" is not one of the scalars`);
  return fields;
}

/** Invariance row of a term (Σ ±power per field) and its gauge factors, or the reason it names no field. */
function readTerm(term: Term, label: string, index: Map<string, number>, fields: Field[], errors: string[]) {
  if (!Array.isArray(term) || term.length === 0) {
    errors.push(`${label}: a term needs at least one field`);
    return null;
  }
  const row = fields.map(() => new Fraction(0));
  const factors: GaugeFactor[] = [];
  let ok = true;
  for (const f of term) {
    const j = index.get(typeof f?.field === "string" ? f.field.trim() : "");
    const power = f?.power ?? 1;
    if (j === undefined) errors.push(`${label}: unknown field "${String(f?.field)}"`);
    if (!Number.isSafeInteger(power) || power < 1)
      errors.push(`${label}: power ${String(power)} must be a positive integer`);
    if (j === undefined || !Number.isSafeInteger(power) || power < 1) {
      ok = false;
      continue;
    }
    row[j] = row[j].add(f.conj ? -power : power);
    factors.push({ gauge: fields[j].gauge, conj: f.conj === true, power });
  }
  return ok ? { row, factors } : null;
}

/** The fermions with the PQ charges of a vector over the fields (scalars are skipped). */
function withCharges(fermions: readonly FermionInput[], fields: Field[], x: Rational[]): FermionInput[] {
  const out = fermions.map((f) => ({ ...f }));
  fields.forEach((fd, j) => {
    if (fd.fermion >= 0) out[fd.fermion].pq = toFractionString(x[j]);
  });
  return out;
}

function anomalyOf(fermions: readonly FermionInput[], fields: Field[], x: Rational[]) {
  const r = tryAnomaly(withCharges(fermions, fields, x));
  if (!r.ok) throw new Error(r.errors[0]?.message ?? "anomaly calculator refused the solved charges");
  return r.result;
}

/**
 * Whether varying field j's charge alone changes E and N as its solution direction does: then a charge scan of
 * the table over the free fields (other charges as solved) spans the solutions' E/N; otherwise charges of other
 * fermions follow from it and such a scan would break kept terms.
 */
function aloneMatches(
  fermions: readonly FermionInput[],
  fields: Field[],
  j: number,
  dir: { E: Rational; N: Rational },
) {
  const alone = anomalyOf(
    fermions,
    fields,
    fields.map((_, k) => new Fraction(k === j ? 1 : 0)),
  );
  return alone.E.equals(dir.E) && alone.N.equals(dir.N);
}

/**
 * Solve the PQ charges that leave every kept term invariant, with the `normalize` scalar's charge 1. Terms are
 * gauge-checked first (a failing one is named and nothing is solved). E/N is "determined" when E and N are
 * proportional as affine forms on the solution space; symmetries without anomaly (Y, B, L) never change it.
 */
export function solvePqCharges(p: ChargeProblem): ChargeSolution {
  const errors: string[] = [];
  const fields = readFields(p, errors);
  const index = new Map(fields.map((f, j) => [f.name, j]));
  const read = (list: Term[] | undefined, what: string) =>
    (Array.isArray(list) ? list : []).map((t, k) => {
      const label = `${what} ${k + 1}${Array.isArray(t) ? ` (${formatTerm(t)})` : ""}`;
      return { label, r: readTerm(t, label, index, fields, errors) };
    });
  const kept = read(p.terms, "term");
  const forbidden = read(p.forbidden, "forbidden term");
  for (const { label, r } of kept) if (r) for (const why of gaugeProblems(r.factors)) errors.push(`${label}: ${why}`);
  if (errors.length > 0) return { ok: false, errors };

  const n = fields.length;
  const norm = index.get(p.normalize) ?? 0;
  const a = [...kept.map(({ r }) => r!.row), fields.map((_, j) => new Fraction(j === norm ? 1 : 0))];
  const b = [...kept.map(() => new Fraction(0)), new Fraction(1)];
  const sol = solveAffine(a, b, n);
  if (!sol.ok) {
    return { ok: false, errors: [`the kept terms force the PQ charge of ${p.normalize} to 0: no PQ symmetry is left`] };
  }
  const base = anomalyOf(p.fermions, fields, sol.particular);
  const dirs = sol.basis.map((v) => anomalyOf(p.fermions, fields, v));
  const axion = !base.N.equals(0) || dirs.some((d) => !d.N.equals(0));

  // E/N constant ⇔ (E₀, e₁…e_k) = r·(N₀, n₁…n_k) for one r.
  const ens = [base, ...dirs];
  const pivot = ens.find((d) => !d.N.equals(0));
  const ratio = pivot ? pivot.E.div(pivot.N) : null;
  const determined = axion && ratio !== null && ens.every((d) => d.E.equals(ratio.mul(d.N)));

  // Prefer a representative with N ≠ 0 when one exists.
  let x = sol.particular;
  const k = dirs.findIndex((d) => !d.N.equals(0));
  if (base.N.equals(0) && k >= 0) x = x.map((v, j) => v.add(sol.basis[k][j]));
  const rep = anomalyOf(p.fermions, fields, x);
  const nFixed = axion && dirs.every((d) => d.N.equals(0));

  const freeDirs = dirs.flatMap((d, i) => (d.E.equals(0) && d.N.equals(0) ? [] : [i]));
  const charges: Record<string, string> = {};
  fields.forEach((f, j) => (charges[f.name] = toFractionString(x[j])));
  const forbiddenAllowed: number[] = [];
  const forbiddenByGauge: number[] = [];
  forbidden.forEach(({ r }, i) => {
    if (!r) return;
    if (gaugeProblems(r.factors).length > 0) forbiddenByGauge.push(i);
    else if (dot(r.row, sol.particular).equals(0) && sol.basis.every((v) => dot(r.row, v).equals(0)))
      forbiddenAllowed.push(i);
  });
  return {
    ok: true,
    axion,
    determined,
    eOverN: determined && ratio ? toFractionString(ratio) : null,
    nDW: nFixed && rep.domainWallExact ? toFractionString(rep.domainWallExact) : null,
    charges,
    forbiddenAllowed,
    E: toFractionString(rep.E),
    N: toFractionString(rep.N),
    free: freeDirs.map((i) => fields[sol.free[i]].name),
    scanExact: freeDirs.every((i) => aloneMatches(p.fermions, fields, sol.free[i], dirs[i])),
    undetermined: fields.filter((_, j) => sol.basis.some((v) => !v[j].equals(0))).map((f) => f.name),
    forbiddenByGauge,
  };
}
