// The figure's font families and the open-licence font files behind them (npm packages `computer-modern`,
// SIL OFL 1.1, and `dejavu-fonts-ttf`, Bitstream Vera licence): LaTeX's own look for papers.

import type { FigureFont } from "../../project/types";

export type FigureFontFamily = FigureFont;

/** Package paths of each family's faces; the fallback covers glyphs CMU lacks (≤, ≥, ≈, ∞, superscript signs). */
export const FIGURE_FONT_FILES: Record<
  FigureFontFamily,
  { regular: string; italic: string; bold: string; fallback: string }
> = {
  sans: {
    regular: "computer-modern/fonts/cmu-sans-serif-500-roman.ttf",
    italic: "computer-modern/fonts/cmu-sans-serif-500-italic.ttf",
    bold: "computer-modern/fonts/cmu-sans-serif-700-roman.ttf",
    fallback: "dejavu-fonts-ttf/ttf/DejaVuSans.ttf",
  },
  serif: {
    regular: "computer-modern/fonts/cmu-serif-500-roman.ttf",
    italic: "computer-modern/fonts/cmu-serif-500-italic.ttf",
    bold: "computer-modern/fonts/cmu-serif-700-roman.ttf",
    fallback: "dejavu-fonts-ttf/ttf/DejaVuSerif.ttf",
  },
};
