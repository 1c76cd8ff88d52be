// The overlap summary as CSV (summary and intervals, full precision), Markdown, and a plain-text caption.
import type { AxionConstants } from "../../physics/constants";
import { intervalEOverN, type OverlapSummaryRow } from "../../analysis/overlap-summary";
import { csvTextCell as cell, markdownTextCell as md } from "../../analysis/table-cells";
import { eOverNText, withUncertainty } from "./numbers";
import { intervalView, rowView } from "./view";

function num(x: number | null | undefined): string {
  return x === null || x === undefined || !Number.isFinite(x) ? "" : String(x);
}

const SUMMARY_HEADER =
  "model_id,model,model_kind,curve_id,curve,role,verdict,m_a_min_eV,m_a_max_eV,share_mass,share_mass_whole,share_area,intervals,bridged_gaps,widest_min_eV,widest_max_eV,EN_best,models_best,models_total,notes";

/** The summary as CSV: one line per row, masses in eV and shares as fractions at full precision. */
export function summaryToCsv(rows: readonly OverlapSummaryRow[]): string {
  const lines = [SUMMARY_HEADER];
  for (const r of rows) {
    lines.push(
      [
        cell(r.modelId),
        cell(r.modelLabel),
        r.modelKind,
        cell(r.curveId),
        cell(r.curveLabel),
        r.role,
        r.verdict,
        num(r.massRangeEv[0]),
        num(r.massRangeEv[1]),
        num(r.shareAny),
        num(r.shareWhole),
        num(r.areaShare),
        String(r.intervalCount),
        String(r.bridgedCount),
        num(r.widestEv?.[0]),
        num(r.widestEv?.[1]),
        cell(r.verdict === "none" ? "none" : eOverNText(r.eOverNBest)),
        r.modelKind === "set" ? String(r.membersBest) : "",
        r.modelKind === "set" ? String(r.membersTotal) : "",
        cell(r.notes.join("; ")),
      ].join(","),
    );
  }
  return lines.join("\n") + "\n";
}

/** Every interval of every row as CSV, ascending in mass within a row. */
export function intervalsToCsv(rows: readonly OverlapSummaryRow[]): string {
  const lines = ["model_id,model,curve_id,curve,kind,m_a_min_eV,m_a_max_eV,whole_share,EN_covered,models"];
  for (const r of rows) {
    const l = r.intervals;
    for (let i = 0; i < l.count; i++) {
      const kind = l.bridged[i] ? "bridged" : l.whole[i] > 0 ? "whole" : "part";
      const e = l.bridged[i] ? "" : eOverNText(intervalEOverN(l, i));
      const models = r.modelKind === "set" && !l.bridged[i] ? String(l.members[i]) : "";
      lines.push(
        [cell(r.modelId), cell(r.modelLabel), cell(r.curveId), cell(r.curveLabel), kind]
          .concat([num(l.lo[i]), num(l.hi[i]), num(l.whole[i]), cell(e), models])
          .join(","),
      );
    }
  }
  return lines.join("\n") + "\n";
}

/** The summary as a GitHub-style Markdown table, the same words and figures as the screen. */
export function summaryToMarkdown(rows: readonly OverlapSummaryRow[]): string {
  const out = [
    "| Model | Curve | Verdict | Mass range | Share of range | Share of band area | Intervals | Widest | E/N covered |",
    "| --- | --- | --- | ---: | ---: | ---: | ---: | ---: | --- |",
  ];
  for (const r of rows) {
    const v = rowView(r);
    const u = v.unit.name;
    const share = v.shareWhole ? `${v.share} (whole band ${v.shareWhole})` : v.share;
    const widest = v.widest ? `${v.widest[0]}–${v.widest[1]} ${u}` : "—";
    const cells = [md(r.modelLabel), md(r.curveLabel), v.verdict, `${v.range[0]}–${v.range[1]} ${u}`, share];
    cells.push(v.areaShare, String(r.intervalCount), widest, md(v.eOverN));
    out.push(`| ${cells.join(" | ")} |`);
  }
  return out.join("\n") + "\n";
}

/** The intervals of one row as Markdown (the expanded row). */
export function intervalsToMarkdown(row: OverlapSummaryRow): string {
  const v = rowView(row);
  const out = [`| From (${v.unit.name}) | To (${v.unit.name}) | Kind | E/N covered |`, "| ---: | ---: | --- | --- |"];
  for (let i = 0; i < row.intervals.count; i++) {
    const iv = intervalView(row, v, i);
    out.push(`| ${iv.lo} | ${iv.hi} | ${iv.kind} | ${md(iv.members ? `${iv.eOverN} (${iv.members})` : iv.eOverN)} |`);
  }
  return out.join("\n") + "\n";
}

/**
 * One plain-text paragraph for a paper or slide notes: the constants with their uncertainties, then per
 * overlapping row what the curve covers, over which share of which range, in how many intervals.
 */
export function summaryCaption(rows: readonly OverlapSummaryRow[], c: AxionConstants): string {
  const head = `With c_γ = ${withUncertainty(c.cGamma, c.cGammaSigma)} and K = ${withUncertainty(c.kMuEv, c.kMuEvSigma)} μeV`;
  const parts = rows
    .filter((r) => r.verdict !== "none")
    .map((r) => {
      const v = rowView(r);
      const verb = r.role === "exclusion" ? "excludes" : r.role === "projection" ? "reaches" : "contains";
      const how = r.verdict.endsWith("-whole") ? "" : "part of ";
      const n = r.intervalCount;
      const sets = r.modelKind === "set" ? ` (at most ${r.membersBest} of its ${r.membersTotal} models at once)` : "";
      return `${r.curveLabel} ${verb} ${how}the ${r.modelLabel} model${sets} over ${v.share} of ${v.range[0]}–${v.range[1]} ${v.unit.name} in ${n} interval${n === 1 ? "" : "s"}`;
    });
  if (parts.length === 0) return `${head}, none of the curves shown overlaps any of the models shown.`;
  return `${head}, ${parts.join("; ")}.`;
}
