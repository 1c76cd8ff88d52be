// The readable term syntax (ASCII or Unicode): "Qbar_L Phi Q_R", "H2^† H1 Phi^†2", "conj(Phi)^2", "Q̄_L Φ Q_R".
// Errors name the 1-based character position.
import type { Term, TermFactor } from "./types";

export type TermParse = { ok: true; term: Term } | { ok: false; message: string; position: number };

const SUPERSCRIPT = "⁰¹²³⁴⁵⁶⁷⁸⁹";
const SUBSCRIPT = "₀₁₂₃₄₅₆₇₈₉";
const DAGGER = new Set(["†", "+", "*"]);
// A combining macron/overline (Q̄) or tilde (H̃ = iσ₂H*) on a name means the conjugate field.
const CONJ_MARKS = /[\u0303\u0304\u0305]/u;
const CONJ_MARKS_ALL = /[\u0303\u0304\u0305]/gu;
const FUNCS = new Set(["conj", "bar", "tilde", "dag"]);
const GREEK: Record<string, string> = {
  Φ: "Phi",
  φ: "phi",
  ϕ: "phi",
  σ: "sigma",
  Σ: "Sigma",
  χ: "chi",
  ψ: "psi",
  Ψ: "Psi",
  η: "eta",
  ρ: "rho",
  Δ: "Delta",
  ξ: "xi",
  Ξ: "Xi",
  θ: "theta",
  ω: "omega",
};

const isNameStart = (c: string) => /[\p{L}]/u.test(c);
// Combining marks (U+0300–U+036F) belong to the name they sit on; tested alone, one character at a time.
const isNameChar = (c: string) => /[\p{L}\p{N}_'′]/u.test(c) || /\p{M}/u.test(c) || SUBSCRIPT.includes(c);

/** Loose key for matching a typed name to a field: subscripts as digits, no underscores, Greek spelled out. */
function nameKey(name: string): string {
  return Array.from(name.normalize("NFC"))
    .map((c) => (SUBSCRIPT.includes(c) ? String(SUBSCRIPT.indexOf(c)) : (GREEK[c] ?? c)))
    .join("")
    .replace(/[_\s]/g, "");
}

/** Find the field a typed name means: exact, then loose key, then with "bar" removed (conjugate). */
function resolve(raw: string, names: readonly string[]): { field: string; conj: boolean } | string {
  if (names.includes(raw)) return { field: raw, conj: false };
  const byKey = (n: string) => names.filter((f) => nameKey(f) === nameKey(n));
  const hits = byKey(raw);
  if (hits.length === 1) return { field: hits[0], conj: false };
  if (hits.length > 1) return `"${raw}" could mean ${hits.map((h) => `"${h}"`).join(" or ")}`;
  const bar = /bar/.exec(raw);
  if (bar) {
    const plain = raw.slice(0, bar.index) + raw.slice(bar.index + 3);
    const again = names.includes(plain) ? [plain] : byKey(plain);
    if (again.length === 1) return { field: again[0], conj: true };
  }
  return `unknown field "${raw}"`;
}

interface Cursor {
  chars: string[];
  i: number;
}

/** Read modifiers after a name or a closing bracket: † ^… * ~ and superscript digits. */
function readModifiers(cur: Cursor): { conj: boolean; power: string } | { message: string; position: number } {
  let conj = false;
  let power = "";
  const { chars } = cur;
  for (;;) {
    const c = chars[cur.i];
    if (c === "†" || c === "*" || c === "~") conj = !conj;
    else if (c !== undefined && SUPERSCRIPT.includes(c)) power += String(SUPERSCRIPT.indexOf(c));
    else if (c === "^") {
      const start = cur.i;
      cur.i++;
      const braced = chars[cur.i] === "{";
      if (braced) cur.i++;
      const rest = chars.slice(cur.i).join("");
      const word = /^(dagger|dag)/.exec(rest);
      let n = 0;
      if (word) {
        conj = !conj;
        cur.i += word[1].length;
        n++;
      }
      while (
        cur.i < chars.length &&
        (DAGGER.has(chars[cur.i]) || /\d/.test(chars[cur.i]) || SUPERSCRIPT.includes(chars[cur.i]))
      ) {
        const d = chars[cur.i];
        if (DAGGER.has(d)) conj = !conj;
        else power += /\d/.test(d) ? d : String(SUPERSCRIPT.indexOf(d));
        cur.i++;
        n++;
      }
      if (braced) {
        if (chars[cur.i] !== "}") return { message: 'expected "}"', position: cur.i + 1 };
        cur.i++;
      }
      if (n === 0) return { message: 'expected †, a power or "dag" after "^"', position: start + 1 };
      continue;
    } else break;
    cur.i++;
  }
  return { conj, power };
}

/** Parse one factor at the cursor (whitespace already skipped). */
function readFactor(
  cur: Cursor,
  names: readonly string[],
): { factor: TermFactor } | { message: string; position: number } {
  const { chars } = cur;
  const start = cur.i;
  if (!isNameStart(chars[start])) return { message: `unexpected "${chars[start]}"`, position: start + 1 };
  while (cur.i < chars.length && isNameChar(chars[cur.i])) cur.i++;
  let raw = chars.slice(start, cur.i).join("");
  let conj = false;
  let namePos = start;
  if (FUNCS.has(raw) && chars[cur.i] === "(") {
    const fn = raw;
    cur.i++;
    while (chars[cur.i] === " ") cur.i++;
    namePos = cur.i;
    if (!isNameStart(chars[cur.i] ?? ""))
      return { message: `expected a field name inside ${fn}(…)`, position: cur.i + 1 };
    while (cur.i < chars.length && isNameChar(chars[cur.i])) cur.i++;
    raw = chars.slice(namePos, cur.i).join("");
    while (chars[cur.i] === " ") cur.i++;
    const inner = readModifiers(cur);
    if ("message" in inner) return inner;
    if (chars[cur.i] !== ")") return { message: `expected ")" to close ${fn}(`, position: cur.i + 1 };
    cur.i++;
    conj = !inner.conj;
    if (inner.power !== "") return { message: "write the power outside the brackets", position: cur.i };
  }
  if (CONJ_MARKS.test(raw)) {
    conj = !conj;
    raw = raw.replace(CONJ_MARKS_ALL, "");
  }
  const mods = readModifiers(cur);
  if ("message" in mods) return mods;
  const r = resolve(raw.normalize("NFC"), names);
  if (typeof r === "string") return { message: r, position: namePos + 1 };
  const power = mods.power === "" ? 1 : Number(mods.power);
  if (!Number.isSafeInteger(power) || power < 1 || power > 1000) {
    return { message: `power ${mods.power} must be an integer from 1 to 1000`, position: namePos + 1 };
  }
  const c = (conj !== mods.conj) !== r.conj;
  return { factor: power === 1 ? { field: r.field, conj: c } : { field: r.field, conj: c, power } };
}

/**
 * Parse a term typed by the user against the known field names. Fields are matched exactly, then loosely
 * (H₂ = H_2 = H2, Φ = Phi); "Qbar_L" means the conjugate of "Q_L".
 */
export function parseTerm(text: string, names: readonly string[]): TermParse {
  const cur: Cursor = { chars: Array.from(text), i: 0 };
  const { chars } = cur;
  const term: Term = [];
  for (;;) {
    let spaced = cur.i === 0;
    while (cur.i < chars.length && /[\s·⋅×]/.test(chars[cur.i])) {
      cur.i++;
      spaced = true;
    }
    if (spaced && chars[cur.i] === "*" && /\s/.test(chars[cur.i + 1] ?? " ")) {
      cur.i++;
      continue;
    }
    if (cur.i >= chars.length) break;
    if (!spaced) return { ok: false, message: `unexpected "${chars[cur.i]}"`, position: cur.i + 1 };
    const f = readFactor(cur, names);
    if ("message" in f) return { ok: false, ...f };
    term.push(f.factor);
  }
  if (term.length === 0) return { ok: false, message: "the term is empty", position: 1 };
  return { ok: true, term };
}

/** The term in the syntax parseTerm reads back: "Q_L† Phi Q_R", "Phi^†2". */
export function formatTerm(term: Term): string {
  return term.map((f) => `${f.field}${f.conj ? "†" : ""}${(f.power ?? 1) === 1 ? "" : `^${f.power}`}`).join(" ");
}
