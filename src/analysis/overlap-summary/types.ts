// The overlap summary's shapes: one row per model × curve, and its intervals packed in typed arrays so that tens
// of thousands of them cross from the worker to the page without copying objects.
import type { CurveRole } from "../../project/types";
import type { OverlapKind } from "../overlap-table";

/** How a model's E/N reads: one line, every E/N of an interval, the band between lines, or a set of lines. */
export type SummaryModelKind = "line" | "interval" | "between" | "set";

/** E/N excluded (reached, inside): every E/N of the model, or ascending pieces (empty when none). */
export type EOverNCover = "all" | [number, number][];

/** The intervals of one row, ascending, disjoint; index i of every array describes interval i. */
export interface IntervalList {
  count: number;
  /** Mass ends in eV. */
  lo: Float64Array;
  hi: Float64Array;
  /** Share (in log m) of the interval where the whole band (every member of a set) is covered; 1 for a line. */
  whole: Float64Array;
  /** E/N covered somewhere in the interval: 4 numbers per interval (two pieces a, b), NaN where absent. */
  eOverN: Float64Array;
  /** Sets: the number of models (with multiplicity) covered somewhere in the interval; 0 otherwise. */
  members: Float64Array;
  /** 1 for a gap bridged by the opt-in merging (reported apart, never counted as covered), else 0. */
  bridged: Uint8Array;
}

/** One summary row: how much of one model's band one curve covers, and where. */
export interface OverlapSummaryRow {
  modelId: string;
  modelLabel: string;
  modelKind: SummaryModelKind;
  curveId: string;
  curveLabel: string;
  role: CurveRole;
  /** Strongest overlap present: "-whole" when the whole band is covered somewhere, "none" when nothing is. */
  verdict: OverlapKind;
  /** Where the curve has data, eV. */
  massRangeEv: [number, number];
  /** Share of that range (in log m) where the whole band is covered, and where any of it is. */
  shareWhole: number;
  shareAny: number;
  /** Share of the band's area (log m × log g) covered; null for a line or a band reaching g = 0. */
  areaShare: number | null;
  /** Separate covered intervals (bridged gaps not counted). */
  intervalCount: number;
  bridgedCount: number;
  /** The widest covered interval in log m, eV. */
  widestEv: [number, number] | null;
  /** E/N covered at the best point: "all" when the whole band is, else the largest set found at one place. */
  eOverNBest: EOverNCover;
  /** Sets: models (with multiplicity) in the set, and the most covered at one place. */
  membersTotal: number;
  membersBest: number;
  cancels: boolean;
  notes: string[];
  intervals: IntervalList;
}

/** Options of the summary. */
export interface SummaryOptions {
  /** Bridge gaps narrower than one curve sample and list them as their own kind. @default false */
  mergeGaps?: boolean;
}
