// Figures at the schema's edges must render: a 20 × 2000 mm custom size with 72 pt text once made the PNG
// library abort the process (issue 16); sizes beyond the project's 20–1000 mm are repaired on loading or noted
// when they come from the command line; an unwritable output gives one line, not a stack trace.
import { describe, expect, it } from "vitest";
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { readPngSize } from "../../src/formats/png-meta";
import { parseXml } from "./svg-checks";
import { projectFileText, runCli, smallProject, tempDir } from "./fixtures";

function edgeProject(dir: string): string {
  const p = smallProject();
  // Text at the schema's 72 pt; the height beyond its 1000 mm, as files written before the limits agreed may hold.
  const path = join(dir, "edge.axband.json");
  writeFileSync(
    path,
    projectFileText({
      ...p,
      figure: { ...p.figure, preset: "custom", customWidthMm: 20, customHeightMm: 2000, fontPt: 72 },
    }),
  );
  return path;
}

describe("figures at the schema's limits", () => {
  it("writes SVG, PNG and PDF of a 20 × 2000 mm, 72 pt project, each change named in a note", () => {
    const dir = tempDir();
    const input = edgeProject(dir);
    const svg = join(dir, "f.svg");
    const png = join(dir, "f.png");
    const pdf = join(dir, "f.pdf");
    const r = runCli([input, "-o", svg, "--png", png, "--dpi", "100"]);
    expect(r.stderr).not.toMatch(/panicked/);
    expect(r.status).toBe(0);
    expect(r.stderr).toMatch(/repaired on loading: figure, custom height: 2000 is out of range; set to 1000/);
    expect(r.stderr).toMatch(/note: figure: 72 pt text leaves no room for the plot in 20 × 1000 mm; drawn with \d+ pt/);
    const root = parseXml(readFileSync(svg, "utf8")).documentElement!;
    expect(root.getAttribute("width")).toBe("2cm");
    // 20 mm at 100 dpi: 20/25.4 × 100 = 78.7 → 79 px (ISO/IEC 15948 IHDR width).
    expect(readPngSize(new Uint8Array(readFileSync(png))).widthPx).toBe(79);
    const rp = runCli([input, "-o", pdf]);
    expect(rp.status).toBe(0);
    // A PDF file starts with "%PDF-" (ISO 32000-1:2008, §7.5.2).
    expect(readFileSync(pdf).subarray(0, 5).toString("latin1")).toBe("%PDF-");
  });

  it("notes a custom size from the command line beyond 1000 mm and draws it at 1000 mm", () => {
    const dir = tempDir();
    const svg = join(dir, "f.svg");
    const r = runCli([edgeProject(dir), "-o", svg, "--preset", "custom", "--width-mm", "1500", "--height-mm", "50"]);
    expect(r.status).toBe(0);
    expect(r.stderr).toMatch(
      /note: figure: custom size 1500 × 50 mm is drawn at 1000 × 50 mm \(custom sizes are 20–1000 mm\)/,
    );
    // 1000 mm = 100 cm (SI prefixes).
    expect(parseXml(readFileSync(svg, "utf8")).documentElement!.getAttribute("width")).toBe("100cm");
  });

  it("gives one line and writes nothing when the output directory cannot be written", () => {
    const dir = tempDir();
    const input = edgeProject(dir);
    // /proc refuses new files even to root (proc(5), Linux man-pages).
    const r = runCli([input, "-o", "/proc/axband-test.svg"]);
    expect(r.status).toBe(2);
    expect(r.stderr).not.toMatch(/\n\s+at /);
    expect(r.stderr).toMatch(/^axband render: \/proc\/axband-test\.svg: cannot write/m);
    expect(existsSync("/proc/axband-test.svg")).toBe(false);
  });
});
