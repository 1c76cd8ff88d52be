// Simple math markup in titles and labels (`g_{aγγ}`, `SU(3)_L`, `\Lambda_{QCD}`, `10^{12}`) turned into the
// scene's text runs, so the screen, SVG, PNG and PDF set the same sub/superscripts; plain text stays as it is.
import type { TextRun } from "./scene-types";
import { minusSigns } from "./format";

/** LaTeX's Greek letter names (its uppercase set, plus the uppercase letters it writes as Latin ones). */
const GREEK: Readonly<Record<string, string>> = {
  alpha: "α",
  beta: "β",
  gamma: "γ",
  delta: "δ",
  epsilon: "ε",
  varepsilon: "ε",
  zeta: "ζ",
  eta: "η",
  theta: "θ",
  vartheta: "ϑ",
  iota: "ι",
  kappa: "κ",
  lambda: "λ",
  mu: "μ",
  nu: "ν",
  xi: "ξ",
  omicron: "ο",
  pi: "π",
  rho: "ρ",
  sigma: "σ",
  tau: "τ",
  upsilon: "υ",
  phi: "ϕ",
  varphi: "φ",
  chi: "χ",
  psi: "ψ",
  omega: "ω",
  Alpha: "Α",
  Beta: "Β",
  Gamma: "Γ",
  Delta: "Δ",
  Epsilon: "Ε",
  Zeta: "Ζ",
  Eta: "Η",
  Theta: "Θ",
  Iota: "Ι",
  Kappa: "Κ",
  Lambda: "Λ",
  Mu: "Μ",
  Nu: "Ν",
  Xi: "Ξ",
  Omicron: "Ο",
  Pi: "Π",
  Rho: "Ρ",
  Sigma: "Σ",
  Tau: "Τ",
  Upsilon: "Υ",
  Phi: "Φ",
  Chi: "Χ",
  Psi: "Ψ",
  Omega: "Ω",
};

/** Characters `\` makes literal: `\_`, `\^`, `\\`, `\{`, `\}`. */
const ESCAPED = new Set(["_", "^", "\\", "{", "}"]);
/** What a shorthand script may follow (a letter, digit, Greek letter or closing bracket) and consist of. */
const BASE_RE = /[\p{L}\p{N})\]]/u;
const SCRIPT_CHAR_RE = /[\p{L}\p{N}]/u;
/** What may come right after a one-character script: the end, a space, or closing punctuation. */
const AFTER_SCRIPT_RE = /[\s)\]},;:/=^\\|]/u;

/** A `\name` at i: the Greek letter and the index after the name, or null. */
function greekAt(s: string, i: number): { ch: string; end: number } | null {
  if (s[i] !== "\\") return null;
  let j = i + 1;
  while (j < s.length && /[A-Za-z]/.test(s[j])) j++;
  const ch = GREEK[s.slice(i + 1, j)];
  return ch ? { ch, end: j } : null;
}

/** Plain text with `\name` Greek letters and `\_`-style escapes resolved (the inside of a script, or free text). */
function literal(s: string): string {
  let out = "";
  for (let i = 0; i < s.length;) {
    const g = greekAt(s, i);
    if (g) {
      out += g.ch;
      i = g.end;
    } else if (s[i] === "\\" && ESCAPED.has(s[i + 1])) {
      out += s[i + 1];
      i += 2;
    } else out += s[i++];
  }
  return out;
}

/** Bare underscores of the whitespace-delimited word around i (a `_{` or `\_` is not bare). */
function bareUnderscores(s: string, i: number): number {
  let a = i;
  while (a > 0 && !/\s/.test(s[a - 1])) a--;
  let n = 0;
  for (let k = a; k < s.length && !/\s/.test(s[k]); k++) if (s[k] === "_" && s[k + 1] !== "{" && s[k - 1] !== "\\") n++;
  return n;
}

/** The script that starts at i (s[i] is `_` or `^`): its text and the index after it, or null when it is no script. */
function scriptAt(s: string, i: number): { text: string; end: number } | null {
  if (s[i + 1] === "{") {
    const close = s.indexOf("}", i + 2);
    // "{" inside or no "}": not our markup, leave it as typed.
    if (close < 0 || s.slice(i + 2, close).includes("{")) return null;
    return { text: literal(s.slice(i + 2, close)), end: close + 1 };
  }
  // The shorthand: after a letter, digit or bracket, one character (or Greek name), then the end, a space or
  // closing punctuation; never in a word with another bare underscore (my_curve_v2, a_b_c) or before a dot.
  if (i === 0 || !BASE_RE.test(s[i - 1])) return null;
  const g = greekAt(s, i + 1);
  const end = g ? g.end : i + 2;
  const text = g ? g.ch : s[i + 1];
  if (!g && !(text && SCRIPT_CHAR_RE.test(text))) return null;
  if (end < s.length && !AFTER_SCRIPT_RE.test(s[end])) return null;
  if (s[i] === "_" && bareUnderscores(s, i) > 1) return null;
  return { text, end };
}

/**
 * Text runs of a title or label with simple math markup:
 * - `_{…}` / `^{…}`: sub/superscript, anywhere (`g_{aγγ}`, `10^{-12}` with a real minus, `^{3}He`);
 * - `_x` / `^x`: one character (or `\name`) after a letter, digit or `)`/`]`, followed by the end, a space or
 *   closing punctuation, in a word with no other bare underscore (`SU(3)_L`, `m_a`, `x^2`; but `my_curve.csv`,
 *   `run_2.csv`, `a_b_c`, `ADMX_2018` stay as typed);
 * - `\alpha` … `\omega`, `\Gamma` … `\Omega`: Greek letters (typed Greek works as well);
 * - `\_ \^ \\ \{ \}`: the character itself.
 * Anything else, unknown `\names` included, is kept as typed. Scripts do not nest.
 */
export function markupRuns(text: string): TextRun[] {
  const runs: TextRun[] = [];
  const push = (t: string, shift?: "sub" | "sup") => {
    if (!t) return;
    const last = runs[runs.length - 1];
    if (last && last.shift === shift) last.text += t;
    else runs.push(shift ? { text: t, shift } : { text: t });
  };
  let plain = "";
  for (let i = 0; i < text.length;) {
    const c = text[i];
    const script = c === "_" || c === "^" ? scriptAt(text, i) : null;
    if (script) {
      push(literal(plain));
      plain = "";
      push(minusSigns(script.text), c === "_" ? "sub" : "sup");
      i = script.end;
    } else if (c === "\\" && i + 1 < text.length) {
      plain += text.slice(i, i + 2);
      i += 2;
    } else plain += text[i++];
  }
  push(literal(plain));
  return runs.length ? runs : [{ text: "" }];
}
