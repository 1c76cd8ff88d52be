// Tests for the exported figure file: physical sizes per preset, viewBox, determinism, the embedded project
// (round trip with curve data, any prefix, damaged or missing payloads) and inert hostile labels.
import { describe, expect, it } from "vitest";
import {
  AXBAND_PROJECT_NS,
  EMBED_ENCODING,
  EXPORT_RESOLUTION,
  embedProjectInSvg,
  rasterResolution,
  exportFigureSvg,
  exportSizeInches,
} from "../../src/formats/figure-file";
import { extractProjectFromSvg } from "../../src/formats/figure-read";
import { projectsEqual } from "../../src/project/json";
import { restoreProject } from "../../src/project/restore";
import type { SizePreset } from "../../src/project/types";
import {
  INJECTION_CORPUS,
  SVG_NS,
  elementNames,
  parseXml,
  shownLabels,
  texts,
  unsafeParts,
  withCorpusLabels,
} from "../cli/svg-checks";
import { smallProject } from "../cli/fixtures";

/** The project as a reader gets it back (through the shared restore step), for equality checks. */
function canonical(p = smallProject()) {
  const r = restoreProject(p);
  if (!r.ok) throw new Error(r.error);
  return r.project;
}

describe("exportFigureSvg", () => {
  it("writes each fixed preset at its physical size, with a matching viewBox at 96 px per inch", () => {
    // Widths: 8.6 cm single column and 17.8 cm double column (APS journal column widths, common practice);
    // a 16:9 slide. 1 in = 2.54 cm and 96 CSS px (CSS Values and Units Level 3, §5.2).
    const want: Record<Exclude<SizePreset, "custom">, string> = {
      "single-column": "8.6cm",
      "double-column": "17.8cm",
      slide: "25.4cm",
    };
    for (const [preset, width] of Object.entries(want) as [Exclude<SizePreset, "custom">, string][]) {
      const root = parseXml(exportFigureSvg(canonical(), { preset })).documentElement!;
      expect(root.namespaceURI).toBe(SVG_NS);
      expect(root.getAttribute("width")).toBe(width);
      const [, , w, h] = (root.getAttribute("viewBox") ?? "").split(/[\s,]+/).map(Number);
      // The physical size is written to 0.01 cm, i.e. within 0.005 cm = 0.19 px of the viewBox.
      const tolPx = (0.005 / 2.54) * 96 + 0.01;
      expect(Math.abs(w - (parseFloat(width) / 2.54) * 96)).toBeLessThan(tolPx);
      const hCm = parseFloat(root.getAttribute("height") ?? "");
      expect(Math.abs(h - (hCm / 2.54) * 96)).toBeLessThan(tolPx);
      if (preset === "slide") expect(w / h).toBeCloseTo(16 / 9, 3);
    }
  });

  it("uses the custom size in mm for the custom preset", () => {
    const p = canonical();
    const custom = { ...p, figure: { ...p.figure, preset: "custom" as const, customWidthMm: 120, customHeightMm: 80 } };
    const root = parseXml(exportFigureSvg(custom)).documentElement!;
    expect(root.getAttribute("width")).toBe("12cm");
    expect(root.getAttribute("height")).toBe("8cm");
    expect(exportSizeInches(custom)).toEqual({ widthIn: 120 / 25.4, heightIn: 80 / 25.4 });
  });

  it("is deterministic and leaves the project untouched", () => {
    const p = canonical();
    const before = structuredClone(p);
    expect(exportFigureSvg(p)).toBe(exportFigureSvg(p));
    expect(projectsEqual(p, before)).toBe(true);
  });

  it("is safe and self-contained, with the labels as text", () => {
    const doc = parseXml(exportFigureSvg(canonical()));
    expect(unsafeParts(doc)).toEqual([]);
    const all = texts(doc).join("\n");
    for (const label of ["DFSZ-type line", "Preferred window", "Demo scan (invented)"]) expect(all).toContain(label);
  });

  it("embeds the project in <metadata> in our namespace, or leaves it out on request", () => {
    const svg = exportFigureSvg(canonical());
    const doc = parseXml(svg);
    const el = Array.from(doc.getElementsByTagNameNS(AXBAND_PROJECT_NS, "project"));
    expect(el).toHaveLength(1);
    expect(el[0].parentNode?.nodeName).toBe("metadata");
    expect(el[0].getAttribute("encoding")).toBe(EMBED_ENCODING);
    // "v3.", the base64url alphabet only (RFC 4648 §5) and "." before the checksum: no XML escaping needed.
    expect(el[0].textContent).toMatch(/^v3\.[A-Za-z0-9_-]+\.[A-Za-z0-9_-]{6}$/);
    expect(exportFigureSvg(canonical(), { embedProject: false })).not.toContain(AXBAND_PROJECT_NS);
  });

  it("equals the bare SVG with the project embedded afterwards (the CLI builds the scene once)", () => {
    const p = canonical();
    expect(embedProjectInSvg(exportFigureSvg(p, { embedProject: false }), p)).toBe(exportFigureSvg(p));
  });
});

describe("thinning resolution", () => {
  it("is 2 columns per scene px for the SVG and 2 per PNG px for rasters", () => {
    // 1 CSS px = 1/96 in (CSS Values and Units Level 3, §5.2): 300 dpi is 300/96 = 3.125 PNG px per scene px;
    // the thinning error is about one column, so two columns per output pixel keep it ≤ 0.5 px.
    expect(EXPORT_RESOLUTION).toBe(2);
    expect(rasterResolution(300)).toBe(6.25);
    expect(rasterResolution(192)).toBe(4);
    expect(rasterResolution(72)).toBe(2);
    expect(rasterResolution(Number.NaN)).toBe(2);
  });
});

describe("extractProjectFromSvg", () => {
  it("gives back the exported project, Float64Array curve data equal by value", () => {
    const p = canonical();
    const r = extractProjectFromSvg(exportFigureSvg(p));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(projectsEqual(r.project, p)).toBe(true);
    expect(r.project.curves[1].gInvGeV).toBeInstanceOf(Float64Array);
    expect(Array.from(r.project.curves[1].gInvGeV)).toEqual(Array.from(p.curves[1].gInvGeV));
  });

  it("records the preset the figure was exported at", () => {
    const r = extractProjectFromSvg(exportFigureSvg(canonical(), { preset: "double-column" }));
    expect(r.ok && r.project.figure.preset).toBe("double-column");
  });

  it("still finds the project when an editor renamed the namespace prefix", () => {
    const svg = exportFigureSvg(canonical())
      .replace(/<(\/?)axband:project/g, "<$1ns0:project")
      .replace("xmlns:axband=", "xmlns:ns0=");
    const r = extractProjectFromSvg(svg);
    expect(r.ok).toBe(true);
  });

  it("explains what is wrong instead of throwing", () => {
    const svg = exportFigureSvg(canonical());
    const cases: [string, RegExp][] = [
      ["not svg at all", /not an SVG/],
      [exportFigureSvg(canonical(), { embedProject: false }), /carries no axband project/],
      [
        svg.replace(/(encoding="deflate-base64url"[^>]*>v3\.)[A-Za-z0-9_-]{20}/, "$1AAAAAAAAAAAAAAAAAAAA"),
        /the project embedded in this SVG is damaged \(its checksum does not match/,
      ],
      [svg.replace(`encoding="${EMBED_ENCODING}"`, 'encoding="rot13"'), /unknown encoding/],
    ];
    for (const [text, msg] of cases) {
      const r = extractProjectFromSvg(text);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error).toMatch(msg);
    }
  });
});

describe("hostile labels", () => {
  it("stay literal text in the SVG and in the embedded project", () => {
    const p = canonical(withCorpusLabels(smallProject()));
    const svg = exportFigureSvg(p);
    const doc = parseXml(svg);
    expect(unsafeParts(doc)).toEqual([]);
    const names = elementNames(doc);
    for (const n of ["script", "img", "iframe"]) expect(names.has(n)).toBe(false);
    const shown = shownLabels(doc);
    const c = INJECTION_CORPUS;
    for (const label of [c[0], c[5], c[1], `${c[3]} ${c[4]}`])
      expect(
        shown.some((s) => s.includes(label)),
        label,
      ).toBe(true);
    expect(texts(doc).join("\n")).toContain(`${c[2]} ${c[6]}`);
    const back = extractProjectFromSvg(svg);
    expect(back.ok && back.project.models[0].label).toBe(c[0]);
    expect(back.ok && back.project.name).toBe(c[0]);
  });
});
