// Glue between the calculator's draft and the PQ-charge solver: terms typed one per line are parsed against
// the field names (errors name the line and the character), then solved.
import { parseTerm, solvePqCharges, type ChargeSolved, type Term } from "../../physics/charges";
import { fermionFromDraft, scalarFromDraft, type CalcState } from "./calculator-state";

/** Non-empty lines of a term list, with their 1-based line numbers. */
export function termLines(text: string): { line: number; text: string }[] {
  return text
    .split("\n")
    .map((t, i) => ({ line: i + 1, text: t.trim() }))
    .filter((t) => t.text !== "");
}

function parseList(text: string, what: string, names: string[], errors: string[]): Term[] {
  const out: Term[] = [];
  for (const { line, text: t } of termLines(text)) {
    const r = parseTerm(t, names);
    if (r.ok) out.push(r.term);
    else errors.push(`${what}, line ${line} "${t}": ${r.message} (character ${r.position})`);
  }
  return out;
}

/** Solve the draft's terms; every problem (syntax, unknown field, gauge) is listed and nothing is solved. */
export function solveDraft(s: CalcState): { ok: true; result: ChargeSolved } | { ok: false; errors: string[] } {
  const names = [...s.rows, ...s.scalars].map((r) => r.name.trim()).filter((n) => n !== "");
  const errors: string[] = [];
  const terms = parseList(s.terms, "Kept terms", names, errors);
  const forbidden = parseList(s.forbidden, "Forbidden terms", names, errors);
  if (terms.length === 0 && errors.length === 0) errors.push("Kept terms: enter at least one term, one per line");
  if (errors.length > 0) return { ok: false, errors };
  const r = solvePqCharges({
    fermions: s.rows.map(fermionFromDraft),
    scalars: s.scalars.map(scalarFromDraft),
    terms,
    forbidden,
    normalize: s.normalize,
  });
  return r.ok ? { ok: true, result: r } : r;
}
