// The figure title fitted to the figure width: as it is when it fits, else wrapped onto two lines at the best
// space, else smaller (not below 6 pt at the physical size), else cut with "…"; every change comes with a note.
import type { TextRun } from "./scene-types";
import { runsWidthPx, truncateRuns } from "./text";
import { r2 } from "./format";

/** Smallest title size, px at the physical size (96 px per inch): 6 pt, the least any text of a figure gets. */
export const TITLE_MIN_PX = (6 * 96) / 72;
/** Distance between the baselines of a two-line title, in title sizes. */
export const TITLE_LINE_SPACING = 1.15;

export interface TitleFit {
  /** One or two lines of runs. */
  lines: TextRun[][];
  sizePx: number;
  /** What was changed to make it fit (absent when the title fits as it is). */
  note?: string;
}

/** Runs split at character index `at` of their joined text (the character there, a space, is dropped). */
function splitAt(runs: readonly TextRun[], at: number): [TextRun[], TextRun[]] {
  const left: TextRun[] = [];
  const right: TextRun[] = [];
  let pos = 0;
  for (const r of runs) {
    const end = pos + r.text.length;
    if (end <= at) left.push(r);
    else if (pos > at) right.push(r);
    else {
      if (at > pos) left.push({ ...r, text: r.text.slice(0, at - pos) });
      if (end > at + 1) right.push({ ...r, text: r.text.slice(at - pos + 1) });
    }
    pos = end;
  }
  return [left, right];
}

/** The two lines, split at a space, whose wider line is narrowest; null for a title without spaces. */
function bestSplit(runs: readonly TextRun[], sizePx: number): { lines: TextRun[][]; widthPx: number } | null {
  const text = runs.map((r) => r.text).join("");
  let best: { lines: TextRun[][]; widthPx: number } | null = null;
  for (let i = text.indexOf(" "); i > 0 && i < text.length - 1; i = text.indexOf(" ", i + 1)) {
    const lines = splitAt(runs, i);
    const widthPx = Math.max(runsWidthPx(lines[0], sizePx), runsWidthPx(lines[1], sizePx));
    if (!best || widthPx < best.widthPx) best = { lines, widthPx };
  }
  return best;
}

const pt = (px: number) => Math.round(px * 0.75 * 10) / 10;

/**
 * Fit a title of `runs` at `sizePx` into `maxWidthPx`: unchanged when it fits; else on two lines; else the two
 * lines (or the one word) smaller, down to {@link TITLE_MIN_PX} (or the given size if that is already smaller);
 * else at that size, each line cut with "…".
 */
export function fitTitle(runs: readonly TextRun[], sizePx: number, maxWidthPx: number): TitleFit {
  const oneWidth = runsWidthPx(runs, sizePx);
  if (oneWidth <= maxWidthPx) return { lines: [runs.slice()], sizePx };
  const split = bestSplit(runs, sizePx);
  const lines = split ? split.lines : [runs.slice()];
  const widthPx = split ? split.widthPx : oneWidth;
  const wrapped = split ? "wrapped onto two lines" : "";
  if (widthPx <= maxWidthPx) return { lines, sizePx, note: `title ${wrapped} to fit the figure width` };
  const minPx = Math.min(sizePx, TITLE_MIN_PX);
  const fitPx = Math.floor(((sizePx * maxWidthPx) / widthPx) * 100) / 100;
  const how = wrapped ? `${wrapped} and ` : "";
  if (fitPx >= minPx)
    return {
      lines,
      sizePx: fitPx,
      note: `title ${how}set at ${pt(fitPx)} pt (from ${pt(sizePx)} pt) to fit the figure width`,
    };
  return {
    lines: lines.map((l) => truncateRuns(l, minPx, maxWidthPx)),
    sizePx: r2(minPx),
    note: `title ${how}set at ${pt(minPx)} pt and cut with "…": it is too long for the figure width; shorten it`,
  };
}
