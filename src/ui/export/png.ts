// Rasterises an exported SVG figure to PNG in the browser (Image of a blob URL drawn into a canvas) and
// works out the pixel size for 1×, 2× and 300 dpi from the SVG's own viewBox and physical size.

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

const INCHES_PER_UNIT: Record<string, number> = { cm: 1 / 2.54, mm: 1 / 25.4, in: 1, pt: 1 / 72, pc: 1 / 6, px: 1 / 96, "": 1 / 96 };

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
  const vb = (rootAttribute(svgText, "viewBox") ?? "").trim().split(/[\s,]+/).map(Number);
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
