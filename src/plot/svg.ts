// The SVG string writer: a scene in, one self-contained, deterministic SVG document out (no external fonts,
// images or CSS; text kept as text; every text and attribute value escaped; the project in <metadata>).
import type { Scene, SceneLayer, SceneNode, TextNode } from "./scene-types";
import { r2, safeColour } from "./format";
import { placeRuns } from "./text";

/** XML-escape text and attribute values: & < > " ' (so nothing in a label can open a tag or end an attribute). */
export function escapeXml(s: string): string {
  return (
    String(s)
      .replace(/&/g, "&amp;")
      .replace(/</g, "&lt;")
      .replace(/>/g, "&gt;")
      .replace(/"/g, "&quot;")
      .replace(/'/g, "&apos;")
      // eslint-disable-next-line no-control-regex
      .replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\ufffe\uffff]/g, "")
      .replace(/[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/g, "")
  );
}

/** A number rounded to 2 decimals as SVG text ("-0" written as "0"). */
export function fmt(v: number): string {
  const r = Math.round(v * 100) / 100;
  return Object.is(r, -0) || !Number.isFinite(r) ? "0" : String(r);
}

const DATA_KEY = /^[a-z0-9-]+$/;
const ID_SAFE = /[^A-Za-z0-9_-]/g;
const PATH_CHARS = (() => {
  const t = new Uint8Array(128);
  for (const ch of "MLHVZCQSTAmlhvzcqsta0123456789eE+-., \t\n\r") t[ch.charCodeAt(0)] = 1;
  return t;
})();

/**
 * True when path data holds only path commands, digits, signs, dots, commas and spaces (nothing that could
 * close the attribute or reference anything). A table lookup; path data a node holds as `writtenD` skips it.
 */
export function isSafePathData(d: string): boolean {
  for (let i = 0; i < d.length; i++) {
    const c = d.charCodeAt(i);
    if (c >= 128 || PATH_CHARS[c] === 0) return false;
  }
  return true;
}
const DASH_SAFE = /^[0-9.\s,]*$/;

export interface WriteSvgOpts {
  /** Text placed (escaped) inside <metadata>, e.g. the compressed project. @default none */
  metadata?: string;
  /** Prefix of every id in the document (layer groups, clip path, nodes), for several figures on a page. @default "" */
  idPrefix?: string;
}

function attr(name: string, value: string | number | undefined): string {
  if (value === undefined || value === "") return "";
  return ` ${name}="${typeof value === "number" ? fmt(value) : escapeXml(value)}"`;
}

function paint(value: string | undefined): string | undefined {
  if (value === undefined) return undefined;
  return value === "none" ? "none" : safeColour(value, "#000000");
}

// The same node ids come back on every frame: their written forms (prefix + safe id) are remembered, so that
// each frame gets the very same strings, whose hashes the engine keeps (bounded, cleared when full).
const writtenIds = new Map<string, Map<string, string>>();
let writtenCount = 0;
function writtenId(prefix: string, id: string): string {
  if (writtenCount > 10_000) {
    writtenIds.clear();
    writtenCount = 0;
  }
  let byId = writtenIds.get(prefix);
  if (!byId) {
    byId = new Map();
    writtenIds.set(prefix, byId);
  }
  let out = byId.get(id);
  if (out === undefined) {
    out = prefix + id.replace(ID_SAFE, "_");
    byId.set(id, out);
    writtenCount++;
  }
  return out;
}

/** Ids are written as prefix + the node's id, restricted to [A-Za-z0-9_-]; duplicates get a counter. */
class Ids {
  private used = new Map<string, number>();
  constructor(private prefix: string) {}
  get(id: string | undefined): string | undefined {
    if (!id) return undefined;
    const base = writtenId(this.prefix, id);
    const n = this.used.get(base);
    if (n === undefined) {
      this.used.set(base, 1);
      return base;
    }
    this.used.set(base, n + 1);
    return `${base}-${n + 1}`;
  }
}

/** The element ids of a scene as written: the plot clip path, each layer group, each node (undefined: none). */
export interface SceneIds {
  clip: string;
  layers: (string | undefined)[];
  nodes: (string | undefined)[][];
}

/**
 * Element ids in document order: prefix + the id with characters outside [A-Za-z0-9_-] replaced by "_",
 * repeats suffixed "-2", "-3"… (ids stay unique even when labels are not).
 * @param prefix prefix of every id. @default ""
 */
export function sceneIds(scene: Scene, prefix = ""): SceneIds {
  const ids = new Ids(prefix.replace(ID_SAFE, "_"));
  const clip = ids.get("plot-clip") as string;
  const layers: (string | undefined)[] = [];
  const nodes: (string | undefined)[][] = [];
  for (const layer of scene.layers) {
    layers.push(ids.get(layer.id));
    nodes.push(layer.nodes.map((n) => ids.get(n.id)));
  }
  return { clip, layers, nodes };
}

/** One attribute as written: SVG name and its value as text (unescaped; the writer escapes). */
export type SvgAttribute = [name: string, value: string];

function num(v: number | undefined): string | undefined {
  return v === undefined || !Number.isFinite(v) ? undefined : fmt(v);
}

function push(out: SvgAttribute[], name: string, value: string | undefined): void {
  if (value !== undefined && value !== "") out.push([name, value]);
}

function pushData(out: SvgAttribute[], data: Record<string, string> | undefined): void {
  if (!data) return;
  for (const key of Object.keys(data).sort()) if (DATA_KEY.test(key)) out.push([`data-${key}`, String(data[key])]);
}

/**
 * The attributes of a scene node exactly as the SVG writer writes them (after the id): presentation
 * attributes with safe colours, numbers with 2 decimals, bevel joins on strokes, the text baseline turned
 * into an explicit y, and data-* attributes with keys limited to [a-z0-9-]. The on-screen renderer should
 * set the same attributes (React: camelCase names, xmlSpace) so screen and export agree.
 */
export function nodeAttributes(n: SceneNode): SvgAttribute[] {
  const out: SvgAttribute[] = [];
  if (n.kind === "path") {
    // Identity first: the same string object compares in O(1); a changed d is scanned.
    push(out, "d", n.d === n.writtenD || isSafePathData(n.d) ? n.d : "");
    push(out, "fill", paint(n.fill) ?? "none");
    push(out, "fill-opacity", num(n.fillOpacity));
    if (n.stroke) {
      push(out, "stroke", paint(n.stroke));
      push(out, "stroke-width", num(n.strokeWidth));
      push(out, "stroke-opacity", num(n.strokeOpacity));
      push(out, "stroke-dasharray", n.dash && DASH_SAFE.test(n.dash) ? n.dash : undefined);
      // Bevel joins: no miter spikes at the turns of dense data, and at ~2 px line widths they look as round
      // joins do while costing the browser ~30 % less to paint (bench/redraw.mjs, 20 curves of 100,000 points:
      // raster time of a zoom sequence 2.2 s with round joins, 1.5 s with bevel).
      push(out, "stroke-linejoin", "bevel");
    }
  } else if (n.kind === "rect") {
    push(out, "x", num(n.x));
    push(out, "y", num(n.y));
    push(out, "width", num(Math.max(0, n.w)));
    push(out, "height", num(Math.max(0, n.h)));
    push(out, "fill", paint(n.fill) ?? "none");
    push(out, "fill-opacity", num(n.fillOpacity));
    if (n.stroke) {
      push(out, "stroke", paint(n.stroke));
      push(out, "stroke-width", num(n.strokeWidth));
    }
  } else {
    // Placed by the wrapping group (textPlacement): only the baseline's offset from the anchor point is here.
    const y = Number.isFinite(n.y) ? n.y : 0;
    const dy = num(placeRuns({ ...n, y }).baselineY - r2(y));
    push(out, "y", dy === "0" ? undefined : dy);
    push(out, "font-size", num(n.sizePx));
    push(out, "text-anchor", n.anchor === "start" ? undefined : n.anchor);
    push(out, "font-weight", n.weight === "bold" ? "bold" : undefined);
    push(out, "fill", paint(n.fill) ?? "#000000");
    push(out, "xml:space", "preserve");
  }
  pushData(out, n.data);
  return out;
}

/**
 * The transform of the group that wraps each text: a translation to its anchor point, then its rotation.
 * Texts are placed by a wrapping group rather than by their own x/y or transform because a browser lays a
 * text out again (shaping, chunking: ~0.15 ms each in Chromium) whenever those change, but not when only an
 * ancestor's translation does: moving the tick labels of a zoom step costs a third as much
 * (bench/redraw.mjs).
 */
export function textPlacement(n: TextNode): string {
  const x = Number.isFinite(n.x) ? n.x : 0;
  const y = Number.isFinite(n.y) ? n.y : 0;
  const rot = n.rotate && Number.isFinite(n.rotate) ? ` rotate(${fmt(n.rotate)})` : "";
  return `translate(${fmt(x)} ${fmt(y)})${rot}`;
}

/** The attributes of a layer's <g> as written: its id, the plot clip when the layer is clipped, data-* attributes. */
export function layerAttributes(layer: SceneLayer, id: string | undefined, clipId: string): SvgAttribute[] {
  const out: SvgAttribute[] = [];
  push(out, "id", id);
  if (layer.clip) out.push(["clip-path", `url(#${clipId})`]);
  pushData(out, layer.data);
  return out;
}

/** The tspans of a text node as written: attributes (dy, font-size, font-style) and text of each run. */
export function textSpans(n: TextNode): { attrs: SvgAttribute[]; text: string }[] {
  return placeRuns(n).runs.map((r) => {
    const attrs: SvgAttribute[] = [];
    if (r.dyPx !== 0) attrs.push(["dy", fmt(r.dyPx)]);
    if (r.sizePx !== undefined) attrs.push(["font-size", fmt(r.sizePx)]);
    if (r.italic) attrs.push(["font-style", "italic"]);
    return { attrs, text: r.text };
  });
}

function attrsText(attrs: SvgAttribute[]): string {
  let s = "";
  for (const [k, v] of attrs) s += ` ${k}="${escapeXml(v)}"`;
  return s;
}

function nodeEl(n: SceneNode, id: string | undefined): string {
  const tag = n.kind === "path" ? "path" : n.kind === "rect" ? "rect" : "text";
  const head = `<${tag}${id ? ` id="${escapeXml(id)}"` : ""}${attrsText(nodeAttributes(n))}`;
  if (n.kind !== "text") return head + "/>";
  let inner = "";
  for (const span of textSpans(n))
    inner += span.attrs.length
      ? `<tspan${attrsText(span.attrs)}>${escapeXml(span.text)}</tspan>`
      : escapeXml(span.text);
  return `<g transform="${escapeXml(textPlacement(n))}">${head}>${inner}</text></g>`;
}

/**
 * The SVG document of a scene: width/height in physical units when the scene has them (else px), a viewBox
 * in scene px, one <g id="…"> per layer (background, grid, curves, models, highlight, axes, legend), one
 * clip path for the plot area on the clipped layers. Same scene and options give the same bytes.
 */
export function writeSvg(scene: Scene, opts: WriteSvgOpts = {}): string {
  const ids = sceneIds(scene, opts.idPrefix ?? "");
  const clipId = ids.clip;
  const { plot } = scene;
  const out: string[] = [];
  out.push('<?xml version="1.0" encoding="UTF-8"?>\n');
  out.push(
    "<svg" +
      ' xmlns="http://www.w3.org/2000/svg"' +
      attr("width", scene.widthPhysical ?? `${fmt(scene.widthPx)}px`) +
      attr("height", scene.heightPhysical ?? `${fmt(scene.heightPx)}px`) +
      attr("viewBox", `0 0 ${fmt(scene.widthPx)} ${fmt(scene.heightPx)}`) +
      attr("font-family", scene.fontFamily) +
      ' stroke-linecap="butt">\n',
  );
  if (opts.metadata !== undefined) out.push(`<metadata>${escapeXml(opts.metadata)}</metadata>\n`);
  out.push(
    `<defs><clipPath id="${clipId}"><rect x="${fmt(plot.x)}" y="${fmt(plot.y)}" width="${fmt(plot.w)}" height="${fmt(plot.h)}"/></clipPath></defs>\n`,
  );
  scene.layers.forEach((layer, li) => {
    out.push(`<g${attrsText(layerAttributes(layer, ids.layers[li], clipId))}>`);
    layer.nodes.forEach((node, ni) => out.push("\n" + nodeEl(node, ids.nodes[li][ni])));
    out.push(layer.nodes.length ? "\n</g>\n" : "</g>\n");
  });
  out.push("</svg>\n");
  return out.join("");
}
