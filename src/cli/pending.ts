// TEMPORARY adapter: stands in for src/data's parseCurveText and projectFromFile until they land, with the
// documented signatures; each is replaced by the real import and this file removed. Not a finished implementation.
import { parseJsonSafely, restoreProject } from "../data/schema";
import type { Project } from "../data/types";

export interface ParseOpts {
  fileName?: string;
  massUnit?: string;
  couplingUnit?: string;
  delimiter?: string;
}
export interface ParseResult {
  massEv: Float64Array;
  gInvGeV: Float64Array;
  rejected: { row: number; column: number; reason: string }[];
  nonPositive: number;
  delimiter: string;
  header: string[] | null;
}

export function parseCurveText(text: string, _opts: ParseOpts = {}): ParseResult {
  const m: number[] = [];
  const g: number[] = [];
  const rejected: ParseResult["rejected"] = [];
  let header: string[] | null = null;
  let nonPositive = 0;
  text.split(/\r?\n/).forEach((line, i) => {
    const t = line.trim();
    if (t === "" || t.startsWith("#")) return;
    const cells = t.split(",");
    const a = Number(cells[0]);
    const b = Number(cells[1]);
    if (m.length === 0 && header === null && Number.isNaN(a)) {
      header = cells;
      return;
    }
    if (!Number.isFinite(a) || cells[0].trim() === "") return void rejected.push({ row: i + 1, column: 1, reason: `"${cells[0]}" is not a number` });
    if (!Number.isFinite(b) || (cells[1] ?? "").trim() === "") return void rejected.push({ row: i + 1, column: 2, reason: `"${cells[1] ?? ""}" is not a number` });
    if (a <= 0 || b <= 0) nonPositive++;
    m.push(a);
    g.push(b);
  });
  return { massEv: Float64Array.from(m), gInvGeV: Float64Array.from(g), rejected, nonPositive, delimiter: ",", header };
}

export function projectFromFile(text: string, _fileName?: string): { ok: true; project: Project; repairs?: string[] } | { ok: false; error: string } {
  let raw: unknown;
  try {
    raw = parseJsonSafely(text);
  } catch (e) {
    return { ok: false, error: `not valid JSON (${(e as Error).message})` };
  }
  const r = restoreProject(raw);
  return r.ok ? { ok: true, project: r.project, repairs: r.repairs } : { ok: false, error: r.error };
}
