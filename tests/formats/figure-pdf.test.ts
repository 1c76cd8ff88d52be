// The exported PDF figure: the project travels as an attached project file and comes back exactly; damaged,
// truncated or foreign PDFs give a clear message; poppler-utils (an independent PDF reader) sees one page of
// the preset's size, only embedded fonts, every legend entry and both axis titles as text, and the attachment.
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it, onTestFinished } from "vitest";
import { exportFigurePdfWithInfo, extractProjectFromPdf } from "../../src/formats/figure-pdf";
import { nodePdfFonts } from "../../src/cli/pdf-fonts";
import { defaultProject } from "../../src/project/demo";
import { projectsEqual } from "../../src/project/json";
import { restoreProject } from "../../src/project/restore";
import { newCurve } from "../../src/project/defaults";

const fonts = nodePdfFonts("sans");
const opts = { fonts, creator: "axband test" };
const hasPoppler = spawnSync("pdfinfo", ["-v"]).status === 0;

function canonical(p: ReturnType<typeof defaultProject>) {
  const r = restoreProject(p);
  if (!r.ok) throw new Error(r.error);
  return r.project;
}

describe("the project attached to the PDF", () => {
  it("round trip: the demo comes back equal, curve data included", async () => {
    const p = defaultProject();
    const r = await exportFigurePdfWithInfo(p, opts);
    expect(r.embeddedCurves).toBe(true);
    const back = await extractProjectFromPdf(r.pdf);
    expect(back.ok).toBe(true);
    if (back.ok) expect(projectsEqual(back.project, canonical(p))).toBe(true);
  });

  it("over the point cap the attachment carries models, figure and constants, and reopening says so", async () => {
    const p = defaultProject();
    const n = 600_000; // over the 500,000-point cap of the SVG embedding
    const massEv = Float64Array.from({ length: n }, (_, i) => 1e-6 * (1 + i / n));
    const big = newCurve({ label: "Big invented curve", massEv, gInvGeV: massEv.map(() => 1e-12) });
    const r = await exportFigurePdfWithInfo({ ...p, curves: [big] }, opts);
    expect(r.embeddedCurves).toBe(false);
    expect(r.omittedCurves).toEqual(["Big invented curve"]);
    const back = await extractProjectFromPdf(r.pdf);
    expect(back.ok && back.project.curves.length).toBe(0);
    expect(back.ok && back.note).toMatch(/without the data of its curve/);
  });

  it("refuses what is not an axband PDF, truncated or damaged, with a sentence and no throw", async () => {
    const r = await exportFigurePdfWithInfo(defaultProject(), opts);
    const noProject = await exportFigurePdfWithInfo(defaultProject(), { ...opts, embedProject: false });
    expect(await extractProjectFromPdf(new TextEncoder().encode("hello"))).toEqual({
      ok: false,
      error: "this is not a PDF file",
    });
    const foreign = await extractProjectFromPdf(noProject.pdf);
    expect(foreign.ok ? "" : foreign.error).toMatch(/carries no axband project/);
    const cut = await extractProjectFromPdf(r.pdf.subarray(0, Math.floor(r.pdf.length / 3)));
    expect(cut.ok).toBe(false);
    const flipped = r.pdf.slice();
    for (let i = 2000; i < flipped.length; i += 997) flipped[i] ^= 0x55;
    const damaged = await extractProjectFromPdf(flipped);
    expect(damaged.ok).toBe(false);
  });

  it("the demo PDF is at most twice the size of the demo SVG (subset fonts, compressed streams)", async () => {
    const { exportFigureSvg } = await import("../../src/formats/figure-file");
    const p = defaultProject();
    const pdf = (await exportFigurePdfWithInfo(p, opts)).pdf;
    expect(pdf.length).toBeLessThanOrEqual(2 * Buffer.byteLength(exportFigureSvg(p)));
  });
});

describe.skipIf(!hasPoppler)("read by poppler-utils (pdfinfo, pdffonts, pdftotext, pdfdetach)", () => {
  it("single column: one page of 8.6 cm = 243.78 pt width (±0.5 pt), embedded subset fonts, the project attached", async () => {
    const dir = mkdtempSync(join(tmpdir(), "axband-pdf-"));
    onTestFinished(() => rmSync(dir, { recursive: true, force: true }));
    const file = join(dir, "demo.pdf");
    const p = defaultProject();
    writeFileSync(file, (await exportFigurePdfWithInfo(p, { ...opts, preset: "single-column" })).pdf);
    const info = execFileSync("pdfinfo", [file], { encoding: "utf8" });
    expect(info).toMatch(/Pages:\s+1/);
    const m = /Page size:\s+([\d.]+) x ([\d.]+) pts/.exec(info);
    // 8.6 cm / 2.54 cm per inch × 72 pt per inch = 243.78 pt.
    expect(Math.abs(Number(m?.[1]) - 243.78)).toBeLessThanOrEqual(0.5);
    const fontsList = execFileSync("pdffonts", [file], { encoding: "utf8" }).split("\n").slice(2).filter(Boolean);
    expect(fontsList.length).toBeGreaterThan(0);
    for (const line of fontsList) expect(line).toMatch(/\syes\s+yes\s+yes\s/); // emb, sub, uni
    expect(execFileSync("pdfdetach", ["-list", file], { encoding: "utf8" })).toMatch(/\.axband\.json/);
  });

  it("slide: pdftotext finds both axis titles and every legend entry", async () => {
    const dir = mkdtempSync(join(tmpdir(), "axband-pdf-"));
    onTestFinished(() => rmSync(dir, { recursive: true, force: true }));
    const file = join(dir, "demo.pdf");
    const p = defaultProject();
    writeFileSync(file, (await exportFigurePdfWithInfo(p, { ...opts, preset: "slide" })).pdf);
    const text = execFileSync("pdftotext", ["-raw", file, "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
    expect(text).toContain("[eV]");
    expect(text).toContain("[GeV");
    for (const m of p.models) expect(text).toContain(m.label);
    for (const c of p.curves) expect(text).toContain(c.label);
  });
});
