// Turns the renderer's input files into one project: CSV files through the app's importer and factories with
// ranges fitted to the data; a project file, exported SVG or PDF through the app's validation, loaded on demand.
import { applyAxesOptions } from "./args-axes";
import { basename } from "node:path";
import type { Curve, Model, Project } from "../project/types";
import { autoModelLabel, defaultFigure, emptyProject, newCurve, newModel } from "../project/defaults";
import { minusSigns } from "../plot/format";
import { formatProblem, formatRejection, labelFromFileName, type CurveParseResult } from "../formats/csv";
import { parseEOverN } from "../physics/eovern-parse";
import type { CliInput, CliOptions } from "./args";
import { fitRanges } from "./fit-ranges";
import { InputError, parseCsvFile } from "./read-input";

/** The project to draw, and what the user should know about how it was read (printed on stderr). */
export interface LoadedProject {
  project: Project;
  notes: string[];
}

/** Most `file:row:column: reason` lines printed before "… and N more". */
export const MAX_ROW_MESSAGES = 20;

/** Parse results found ahead of loading (by parse-parallel.ts), by input index; undefined: parse here. */
export type PreParsed = readonly (CurveParseResult | undefined)[];

function loadCsv(inputs: CliInput[], opts: CliOptions, preParsed: PreParsed): LoadedProject {
  const notes: string[] = [];
  const curves: Curve[] = [];
  const badRows: string[] = [];
  let badCount = 0;
  for (const [index, input] of inputs.entries()) {
    const fileName = basename(input.path);
    // The app's import code: the same parser, unit detection and messages.
    const r = preParsed[index] ?? parseCsvFile(input.path, opts);
    if (r.fatal) throw new InputError(formatProblem(input.path, r.fatal));
    for (const bad of r.rejected) badRows.push(formatRejection(input.path, bad));
    badCount += r.rejectedCount;
    if (r.rejectedCount > 0 && opts.skipBadRows)
      notes.push(`${input.path}: skipped ${r.rejectedCount} row(s) that could not be read (--skip-bad-rows)`);
    for (const m of r.messages) if (m.level !== "info") notes.push(`${input.path}: ${m.text}`);
    if (r.nonPositive > 0)
      notes.push(`${input.path}: ${r.nonPositive} point(s) with a mass or coupling ≤ 0 cannot be drawn on log axes`);
    if (r.massEv.length === 0)
      throw new InputError(`${input.path}: no data rows (two numeric columns: mass, coupling)`);
    // Ids by position, not random: the same files give the same SVG bytes (paper figures rebuilt by scripts).
    const curve = newCurve(
      {
        id: `c-${curves.length + 1}`,
        label: r.label ?? labelFromFileName(fileName),
        role: input.role,
        massEv: r.massEv,
        gInvGeV: r.gInvGeV,
        keepOrder: input.role === "region",
        citation: r.citation ?? "",
        fileName,
      },
      { curves },
    );
    curves.push(curve);
  }
  if (badCount > 0) {
    const shown = badRows.slice(0, MAX_ROW_MESSAGES);
    const more = badCount > shown.length ? [`… and ${badCount - shown.length} more`] : [];
    if (!opts.skipBadRows) {
      throw new InputError(
        [
          ...shown,
          ...more,
          `${badCount} row(s) could not be read; fix them, or pass --skip-bad-rows to leave them out`,
        ].join("\n"),
      );
    }
    notes.unshift(...shown, ...more);
  }
  const models: Model[] = [];
  for (const spec of opts.models) {
    const e = parseEOverN(spec);
    if (!e.ok) throw new InputError(`--model ${spec}: ${e.error}`);
    // Labels with U+2212, as the app writes them (legend, notes, model CSV, overlap exports).
    const label = minusSigns(autoModelLabel(e.min, e.max));
    models.push(newModel({ id: `m-${models.length + 1}`, label, eOverNMin: e.min, eOverNMax: e.max }, { models }));
  }
  const figure = defaultFigure();
  const fitted = fitRanges(curves);
  if (fitted) {
    figure.massRangeEv = fitted.massRangeEv;
    figure.yRange = fitted.gRange;
  }
  const project = emptyProject(inputs.length === 1 ? labelFromFileName(basename(inputs[0].path)) : "CSV figure");
  return { project: { ...project, curves, models, figure }, notes };
}

/** Applies the size, range, title, font, legend, axis and exclusion options to a loaded project (a copy). */
export function applyFigureOptions(project: Project, opts: CliOptions): Project {
  const f = { ...project.figure };
  if (opts.preset) f.preset = opts.preset;
  if (opts.widthMm !== undefined) f.customWidthMm = opts.widthMm;
  if (opts.heightMm !== undefined) f.customHeightMm = opts.heightMm;
  if (opts.massRangeEv) f.massRangeEv = opts.massRangeEv;
  if (opts.gRange) f.yRange = opts.gRange;
  if (opts.title !== undefined) f.title = opts.title;
  if (opts.font) f.font = opts.font;
  if (opts.legend) f.legend = opts.legend;
  if (opts.legendScale !== undefined) f.legendScale = opts.legendScale;
  const mark = opts.exclusions;
  const curves = mark
    ? project.curves.map((c) => (c.role === "exclusion" ? { ...c, exclusionMark: mark } : c))
    : project.curves;
  return { ...project, curves, figure: applyAxesOptions(f, opts) };
}

/** Notes for curves of a loaded project with points a log axis cannot show (they stay in the project). */
export function undrawablePointNotes(project: Project, source: string): string[] {
  const notes: string[] = [];
  for (const c of project.curves) {
    let bad = 0;
    const n = Math.min(c.massEv.length, c.gInvGeV.length);
    for (let i = 0; i < n; i++)
      if (!(c.massEv[i] > 0 && c.gInvGeV[i] > 0 && Number.isFinite(c.massEv[i]) && Number.isFinite(c.gInvGeV[i])))
        bad++;
    if (bad > 0)
      notes.push(
        `${source}: curve "${c.label}" has ${bad} point(s) with a mass or coupling ≤ 0 (or not finite); they are not drawn on the log axes`,
      );
    if (c.massEv.length === 0) notes.push(`${source}: curve "${c.label}" has no data points`);
  }
  return notes;
}

/**
 * The project of CSV inputs, with the figure options applied; throws InputError on anything the user must fix.
 * `preParsed` holds CSV parse results already made elsewhere (same parser, same options), by input index.
 * @default preParsed [] (every file read and parsed here)
 */
export function loadCsvProject(opts: CliOptions, preParsed: PreParsed = []): LoadedProject {
  const loaded = loadCsv(opts.inputs, opts, preParsed);
  return { project: applyFigureOptions(loaded.project, opts), notes: loaded.notes };
}

/**
 * Reads every input and returns the project to draw; throws InputError on anything the user must fix. The
 * readers of project files, SVG and PDF (the schema, the PDF parser) load only for such an input.
 * @default preParsed [] (every CSV file read and parsed here)
 */
export async function loadProject(opts: CliOptions, preParsed: PreParsed = []): Promise<LoadedProject> {
  const first = opts.inputs[0];
  if (first.kind === "csv") return loadCsvProject(opts, preParsed);
  const loaded =
    first.kind === "pdf"
      ? await (await import("./pdf-input")).loadPdfProject(first)
      : (await import("./project-input")).loadSavedProject(first);
  return {
    project: applyFigureOptions(loaded.project, opts),
    notes: [...loaded.notes, ...undrawablePointNotes(loaded.project, first.path)],
  };
}
