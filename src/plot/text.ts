// Text without a DOM: width estimates for layout, and the one placement of sub/superscript runs that both
// the SVG writer and the on-screen renderer use, so exported text sits exactly where the screen shows it.
import type { TextNode, TextRun } from "./scene-types";

/**
 * Advance widths in 1/1000 em of a Helvetica/Arial-like sans-serif (the Adobe Core-14 Helvetica AFM
 * widths, from memory; Arial and Liberation Sans share them, DejaVu Sans is ~8 % wider, which the layout
 * absorbs in its padding). Characters not listed count as 0.6 em (Greek, symbols) or 1 em (wide scripts).
 */
const WIDTHS: Record<string, number> = (() => {
  const w: Record<string, number> = {};
  const put = (chars: string, width: number) => {
    for (const ch of chars) w[ch] = width;
  };
  put("0123456789", 556);
  put(" ", 278);
  put("ABEKPSVXY", 667);
  put("CDHNRUw", 722);
  put("GOQ", 778);
  put("FTZ", 611);
  put("IJ", 278);
  w.J = 500;
  put("L", 556);
  put("M", 833);
  put("W", 944);
  put("abdeghnopqu", 556);
  put("cksvxyz", 500);
  put("fjt", 278);
  put("il", 222);
  w.j = 222;
  put("m", 833);
  put("r", 333);
  put(".,:;!/[]\\", 278);
  put("()-", 333);
  put("−+=×<>~÷±", 584);
  put("|", 260);
  put("'", 191);
  put('"', 355);
  put("%", 889);
  put("&", 667);
  put("?_", 556);
  put("*", 389);
  put("#$", 556);
  put("@", 1015);
  put("…", 1000);
  put("·", 278);
  put("–", 556);
  put("—", 1000);
  put("μµ", 556);
  put("αβγδεζηθικλνξοπρστυφχψω", 560);
  put("ΓΔΘΛΞΠΣΦΨΩ", 700);
  return w;
})();

/** Sub/superscripts are set at this fraction of the base size. */
export const SHIFT_SCALE = 0.7;
/** Superscript baseline raised by this fraction of the base size (positive = up). */
export const SUP_RAISE = 0.42;
/** Subscript baseline lowered by this fraction of the base size. */
export const SUB_DROP = 0.2;
/**
 * Smallest size (px) a sub/superscript is set at: 6 pt at 96 px/in, the smallest lettering journals accept in
 * printed artwork (common practice, e.g. the APS and Elsevier artwork guidelines, from memory). A base size
 * below it is kept as it is.
 */
export const MIN_TEXT_PX = 8;

/** Font size (px) of a sub/superscript on a base size: {@link SHIFT_SCALE} of it, but not under 6 pt. */
export function shiftedSizePx(sizePx: number): number {
  return Math.max(sizePx * SHIFT_SCALE, Math.min(sizePx, MIN_TEXT_PX));
}

/** Cap height of the sans-serif as a fraction of the font size (for "hanging" and "middle" placement). */
export const CAP_HEIGHT = 0.72;

function charWidthEm(ch: string): number {
  const w = WIDTHS[ch];
  if (w !== undefined) return w / 1000;
  const code = ch.codePointAt(0) ?? 0;
  return code >= 0x2e80 ? 1 : 0.6;
}

/** Estimated width in px of a plain string at a font size in px. */
export function stringWidthPx(text: string, sizePx: number): number {
  let em = 0;
  for (const ch of text) em += charWidthEm(ch);
  return em * sizePx;
}

/** Estimated width in px of text runs (sub/superscripts at {@link shiftedSizePx}) at a base size in px. */
export function runsWidthPx(runs: readonly TextRun[], sizePx: number): number {
  let w = 0;
  for (const r of runs) w += stringWidthPx(r.text, r.shift ? shiftedSizePx(sizePx) : sizePx);
  return w;
}

/** "…" added to `text`, cut so both fit in `maxWidthPx` (at least one character is kept). */
function shortened(text: string, sizePx: number, maxWidthPx: number): string {
  const room = maxWidthPx - stringWidthPx("…", sizePx);
  let kept = "";
  let used = 0;
  for (const ch of text) {
    const w = stringWidthPx(ch, sizePx);
    if (kept && used + w > room) break;
    used += w;
    kept += ch;
  }
  return kept.trimEnd() + "…";
}

/** A text broken into lines, and whether something had to be cut to fit. */
export interface WrappedText {
  lines: string[];
  /** A word wider than a line, or more lines than allowed: the text was cut with "…". */
  shortened: boolean;
}

/**
 * Plain text broken at spaces into lines of at most `maxWidthPx` (greedy, as a typesetter's first fit). An
 * equals sign keeps its neighbours ("E/N = 8/3" never ends a line with "="). Only a single word wider than
 * the line, or lines beyond `maxLines`, are cut with "…".
 * @param maxLines @default Infinity
 */
export function wrapText(text: string, sizePx: number, maxWidthPx: number, maxLines = Infinity): WrappedText {
  const words = text
    .replace(/ = /g, "\u00a0=\u00a0")
    .split(/ +/)
    .filter((w) => w !== "");
  const fits = (t: string) => stringWidthPx(t, sizePx) <= maxWidthPx;
  const lines: string[] = [];
  let cut = false;
  let line = "";
  for (const word of words) {
    const joined = line ? `${line} ${word}` : word;
    if (fits(joined)) {
      line = joined;
      continue;
    }
    if (line) lines.push(line);
    line = word;
    if (!fits(word)) {
      line = shortened(word, sizePx, maxWidthPx);
      cut = true;
    }
  }
  if (line || lines.length === 0) lines.push(line);
  if (lines.length > maxLines) {
    const kept = lines.slice(0, Math.max(1, maxLines));
    kept[kept.length - 1] = shortened(kept[kept.length - 1] + " ", sizePx, maxWidthPx);
    return { lines: kept.map(unbind), shortened: true };
  }
  return { lines: lines.map(unbind), shortened: cut };
}

function unbind(line: string): string {
  return line.replace(/\u00a0/g, " ");
}

/** One run as drawn: a tspan with a baseline offset relative to the previous run and its own size. */
export interface PlacedRun {
  text: string;
  /** Baseline change in px from the previous run (SVG `dy`; positive = down); 0 for none. */
  dyPx: number;
  /** Font size in px, or undefined to inherit the text node's size. */
  sizePx: number | undefined;
  italic: boolean;
}

/**
 * Where a text node's runs go: the y of the first baseline (the node's `baseline` turned into an explicit
 * offset, since renderers disagree on dominant-baseline) and per run its dy and size. Both renderers must
 * use this so the screen and the export agree.
 */
export function placeRuns(node: Pick<TextNode, "y" | "runs" | "sizePx" | "baseline">): {
  baselineY: number;
  runs: PlacedRun[];
} {
  const s = node.sizePx;
  const baselineY =
    node.baseline === "middle"
      ? node.y + (CAP_HEIGHT / 2) * s
      : node.baseline === "hanging"
        ? node.y + CAP_HEIGHT * s
        : node.y;
  let offset = 0; // current baseline offset, px, positive = down
  const runs: PlacedRun[] = [];
  for (const r of node.runs) {
    if (r.text === "") continue;
    const want = r.shift === "sup" ? -SUP_RAISE * s : r.shift === "sub" ? SUB_DROP * s : 0;
    const dy = Math.round((want - offset) * 100) / 100;
    offset += dy;
    runs.push({
      text: r.text,
      dyPx: dy,
      sizePx: r.shift ? Math.round(shiftedSizePx(s) * 100) / 100 : undefined,
      italic: !!r.italic,
    });
  }
  return { baselineY: Math.round(baselineY * 100) / 100, runs };
}

/** Plain text of runs (for data attributes, titles and tests). */
export function runsText(runs: readonly TextRun[]): string {
  return runs.map((r) => r.text).join("");
}

/** Runs cut to fit a width in px, ending in "…" when cut. */
export function truncateRuns(runs: readonly TextRun[], sizePx: number, maxWidthPx: number): TextRun[] {
  if (runsWidthPx(runs, sizePx) <= maxWidthPx) return runs.slice();
  const ellipsis = stringWidthPx("…", sizePx);
  const out: TextRun[] = [];
  let used = 0;
  for (const r of runs) {
    const size = r.shift ? shiftedSizePx(sizePx) : sizePx;
    let kept = "";
    for (const ch of r.text) {
      const w = stringWidthPx(ch, size);
      if (used + w + ellipsis > maxWidthPx) {
        if (kept) out.push({ ...r, text: kept });
        out.push({ text: "…" });
        return out;
      }
      used += w;
      kept += ch;
    }
    if (kept) out.push({ ...r, text: kept });
  }
  return out;
}
