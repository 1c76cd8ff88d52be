// Export menu in jsdom: the SVG download is exactly exportFigureSvg(project, { preset, embedProject: true })
// (so screen, export and CLI share one writer), names the file after the project, escapes labels, and
// reopens as the project; the preset choice is stored in Figure.preset; PNG sizes follow the physical size
// (1 in = 2.54 cm exactly, international inch of 1959; 96 CSS px per inch, CSS Values and Units Level 3).
import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import { fireEvent, render, screen, waitFor } from "@testing-library/react";
import { ExportMenu } from "../../src/ui/export/ExportMenu";
import { pngTarget, svgSize } from "../../src/ui/export/png";
import { useAxband } from "../../src/ui/store";
import { defaultProject } from "../../src/data";
import { exportFigureSvg } from "../../src/formats/figure-file";
import { extractProjectFromSvg } from "../../src/formats/figure-read";
import { captureDownloads, useProject } from "./export-helpers";

beforeEach(() => useProject({ ...defaultProject(), name: "Export test" }));
afterEach(() => vi.restoreAllMocks());

describe("SVG export", () => {
  test("downloads exportFigureSvg's text with the project embedded, labels escaped", async () => {
    const downloads = captureDownloads();
    const id = useAxband.getState().project.models[0].id;
    useAxband.getState().updateModel(id, { label: `<script>alert(1)</script> "><img src=x onerror=alert(1)>` });
    render(<ExportMenu />);
    fireEvent.click(screen.getByTestId("export-svg"));
    await waitFor(() => expect(downloads).toHaveLength(1));
    expect(downloads[0].fileName).toBe("Export test.svg");
    expect(downloads[0].blob.type).toBe("image/svg+xml");
    const text = await downloads[0].text();
    const project = useAxband.getState().project;
    expect(text).toBe(exportFigureSvg(project, { preset: project.figure.preset, embedProject: true }));
    expect(text).not.toMatch(/<script|<img/i);
    expect(text).toContain("&lt;script&gt;alert(1)&lt;/script&gt;");
    const back = extractProjectFromSvg(text);
    expect(back.ok && back.project.models[0].label).toBe(project.models[0].label);
  });

  test("the preset menu sets Figure.preset and the SVG takes its physical width", async () => {
    const downloads = captureDownloads();
    render(<ExportMenu />);
    fireEvent.click(screen.getByTestId("export-menu"));
    fireEvent.change(screen.getByLabelText("Figure size preset"), { target: { value: "double-column" } });
    expect(useAxband.getState().project.figure.preset).toBe("double-column");
    fireEvent.click(screen.getByTestId("export-svg"));
    await waitFor(() => expect(downloads).toHaveLength(1));
    expect(await downloads[0].text()).toMatch(/<svg[^>]*\swidth="17\.8cm"/);
    fireEvent.change(screen.getByLabelText("Figure size preset"), { target: { value: "custom" } });
    fireEvent.change(screen.getByLabelText("width"), { target: { value: "120" } });
    expect(useAxband.getState().project.figure.customWidthMm).toBe(120);
  });

  test("model lines and bands download as CSV", async () => {
    const downloads = captureDownloads();
    render(<ExportMenu />);
    fireEvent.click(screen.getByTestId("export-menu"));
    fireEvent.click(screen.getByTestId("export-model-csv"));
    await waitFor(() => expect(downloads).toHaveLength(1));
    expect(downloads[0].fileName).toBe("Export test-models.csv");
    expect(await downloads[0].text()).toContain("m_a [eV],f_a [GeV],g_low [GeV^-1],g_high [GeV^-1]");
  });
});

describe("PNG sizes", () => {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="8.6cm" height="6.45cm" viewBox="0 0 325.04 243.78"></svg>`;
  test("reads the viewBox and the physical size", () => {
    const s = svgSize(svg);
    expect(s.widthPx).toBeCloseTo(325.04, 10);
    expect(s.widthIn).toBeCloseTo(8.6 / 2.54, 12);
    expect(s.heightIn).toBeCloseTo(6.45 / 2.54, 12);
  });
  test("1× is the viewBox at 96 px/in, 2× doubles it, 300 dpi uses the physical size", () => {
    const s = svgSize(svg);
    expect(pngTarget(s, "1x")).toMatchObject({ widthPx: 325, heightPx: 244 });
    expect(pngTarget(s, "2x")).toMatchObject({ widthPx: 650, heightPx: 488 });
    const t = pngTarget(s, "300dpi");
    expect(t).toMatchObject({
      widthPx: Math.round((8.6 / 2.54) * 300),
      heightPx: Math.round((6.45 / 2.54) * 300),
      dpi: 300,
    });
    // 2× of a scene at 96 px/in is 192 dpi at the physical size.
    expect(pngTarget(s, "2x").dpi).toBeCloseTo(650 / (8.6 / 2.54), 9);
  });
});

describe("file names", () => {
  test("a project that kept the demo's name but none of its content exports as axband-figure", async () => {
    const downloads = captureDownloads();
    useProject({ ...defaultProject(), models: [], curves: [] });
    render(<ExportMenu />);
    fireEvent.click(screen.getByTestId("export-svg"));
    await waitFor(() => expect(downloads).toHaveLength(1));
    expect(downloads[0].fileName).toBe("axband-figure.svg");
  });

  test("the name is editable in the export menu and names the next export", async () => {
    const downloads = captureDownloads();
    render(<ExportMenu />);
    fireEvent.click(screen.getByTestId("export-menu"));
    fireEvent.change(screen.getByRole("textbox", { name: "Project name" }), { target: { value: "Cavity run 3" } });
    fireEvent.click(screen.getByTestId("export-svg"));
    await waitFor(() => expect(downloads).toHaveLength(1));
    expect(downloads[0].fileName).toBe("Cavity run 3.svg");
  });
});
