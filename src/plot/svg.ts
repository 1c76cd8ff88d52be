// The SVG string writer: a scene in, one self-contained, deterministic SVG document out (no external fonts,
// images or CSS; text kept as text; every text and attribute value escaped; the project in <metadata>).
import type { PathNode, RectNode, Scene, SceneNode, TextNode } from "./scene-types";
import { safeColour } from "./format";
import { placeRuns } from "./text";

/** XML-escape text and attribute values: & < > " ' (so nothing in a label can open a tag or end an attribute). */
export function escapeXml(s: string): string {
  return String(s)
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&apos;")
    // eslint-disable-next-line no-control-regex
    .replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\ufffe\uffff]/g, "")
    .replace(/[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/g, "");
}

/** A number rounded to 2 decimals as SVG text ("-0" written as "0"). */
export function fmt(v: number): string {
  const r = Math.round(v * 100) / 100;
  return Object.is(r, -0) || !Number.isFinite(r) ? "0" : String(r);
}

const DATA_KEY = /^[a-z0-9-]+$/;
const ID_SAFE = /[^A-Za-z0-9_-]/g;
const PATH_SAFE = /^[MLHVZCQSTAmlhvzcqsta0-9eE+\-.,\s]*$/;
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

function dataAttrs(data: Record<string, string> | undefined): string {
  if (!data) return "";
  let s = "";
  for (const key of Object.keys(data).sort()) {
    if (!DATA_KEY.test(key)) continue;
    s += ` data-${key}="${escapeXml(String(data[key]))}"`;
  }
  return s;
}

function paint(value: string | undefined): string | undefined {
  if (value === undefined) return undefined;
  return value === "none" ? "none" : safeColour(value, "#000000");
}

/** Ids are written as prefix + the node's id, restricted to [A-Za-z0-9_-]; duplicates get a counter. */
class Ids {
  private used = new Map<string, number>();
  constructor(private prefix: string) {}
  get(id: string | undefined): string | undefined {
    if (!id) return undefined;
    const base = this.prefix + id.replace(ID_SAFE, "_");
    const n = this.used.get(base) ?? 0;
    this.used.set(base, n + 1);
    return n === 0 ? base : `${base}-${n + 1}`;
  }
}

function pathEl(n: PathNode, ids: Ids): string {
  const d = PATH_SAFE.test(n.d) ? n.d : "";
  return (
    "<path" +
    attr("id", ids.get(n.id)) +
    attr("d", d) +
    attr("fill", paint(n.fill) ?? "none") +
    attr("fill-opacity", n.fillOpacity) +
    attr("stroke", paint(n.stroke)) +
    attr("stroke-width", n.stroke ? n.strokeWidth : undefined) +
    attr("stroke-opacity", n.stroke ? n.strokeOpacity : undefined) +
    attr("stroke-dasharray", n.stroke && n.dash && DASH_SAFE.test(n.dash) ? n.dash : undefined) +
    (n.stroke ? ' stroke-linejoin="round"' : "") +
    dataAttrs(n.data) +
    "/>"
  );
}

function rectEl(n: RectNode, ids: Ids): string {
  return (
    "<rect" +
    attr("id", ids.get(n.id)) +
    attr("x", n.x) +
    attr("y", n.y) +
    attr("width", Math.max(0, n.w)) +
    attr("height", Math.max(0, n.h)) +
    attr("fill", paint(n.fill) ?? "none") +
    attr("fill-opacity", n.fillOpacity) +
    attr("stroke", paint(n.stroke)) +
    attr("stroke-width", n.stroke ? n.strokeWidth : undefined) +
    dataAttrs(n.data) +
    "/>"
  );
}

function textEl(n: TextNode, ids: Ids): string {
  const placed = placeRuns(n);
  let inner = "";
  for (const r of placed.runs) {
    const a = attr("dy", r.dyPx !== 0 ? r.dyPx : undefined) + attr("font-size", r.sizePx) + (r.italic ? ' font-style="italic"' : "");
    inner += a ? `<tspan${a}>${escapeXml(r.text)}</tspan>` : escapeXml(r.text);
  }
  return (
    "<text" +
    attr("id", ids.get(n.id)) +
    attr("x", n.x) +
    attr("y", placed.baselineY) +
    attr("font-size", n.sizePx) +
    attr("text-anchor", n.anchor === "start" ? undefined : n.anchor) +
    attr("font-weight", n.weight === "bold" ? "bold" : undefined) +
    attr("fill", paint(n.fill) ?? "#000000") +
    (n.rotate ? attr("transform", `rotate(${fmt(n.rotate)} ${fmt(n.x)} ${fmt(n.y)})`) : "") +
    ' xml:space="preserve"' +
    dataAttrs(n.data) +
    ">" +
    inner +
    "</text>"
  );
}

function nodeEl(n: SceneNode, ids: Ids): string {
  if (n.kind === "path") return pathEl(n, ids);
  if (n.kind === "rect") return rectEl(n, ids);
  return textEl(n, ids);
}

/**
 * The SVG document of a scene: width/height in physical units when the scene has them (else px), a viewBox
 * in scene px, one <g id="…"> per layer (background, grid, curves, models, highlight, axes, legend), one
 * clip path for the plot area on the clipped layers. Same scene and options give the same bytes.
 */
export function writeSvg(scene: Scene, opts: WriteSvgOpts = {}): string {
  const prefix = (opts.idPrefix ?? "").replace(ID_SAFE, "_");
  const ids = new Ids(prefix);
  const clipId = ids.get("plot-clip") as string;
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
  out.push(`<defs><clipPath id="${clipId}"><rect x="${fmt(plot.x)}" y="${fmt(plot.y)}" width="${fmt(plot.w)}" height="${fmt(plot.h)}"/></clipPath></defs>\n`);
  for (const layer of scene.layers) {
    const gid = ids.get(layer.id);
    out.push(`<g id="${gid}"${layer.clip ? ` clip-path="url(#${clipId})"` : ""}${dataAttrs(layer.data)}>`);
    for (const node of layer.nodes) out.push("\n" + nodeEl(node, ids));
    out.push(layer.nodes.length ? "\n</g>\n" : "</g>\n");
  }
  out.push("</svg>\n");
  return out.join("");
}
