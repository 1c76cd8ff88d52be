// Model lines and bands as CSV (m_a, f_a, g_low, g_high) sampled over the figure's mass range, so users can
// replot the predictions in their own scripts. Pure: a project in, text out; the UI and the CLI save it.
import { bandEdges, faFromMass, linesBandEdges, rationalToNumber, type AxionConstants } from "../physics/index";
import { modelKindNote } from "../plot/legend";
import { modelShape } from "../plot/model-shape";
import type { Model, Project } from "../project/types";
import { constantsOf } from "../plot/physics-settings";

/** Column header of every block (units in brackets, as the CSV importer reads them). */
export const MODEL_CSV_HEADER = "m_a [eV],f_a [GeV],g_low [GeV^-1],g_high [GeV^-1]";

export interface ModelCsvOpts {
  /** Number of masses, log-uniform over the figure's mass range, ends included. @default 101 */
  points?: number;
  /** Also export models hidden in the figure. @default false */
  includeHidden?: boolean;
  /** Mass range in eV to sample instead of the figure's. @default project.figure.massRangeEv */
  massRangeEv?: [number, number];
}

/** One model's block: the text (comment lines, header, rows) and a file name for saving it alone. */
export interface ModelCsvBlock {
  modelId: string;
  label: string;
  fileName: string;
  text: string;
}

/** What could not be exported, with the reason (e.g. an E/N that does not read as a number). */
export interface ModelCsvSkip {
  modelId: string;
  label: string;
  reason: string;
}

// A label must stay on its comment line: a newline in it would start a data row in the reader's parser.
function oneLine(s: string): string {
  // eslint-disable-next-line no-control-regex
  return s.replace(/[\u0000-\u001f\u007f\u2028\u2029]+/g, " ").trim();
}

function slug(s: string): string {
  const t = s
    .normalize("NFKD")
    .replace(/[^\w.-]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .toLowerCase();
  return t.slice(0, 40) || "model";
}

function num(v: number): string {
  return v === 0 ? "0" : v.toExponential(6);
}

/** Masses in eV, log-uniform from lo to hi with both ends exact. */
export function logMasses(loEv: number, hiEv: number, points: number): Float64Array {
  const n = Math.max(2, Math.floor(points));
  const a = Math.log10(Math.min(loEv, hiEv));
  const b = Math.log10(Math.max(loEv, hiEv));
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = 10 ** (a + ((b - a) * i) / (n - 1));
  out[0] = Math.min(loEv, hiEv);
  out[n - 1] = Math.max(loEv, hiEv);
  return out;
}

function block(model: Model, c: AxionConstants, masses: Float64Array, index: number): ModelCsvBlock | ModelCsvSkip {
  const label = oneLine(model.label) || `model ${index + 1}`;
  const a = rationalToNumber(model.eOverNMin);
  const b = rationalToNumber(model.eOverNMax);
  if (!Number.isFinite(a) || !Number.isFinite(b)) {
    return {
      modelId: model.id,
      label,
      reason: `E/N "${oneLine(model.eOverNMin)}".."${oneLine(model.eOverNMax)}" is not a number`,
    };
  }
  const lo = Math.min(a, b);
  const hi = Math.max(a, b);
  const isLine = lo === hi;
  const sigmas = model.sigmas > 0 ? model.sigmas : 0;
  const en = isLine
    ? oneLine(model.eOverNMin)
    : `${oneLine(a <= b ? model.eOverNMin : model.eOverNMax)}..${oneLine(a <= b ? model.eOverNMax : model.eOverNMin)}`;
  // Between lines and model sets: the band between their lines (a set's central share, or all its lines).
  const shape = model.kind === "between" || model.kind === "set" ? modelShape(model, c) : null;
  const values = shape && (shape.kind === "lines-band" || shape.kind === "lines") ? shape.values : null;
  if (values) return linesBlock(model, label, values, c, masses, index);
  const notes: [string, string] = [
    `# E/N = ${en} (${isLine ? "model line" : "model band"})`,
    sigmas > 0
      ? `# theory spread: c_gamma and K varied by +-${sigmas} sigma (g_low and g_high include it); f_a uses the central K`
      : isLine
        ? "# model line: g_low = g_high = alpha/(2 pi f_a) |E/N - c_gamma|"
        : "# model band: g_low and g_high are the band edges (g_low = 0 where the coupling can cancel)",
  ];
  const opts = { constants: c, sigmas };
  return csvBlock({ model, label, index, c, masses }, notes, (m) => bandEdges(m, lo, hi, opts));
}

/**
 * One model's file: its label, the E/N note, the constants, the band note, the column names, and one row per mass.
 * @param notes the E/N line and the line that says what g_low and g_high are
 */
function csvBlock(
  of: { model: Model; label: string; index: number; c: AxionConstants; masses: Float64Array },
  notes: [string, string],
  edges: (massEv: number) => { lowInvGeV: number; highInvGeV: number },
): ModelCsvBlock {
  const { model, label, index, c, masses } = of;
  const lines = [
    `# model: ${label}`,
    notes[0],
    `# c_gamma = ${c.cGamma} +- ${c.cGammaSigma}; m_a*f_a = K * 1e6 eV*GeV with K = ${c.kMuEv} +- ${c.kMuEvSigma} ueV (${oneLine(c.label)})`,
    notes[1],
    MODEL_CSV_HEADER,
  ];
  for (const m of masses) {
    const e = edges(m);
    lines.push(`${num(m)},${num(faFromMass(m, { constants: c }))},${num(e.lowInvGeV)},${num(e.highInvGeV)}`);
  }
  return {
    modelId: model.id,
    label,
    fileName: `model-${String(index + 1).padStart(2, "0")}-${slug(label)}.csv`,
    text: lines.join("\n") + "\n",
  };
}

function linesBlock(
  model: Model,
  label: string,
  values: number[],
  c: AxionConstants,
  masses: Float64Array,
  index: number,
): ModelCsvBlock {
  const sigmas = model.sigmas > 0 ? model.sigmas : 0;
  const what = modelKindNote(model) ?? "between lines";
  const notes: [string, string] = [
    `# E/N lines = ${model.members.map((m) => oneLine(m.eOverN)).join(" | ")} (${what})`,
    `# g_low and g_high: the lines with the smallest and largest |E/N - c_gamma|${model.kind === "set" && model.setDraw === "central" ? " among the central share" : ""}${sigmas > 0 ? `, c_gamma and K varied by +-${sigmas} sigma` : ""}; g_low = 0 only where a line reaches 0`,
  ];
  return csvBlock({ model, label, index, c, masses }, notes, (m) =>
    linesBandEdges(m, values, { constants: c, sigmas }),
  );
}

/**
 * Every (visible) model of the project as its own CSV block, sampled at `points` log-uniform masses over the
 * figure's mass range. Couplings are always g_aγγ in GeV⁻¹, whatever the figure's y view. A model line has
 * g_low = g_high unless it has a theory spread; a band whose E/N interval (widened by the spread) contains
 * c_γ has g_low = 0. Models whose E/N does not read as a number are listed in `skipped`.
 */
export function modelCsvBlocks(
  project: Project,
  opts: ModelCsvOpts = {},
): { blocks: ModelCsvBlock[]; skipped: ModelCsvSkip[] } {
  const [lo, hi] = opts.massRangeEv ?? project.figure.massRangeEv;
  if (!(lo > 0 && hi > 0 && Number.isFinite(lo) && Number.isFinite(hi))) {
    throw new Error(`mass range must be positive and finite, got [${lo}, ${hi}] eV`);
  }
  const masses = logMasses(lo, hi, opts.points ?? 101);
  const c = constantsOf(project.physics);
  const blocks: ModelCsvBlock[] = [];
  const skipped: ModelCsvSkip[] = [];
  project.models.forEach((m, i) => {
    if (!m.visible && !opts.includeHidden) return;
    const r = block(m, c, masses, i);
    if ("text" in r) blocks.push(r);
    else skipped.push(r);
  });
  return { blocks, skipped };
}

/** All model blocks in one CSV text, separated by a blank line (readers that split on blank lines get one table per model). */
export function modelsToCsv(project: Project, opts: ModelCsvOpts = {}): string {
  const { blocks, skipped } = modelCsvBlocks(project, opts);
  const head = [
    `# axband model lines and bands of project "${oneLine(project.name)}"`,
    ...skipped.map((s) => `# skipped ${s.label}: ${s.reason}`),
  ];
  return [head.join("\n") + "\n", ...blocks.map((b) => b.text)].join("\n");
}
