// The overlap summary: one row per visible model × visible curve saying how much of the model the curve excludes
// (reaches, contains), where, in how many intervals, and for which E/N; strongest verdict first, then by share.
import type { Curve, Model, Project } from "../../project/types";
import { overlapAreaShare, overlapDetail, type OverlapCurve, type OverlapModel } from "../overlap";
import { curveGFactor, projectConstants, type OverlapKind } from "../overlap-table";
import { addPieces, groupDetail, measure, packGroups, withBridged, type Group } from "./intervals";
import { modelSpec, type ModelSpec } from "./models";
import { setGroups } from "./sets";
import type { EOverNCover, OverlapSummaryRow, SummaryOptions } from "./types";

export type { EOverNCover, IntervalList, OverlapSummaryRow, SummaryOptions } from "./types";
export { intervalEOverN } from "./intervals";

const KINDS = {
  exclusion: ["excluded-whole", "excluded-part"],
  projection: ["reach-whole", "reach-part"],
  region: ["inside-whole", "inside-part"],
} as const;

const RANK: Record<OverlapKind, number> = {
  "excluded-whole": 0,
  "excluded-part": 1,
  "reach-whole": 2,
  "reach-part": 3,
  "inside-whole": 4,
  "inside-part": 5,
  none: 6,
};

/** Rank of a verdict, strongest first (0 = wholly excluded somewhere, 6 = no overlap). */
export function summaryRank(kind: OverlapKind): number {
  return RANK[kind];
}

/** The E/N covered at the best point: "all" when the whole band is somewhere, else the widest set of one stretch. */
function bestEOverN(groups: Group[]): EOverNCover {
  let best: [number, number][] = [];
  let bestWidth = -1;
  for (const g of groups) {
    if (g.bridged) continue;
    if (g.wholeLn > 0) return "all";
    const width = g.eOverN.reduce((s, [a, b]) => s + (b - a), 0);
    if (width > bestWidth) {
      bestWidth = width;
      best = [];
      addPieces(best, g.eOverN);
    }
  }
  return best;
}

interface PairParts {
  groups: Group[];
  range: [number, number] | null;
  cancels: boolean;
  skipped: number;
}

function pairParts(spec: ModelSpec, om: OverlapModel, oc: OverlapCurve, merge: boolean): PairParts {
  if (spec.kind === "set") {
    const r = setGroups(spec.members, om, oc, {});
    const bridged = merge ? mergedGaps(spec, om, oc) : [];
    return { groups: withBridged(r.groups, bridged), range: r.massRangeEv, cancels: false, skipped: r.skippedPoints };
  }
  const d = overlapDetail(om, oc);
  const groups = withBridged(groupDetail(d), merge ? mergedGaps(spec, om, oc) : []);
  return { groups, range: d.massRangeEv, cancels: d.cancels, skipped: d.skippedPoints };
}

/** The gaps the opt-in merging would bridge (for a set: those of its extreme lines' band). */
function mergedGaps(spec: ModelSpec, om: OverlapModel, oc: OverlapCurve) {
  const m = spec.kind === "set" ? { ...om, between: spec.members.map((x) => x.value) } : om;
  return overlapDetail(m, oc, { mergeGaps: true }).bridgedGapsEv;
}

function summaryRow(model: Model, spec: ModelSpec, curve: Curve, project: Project, merge: boolean) {
  const c = projectConstants(project);
  const { factor, problem } = curveGFactor(curve);
  const om: OverlapModel = { eOverNMin: spec.eMin, eOverNMax: spec.eMax, sigmas: model.sigmas, constants: c };
  if (spec.kind === "between") om.between = spec.members.map((m) => m.value);
  const oc: OverlapCurve = { massEv: curve.massEv, gInvGeV: curve.gInvGeV, role: curve.role, gFactor: factor };
  const parts = pairParts(spec, om, oc, merge);
  if (!parts.range) return null;
  const m = measure(parts.groups, parts.range);
  const [wholeKind, partKind] = KINDS[curve.role];
  const verdict: OverlapKind = m.shareWhole > 0 ? wholeKind : m.shareAny > 0 ? partKind : "none";
  const notes: string[] = [];
  if (parts.cancels) notes.push("the band reaches g = 0 (E/N near c_γ): no finite curve covers all of it");
  if (problem) notes.push(problem);
  if (parts.skipped > 0) notes.push(`${parts.skipped} point(s) with non-positive or missing values skipped`);
  const setTotal = spec.members.reduce((s, x) => s + x.count, 0);
  const row: OverlapSummaryRow = {
    modelId: model.id,
    modelLabel: model.label,
    modelKind: spec.kind,
    curveId: curve.id,
    curveLabel: curve.label,
    role: curve.role,
    verdict,
    massRangeEv: parts.range,
    shareWhole: m.shareWhole,
    shareAny: m.shareAny,
    areaShare: spec.kind === "set" ? null : overlapAreaShare(om, oc),
    intervalCount: m.count,
    bridgedCount: parts.groups.length - m.count,
    widestEv: m.widestEv,
    eOverNBest: verdict === "none" ? [] : bestEOverN(parts.groups),
    membersTotal: spec.kind === "set" ? setTotal : 0,
    membersBest: parts.groups.reduce((s, g) => Math.max(s, g.bridged ? 0 : g.members), 0),
    cancels: parts.cancels,
    notes,
    intervals: packGroups(parts.groups),
  };
  return row;
}

/** Strongest verdict first, then the larger share (area for bands, mass otherwise); stable otherwise. */
export function compareSummary(a: OverlapSummaryRow, b: OverlapSummaryRow): number {
  return RANK[a.verdict] - RANK[b.verdict] || b.shareWhole - a.shareWhole || b.shareAny - a.shareAny;
}

/**
 * One row per visible model × visible curve with usable data (rows with verdict "none" included: the panel's
 * filter hides them), computed with the project's constants, each model's theory spread and kind, and each
 * curve's rescaling, sorted by {@link compareSummary}. Gaps between samples are never bridged unless
 * `mergeGaps` asks for it, and bridged gaps are then listed apart, not counted as covered.
 */
export function overlapSummary(project: Project, opts: SummaryOptions = {}): OverlapSummaryRow[] {
  const rows: OverlapSummaryRow[] = [];
  const curves = project.curves.filter((cv) => cv.visible);
  for (const model of project.models) {
    if (!model.visible) continue;
    const spec = modelSpec(model);
    if (!spec) continue;
    for (const curve of curves) {
      const row = summaryRow(model, spec, curve, project, opts.mergeGaps ?? false);
      if (row) rows.push(row);
    }
  }
  return rows.sort(compareSummary);
}
