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

function attrsOf(node: SceneNode): Record<string, string> {
  const a: Record<string, string> = {};
  for (const [k, v] of nodeAttributes(node)) if (k !== "xml:space") a[k] = v;
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
export function createDomRenderer(host: HTMLElement): (scene: Scene) => void {
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
  return (scene: Scene) => {
    svg.setAttribute("viewBox", `0 0 ${scene.widthPx} ${scene.heightPx}`);
    svg.setAttribute("font-family", scene.fontFamily);
    clipRect.setAttribute("x", n(scene.plot.x));
    clipRect.setAttribute("y", n(scene.plot.y));
    clipRect.setAttribute("width", n(scene.plot.w));
    clipRect.setAttribute("height", n(scene.plot.h));
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
      const seen = new Set<string>();
      let prev: Element | null = null;
      layer.nodes.forEach((node, i) => {
        const key = `${node.kind}:${node.id ?? i}`;
        seen.add(key);
        let slot = grp.slots.get(key);
        if (!slot) {
          const tag = node.kind === "path" ? "path" : node.kind === "rect" ? "rect" : "text";
          slot = { el: document.createElementNS(NS, tag), kind: node.kind, attrs: {}, text: "" };
          grp.slots.set(key, slot);
        }
        const next = attrsOf(node);
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
      for (const [key, slot] of grp.slots) {
        if (!seen.has(key)) {
          slot.el.remove();
          grp.slots.delete(key);
        }
      }
    }
  };
}
