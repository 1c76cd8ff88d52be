// The PDF and the PNG export draw the same figure: the demo at the single-column preset, written as PDF and
// rendered by poppler's pdftoppm at 150 dpi (an independent PDF renderer), against the PNG path (resvg at
// 150 dpi with the same font files). Measure, on greyscale (ITU-R BT.601 luma weights 0.299/0.587/0.114)
// after a 3 × 3 box average of each image (the renderers anti-alias edges differently, poppler snaps thin
// strokes to the pixel grid): the mean absolute difference per pixel, and the share of pixels differing by
// more than 64/255. Measured when written (poppler 22, resvg 2.6), sans: mean 3.0/255, 0.20 %; serif:
// 2.7/255, 0.14 % (unaveraged: 6.6/255 and 3.5 %). Thresholds: mean ≤ 5/255 and share ≤ 1 %. A control pair
// (the same PDF against the PNG of the figure without its legend: mean 8.8/255, 3.7 %) must fail both, so
// the thresholds can see a real difference.
// Skipped with a note when poppler-utils is not installed (CI installs it).
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { exportFigurePdfWithInfo } from "../../src/formats/figure-pdf";
import { exportFigureSvg, rasterResolution } from "../../src/formats/figure-file";
import { nodePdfFonts } from "../../src/cli/pdf-fonts";
import { pngPixelSize, rasterise } from "../../src/cli/png";
import { defaultProject } from "../../src/project/demo";
import { presetOf } from "../../src/plot/layout";
import type { Project } from "../../src/project/types";

const DPI = 150;
const MEAN_MAX = 5;
const SHARE_MAX = 0.01;
const hasPoppler = spawnSync("pdftoppm", ["-v"]).status === 0;
if (!hasPoppler) console.warn("note: pdftoppm (poppler-utils) not found; the PDF/PNG pixel comparison is skipped");
const dir = mkdtempSync(join(tmpdir(), "axband-pixels-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

interface Grey {
  w: number;
  h: number;
  px: Uint8Array;
}

async function pdfGrey(p: Project): Promise<Grey> {
  const r = await exportFigurePdfWithInfo(p, { fonts: nodePdfFonts(p.figure.font), creator: "axband test" });
  const file = join(dir, "figure.pdf");
  writeFileSync(file, r.pdf);
  const pgm = execFileSync("pdftoppm", ["-r", String(DPI), "-gray", "-singlefile", file], { maxBuffer: 1 << 26 });
  const head = /^P5\s+(\d+)\s+(\d+)\s+255\s/.exec(pgm.subarray(0, 40).toString("latin1"));
  if (!head) throw new Error("pdftoppm did not write a binary PGM");
  const w = Number(head[1]);
  const h = Number(head[2]);
  return { w, h, px: new Uint8Array(pgm.subarray(head[0].length, head[0].length + w * h)) };
}

function pngGrey(p: Project): Grey {
  const size = presetOf(p.figure);
  const { widthPx } = pngPixelSize(size.widthMm / 25.4, size.heightMm / 25.4, DPI);
  const svg = exportFigureSvg(p, { embedProject: false, resolution: rasterResolution(DPI) });
  const img = rasterise(svg, widthPx, p.figure.font);
  const px = new Uint8Array(img.width * img.height);
  const rgba = img.pixels;
  for (let i = 0; i < px.length; i++) {
    px[i] = Math.round(0.299 * rgba[4 * i] + 0.587 * rgba[4 * i + 1] + 0.114 * rgba[4 * i + 2]);
  }
  return { w: img.width, h: img.height, px };
}

/** 3 × 3 box average: renderers place anti-aliased edges up to half a pixel apart; a missing mark survives it. */
function blur(g: Grey): Grey {
  const px = new Uint8Array(g.px.length);
  for (let y = 0; y < g.h; y++) {
    for (let x = 0; x < g.w; x++) {
      let sum = 0;
      let n = 0;
      for (let dy = -1; dy <= 1; dy++) {
        for (let dx = -1; dx <= 1; dx++) {
          const yy = y + dy;
          const xx = x + dx;
          if (yy < 0 || yy >= g.h || xx < 0 || xx >= g.w) continue;
          sum += g.px[yy * g.w + xx];
          n++;
        }
      }
      px[y * g.w + x] = Math.round(sum / n);
    }
  }
  return { ...g, px };
}

/** Mean |Δgrey| (0–255) and share of pixels with |Δgrey| > 64 over the common area. */
function compare(a: Grey, b: Grey): { mean: number; share: number } {
  const w = Math.min(a.w, b.w);
  const h = Math.min(a.h, b.h);
  let sum = 0;
  let big = 0;
  for (let y = 0; y < h; y++) {
    for (let x = 0; x < w; x++) {
      const d = Math.abs(a.px[y * a.w + x] - b.px[y * b.w + x]);
      sum += d;
      if (d > 64) big++;
    }
  }
  return { mean: sum / (w * h), share: big / (w * h) };
}

function demoAt(font: Project["figure"]["font"]): Project {
  const p = defaultProject();
  return { ...p, figure: { ...p.figure, preset: "single-column", font } };
}

describe.skipIf(!hasPoppler)("PDF (pdftoppm) against PNG (resvg) at 150 dpi, single column", () => {
  it.each(["sans", "serif"] as const)(
    "%s: same size ±1 px, averaged: mean ≤ 5/255, ≤ 1 percent of pixels off by > 64/255",
    async (font) => {
      const p = demoAt(font);
      const pdf = await pdfGrey(p);
      const png = pngGrey(p);
      expect(Math.abs(pdf.w - png.w)).toBeLessThanOrEqual(1);
      expect(Math.abs(pdf.h - png.h)).toBeLessThanOrEqual(1);
      const d = compare(blur(pdf), blur(png));
      expect(d.mean).toBeLessThanOrEqual(MEAN_MAX);
      expect(d.share).toBeLessThanOrEqual(SHARE_MAX);
    },
  );

  it("the measure sees a real difference: the PDF against the PNG of the figure without its legend fails", async () => {
    const p = demoAt("sans");
    const noLegend = { ...p, figure: { ...p.figure, legend: "hidden" as const } };
    const d = compare(blur(await pdfGrey(p)), blur(pngGrey(noLegend)));
    expect(d.mean).toBeGreaterThan(MEAN_MAX);
    expect(d.share).toBeGreaterThan(SHARE_MAX);
  });
});
