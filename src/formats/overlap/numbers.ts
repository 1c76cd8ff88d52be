// Numbers of the overlap summary as text: a mass unit suited to a range, enough significant figures that no two
// listed intervals print the same, shares in percent, E/N ranges, and values with uncertainty as "1.92(4)".
import type { EOverNCover, IntervalList } from "../../analysis/overlap-summary";

export interface MassUnit {
  name: string;
  /** The unit in eV. */
  ev: number;
  /** siunitx unit macro. */
  si: string;
  /** Plain LaTeX math. */
  math: string;
}

const UNITS: MassUnit[] = [
  { name: "peV", ev: 1e-12, si: "\\pico\\electronvolt", math: "\\mathrm{peV}" },
  { name: "neV", ev: 1e-9, si: "\\nano\\electronvolt", math: "\\mathrm{neV}" },
  { name: "μeV", ev: 1e-6, si: "\\micro\\electronvolt", math: "\\mu\\mathrm{eV}" },
  { name: "meV", ev: 1e-3, si: "\\milli\\electronvolt", math: "\\mathrm{meV}" },
  { name: "eV", ev: 1, si: "\\electronvolt", math: "\\mathrm{eV}" },
];

/** The unit whose numbers for the range's geometric middle fall in [1, 1000). */
export function massUnitFor(loEv: number, hiEv: number): MassUnit {
  const mid = Math.sqrt(loEv * hiEv);
  let unit = UNITS[0];
  for (const u of UNITS) if (mid >= u.ev) unit = u;
  return unit;
}

/** `x` with `digits` significant figures, plain (no exponent) for 10⁻³ ≤ |x| < 10⁶. */
export function sig(x: number, digits: number): string {
  if (!Number.isFinite(x)) return "";
  if (x === 0) return "0";
  const ax = Math.abs(x);
  if (ax >= 1e-3 && ax < 1e6) return String(Number(x.toPrecision(digits)));
  const [mant, exp] = x.toExponential(digits - 1).split("e");
  return `${String(Number(mant))}e${exp.replace(/^\+/, "")}`;
}

/**
 * The fewest significant figures (at least `min`) with which every interval's two ends differ and no two
 * intervals print the same, in the given unit; `max` caps it (doubles hold about 17).
 */
export function distinctDigits(
  lo: ArrayLike<number>,
  hi: ArrayLike<number>,
  unitEv: number,
  min = 3,
  max = 12,
): number {
  for (let d = min; d < max; d++) {
    let ok = true;
    let prev = "";
    for (let i = 0; i < lo.length && ok; i++) {
      const a = sig(lo[i] / unitEv, d);
      const b = sig(hi[i] / unitEv, d);
      const both = `${a}|${b}`;
      if (a === b || both === prev) ok = false;
      prev = both;
    }
    if (ok) return d;
  }
  return max;
}

/** Digits that tell the intervals of a list apart (ends of the list's mass range included). */
export function listDigits(list: IntervalList, unitEv: number): number {
  return distinctDigits(list.lo, list.hi, unitEv);
}

/** A share as a percentage with two significant figures ("38 %", "0.52 %", "< 0.01 %"). */
export function percent(share: number): string {
  if (share <= 0) return "0 %";
  if (share >= 1) return "100 %";
  const p = share * 100;
  if (p < 0.01) return "< 0.01 %";
  return `${p >= 10 ? String(Math.round(p)) : sig(p, 2)} %`;
}

/** E/N covered: "all", "none", or ranges joined by " ∪ " (four significant figures). */
export function eOverNText(e: EOverNCover): string {
  if (e === "all") return "all";
  if (e.length === 0) return "none";
  return e.map(([a, b]) => (a === b ? sig(a, 4) : `${sig(a, 4)} to ${sig(b, 4)}`)).join(" ∪ ");
}

/** A value with its one-σ uncertainty in the last digits, as the papers write it: 1.92(4), 5.691(51). */
export function withUncertainty(value: number, sigma: number): string {
  const text = String(value);
  const decimals = text.includes(".") ? text.length - text.indexOf(".") - 1 : 0;
  const unc = Math.round(sigma * 10 ** decimals);
  return unc > 0 ? `${text}(${unc})` : text;
}
