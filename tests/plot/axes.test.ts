// The axes of a scene: the mass axis labelled in eV, meV, µeV or neV at the same positions (values stay in eV;
// SI prefixes from the BIPM SI Brochure, 9th ed. 2019, Table 7), the frequency axis in a fixed unit through
// ν = m/h (h = 4.135667696×10⁻¹⁵ eV·s, CODATA 2018, exact), and outward ticks with labels clear of them (house
// style; "labels never touch the ticks" is common practice).
import { describe, expect, test } from "vitest";
import { buildScene, massToX } from "../../src/plot/index";
import type { Project } from "../../src/project/types";
import { CAP_HEIGHT, SHIFT_SCALE, SUP_RAISE } from "../../src/plot/text";
import { fixtureProject, parsePath, paths, textNodes, textOf } from "./fixture";

const H_EV_S = 4.135667696e-15;

function sceneWith(figure: Partial<Project["figure"]>) {
  const p = fixtureProject();
  p.figure = { ...p.figure, ...figure };
  return buildScene(p);
}
const label = (scene: ReturnType<typeof buildScene>, prefix: string, text: string) =>
  textNodes(scene, "axes").find((n) => n.id?.startsWith(`${prefix}-`) && textOf(n) === text);

describe("mass axis unit", () => {
  test("µeV: the label 1 sits where 10⁻⁶ eV does, 100 at 10⁻⁴ eV, and the title reads m_a [μeV]", () => {
    const scene = sceneWith({ massUnit: "ueV" });
    expect(Math.abs(label(scene, "xlabel", "1")!.x - massToX(scene, 1e-6))).toBeLessThan(0.01);
    expect(Math.abs(label(scene, "xlabel", "100")!.x - massToX(scene, 1e-4))).toBeLessThan(0.01);
    expect(textOf(textNodes(scene, "axes").find((n) => n.id === "xtitle")!)).toBe("ma [μeV]");
  });

  test("meV and neV: 1 meV at 10⁻³ eV, 100 neV at 10⁻⁷ eV; the plot area and curves are those of the eV axis", () => {
    const ev = sceneWith({ massUnit: "eV", massRangeEv: [1e-5, 1e-1] });
    const mev = sceneWith({ massUnit: "meV", massRangeEv: [1e-5, 1e-1] });
    const nev = sceneWith({ massUnit: "neV", massRangeEv: [1e-8, 1e-5] });
    expect(Math.abs(label(mev, "xlabel", "1")!.x - massToX(mev, 1e-3))).toBeLessThan(0.01);
    expect(Math.abs(label(nev, "xlabel", "100")!.x - massToX(nev, 1e-7))).toBeLessThan(0.01);
    expect(textOf(textNodes(mev, "axes").find((n) => n.id === "xtitle")!)).toBe("ma [meV]");
    expect(mev.plot).toEqual(ev.plot);
    expect(mev.layers.find((l) => l.id === "curves")).toEqual(ev.layers.find((l) => l.id === "curves"));
  });

  test("eV keeps powers of ten (10⁻⁶ with a superscript); meV over 10⁻⁴…10 uses them for every label", () => {
    const wide = textNodes(sceneWith({ massUnit: "meV" }), "axes").filter((n) => n.id?.startsWith("xlabel-"));
    expect(wide.map(textOf)).toContain("100");
    expect(wide.every((n) => n.runs.some((r) => r.shift === "sup"))).toBe(true);
    const runs = label(sceneWith({}), "xlabel", "10\u22126")!.runs;
    expect(runs).toEqual([{ text: "10" }, { text: "\u22126", shift: "sup" }]);
  });
});

describe("frequency axis unit", () => {
  test("fixed THz: 1 THz sits at m = h·10¹² Hz = 4.135667696 meV (axis 0.24…24 THz)", () => {
    const scene = sceneWith({ topAxis: "frequency", frequencyUnit: "THz", massRangeEv: [1e-3, 1e-1] });
    expect(textOf(textNodes(scene, "axes").find((n) => n.id === "toptitle")!)).toBe("ν [THz]");
    expect(Math.abs(label(scene, "toplabel", "1")!.x - massToX(scene, 1e12 * H_EV_S))).toBeLessThan(0.01);
  });

  test("fixed MHz over 10⁻⁷…10⁻² eV (24 MHz to 2.4 PHz) uses powers of ten for every label", () => {
    const scene = sceneWith({ topAxis: "frequency", frequencyUnit: "MHz" });
    const top = textNodes(scene, "axes").filter((n) => n.id?.startsWith("toplabel-"));
    expect(top.length).toBeGreaterThanOrEqual(3);
    for (const n of top) expect(n.runs.some((r) => r.shift === "sup")).toBe(true);
    const tenTo3 = top.find((n) => textOf(n) === "103")!;
    expect(Math.abs(tenTo3.x - massToX(scene, 1e9 * H_EV_S))).toBeLessThan(0.01);
  });
});

/** Segments of the tick paths as [x1, y1, x2, y2]. */
function tickSegments(scene: ReturnType<typeof buildScene>): number[][] {
  return paths(scene, "axes")
    .filter((p) => p.id?.startsWith("ticks-"))
    .flatMap((p) => parsePath(p.d).map((s) => [...s.points[0], ...s.points[1]]));
}

describe("outward ticks", () => {
  test("default: bottom ticks go down and left ticks go left from the frame; none on the right", () => {
    const scene = sceneWith({ topAxis: "none" });
    const { x, y, w, h } = scene.plot;
    const segs = tickSegments(scene);
    const bottom = segs.filter((s) => s[0] === s[2] && Math.abs(s[1] - (y + h)) < 0.02);
    const left = segs.filter((s) => s[1] === s[3] && Math.abs(s[0] - x) < 0.02);
    expect(bottom.length).toBeGreaterThan(5);
    expect(left.length).toBeGreaterThan(5);
    for (const s of bottom) expect(s[3]).toBeGreaterThan(s[1]);
    for (const s of left) expect(s[2]).toBeLessThan(s[0]);
    expect(segs.every((s) => s[0] <= x + w - 0.5 || s[1] >= y + h - 0.02)).toBe(true);
    expect(segs.some((s) => Math.abs(s[1] - y) < 0.02 && s[0] === s[2])).toBe(false);
  });

  test("all four sides: right ticks mirror the left outward; top ticks mirror the bottom unless a top axis is shown", () => {
    const scene = sceneWith({ topAxis: "none", ticks: "all" });
    const { x, y, w, h } = scene.plot;
    const segs = tickSegments(scene);
    const right = segs.filter((s) => s[1] === s[3] && Math.abs(s[0] - (x + w)) < 0.02);
    const left = segs.filter((s) => s[1] === s[3] && Math.abs(s[0] - x) < 0.02);
    expect(right.map((s) => s[1])).toEqual(left.map((s) => s[1]));
    for (const s of right) expect(s[2]).toBeGreaterThan(s[0]);
    const top = segs.filter((s) => s[0] === s[2] && Math.abs(s[1] - y) < 0.02);
    const bottom = segs.filter((s) => s[0] === s[2] && Math.abs(s[1] - (y + h)) < 0.02);
    expect(top.map((s) => s[0])).toEqual(bottom.map((s) => s[0]));
    for (const s of top) expect(s[3]).toBeLessThan(s[1]);
    // With the f_a axis on top its own ticks go there (f_a decades fall elsewhere than mass decades).
    const fa = sceneWith({ topAxis: "fa", ticks: "all" });
    const faTop = tickSegments(fa).filter((s) => s[0] === s[2] && Math.abs(s[1] - fa.plot.y) < 0.02);
    const faLabel = label(fa, "toplabel", "1012")!;
    expect(faTop.some((s) => Math.abs(s[0] - faLabel.x) < 0.02)).toBe(true);
  });

  test("tick labels sit clear of the outward ticks and inside the figure, at every preset", () => {
    for (const preset of ["slide", "single-column", "double-column"] as const)
      for (const ticks of ["out", "all"] as const) {
        const scene = sceneWith({ preset, ticks, topAxis: "frequency" });
        const { x, y, h } = scene.plot;
        const segs = tickSegments(scene);
        const reach = (pick: (s: number[]) => number) => Math.max(...segs.map(pick));
        const below = reach((s) => Math.max(s[1], s[3])) - (y + h);
        const leftOf = x - Math.min(...segs.map((s) => Math.min(s[0], s[2])));
        const above = y - Math.min(...segs.map((s) => Math.min(s[1], s[3])));
        for (const n of textNodes(scene, "axes")) {
          const supTop = n.sizePx * (SUP_RAISE + SHIFT_SCALE * CAP_HEIGHT);
          if (n.id?.startsWith("xlabel-")) expect(n.y - supTop).toBeGreaterThan(y + h + below);
          if (n.id?.startsWith("toplabel-")) expect(n.y).toBeLessThan(y - above);
          if (n.id?.startsWith("ylabel-")) expect(n.x).toBeLessThan(x - leftOf);
          expect(n.x).toBeGreaterThanOrEqual(0);
          expect(n.y).toBeLessThanOrEqual(scene.heightPx);
        }
        expect(Math.max(...segs.map((s) => Math.max(s[0], s[2])))).toBeLessThanOrEqual(scene.widthPx);
      }
  });
});
