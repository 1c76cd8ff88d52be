// Turns the renderer's input files into one project: a project file or an exported SVG through the same
// validation as the app, or CSV files through the app's importer and factories with ranges fitted to the data.
import { applyAxesOptions } from "./args-axes";
import { readFileSync } from "node:fs";
import { basename } from "node:path";
import type { Curve, Model, Project } from "../project/types";
import { autoModelLabel, defaultFigure, emptyProject, newCurve, newModel } from "../project/defaults";
import { minusSigns } from "../plot/format";
import {
  decodeImportBytes,
  formatProblem,
  formatRejection,
  labelFromFileName,
  parseCurveText,
  type CurveParseResult,
} from "../formats/csv";
import { projectFromFile } from "../formats/project-file";
import { parseEOverN } from "../physics/eovern-parse";
import { extractProjectFromSvg } from "../formats/figure-file";
import type { CliInput, CliOptions } from "./args";
import { fitRanges } from "./fit-ranges";

/** A problem with the user's input or options: reported on stderr, exit code 2, nothing written. */
export class InputError extends Error {}

/** The project to draw, and what the user should know about how it was read (printed on stderr). */
export interface LoadedProject {
  project: Project;
  notes: string[];
}

/** Most `file:row:column: reason` lines printed before "… and N more". */
export const MAX_ROW_MESSAGES = 20;

function readText(path: string): string {
  return readBytes(path).toString("utf8");
}

/** A CSV file's text, decoded as the app's import decodes it (UTF-16 by its BOM, UTF-8, else Windows-1252). */
function readCsvText(path: string): { text: string; encoding: string } {
  const d = decodeImportBytes(readBytes(path));
  if (!d.ok) throw new InputError(formatProblem(path, d.problem));
  return d;
}

function readBytes(path: string): Buffer {
  try {
    return readFileSync(path);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const why =
      code === "ENOENT"
        ? "no such file"
        : code === "EISDIR"
          ? "is a directory"
          : code === "EACCES"
            ? "permission denied"
            : (e as Error).message;
    throw new InputError(`${path}: cannot read the file (${why})`);
  }
}

function loadProjectFile(input: CliInput): LoadedProject {
  const text = readText(input.path);
  const r = projectFromFile(text, basename(input.path));
  if (!r.ok) throw new InputError(`${input.path}: not a usable axband project: ${r.error}`);
  return { project: r.project, notes: r.repairs.map((s) => `${input.path}: repaired on loading: ${s}`) };
}

function loadSvg(input: CliInput): LoadedProject {
  const r = extractProjectFromSvg(readText(input.path));
  if (!r.ok) throw new InputError(`${input.path}: ${r.error}`);
  return { project: r.project, notes: r.repairs.map((s) => `${input.path}: repaired on loading: ${s}`) };
}

/** Reads and parses one CSV input as the app's import would (the worker threads call this too). */
export function parseCsvFile(path: string, opts: Pick<CliOptions, "massUnit" | "couplingUnit">): CurveParseResult {
  const { text, encoding } = readCsvText(path);
  return parseCurveText(text, {
    fileName: basename(path),
    massUnit: opts.massUnit,
    couplingUnit: opts.couplingUnit,
    encoding,
  });
}

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
 * Reads every input and returns the project to draw; throws InputError on anything the user must fix.
 * `preParsed` holds CSV parse results already made elsewhere (same parser, same options), by input index.
 * @default preParsed [] (every file read and parsed here)
 */
export function loadProject(opts: CliOptions, preParsed: PreParsed = []): LoadedProject {
  const first = opts.inputs[0];
  const loaded =
    first.kind === "project"
      ? loadProjectFile(first)
      : first.kind === "svg"
        ? loadSvg(first)
        : loadCsv(opts.inputs, opts, preParsed);
  const extra = first.kind === "csv" ? [] : undrawablePointNotes(loaded.project, first.path);
  return { project: applyFigureOptions(loaded.project, opts), notes: [...loaded.notes, ...extra] };
}
