// The exported figure file: project → self-contained SVG at a preset's physical size, the project embedded in
// <metadata> so it reopens (curve data only up to EMBED_MAX_POINTS points and EMBED_MAX_CHARS characters).
import type { Project, SizePreset } from "../project/types";
import type { Scene } from "../plot/scene-types";
import { PX_PER_IN, presetOf } from "../plot/layout";
import { buildScene } from "../plot/scene";
import { writeSvg } from "../plot/svg";
import { encodeLink, encodeLinkWithin } from "./codec/encode";

/** Namespace URI of our <metadata> element (a URN of our own: nothing is fetched from it). */
export const AXBAND_PROJECT_NS = "urn:axband:project";
/** Encoding of the embedded payload, written into the element's `encoding` attribute. */
export const EMBED_ENCODING = "deflate-base64url";
/**
 * Longest embedded project with curve data, in characters of the payload (ASCII, so also bytes): 2 MB. A
 * project that would take more is embedded without its curve data (models, figure and constants only, with
 * curves="omitted" on the element), so the figure file stays a figure: 2·10⁶ points would add ~9 MB.
 */
export const EMBED_MAX_CHARS = 2_000_000;

/**
 * Most curve points (one per mass value, over all curves) an embedded project carries. A project with more
 * is embedded without its curve data at once, without trying to pack it: finding out that 2·10⁶ points do
 * not fit EMBED_MAX_CHARS costs ~0.5 s of packing (bench/render.mjs), a quarter of a CLI run. 500,000 points
 * would need ≥ 3 bytes each to pass 2 MB, which measured data reach (the invented benchmark curves take 3.4
 * bytes a point, 120,000 full-precision points already 2.6 MB), so the cap rarely changes what is embedded.
 */
export const EMBED_MAX_POINTS = 500_000;

/**
 * Thinning resolution of the exported SVG (columns per scene px). The plot core's thinning (first/min/max/last
 * per column for sorted curves, simplification for regions) keeps the drawn line within about one column of
 * every data point, so two columns per px keep it ≤ 0.5 px at the export size (bench/render.mjs measures it:
 * max 0.98 px at 1, 0.48 px at 2, on 2·10⁶ invented points).
 */
export const EXPORT_RESOLUTION = 2;

/**
 * Thinning resolution for a raster of the figure at `dpi`: two columns per PNG pixel (2·dpi/96, at least
 * EXPORT_RESOLUTION), so the thinning error stays ≤ 0.5 px of the PNG too (e.g. 6.25 at 300 dpi).
 */
export function rasterResolution(dpi: number): number {
  return Number.isFinite(dpi) && dpi > PX_PER_IN ? (2 * dpi) / PX_PER_IN : EXPORT_RESOLUTION;
}

export interface ExportSvgOpts {
  /** Size preset to draw at. @default project.figure.preset */
  preset?: SizePreset;
  /** Embed the whole project (curve data included) in <metadata>. @default true */
  embedProject?: boolean;
  /** Thinning resolution (columns per scene px); raise it for rasters, see {@link rasterResolution}. @default EXPORT_RESOLUTION */
  resolution?: number;
  /** Longest embedded payload with curve data, in characters; above it the curve data are left out. @default EMBED_MAX_CHARS */
  embedMaxChars?: number;
  /** Most curve points embedded; with more the curve data are left out without packing them. @default EMBED_MAX_POINTS */
  embedMaxPoints?: number;
}

/** What went into the SVG's <metadata>. */
export interface EmbedInfo {
  /** Whether a project is embedded at all (false with `embedProject: false`). */
  embedded: boolean;
  /** Whether the embedded project has its curve data (true also when it has no curves; false when not embedded). */
  embeddedCurves: boolean;
  /** Labels of the curves whose data were left out for size (empty when the data are in, or nothing is embedded). */
  omittedCurves: string[];
  /** Number of points of those curves. */
  omittedPoints: number;
  /** Why the data were left out: more points than EMBED_MAX_POINTS, or a payload over EMBED_MAX_CHARS; null when nothing was. */
  omittedBecause: "points" | "size" | null;
}

/** An exported SVG and what its <metadata> carries. */
export interface SvgWithInfo extends EmbedInfo {
  svg: string;
}

/** The project with its figure switched to another preset (a copy; the input is not touched). */
function withPreset(project: Project, preset: SizePreset | undefined): Project {
  return preset === undefined || preset === project.figure.preset
    ? project
    : { ...project, figure: { ...project.figure, preset } };
}

/** The scene of a project at its preset's physical size (what the SVG and PNG exports draw). */
export function exportScene(project: Project, opts: Pick<ExportSvgOpts, "preset" | "resolution"> = {}): Scene {
  const p = withPreset(project, opts.preset);
  const size = presetOf(p.figure);
  return buildScene(p, {
    widthPx: size.widthPx,
    heightPx: size.heightPx,
    resolution: opts.resolution ?? EXPORT_RESOLUTION,
  });
}

/** Physical size of the exported figure in inches (for PNG pixel sizes: inches × dpi). */
export function exportSizeInches(project: Project, preset?: SizePreset): { widthIn: number; heightIn: number } {
  const size = presetOf(withPreset(project, preset).figure);
  return { widthIn: size.widthMm / 25.4, heightIn: size.heightMm / 25.4 };
}

/** Points of a project's curves (one per mass value). */
function pointCount(project: Project): number {
  return project.curves.reduce((n, c) => n + c.massEv.length, 0);
}

/** "2 MB" for 2,000,000 characters. */
/**
 * A whole number with commas between groups of three digits (500000 → "500,000"), as toLocaleString("en")
 * writes it without loading the locale data (about 80 ms of the command line's start-up).
 */
function groupDigits(n: number): string {
  return String(n).replace(/\B(?=(\d{3})+(?!\d))/g, ",");
}

function capText(chars: number): string {
  return chars >= 1e6 ? `${Math.round(chars / 1e5) / 10} MB` : `${Math.round(chars / 100) / 10} kB`;
}

/**
 * The cap a figure went over, for messages: "the cap of 500,000 points" or "the 2 MB cap".
 * @param maxChars the payload cap used. @default EMBED_MAX_CHARS @param maxPoints the point cap. @default EMBED_MAX_POINTS
 */
export function embedCapText(
  because: "points" | "size",
  maxChars: number = EMBED_MAX_CHARS,
  maxPoints: number = EMBED_MAX_POINTS,
): string {
  return because === "points" ? `the cap of ${groupDigits(maxPoints)} points` : `the ${capText(maxChars)} cap`;
}

/**
 * The <metadata> content that carries the project, and what it holds: one element in our namespace whose
 * text is the share-link fragment of the project ("v3." + base64url of raw DEFLATE of the compact JSON + "." +
 * checksum; see src/formats/codec/formats.ts), so reading it back goes through the link decoder's size cap, schema check and repair.
 * Curve data are included while the curves have at most `maxPoints` points (checked first, at no cost) and the
 * fragment stays within `maxChars`; the encoder stops as soon as it cannot, so a project over the character
 * cap costs about the cap's worth of packing. Otherwise the fragment carries name,
 * constants, figure and models (and how many curves were left out), the element says curves="omitted" with
 * the counts, and a comment before it tells a reader of the file why.
 * @param maxChars longest payload with curve data, in characters. @default EMBED_MAX_CHARS
 * @param maxPoints most curve points embedded. @default EMBED_MAX_POINTS
 */
export function projectMetadata(
  project: Project,
  maxChars: number = EMBED_MAX_CHARS,
  maxPoints: number = EMBED_MAX_POINTS,
): { xml: string; info: EmbedInfo } {
  const open = `<axband:project xmlns:axband="${AXBAND_PROJECT_NS}" encoding="${EMBED_ENCODING}" version="${project.version}"`;
  const points = pointCount(project);
  const tooMany = points > maxPoints;
  const full =
    project.curves.length === 0
      ? encodeLink(project, { includeCurves: true })
      : tooMany
        ? null
        : encodeLinkWithin(project, maxChars, { includeCurves: true });
  if (full !== null) {
    return {
      xml: `${open}>${full}</axband:project>`,
      info: { embedded: true, embeddedCurves: true, omittedCurves: [], omittedPoints: 0, omittedBecause: null },
    };
  }
  const curves = project.curves.length;
  const why = tooMany
    ? `they are more than ${maxPoints} points, the most a figure file carries`
    : `with them the embedded project would exceed ${capText(maxChars)}`;
  // Counts only in the comment (labels could hold "--", which a comment cannot).
  const comment = `<!-- axband: the data of ${curves} curve(s), ${points} points, were left out: ${why}. The models, figure and constants are here; the project file (.axband.json) keeps the data. -->`;
  const xml = `${comment}${open} curves="omitted" omitted-curves="${curves}" omitted-points="${points}">${encodeLink(project, { includeCurves: false })}</axband:project>`;
  return {
    xml,
    info: {
      embedded: true,
      embeddedCurves: false,
      omittedCurves: project.curves.map((c) => c.label),
      omittedPoints: points,
      omittedBecause: tooMany ? "points" : "size",
    },
  };
}

/**
 * The exported SVG of a project: the same scene builder and SVG writer as the screen, at the preset's
 * physical size (width/height in cm, viewBox in CSS px at 96/in), thinned so that no drawn point is more
 * than 0.5 px off the data at that size, with the project embedded unless `embedProject` is false (curve
 * data only while they fit `embedMaxChars`), and what was embedded.
 * Deterministic: the same project gives the same bytes (the CLI and the app's export button rely on it).
 */
export function exportFigureSvgWithInfo(project: Project, opts: ExportSvgOpts = {}): SvgWithInfo {
  const svg = writeSvg(exportScene(project, opts));
  if (!(opts.embedProject ?? true))
    return { svg, embedded: false, embeddedCurves: false, omittedCurves: [], omittedPoints: 0, omittedBecause: null };
  return embedProjectInSvgWithInfo(svg, withPreset(project, opts.preset), opts.embedMaxChars, opts.embedMaxPoints);
}

/** {@link exportFigureSvgWithInfo} without the info: the SVG text only. */
export function exportFigureSvg(project: Project, opts: ExportSvgOpts = {}): string {
  return exportFigureSvgWithInfo(project, opts).svg;
}

/**
 * An SVG written without the project, with the project put into a <metadata> element right after the root
 * tag (writeSvg escapes its own metadata option as text; ours is markup), and what was embedded.
 * exportFigureSvg(p) equals embedProjectInSvg(exportFigureSvg(p, { embedProject: false }), p), so a caller
 * that needs both (the CLI rasterises the lighter one) builds the scene once.
 * @param project the project as exported (its figure preset already set to the export's).
 * @param maxChars longest payload with curve data. @default EMBED_MAX_CHARS
 * @param maxPoints most curve points embedded. @default EMBED_MAX_POINTS
 */
export function embedProjectInSvgWithInfo(
  svg: string,
  project: Project,
  maxChars: number = EMBED_MAX_CHARS,
  maxPoints: number = EMBED_MAX_POINTS,
): SvgWithInfo {
  const rootEnd = svg.indexOf(">", svg.indexOf("<svg")) + 1;
  const nl = svg[rootEnd] === "\n" ? 1 : 0;
  const { xml, info } = projectMetadata(project, maxChars, maxPoints);
  // Content is base64url, fixed attribute values, counts and a comment of our own: it needs no escaping.
  const meta = `<metadata>${xml}</metadata>\n`;
  return { svg: svg.slice(0, rootEnd + nl) + meta + svg.slice(rootEnd + nl), ...info };
}

/** {@link embedProjectInSvgWithInfo} without the info. @param maxChars @default EMBED_MAX_CHARS @param maxPoints @default EMBED_MAX_POINTS */
export function embedProjectInSvg(
  svg: string,
  project: Project,
  maxChars: number = EMBED_MAX_CHARS,
  maxPoints: number = EMBED_MAX_POINTS,
): string {
  return embedProjectInSvgWithInfo(svg, project, maxChars, maxPoints).svg;
}

/** CSS px per inch of the scene coordinates (re-exported for PNG sizing). */
export { PX_PER_IN };
