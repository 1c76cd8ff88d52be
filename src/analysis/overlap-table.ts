// The overlap table: for each visible model × curve, the mass intervals where the curve excludes all, part or none
// of the model band, with CSV and Markdown exports (the UI only sorts, filters and highlights).
import { csvTextCell, markdownTextCell } from "./table-cells";
import type { AxionConstants } from "../physics/constants";
import { faFromMass, frequencyFromMass } from "../physics/coupling";
import { parseEOverN } from "../physics/eovern-parse";
import { overlapDetail, type OverlapDetail } from "./overlap";
import { rescaleFactor } from "./rescale";
import { constantsOf } from "../project/physics-constants";
import type { Curve, CurveRole, Model, Project } from "../project/types";

export type OverlapKind =
  "excluded-whole" | "excluded-part" | "reach-whole" | "reach-part" | "inside-whole" | "inside-part" | "none";

/** One row of the overlap table: one mass interval of one model × curve pair. */
export interface OverlapRow {
  modelId: string;
  modelLabel: string;
  curveId: string;
  curveLabel: string;
  role: CurveRole;
  kind: OverlapKind;
  massMinEv: number;
  massMaxEv: number;
  /** f_a at the interval's ends (f_a falls as m_a grows: faMin belongs to massMax), with the project's K. */
  faMinGeV: number;
  faMaxGeV: number;
  /** Photon frequency ν = m_a/h at the ends. */
  freqMinHz: number;
  freqMaxHz: number;
  /** For a partial overlap: the E/N sub-interval excluded (reached, inside) somewhere in this mass interval, when it is one piece. */
  eOverNSub?: [number, number];
  /** All pieces of that E/N set (two when the band straddles c_γ). */
  eOverNSubs?: [number, number][];
  /** For exclusion and projection: the E/N values excluded (reached) at every mass of the interval. */
  eOverNSubThroughout?: [number, number][];
  /** Human-readable remarks (cancellation, gaps merged, rescaling problems); "" when none. */
  note: string;
}

/** The constants a project uses: a published set or the user's own values. */
export function projectConstants(project: Pick<Project, "physics">): AxionConstants {
  return constantsOf(project.physics);
}

/**
 * The factor the curve's couplings are shown with: √(ρ_assumed/ρ_shown)/√f (common practice, see rescale.ts);
 * 1 with a reason when the rescaling parameters are invalid.
 */
export function curveGFactor(curve: Curve): { factor: number; problem: string | null } {
  try {
    return { factor: rescaleFactor(curve.rescale), problem: null };
  } catch (err) {
    return { factor: 1, problem: `rescaling ignored: ${(err as Error).message}` };
  }
}

const KIND_BY_ROLE: Record<CurveRole, { whole: OverlapKind; part: OverlapKind }> = {
  exclusion: { whole: "excluded-whole", part: "excluded-part" },
  projection: { whole: "reach-whole", part: "reach-part" },
  region: { whole: "inside-whole", part: "inside-part" },
};

const CANCELLATION_NOTE: Record<CurveRole, string> = {
  exclusion: "cancellation: E/N near c_γ has g → 0; no finite limit excludes the whole band",
  projection: "cancellation: E/N near c_γ has g → 0; no finite sensitivity reaches the whole band",
  region: "cancellation: E/N near c_γ has g → 0; no closed region contains the whole band",
};

function formatEOverN(x: number): string {
  return String(Number(x.toPrecision(4)));
}

function describeSubs(subs: [number, number][], role: CurveRole): string {
  const verb = role === "exclusion" ? "excluded" : role === "projection" ? "within reach" : "inside";
  const pieces = subs.map(([a, b]) => (a === b ? formatEOverN(a) : `[${formatEOverN(a)}, ${formatEOverN(b)}]`));
  return pieces.length === 0 ? "" : `E/N ${pieces.join(" ∪ ")} ${verb} somewhere in this interval`;
}

function overlapsAny(lo: number, hi: number, list: [number, number][]): boolean {
  return list.some(([a, b]) => a < hi && b > lo);
}

function rowsForPair(
  model: Model,
  curve: Curve,
  detail: OverlapDetail,
  c: AxionConstants,
  extraNote: string[],
): OverlapRow[] {
  const kinds = KIND_BY_ROLE[curve.role];
  const items: { lo: number; hi: number; kind: OverlapKind; subs?: [number, number][]; all?: [number, number][] }[] =
    [];
  for (const [lo, hi] of detail.whole) items.push({ lo, hi, kind: kinds.whole });
  detail.part.forEach(([lo, hi], q) =>
    items.push({ lo, hi, kind: kinds.part, subs: detail.partEOverN[q], all: detail.partEOverNThroughout?.[q] }),
  );
  for (const [lo, hi] of detail.none) items.push({ lo, hi, kind: "none" });
  items.sort((a, b) => a.lo - b.lo);
  return items.map((it) => {
    const notes: string[] = [];
    if (detail.cancels) notes.push(CANCELLATION_NOTE[curve.role]);
    // One piece goes in the E/N columns; two pieces (a band straddling c_γ) are spelled out here.
    if (it.subs && it.subs.length > 1) notes.push(describeSubs(it.subs, curve.role));
    if (it.kind !== "none" && overlapsAny(it.lo, it.hi, detail.bridgedGapsEv)) {
      notes.push("merged across gaps narrower than one curve sample");
    }
    notes.push(...extraNote);
    const row: OverlapRow = {
      modelId: model.id,
      modelLabel: model.label,
      curveId: curve.id,
      curveLabel: curve.label,
      role: curve.role,
      kind: it.kind,
      massMinEv: it.lo,
      massMaxEv: it.hi,
      faMinGeV: faFromMass(it.hi, { constants: c }),
      faMaxGeV: faFromMass(it.lo, { constants: c }),
      freqMinHz: frequencyFromMass(it.lo),
      freqMaxHz: frequencyFromMass(it.hi),
      note: notes.join("; "),
    };
    if (it.subs) {
      row.eOverNSubs = it.subs.map(([a, b]) => [a, b]);
      if (it.subs.length === 1) row.eOverNSub = [it.subs[0][0], it.subs[0][1]];
    }
    if (it.all) row.eOverNSubThroughout = it.all.map(([a, b]) => [a, b]);
    return row;
  });
}

/**
 * Every visible model × visible curve of the project, one row per mass interval (whole, part and none,
 * ascending in mass, covering the curve's mass range), computed with the project's constants (reference
 * 2016, 2019 or custom), each model's theory spread and each curve's rescaling. Models whose E/N cannot be
 * read and curves with fewer than two usable points give no rows. Intervals merge across gaps narrower
 * than one curve sample (see overlapDetail). Rows come in the project's order: model by model as listed,
 * within a model curve by curve as listed, within a pair by mass; the overlap panel shows them strongest
 * verdict first and relies on this order within a verdict.
 * @param project the whole state; nothing in it is changed.
 */
export function overlapTable(project: Project): OverlapRow[] {
  const c = projectConstants(project);
  const rows: OverlapRow[] = [];
  const curves = project.curves.filter((cv) => cv.visible);
  for (const model of project.models) {
    if (!model.visible) continue;
    const min = parseEOverN(model.eOverNMin);
    const max = parseEOverN(model.eOverNMax);
    if (!min.ok || !max.ok) continue;
    const eOverNMin = Math.min(min.minValue, max.minValue);
    const eOverNMax = Math.max(min.maxValue, max.maxValue);
    for (const curve of curves) {
      const { factor, problem } = curveGFactor(curve);
      const detail = overlapDetail(
        { eOverNMin, eOverNMax, sigmas: model.sigmas, constants: c },
        { massEv: curve.massEv, gInvGeV: curve.gInvGeV, role: curve.role, gFactor: factor },
      );
      if (!detail.massRangeEv) continue;
      const extra: string[] = [];
      if (problem) extra.push(problem);
      if (detail.skippedPoints > 0)
        extra.push(`${detail.skippedPoints} point(s) with non-positive or missing values skipped`);
      rows.push(...rowsForPair(model, curve, detail, c, extra));
    }
  }
  return rows;
}

// ---------------------------------------------------------------------------------------------------------
// Exports.

const KIND_TEXT: Record<OverlapKind, string> = {
  "excluded-whole": "excluded (whole band)",
  "excluded-part": "excluded (part of band)",
  "reach-whole": "within reach (whole band)",
  "reach-part": "within reach (part of band)",
  "inside-whole": "inside region (whole band)",
  "inside-part": "inside region (part of band)",
  none: "none",
};

const CSV_HEADER = [
  "model_id",
  "model",
  "curve_id",
  "curve",
  "role",
  "kind",
  "m_a_min_eV",
  "m_a_max_eV",
  "f_a_min_GeV",
  "f_a_max_GeV",
  "freq_min_Hz",
  "freq_max_Hz",
  "EN_sub_min",
  "EN_sub_max",
  "note",
];

const csvField = csvTextCell;

/** Full precision: the shortest decimal that reads back as the same double. */
function csvNumber(x: number | undefined): string {
  return x === undefined || !Number.isFinite(x) ? "" : String(x);
}

/**
 * The table as CSV (RFC 4180 quoting, "\n" line ends), one header line with units in the column names,
 * numbers at full precision. E/N sub-interval columns are filled when the excluded E/N set is one piece;
 * otherwise the note lists the pieces.
 */
export function overlapTableToCsv(rows: OverlapRow[]): string {
  const lines = [CSV_HEADER.join(",")];
  for (const r of rows) {
    lines.push(
      [
        csvField(r.modelId),
        csvField(r.modelLabel),
        csvField(r.curveId),
        csvField(r.curveLabel),
        r.role,
        r.kind,
        csvNumber(r.massMinEv),
        csvNumber(r.massMaxEv),
        csvNumber(r.faMinGeV),
        csvNumber(r.faMaxGeV),
        csvNumber(r.freqMinHz),
        csvNumber(r.freqMaxHz),
        csvNumber(r.eOverNSub?.[0]),
        csvNumber(r.eOverNSub?.[1]),
        csvField(r.note),
      ].join(","),
    );
  }
  return lines.join("\n") + "\n";
}

/**
 * A number with `digits` significant digits: plain between 10⁻³ and 10⁴, otherwise as "1.234e-5".
 * @default digits 4
 */
export function formatSignificant(x: number, digits = 4): string {
  if (!Number.isFinite(x)) return "";
  if (x === 0) return "0";
  const ax = Math.abs(x);
  if (ax >= 1e-3 && ax < 1e4) return String(Number(x.toPrecision(digits)));
  const [mant, exp] = x.toExponential(digits - 1).split("e");
  return `${String(Number(mant))}e${exp.replace(/^\+/, "")}`;
}

const mdCell = markdownTextCell;

/**
 * The table as a GitHub-style Markdown table with units in the header and 4 significant digits.
 */
export function overlapTableToMarkdown(rows: OverlapRow[]): string {
  const header = [
    "Model",
    "Curve",
    "Role",
    "Overlap",
    "m_a min (eV)",
    "m_a max (eV)",
    "f_a min (GeV)",
    "f_a max (GeV)",
    "ν min (Hz)",
    "ν max (Hz)",
    "E/N sub-interval",
    "Note",
  ];
  const align = header.map((_, i) => (i >= 4 && i <= 9 ? "---:" : "---"));
  const lines = [`| ${header.join(" | ")} |`, `| ${align.join(" | ")} |`];
  for (const r of rows) {
    const subs = (r.eOverNSubs ?? []).map(([a, b]) => `[${formatSignificant(a)}, ${formatSignificant(b)}]`).join(" ∪ ");
    const cells = [
      mdCell(r.modelLabel),
      mdCell(r.curveLabel),
      r.role,
      KIND_TEXT[r.kind],
      formatSignificant(r.massMinEv),
      formatSignificant(r.massMaxEv),
      formatSignificant(r.faMinGeV),
      formatSignificant(r.faMaxGeV),
      formatSignificant(r.freqMinHz),
      formatSignificant(r.freqMaxHz),
      mdCell(subs),
      mdCell(r.note),
    ];
    lines.push(`| ${cells.join(" | ")} |`);
  }
  return lines.join("\n") + "\n";
}
