// PNG export of the export menu in jsdom, with the browser's rasteriser replaced by resvg (jsdom has no
// canvas): the SVG handed to the rasteriser is the figure thinned for the PNG's pixels, two columns per PNG
// pixel (rasterResolution in src/formats/figure-file.ts, the command-line renderer's rule), without the embedded
// project, and the downloaded PNG has the pixel size and the dpi of the choice. Sources: 1 in = 2.54 cm
// exactly (international inch, 1959); 96 CSS px per inch (W3C CSS Values and Units Level 3); pHYs stores
// pixels per metre with unit specifier 1 (PNG specification, ISO/IEC 15948:2004, §11.3.5.3); thinning to
// first/min/max/last per pixel column keeps the drawn line within about one column of the data (common practice).
import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import { fireEvent, render, screen, waitFor } from "@testing-library/react";
import { Resvg } from "@resvg/resvg-js";
import { ExportMenu } from "../../src/ui/export/ExportMenu";
import { pngFigure, presetSvgSize, rasteriseSvg, svgSize } from "../../src/ui/export/png";
import { useAxband } from "../../src/ui/store";
import { defaultProject, newCurve } from "../../src/data";
import type { Project } from "../../src/project/types";
import { AXBAND_PROJECT_NS, EXPORT_RESOLUTION, exportFigureSvg, rasterResolution } from "../../src/formats/figure-file";
import { presetOf } from "../../src/plot/layout";
import { pngChunksValid, readPngDpi, readPngSize } from "../../src/formats/png-meta";
import { captureDownloads, useProject, type CapturedDownload } from "./export-helpers";

// The browser's Image + canvas rasteriser, replaced by resvg at the requested width (the height follows
// the viewBox's aspect ratio, as in the browser, where the pixel size is written onto the root element).
vi.mock("../../src/ui/export/png", async (importOriginal) => {
  const actual = await importOriginal<typeof import("../../src/ui/export/png")>();
  return {
    ...actual,
    rasteriseSvg: vi.fn((svg: string, widthPx: number) =>
      Promise.resolve(
        new Uint8Array(
          new Resvg(svg, {
            fitTo: { mode: "width", value: widthPx },
            background: "#ffffff",
            font: { loadSystemFonts: false },
            logLevel: "off",
          })
            .render()
            .asPng(),
        ),
      ),
    ),
  };
});
const raster = vi.mocked(rasteriseSvg);

const CM_PER_IN = 2.54;

/** An invented dense scan: 30,000 sorted masses over 1–100 μeV, couplings scattered by a seeded generator. */
function denseProject(): Project {
  let s = 7;
  const rnd = () => (s = (s * 48271) % 2147483647) / 2147483647;
  const n = 30_000;
  const dense = newCurve({
    id: "dense",
    label: "Dense scan (invented)",
    massEv: Float64Array.from({ length: n }, (_, i) => 1e-6 * 10 ** ((2 * i) / n)),
    gInvGeV: Float64Array.from({ length: n }, () => 1e-13 * (1 + rnd())),
  });
  const p = defaultProject();
  return { ...p, name: "PNG test", curves: [dense], figure: { ...p.figure, preset: "single-column" } };
}

/** Vertices of the dense curve's path (one per path command; the writer uses M, l, h, v). */
function curveVertices(svg: string): number {
  const d = /<path id="[^"]*curve[^"]*" d="([^"]*)"/.exec(svg)?.[1] ?? "";
  return (d.match(/[MLHVmlhv]/g) ?? []).length;
}

async function bytesOf(d: CapturedDownload): Promise<Uint8Array> {
  const blob = d.blob;
  if (typeof blob.arrayBuffer === "function") return new Uint8Array(await blob.arrayBuffer());
  return new Promise((resolve, reject) => {
    const r = new FileReader();
    r.onload = () => resolve(new Uint8Array(r.result as ArrayBuffer));
    r.onerror = () => reject(r.error);
    r.readAsArrayBuffer(blob);
  });
}

async function exportPng(
  scale: "1x" | "2x" | "300dpi",
): Promise<{ svg: string; widthPx: number; heightPx: number; png: Uint8Array; fileName: string }> {
  const downloads = captureDownloads();
  render(<ExportMenu />);
  fireEvent.click(screen.getByTestId("export-menu"));
  fireEvent.change(screen.getByLabelText("PNG resolution"), { target: { value: scale } });
  fireEvent.click(screen.getByTestId("export-png"));
  await waitFor(() => expect(downloads).toHaveLength(1));
  expect(raster).toHaveBeenCalledTimes(1);
  const [svg, widthPx, heightPx] = raster.mock.calls[0];
  return { svg, widthPx, heightPx, png: await bytesOf(downloads[0]), fileName: downloads[0].fileName };
}

beforeEach(() => {
  raster.mockClear();
  useProject(denseProject());
});
afterEach(() => vi.restoreAllMocks());

describe("PNG export", () => {
  test("300 dpi: the SVG is thinned at 2·300/96 = 6.25 columns per scene px, without the project; the PNG says 300 dpi", async () => {
    const { svg, widthPx, heightPx, png, fileName } = await exportPng("300dpi");
    const project = useAxband.getState().project;
    expect(rasterResolution(300)).toBeCloseTo((2 * 300) / 96, 12);
    expect(svg).toBe(
      exportFigureSvg(project, { preset: "single-column", embedProject: false, resolution: rasterResolution(300) }),
    );
    expect(svg).not.toContain(AXBAND_PROJECT_NS);
    expect(svg).not.toContain("<metadata>");
    // 8.6 cm × 6.45 cm at 300 dpi.
    expect(widthPx).toBe(Math.round((8.6 / CM_PER_IN) * 300));
    expect(heightPx).toBe(Math.round((6.45 / CM_PER_IN) * 300));
    // The SVG download is thinned at 2 columns per scene px; the raster's has ~6.25/2 times the vertices.
    const forSvgFile = exportFigureSvg(project, { preset: "single-column", embedProject: true });
    expect(curveVertices(forSvgFile)).toBeGreaterThan(100);
    expect(curveVertices(svg) / curveVertices(forSvgFile)).toBeGreaterThan(2.5);
    expect(fileName).toBe("PNG test@300dpi.png");
    expect(pngChunksValid(png)).toBe(true);
    expect(readPngSize(png)).toEqual({ widthPx, heightPx });
    const dpi = readPngDpi(png);
    expect(dpi?.unit).toBe("metre");
    expect(dpi?.pxPerUnitX).toBe(Math.round(300 / 0.0254)); // 11811 px/m
    expect(dpi?.dpiX).toBeCloseTo(300, 2);
  });

  test("2×: two columns per PNG pixel at the 2× dpi (~192), the PNG carries that dpi", async () => {
    const { svg, widthPx, png } = await exportPng("2x");
    const project = useAxband.getState().project;
    const widthIn = 8.6 / CM_PER_IN;
    const dpi = widthPx / widthIn;
    expect(widthPx).toBe(Math.round(presetOf(project.figure).widthPx * 2));
    expect(dpi).toBeCloseTo(192, 0);
    expect(svg).toBe(
      exportFigureSvg(project, { preset: "single-column", embedProject: false, resolution: rasterResolution(dpi) }),
    );
    expect(svg).not.toContain(AXBAND_PROJECT_NS);
    expect(readPngSize(png).widthPx).toBe(widthPx);
    expect(readPngDpi(png)?.pxPerUnitX).toBe(Math.round(dpi / 0.0254));
  });

  test("1×: the screen's 96 dpi needs no more than the SVG file's resolution; the SVG is the file's without the project", async () => {
    const { svg, png } = await exportPng("1x");
    const project = useAxband.getState().project;
    expect(rasterResolution(96)).toBe(EXPORT_RESOLUTION);
    expect(svg).toBe(exportFigureSvg(project, { preset: "single-column", embedProject: false }));
    expect(readPngDpi(png)?.dpiX).toBeCloseTo(96, 0);
  });

  test("the size known before the SVG is built is the built SVG's: exactly for the presets, to 0.01 cm for a custom size", () => {
    const base = denseProject();
    const figures: Project["figure"][] = [
      { ...base.figure, preset: "slide" },
      { ...base.figure, preset: "single-column" },
      { ...base.figure, preset: "double-column" },
      { ...base.figure, preset: "custom", customWidthMm: 123.45, customHeightMm: 67.8 },
    ];
    for (const figure of figures) {
      const project = { ...base, figure };
      const fromFile = svgSize(exportFigureSvg(project, { embedProject: false }));
      const known = presetSvgSize(presetOf(figure));
      const cmOff = (a: number | null, b: number | null) => Math.abs(((a ?? NaN) - (b ?? NaN)) * CM_PER_IN);
      const cmAllowed = figure.preset === "custom" ? 0.01 + 1e-9 : 1e-12;
      expect(known.widthPx).toBeCloseTo(fromFile.widthPx, 9);
      expect(known.heightPx).toBeCloseTo(fromFile.heightPx, 9);
      expect(cmOff(known.widthIn, fromFile.widthIn)).toBeLessThanOrEqual(cmAllowed);
      expect(cmOff(known.heightIn, fromFile.heightIn)).toBeLessThanOrEqual(cmAllowed);
      // So the thinning is the one for the PNG's dpi: exactly for a preset, to ~0.1 % for a custom size.
      for (const scale of ["1x", "2x", "300dpi"] as const) {
        const f = pngFigure(project, scale);
        expect(svgSize(f.svg)).toEqual(fromFile);
        expect(f.resolution / rasterResolution(f.dpi)).toBeCloseTo(1, figure.preset === "custom" ? 2 : 12);
      }
    }
    // Slide: 25.4 cm = 10 in wide.
    expect(presetSvgSize(presetOf({ ...base.figure, preset: "slide" })).widthIn).toBeCloseTo(25.4 / CM_PER_IN, 12);
  });
});
