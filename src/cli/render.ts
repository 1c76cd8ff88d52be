// Command-line renderer (`npm run render -- …`): a project file, an exported SVG or CSV files in, the same
// SVG the app exports (and optionally PNG and model CSV) out, without a browser and without any download.
import { overlapOutputs } from "./overlap-out";
import { existsSync, realpathSync, statSync } from "node:fs";
import { basename, dirname, join, resolve } from "node:path";
import { pathToFileURL } from "node:url";
import { parseArgs, USAGE, type CliOptions } from "./args";
import { InputError, type PreParsed } from "./inputs";
import { loadAnyProject } from "./pdf-input";
import { fitFigure } from "./fit-figure";
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
import { shortenedLegendNote } from "../plot/legend";
import { buildScene } from "../plot/scene";
import { modelsToCsv } from "../formats/model-csv";
import { exportFigurePdfWithInfo } from "../formats/figure-pdf";
import { nodePdfFonts } from "./pdf-fonts";
import { AXBAND_VERSION } from "./version";

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
  if (!existsSync(dir) || !statSync(dir).isDirectory())
    throw new InputError(`${path}: the directory ${dir} does not exist`);
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
    const loaded = await loadAnyProject(opts, preParsed);
    const { project, notes: fitNotes } = fitFigure(loaded.project);
    const legendNote = shortenedLegendNote(buildScene(project));
    for (const n of [...loaded.notes, ...fitNotes, ...(legendNote ? [legendNote] : [])]) io.err(`note: ${n}`);
    const files: OutputFile[] = [];
    const report: string[] = [];
    const preset = presetOf(project.figure);
    const asPdf = opts.out !== undefined && /\.pdf$/i.test(opts.out);
    // The project is embedded into the written SVG only; rasters are drawn from the lighter bare SVG.
    const bare = opts.out && !asPdf ? exportFigureSvg(project, { embedProject: false }) : "";
    if (opts.out && asPdf) {
      const r = await exportFigurePdfWithInfo(project, {
        fonts: nodePdfFonts(project.figure.font),
        creator: `axband ${AXBAND_VERSION}`,
        embedProject: opts.embed,
      });
      if (r.embedded && !r.embeddedCurves)
        io.err(
          `note: project attached without curve data (${r.omittedCurves.length} curve(s) too large to embed); the PDF reopens with models, figure and constants only: keep the project file or the CSV files for the data`,
        );
      files.push({ path: opts.out, data: r.pdf });
      report.push(
        `wrote ${opts.out} (${size(r.pdf.length)}, ${preset.widthPhysical} × ${preset.heightPhysical}, ${project.curves.length} curve(s), ${project.models.length} model(s)${r.embedded ? ", project attached" : ""})`,
      );
    }
    if (opts.out && !asPdf) {
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
      files.push({ path: opts.out, data: svg });
      report.push(
        `wrote ${opts.out} (${size(Buffer.byteLength(svg))}, ${preset.widthPhysical} × ${preset.heightPhysical}, ${project.curves.length} curve(s), ${project.models.length} model(s)${embedNote})`,
      );
    }
    if (opts.png) {
      const inches = exportSizeInches(project);
      const dpi = opts.scale !== undefined ? 96 * opts.scale : opts.dpi;
      const px = pngPixelSize(inches.widthIn, inches.heightIn, dpi);
      checkPngPixels(px, dpi);
      // Thinned for the PNG's own pixels (≤ 0.5 PNG px), not the 96/in scene px of the SVG.
      const resolution = rasterResolution(dpi);
      const forPng =
        bare && resolution === rasterResolution(96)
          ? bare
          : exportFigureSvg(project, { embedProject: false, resolution });
      const png = renderPng(forPng, px.widthPx, dpi, project.figure.font);
      files.push({ path: opts.png, data: png });
      report.push(
        `wrote ${opts.png} (${size(png.length)}, ${px.widthPx} × ${px.heightPx} px, ${Math.round(dpi * 100) / 100} dpi)`,
      );
    }
    if (opts.modelsCsv) {
      const csv = modelsToCsv(project);
      files.push({ path: opts.modelsCsv, data: csv });
      report.push(
        `wrote ${opts.modelsCsv} (${size(Buffer.byteLength(csv))}, ${project.models.filter((m) => m.visible).length} model(s))`,
      );
    }
    for (const o of overlapOutputs(project, opts.overlap, opts.overlapIntervals)) {
      files.push({ path: o.path, data: o.data });
      report.push(o.report);
    }
    try {
      writeAllOrNothing(files);
    } catch (e) {
      throw writeError(e, files);
    }
    for (const line of report) io.out(line);
    return 0;
  } catch (e) {
    if (e instanceof InputError) {
      io.err(`axband render: ${e.message}`);
      io.err("nothing was written");
      return 2;
    }
    io.err(`axband render: unexpected failure: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}`);
    io.err("nothing was written");
    return 1;
  }
}

// Run only when executed as a script (tests import `main` without side effects).
if (process.argv[1] && import.meta.url === pathToFileURL(resolve(process.argv[1])).href) {
  void main(process.argv.slice(2)).then((code) => (process.exitCode = code));
}
