// Charge scans: the anomaly calculator over every combination of listed PQ charges, copies and scalar charges,
// giving the spectrum of E/N with counts, and the text syntax for lists and ranges typed into its fields.
import Fraction from "fraction.js";
import type { FermionInput, RationalInput } from "../anomaly-types";
import { AnomalyInputError, anomaly, type AnomalyFieldError } from "../anomaly";
import { parseRational, toFractionString, type Rational } from "../rational";
import type { EnsembleValue } from "./ensemble";

/** A fermion whose PQ charge and number of copies may each be one value or a list of values to scan. */
export interface ScanFermion extends Omit<FermionInput, "pq" | "copies"> {
  pq: RationalInput | RationalInput[];
  copies?: number | number[];
}

/** A distinct E/N of a scan; nonIntegerNDW (only when > 0) counts its combinations whose N_DW is not an integer. */
interface ScanValue extends EnsembleValue {
  nonIntegerNDW?: number;
}

export interface ScanResult {
  /** Combinations tried (including those with N = 0). */
  combinations: number;
  distinct: ScanValue[];
  /** Combinations with N = 0: no colour anomaly, no E/N. */
  zeroN: number;
  /**
   * Combinations whose N_DW = |2N/X_S| is not an integer. A Yukawa term ties the fermions' charge difference to
   * X_S and then makes 2N/X_S an integer, so a fraction means no renormalisable coupling links these charges.
   */
  nonIntegerNDW: number;
}

/** Largest number of combinations a scan will run. */
export const MAX_SCAN_COMBINATIONS = 1_000_000;

const asList = <T>(v: T | T[] | undefined, dflt: T): T[] => (v === undefined ? [dflt] : Array.isArray(v) ? v : [v]);

function lcm(a: bigint, b: bigint): bigint {
  let x = a;
  let y = b;
  while (y) [x, y] = [y, x % y];
  return (a / x) * b;
}

/** Rationals → integers over one common denominator (as doubles; refused past 2^53). */
function toIntegers(values: Rational[][]): { ints: number[][]; scale: bigint } {
  let scale = 1n;
  for (const list of values) for (const v of list) scale = lcm(scale, v.d);
  const ints = values.map((list) =>
    list.map((v) => {
      const x = (v.s * v.n * scale) / v.d;
      if (x > BigInt(Number.MAX_SAFE_INTEGER) || -x > BigInt(Number.MAX_SAFE_INTEGER))
        throw new Error("charge scan: the charges' denominators are too large for an exact scan");
      return Number(x);
    }),
  );
  return { ints, scale };
}

/** Read the lists of one fermion; bad entries become errors naming the fermion and the field. */
function readLists(f: ScanFermion, i: number, errors: AnomalyFieldError[]): { pq: Rational[]; copies: number[] } {
  const label = `fermion ${i + 1}${f.name ? ` (${f.name})` : ""}`;
  const pq: Rational[] = [];
  asList(f.pq, 0).forEach((v, k) => {
    const r = parseRational(v);
    if (r.ok) pq.push(r.value);
    else errors.push({ index: i, field: "pq", message: `${label}: PQ charge ${k + 1} of the list ${r.reason}` });
  });
  const copies = asList(f.copies, 1);
  copies.forEach((c, k) => {
    if (!Number.isSafeInteger(c) || c < 0)
      errors.push({
        index: i,
        field: "copies",
        message: `${label}: copies ${k + 1} of the list must be a non-negative integer`,
      });
  });
  if (pq.length === 0 && errors.length === 0)
    errors.push({ index: i, field: "pq", message: `${label}: the list of PQ charges is empty` });
  if (copies.length === 0) errors.push({ index: i, field: "copies", message: `${label}: the list of copies is empty` });
  return { pq, copies };
}

/**
 * Every combination of the listed values (one PQ charge and one number of copies per fermion, one X_S):
 * E, N from the anomaly calculator's per-fermion shares (linear in X and copies), summed exactly.
 * @throws AnomalyInputError for bad input; Error past {@link MAX_SCAN_COMBINATIONS} combinations.
 */
export function scanAnomaly(
  fermions: readonly ScanFermion[],
  scalarCharge: RationalInput | RationalInput[] = 1,
): ScanResult {
  const errors: AnomalyFieldError[] = [];
  const lists = fermions.map((f, i) => readLists(f, i, errors));
  const xsList: Rational[] = [];
  for (const v of asList(scalarCharge, 1)) {
    const r = parseRational(v);
    if (!r.ok || r.value.equals(0))
      errors.push({
        index: -1,
        field: "scalarCharge",
        message: `scalar PQ charge X_S ${String(v)} ${r.ok ? "must not be 0" : r.reason}`,
      });
    else xsList.push(r.value);
  }
  if (errors.length) throw new AnomalyInputError(errors);
  // The shares per unit X and copy, from the calculator itself (it also checks colour, charges, chirality).
  const unit = anomaly(fermions.map((f) => ({ ...f, pq: 1, copies: 1 }))).contributions;
  let combinations = xsList.length;
  for (const l of lists) combinations *= l.pq.length * l.copies.length;
  if (combinations > MAX_SCAN_COMBINATIONS)
    throw new Error(
      `charge scan: ${combinations.toLocaleString("en")} combinations is more than ${MAX_SCAN_COMBINATIONS.toLocaleString("en")}; shorten a list`,
    );
  // Each fermion's options: its (E, N) shares for every (X, copies) pair.
  const eOpts: Rational[][] = [];
  const nOpts: Rational[][] = [];
  lists.forEach((l, i) => {
    const e: Rational[] = [];
    const n: Rational[] = [];
    for (const x of l.pq)
      for (const c of l.copies) {
        e.push(unit[i].dE.mul(x).mul(c));
        n.push(unit[i].dN.mul(x).mul(c));
      }
    eOpts.push(e);
    nOpts.push(n);
  });
  const E = toIntegers(eOpts);
  const N = toIntegers(nOpts);
  const raw = new Map<string, { e: number; n: number; c: number }>();
  const pick = new Int32Array(fermions.length);
  // Odometer over the fermions' options: one combination per turn.
  for (let done = 0; done < combinations / xsList.length; done++) {
    let e = 0;
    let n = 0;
    for (let i = 0; i < pick.length; i++) {
      e += E.ints[i][pick[i]];
      n += N.ints[i][pick[i]];
    }
    const k = `${e},${n}`;
    const v = raw.get(k);
    if (v) v.c++;
    else raw.set(k, { e, n, c: 1 });
    for (let i = 0; i < pick.length; i++) {
      if (++pick[i] < E.ints[i].length) break;
      pick[i] = 0;
    }
  }
  return summariseScan(raw, E.scale, N.scale, xsList);
}

function summariseScan(
  raw: Map<string, { e: number; n: number; c: number }>,
  eScale: bigint,
  nScale: bigint,
  xsList: Rational[],
): ScanResult {
  const byRatio = new Map<string, { value: Rational; v: ScanValue }>();
  let zeroN = 0;
  let nonIntegerNDW = 0;
  for (const { e, n, c } of raw.values()) {
    if (n === 0) {
      zeroN += c * xsList.length;
      continue;
    }
    const N = new Fraction(BigInt(n), nScale);
    const ratio = new Fraction(BigInt(e), eScale).div(N);
    const key = toFractionString(ratio);
    const dwExact = xsList.map((xs) => N.mul(2).div(xs).abs());
    const dw = dwExact.map((d) => d.valueOf());
    const fractional = c * dwExact.filter((d) => d.d !== 1n).length;
    nonIntegerNDW += fractional;
    const got = byRatio.get(key);
    if (got) {
      got.v.count += c * xsList.length;
      got.v.nDWMin = Math.min(got.v.nDWMin, ...dw);
      got.v.nDWMax = Math.max(got.v.nDWMax, ...dw);
      if (fractional > 0) got.v.nonIntegerNDW = (got.v.nonIntegerNDW ?? 0) + fractional;
    } else
      byRatio.set(key, {
        value: ratio,
        v: {
          eOverN: key,
          count: c * xsList.length,
          nDWMin: Math.min(...dw),
          nDWMax: Math.max(...dw),
          ...(fractional > 0 ? { nonIntegerNDW: fractional } : {}),
        },
      });
  }
  const distinct = [...byRatio.values()].sort((a, b) => a.value.compare(b.value)).map((x) => x.v);
  const combinations = distinct.reduce((s, d) => s + d.count, 0) + zeroN;
  return { combinations, distinct, zeroN, nonIntegerNDW };
}

/** Outcome of reading a field that may hold a list or range. */
export type ScanFieldParse = { ok: true; values: string[]; isList: boolean } | { ok: false; reason: string };

/** Longest range a field may expand to. */
const MAX_RANGE = 1000;

/**
 * Read a calculator field: one rational ("-1/3"), an integer range ("1..3", "-2..2"), or a braced list of
 * rationals and ranges ("{-1, 0, 1}", "{1/3, 2..4}"). Values come back as canonical fraction strings.
 */
export function parseScanField(text: string): ScanFieldParse {
  const t = text.trim().replace(/\u2212/g, "-");
  const braced = t.startsWith("{") || t.endsWith("}");
  if (braced && !(t.startsWith("{") && t.endsWith("}")))
    return { ok: false, reason: `"${text}": a list needs both braces, as in {-1, 0, 1}` };
  const body = braced ? t.slice(1, -1) : t;
  const items = braced ? body.split(",") : [body];
  const values: string[] = [];
  for (let k = 0; k < items.length; k++) {
    const item = items[k].trim();
    const where = braced ? `item ${k + 1} ("${item}")` : `"${item}"`;
    if (item === "") return { ok: false, reason: `${where} is empty` };
    const range = /^([+-]?\d+)\s*\.\.\s*([+-]?\d+)$/.exec(item);
    if (range) {
      const a = Number(range[1]);
      const b = Number(range[2]);
      if (b < a) return { ok: false, reason: `${where}: a range runs upward, as in 1..3` };
      if (b - a + 1 > MAX_RANGE) return { ok: false, reason: `${where}: a range may hold at most ${MAX_RANGE} values` };
      for (let v = a; v <= b; v++) values.push(String(v));
      continue;
    }
    if (item.includes("..")) return { ok: false, reason: `${where}: ranges take integers, as in -2..2` };
    const r = parseRational(item);
    if (!r.ok) return { ok: false, reason: `${where} ${r.reason}` };
    values.push(toFractionString(r.value));
  }
  return { ok: true, values, isList: braced || values.length > 1 };
}
