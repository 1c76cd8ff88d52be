// One summary row in words and display numbers, shared by the panel, Markdown, LaTeX and the caption, so that the
// screen and every export say the same thing with the same significant figures.
import { intervalEOverN, type OverlapSummaryRow } from "../../analysis/overlap-summary";
import { eOverNText, listDigits, massUnitFor, percent, sig, type MassUnit } from "./numbers";

const VERB = { exclusion: "excluded", projection: "within reach", region: "inside the region" } as const;

/** "wholly excluded", "partly within reach (3 of 12 models)", "no overlap"; a line without spread is just "excluded". */
export function verdictWords(row: OverlapSummaryRow): string {
  if (row.verdict === "none") return "no overlap";
  const verb = VERB[row.role];
  const whole = row.verdict.endsWith("-whole");
  if (row.modelKind === "set") {
    const count = whole ? "" : ` (${row.membersBest} of ${row.membersTotal} models)`;
    return `${whole ? "wholly" : "partly"} ${verb}${count}`;
  }
  if (row.modelKind === "line" && whole && row.shareWhole === row.shareAny) return verb;
  return `${whole ? "wholly" : "partly"} ${verb}`;
}

export interface RowView {
  unit: MassUnit;
  digits: number;
  /** Mass range, widest interval: [lo, hi] as text in `unit`. */
  range: [string, string];
  widest: [string, string] | null;
  share: string;
  /** Share of the range where the whole band is covered, when that differs from `share`. */
  shareWhole: string | null;
  areaShare: string;
  eOverN: string;
  verdict: string;
}

// Rows are never mutated once built, and finding the digits formats every interval end: once per row.
const views = new WeakMap<OverlapSummaryRow, RowView>();

/** The row's display values (mass unit chosen for its range, digits that keep its intervals apart); cached per row. */
export function rowView(row: OverlapSummaryRow): RowView {
  let view = views.get(row);
  if (!view) {
    view = buildRowView(row);
    views.set(row, view);
  }
  return view;
}

function buildRowView(row: OverlapSummaryRow): RowView {
  const [lo, hi] = row.massRangeEv;
  const unit = massUnitFor(lo, hi);
  const digits = Math.max(3, listDigits(row.intervals, unit.ev));
  const fmt = (x: number): string => sig(x / unit.ev, digits);
  return {
    unit,
    digits,
    range: [fmt(lo), fmt(hi)],
    widest: row.widestEv ? [fmt(row.widestEv[0]), fmt(row.widestEv[1])] : null,
    share: percent(row.shareAny),
    shareWhole: row.shareWhole > 0 && row.shareWhole !== row.shareAny ? percent(row.shareWhole) : null,
    areaShare: row.areaShare === null ? "—" : percent(row.areaShare),
    // Every kind the same way: "all" where the whole band (a line with its spread) is covered, else the E/N
    // covered (for a line partly covered within its spread, its own value).
    eOverN: row.verdict === "none" ? "none" : eOverNText(row.eOverNBest),
    verdict: verdictWords(row),
  };
}

/** One interval of a row in the row's unit and digits. */
export function intervalView(row: OverlapSummaryRow, view: RowView, i: number) {
  const l = row.intervals;
  const fmt = (x: number): string => sig(x / view.unit.ev, view.digits);
  const kind = l.bridged[i] ? "bridged gap" : l.whole[i] >= 1 ? "whole" : l.whole[i] > 0 ? "whole in part" : "part";
  return {
    lo: fmt(l.lo[i]),
    hi: fmt(l.hi[i]),
    kind,
    eOverN: l.bridged[i] ? "—" : eOverNText(intervalEOverN(l, i)),
    members: row.modelKind === "set" && !l.bridged[i] ? `${l.members[i]} of ${row.membersTotal}` : "",
  };
}
