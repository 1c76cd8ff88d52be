// The legend: one entry per visible model and curve with a swatch drawn like the thing it names (line,
// band, exclusion fill, region), on a white translucent box; notes for cancelling bands and rescaled curves.
import type { Model } from "../project/types";
import type { SceneNode, TextRun } from "./scene-types";
import { r2 } from "./format";
import { hatchStyleFor } from "./hatch";
import { markupRuns } from "./markup";
import { runsText, runsWidthPx, truncateRuns } from "./text";

/**
 * What a model's kind adds to its legend entry, so a reader knows what the band means: "between lines 5/3 | 44/3",
 * "model set: 820 models, lines" / "…, between extremes" / "…, central 68 %" (models counted with multiplicities);
 * null for a line or an interval, which the label already describes.
 */
export function modelKindNote(
  m: Partial<Pick<Model, "kind" | "members" | "setDraw" | "setShare" | "label">>,
): string | null {
  const members = m.members ?? [];
  if (members.length === 0) return null;
  if (m.kind === "between") {
    const values = members.map((x) => x.eOverN).join(" | ");
    // A label typed as "E/N = 5/3 | 44/3" already names the lines.
    return m.label?.includes(values) ? "between lines" : `between lines ${values}`;
  }
  if (m.kind !== "set") return null;
  const n = members.reduce((s, x) => s + x.count, 0);
  const draw =
    m.setDraw === "lines"
      ? "lines"
      : m.setDraw === "central"
        ? `central ${Math.round((m.setShare ?? 0.68) * 1000) / 10} %`
        : "between extremes";
  return `model set: ${n} model${n === 1 ? "" : "s"}, ${draw}`;
}

export type SwatchKind = "model-line" | "model-band" | "exclusion" | "projection" | "region";

export interface LegendEntry {
  kind: SwatchKind;
  /** Full text of the entry, notes included. */
  text: string;
  colour: string;
  dash?: string;
  fillOpacity: number;
  lineWidthPx: number;
  /** Draw a lighter band around the swatch (theory spread). */
  spread?: boolean;
  /** Exclusions: hatches above the swatch's edge, as on the plot. */
  hatched?: boolean;
  /** Extra data-* attributes of the entry's text (model-id / curve-id). */
  data: Record<string, string>;
}

export interface LegendBox {
  widthPx: number;
  heightPx: number;
  rowPx: number;
  swatchPx: number;
  padPx: number;
  labels: TextRun[][];
}

/**
 * Size of the legend box. Labels are read as math markup (markup.ts); longer than `maxLabelPx` they are cut
 * with "…" (the full text stays in the entry's data-legend-entry attribute).
 */
export function measureLegend(entries: LegendEntry[], sizePx: number, maxLabelPx: number): LegendBox {
  const padPx = sizePx * 0.55;
  const rowPx = sizePx * 1.38;
  const swatchPx = sizePx * 2.1;
  const labels = entries.map((e) => truncateRuns(markupRuns(e.text), sizePx, Math.max(sizePx * 4, maxLabelPx)));
  const textW = labels.reduce((w, l) => Math.max(w, runsWidthPx(l, sizePx)), 0);
  if (entries.length === 0) return { widthPx: 0, heightPx: 0, rowPx, swatchPx, padPx, labels };
  return {
    widthPx: padPx * 2 + swatchPx + sizePx * 0.5 + textW,
    heightPx: padPx * 2 + rowPx * entries.length - (rowPx - sizePx * 1.05),
    rowPx,
    swatchPx,
    padPx,
    labels,
  };
}

/** The hatches of an exclusion's swatch: up from its edge at (x, y), as the plot's hatches sit on the excluded side. */
function swatchHatches(id: string, e: LegendEntry, x: number, y: number, w: number, h: number): SceneNode {
  const style = hatchStyleFor(e.lineWidthPx);
  const len = Math.min(style.lengthPx + e.lineWidthPx / 2, h);
  const count = Math.max(2, Math.floor(w / style.spacingPx));
  const step = w / count;
  let d = "";
  for (let k = 0; k < count; k++) d += `M${r2(x + step * (k + 0.5))} ${r2(y)}l0 ${r2(-len)}`;
  return { kind: "path", id, d, stroke: e.colour, strokeWidth: r2(style.widthPx), fill: "none" };
}

/** Scene nodes of the legend box at (x, y). */
export function legendNodes(entries: LegendEntry[], box: LegendBox, x: number, y: number, sizePx: number): SceneNode[] {
  if (entries.length === 0) return [];
  const nodes: SceneNode[] = [
    {
      kind: "rect",
      id: "legend-box",
      x: r2(x),
      y: r2(y),
      w: r2(box.widthPx),
      h: r2(box.heightPx),
      fill: "#ffffff",
      fillOpacity: 0.85,
      stroke: "#b3b3b3",
      strokeWidth: r2(Math.max(0.5, sizePx / 22)),
    },
  ];
  entries.forEach((e, i) => {
    const cy = y + box.padPx + sizePx * 0.52 + i * box.rowPx;
    const sx = x + box.padPx;
    const sw = box.swatchPx;
    const sh = sizePx * 0.72;
    const id = `legend-${i + 1}`;
    const lw = r2(e.lineWidthPx);
    if (e.kind === "model-line" || e.kind === "projection") {
      if (e.spread)
        nodes.push({
          kind: "rect",
          id: `${id}-spread`,
          x: r2(sx),
          y: r2(cy - sh / 2),
          w: r2(sw),
          h: r2(sh),
          fill: e.colour,
          fillOpacity: 0.12,
        });
      nodes.push({
        kind: "path",
        id: `${id}-swatch`,
        d: `M${r2(sx)} ${r2(cy)}L${r2(sx + sw)} ${r2(cy)}`,
        stroke: e.colour,
        strokeWidth: lw,
        dash: e.dash,
        fill: "none",
      });
    } else if (e.kind === "model-band") {
      if (e.spread)
        nodes.push({
          kind: "rect",
          id: `${id}-spread`,
          x: r2(sx),
          y: r2(cy - sh / 2 - sh * 0.2),
          w: r2(sw),
          h: r2(sh * 1.4),
          fill: e.colour,
          fillOpacity: 0.12,
        });
      nodes.push({
        kind: "rect",
        id: `${id}-swatch`,
        x: r2(sx),
        y: r2(cy - sh / 2),
        w: r2(sw),
        h: r2(sh),
        fill: e.colour,
        fillOpacity: e.fillOpacity,
      });
      nodes.push({
        kind: "path",
        id: `${id}-edges`,
        d: `M${r2(sx)} ${r2(cy - sh / 2)}L${r2(sx + sw)} ${r2(cy - sh / 2)}M${r2(sx)} ${r2(cy + sh / 2)}L${r2(sx + sw)} ${r2(cy + sh / 2)}`,
        stroke: e.colour,
        strokeWidth: lw,
        dash: e.dash,
        fill: "none",
      });
    } else if (e.kind === "exclusion") {
      if (e.fillOpacity > 0)
        nodes.push({
          kind: "rect",
          id: `${id}-swatch`,
          x: r2(sx),
          y: r2(cy - sh / 2),
          w: r2(sw),
          h: r2(sh),
          fill: e.colour,
          fillOpacity: e.fillOpacity,
        });
      if (e.hatched) nodes.push(swatchHatches(`${id}-hatch`, e, sx, cy + sh / 2, sw, sh));
      nodes.push({
        kind: "path",
        id: `${id}-edge`,
        d: `M${r2(sx)} ${r2(cy + sh / 2)}L${r2(sx + sw)} ${r2(cy + sh / 2)}`,
        stroke: e.colour,
        strokeWidth: lw,
        dash: e.dash,
        fill: "none",
      });
    } else {
      nodes.push({
        kind: "rect",
        id: `${id}-swatch`,
        x: r2(sx),
        y: r2(cy - sh / 2),
        w: r2(sw),
        h: r2(sh),
        fill: e.colour,
        fillOpacity: e.fillOpacity,
        stroke: e.colour,
        strokeWidth: lw,
      });
    }
    nodes.push({
      kind: "text",
      id: `${id}-text`,
      x: r2(sx + sw + sizePx * 0.5),
      y: r2(cy),
      runs: box.labels[i],
      sizePx: r2(sizePx),
      anchor: "start",
      baseline: "middle",
      fill: "#1a1a1a",
      data: { "legend-entry": e.text, ...e.data },
    });
  });
  return nodes;
}

/** Plain text of a legend label (tests, tooltips). */
export const legendLabelText = runsText;
