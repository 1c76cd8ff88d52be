// Display helpers shared by the panels: typographic minus, SU(3) names with overbars, fermion summaries,
// numbers with SI prefixes and in scientific notation.
import type { FermionInput, RationalInput } from "../physics/anomaly-types";
import { minusSigns as minus } from "../plot/format";
import { formatBeta } from "../physics/beta";
import { parseRational } from "../physics/rational";

/** Text with ASCII hyphen-minus signs turned into U+2212 (the plot core's function, shared with the CLI). */
export { minus };

/** "3bar" → "3̄", "15'bar" → "15̄′" for display (the parser accepts both spellings). */
export function colourDisplay(name: string): string {
  return name.replace(/'/g, "′").replace(/^(\d+)(′?)bar$/, (_, n: string, prime: string) => `${n}\u0305${prime}`);
}

function rat(v: RationalInput): string {
  return minus(String(v).trim());
}

/** β = b·√3 as in papers ("−1/√3"); b as typed when it is not a rational. */
function betaText(b: RationalInput): string {
  const r = parseRational(b);
  return r.ok ? minus(formatBeta(r.value)) : rat(b);
}

/** One line describing a fermion: "Q_L (3, 1, −1/3) L, 𝒳 = 1" (𝒳 the PQ charge, X the U(1)_X charge). */
export function fermionSummary(f: FermionInput): string {
  const colour = typeof f.colour === "string" ? colourDisplay(f.colour) : `(${f.colour.p},${f.colour.q})`;
  let ew: string;
  if (f.ew.kind === "sm") ew = `${f.ew.dim}, ${rat(f.ew.y)}`;
  else if (f.ew.kind === "su3l") ew = `SU(3)_L ${colourDisplay(f.ew.rep)}, X = ${rat(f.ew.x)}, β = ${betaText(f.ew.b)}`;
  else ew = `Q = {${f.ew.charges.map(rat).join(", ")}}`;
  const copies = f.copies !== undefined && f.copies !== 1 ? ` ×${f.copies}` : "";
  return `${f.name ? `${f.name} ` : ""}(${colour}, ${ew}) ${f.chirality}, 𝒳 = ${rat(f.pq)}${copies}`;
}

const SI = [
  { p: "T", e: 12 },
  { p: "G", e: 9 },
  { p: "M", e: 6 },
  { p: "k", e: 3 },
  { p: "", e: 0 },
  { p: "m", e: -3 },
  { p: "μ", e: -6 },
  { p: "n", e: -9 },
  { p: "p", e: -12 },
  { p: "f", e: -15 },
];

/** A value with an SI prefix and unit, 3 significant digits: 2.42e9, "Hz" → "2.42 GHz". */
export function siFormat(value: number, unit: string): string {
  if (!Number.isFinite(value) || value === 0) return `${value} ${unit}`;
  const e = Math.floor(Math.log10(Math.abs(value)));
  const pick = SI.find((s) => e >= s.e) ?? SI[SI.length - 1];
  return `${(value / 10 ** pick.e).toPrecision(3)} ${pick.p}${unit}`;
}

/** Scientific notation with a real × and superscript exponent: 1.23×10⁻¹³ (3 significant digits). */
export function sciFormat(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return "0";
  const e = Math.floor(Math.log10(Math.abs(value)));
  if (e >= -2 && e <= 3) return minus(value.toPrecision(digits));
  let m = value / 10 ** e;
  let exp = e;
  if (Math.abs(Number(m.toPrecision(digits))) >= 10) {
    m /= 10;
    exp += 1;
  }
  const sup = String(exp)
    .split("")
    .map((ch) => "⁰¹²³⁴⁵⁶⁷⁸⁹"["0123456789".indexOf(ch)] ?? (ch === "-" ? "⁻" : ch))
    .join("");
  return `${minus(m.toPrecision(digits))}×10${sup}`;
}
