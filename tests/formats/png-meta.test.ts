// Tests for the PNG metadata helpers: CRC-32 against published check values and zlib, and pHYs insertion
// into a real PNG rendered by resvg (read back, placed before IDAT, image data untouched, CRCs valid).
import { describe, expect, it } from "vitest";
import { crc32 as zlibCrc32, inflateSync } from "node:zlib";
import fc from "fast-check";
import { Resvg } from "@resvg/resvg-js";
import { crc32 } from "../../src/formats/crc32";
import {
  dpiToPixelsPerMetre,
  listPngChunks,
  pixelsPerMetreToDpi,
  pngChunksValid,
  readPngDpi,
  readPngSize,
  setPngDpi,
} from "../../src/formats/png-meta";

const enc = new TextEncoder();

function renderPng(widthPx: number, heightPx: number): Uint8Array {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${widthPx}" height="${heightPx}"><rect width="50%" height="100%" fill="#0072B2"/></svg>`;
  return new Uint8Array(new Resvg(svg, { font: { loadSystemFonts: false } }).render().asPng());
}

function idatBytes(png: Uint8Array): Uint8Array {
  const parts = listPngChunks(png)
    .filter((c) => c.type === "IDAT")
    .map((c) => png.subarray(c.offset + 8, c.offset + 8 + c.length));
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let at = 0;
  for (const p of parts) {
    out.set(p, at);
    at += p.length;
  }
  return out;
}

describe("crc32", () => {
  it("gives the CRC-32 check value for '123456789'", () => {
    // Check value 0xCBF43926 of CRC-32 (ISO-HDLC / PNG / zlib): G. Cook, "Catalogue of parametrised CRC
    // algorithms" (entry CRC-32/ISO-HDLC), from memory; also what zlib returns (next test).
    expect(crc32(enc.encode("123456789"))).toBe(0xcbf43926);
  });

  it("gives the fixed CRC of the IEND chunk", () => {
    // IEND is always the 12 bytes 00 00 00 00 49 45 4E 44 AE 42 60 82 (ISO/IEC 15948:2004 §11.2.5 with
    // Annex D's CRC), from memory.
    expect(crc32(enc.encode("IEND"))).toBe(0xae426082);
  });

  it("agrees with zlib's crc32 on arbitrary bytes and sub-ranges", () => {
    // Reference implementation: zlib's crc32 as exposed by Node's node:zlib module.
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 2000 }), fc.nat(), fc.nat(), (bytes, a, b) => {
        expect(crc32(bytes)).toBe(zlibCrc32(bytes));
        const lo = bytes.length ? a % bytes.length : 0;
        const hi = bytes.length ? lo + (b % (bytes.length - lo + 1)) : 0;
        expect(crc32(bytes, lo, hi)).toBe(zlibCrc32(bytes.subarray(lo, hi)));
      }),
      { numRuns: 200 },
    );
  });
});

describe("dpi conversion", () => {
  it("turns 300 dpi into 11811 px/m and 96 dpi into 3780 px/m", () => {
    // 1 in = 0.0254 m exactly (international yard and pound agreement, 1959): 300/0.0254 = 11811.02,
    // 96/0.0254 = 3779.53 — the pHYs field is an integer (ISO/IEC 15948 §11.3.5.3).
    expect(dpiToPixelsPerMetre(300)).toBe(11811);
    expect(dpiToPixelsPerMetre(96)).toBe(3780);
    expect(dpiToPixelsPerMetre(600)).toBe(23622);
    expect(pixelsPerMetreToDpi(11811)).toBeCloseTo(300, 2);
  });
});

describe("setPngDpi on a PNG rendered by resvg", () => {
  const png = renderPng(37, 21);

  it("reads the pixel size from IHDR", () => {
    expect(readPngSize(png)).toEqual({ widthPx: 37, heightPx: 21 });
  });

  it("sets a pHYs chunk that reads back as 300 dpi in metres", () => {
    const out = setPngDpi(png, 300);
    const d = readPngDpi(out);
    expect(d).toBeDefined();
    expect(d?.unit).toBe("metre");
    expect(d?.pxPerUnitX).toBe(11811);
    expect(d?.pxPerUnitY).toBe(11811);
    expect(d?.dpiX).toBeCloseTo(300, 2);
  });

  it("puts pHYs after IHDR and before the first IDAT, keeps every CRC valid (checked with zlib)", () => {
    const out = setPngDpi(png, 300);
    const types = listPngChunks(out).map((c) => c.type);
    expect(types[0]).toBe("IHDR");
    expect(types.indexOf("pHYs")).toBeLessThan(types.indexOf("IDAT"));
    expect(types.at(-1)).toBe("IEND");
    expect(pngChunksValid(out)).toBe(true);
    for (const c of listPngChunks(out)) {
      const stored = new DataView(out.buffer, out.byteOffset + c.offset + 8 + c.length, 4).getUint32(0);
      expect(stored).toBe(zlibCrc32(out.subarray(c.offset + 4, c.offset + 8 + c.length)));
    }
  });

  it("replaces an existing pHYs instead of adding a second one", () => {
    const twice = setPngDpi(setPngDpi(png, 72), 600);
    expect(listPngChunks(twice).filter((c) => c.type === "pHYs")).toHaveLength(1);
    expect(readPngDpi(twice)?.pxPerUnitX).toBe(23622);
    expect(twice.length).toBe(setPngDpi(png, 600).length);
  });

  it("leaves the image data untouched", () => {
    const out = setPngDpi(png, 300);
    expect(Buffer.from(inflateSync(idatBytes(out))).equals(Buffer.from(inflateSync(idatBytes(png))))).toBe(true);
    expect(readPngSize(out)).toEqual(readPngSize(png));
  });

  it("rejects non-PNG input and non-positive dpi", () => {
    expect(() => setPngDpi(enc.encode("GIF89a not a png"), 300)).toThrow(/not a PNG/);
    expect(() => setPngDpi(png, 0)).toThrow(/dpi/);
    expect(() => listPngChunks(png.subarray(0, png.length - 6))).toThrow();
  });
});
