// β of SU(3)_L × U(1)_X models as written in papers ("-1/√3", "−√3", "1/sqrt(3)", "2√3/3") read exactly as
// b = β/√3, the rational the anomaly calculator uses (Q = T₃ + βT₈ + X), and b written back as β.
import Fraction from "fraction.js";
import { parseRational, type Rational } from "./rational";

export type BetaParse = { ok: true; b: Rational } | { ok: false; reason: string };

// √3 spelled as √3, √(3), sqrt(3), sqrt3; becomes "s" before matching.
const SQRT3 = /(?:√|sqrt)\s*(?:\(\s*3\s*\)|3)/gi;

const rational = (t: string | undefined, dflt: number): Rational | null => {
  if (t === undefined || t === "") return new Fraction(dflt);
  const r = parseRational(t);
  return r.ok ? r.value : null;
};

/** Read β as a rational multiple of √3 (or 0) and return b = β/√3 exactly. */
export function parseBeta(input: string): BetaParse {
  const text = input
    .trim()
    .replace(/\u2212/g, "-")
    .replace(SQRT3, "s")
    .replace(/\s+/g, "");
  if (text === "") return { ok: false, reason: "is empty" };
  const sign = text.startsWith("-") ? -1 : 1;
  const body = text.replace(/^[+-]/, "");
  const num = "(\\d+(?:/\\d+)?)";
  const forms: [RegExp, (m: RegExpExecArray) => Rational | null][] = [
    // p√3, p·√3, p√3/q, √3, √3/q
    [new RegExp(`^(\\d+)?[*·]?s(?:/(\\d+))?$`), (m) => rational(m[1], 1)?.div(rational(m[2], 1) ?? 0) ?? null],
    // p/q·√3
    [new RegExp(`^${num}[*·]?s$`), (m) => rational(m[1], 1)],
    // p/√3 = (p/3)·√3
    [new RegExp(`^(\\d+)?/s$`), (m) => rational(m[1], 1)?.div(3) ?? null],
    // p/(q√3) = p/(3q)·√3
    [
      new RegExp(`^(\\d+)?/\\((\\d+)[*·]?s\\)$`),
      (m) => rational(m[1], 1)?.div((rational(m[2], 1) ?? new Fraction(0)).mul(3)) ?? null,
    ],
  ];
  for (const [re, b] of forms) {
    const m = re.exec(body);
    if (!m) continue;
    const v = /\/0+$|\/0+s/.test(body) ? null : b(m);
    return v && Number.isFinite(v.valueOf())
      ? { ok: true, b: v.mul(sign) }
      : { ok: false, reason: "has a zero denominator" };
  }
  const r = parseRational(text);
  if (r.ok && r.value.equals(0)) return { ok: true, b: r.value };
  if (r.ok) return { ok: false, reason: "is rational; β must be a rational multiple of √3, such as -1/√3 or √3" };
  return { ok: false, reason: 'is not a rational multiple of √3 (write e.g. "-1/√3", "−√3", "1/sqrt(3)")' };
}

/** β = b·√3 written as in papers: "1/√3", "−√3", "2√3", "0". */
export function formatBeta(b: Rational): string {
  if (b.equals(0)) return "0";
  const sign = b.s < 0 ? "−" : "";
  const n = Number(b.n);
  const d = Number(b.d);
  if (d % 3 === 0) return d === 3 ? `${sign}${n}/√3` : `${sign}${n}/(${d / 3}√3)`;
  return `${sign}${n === 1 ? "" : n}√3${d === 1 ? "" : `/${d}`}`;
}
