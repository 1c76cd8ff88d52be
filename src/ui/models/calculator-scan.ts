// Charge scans in the anomaly calculator: a table whose PQ charges, copies or X_S hold lists ("{-1, 0, 1}") or
// ranges ("1..3") is read into the physics core's scan input; errors name the row and the field.
import { AnomalyInputError } from "../../physics/anomaly";
import { parseScanField, scanAnomaly, type ScanFermion, type ScanResult } from "../../physics/ensemble";
import { fermionFromDraft, type CalcState } from "./calculator-state";

const LISTY = /[{}]|\.\./;

/** True when some PQ charge, copies or X_S field holds a list or range. */
export function isScanState(s: CalcState): boolean {
  return LISTY.test(s.scalarCharge) || s.rows.some((r) => LISTY.test(r.pq) || LISTY.test(r.copies));
}

export type ScanOutcome = { ok: true; result: ScanResult } | { ok: false; messages: string[] };

/** Read the table and run the scan (at most 10⁶ combinations; the core refuses more with a message). */
export function scanFromState(s: CalcState): ScanOutcome {
  const messages: string[] = [];
  const fermions: ScanFermion[] = s.rows.map((row, i) => {
    const label = `fermion ${i + 1}${row.name.trim() ? ` (${row.name.trim()})` : ""}`;
    const pq = parseScanField(row.pq);
    const copies = parseScanField(row.copies);
    if (!pq.ok) messages.push(`${label}: PQ charge ${pq.reason}`);
    if (!copies.ok) messages.push(`${label}: copies ${copies.reason}`);
    const copyNumbers = copies.ok ? copies.values.map(Number) : [1];
    if (copies.ok && copyNumbers.some((c) => !Number.isSafeInteger(c) || c < 0))
      messages.push(`${label}: copies must be non-negative integers`);
    return { ...fermionFromDraft(row), pq: pq.ok ? pq.values : "1", copies: copyNumbers };
  });
  const xs = parseScanField(s.scalarCharge);
  if (!xs.ok) messages.push(`scalar PQ charge 𝒳_S ${xs.reason}`);
  if (messages.length > 0 || !xs.ok) return { ok: false, messages };
  try {
    return { ok: true, result: scanAnomaly(fermions, xs.values) };
  } catch (e) {
    if (e instanceof AnomalyInputError) return { ok: false, messages: e.errors.map((x) => x.message) };
    return { ok: false, messages: [e instanceof Error ? e.message : String(e)] };
  }
}
