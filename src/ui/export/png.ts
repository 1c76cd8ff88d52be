// Rasterises an exported SVG to PNG in the browser (canvas), with the pixel size for 1×, 2× and 300 dpi, from an
// SVG thinned for the PNG's pixels and without the embedded project.
import type { Project } from "../../project/types";
import { exportFigureSvg, rasterResolution } from "../../formats/figure-file";
import { presetOf, type Preset } from "../../plot/layout";

/** PNG resolutions offered by the export menu. */
export type PngScale = "1x" | "2x" | "300dpi";

export interface SvgSize {
  /** viewBox size in CSS pixels (96 per inch). */
  widthPx: number;
  heightPx: number;
  /** Physical size in inches from the width/height attributes, when they carry a physical unit. */
  widthIn: number | null;
  heightIn: number | null;
}

const INCHES_PER_UNIT: Record<string, number> = {
  cm: 1 / 2.54,
  mm: 1 / 25.4,
  in: 1,
  pt: 1 / 72,
  pc: 1 / 6,
  px: 1 / 96,
  "": 1 / 96,
};

function lengthInches(value: string | null): number | null {
  if (!value) return null;
  const m = /^\s*([0-9]*\.?[0-9]+(?:e[-+]?\d+)?)\s*(cm|mm|in|pt|pc|px)?\s*$/i.exec(value);
  if (!m) return null;
  const n = Number(m[1]);
  const per = INCHES_PER_UNIT[(m[2] ?? "").toLowerCase()];
  return Number.isFinite(n) && n > 0 && per !== undefined ? n * per : null;
}

function rootAttribute(svgText: string, name: string): string | null {
  const open = /<svg\b[^>]*>/i.exec(svgText);
  if (!open) return null;
  const m = new RegExp(`\\s${name}\\s*=\\s*("([^"]*)"|'([^']*)')`, "i").exec(open[0]);
  return m ? (m[2] ?? m[3] ?? null) : null;
}

/** Reads the viewBox and the physical width/height of an SVG document's root element. */
export function svgSize(svgText: string): SvgSize {
  const vb = (rootAttribute(svgText, "viewBox") ?? "")
    .trim()
    .split(/[\s,]+/)
    .map(Number);
  const wAttr = rootAttribute(svgText, "width");
  const hAttr = rootAttribute(svgText, "height");
  const widthIn = lengthInches(wAttr);
  const heightIn = lengthInches(hAttr);
  const widthPx = vb.length === 4 && vb[2] > 0 ? vb[2] : (widthIn ?? 0) * 96;
  const heightPx = vb.length === 4 && vb[3] > 0 ? vb[3] : (heightIn ?? 0) * 96;
  return { widthPx, heightPx, widthIn, heightIn };
}

/**
 * Pixel size and dots per inch of the PNG for a resolution choice. 1× is the scene at 96 px per inch,
 * 2× doubles it; 300 dpi uses the physical size (falling back to the 96 px-per-inch size when the SVG has none).
 */
export function pngTarget(size: SvgSize, scale: PngScale): { widthPx: number; heightPx: number; dpi: number } {
  const wIn = size.widthIn ?? size.widthPx / 96;
  const hIn = size.heightIn ?? size.heightPx / 96;
  if (scale === "300dpi") return { widthPx: Math.round(wIn * 300), heightPx: Math.round(hIn * 300), dpi: 300 };
  const k = scale === "2x" ? 2 : 1;
  const widthPx = Math.round(size.widthPx * k);
  const heightPx = Math.round(size.heightPx * k);
  return { widthPx, heightPx, dpi: wIn > 0 ? widthPx / wIn : 96 * k };
}

/**
 * The size of a figure exported at this preset, known before the SVG is built: the viewBox in px and the
 * preset's physical size. For the fixed presets it is what {@link svgSize} reads from the file; for a custom
 * size the file rounds its physical size from the px size to 0.01 cm, so the two can differ by that much.
 */
export function presetSvgSize(
  preset: Pick<Preset, "widthPx" | "heightPx" | "widthPhysical" | "heightPhysical">,
): SvgSize {
  return {
    widthPx: preset.widthPx,
    heightPx: preset.heightPx,
    widthIn: lengthInches(preset.widthPhysical),
    heightIn: lengthInches(preset.heightPhysical),
  };
}

/** The SVG a PNG is drawn from, its pixel size and dpi, and the thinning resolution it was built with. */
export interface PngFigure {
  svg: string;
  widthPx: number;
  heightPx: number;
  dpi: number;
  /** Columns per scene px: rasterResolution of the dpi the preset's size gives (two columns per PNG pixel; equal to rasterResolution(dpi) for the fixed presets). */
  resolution: number;
}

/**
 * The SVG to rasterise for a PNG of the project at its figure preset: thinned at rasterResolution(dpi) (two
 * columns per PNG pixel, so the thinning stays ≤ 0.5 PNG px, as the command-line renderer does) and without
 * the embedded project (the PNG cannot carry it, and a lighter SVG rasterises faster); with the PNG's
 * pixel size and dpi from {@link pngTarget} on the built SVG's own size.
 */
export function pngFigure(project: Project, scale: PngScale): PngFigure {
  const resolution = rasterResolution(pngTarget(presetSvgSize(presetOf(project.figure)), scale).dpi);
  const svg = exportFigureSvg(project, { preset: project.figure.preset, embedProject: false, resolution });
  // The file's width/height decide the pixels and the dpi stamped into the PNG (as before); for a custom size
  // they may differ from the preset's by the 0.01 cm rounding (≤ 0.5 % in dpi at the smallest 2 cm), too little to matter for thinning.
  return { svg, ...pngTarget(svgSize(svg), scale), resolution };
}

/** Sets the width/height attributes of the root <svg> to pixels so the browser rasterises it at that size. */
function withPixelSize(svgText: string, widthPx: number, heightPx: number): string {
  return svgText.replace(/<svg\b[^>]*>/i, (tag) => {
    let t = tag.replace(/\s(width|height)\s*=\s*("[^"]*"|'[^']*')/gi, "");
    t = t.replace(/^<svg\b/i, `<svg width="${widthPx}" height="${heightPx}"`);
    return t;
  });
}

/**
 * Draws an SVG into a canvas of the given size and returns the PNG bytes (without dpi metadata).
 * Runs in the browser only (needs Image, canvas and blob URLs). Fills the background white so the PNG
 * looks the same on dark slides.
 */
export async function rasteriseSvg(svgText: string, widthPx: number, heightPx: number): Promise<Uint8Array> {
  const blob = new Blob([withPixelSize(svgText, widthPx, heightPx)], { type: "image/svg+xml" });
  const url = URL.createObjectURL(blob);
  try {
    const img = new Image();
    img.decoding = "async";
    const loaded = new Promise<void>((resolve, reject) => {
      img.onload = () => resolve();
      img.onerror = () => reject(new Error("The figure could not be drawn as an image."));
    });
    img.src = url;
    await loaded;
    const canvas = document.createElement("canvas");
    canvas.width = widthPx;
    canvas.height = heightPx;
    const ctx = canvas.getContext("2d");
    if (!ctx) throw new Error("This browser gives no canvas to draw the PNG into.");
    ctx.fillStyle = "#ffffff";
    ctx.fillRect(0, 0, widthPx, heightPx);
    ctx.drawImage(img, 0, 0, widthPx, heightPx);
    const png = await new Promise<Blob>((resolve, reject) =>
      canvas.toBlob((b) => (b ? resolve(b) : reject(new Error("The browser could not encode the PNG."))), "image/png"),
    );
    return new Uint8Array(await png.arrayBuffer());
  } finally {
    URL.revokeObjectURL(url);
  }
}
