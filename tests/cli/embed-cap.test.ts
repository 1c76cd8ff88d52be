// The renderer with curve data too large to embed (over the 2 MB cap of src/formats/figure-file.ts): it says so on
// stderr and in its report, writes the same SVG as the in-process export, and that SVG still renders again.
import { describe, expect, it } from "vitest";
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { parseArgs } from "../../src/cli/args";
import { loadCsvProject } from "../../src/cli/inputs";
import { AXBAND_PROJECT_NS, exportFigureSvg } from "../../src/formats/figure-file";
import { extractProjectFromSvg } from "../../src/formats/figure-read";
import { parseXml } from "./svg-checks";
import { tempDir, runRender as run } from "./fixtures";

describe("render with curve data over the embedding cap", () => {
  it("embeds models and figure only, says so, and matches the in-process export byte for byte", async () => {
    const dir = tempDir();
    const csv = join(dir, "big-scan.csv");
    // 120,000 invented full-precision points: ~2.6 MB as a link, over the 2 MB cap.
    let s = 777;
    const rnd = () => (s = (s * 48271) % 2147483647) / 2147483647;
    const rows = ["# invented test curve", "mass_eV,g_GeV^-1"];
    for (let i = 0; i < 120_000; i++)
      rows.push(`${1e-6 * (1 + (9 * i) / 120_000) * (1 + 1e-9 * rnd())},${1e-13 * (1 + rnd())}`);
    writeFileSync(csv, rows.join("\n") + "\n");
    const svgPath = join(dir, "big.svg");
    const args = [csv, "-o", svgPath, "--model", "8/3"];
    const r = await run(args);
    expect(r.status).toBe(0);
    expect(r.err).toContain("note: project embedded without curve data (120000 points exceed the 2 MB cap)");
    expect(r.out).toContain("project embedded without curve data)");

    const svg = readFileSync(svgPath, "utf8");
    const el = parseXml(svg).getElementsByTagNameNS(AXBAND_PROJECT_NS, "project")[0];
    expect(el.getAttribute("curves")).toBe("omitted");
    const parsed = parseArgs(args);
    if (!parsed.ok) throw new Error(parsed.error);
    expect(svg).toBe(exportFigureSvg(loadCsvProject(parsed.options).project));

    const back = extractProjectFromSvg(svg);
    expect(back.ok && back.omittedCurveCount).toBe(1);
    expect(back.ok && back.project.models.map((m) => m.eOverNMin)).toEqual(["8/3"]);
    // The reopened project (no curves) renders again.
    expect((await run([svgPath, "-o", join(dir, "again.svg")])).status).toBe(0);
  });
});
