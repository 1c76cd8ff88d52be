// The renderer's PDF output and input: `-o figure.pdf` writes the vector PDF with the project attached, and
// that PDF, given back as input, redraws the very same figure (checked against the SVG of the same project).
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { parseArgs } from "../../src/cli/args";
import { tempDir, runRender as run } from "./fixtures";

describe("render -o FILE.pdf", () => {
  it("writes a PDF that reopens as the same project: its SVG equals the one rendered from the project file", async () => {
    const dir = tempDir();
    const pdf = join(dir, "demo.pdf");
    const r = await run(["public/demo.axband.json", "-o", pdf, "--preset", "single-column"]);
    expect(r.status).toBe(0);
    expect(r.out).toMatch(/wrote .*demo\.pdf \(.*8\.6cm × .*project attached\)/);
    expect(readFileSync(pdf).subarray(0, 5).toString("latin1")).toBe("%PDF-");
    const fromPdf = join(dir, "from-pdf.svg");
    const fromProject = join(dir, "from-project.svg");
    expect((await run([pdf, "-o", fromPdf])).status).toBe(0);
    expect((await run(["public/demo.axband.json", "-o", fromProject, "--preset", "single-column"])).status).toBe(0);
    expect(readFileSync(fromPdf, "utf8")).toBe(readFileSync(fromProject, "utf8"));
  });

  it("a PDF that is not axband's is refused with one line and nothing is written", async () => {
    const dir = tempDir();
    const foreign = join(dir, "foreign.pdf");
    writeFileSync(foreign, "%PDF-1.7\n% not really a PDF\n");
    const r = await run([foreign, "-o", join(dir, "x.svg")]);
    expect(r.status).toBe(2);
    expect(r.err).toMatch(/foreign\.pdf: this PDF is damaged or incomplete/);
    expect(r.err).toContain("nothing was written");
  });

  it("--font takes sans or serif only", () => {
    expect(parseArgs(["a.csv", "-o", "x.pdf", "--font", "serif"])).toMatchObject({
      ok: true,
      options: { font: "serif" },
    });
    expect(parseArgs(["a.csv", "-o", "x.pdf", "--font", "comic"])).toEqual({
      ok: false,
      error: '--font: expected sans or serif, got "comic"',
    });
  });
});
