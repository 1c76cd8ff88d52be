// A figure title that does not fit the figure width: wrapped onto two lines (the layout makes room), else
// smaller down to 6 pt at the physical size (6 pt = 8 px at 96 px per inch, CSS Values and Units Level 3:
// 1in = 96px = 72pt), else cut with "…"; each change is a note in the scene, and the CLI prints it.
import { describe, expect, test } from "vitest";
import { fitTitle, TITLE_MIN_PX } from "../../src/plot/title";
import { runsText, runsWidthPx } from "../../src/plot/text";
import { buildScene } from "../../src/plot/index";
import { fixtureProject, textNodes } from "./fixture";
import { runRender } from "../cli/fixtures";
import { writeFileSync } from "node:fs";
import { join } from "node:path";
import { projectFileText, tempDir } from "../cli/fixtures";

const LONG = "Invented heavy-quark windows and demo haloscope limits compared at equal local dark-matter density";

describe("fitTitle", () => {
  test("a title that fits is returned unchanged, without a note", () => {
    const f = fitTitle([{ text: "Short" }], 16, 500);
    expect(f).toEqual({ lines: [[{ text: "Short" }]], sizePx: 16 });
  });

  test("too wide: two lines split at a space, each within the width, nothing lost", () => {
    const runs = [
      { text: "Limits on g" },
      { text: "aγγ", shift: "sub" as const },
      { text: " from invented haloscopes" },
    ];
    const width = runsWidthPx(runs, 16) * 0.6;
    const f = fitTitle(runs, 16, width);
    expect(f.lines).toHaveLength(2);
    expect(f.sizePx).toBe(16);
    for (const l of f.lines) expect(runsWidthPx(l, 16)).toBeLessThanOrEqual(width);
    expect(f.lines.map(runsText).join(" ")).toBe(runsText(runs));
    expect(f.lines[0].some((r) => r.shift === "sub")).toBe(true);
    expect(f.note).toMatch(/wrapped onto two lines/);
  });

  test("still too wide on two lines: smaller, not below 6 pt, with the size in the note", () => {
    const runs = [{ text: LONG }];
    const w2 = runsWidthPx(runs, 16) / 2;
    const f = fitTitle(runs, 16, w2 * 0.8);
    expect(f.sizePx).toBeLessThan(16);
    expect(f.sizePx).toBeGreaterThanOrEqual(TITLE_MIN_PX);
    for (const l of f.lines) expect(runsWidthPx(l, f.sizePx)).toBeLessThanOrEqual(w2 * 0.8);
    expect(f.note).toMatch(/set at \d+(\.\d)? pt \(from 12 pt\)/);
  });

  test("too long even at 6 pt: cut with … at 6 pt, and the note says so", () => {
    const f = fitTitle([{ text: LONG }], 16, 60);
    expect(f.sizePx).toBeCloseTo(TITLE_MIN_PX, 6);
    expect(TITLE_MIN_PX * 0.75).toBeCloseTo(6, 9);
    for (const l of f.lines) {
      expect(runsWidthPx(l, f.sizePx)).toBeLessThanOrEqual(60);
      expect(runsText(l).endsWith("…")).toBe(true);
    }
    expect(f.note).toMatch(/cut/);
  });
});

describe("long titles in the scene", () => {
  test("single column: the title wraps inside the figure, the plot moves down to make room, and the scene notes it", () => {
    const p = fixtureProject();
    p.figure.preset = "single-column";
    p.figure.title = "Short";
    const short = buildScene(p);
    expect(short.notes).toBeUndefined();
    p.figure.title = LONG;
    const scene = buildScene(p);
    const lines = textNodes(scene, "axes").filter((t) => t.id?.startsWith("figure-title"));
    expect(lines.length).toBe(2);
    for (const t of lines) {
      const half = runsWidthPx(t.runs, t.sizePx) / 2;
      expect(t.x - half).toBeGreaterThanOrEqual(0);
      expect(t.x + half).toBeLessThanOrEqual(scene.widthPx);
      expect(t.sizePx * 0.75).toBeGreaterThanOrEqual(6);
    }
    expect(lines[1].y).toBeGreaterThan(lines[0].y);
    // The layout made room: everything under the title moved down, and the second line sits above it all.
    expect(scene.plot.y).toBeGreaterThan(short.plot.y);
    const below = textNodes(scene, "axes").filter((t) => !t.id?.startsWith("figure-title") && t.rotate === undefined);
    const highest = Math.min(...below.map((t) => t.y - t.sizePx));
    expect(lines[1].y + 0.24 * lines[1].sizePx).toBeLessThanOrEqual(highest);
    expect(scene.notes?.[0]).toMatch(/^title /);
  });

  test("the command line prints the title note on stderr", async () => {
    const dir = tempDir();
    const p = fixtureProject();
    const input = join(dir, "long.axband.json");
    writeFileSync(input, projectFileText({ ...p, figure: { ...p.figure, preset: "single-column", title: LONG } }));
    const r = await runRender([input, "-o", join(dir, "long.svg")]);
    expect(r.status).toBe(0);
    expect(r.err).toMatch(/note: figure: title wrapped onto two lines/);
  });
});
