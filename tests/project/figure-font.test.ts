// The figure font setting: files and links written before it read as "sans" without a repair note, a bad value
// is repaired to "sans" with a note, a link carries "serif", and the scene names the chosen face first.
// Sizes: at the single-column preset the tick labels come out at 8 pt, LaTeX's \footnotesize in a 10 pt
// document (size10.clo of the LaTeX standard classes: \footnotesize 8pt, \scriptsize 7pt; from memory).
import { describe, expect, it } from "vitest";
import { restoreProject } from "../../src/project/restore";
import { defaultProject } from "../../src/project/demo";
import { decodeLink, encodeLink } from "../../src/data/index";
import { buildScene } from "../../src/plot/scene";
import type { SceneNode, TextNode } from "../../src/plot/scene-types";

function withoutFont() {
  const p = defaultProject();
  const { font: _f, ...figure } = p.figure;
  return { ...JSON.parse(JSON.stringify({ ...p, curves: [] })), figure };
}

describe("figure.font in files and links", () => {
  it("a project without the key reads as sans, with no repair note", () => {
    const r = restoreProject(withoutFont());
    expect(r.ok && r.project.figure.font).toBe("sans");
    expect(r.ok && r.repairs).toEqual([]);
  });

  it("an unknown value is repaired to sans and the repair is named", () => {
    const raw = withoutFont();
    raw.figure.font = "comic";
    const r = restoreProject(raw);
    expect(r.ok && r.project.figure.font).toBe("sans");
    expect(r.ok && r.repairs.join(" ")).toMatch(/figure font/);
  });

  it("a link keeps serif", () => {
    const p = defaultProject();
    const serif = { ...p, figure: { ...p.figure, font: "serif" as const } };
    const back = decodeLink(encodeLink(serif, { includeCurves: true }));
    expect(back.ok && back.project.figure.font).toBe("serif");
  });
});

describe("the scene's font", () => {
  it("names CMU Serif first for serif and CMU Sans Serif for sans", () => {
    const p = defaultProject();
    expect(buildScene(p).fontFamily).toMatch(/^'CMU Sans Serif',/);
    expect(buildScene({ ...p, figure: { ...p.figure, font: "serif" } }).fontFamily).toMatch(/^'CMU Serif',/);
  });

  it("single column: tick labels at 8 pt (footnote size of a 10 pt paper), legend at 7 pt, axis titles ≤ 9 pt", () => {
    const p = defaultProject();
    // A legend in a corner keeps its chosen size (the automatic one of the demo goes below the plot, where it
    // may be set smaller, down to 6 pt, to leave the plot its room: tests/plot/preset-checks.test.ts).
    const scene = buildScene({
      ...p,
      figure: { ...p.figure, preset: "single-column", fontPt: 12, legend: "top-right" },
    });
    const texts = (id: string): TextNode[] =>
      scene.layers
        .filter((l) => l.id === id)
        .flatMap((l) => l.nodes as SceneNode[])
        .filter((n): n is TextNode => n.kind === "text");
    const pt = (px: number) => Math.round(px * (72 / 96) * 100) / 100;
    const axisSizes = new Set(texts("axes").map((t) => pt(t.sizePx)));
    expect(axisSizes.has(8)).toBe(true);
    expect(Math.max(...axisSizes)).toBeLessThanOrEqual(9);
    expect(Math.min(...texts("legend").map((t) => pt(t.sizePx)))).toBeGreaterThanOrEqual(7);
  });
});
