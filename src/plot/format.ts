// Small formatting helpers of the plot core: rounded numbers for path data, powers of ten as text runs with
// a real superscript and a real minus sign, and safe colours and dash patterns from user input.
import type { TextRun } from "./scene-types";
import type { LineStyle } from "../project/types";

/** Real minus sign (U+2212), never a hyphen, in every label. */
export const MINUS = "\u2212";

/**
 * Text with ASCII hyphen-minus signs turned into U+2212 where they start a number: at the start, after a
 * space, an opening bracket, a comma, "=" or an interval's "..". Hyphens inside words and exponents stay.
 * The one function for labels and E/N texts in the app and on the command line.
 */
export function minusSigns(text: string): string {
  return text.replace(/(^|[\s(,=[{]|\.\.)-/g, `$1${MINUS}`);
}

/** A number rounded to 2 decimals (scene coordinates and path data). */
export function r2(v: number): number {
  return Math.round(v * 100) / 100;
}

/** Integer (or decimal) text with U+2212 for negatives. */
export function signed(n: number | string): string {
  const s = String(n);
  return s.startsWith("-") ? MINUS + s.slice(1) : s;
}

/** "10" with superscript exponent: 10⁻⁶ as runs ["10", sup "−6"]. */
export function powerOfTenRuns(exponent: number): TextRun[] {
  return [{ text: "10" }, { text: signed(exponent), shift: "sup" }];
}

/** Mantissa text with at most 6 significant digits (zoomed axes need 3.105) and no trailing zeros ("2", "2.5"). */
export function mantissaText(m: number): string {
  return signed(String(Number(m.toPrecision(6))));
}

/**
 * A positive value as label runs: "10⁻⁶" for a power of ten, "2×10⁻⁶" otherwise; with exponent 0 just "2".
 * @param value the tick value (> 0).
 */
export function scientificRuns(value: number): TextRun[] {
  const e = Math.floor(Math.log10(value) + 1e-9);
  const m = value / 10 ** e;
  if (Math.abs(m - 1) < 1e-9) return powerOfTenRuns(e);
  if (e === 0) return [{ text: mantissaText(m) }];
  return [{ text: `${mantissaText(m)}×10` }, { text: signed(e), shift: "sup" }];
}

/** A plain decimal label ("0.01", "1", "250") for values between 10⁻³ and 10⁶, else scientific runs. */
export function plainOrScientificRuns(value: number): TextRun[] {
  if (value >= 1e-3 && value < 1e6) return [{ text: signed(String(Number(value.toPrecision(4)))) }];
  return scientificRuns(value);
}

const HEX = /^#(?:[0-9a-fA-F]{3,4}|[0-9a-fA-F]{6}|[0-9a-fA-F]{8})$/;
const FUNC = /^(?:rgb|rgba|hsl|hsla)\(\s*[-0-9.%,\s/]+\)$/;
const NAMED = /^[a-zA-Z]{3,24}$/;

/**
 * The colour if it is a plain CSS colour (hex, rgb()/hsl(), or a keyword), else the fallback: user colours
 * end up in attributes, and nothing like url(...) may reach the figure.
 * @default fallback "#000000"
 */
export function safeColour(colour: string | undefined, fallback = "#000000"): string {
  if (typeof colour !== "string") return fallback;
  const c = colour.trim();
  return HEX.test(c) || FUNC.test(c) || NAMED.test(c) ? c : fallback;
}

/** SVG dash pattern for a line style at a stroke width in px (undefined for solid). */
export function dashFor(style: LineStyle | undefined, widthPx: number): string | undefined {
  const u = Math.max(widthPx, 0.5);
  switch (style) {
    case "dashed":
      return `${r2(5 * u)} ${r2(3 * u)}`;
    case "dotted":
      return `${r2(1 * u)} ${r2(2 * u)}`;
    case "dashdot":
      return `${r2(6 * u)} ${r2(2.5 * u)} ${r2(1 * u)} ${r2(2.5 * u)}`;
    default:
      return undefined;
  }
}

/** A finite number in [0, 1], else the fallback. */
export function unitInterval(v: number | undefined, fallback: number): number {
  return typeof v === "number" && Number.isFinite(v) ? Math.min(1, Math.max(0, v)) : fallback;
}
