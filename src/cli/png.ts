// PNG output of the renderer: the exported SVG rasterised with resvg (native, no browser) at physical size × dpi,
// in the figure font's own files, with the dpi stamped into the pHYs chunk.
import { createRequire } from "node:module";
import type { FigureFontFamily } from "../formats/pdf/fonts";
import { setPngDpi } from "../formats/png-meta";
import { figureFontPaths } from "./pdf-fonts";

/** The family name inside each figure font's files (what the SVG's font-family list names first). */
const FAMILY_NAME: Record<FigureFontFamily, string> = { sans: "CMU Sans Serif", serif: "CMU Serif" };

/** Pixel size of a PNG of a figure `widthIn` × `heightIn` inches at `dpi` (8.6 cm at 300 dpi → 1016 px). */
export function pngPixelSize(widthIn: number, heightIn: number, dpi: number): { widthPx: number; heightPx: number } {
  return { widthPx: Math.max(1, Math.round(widthIn * dpi)), heightPx: Math.max(1, Math.round(heightIn * dpi)) };
}

/**
 * The SVG drawn by resvg at exactly `widthPx` wide (the height follows the viewBox's aspect ratio), on white
 * like the app's PNG export. Text uses only the figure font's files (no system fonts), so the pixels are the
 * same on every machine and match the PDF's.
 */
export function rasterise(svg: string, widthPx: number, font: FigureFontFamily = "sans") {
  // Loaded on first use: SVG-only runs skip the native module's start-up.
  const { Resvg } = createRequire(import.meta.url)("@resvg/resvg-js") as typeof import("@resvg/resvg-js");
  const family = FAMILY_NAME[font];
  return new Resvg(svg, {
    fitTo: { mode: "width", value: widthPx },
    background: "#ffffff",
    font: {
      loadSystemFonts: false,
      fontFiles: figureFontPaths(font),
      defaultFontFamily: family,
      sansSerifFamily: font === "sans" ? family : undefined,
      serifFamily: font === "serif" ? family : undefined,
    },
    logLevel: "off",
  }).render();
}

/** PNG bytes of {@link rasterise}'s image, with pHYs set to `dpi`. */
export function renderPng(svg: string, widthPx: number, dpi: number, font: FigureFontFamily = "sans"): Uint8Array {
  return setPngDpi(new Uint8Array(rasterise(svg, widthPx, font).asPng()), dpi);
}
