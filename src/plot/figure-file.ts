// The exported figure file: project → self-contained SVG at a preset's physical size, with the project
// embedded (compressed) in <metadata> so the file reopens in axband and the CLI accepts it as input.
import type { Project, SizePreset } from "../data/types";
import type { Scene } from "./scene-types";
import { PX_PER_IN, presetOf } from "./layout";
import { buildScene } from "./scene";
import { writeSvg } from "./svg";
import { decodeLink, encodeLink } from "../data/link";

/** Namespace URI of our <metadata> element (a URN of our own: nothing is fetched from it). */
export const AXBAND_PROJECT_NS = "urn:axband:project";
/** Encoding of the embedded payload, written into the element's `encoding` attribute. */
export const EMBED_ENCODING = "deflate-base64url";

/**
 * Thinning resolution of the exported SVG (columns per scene px). The plot core's first/min/max/last column
 * thinning keeps the drawn line within half a column of every data point: at 1 that is ≤ 0.5 px at the
 * export size (bench/render.mjs measures it: max 0.500 px at 1, 0.250 px at 2, on 2·10⁶ invented points).
 */
export const EXPORT_RESOLUTION = 1;

/**
 * Thinning resolution for a raster of the figure at `dpi`: the PNG's pixels per scene px (dpi / 96, at
 * least 1), so the thinning error stays ≤ 0.5 px of the PNG too (e.g. 3.125 at 300 dpi).
 */
export function rasterResolution(dpi: number): number {
  return Number.isFinite(dpi) && dpi > PX_PER_IN ? dpi / PX_PER_IN : EXPORT_RESOLUTION;
}

export interface ExportSvgOpts {
  /** Size preset to draw at. @default project.figure.preset */
  preset?: SizePreset;
  /** Embed the whole project (curve data included) in <metadata>. @default true */
  embedProject?: boolean;
  /** Thinning resolution (columns per scene px); raise it for rasters, see {@link rasterResolution}. @default EXPORT_RESOLUTION */
  resolution?: number;
}

/** The project with its figure switched to another preset (a copy; the input is not touched). */
function withPreset(project: Project, preset: SizePreset | undefined): Project {
  return preset === undefined || preset === project.figure.preset ? project : { ...project, figure: { ...project.figure, preset } };
}

/** The scene of a project at its preset's physical size (what the SVG and PNG exports draw). */
export function exportScene(project: Project, opts: Pick<ExportSvgOpts, "preset" | "resolution"> = {}): Scene {
  const p = withPreset(project, opts.preset);
  const size = presetOf(p.figure);
  return buildScene(p, { widthPx: size.widthPx, heightPx: size.heightPx, resolution: opts.resolution ?? EXPORT_RESOLUTION });
}

/** Physical size of the exported figure in inches (for PNG pixel sizes: inches × dpi). */
export function exportSizeInches(project: Project, preset?: SizePreset): { widthIn: number; heightIn: number } {
  const size = presetOf(withPreset(project, preset).figure);
  return { widthIn: size.widthMm / 25.4, heightIn: size.heightMm / 25.4 };
}

/**
 * The <metadata> content that carries the project: one element in our namespace whose text is the share-link
 * fragment of the whole project, curves included ("v1." + base64url of raw DEFLATE of the compact JSON; see
 * src/data/link.ts), so reading it back goes through the link decoder's size cap, schema check and repair.
 */
export function projectMetadataXml(project: Project): string {
  return `<axband:project xmlns:axband="${AXBAND_PROJECT_NS}" encoding="${EMBED_ENCODING}" version="${project.version}">${encodeLink(project, { includeCurves: true })}</axband:project>`;
}

/**
 * The exported SVG of a project: the same scene builder and SVG writer as the screen, at the preset's
 * physical size (width/height in cm, viewBox in CSS px at 96/in), thinned so that no drawn point is more
 * than 0.5 px off the data at that size, with the project embedded unless `embedProject` is false.
 * Deterministic: the same project gives the same bytes (the CLI and the app's export button rely on it).
 */
export function exportFigureSvg(project: Project, opts: ExportSvgOpts = {}): string {
  const svg = writeSvg(exportScene(project, opts));
  return (opts.embedProject ?? true) ? embedProjectInSvg(svg, withPreset(project, opts.preset)) : svg;
}

/**
 * An SVG written without the project, with the project put into a <metadata> element right after the root
 * tag (writeSvg escapes its own metadata option as text; ours is markup). exportFigureSvg(p) equals
 * embedProjectInSvg(exportFigureSvg(p, { embedProject: false }), p), so a caller that needs both (the CLI
 * rasterises the lighter one) builds the scene once.
 * @param project the project as exported (its figure preset already set to the export's).
 */
export function embedProjectInSvg(svg: string, project: Project): string {
  const rootEnd = svg.indexOf(">", svg.indexOf("<svg")) + 1;
  const nl = svg[rootEnd] === "\n" ? 1 : 0;
  // Content is base64url and fixed attribute values: it needs no escaping.
  const meta = `<metadata>${projectMetadataXml(project)}</metadata>\n`;
  return svg.slice(0, rootEnd + nl) + meta + svg.slice(rootEnd + nl);
}

export type ExtractResult = { ok: true; project: Project } | { ok: false; error: string };

// The element may carry any prefix (an editor may rewrite it); its local name and encoding identify it.
const EMBED_RE = /<([A-Za-z_][\w.-]*:)?project\b([^>]*)>([^<]*)<\/\1?project\s*>/g;

/**
 * The project embedded in an SVG exported by axband, decoded and validated exactly like a project file or
 * a link (schema check, migrations, size cap). Never throws: anything wrong gives `{ ok: false, error }`.
 */
export function extractProjectFromSvg(svgText: string): ExtractResult {
  if (typeof svgText !== "string" || !/<svg[\s>]/.test(svgText)) return { ok: false, error: "this is not an SVG file" };
  if (!svgText.includes(AXBAND_PROJECT_NS)) {
    return { ok: false, error: "this SVG carries no axband project (it was exported without the project, or by another program)" };
  }
  for (const m of svgText.matchAll(EMBED_RE)) {
    const attrs = m[2];
    const enc = /\sencoding\s*=\s*["']([^"']*)["']/.exec(attrs)?.[1];
    if (enc !== EMBED_ENCODING) {
      if (enc !== undefined) return { ok: false, error: `the embedded project uses the unknown encoding "${enc}"` };
      continue;
    }
    const payload = m[3].replace(/\s+/g, "");
    const r = decodeLink(payload);
    return r.ok ? { ok: true, project: r.project } : { ok: false, error: `the project embedded in this SVG cannot be read: ${r.error}` };
  }
  return { ok: false, error: "this SVG mentions axband but its embedded project element is missing or damaged" };
}

/** CSS px per inch of the scene coordinates (re-exported for PNG sizing). */
export { PX_PER_IN };
