// Puts a Scene into an <svg> node for node and attribute for attribute as writeSvg writes it, updating in place
// from frame to frame: the figure's hot path.
import type { Scene, SceneLayer, SceneNode } from "../../plot/scene-types";
import { fmt, layerAttributes, nodeAttributes, sceneIds, textPlacement, textSpans } from "../../plot/svg";

const SVG_NS = "http://www.w3.org/2000/svg";
const XML_NS = "http://www.w3.org/XML/1998/namespace";

/** One element kept from frame to frame, with the attribute values last written to it. */
interface Slot {
  el: SVGElement;
  attrs: Map<string, string>;
  /** The text content last written (tspans as the writer writes them), for text nodes. */
  text: string;
  /** Text nodes: the group that places the text (textPlacement), and its transform last written. */
  wrap: SVGGElement | null;
  placement: string;
  tag: string;
  /** The node and id last drawn here: an equal node next frame needs no attribute work at all. */
  node: SceneNode | null;
  id: string | undefined;
}

interface LayerSlot {
  g: SVGGElement;
  attrs: Map<string, string>;
  slots: Map<string, Slot>;
}

/** Writes `next` over the attributes last written (`last`): only the changed ones, removing the dropped ones. */
function syncAttributes(el: Element, last: Map<string, string>, next: [string, string][]): void {
  // Setting an attribute to its current value can still make the browser lay the figure out again.
  for (let i = 0; i < next.length; i++) {
    const k = next[i][0];
    const v = next[i][1];
    if (last.get(k) === v) continue;
    if (k === "xml:space") el.setAttributeNS(XML_NS, k, v);
    else el.setAttribute(k, v);
    last.set(k, v);
  }
  // The names in `next` are distinct and all in `last` now: equal sizes mean nothing is left to remove.
  if (next.length === last.size) return;
  const seen = new Set(next.map((a) => a[0]));
  for (const k of [...last.keys()]) {
    if (seen.has(k)) continue;
    if (k === "xml:space") el.removeAttributeNS(XML_NS, "space");
    else el.removeAttribute(k);
    last.delete(k);
  }
}

function fillText(el: SVGElement, spans: ReturnType<typeof textSpans>): void {
  el.textContent = "";
  for (const span of spans) {
    if (span.attrs.length === 0) {
      el.appendChild(document.createTextNode(span.text));
      continue;
    }
    const t = document.createElementNS(SVG_NS, "tspan");
    for (const [k, v] of span.attrs) t.setAttribute(k, v);
    t.textContent = span.text;
    el.appendChild(t);
  }
}

/** Whether two scene values (plain objects, arrays, strings, numbers) are equal, field by field. */
function sameValue(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (typeof a !== "object" || typeof b !== "object" || a === null || b === null) return false;
  if (Array.isArray(a)) {
    if (!Array.isArray(b) || a.length !== b.length) return false;
    for (let i = 0; i < a.length; i++) if (!sameValue(a[i], b[i])) return false;
    return true;
  }
  const ka = Object.keys(a);
  if (ka.length !== Object.keys(b).length) return false;
  for (const k of ka)
    if (!sameValue((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k])) return false;
  return true;
}

function tagOf(node: SceneNode): string {
  return node.kind === "path" ? "path" : node.kind === "rect" ? "rect" : "text";
}

/** The slot for `key`, new when there is none or its element has another tag than `node` needs. */
function slotFor(ls: LayerSlot, key: string, node: SceneNode): Slot {
  let slot = ls.slots.get(key);
  const tag = tagOf(node);
  if (slot && slot.tag !== tag) {
    (slot.wrap ?? slot.el).remove();
    slot = undefined;
  }
  if (!slot) {
    const el = document.createElementNS(SVG_NS, tag);
    const wrap = node.kind === "text" ? document.createElementNS(SVG_NS, "g") : null;
    wrap?.appendChild(el);
    slot = { el, attrs: new Map(), text: "", wrap, placement: "", tag, node: null, id: undefined };
    ls.slots.set(key, slot);
  }
  return slot;
}

/** Writes what changed between the node last drawn in `slot` and `node`. */
function drawNode(slot: Slot, node: SceneNode, id: string | undefined): void {
  // Legend entries, unchanged labels and models: most of a frame's nodes equal the last ones, and an
  // equal node needs nothing written (only its place among the layer's children is checked by the caller).
  const same = slot.id === id && slot.node !== null && sameValue(slot.node, node);
  slot.node = node;
  slot.id = id;
  if (same) return;
  const attrs = nodeAttributes(node);
  syncAttributes(slot.el, slot.attrs, id ? [["id", id], ...attrs] : attrs);
  if (node.kind !== "text" || !slot.wrap) return;
  const placement = textPlacement(node);
  if (placement !== slot.placement) {
    slot.wrap.setAttribute("transform", placement);
    slot.placement = placement;
  }
  const spans = textSpans(node);
  const text = JSON.stringify(spans);
  if (text !== slot.text) {
    fillText(slot.el, spans);
    slot.text = text;
  }
}

/** Brings a layer's children in line with its nodes, in order. */
function drawLayerNodes(ls: LayerSlot, layer: SceneLayer, nodeIds: (string | undefined)[]): void {
  // Keyed by the written id (unique in a scene, and the same string object from frame to frame); a node
  // whose kind changed under the same id gets a new element.
  const keys = layer.nodes.map((_, i) => nodeIds[i] ?? `#${i}`);
  // Elements of nodes that are gone go first, so the ones that stay keep their place (a moved element is
  // laid out again, which for text is the dear part of a frame).
  const keep = new Set(keys);
  for (const [key, slot] of ls.slots) {
    if (keep.has(key)) continue;
    (slot.wrap ?? slot.el).remove();
    ls.slots.delete(key);
  }
  let prev: Element | null = null;
  layer.nodes.forEach((node, i) => {
    const slot = slotFor(ls, keys[i], node);
    drawNode(slot, node, nodeIds[i]);
    const outer = slot.wrap ?? slot.el;
    const want: ChildNode | null = prev ? prev.nextSibling : ls.g.firstChild;
    if (want !== outer) ls.g.insertBefore(outer, want);
    prev = outer;
  });
}

/** Removes the layers no longer in `scene`. */
function dropGoneLayers(layers: Map<string, LayerSlot>, scene: Scene): void {
  const layerKeys = new Set<string>(scene.layers.map((l) => l.id));
  for (const [key, ls] of layers) {
    if (layerKeys.has(key)) continue;
    ls.g.remove();
    layers.delete(key);
  }
}

function layerSlotFor(layers: Map<string, LayerSlot>, id: string): LayerSlot {
  let ls = layers.get(id);
  if (!ls) {
    ls = { g: document.createElementNS(SVG_NS, "g"), attrs: new Map(), slots: new Map() };
    layers.set(id, ls);
  }
  return ls;
}

export interface SceneDom {
  /** Brings the elements in line with `scene` (the same markup writeSvg would write for it). */
  update(scene: Scene): void;
  /** Removes every element this renderer added. */
  destroy(): void;
}

/**
 * A renderer of scenes into `svg`: its <defs> (the plot clip) and one <g> per layer, inserted before `before`
 * (e.g. a group of screen-only overlays; null: at the end). Elements are kept by layer and node id, so an
 * unchanged node costs a comparison and a moved tick label keeps its element; only changed attributes and
 * texts are written.
 * @param idPrefix prefix of every id, as writeSvg's idPrefix.
 */
export function createSceneDom(svg: SVGSVGElement, before: Node | null, idPrefix: string): SceneDom {
  const defs = document.createElementNS(SVG_NS, "defs");
  const clip = document.createElementNS(SVG_NS, "clipPath");
  const clipRect = document.createElementNS(SVG_NS, "rect");
  clip.appendChild(clipRect);
  defs.appendChild(clip);
  svg.insertBefore(defs, before);
  const clipAttrs = new Map<string, string>();
  const rectAttrs = new Map<string, string>();
  const layers = new Map<string, LayerSlot>();

  const update = (scene: Scene) => {
    const ids = sceneIds(scene, idPrefix);
    const { plot } = scene;
    syncAttributes(clip, clipAttrs, [["id", ids.clip]]);
    syncAttributes(clipRect, rectAttrs, [
      ["x", fmt(plot.x)],
      ["y", fmt(plot.y)],
      ["width", fmt(plot.w)],
      ["height", fmt(plot.h)],
    ]);
    dropGoneLayers(layers, scene);
    let prevLayer: Element = defs;
    scene.layers.forEach((layer, li) => {
      const ls = layerSlotFor(layers, layer.id);
      syncAttributes(ls.g, ls.attrs, layerAttributes(layer, ids.layers[li], ids.clip));
      if (prevLayer.nextSibling !== ls.g) svg.insertBefore(ls.g, prevLayer.nextSibling);
      prevLayer = ls.g;
      drawLayerNodes(ls, layer, ids.nodes[li]);
    });
  };

  const destroy = () => {
    defs.remove();
    for (const ls of layers.values()) ls.g.remove();
    layers.clear();
  };
  return { update, destroy };
}
