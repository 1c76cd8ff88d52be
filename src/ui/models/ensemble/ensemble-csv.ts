// CSV of an ensemble's or scan's spectrum: one row per distinct E/N with its count and domain-wall numbers.
import type { EnsembleValue } from "../../../physics/ensemble";
import { csvTextCell } from "../../../analysis/table-cells";

/** An N_DW for reading: integers as they are; a scan's fractional one (2/3) to four digits, not sixteen. */
const dwNumber = (x: number): string => (Number.isInteger(x) ? String(x) : String(Number(x.toPrecision(4))));

/** N_DW of a value: one number, or "lo–hi" when the models with this E/N differ. */
export function nDWText(v: Pick<EnsembleValue, "nDWMin" | "nDWMax">): string {
  return v.nDWMin === v.nDWMax ? dwNumber(v.nDWMin) : `${dwNumber(v.nDWMin)}–${dwNumber(v.nDWMax)}`;
}

/** Header comments say what produced the table; E/N stays an exact fraction, as text ("-64/3" would run as a formula). */
export function spectrumCsv(values: readonly EnsembleValue[], comment: readonly string[]): string {
  const lines = comment.map((c) => `# ${c}`);
  lines.push("E/N,E/N (decimal),count,N_DW min,N_DW max");
  for (const v of values) {
    const [p, q] = v.eOverN.split("/");
    const dec = Number(p) / Number(q ?? "1");
    lines.push(`${csvTextCell(v.eOverN)},${dec.toPrecision(8)},${v.count},${v.nDWMin},${v.nDWMax}`);
  }
  return lines.join("\n") + "\n";
}
