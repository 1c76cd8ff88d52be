// The figure font's files for the command line's PDF and PNG and for tests: read from the installed
// open-licence font packages (Computer Modern Unicode, OFL; DejaVu as the fallback for glyphs CMU lacks).
import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import type { PdfFonts } from "../formats/pdf/write-pdf";
import { FIGURE_FONT_FILES, type FigureFontFamily } from "../formats/pdf/fonts";

const require = createRequire(import.meta.url);
const read = (spec: string) => new Uint8Array(readFileSync(require.resolve(spec)));

/** The files of a figure font family on disk (regular, italic, bold, fallback), for resvg's font database. */
export function figureFontPaths(family: FigureFontFamily): string[] {
  const f = FIGURE_FONT_FILES[family];
  return [f.regular, f.italic, f.bold, f.fallback].map((spec) => require.resolve(spec));
}

/** The faces of a figure font family as bytes. */
export function nodePdfFonts(family: FigureFontFamily = "sans"): PdfFonts {
  const files = FIGURE_FONT_FILES[family];
  return {
    regular: read(files.regular),
    italic: read(files.italic),
    bold: read(files.bold),
    fallback: read(files.fallback),
  };
}
