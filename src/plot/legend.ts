// The legend: one entry per visible model and curve with a swatch drawn like the thing it names (line,
// band, exclusion fill, region), on a white translucent box; entries wrap, and below the plot go in columns.
import type { Model } from "../project/types";
import type { RectNode, Scene, SceneNode } from "./scene-types";
import { r2 } from "./format";
import { hatchStyleFor } from "./hatch";
import { markupRuns } from "./markup";
import { stringWidthPx, wrapText } from "./text";

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

/** One entry as laid out: its lines and where its swatch and first line sit, relative to the box's corner. */
export interface LegendItem {
  lines: string[];
  /** Left edge of the swatch. */
  dx: number;
  /** Middle of the first line. */
  dy: number;
  /** Where the entry's text starts (after the swatch). */
  textDx: number;
}

export interface LegendBox {
  widthPx: number;
  heightPx: number;
  /** Size of the entries' text, px. */
  sizePx: number;
  swatchPx: number;
  items: LegendItem[];
  /** Indices of entries whose text had to be cut with "…" to fit (see {@link LegendLimits}). */
  shortened: number[];
}

/** The room a legend may take: a single column (inner corners, outside right) or columns side by side. */
export interface LegendLimits {
  widthPx: number;
  heightPx: number;
  /** Entries in as many columns as the width allows (legend below or above the plot). */
  columns: boolean;
}

/** Spacing of a legend with text of `sizePx`: padding, swatch, gaps, and the heights of an entry and of a wrapped line. */
function metrics(sizePx: number) {
  return {
    padPx: sizePx * 0.55,
    swatchPx: sizePx * 2.1,
    /** Swatch to text. */
    textGapPx: sizePx * 0.5,
    columnGapPx: sizePx * 1.2,
    /** From one entry's first line to the next entry's, for one-line entries. */
    rowPx: sizePx * 1.38,
    /** From one line of an entry to its next (tighter than between entries, so an entry reads as one). */
    linePx: sizePx * 1.12,
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

/** Most columns a legend below or above the plot is set in; narrower text than this many em is not tried. */
const MAX_COLUMNS = 6;
const MIN_COLUMN_EM = 6;

type Wrapped = { lines: string[]; shortened: boolean }[];

/** Entries in `cols` columns (filled top to bottom, then left to right) with rows aligned across columns. */
function grid(wrapped: Wrapped, cols: number, sizePx: number): Omit<LegendBox, "shortened"> {
  const m = metrics(sizePx);
  const rows = Math.ceil(wrapped.length / cols);
  const rowH = Array.from({ length: rows }, (_, r) =>
    Math.max(...wrapped.filter((_, i) => i % rows === r).map((w) => m.rowPx + (w.lines.length - 1) * m.linePx)),
  );
  const items: LegendItem[] = [];
  let x = m.padPx;
  for (let c = 0; c * rows < wrapped.length; c++) {
    const inCol = wrapped.slice(c * rows, (c + 1) * rows);
    const textW = Math.max(...inCol.flatMap((w) => w.lines.map((l) => stringWidthPx(l, sizePx))));
    let y = m.padPx + sizePx * 0.52;
    inCol.forEach((w, r) => {
      items.push({ lines: w.lines, dx: x, dy: y, textDx: x + m.swatchPx + m.textGapPx });
      y += rowH[r];
    });
    x += m.swatchPx + m.textGapPx + textW + m.columnGapPx;
  }
  return {
    widthPx: x - m.columnGapPx + m.padPx,
    heightPx: m.padPx * 2 + rowH.reduce((a, b) => a + b, 0) - (m.rowPx - sizePx * 1.05),
    sizePx,
    swatchPx: m.swatchPx,
    items,
  };
}

/** The legend in `cols` columns, each entry wrapped to the columns' share of `limits.widthPx`. */
function inColumns(entries: LegendEntry[], sizePx: number, widthPx: number, cols: number, maxLines: number) {
  const m = metrics(sizePx);
  const textPx = (widthPx - m.padPx * 2 - cols * (m.swatchPx + m.textGapPx) - (cols - 1) * m.columnGapPx) / cols;
  const wrapped = entries.map((e) => wrapText(e.text, sizePx, Math.max(textPx, sizePx * 3), maxLines));
  const shortened = wrapped.flatMap((w, i) => (w.shortened ? [i] : []));
  return { box: { ...grid(wrapped, cols, sizePx), shortened }, textPx };
}

/** Characters of the entries' text the box shows (spaces left out: a line break takes one). */
function shownChars(box: LegendBox): number {
  return box.items.reduce((n, it) => n + it.lines.reduce((k, l) => k + l.replace(/…$|\s/g, "").length, 0), 0);
}

/** Whether box `a` is a better choice than `b`: it fits the height and `b` does not, shows more text, is lower. */
function better(a: LegendBox, b: LegendBox | null, heightPx: number): boolean {
  if (!b) return true;
  const fitsA = a.heightPx <= heightPx;
  const fitsB = b.heightPx <= heightPx;
  if (fitsA !== fitsB) return fitsA;
  // Neither fits: the lowest box oversteps its room least.
  if (!fitsA) return a.heightPx < b.heightPx - 1e-9;
  const shown = shownChars(a) - shownChars(b);
  if (shown !== 0) return shown > 0;
  return a.heightPx < b.heightPx - 1e-9;
}

/**
 * Size and arrangement of the legend box: entries wrap onto further lines within `limits.widthPx`; below or
 * above the plot they go in the number of columns that fits `limits.heightPx` showing the most text, then
 * the lowest box (ties: fewer columns). Only a word wider than a line, or an entry with more lines than
 * the height allows, is cut with "…"; those entries are listed in `shortened`. A box that cannot fit even
 * with one line per entry is the lowest one found.
 */
export function measureLegend(entries: LegendEntry[], sizePx: number, limits: LegendLimits): LegendBox {
  if (entries.length === 0) return { widthPx: 0, heightPx: 0, sizePx, swatchPx: 0, items: [], shortened: [] };
  const colsToTry = limits.columns ? Math.min(entries.length, MAX_COLUMNS) : 1;
  let best: LegendBox | null = null;
  for (let cols = 1; cols <= colsToTry; cols++) {
    let maxLines = Infinity;
    for (;;) {
      const { box, textPx } = inColumns(entries, sizePx, limits.widthPx, cols, maxLines);
      if (cols > 1 && textPx < MIN_COLUMN_EM * sizePx) break;
      if (better(box, best, limits.heightPx)) best = box;
      const longest = Math.max(...box.items.map((it) => it.lines.length));
      if (box.heightPx <= limits.heightPx || longest <= 1) break;
      // Too tall: keep every entry to one line fewer than the longest has now.
      maxLines = longest - 1;
    }
  }
  return best as LegendBox;
}

/** A swatch rectangle (the keys in the order every swatch has them, so the written SVG stays the same). */
function swatchRect(id: string, x: number, y: number, w: number, h: number, fill: string, opacity: number): RectNode {
  return { kind: "rect", id, x: r2(x), y: r2(y), w: r2(w), h: r2(h), fill, fillOpacity: opacity };
}

/** A swatch stroke along path data `d`, in the entry's colour, width and dash. */
function swatchPath(e: LegendEntry, id: string, d: string): SceneNode {
  return { kind: "path", id, d, stroke: e.colour, strokeWidth: r2(e.lineWidthPx), dash: e.dash, fill: "none" };
}

/** Scene nodes of one entry's swatch, centred on the line at `cy`, starting at `sx`. */
function swatchNodes(e: LegendEntry, id: string, sx: number, cy: number, sw: number, sizePx: number): SceneNode[] {
  const sh = sizePx * 0.72;
  const [x0, x1, top, bottom] = [r2(sx), r2(sx + sw), r2(cy - sh / 2), r2(cy + sh / 2)];
  const body = () => swatchRect(`${id}-swatch`, sx, cy - sh / 2, sw, sh, e.colour, e.fillOpacity);
  if (e.kind === "model-line" || e.kind === "projection") {
    const spread = e.spread ? [swatchRect(`${id}-spread`, sx, cy - sh / 2, sw, sh, e.colour, 0.12)] : [];
    return [...spread, swatchPath(e, `${id}-swatch`, `M${x0} ${r2(cy)}L${x1} ${r2(cy)}`)];
  }
  if (e.kind === "model-band") {
    const spread = e.spread
      ? [swatchRect(`${id}-spread`, sx, cy - sh / 2 - sh * 0.2, sw, sh * 1.4, e.colour, 0.12)]
      : [];
    return [
      ...spread,
      body(),
      swatchPath(e, `${id}-edges`, `M${x0} ${top}L${x1} ${top}M${x0} ${bottom}L${x1} ${bottom}`),
    ];
  }
  if (e.kind === "exclusion")
    return [
      ...(e.fillOpacity > 0 ? [body()] : []),
      ...(e.hatched ? [swatchHatches(`${id}-hatch`, e, sx, cy + sh / 2, sw, sh)] : []),
      swatchPath(e, `${id}-edge`, `M${x0} ${bottom}L${x1} ${bottom}`),
    ];
  return [{ ...body(), stroke: e.colour, strokeWidth: r2(e.lineWidthPx) }];
}

/**
 * Text nodes of one entry's lines. The first carries the full text (data-legend-entry) and the entry's ids;
 * further lines are marked data-legend-line with their number.
 */
function entryTextNodes(e: LegendEntry, item: LegendItem, id: string, x: number, y: number, sizePx: number) {
  const linePx = metrics(sizePx).linePx;
  return item.lines.map((line, k): SceneNode => ({
    kind: "text",
    id: k === 0 ? `${id}-text` : `${id}-text-${k + 1}`,
    x: r2(x + item.textDx),
    y: r2(y + item.dy + k * linePx),
    runs: markupRuns(line),
    sizePx: r2(sizePx),
    anchor: "start",
    baseline: "middle",
    fill: "#1a1a1a",
    data: k === 0 ? { "legend-entry": e.text, ...e.data } : { "legend-line": String(k + 1) },
  }));
}

/** Scene nodes of the legend box at (x, y): the translucent white box, then per entry its swatch and lines. */
export function legendNodes(entries: LegendEntry[], box: LegendBox, x: number, y: number): SceneNode[] {
  if (entries.length === 0) return [];
  const sizePx = box.sizePx;
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
    const item = box.items[i];
    const id = `legend-${i + 1}`;
    nodes.push(...swatchNodes(e, id, x + item.dx, y + item.dy, box.swatchPx, sizePx));
    nodes.push(...entryTextNodes(e, item, id, x, y, sizePx));
  });
  return nodes;
}

/**
 * What the user is told when the legend had to be made to fit: its text set smaller than chosen (pt), entries
 * shortened; null when neither.
 */
export function shortenedLegendNote(scene: Pick<Scene, "shortenedLegendEntries" | "legendReducedToPt">): string | null {
  const reduced = scene.legendReducedToPt
    ? `Legend: text set at ${scene.legendReducedToPt} pt (smaller than chosen) to fit beside the plot.`
    : "";
  const shortened = scene.shortenedLegendEntries;
  if (!shortened?.length) return reduced || null;
  const names = shortened.map((t) => `“${t}”`).join(", ");
  const n = shortened.length;
  const what = `${n === 1 ? "an entry was" : `${n} entries were`} shortened to fit (${names}); a larger figure, a smaller legend text or another legend place shows ${n === 1 ? "it" : "them"} in full.`;
  return reduced ? `${reduced} ${what[0].toUpperCase()}${what.slice(1)}` : `Legend: ${what}`;
}
