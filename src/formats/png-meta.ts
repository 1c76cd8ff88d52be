// PNG metadata for exported rasters: set or read the physical pixel density (the pHYs chunk) and read the
// pixel size (IHDR), so a PNG exported at 300 dpi says so to LaTeX and office tools. Pure: bytes in, bytes out.
import { crc32 } from "./crc32";

/** The eight bytes every PNG starts with (PNG specification, ISO/IEC 15948:2004, §5.2). */
const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a] as const;

/** One inch in metres (exact by definition of the international inch). */
const METRES_PER_INCH = 0.0254;

/** Pixels per metre for a density in dots per inch, rounded to the integer the pHYs chunk stores (300 → 11811). */
export function dpiToPixelsPerMetre(dpi: number): number {
  return Math.round(dpi / METRES_PER_INCH);
}

/** Dots per inch for a density in pixels per metre (11811 → 299.9994). */
export function pixelsPerMetreToDpi(pxPerMetre: number): number {
  return pxPerMetre * METRES_PER_INCH;
}

/** One chunk of a PNG: its 4-letter type, where its length field starts, and its data length in bytes. */
export interface PngChunk {
  type: string;
  /** Byte offset of the chunk's length field; data starts at offset + 8. */
  offset: number;
  /** Length of the data in bytes (without length, type and CRC). */
  length: number;
}

function readU32(b: Uint8Array, at: number): number {
  return ((b[at] << 24) | (b[at + 1] << 16) | (b[at + 2] << 8) | b[at + 3]) >>> 0;
}

function writeU32(b: Uint8Array, at: number, v: number): void {
  b[at] = (v >>> 24) & 0xff;
  b[at + 1] = (v >>> 16) & 0xff;
  b[at + 2] = (v >>> 8) & 0xff;
  b[at + 3] = v & 0xff;
}

/** True when the bytes start with the PNG signature. */
export function isPng(bytes: Uint8Array): boolean {
  return bytes.length >= 8 && PNG_SIGNATURE.every((v, i) => bytes[i] === v);
}

/** The chunks of a PNG in file order, up to and including IEND. Throws on a truncated or non-PNG input. */
export function listPngChunks(png: Uint8Array): PngChunk[] {
  if (!isPng(png)) throw new Error("not a PNG file (signature missing)");
  const chunks: PngChunk[] = [];
  let at = 8;
  while (at + 12 <= png.length) {
    const length = readU32(png, at);
    const type = String.fromCharCode(png[at + 4], png[at + 5], png[at + 6], png[at + 7]);
    if (at + 12 + length > png.length) throw new Error(`PNG chunk ${type} at byte ${at} runs past the end of the file`);
    chunks.push({ type, offset: at, length });
    at += 12 + length;
    if (type === "IEND") return chunks;
  }
  throw new Error("PNG file has no IEND chunk (truncated?)");
}

/** Builds one complete chunk (length, type, data, CRC over type + data). */
function makeChunk(type: string, data: Uint8Array): Uint8Array {
  const out = new Uint8Array(12 + data.length);
  writeU32(out, 0, data.length);
  for (let i = 0; i < 4; i++) out[4 + i] = type.charCodeAt(i);
  out.set(data, 8);
  writeU32(out, 8 + data.length, crc32(out, 4, 8 + data.length));
  return out;
}

/**
 * A copy of the PNG with its pixel density set to `dpi` in both directions: any existing pHYs chunk is
 * dropped and a new one (unit: metre) is placed right after IHDR, which satisfies the rule that pHYs comes
 * before the first IDAT (ISO/IEC 15948 §5.6). The image data is untouched.
 * @param dpi dots per inch, > 0.
 */
export function setPngDpi(png: Uint8Array, dpi: number): Uint8Array {
  if (!(dpi > 0) || !Number.isFinite(dpi)) throw new Error(`dpi must be a positive number, got ${dpi}`);
  const chunks = listPngChunks(png);
  if (chunks[0]?.type !== "IHDR") throw new Error("PNG file does not start with IHDR");
  const ppm = dpiToPixelsPerMetre(dpi);
  const data = new Uint8Array(9);
  writeU32(data, 0, ppm);
  writeU32(data, 4, ppm);
  data[8] = 1; // unit specifier 1 = the metre
  const phys = makeChunk("pHYs", data);
  const kept = chunks.filter((c) => c.type !== "pHYs");
  const keptBytes = kept.reduce((n, c) => n + 12 + c.length, 0);
  const out = new Uint8Array(8 + keptBytes + phys.length);
  out.set(png.subarray(0, 8), 0);
  let at = 8;
  for (const c of kept) {
    out.set(png.subarray(c.offset, c.offset + 12 + c.length), at);
    at += 12 + c.length;
    if (c.type === "IHDR") {
      out.set(phys, at);
      at += phys.length;
    }
  }
  return out;
}

/** Pixel density stored in a PNG's pHYs chunk. */
export interface PngDensity {
  pxPerUnitX: number;
  pxPerUnitY: number;
  /** "metre" when the unit specifier is 1; otherwise only the aspect ratio is known. */
  unit: "metre" | "unknown";
  /** Dots per inch (only when unit = "metre"). */
  dpiX?: number;
  dpiY?: number;
}

/** The PNG's pHYs density, or undefined when it has none. Throws on a non-PNG input. */
export function readPngDpi(png: Uint8Array): PngDensity | undefined {
  const c = listPngChunks(png).find((k) => k.type === "pHYs");
  if (!c || c.length !== 9) return undefined;
  const d = c.offset + 8;
  const x = readU32(png, d);
  const y = readU32(png, d + 4);
  const metre = png[d + 8] === 1;
  return metre
    ? { pxPerUnitX: x, pxPerUnitY: y, unit: "metre", dpiX: pixelsPerMetreToDpi(x), dpiY: pixelsPerMetreToDpi(y) }
    : { pxPerUnitX: x, pxPerUnitY: y, unit: "unknown" };
}

/** Width and height in pixels from the IHDR chunk. Throws on a non-PNG input. */
export function readPngSize(png: Uint8Array): { widthPx: number; heightPx: number } {
  const c = listPngChunks(png)[0];
  if (c?.type !== "IHDR") throw new Error("PNG file does not start with IHDR");
  return { widthPx: readU32(png, c.offset + 8), heightPx: readU32(png, c.offset + 12) };
}

/** True when every chunk's stored CRC matches its type + data (a cheap integrity check for tests and tools). */
export function pngChunksValid(png: Uint8Array): boolean {
  return listPngChunks(png).every(
    (c) => crc32(png, c.offset + 4, c.offset + 8 + c.length) === readU32(png, c.offset + 8 + c.length),
  );
}
