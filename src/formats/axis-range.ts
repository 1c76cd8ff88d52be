// Typed axis ranges: a value with an optional unit ("5 µeV", "5 ueV", "3e-6 eV", "1.2 GHz" via m = hν,
// "10 meV"; a bare number is in the field's unit) and a checked min–max pair with messages naming the field.
import { massFromEv, massToEv, type MassUnit } from "../physics/units";
import { parseMassUnit } from "./units";

export type ParsedValue = { ok: true; value: number } | { ok: false; reason: string };
export type CheckedRange = { ok: true; range: [number, number] } | { ok: false; error: string };

const NUMBER_THEN_REST = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*)$/;

/**
 * A mass in eV from text: a number, optionally followed by a mass or frequency unit in any spelling the CSV
 * headers take (µ, μ or u for micro). A bare number is in `bareUnit`. "mev" is refused: meV or MeV?
 */
export function parseMassText(text: string, bareUnit: MassUnit): ParsedValue {
  const s = text.trim().replace(/\u2212/g, "-");
  if (s === "") return { ok: false, reason: "is empty" };
  const m = NUMBER_THEN_REST.exec(s);
  if (!m) return { ok: false, reason: `“${text.trim()}” is not a number` };
  const unitText = m[2].trim();
  const unit = unitText === "" ? bareUnit : parseMassUnit(unitText);
  if (!unit) {
    const why = /^m(ev|hz)$/i.test(unitText)
      ? "is ambiguous: write meV (milli) or MeV (mega), MHz (mega)"
      : "is not a unit of mass or frequency (use eV, meV, µeV or ueV, neV, Hz, kHz, MHz, GHz)";
    return { ok: false, reason: `“${unitText}” ${why}` };
  }
  return { ok: true, value: massToEv(Number(m[1]), unit) };
}

/** A plain number (Unicode minus accepted), for fields without units. */
export function parseNumberText(text: string): ParsedValue {
  const s = text.trim().replace(/\u2212/g, "-");
  const v = Number(s);
  return s !== "" && Number.isFinite(v) ? { ok: true, value: v } : { ok: false, reason: `“${text}” is not a number` };
}

/**
 * A log-axis range from two texts: both readable, positive, min below max, at most 40 decades. Messages name
 * the field (`what min`, `what max`).
 */
export function checkRange(
  minText: string,
  maxText: string,
  what: string,
  parse: (text: string) => ParsedValue = parseNumberText,
): CheckedRange {
  const lo = parse(minText);
  if (!lo.ok) return { ok: false, error: `${what} min: ${lo.reason}` };
  const hi = parse(maxText);
  if (!hi.ok) return { ok: false, error: `${what} max: ${hi.reason}` };
  if (!(lo.value > 0 && hi.value > 0)) return { ok: false, error: `${what}: both ends must be positive (log axis)` };
  if (!Number.isFinite(lo.value) || !Number.isFinite(hi.value))
    return { ok: false, error: `${what}: both ends must be finite` };
  if (lo.value >= hi.value) return { ok: false, error: `${what}: min must be less than max` };
  if (hi.value / lo.value > 1e40) return { ok: false, error: `${what}: at most 40 decades` };
  return { ok: true, range: [lo.value, hi.value] };
}

/** Short text for a range end: 1e-7 → "1e-7", 2.5e-13 → "2.5e-13", 0.5 → "0.5". */
export function rangeText(v: number): string {
  if (v === 0) return "0";
  const e = Math.floor(Math.log10(Math.abs(v)));
  if (e >= -3 && e <= 4) return String(Number(v.toPrecision(4)));
  return Number(v.toPrecision(4)).toExponential().replace("e+", "e");
}

/** A mass range end in eV as text in a display unit (the range fields show the axis unit). */
export function massRangeText(massEv: number, unit: MassUnit): string {
  return rangeText(massFromEv(massEv, unit));
}
