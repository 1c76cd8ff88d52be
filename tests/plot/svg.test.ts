// Checks of the SVG writer: well-formed XML (parsed with @xmldom/xmldom) with the SVG namespace, viewBox and
// physical size, text kept as text with real sub/superscripts, inert output for hostile labels, and bytes
// that depend only on the scene.
import { describe, expect, test } from "vitest";
import { buildScene, escapeXml, isSafePathData, writeSvg } from "../../src/plot/index";
import { INJECTION_CORPUS, parseXml, SVG_NS, texts, unsafeParts } from "../cli/svg-checks";
import { curve, fixtureProject, model } from "./fixture";

describe("document structure", () => {
  test("namespace, physical size, viewBox, layer groups and the plot clip (W3C SVG 1.1 §5.1, §7.7, §14.3)", () => {
    const p = fixtureProject();
    p.figure.preset = "single-column";
    const svg = writeSvg(buildScene(p));
    const doc = parseXml(svg);
    const root = doc.documentElement!;
    expect(root.namespaceURI).toBe(SVG_NS);
    expect(root.getAttribute("width")).toBe("8.6cm");
    expect(root.getAttribute("height")).toBe("6.45cm");
    expect(root.getAttribute("viewBox")).toBe("0 0 325.04 243.78");
    for (const id of ["background", "grid", "curves", "models", "highlight", "axes", "legend"])
      expect(doc.getElementById(id)?.nodeName).toBe("g");
    const clip = doc.getElementsByTagName("clipPath")[0];
    const clipId = clip.getAttribute("id");
    expect(doc.getElementById("curves")!.getAttribute("clip-path")).toBe(`url(#${clipId})`);
    expect(doc.getElementById("axes")!.getAttribute("clip-path")).toBeNull();
    expect(doc.getElementById("legend")!.getAttribute("data-testid")).toBe("legend");
    expect(unsafeParts(doc)).toEqual([]);
  });

  test("axis titles and legend labels are text; a superscript is a tspan raised with dy and set smaller, then restored", () => {
    const doc = parseXml(writeSvg(buildScene(fixtureProject())));
    const all = texts(doc);
    expect(all).toContain("gaγγ [GeV−1]");
    expect(all).toContain("ma [eV]");
    expect(all).toContain("KSVZ-type, E/N = 0");
    const ytitle = doc.getElementById("ytitle")!;
    const spans = Array.from(ytitle.getElementsByTagName("tspan"));
    const sup = spans.find((s) => s.textContent === "−1")!;
    const sub = spans.find((s) => s.textContent === "aγγ")!;
    expect(Number(sub.getAttribute("dy"))).toBeGreaterThan(0);
    expect(Number(sup.getAttribute("dy"))).toBeLessThan(0);
    expect(Number(sup.getAttribute("font-size"))).toBeLessThan(Number(ytitle.getAttribute("font-size")));
    // the run after the superscript returns to the baseline: the dy offsets sum to 0
    const total = spans.reduce((s, el) => s + Number(el.getAttribute("dy") ?? 0), 0);
    expect(Math.abs(total)).toBeLessThan(0.011);
    const entries = Array.from(doc.getElementsByTagName("text")).filter((t) => t.hasAttribute("data-legend-entry"));
    expect(entries.map((e) => e.getAttribute("data-legend-entry"))).toContain("DFSZ-type, E/N = 8/3");
  });

  test("numbers carry at most 2 decimals; ids use the prefix; same scene gives the same bytes", () => {
    const scene = buildScene(fixtureProject());
    const a = writeSvg(scene, { idPrefix: "fig1-" });
    expect(a).toBe(writeSvg(scene, { idPrefix: "fig1-" }));
    expect(writeSvg(buildScene(fixtureProject()))).toBe(writeSvg(scene));
    expect(a).not.toMatch(/\d\.\d{3}/);
    const doc = parseXml(a);
    const ids = Array.from(doc.getElementsByTagName("*"))
      .map((e) => e.getAttribute("id"))
      .filter(Boolean) as string[];
    expect(ids.every((id) => id.startsWith("fig1-"))).toBe(true);
    expect(new Set(ids).size).toBe(ids.length);
    expect(doc.getElementById("fig1-axes")).not.toBeNull();
  });
});

describe("escaping (W3C XML 1.0 5th ed. §2.4 and §3.3.3; OWASP XSS filter evasion patterns, common practice)", () => {
  test("escapeXml turns the five special characters into entities", () => {
    expect(escapeXml(`<a href="x" title='y'>&</a>`)).toBe(
      "&lt;a href=&quot;x&quot; title=&apos;y&apos;&gt;&amp;&lt;/a&gt;",
    );
  });

  test("hostile labels, title and metadata come out as literal text; the file stays inert and parses", () => {
    const p = fixtureProject();
    p.models = INJECTION_CORPUS.map((label, i) => model({ id: `m${i}`, label, eOverNMin: String(i) }));
    p.curves = INJECTION_CORPUS.map((label, i) =>
      curve({
        id: `c${i}"><x`,
        label,
        role: "projection",
        massEv: Float64Array.from([1e-6 * (i + 1), 2e-6 * (i + 1)]),
        gInvGeV: Float64Array.from([1e-13, 2e-13]),
      }),
    );
    p.figure.title = '<script>alert("t")</script>';
    p.figure.legend = "top-left";
    const metadata = "project]]><script>alert(1)</script><!-- & \"q\" 'a'";
    const svg = writeSvg(buildScene(p), { metadata });
    const doc = parseXml(svg);
    // A label "javascript:…" is kept verbatim in data-legend-entry: user agents never interpret custom data
    // attributes (HTML Living Standard, "Embedding custom non-visible data with the data-* attributes").
    expect(unsafeParts(doc).filter((u) => !/^javascript: in data-[a-z0-9-]+$/.test(u))).toEqual([]);
    expect(doc.getElementsByTagName("script").length).toBe(0);
    expect(doc.getElementsByTagName("img").length).toBe(0);
    const all = texts(doc);
    for (const label of INJECTION_CORPUS) expect(all.some((t) => t.includes(label))).toBe(true);
    expect(all).toContain('<script>alert("t")</script>');
    expect(doc.getElementsByTagName("metadata")[0].textContent).toBe(metadata);
    const withData = Array.from(doc.getElementsByTagName("*")).filter((e) => e.hasAttribute("data-curve-id"));
    expect(withData.some((e) => e.getAttribute("data-curve-id") === 'c0"><x')).toBe(true);
  });

  test("colours, dash patterns and data keys from user input cannot add attributes or external references", () => {
    const p = fixtureProject();
    p.models = [model({ id: "m", eOverNMin: "1", colour: 'red" onload="alert(1)' })];
    p.curves = [
      curve({
        id: "c",
        role: "exclusion",
        colour: "url(http://example.com/x)",
        massEv: Float64Array.from([1e-6, 2e-6]),
        gInvGeV: Float64Array.from([1e-13, 2e-13]),
      }),
    ];
    const scene = buildScene(p);
    const legend = scene.layers.find((l) => l.id === "legend")!;
    const t = legend.nodes.find((n) => n.kind === "text")!;
    (t.data as Record<string, string>)["Bad Key onclick"] = "x";
    const curvesLayer = scene.layers.find((l) => l.id === "curves")!;
    const path = curvesLayer.nodes.find((n) => n.kind === "path")!;
    if (path.kind === "path") path.d = 'M0 0" onclick="alert(1)';
    (t.data as Record<string, string>)["ok-key"] = '"><b>';
    const svg = writeSvg(scene);
    const doc = parseXml(svg);
    expect(unsafeParts(doc)).toEqual([]);
    expect(svg).not.toMatch(/onload|onclick|example\.com/);
    expect(isSafePathData("M1 2l.5-3h4v-.25Z")).toBe(true);
    expect(isSafePathData('M0 0"/><script>')).toBe(false);
    expect(svg).toContain('data-ok-key="&quot;&gt;&lt;b&gt;"');
  });
});
