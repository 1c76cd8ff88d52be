// The embedding policy of exported SVGs: the project goes into <metadata> with its curve data while the curves
// have at most EMBED_MAX_POINTS points and the payload stays within EMBED_MAX_CHARS (2 MB), else without them, marked curves="omitted" and said in a comment, and
// the SVG still reopens with models, figure and constants and says what was left out.
import { describe, expect, it } from "vitest";
import { newCurve } from "../../src/project/defaults";
import { encodeLink } from "../../src/formats/codec";
import { projectsEqual } from "../../src/project/json";
import { restoreProject } from "../../src/project/restore";
import type { Project } from "../../src/project/types";
import {
  AXBAND_PROJECT_NS,
  EMBED_MAX_CHARS,
  EMBED_MAX_POINTS,
  embedCapText,
  embedProjectInSvg,
  embedProjectInSvgWithInfo,
  exportFigureSvg,
  exportFigureSvgWithInfo,
  projectMetadata,
} from "../../src/formats/figure-file";
import { extractProjectFromSvg } from "../../src/formats/figure-read";
import { smallProject } from "../cli/fixtures";
import { parseXml, unsafeParts } from "../cli/svg-checks";

function canonical(p: Project = smallProject()): Project {
  const r = restoreProject(p);
  if (!r.ok) throw new Error(r.error);
  return r.project;
}

/** The one embedded project element of an SVG (namespace-aware XML parse). */
function projectElement(svg: string) {
  const els = Array.from(parseXml(svg).getElementsByTagNameNS(AXBAND_PROJECT_NS, "project"));
  expect(els).toHaveLength(1);
  return els[0];
}

/** A project with `n` invented full-precision points: ~22 payload characters per point, so 120,000 pass 2 MB. */
function bigProject(n: number): Project {
  let s = 12345;
  const rnd = () => (s = (s * 48271) % 2147483647) / 2147483647;
  const p = canonical();
  const massEv = Float64Array.from({ length: n }, (_, i) => 1e-6 * (1 + (9 * i) / n) * (1 + 1e-9 * rnd()));
  const gInvGeV = Float64Array.from({ length: n }, () => 1e-13 * (1 + rnd()));
  return {
    ...p,
    curves: [
      ...p.curves,
      newCurve({ id: "c-big", label: "Big scan (invented)", massEv, gInvGeV }, { curves: p.curves }),
    ],
  };
}

describe("curve data within the cap", () => {
  it("a small project is embedded whole, and the info says so", () => {
    const p = canonical();
    const r = exportFigureSvgWithInfo(p);
    expect(r).toMatchObject({
      embedded: true,
      embeddedCurves: true,
      omittedCurves: [],
      omittedPoints: 0,
      omittedBecause: null,
    });
    expect(r.svg).toBe(exportFigureSvg(p));
    expect(projectElement(r.svg).hasAttribute("curves")).toBe(false);
    const back = extractProjectFromSvg(r.svg);
    expect(back.ok && back.omittedCurveCount).toBe(0);
    expect(back.ok && back.note).toBeUndefined();
  });

  it("the cap is exact: a payload of exactly the cap goes in with its curves, one character less leaves them out", () => {
    const p = canonical();
    const full = encodeLink(p, { includeCurves: true });
    expect(projectMetadata(p, full.length).info.embeddedCurves).toBe(true);
    expect(projectMetadata(p, full.length).xml).toContain(`>${full}</axband:project>`);
    expect(projectMetadata(p, full.length - 1).info.embeddedCurves).toBe(false);
  });

  it("without embedding, the info says nothing was embedded", () => {
    const r = exportFigureSvgWithInfo(canonical(), { embedProject: false });
    expect(r).toMatchObject({ embedded: false, embeddedCurves: false, omittedCurves: [] });
    expect(r.svg).not.toContain(AXBAND_PROJECT_NS);
  });
});

describe("curve data over the cap", () => {
  const p = canonical();
  const cap = 1000;
  const r = exportFigureSvgWithInfo(p, { embedMaxChars: cap });

  it("leaves the curve data out, names the curves and counts the points", () => {
    expect(r.embedded).toBe(true);
    expect(r.embeddedCurves).toBe(false);
    expect(r.omittedCurves).toEqual(p.curves.map((c) => c.label));
    expect(r.omittedPoints).toBe(p.curves.reduce((n, c) => n + c.massEv.length, 0));
  });

  it('marks the element curves="omitted" with the counts, explains in a comment, and stays valid, safe XML', () => {
    const el = projectElement(r.svg);
    expect(el.getAttribute("curves")).toBe("omitted");
    expect(el.getAttribute("omitted-curves")).toBe(String(p.curves.length));
    expect(el.getAttribute("omitted-points")).toBe(String(r.omittedPoints));
    expect(el.textContent).toBe(encodeLink(p, { includeCurves: false }));
    expect(r.svg).toMatch(/<metadata><!-- axband: the data of 2 curve\(s\), 400 points, were left out[^>]*-->/);
    expect(unsafeParts(parseXml(r.svg))).toEqual([]);
  });

  it("is the same SVG by every route (exportFigureSvg, embedProjectInSvg on the bare SVG)", () => {
    expect(exportFigureSvg(p, { embedMaxChars: cap })).toBe(r.svg);
    const bare = exportFigureSvg(p, { embedProject: false });
    expect(embedProjectInSvg(bare, p, cap)).toBe(r.svg);
    expect(embedProjectInSvgWithInfo(bare, p, cap)).toEqual(r);
  });

  it("reopens with models, figure and constants, and says the curves were left out", () => {
    const back = extractProjectFromSvg(r.svg);
    expect(back.ok).toBe(true);
    if (!back.ok) return;
    expect(back.project.curves).toEqual([]);
    expect(projectsEqual({ ...back.project, curves: p.curves }, p)).toBe(true);
    expect(back.omittedCurveCount).toBe(2);
    expect(back.note).toMatch(/without the data of its 2 curves.*project file/);
  });
});

describe("the default 2 MB cap", () => {
  it("is 2,000,000 characters", () => {
    expect(EMBED_MAX_CHARS).toBe(2_000_000);
  });

  it("120,000 full-precision points are left out and the SVG stays a figure; 20,000 go in", () => {
    const big = bigProject(120_000);
    const bare = exportFigureSvg(big, { embedProject: false });
    const r = exportFigureSvgWithInfo(big);
    expect(r.embeddedCurves).toBe(false);
    expect(r.omittedCurves).toEqual(["Demo scan (invented)", "Demo reach (invented)", "Big scan (invented)"]);
    expect(r.omittedPoints).toBe(120_400);
    // The whole project would not have fitted: the decision is the encoder's own length, not a guess.
    expect(encodeLink(big).length).toBeGreaterThan(EMBED_MAX_CHARS);
    expect(r.svg.length - bare.length).toBeLessThan(5000);

    const fits = bigProject(20_000);
    const f = exportFigureSvgWithInfo(fits);
    expect(f.embeddedCurves).toBe(true);
    const back = extractProjectFromSvg(f.svg);
    expect(back.ok && projectsEqual(back.project, fits)).toBe(true);
    expect(projectElement(f.svg).textContent?.length).toBeLessThanOrEqual(EMBED_MAX_CHARS);
  });
});

/** A project whose one big curve compresses to almost nothing: `n` points on a regular grid of round numbers. */
function regularProject(n: number): Project {
  const p = canonical();
  const massEv = Float64Array.from({ length: n }, (_, i) => (i + 1) * 1e-9);
  const gInvGeV = new Float64Array(n).fill(1e-13);
  return {
    ...p,
    curves: [
      ...p.curves,
      newCurve({ id: "c-grid", label: "Grid scan (invented)", massEv, gInvGeV }, { curves: p.curves }),
    ],
  };
}

describe("the point cap", () => {
  const points = (p: Project) => p.curves.reduce((n, c) => n + c.massEv.length, 0);

  it("leaves out curve data over EMBED_MAX_POINTS without packing them, even when they would fit 2 MB", () => {
    const base = points(canonical());
    // Round grid values pack to a few bytes per thousand points: the character cap alone would let them in.
    const over = regularProject(EMBED_MAX_POINTS - base + 1);
    expect(points(over)).toBe(EMBED_MAX_POINTS + 1);
    expect(encodeLink(over).length).toBeLessThan(EMBED_MAX_CHARS);
    const r = projectMetadata(over);
    expect(r.info).toMatchObject({
      embeddedCurves: false,
      omittedBecause: "points",
      omittedPoints: EMBED_MAX_POINTS + 1,
    });
    expect(r.xml).toContain(`more than ${EMBED_MAX_POINTS} points`);
    expect(r.xml).toContain('curves="omitted"');

    const at = regularProject(EMBED_MAX_POINTS - base);
    const a = projectMetadata(at);
    expect(a.info).toMatchObject({ embeddedCurves: true, omittedBecause: null });
  });

  it("a lower cap passed in is used, and the size reason is kept apart from the point reason", () => {
    const p = bigProject(1000);
    expect(exportFigureSvgWithInfo(p, { embedMaxPoints: 500 }).omittedBecause).toBe("points");
    expect(exportFigureSvgWithInfo(p, { embedMaxChars: 5000 }).omittedBecause).toBe("size");
    expect(exportFigureSvgWithInfo(p).omittedBecause).toBe(null);
  });

  it("names the cap in words for messages", () => {
    expect(embedCapText("points")).toBe("the cap of 500,000 points");
    expect(embedCapText("size")).toBe("the 2 MB cap");
  });
});
