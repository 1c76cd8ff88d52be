// Exact linear algebra over the rationals for the charge solver: reduced row echelon form, and the solutions of
// A x = b as a particular solution plus a null-space basis.
import Fraction from "fraction.js";
import type { Rational } from "../rational";

/** Solutions of A x = b: x = particular + Σ t_k basis[k]; `free` are the columns chosen as parameters. */
export type AffineSolution =
  { ok: true; particular: Rational[]; basis: Rational[][]; free: number[]; pivots: number[] } | { ok: false };

/** Reduced row echelon form of a copy of `m` (rows of equal length) and its pivot columns. */
function rref(m: readonly (readonly Rational[])[], cols: number): { rows: Rational[][]; pivots: number[] } {
  const rows = m.map((r) => r.slice());
  const pivots: number[] = [];
  let lead = 0;
  for (let c = 0; c < cols && lead < rows.length; c++) {
    const p = rows.findIndex((r, i) => i >= lead && !r[c].equals(0));
    if (p < 0) continue;
    [rows[lead], rows[p]] = [rows[p], rows[lead]];
    const inv = new Fraction(1).div(rows[lead][c]);
    rows[lead] = rows[lead].map((v) => v.mul(inv));
    for (let i = 0; i < rows.length; i++) {
      if (i === lead || rows[i][c].equals(0)) continue;
      const f = rows[i][c];
      rows[i] = rows[i].map((v, j) => v.sub(f.mul(rows[lead][j])));
    }
    pivots.push(c);
    lead++;
  }
  return { rows, pivots };
}

// Written here because no kept npm library does exact rational elimination on fraction.js values; the matrices
// are tiny (fields × terms), so plain Gauss–Jordan.
/** All solutions of A x = b (A is rows × n); `{ ok: false }` when the system is inconsistent. */
export function solveAffine(a: readonly (readonly Rational[])[], b: readonly Rational[], n: number): AffineSolution {
  const aug = a.map((r, i) => [...r, b[i]]);
  const { rows, pivots: all } = rref(aug, n + 1);
  if (all.includes(n)) return { ok: false };
  const pivots = all;
  const free = Array.from({ length: n }, (_, j) => j).filter((j) => !pivots.includes(j));
  const particular = Array.from({ length: n }, () => new Fraction(0));
  pivots.forEach((c, i) => (particular[c] = rows[i][n]));
  const basis = free.map((f) => {
    const v = Array.from({ length: n }, () => new Fraction(0));
    v[f] = new Fraction(1);
    pivots.forEach((c, i) => (v[c] = rows[i][f].neg()));
    return v;
  });
  return { ok: true, particular, basis, free, pivots };
}

/** Dot product of a row of coefficients with a vector. */
export function dot(row: readonly Rational[], x: readonly Rational[]): Rational {
  return row.reduce((acc, v, j) => acc.add(v.mul(x[j])), new Fraction(0));
}
