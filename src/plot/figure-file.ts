// The exported figure file: project → self-contained SVG at a preset's physical size, with the project
// embedded (compressed) in <metadata> so the file reopens in axband and the CLI accepts it as input.
import type { Project, SizePreset } from "../data/types";
import type { Scene } from "./scene-types";
import { PX_PER_IN, presetOf } from "./layout";
import { decodeLink, encodeLink } from "../data/link";

/** Namespace URI of our <metadata> element (a URN of our own: nothing is fetched from it). */
export const AXBAND_PROJECT_NS = "urn:axband:project";
/** Encoding of the embedded payload, written into the element's `encoding` attribute. */
export const EMBED_ENCODING = "deflate-base64url";

/**
 * Thinning resolution for exports: points per scene pixel column. Per-column first/min/max/last thinning
 * keeps every drawn point within one column width of the data, so 2 columns per pixel bound the error by
 * 0.5 px at the export size.
 */
export const EXPORT_RESOLUTION = 2;

export interface ExportSvgOpts {
  /** Size preset to draw at. @default project.figure.preset */
  preset?: SizePreset;
  /** Embed the whole project (curve data included) in <metadata>. @default true */
  embedProject?: boolean;
}

/** The project with its figure switched to another preset (a copy; the input is not touched). */
function withPreset(project: Project, preset: SizePreset | undefined): Project {
  return preset === undefined || preset === project.figure.preset ? project : { ...project, figure: { ...project.figure, preset } };
}

/** The scene of a project at its preset's physical size (what the SVG and PNG exports draw). */
export function exportScene(project: Project, opts: Pick<ExportSvgOpts, "preset"> = {}): Scene {
  const p = withPreset(project, opts.preset);
  const size = presetOf(p.figure);
  return buildScene(p, { widthPx: size.widthPx, heightPx: size.heightPx, resolution: EXPORT_RESOLUTION });
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
  const scene = exportScene(project, opts);
  const embedded = opts.embedProject ?? true;
  return writeSvg(scene, embedded ? { metadata: projectMetadataXml(withPreset(project, opts.preset)) } : {});
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

// ---------------------------------------------------------------------------------------------------------
// TEMPORARY adapters until src/plot (buildScene, writeSvg) lands; each is
// replaced by the real import and removed. Not a finished implementation.
function esc(s: string): string {
  return s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");
}
function buildScene(project: Project, o: { widthPx: number; heightPx: number; resolution?: number }): Scene {
  const size = presetOf(project.figure);
  const plot = { x: 60, y: 20, w: o.widthPx - 80, h: o.heightPx - 70 };
  const [m0, m1] = project.figure.massRangeEv;
  const [g0, g1] = project.figure.yRange;
  const X = (m: number) => plot.x + ((Math.log10(m) - Math.log10(m0)) / (Math.log10(m1) - Math.log10(m0))) * plot.w;
  const Y = (g: number) => plot.y + plot.h - ((Math.log10(g) - Math.log10(g0)) / (Math.log10(g1) - Math.log10(g0))) * plot.h;
  const curves = project.curves.map((c, i) => {
    let d = "";
    for (let k = 0; k < c.massEv.length; k++) d += `${k ? "L" : "M"}${X(c.massEv[k]).toFixed(2)} ${Y(c.gInvGeV[k]).toFixed(2)}`;
    return { kind: "path" as const, d, stroke: c.colour, id: `curve-${i + 1}` };
  });
  const legend = [...project.models, ...project.curves].map((e, i) => ({
    kind: "text" as const, x: plot.x + 10, y: plot.y + 14 * (i + 1), runs: [{ text: e.label }], sizePx: 10, anchor: "start" as const, baseline: "alphabetic" as const,
  }));
  return {
    widthPx: o.widthPx, heightPx: o.heightPx, widthPhysical: size.widthPhysical, heightPhysical: size.heightPhysical, plot,
    scales: { massDomainEv: [m0, m1], yDomain: [g0, g1] }, fontFamily: "sans-serif",
    layers: [
      { id: "curves", clip: true, nodes: curves },
      { id: "axes", clip: false, nodes: [
        { kind: "text", x: plot.x + plot.w / 2, y: o.heightPx - 10, runs: [{ text: "m", italic: true }, { text: "a", shift: "sub" }, { text: " [eV]" }], sizePx: 11, anchor: "middle", baseline: "alphabetic" },
        { kind: "text", x: 15, y: plot.y + plot.h / 2, runs: [{ text: "g", italic: true }, { text: "aγγ", shift: "sub" }, { text: " [GeV" }, { text: "−1", shift: "sup" }, { text: "]" }], sizePx: 11, anchor: "middle", baseline: "alphabetic", rotate: -90 },
      ] },
      { id: "legend", clip: false, nodes: legend, data: { testid: "legend" } },
    ],
  };
}
function writeSvg(scene: Scene, o: { metadata?: string; idPrefix?: string } = {}): string {
  const out: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${scene.widthPhysical}" height="${scene.heightPhysical}" viewBox="0 0 ${scene.widthPx} ${scene.heightPx}" font-family="${esc(scene.fontFamily)}">`,
  ];
  if (o.metadata) out.push(`<metadata>${o.metadata}</metadata>`);
  out.push(`<defs><clipPath id="plot-clip"><rect x="${scene.plot.x}" y="${scene.plot.y}" width="${scene.plot.w}" height="${scene.plot.h}"/></clipPath></defs>`);
  for (const l of scene.layers) {
    out.push(`<g id="${l.id}"${l.clip ? ' clip-path="url(#plot-clip)"' : ""}>`);
    for (const n of l.nodes) {
      if (n.kind === "path") out.push(`<path d="${n.d}" fill="none" stroke="${esc(n.stroke ?? "#000")}"/>`);
      else if (n.kind === "text") out.push(`<text x="${n.x}" y="${n.y}" font-size="${n.sizePx}"${n.rotate ? ` transform="rotate(${n.rotate} ${n.x} ${n.y})"` : ""} text-anchor="${n.anchor}">${n.runs.map((r) => `<tspan${r.shift ? ` baseline-shift="${r.shift === "sub" ? "sub" : "super"}"` : ""}>${esc(r.text)}</tspan>`).join("")}</text>`);
    }
    out.push("</g>");
  }
  out.push("</svg>");
  return out.join("\n") + "\n";
}
