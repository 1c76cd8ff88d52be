// Gauge check of one term before any PQ charge is solved: the U(1) charge (hypercharge Y, or X for SU(3)_L
// fields) adds up to zero, colour allows a singlet, and SU(2)_L or SU(3)_L allows a singlet.
import Fraction from "fraction.js";
import type { ElectroweakInput, FermionInput } from "../anomaly-types";
import { parseRational, toFractionString, type Rational } from "../rational";
import { colourName, parseColour, type Su3Irrep } from "../su3";
import { electricCharges } from "../anomaly";

/** What the gauge check needs of a field. */
export interface FieldGauge {
  colour: Su3Irrep;
  /** "sm": SU(2)_L × U(1)_Y; "su3l": SU(3)_L × U(1)_X; "explicit": electric charges only. */
  kind: ElectroweakInput["kind"];
  /** Y, X, or the mean electric charge for explicit components (the part that commutes with the multiplet). */
  u1: Rational;
  /** SU(2)_L dimension (sm) or SU(3)_L irrep (su3l). */
  su2Dim: number;
  su3l: Su3Irrep;
}

/** Read a field's gauge data, or the reason it cannot be read. */
export function readGauge(colour: FermionInput["colour"] | undefined, ew: ElectroweakInput): FieldGauge | string {
  const c = parseColour(colour ?? "1");
  if (!c.ok) return `colour ${c.reason}`;
  let charges: Rational[];
  try {
    charges = electricCharges(ew);
  } catch (e) {
    return (e as Error).message;
  }
  const base = { colour: c.irrep, kind: ew.kind, su2Dim: 1, su3l: { p: 0, q: 0 } };
  if (ew.kind === "sm") {
    const y = parseRational(ew.y);
    return y.ok ? { ...base, u1: y.value, su2Dim: ew.dim } : `hypercharge ${y.reason}`;
  }
  if (ew.kind === "su3l") {
    const x = parseRational(ew.x);
    const rep = ew.rep === "3" ? { p: 1, q: 0 } : ew.rep === "3bar" ? { p: 0, q: 1 } : { p: 0, q: 0 };
    return x.ok ? { ...base, u1: x.value, su3l: rep } : `U(1)_X charge ${x.reason}`;
  }
  const mean = charges.reduce((a, q) => a.add(q), new Fraction(0)).div(charges.length);
  return { ...base, u1: mean };
}

/** A factor of a term with its field's gauge data, already expanded by its power. */
export interface GaugeFactor {
  gauge: FieldGauge;
  conj: boolean;
  power: number;
}

const conjIrrep = (r: Su3Irrep, conj: boolean): Su3Irrep => (conj ? { p: r.q, q: r.p } : r);

/**
 * Whether a product of SU(3) irreps can contain a singlet. Exact for up to two non-singlet factors (one never,
 * two only when the second is the conjugate of the first); for three or more only triality (p − q mod 3 adds
 * to 0) is checked, a necessary condition.
 */
function su3Singlet(irreps: Su3Irrep[]): string | null {
  const nontrivial = irreps.filter((r) => r.p + r.q > 0);
  const triality = nontrivial.reduce((t, r) => t + r.p - r.q, 0);
  if (((triality % 3) + 3) % 3 !== 0) return `triality ${((triality % 3) + 3) % 3} ≠ 0`;
  if (nontrivial.length === 1) return `a single ${colourName(nontrivial[0])} has no singlet`;
  if (nontrivial.length === 2) {
    const [a, b] = nontrivial;
    if (a.p !== b.q || a.q !== b.p) return `${colourName(a)} × ${colourName(b)} has no singlet`;
  }
  return null;
}

/**
 * Whether a product of SU(2) multiplets of dimensions n_i contains a singlet. Exact: the product of spins
 * j_i = (n_i − 1)/2 contains every total spin from its minimum to Σ j_i in unit steps, so a singlet exists iff
 * Σ j_i is an integer (an even number of even-dimensional factors) and the largest j_i ≤ the sum of the others.
 */
function su2Singlet(dims: number[]): string | null {
  const twiceJ = dims.filter((n) => n > 1).map((n) => n - 1);
  const sum = twiceJ.reduce((a, b) => a + b, 0);
  if (sum % 2 !== 0) return "an odd number of even-dimensional SU(2) multiplets has no singlet";
  const max = Math.max(0, ...twiceJ);
  if (2 * max > sum) return `SU(2) multiplets of dimensions ${dims.filter((n) => n > 1).join(" × ")} have no singlet`;
  return null;
}

/** An SU(2)_L singlet (sm) or SU(3)_L singlet (su3l): its U(1) charge is its electric charge in both groups. */
const weakSinglet = (g: FieldGauge): boolean =>
  (g.kind === "sm" && g.su2Dim === 1) || (g.kind === "su3l" && g.su3l.p + g.su3l.q === 0);

/** Reasons the term is not gauge invariant (empty when it passes). */
export function gaugeProblems(factors: GaugeFactor[]): string[] {
  const out: string[] = [];
  const expand = <T>(f: (g: GaugeFactor) => T): T[] => factors.flatMap((g) => Array<T>(g.power).fill(f(g)));
  const u1 = factors.reduce((a, g) => a.add(g.gauge.u1.mul(g.conj ? -g.power : g.power)), new Fraction(0));
  // Weak singlets (an SU(2)_L or SU(3)_L singlet has U(1) charge = electric charge) fit either group, so a
  // singlet Φ entered as SU(2) × U(1) may sit in an SU(3)_L × U(1)_X model's terms; only multiplets decide.
  const kindsOf = (gs: GaugeFactor[]) => new Set(gs.map((g) => g.gauge.kind).filter((k) => k !== "explicit"));
  const kinds = kindsOf(factors.filter((g) => !weakSinglet(g.gauge)));
  if (kinds.size > 1) out.push("mixes SU(2)_L × U(1)_Y multiplets with SU(3)_L × U(1)_X multiplets");
  const named = kinds.size > 0 ? kinds : kindsOf(factors);
  const name = named.size !== 1 ? "electric charge" : named.has("su3l") ? "U(1)_X charge" : "hypercharge";
  if (!u1.equals(0)) out.push(`${name} adds up to ${toFractionString(u1)}, not 0`);
  const colour = su3Singlet(expand((g) => conjIrrep(g.gauge.colour, g.conj)));
  if (colour) out.push(`colour: ${colour}`);
  if (kinds.size === 1 && kinds.has("sm")) {
    const su2 = su2Singlet(expand((g) => g.gauge.su2Dim));
    if (su2) out.push(`SU(2)_L: ${su2}`);
  }
  if (kinds.size === 1 && kinds.has("su3l")) {
    const l = su3Singlet(expand((g) => conjIrrep(g.gauge.su3l, g.conj)));
    if (l) out.push(`SU(3)_L: ${l}`);
  }
  return out;
}
