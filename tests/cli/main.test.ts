// In-process tests of the renderer's main(): the options the child-process tests do not cover (PNG at 2×,
// custom size, title, model CSV, missing output directory), with messages captured instead of printed.
import { describe, expect, it } from "vitest";
import { existsSync, readFileSync, readdirSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { readPngDpi, readPngSize } from "../../src/formats/png-meta";
import { MODEL_CSV_HEADER } from "../../src/formats/model-csv";
import { parseXml, texts } from "./svg-checks";
import { projectFileText, smallProject, tempDir, runRender as run } from "./fixtures";

function projectIn(dir: string): string {
  const path = join(dir, "p.axband.json");
  writeFileSync(path, projectFileText(smallProject()));
  return path;
}

describe("main", () => {
  it("writes a 2× PNG: twice the 96-px-per-inch size, 192 dpi in pHYs", async () => {
    const dir = tempDir();
    const png = join(dir, "f.png");
    const r = await run([projectIn(dir), "--png", png, "--scale", "2", "--preset", "single-column"]);
    expect(r.err).toBe("");
    expect(r.status).toBe(0);
    const bytes = new Uint8Array(readFileSync(png));
    // 8.6 cm = 325.04 CSS px at 96/in (CSS Values and Units Level 3, §5.2); 2× → 650 px.
    expect(readPngSize(bytes).widthPx).toBe(Math.round((8.6 / 2.54) * 96 * 2));
    // 192 dpi = 192 / 0.0254 m = 7559 px/m (ISO/IEC 15948 §11.3.5.3).
    expect(readPngDpi(bytes)?.pxPerUnitX).toBe(7559);
  });

  it("draws a custom size with a title, and writes the model CSV", async () => {
    const dir = tempDir();
    const svg = join(dir, "f.svg");
    const csv = join(dir, "models.csv");
    const r = await run([
      projectIn(dir),
      "-o",
      svg,
      "--preset",
      "custom",
      "--width-mm",
      "120",
      "--height-mm",
      "75",
      "--title",
      "Quick look (invented)",
      "--models-csv",
      csv,
    ]);
    expect(r.status).toBe(0);
    const root = parseXml(readFileSync(svg, "utf8")).documentElement!;
    expect(root.getAttribute("width")).toBe("12cm");
    expect(root.getAttribute("height")).toBe("7.5cm");
    expect(texts(parseXml(readFileSync(svg, "utf8")))).toContain("Quick look (invented)");
    const text = readFileSync(csv, "utf8");
    expect(text.split("\n").filter((l) => l === MODEL_CSV_HEADER)).toHaveLength(2);
    expect(r.out).toMatch(/wrote .*models\.csv/);
  });

  it("writes the overlap summary (.csv, .md, .tex) and its intervals beside the figure", async () => {
    const dir = tempDir();
    const csv = join(dir, "a.csv");
    // A flat limit 1e-15 GeV⁻¹ meets the E/N = 0 line at 2.55212 μeV (worked by hand in
    // tests/analysis/overlap.test.ts from α, c_γ = 1.92 and K = 5.691 μeV): excluded from there to 10 μeV.
    writeFileSync(csv, "1e-6,1e-15\n1e-5,1e-15\n");
    for (const ext of ["csv", "md", "tex"]) {
      const out = join(dir, `overlap.${ext}`);
      const r = await run([csv, "--model", "0", "--overlap", out, "--overlap-intervals", join(dir, `iv-${ext}.csv`)]);
      expect(r.err).toBe("");
      expect(r.status).toBe(0);
      const text = readFileSync(out, "utf8");
      if (ext === "csv") {
        const [header, row] = text.trimEnd().split("\n");
        const cols = header.split(",");
        const cells = row.split(",");
        expect(Number(cells[cols.indexOf("m_a_min_eV")])).toBe(1e-6);
        expect(cells[cols.indexOf("intervals")]).toBe("1");
        // Share in log m: ln(10 μeV/2.55212 μeV)/ln 10 = 0.59312 (by hand).
        expect(Number(cells[cols.indexOf("share_mass")])).toBeCloseTo(0.59312, 4);
      }
      if (ext === "md") expect(text).toMatch(/With c_γ = 1\.92\(4\) and K = 5\.691\(51\) μeV/);
      if (ext === "tex") expect(text).toContain("\\toprule");
      const iv = readFileSync(join(dir, `iv-${ext}.csv`), "utf8")
        .trimEnd()
        .split("\n");
      expect(iv.length).toBe(2);
      expect(Number(iv[1].split(",")[5])).toBeCloseTo(2.55212e-6, 10);
    }
    expect((await run([csv, "--overlap", join(dir, "o.txt")])).status).toBe(2);
  });

  it("writes negative E/N with the minus sign U+2212 in legend, model CSV and overlap text, as the app does", async () => {
    // U+2212 MINUS SIGN, the Unicode Standard's Mathematical Operators block; U+002D is the hyphen-minus.
    const dir = tempDir();
    const csv = join(dir, "a.csv");
    writeFileSync(csv, "1e-6,1e-15\n1e-5,1e-15\n");
    const svg = join(dir, "f.svg");
    const models = join(dir, "models.csv");
    const md = join(dir, "overlap.md");
    const r = await run([
      csv,
      "--model",
      "-10/3",
      "--model=-1..-1/3",
      "-o",
      svg,
      "--models-csv",
      models,
      "--overlap",
      md,
    ]);
    expect(r.err).toBe("");
    expect(r.status).toBe(0);
    const shown = texts(parseXml(readFileSync(svg, "utf8"))).join("\n");
    expect(shown).toContain("E/N = \u221210/3");
    expect(shown).toContain("E/N = \u22121..\u22121/3");
    expect(shown).not.toMatch(/E\/N = -|\.\.-/);
    const modelCsv = readFileSync(models, "utf8");
    expect(modelCsv).toContain("# model: E/N = \u221210/3");
    expect(modelCsv).toContain("# model: E/N = \u22121..\u22121/3");
    const overlap = readFileSync(md, "utf8");
    expect(overlap).toContain("E/N = \u221210/3");
    expect(overlap).not.toMatch(/E\/N = -/);
  });

  it("--legend below puts the legend under the plot; an entry that must be shortened is named on stderr", async () => {
    const dir = tempDir();
    const p = projectIn(dir);
    const out = join(dir, "f.svg");
    const r = await run([p, "-o", out, "--preset", "single-column", "--legend", "below", "--legend-scale", "1.2"]);
    expect(r.status).toBe(0);
    const doc = parseXml(readFileSync(out, "utf8"));
    const box = Array.from(doc.getElementsByTagName("rect")).find((e) => e.getAttribute("id")?.endsWith("legend-box"))!;
    const clip = Array.from(doc.getElementsByTagName("rect")).find((e) => e.parentNode?.nodeName === "clipPath")!;
    // Below: the box starts under the plot area's bottom edge.
    expect(Number(box.getAttribute("y"))).toBeGreaterThan(
      Number(clip.getAttribute("y")) + Number(clip.getAttribute("height")),
    );
    expect(r.err).not.toMatch(/shortened/);
    // A label of one word wider than the legend's room cannot wrap: cut, and the user is told which one.
    const long = smallProject({ model: "Supercalifragilisticexpialidocious-model-with-a-very-long-unbroken-name" });
    writeFileSync(p, projectFileText(long));
    const r2 = await run([p, "-o", out, "--preset", "single-column", "--legend", "outside-right"]);
    expect(r2.status).toBe(0);
    expect(r2.err).toMatch(/note: Legend: .*shortened to fit \(“Supercalifragilistic/);
  });

  it("exits 2 without writing when an output directory does not exist", async () => {
    const dir = tempDir();
    const p = projectIn(dir);
    const r = await run([p, "-o", join(dir, "f.svg"), "--png", join(dir, "no-such-dir", "f.png")]);
    expect(r.status).toBe(2);
    expect(r.err).toMatch(/does not exist/);
    expect(existsSync(join(dir, "f.svg"))).toBe(false);
    expect(readdirSync(dir)).toEqual(["p.axband.json"]);
  });

  it("exits 2 on a bad --model and on a CSV with no data rows", async () => {
    const dir = tempDir();
    const csv = join(dir, "a.csv");
    writeFileSync(csv, "1e-6,1e-13\n1e-5,2e-13\n");
    const bad = await run([csv, "-o", join(dir, "f.svg"), "--model", "eight thirds"]);
    expect(bad.status).toBe(2);
    expect(bad.err).toMatch(/--model eight thirds/);
    const empty = join(dir, "empty.csv");
    writeFileSync(empty, "# nothing here\n");
    const r = await run([empty, "-o", join(dir, "f.svg")]);
    expect(r.status).toBe(2);
    expect(r.err).toMatch(/empty\.csv/);
    expect(existsSync(join(dir, "f.svg"))).toBe(false);
  });

  it("reads CSV units from --mass-unit when the file has no header", async () => {
    const dir = tempDir();
    const csv = join(dir, "ueV.csv");
    writeFileSync(csv, "1,1e-13\n10,2e-13\n100,1e-13\n");
    const svg = join(dir, "f.svg");
    expect((await run([csv, "-o", svg, "--mass-unit", "ueV"])).status).toBe(0);
    // 1–100 μeV = 10⁻⁶–10⁻⁴ eV: the fitted mass axis spans those decades.
    const all = texts(parseXml(readFileSync(svg, "utf8"))).join(" ");
    expect(all).toContain("10−6");
    expect(all).toContain("10−4");
    expect(all).not.toContain("10−8");
  });
});
