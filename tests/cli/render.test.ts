// End-to-end tests of the command-line renderer run as a child process: project and CSV input, SVG checks
// (XML, namespace, size, text, no external references), PNG size and dpi, same bytes as the in-process
// export, bad input (exit 2, nothing written) and an injection corpus that must stay literal text.
import { beforeAll, describe, expect, it } from "vitest";
import { readdirSync, readFileSync, writeFileSync, existsSync } from "node:fs";
import { join } from "node:path";
import { exportFigureSvg } from "../../src/formats/figure-file";
import { extractProjectFromSvg } from "../../src/formats/figure-read";
import { readPngDpi, readPngSize, pngChunksValid } from "../../src/formats/png-meta";
import { projectsEqual } from "../../src/project/json";
import { projectFromFile } from "../../src/formats/project-file";
import {
  INJECTION_CORPUS,
  SVG_NS,
  elementNames,
  parseXml,
  shownLabels,
  texts,
  unsafeParts,
  withCorpusLabels,
} from "./svg-checks";
import { projectFileText, runCli, smallProject, tempDir } from "./fixtures";

/** Length in cm of an SVG length attribute such as "8.6cm" or "86mm". */
function cm(attr: string | null): number {
  const m = /^([\d.]+)(cm|mm|in)$/.exec(attr ?? "");
  if (!m) throw new Error(`not a physical length: ${attr}`);
  return Number(m[1]) * (m[2] === "cm" ? 1 : m[2] === "mm" ? 0.1 : 2.54);
}

describe("render a project file", () => {
  const dir = tempDir();
  const projectPath = join(dir, "small.axband.json");
  const svgPath = join(dir, "figure.svg");
  const pngPath = join(dir, "figure.png");
  let run: ReturnType<typeof runCli>;

  beforeAll(() => {
    writeFileSync(projectPath, projectFileText(smallProject()));
    run = runCli([projectPath, "-o", svgPath, "--png", pngPath, "--dpi", "300", "--preset", "single-column"]);
  });

  it("exits 0 and says what it wrote", () => {
    expect(run.stderr).not.toMatch(/unexpected/);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain(`wrote ${svgPath}`);
    expect(run.stdout).toContain(`wrote ${pngPath}`);
    expect(run.stdout).toMatch(/1016 × \d+ px, 300 dpi/);
  });

  it("writes well-formed SVG in the SVG namespace with a viewBox and the physical single-column width", () => {
    const doc = parseXml(readFileSync(svgPath, "utf8"));
    const root = doc.documentElement!;
    expect(root.localName).toBe("svg");
    expect(root.namespaceURI).toBe(SVG_NS);
    const vb = (root.getAttribute("viewBox") ?? "").split(/[\s,]+/).map(Number);
    expect(vb).toHaveLength(4);
    expect(vb[2]).toBeGreaterThan(0);
    // 8.6 cm: the single-column width of the APS journals (common practice).
    expect(root.getAttribute("width")).toBe("8.6cm");
    // The viewBox is the same size in CSS px at 96 per inch (CSS Values and Units Level 3, §5.2: 1in = 96px).
    expect(vb[2]).toBeCloseTo((cm(root.getAttribute("width")) / 2.54) * 96, 1);
    expect(vb[3]).toBeCloseTo((cm(root.getAttribute("height")) / 2.54) * 96, 1);
  });

  it("keeps axis titles and legend labels as text", () => {
    const all = shownLabels(parseXml(readFileSync(svgPath, "utf8"))).join("\n");
    for (const label of ["DFSZ-type line", "Preferred window", "Demo scan (invented)", "Demo reach (invented)"])
      expect(all).toContain(label);
    expect(all).toMatch(/eV/); // mass axis title unit
    expect(all).toMatch(/GeV/); // coupling axis title unit
  });

  it("has no scripts, handlers or references outside the file", () => {
    expect(unsafeParts(parseXml(readFileSync(svgPath, "utf8")))).toEqual([]);
  });

  it("writes a PNG of physical size × dpi with pHYs = 300 dpi", () => {
    const png = new Uint8Array(readFileSync(pngPath));
    const root = parseXml(readFileSync(svgPath, "utf8")).documentElement!;
    const { widthPx, heightPx } = readPngSize(png);
    // 8.6 cm / 2.54 cm·in⁻¹ × 300 in⁻¹ = 1015.7 → 1016 px (1 in = 2.54 cm exactly).
    expect(widthPx).toBe(1016);
    expect(Math.abs(heightPx - (cm(root.getAttribute("height")) / 2.54) * 300)).toBeLessThanOrEqual(1);
    // 300 dpi = 11811 px/m in the pHYs chunk (ISO/IEC 15948 §11.3.5.3, unit specifier 1 = metre).
    const d = readPngDpi(png);
    expect(d?.unit).toBe("metre");
    expect(d?.pxPerUnitX).toBe(11811);
    expect(d?.pxPerUnitY).toBe(11811);
    expect(pngChunksValid(png)).toBe(true);
  });

  it("gives byte for byte the SVG of the in-process export (what the app's export button uses)", () => {
    const loaded = projectFromFile(readFileSync(projectPath, "utf8"), "small.axband.json");
    expect(loaded.ok).toBe(true);
    if (!loaded.ok) return;
    expect(readFileSync(svgPath, "utf8")).toBe(exportFigureSvg(loaded.project, { preset: "single-column" }));
  });

  it("embeds the project so that it comes back equal, curve data included", () => {
    const back = extractProjectFromSvg(readFileSync(svgPath, "utf8"));
    expect(back.ok).toBe(true);
    if (!back.ok) return;
    const loaded = projectFromFile(readFileSync(projectPath, "utf8"));
    expect(loaded.ok && projectsEqual(back.project, loaded.project)).toBe(true);
    expect(back.project.curves[0].massEv).toBeInstanceOf(Float64Array);
    expect(Array.from(back.project.curves[0].gInvGeV)).toEqual(Array.from(smallProject().curves[0].gInvGeV));
  });

  it("re-renders an exported SVG given in place of the project file, to the same bytes", () => {
    const again = join(dir, "again.svg");
    const r = runCli([svgPath, "-o", again]);
    expect(r.status).toBe(0);
    expect(readFileSync(again, "utf8")).toBe(readFileSync(svgPath, "utf8"));
  });
});

describe("render CSV files directly", () => {
  const dir = tempDir();
  const a = join(dir, "scan.csv");
  const b = join(dir, "reach.csv");
  const out = join(dir, "quick.svg");

  beforeAll(() => {
    writeFileSync(a, "# invented test curve\nmass [ueV],g [GeV^-1]\n1,1e-13\n2,5e-14\n5,8e-14\n10,2e-13\n");
    writeFileSync(b, "# invented test curve\n1e-6,1e-14\n1e-5,3e-15\n");
  });

  it("draws the files with roles and models, ranges fitted to the data", () => {
    const r = runCli([
      a,
      "--role",
      "projection",
      b,
      "-o",
      out,
      "--model",
      "8/3",
      "--model",
      "0..44/3",
      "--preset",
      "double-column",
      "--no-embed",
    ]);
    expect(r.stderr).toBe("");
    expect(r.status).toBe(0);
    const svg = readFileSync(out, "utf8");
    const doc = parseXml(svg);
    expect(doc.documentElement!.getAttribute("width")).toBe("17.8cm");
    const all = texts(doc).join("\n");
    for (const label of ["scan", "reach", "E/N = 8/3", "E/N = 0..44/3"]) expect(all).toContain(label);
    expect(unsafeParts(doc)).toEqual([]);
    expect(svg).not.toContain("urn:axband:project");
  });

  it("is reproducible: the same files give the same bytes", () => {
    const o1 = join(dir, "r1.svg");
    const o2 = join(dir, "r2.svg");
    expect(runCli([a, b, "-o", o1, "--model", "8/3"]).status).toBe(0);
    expect(runCli([a, b, "-o", o2, "--model", "8/3"]).status).toBe(0);
    expect(readFileSync(o1, "utf8")).toBe(readFileSync(o2, "utf8"));
  });
});

describe("bad input", () => {
  it("exits 2 on unreadable JSON, leaving no output and no temporary file", () => {
    const dir = tempDir();
    const bad = join(dir, "broken.axband.json");
    writeFileSync(bad, '{"version": 1, "models": [');
    const r = runCli([bad, "-o", join(dir, "out.svg"), "--png", join(dir, "out.png")]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/broken\.axband\.json/);
    expect(r.stderr).toMatch(/nothing was written/);
    expect(readdirSync(dir)).toEqual(["broken.axband.json"]);
  });

  it("exits 2 on a file that is not a project, a future version, a missing file and an unknown option", () => {
    const dir = tempDir();
    const notProject = join(dir, "x.json");
    writeFileSync(notProject, JSON.stringify({ hello: "world" }));
    const future = join(dir, "future.json");
    writeFileSync(future, JSON.stringify({ ...JSON.parse(projectFileText(smallProject())), version: 99 }));
    for (const args of [[notProject], [future], [join(dir, "missing.json")], [notProject, "--frobnicate"]]) {
      const r = runCli([...args, "-o", join(dir, "out.svg")]);
      expect(r.status, args.join(" ")).toBe(2);
      expect(r.stderr.length).toBeGreaterThan(10);
      expect(existsSync(join(dir, "out.svg"))).toBe(false);
    }
    expect(readdirSync(dir).sort()).toEqual(["future.json", "x.json"]);
  });

  it("stops on unreadable CSV rows with file:row:column messages, or skips them with --skip-bad-rows", () => {
    const dir = tempDir();
    const csv = join(dir, "rows.csv");
    writeFileSync(csv, "mass_eV,g_GeV^-1\n1e-6,1e-13\n2e-6,oops\n3e-6,2e-13\n");
    const out = join(dir, "rows.svg");
    const stop = runCli([csv, "-o", out]);
    expect(stop.status).toBe(2);
    expect(stop.stderr).toContain(`${csv}:3:2:`);
    expect(existsSync(out)).toBe(false);
    const skip = runCli([csv, "-o", out, "--skip-bad-rows"]);
    expect(skip.status).toBe(0);
    expect(skip.stderr).toContain(`${csv}:3:2:`);
    expect(skip.stderr).toMatch(/skipped 1 row/);
    expect(existsSync(out)).toBe(true);
  });

  it("prints usage for --help with exit 0", () => {
    const r = runCli(["--help"]);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/usage:/);
    expect(r.stdout).toMatch(/--png/);
  });
});

describe("injection corpus", () => {
  it("keeps hostile model, curve and project labels, CSV headers and file names as literal text", () => {
    const dir = tempDir();
    const projectPath = join(dir, "evil.axband.json");
    const p = withCorpusLabels(smallProject());
    const c = INJECTION_CORPUS;
    writeFileSync(projectPath, projectFileText(p));
    const svgPath = join(dir, "evil.svg");
    const r = runCli([projectPath, "-o", svgPath]);
    expect(r.status).toBe(0);
    const doc = parseXml(readFileSync(svgPath, "utf8"));
    expect(unsafeParts(doc)).toEqual([]);
    const names = elementNames(doc);
    for (const n of ["script", "img", "iframe", "foreignObject"]) expect(names.has(n)).toBe(false);
    const shown = shownLabels(doc);
    for (const label of [c[0], c[5], c[1], `${c[3]} ${c[4]}`])
      expect(
        shown.some((s) => s.includes(label)),
        label,
      ).toBe(true);
    expect(texts(doc).join("\n")).toContain(`${c[2]} ${c[6]}`);

    // A CSV whose header and file name carry the corpus (file names cannot hold "/", so that one is left out).
    const csv = join(dir, `${INJECTION_CORPUS[1]}${INJECTION_CORPUS[2]}&amp;.csv`);
    writeFileSync(
      csv,
      `# ${INJECTION_CORPUS.join(" ")}\nmass ${INJECTION_CORPUS[0]} [eV],g ${INJECTION_CORPUS[1]} [GeV^-1]\n1e-6,1e-13\n1e-5,2e-13\n`,
    );
    const out2 = join(dir, "evil-csv.svg");
    const r2 = runCli([csv, "-o", out2]);
    expect(r2.status).toBe(0);
    const doc2 = parseXml(readFileSync(out2, "utf8"));
    expect(unsafeParts(doc2)).toEqual([]);
    expect(elementNames(doc2).has("img")).toBe(false);
    expect(shownLabels(doc2)).toContain(`${INJECTION_CORPUS[1]}${INJECTION_CORPUS[2]}&amp;`);
  });
});
