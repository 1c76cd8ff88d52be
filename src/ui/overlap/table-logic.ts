// Sorting, filtering and wording of overlap-table rows for the overlap panel (the rows themselves come
// from the data core's overlapTable). Pure functions, so the component stays small and testable.
import type { OverlapKind, OverlapRow } from "../../data";

export type SortKey = "model" | "curve" | "role" | "verdict" | "mass" | "fa" | "freq";
export interface SortState {
  key: SortKey;
  dir: 1 | -1;
}

export interface RowFilter {
  modelId: string | null;
  curveId: string | null;
  /** "excluded", "reach", "inside", "none", or a full kind; null = all. */
  verdict: string | null;
}

export const NO_FILTER: RowFilter = { modelId: null, curveId: null, verdict: null };

/** Words for a verdict; a model line has no "part". */
export function verdictText(kind: OverlapKind): string {
  switch (kind) {
    case "excluded-whole":
      return "excluded";
    case "excluded-part":
      return "partly excluded";
    case "reach-whole":
      return "within reach";
    case "reach-part":
      return "partly within reach";
    case "inside-whole":
      return "inside region";
    case "inside-part":
      return "partly inside region";
    case "none":
      return "no overlap";
  }
}

/** Verdict groups the filter offers. */
export const VERDICT_GROUPS: { value: string; label: string }[] = [
  { value: "excluded", label: "excluded (whole or part)" },
  { value: "reach", label: "within reach (whole or part)" },
  { value: "inside", label: "inside a region (whole or part)" },
  { value: "whole", label: "whole band only" },
  { value: "part", label: "part of the band only" },
  { value: "none", label: "no overlap" },
];

function verdictMatches(kind: OverlapKind, v: string): boolean {
  if (v === "whole") return kind.endsWith("-whole");
  if (v === "part") return kind.endsWith("-part");
  if (v === "none") return kind === "none";
  return kind === v || kind.startsWith(`${v}-`);
}

/** Rows passing the filter, in their original order. */
export function filterRows(rows: readonly OverlapRow[], f: RowFilter): OverlapRow[] {
  return rows.filter(
    (r) => (f.modelId === null || r.modelId === f.modelId) && (f.curveId === null || r.curveId === f.curveId) && (f.verdict === null || verdictMatches(r.kind, f.verdict)),
  );
}

const KIND_ORDER: Record<OverlapKind, number> = {
  "excluded-whole": 0,
  "excluded-part": 1,
  "inside-whole": 2,
  "inside-part": 3,
  "reach-whole": 4,
  "reach-part": 5,
  none: 6,
};

function compare(a: OverlapRow, b: OverlapRow, key: SortKey): number {
  switch (key) {
    case "model":
      return a.modelLabel.localeCompare(b.modelLabel);
    case "curve":
      return a.curveLabel.localeCompare(b.curveLabel);
    case "role":
      return a.role.localeCompare(b.role);
    case "verdict":
      return KIND_ORDER[a.kind] - KIND_ORDER[b.kind];
    case "mass":
      return a.massMinEv - b.massMinEv || a.massMaxEv - b.massMaxEv;
    case "fa":
      return a.faMinGeV - b.faMinGeV || a.faMaxGeV - b.faMaxGeV;
    case "freq":
      return a.freqMinHz - b.freqMinHz || a.freqMaxHz - b.freqMaxHz;
  }
}

/** Rows sorted by a column (stable: equal rows keep the table's order); null keeps the table's order. */
export function sortRows(rows: readonly OverlapRow[], sort: SortState | null): OverlapRow[] {
  const indexed = rows.map((r, i) => ({ r, i }));
  if (sort) indexed.sort((x, y) => sort.dir * compare(x.r, y.r, sort.key) || x.i - y.i);
  return indexed.map((x) => x.r);
}

/** Next sort state after a click on a column header: ascending, descending, then the table's order. */
export function nextSort(current: SortState | null, key: SortKey): SortState | null {
  if (!current || current.key !== key) return { key, dir: 1 };
  return current.dir === 1 ? { key, dir: -1 } : null;
}

/** A stable key for a row (model, curve, kind and interval). */
export function rowKey(r: OverlapRow): string {
  return `${r.modelId}|${r.curveId}|${r.kind}|${r.massMinEv}|${r.massMaxEv}`;
}
