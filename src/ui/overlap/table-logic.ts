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
    (r) =>
      (f.modelId === null || r.modelId === f.modelId) &&
      (f.curveId === null || r.curveId === f.curveId) &&
      (f.verdict === null || verdictMatches(r.kind, f.verdict)),
  );
}

/**
 * Verdict order, strongest first: excluded (whole, then part), within reach of a projection (whole, then
 * part), inside a region (whole, then part), no overlap last.
 */
const KIND_ORDER: Record<OverlapKind, number> = {
  "excluded-whole": 0,
  "excluded-part": 1,
  "reach-whole": 2,
  "reach-part": 3,
  "inside-whole": 4,
  "inside-part": 5,
  none: 6,
};

/** Rank of a verdict in the default order (0 = excluded, whole band; 6 = no overlap). */
export function verdictRank(kind: OverlapKind): number {
  return KIND_ORDER[kind];
}

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

/**
 * The default order of the table: strongest verdict first (see {@link verdictRank}); within a verdict the
 * order overlapTable gives, i.e. models and curves as listed in the project, then ascending mass.
 */
export function defaultOrder(rows: readonly OverlapRow[]): OverlapRow[] {
  const indexed = rows.map((r, i) => ({ r, i }));
  indexed.sort((x, y) => KIND_ORDER[x.r.kind] - KIND_ORDER[y.r.kind] || x.i - y.i);
  return indexed.map((x) => x.r);
}

/**
 * Rows sorted by a column; null gives the default order ({@link defaultOrder}). Stable: rows equal in the
 * column keep their default order, so sorting by model still lists each model's exclusions first.
 */
export function sortRows(rows: readonly OverlapRow[], sort: SortState | null): OverlapRow[] {
  const base = defaultOrder(rows);
  if (!sort) return base;
  const indexed = base.map((r, i) => ({ r, i }));
  indexed.sort((x, y) => sort.dir * compare(x.r, y.r, sort.key) || x.i - y.i);
  return indexed.map((x) => x.r);
}

/** Next sort state after a click on a column header: ascending, descending, then the default order. */
export function nextSort(current: SortState | null, key: SortKey): SortState | null {
  if (!current || current.key !== key) return { key, dir: 1 };
  return current.dir === 1 ? { key, dir: -1 } : null;
}

/** A stable key for a row (model, curve, kind and interval). */
export function rowKey(r: OverlapRow): string {
  return `${r.modelId}|${r.curveId}|${r.kind}|${r.massMinEv}|${r.massMaxEv}`;
}
