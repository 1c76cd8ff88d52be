// Command-line renderer (`npm run render -- …`): a project file, an exported SVG or CSV files in, the same
// SVG the app exports (and optionally PNG and model CSV) out, without a browser and without any download.
import { overlapOutputs } from "./overlap-out";
import { existsSync, realpathSync, statSync } from "node:fs";
import { basename, dirname, join, resolve } from "node:path";
import { pathToFileURL } from "node:url";
import { parseArgs, USAGE, type CliOptions } from "./args";
import { loadProject, type PreParsed } from "./inputs";
import { InputError } from "./read-input";
import { fitFigure, type FittedFigure } from "./fit-figure";
import { pngPixelSize, renderPng } from "./png";
import { writeAllOrNothing, type OutputFile } from "./write-atomic";
import {
  embedCapText,
  embedProjectInSvgWithInfo,
  exportFigureSvg,
  exportSizeInches,
  rasterResolution,
} from "../formats/figure-file";
import { presetOf } from "../plot/layout";
import { writeSvg } from "../plot/svg";
import { modelsToCsv } from "../formats/model-csv";
import { AXBAND_VERSION } from "./version";
import type { Project } from "../project/types";

/** Where the renderer writes its messages (tests pass their own). */
export interface Io {
  out: (line: string) => void;
  err: (line: string) => void;
}

export const consoleIo: Io = { out: (s) => process.stdout.write(s + "\n"), err: (s) => process.stderr.write(s + "\n") };

function size(bytes: number): string {
  if (bytes >= 1e6) return `${(bytes / 1e6).toFixed(2)} MB`;
  if (bytes >= 1e3) return `${(bytes / 1e3).toFixed(1)} kB`;
  return `${bytes} bytes`;
}

/** Largest PNG the renderer draws: 100 megapixels (about 400 MB of RGBA while drawing). */
const MAX_PNG_PIXELS = 100e6;

function checkPngPixels(px: { widthPx: number; heightPx: number }, dpi: number): void {
  const total = px.widthPx * px.heightPx;
  if (Number.isFinite(total) && total <= MAX_PNG_PIXELS) return;
  const mp = total / 1e6;
  throw new InputError(
    `--png at ${dpi} dpi would be ${px.widthPx.toPrecision(3)} × ${px.heightPx.toPrecision(3)} px (${mp.toPrecision(3)} megapixels); the limit is ${MAX_PNG_PIXELS / 1e6} megapixels: lower --dpi or --scale`,
  );
}

/** The path a file is known by: its real path, or its real directory and name when it does not exist yet. */
function realPathOf(path: string): string {
  const abs = resolve(path);
  try {
    return realpathSync(abs);
  } catch {
    try {
      return join(realpathSync(dirname(abs)), basename(abs));
    } catch {
      return abs;
    }
  }
}

/** Refuses an output that is an input, or two outputs that are one file, however the paths are spelled. */
function checkDistinctPaths(opts: CliOptions): void {
  const inputs = new Map(opts.inputs.map((i) => [realPathOf(i.path), i.path]));
  const outputs = new Map<string, string>();
  const named: [string, string | undefined][] = [
    ["-o", opts.out],
    ["--png", opts.png],
    ["--models-csv", opts.modelsCsv],
    ["--overlap", opts.overlap],
    ["--overlap-intervals", opts.overlapIntervals],
  ];
  for (const [flag, path] of named) {
    if (!path) continue;
    const real = realPathOf(path);
    const input = inputs.get(real);
    if (input !== undefined) throw new InputError(`${flag} ${path}: is the input file ${input}; choose another output`);
    const other = outputs.get(real);
    if (other !== undefined) throw new InputError(`${flag} ${path}: is also the output of ${other}; choose another`);
    outputs.set(real, flag);
  }
}

/** A write failure as one line naming the file (disk full, permission, name too long…). */
function writeError(e: unknown, files: readonly OutputFile[]): unknown {
  const err = e as NodeJS.ErrnoException;
  if (typeof err?.code !== "string") return e;
  const why =
    err.code === "EACCES" || err.code === "EPERM" ? "permission denied" : (err.message.split(",")[0] ?? err.code);
  const target =
    files.find((f) => err.path !== undefined && err.path.includes(basename(f.path)))?.path ?? err.path ?? "output";
  return new InputError(`${target}: cannot write (${why})`);
}

function checkOutputDir(path: string): void {
  const dir = dirname(resolve(path));
  if (!existsSync(dir)) throw new InputError(`${path}: the directory ${dir} does not exist`);
  if (!statSync(dir).isDirectory()) throw new InputError(`${path}: ${dir} is a file, not a directory`);
  if (existsSync(path) && statSync(path).isDirectory()) throw new InputError(`${path}: is a directory`);
}

/**
 * Runs the renderer on argv (without `node` and the script) and returns the exit code: 0 when every output
 * was written, 2 for bad input or options (nothing written), 1 for an unexpected failure.
 */
export function main(argv: readonly string[], io: Io = consoleIo): Promise<number> {
  return run(argv, io, []);
}

/**
 * As {@link main}, with CSV parse results already made (by start.ts on worker threads), by input index;
 * any file without one is read and parsed here, so output and messages are those of {@link main}.
 */
export function mainWithPreParsed(argv: readonly string[], io: Io, preParsed: PreParsed): Promise<number> {
  return run(argv, io, preParsed);
}

/** One output: the file to write and the line that reports it once everything is written. */
interface Output {
  file: OutputFile;
  report: string;
}

/** The figure's size and contents, as the report lines give them. */
function figureSummary(project: Project): string {
  const preset = presetOf(project.figure);
  return `${preset.widthPhysical} × ${preset.heightPhysical}, ${project.curves.length} curve(s), ${project.models.length} model(s)`;
}

/** The PDF; its writer, fonts and font parser load only here (about a third of a second of start-up otherwise). */
async function pdfOutput(project: Project, opts: CliOptions, path: string, io: Io): Promise<Output> {
  const [{ exportFigurePdfWithInfo }, { nodePdfFonts }] = await Promise.all([
    import("../formats/figure-pdf"),
    import("./pdf-fonts"),
  ]);
  const r = await exportFigurePdfWithInfo(project, {
    fonts: nodePdfFonts(project.figure.font),
    creator: `axband ${AXBAND_VERSION}`,
    embedProject: opts.embed,
  });
  if (r.embedded && !r.embeddedCurves)
    io.err(
      `note: project attached without curve data (${r.omittedCurves.length} curve(s) too large to embed); the PDF reopens with models, figure and constants only: keep the project file or the CSV files for the data`,
    );
  const attached = r.embedded ? ", project attached" : "";
  return {
    file: { path, data: r.pdf },
    report: `wrote ${path} (${size(r.pdf.length)}, ${figureSummary(project)}${attached})`,
  };
}

/** The SVG, with the project embedded unless --no-embed. */
function svgOutput(project: Project, opts: CliOptions, path: string, bare: string, io: Io): Output {
  const embedded = opts.embed ? embedProjectInSvgWithInfo(bare, project) : undefined;
  const svg = embedded ? embedded.svg : bare;
  if (embedded && !embedded.embeddedCurves) {
    io.err(
      `note: project embedded without curve data (${embedded.omittedPoints} points exceed ${embedCapText(embedded.omittedBecause ?? "size")}); the SVG reopens with models, figure and constants only: keep the project file or the CSV files for the data`,
    );
  }
  const embedNote = embedded
    ? embedded.embeddedCurves
      ? ", project embedded"
      : ", project embedded without curve data"
    : "";
  return {
    file: { path, data: svg },
    report: `wrote ${path} (${size(Buffer.byteLength(svg))}, ${figureSummary(project)}${embedNote})`,
  };
}

/** The PNG, thinned for its own pixels (≤ 0.5 PNG px), not the 96/in scene px of the SVG. */
function pngOutput(project: Project, opts: CliOptions, path: string, bare: string): Output {
  const inches = exportSizeInches(project);
  const dpi = opts.scale !== undefined ? 96 * opts.scale : opts.dpi;
  const px = pngPixelSize(inches.widthIn, inches.heightIn, dpi);
  checkPngPixels(px, dpi);
  const resolution = rasterResolution(dpi);
  const forPng =
    bare && resolution === rasterResolution(96) ? bare : exportFigureSvg(project, { embedProject: false, resolution });
  const png = renderPng(forPng, px.widthPx, dpi, project.figure.font);
  const report = `wrote ${path} (${size(png.length)}, ${px.widthPx} × ${px.heightPx} px, ${Math.round(dpi * 100) / 100} dpi)`;
  return { file: { path, data: png }, report };
}

/** Every output the options ask for, in the order they are reported. */
async function outputs({ project, scene }: FittedFigure, opts: CliOptions, io: Io): Promise<Output[]> {
  const list: Output[] = [];
  const asPdf = opts.out !== undefined && /\.pdf$/i.test(opts.out);
  // The project is embedded into the written SVG only; rasters are drawn from the lighter bare SVG. Written from
  // the scene fitFigure built (what exportFigureSvg(project, { embedProject: false }) draws), not a second one.
  const bare = opts.out && !asPdf ? writeSvg(scene) : "";
  if (opts.out)
    list.push(asPdf ? await pdfOutput(project, opts, opts.out, io) : svgOutput(project, opts, opts.out, bare, io));
  if (opts.png) list.push(pngOutput(project, opts, opts.png, bare));
  if (opts.modelsCsv) {
    const csv = modelsToCsv(project);
    const shown = project.models.filter((m) => m.visible).length;
    list.push({
      file: { path: opts.modelsCsv, data: csv },
      report: `wrote ${opts.modelsCsv} (${size(Buffer.byteLength(csv))}, ${shown} model(s))`,
    });
  }
  for (const o of overlapOutputs(project, opts.overlap, opts.overlapIntervals))
    list.push({ file: { path: o.path, data: o.data }, report: o.report });
  return list;
}

/** The lines and exit code of a failure: 2 for bad input or options, 1 for anything unexpected. */
function failure(e: unknown, io: Io): number {
  if (e instanceof InputError) io.err(`axband render: ${e.message}`);
  else io.err(`axband render: unexpected failure: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}`);
  io.err("nothing was written");
  return e instanceof InputError ? 2 : 1;
}

async function run(argv: readonly string[], io: Io, preParsed: PreParsed): Promise<number> {
  const args = parseArgs(argv);
  if (!args.ok) {
    io.err(`axband render: ${args.error}`);
    io.err("run with --help for usage");
    return 2;
  }
  const opts = args.options;
  if (opts.help) {
    io.out(USAGE);
    return 0;
  }
  try {
    for (const p of [opts.out, opts.png, opts.modelsCsv, opts.overlap, opts.overlapIntervals]) if (p) checkOutputDir(p);
    checkDistinctPaths(opts);
    const loaded = await loadProject(opts, preParsed);
    const fitted = fitFigure(loaded.project);
    for (const n of [...loaded.notes, ...fitted.notes]) io.err(`note: ${n}`);
    const list = await outputs(fitted, opts, io);
    const files = list.map((o) => o.file);
    try {
      writeAllOrNothing(files);
    } catch (e) {
      throw writeError(e, files);
    }
    for (const o of list) io.out(o.report);
    return 0;
  } catch (e) {
    return failure(e, io);
  }
}

// Run only when executed as a script (tests import `main` without side effects).
if (process.argv[1] && import.meta.url === pathToFileURL(resolve(process.argv[1])).href) {
  void main(process.argv.slice(2)).then((code) => (process.exitCode = code));
}
