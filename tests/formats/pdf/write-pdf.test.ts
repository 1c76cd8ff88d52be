// The PDF writer against the PDF specification (ISO 32000-1:2008, PDF 1.7) and against the SVG writer of the
// same scene: page size, the y-flip into scene pixels, paths and clipping, opacity, dashes, text positions,
// embedded subset fonts, metadata without dates, and byte-identical output.
import { inflateSync } from "fflate";
import { PDFDocument, PDFName, PDFRawStream, PDFDict, PDFArray } from "pdf-lib";
import { describe, expect, it } from "vitest";
import { writePdf, PT_PER_PX } from "../../../src/formats/pdf/write-pdf";
import { parsePathData } from "../../../src/formats/pdf/path-data";
import { colourRgb } from "../../../src/formats/pdf/colour";
import { nodePdfFonts } from "../../../src/cli/pdf-fonts";
import { textPlacement } from "../../../src/plot/svg";
import type { Scene } from "../../../src/plot/scene-types";

const fonts = nodePdfFonts("sans");

function scene(): Scene {
  return {
    widthPx: 400,
    heightPx: 200,
    plot: { x: 50, y: 20, w: 300, h: 150 },
    scales: { massDomainEv: [1e-6, 1e-3], yDomain: [1e-16, 1e-10] },
    fontFamily: "sans-serif",
    layers: [
      { id: "background", clip: false, nodes: [{ kind: "rect", x: 0, y: 0, w: 400, h: 200, fill: "#ffffff" }] },
      {
        id: "curves",
        clip: true,
        nodes: [
          {
            kind: "path",
            d: "M50 100l10-5h20v10Z",
            fill: "#d55e00",
            fillOpacity: 0.35,
            stroke: "#d55e00",
            strokeWidth: 1.5,
          },
          { kind: "path", d: "M60 150L340 40", stroke: "#0072b2", strokeWidth: 2, dash: "6 3" },
        ],
      },
      {
        id: "axes",
        clip: false,
        nodes: [
          {
            kind: "text",
            x: 200,
            y: 195,
            runs: [{ text: "m" }, { text: "a", shift: "sub" }, { text: " [eV]" }],
            sizePx: 12,
            anchor: "middle",
            baseline: "alphabetic",
          },
          {
            kind: "text",
            x: 12,
            y: 95,
            runs: [{ text: "g" }, { text: "aγγ", shift: "sub" }, { text: " ≤ 10" }, { text: "−9", shift: "sup" }],
            sizePx: 12,
            anchor: "middle",
            baseline: "middle",
            rotate: -90,
          },
        ],
      },
    ],
  };
}

async function contentOf(pdf: Uint8Array): Promise<{ doc: PDFDocument; content: string }> {
  const doc = await PDFDocument.load(pdf);
  const page = doc.getPage(0);
  const contents = page.node.lookup(PDFName.of("Contents"));
  const streams = contents instanceof PDFArray ? contents.asArray().map((r) => doc.context.lookup(r)) : [contents];
  let content = "";
  for (const s of streams) {
    if (!(s instanceof PDFRawStream)) continue;
    const filter = s.dict.lookup(PDFName.of("Filter"));
    content += new TextDecoder("latin1").decode(filter ? inflateSync(s.contents.subarray(2)) : s.contents);
  }
  return { doc, content };
}

describe("path data (SVG 1.1 §8.3 path grammar)", () => {
  it("reads the compact relative form the path writer writes, including '.5.5' as two numbers", () => {
    expect(parsePathData("M10 20l.5.5h-1.5v2Z")).toEqual([
      { op: "M", x: 10, y: 20 },
      { op: "L", x: 10.5, y: 20.5 },
      { op: "L", x: 9, y: 20.5 },
      { op: "L", x: 9, y: 22.5 },
      { op: "Z" },
    ]);
  });
  it("treats pairs after a move as line-tos (SVG 1.1 §8.3.2) and stops at anything that is not path data", () => {
    expect(parsePathData("M0 0 10 0 10 10")).toHaveLength(3);
    expect(parsePathData("M0 0L5 5Z 3")).toHaveLength(3);
    expect(parsePathData("M0 0Lx")).toEqual([{ op: "M", x: 0, y: 0 }]);
  });
});

describe("colours (CSS Color Module Level 4)", () => {
  it("hex, short hex, rgb() and hsl() give the same RGB as the CSS definitions", () => {
    expect(colourRgb("#ff8000")).toEqual([1, 128 / 255, 0]);
    expect(colourRgb("#f80")).toEqual([1, 136 / 255, 0]);
    expect(colourRgb("rgb(0, 114, 178)")).toEqual([0, 114 / 255, 178 / 255]);
    // hsl(120, 100%, 25%) = #008000 (CSS Color 4, §7, worked example of pure green at 25 % lightness).
    const g = colourRgb("hsl(120, 100%, 25%)");
    expect(g[0]).toBeCloseTo(0, 10);
    expect(g[1]).toBeCloseTo(0.5, 10);
    expect(colourRgb("url(#x)")).toEqual([0, 0, 0]);
  });
});

describe("writePdf", () => {
  it("one page of the scene's physical size: px × 72/96 pt (CSS: 96 px per inch; PDF: 72 pt per inch)", async () => {
    const pdf = await writePdf(scene(), { fonts, title: "T", creator: "axband test" });
    const doc = await PDFDocument.load(pdf);
    expect(doc.getPageCount()).toBe(1);
    expect(doc.getPage(0).getSize()).toEqual({ width: 300, height: 150 });
    expect(PT_PER_PX).toBe(0.75);
  });

  it("draws in scene pixels through one y-flipping matrix, clips the plot layer to the plot rectangle", async () => {
    const { content } = await contentOf(await writePdf(scene(), { fonts, title: "T", creator: "c" }));
    expect(content).toMatch(/0\.75 0 0 -0\.75 0 150 cm/);
    // The clipped layer: a rectangle of the plot area, W n (ISO 32000-1 §8.5.4), before the curve paths.
    const clipAt = content.indexOf("50 20 300 150 re\nW\nn");
    expect(clipAt).toBeGreaterThan(0);
    expect(content.indexOf("50 100 m", clipAt)).toBeGreaterThan(clipAt);
    // Relative moves become absolute line-tos: l10-5 → (60, 95), h20 → (80, 95), v10 → (80, 105).
    expect(content).toMatch(/50 100 m\n60 95 l\n80 95 l\n80 105 l\nh/);
  });

  it("fill opacity goes into an ExtGState (ca), dashes into d, joins are bevel (j 2)", async () => {
    const { doc, content } = await contentOf(await writePdf(scene(), { fonts, title: "T", creator: "c" }));
    const res = doc.getPage(0).node.Resources() as PDFDict;
    const gs = res.lookup(PDFName.of("ExtGState"), PDFDict);
    const values = gs.entries().map(([, v]) => doc.context.lookup(v) as PDFDict);
    expect(values.some((d) => String(d.get(PDFName.of("ca"))) === "0.35")).toBe(true);
    expect(content).toMatch(/\[6 3\] 0 d/);
    expect(content).toMatch(/2 j/);
  });

  it("places texts where the SVG writer's wrapping group puts them (same anchor, same rotation)", async () => {
    const s = scene();
    const { content } = await contentOf(await writePdf(s, { fonts, title: "T", creator: "c" }));
    const matrices = [...content.matchAll(/(-?[\d.]+) (-?[\d.]+) (-?[\d.]+) (-?[\d.]+) (-?[\d.]+) (-?[\d.]+) Tm/g)].map(
      (m) => m.slice(1).map(Number),
    );
    const texts = s.layers[2].nodes;
    // The first run of the centred mass-axis title starts left of x = 200 by half the title's width, on the
    // SVG translate's baseline y = 195 (alphabetic baseline, so no offset).
    expect(textPlacement(texts[0] as never)).toBe("translate(200 195)");
    const first = matrices[0];
    expect(first.slice(0, 4)).toEqual([1, 0, 0, -1]);
    expect(first[5]).toBe(195);
    expect(first[4]).toBeLessThan(200);
    expect(first[4]).toBeGreaterThan(200 - 60);
    // The rotated title: matrix (cos −90°, sin −90°, sin −90°, −cos −90°) = (0, −1, −1, 0), its first run on
    // the line x = 12 + baseline offset; the ≤ the main font lacks is drawn from the fallback face.
    const rotated = matrices.find((m) => m[0] === 0 && m[1] === -1 && m[2] === -1 && m[3] === 0);
    expect(rotated).toBeDefined();
    expect(matrices.length).toBeGreaterThanOrEqual(7);
  });

  it("embeds only the faces used, as subsets (ISO 32000-1 §9.6.4 tags), and no dates", async () => {
    const pdf = await writePdf(scene(), { fonts, title: "My figure", creator: "axband 9.9" });
    const raw = new TextDecoder("latin1").decode(pdf);
    const names = [...raw.matchAll(/\/BaseFont \/([A-Z]{6}\+[\w-]+)/g)].map((m) => m[1]);
    expect(new Set(names)).toEqual(new Set(["AXBRGL+CMUSansSerif", "AXBFBK+DejaVuSans"]));
    expect(raw).not.toMatch(/CreationDate|ModDate/);
    const doc = await PDFDocument.load(pdf, { updateMetadata: false });
    expect(doc.getTitle()).toBe("My figure");
    expect(doc.getCreator()).toBe("axband 9.9");
  });

  it("the same scene gives the same bytes", async () => {
    const a = await writePdf(scene(), { fonts, title: "T", creator: "c" });
    const b = await writePdf(scene(), { fonts, title: "T", creator: "c" });
    expect(Buffer.from(a).equals(Buffer.from(b))).toBe(true);
  });
});
