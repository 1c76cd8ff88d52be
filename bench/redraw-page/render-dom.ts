// Benchmark-only renderer: puts scene nodes into an <svg> as DOM elements with the SVG writer's attributes,
// reusing elements by node id and touching only attributes that changed (what React's reconciliation does).
import { nodeAttributes, textSpans, type Scene, type SceneNode } from "../../src/plot/index";

const NS = "http://www.w3.org/2000/svg";

interface Slot {
  el: SVGElement;
  kind: SceneNode["kind"];
  attrs: Record<string, string>;
  text: string;
}

function n(v: number): string {
  return String(Math.round(v * 100) / 100);
}

function attrsOf(node: SceneNode, textByTransform: boolean): Record<string, string> {
  const a: Record<string, string> = {};
  for (const [k, v] of nodeAttributes(node)) if (k !== "xml:space") a[k] = v;
  if (textByTransform && node.kind === "text") {
    // Moving a label by transform needs no new text layout in the browser (x/y changes do).
    const rot = a.transform ? ` rotate(${node.rotate} 0 ${Number(a.y) - node.y})` : "";
    a.transform = `translate(${a.x} ${n(node.y)})${rot}`;
    a.y = n(Number(a.y) - node.y);
    delete a.x;
  }
  return a;
}

function textKey(node: SceneNode): string {
  return node.kind === "text" ? JSON.stringify(node.runs) : "";
}

function fillText(el: SVGElement, node: SceneNode): void {
  if (node.kind !== "text") return;
  el.textContent = "";
  for (const span of textSpans(node)) {
    const t = document.createElementNS(NS, "tspan");
    for (const [k, v] of span.attrs) t.setAttribute(k, v);
    t.textContent = span.text;
    el.appendChild(t);
  }
}

/** A persistent renderer into one <svg>: call render(scene) for every frame. */
export function createDomRenderer(host: HTMLElement, textByTransform = false): (scene: Scene) => void {
  const svg = document.createElementNS(NS, "svg");
  svg.setAttribute("xmlns", NS);
  host.appendChild(svg);
  const defs = document.createElementNS(NS, "defs");
  const clip = document.createElementNS(NS, "clipPath");
  clip.setAttribute("id", "bench-clip");
  const clipRect = document.createElementNS(NS, "rect");
  clip.appendChild(clipRect);
  defs.appendChild(clip);
  svg.appendChild(defs);
  const groups = new Map<string, { g: SVGGElement; slots: Map<string, Slot> }>();
  // Only changed values are written: even setting an attribute to the same value (e.g. the viewBox) can make
  // the browser lay out the whole figure again.
  const last: Record<string, string> = {};
  const set = (el: Element, key: string, name: string, value: string) => {
    if (last[key] === value) return;
    last[key] = value;
    el.setAttribute(name, value);
  };
  return (scene: Scene) => {
    set(svg, "vb", "viewBox", `0 0 ${scene.widthPx} ${scene.heightPx}`);
    set(svg, "ff", "font-family", scene.fontFamily);
    set(clipRect, "cx", "x", n(scene.plot.x));
    set(clipRect, "cy", "y", n(scene.plot.y));
    set(clipRect, "cw", "width", n(scene.plot.w));
    set(clipRect, "ch", "height", n(scene.plot.h));
    for (const layer of scene.layers) {
      let grp = groups.get(layer.id);
      if (!grp) {
        const g = document.createElementNS(NS, "g");
        g.setAttribute("id", layer.id);
        if (layer.clip) g.setAttribute("clip-path", "url(#bench-clip)");
        svg.appendChild(g);
        grp = { g, slots: new Map() };
        groups.set(layer.id, grp);
      }
      // Drop elements whose node is gone first, so the ones that stay never move (moving an element makes
      // the browser lay it out again, which for text is the expensive part of a frame).
      const keys = layer.nodes.map((node, i) => `${node.kind}:${node.id ?? i}`);
      const seen = new Set(keys);
      for (const [key, slot] of grp.slots) {
        if (!seen.has(key)) {
          slot.el.remove();
          grp.slots.delete(key);
        }
      }
      let prev: Element | null = null;
      layer.nodes.forEach((node, i) => {
        const key = keys[i];
        let slot = grp.slots.get(key);
        if (!slot) {
          const tag = node.kind === "path" ? "path" : node.kind === "rect" ? "rect" : "text";
          slot = { el: document.createElementNS(NS, tag), kind: node.kind, attrs: {}, text: "" };
          grp.slots.set(key, slot);
        }
        const next = attrsOf(node, textByTransform);
        for (const k of Object.keys(slot.attrs)) if (!(k in next)) slot.el.removeAttribute(k);
        for (const k of Object.keys(next)) if (slot.attrs[k] !== next[k]) slot.el.setAttribute(k, next[k]);
        slot.attrs = next;
        const tk = textKey(node);
        if (tk !== slot.text) {
          fillText(slot.el, node);
          slot.text = tk;
        }
        const want: ChildNode | null = prev ? prev.nextSibling : grp.g.firstChild;
        if (want !== slot.el) grp.g.insertBefore(slot.el, want);
        prev = slot.el;
      });
    }
  };
}
