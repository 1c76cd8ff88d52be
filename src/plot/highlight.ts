// The marks of a highlighted mass interval (a row of the overlap table) and the halos on its model's or curve's
// lines, drawn over the data in the scene's highlight layer.
import type { PathNode, SceneNode } from "./scene-types";
import type { BuildSceneOpts } from "./scene";
import type { Fonts, PlotRect } from "./layout";
import type { logAffine } from "./scales";
import { r2 } from "./format";

export /** Marks of a highlighted mass interval (a row of the overlap table) and halos on its model's or curve's lines. */
function highlightNodes(
  hl: BuildSceneOpts["highlight"],
  { map, plot, fonts }: { map: ReturnType<typeof logAffine>; plot: PlotRect; fonts: Fonts },
  modelLineById: Map<string, PathNode[]>,
  curveLineById: Map<string, PathNode[]>,
): SceneNode[] {
  const highlight: SceneNode[] = [];
  if (hl && hl.massMinEv > 0 && hl.massMaxEv > 0) {
    const xa = map.ax + map.bx * Math.log10(Math.min(hl.massMinEv, hl.massMaxEv));
    const xb = map.ax + map.bx * Math.log10(Math.max(hl.massMinEv, hl.massMaxEv));
    const lo = Math.max(plot.x - 2, xa);
    const hi = Math.min(plot.x + plot.w + 2, xb);
    const data: Record<string, string> = { highlight: "mass" };
    if (hl.modelId) data["model-id"] = hl.modelId;
    if (hl.curveId) data["curve-id"] = hl.curveId;
    const spans: [number, number][] = [];
    for (const [a, b] of hl.intervalsEv ?? [[hl.massMinEv, hl.massMaxEv]]) {
      if (!(a > 0 && b > 0)) continue;
      const pa = Math.max(lo, map.ax + map.bx * Math.log10(Math.min(a, b)));
      const pb = Math.min(hi, map.ax + map.bx * Math.log10(Math.max(a, b)));
      if (!(pb > pa)) continue;
      // Thousands of narrow intervals become at most one mark per pixel column.
      const last = spans[spans.length - 1];
      if (last && pa <= last[1] + 1) last[1] = Math.max(last[1], pb);
      else spans.push([pa, pb]);
    }
    spans.forEach(([a, b], k) =>
      highlight.push({
        kind: "rect",
        id: k === 0 ? "highlight-range" : `highlight-range-${k + 1}`,
        x: r2(a),
        y: plot.y,
        w: r2(Math.max(b - a, 0.5)),
        h: plot.h,
        fill: "#1f3b57",
        fillOpacity: 0.1,
        data,
      }),
    );
    const halo = [
      ...(hl.modelId ? (modelLineById.get(hl.modelId) ?? []) : []),
      ...(hl.curveId ? (curveLineById.get(hl.curveId) ?? []) : []),
    ];
    halo.forEach((node, k) =>
      highlight.push({
        kind: "path",
        id: `highlight-halo-${k + 1}`,
        d: node.d,
        writtenD: node.writtenD,
        stroke: node.stroke ?? node.fill ?? "#1f3b57",
        strokeWidth: r2((node.strokeWidth ?? fonts.dataLinePx) * 3),
        strokeOpacity: 0.35,
        fill: "none",
        data: { ...data },
      }),
    );
  }
  return highlight;
}
