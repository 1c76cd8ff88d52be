// PNG output of the renderer: rasterises the exported SVG with resvg (a native binary shipped inside its npm
// package; no browser, no download) at physical size × dpi, and stamps the dpi into the PNG's pHYs chunk.
import { existsSync } from "node:fs";
import { createRequire } from "node:module";
import { setPngDpi } from "../formats/png-meta";

/**
 * Sans-serif faces looked for, in order, with the files that show they are installed (Debian, Fedora, Arch,
 * macOS, Windows). Arial-metric faces first: the plot core lays text out with Helvetica/Arial widths, and
 * Liberation Sans shares them; DejaVu Sans is ~8 % wider. resvg uses the default family also for a
 * font-family list whose first entry is missing, so the default must be the face we want, not just any.
 */
const FONT_CANDIDATES: { family: string; files: string[] }[] = [
  {
    family: "Arial",
    files: [
      "/Library/Fonts/Arial.ttf",
      "/System/Library/Fonts/Supplemental/Arial.ttf",
      "C:\\Windows\\Fonts\\arial.ttf",
    ],
  },
  {
    family: "Liberation Sans",
    files: [
      "/usr/share/fonts/truetype/liberation/LiberationSans-Regular.ttf",
      "/usr/share/fonts/liberation-sans/LiberationSans-Regular.ttf",
      "/usr/share/fonts/TTF/LiberationSans-Regular.ttf",
    ],
  },
  {
    family: "DejaVu Sans",
    files: [
      "/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf",
      "/usr/share/fonts/dejavu/DejaVuSans.ttf",
      "/usr/share/fonts/TTF/DejaVuSans.ttf",
    ],
  },
];

/** The sans-serif family the PNG's text falls back to, or undefined (with a note) when none of ours is installed. */
export function pickFallbackFont(exists: (p: string) => boolean = existsSync): { family?: string; note?: string } {
  for (const c of FONT_CANDIDATES) if (c.files.some(exists)) return { family: c.family };
  return {
    note: "no Arial, Liberation Sans or DejaVu Sans found; PNG text uses the first system font resvg finds (install fonts-liberation or fonts-dejavu-core)",
  };
}

/** Pixel size of a PNG of a figure `widthIn` × `heightIn` inches at `dpi` (8.6 cm at 300 dpi → 1016 px). */
export function pngPixelSize(widthIn: number, heightIn: number, dpi: number): { widthPx: number; heightPx: number } {
  return { widthPx: Math.max(1, Math.round(widthIn * dpi)), heightPx: Math.max(1, Math.round(heightIn * dpi)) };
}

/**
 * PNG bytes of an SVG at exactly `widthPx` wide (the height follows the viewBox's aspect ratio), on white
 * like the app's PNG export, with pHYs set to `dpi`.
 */
export function renderPng(svg: string, widthPx: number, dpi: number, fontFamily?: string): Uint8Array {
  // Loaded on first use: SVG-only runs skip the native module's start-up.
  const { Resvg } = createRequire(import.meta.url)("@resvg/resvg-js") as typeof import("@resvg/resvg-js");
  const r = new Resvg(svg, {
    fitTo: { mode: "width", value: widthPx },
    background: "#ffffff",
    font: fontFamily
      ? { loadSystemFonts: true, defaultFontFamily: fontFamily, sansSerifFamily: fontFamily }
      : { loadSystemFonts: true },
    logLevel: "off",
  });
  return setPngDpi(new Uint8Array(r.render().asPng()), dpi);
}
