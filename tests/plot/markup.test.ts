// Math markup in titles and labels: sub/superscripts in LaTeX's `_`/`^` notation with or without braces, Greek
// letters by their LaTeX names (Lamport, "LaTeX: A Document Preparation System", 2nd ed. 1994, Table 3.3,
// from memory) as the Unicode Greek and Coptic block (U+0370–U+03FF, The Unicode Standard) writes them, and
// file-name-like labels left exactly as typed; the same runs in the legend, the title and the PDF text.
import { describe, expect, test } from "vitest";
import { markupRuns } from "../../src/plot/markup";
import { runsText } from "../../src/plot/text";
import { buildScene } from "../../src/plot/index";
import { fixtureProject, textNodes } from "./fixture";

describe("markupRuns", () => {
  test.each([
    ["SU(3)_L", [{ text: "SU(3)" }, { text: "L", shift: "sub" }]],
    ["g_{aγγ}", [{ text: "g" }, { text: "aγγ", shift: "sub" }]],
    ["g_{a\\gamma\\gamma}", [{ text: "g" }, { text: "aγγ", shift: "sub" }]],
    ["\\Lambda_{QCD}", [{ text: "Λ" }, { text: "QCD", shift: "sub" }]],
    ["m_a (eV)", [{ text: "m" }, { text: "a", shift: "sub" }, { text: " (eV)" }]],
    ["x^2", [{ text: "x" }, { text: "2", shift: "sup" }]],
    ["f_\\pi", [{ text: "f" }, { text: "π", shift: "sub" }]],
    ["^{3}He", [{ text: "3", shift: "sup" }, { text: "He" }]],
  ])("%s", (input, runs) => {
    expect(markupRuns(input)).toEqual(runs);
  });

  test("a superscript's leading hyphen becomes the minus sign U+2212", () => {
    expect(markupRuns("10^{-12} GeV")).toEqual([{ text: "10" }, { text: "\u221212", shift: "sup" }, { text: " GeV" }]);
  });

  test("Greek names: lowercase α…ω and uppercase Γ…Ω at their Unicode code points; typed Greek is kept", () => {
    expect(runsText(markupRuns("\\alpha\\beta\\gamma\\delta \\mu \\omega"))).toBe(
      "\u03b1\u03b2\u03b3\u03b4 \u03bc \u03c9",
    );
    expect(runsText(markupRuns("\\Gamma \\Delta \\Lambda \\Sigma \\Omega"))).toBe("\u0393 \u0394 \u039b \u03a3 \u03a9");
    expect(markupRuns("γ-ray")).toEqual([{ text: "γ-ray" }]);
  });

  test("file-name-like labels and plain text are left exactly as typed (one run)", () => {
    for (const label of [
      "my_curve.csv",
      "run_2.csv",
      "a_b_c",
      "ADMX_2018",
      "limit_v2.txt",
      "data_final",
      "Demo network: cavity runs (invented)",
      "E/N = 8/3",
      "C:\\data\\x.csv",
      "x^y.csv",
      "50% of_",
      "_leading",
      "trailing_",
      "a_{unclosed",
    ])
      expect(markupRuns(label)).toEqual([{ text: label }]);
  });

  test("escapes write the character itself", () => {
    expect(markupRuns("CAST\\_a")).toEqual([{ text: "CAST_a" }]);
    expect(markupRuns("\\{x\\}")).toEqual([{ text: "{x}" }]);
  });
});

describe("markup in the scene", () => {
  test("title and legend labels carry the runs; the legend entry keeps the text as typed", () => {
    const p = fixtureProject();
    p.figure.title = "Limits on g_{aγγ}";
    p.curves[0].label = "SU(3)_L dip";
    const scene = buildScene(p);
    const title = textNodes(scene, "axes").find((t) => t.id === "figure-title")!;
    expect(title.runs).toEqual([{ text: "Limits on g" }, { text: "aγγ", shift: "sub" }]);
    const entry = textNodes(scene, "legend").find((t) => t.data?.["curve-id"] === "dip")!;
    expect(entry.runs).toEqual([{ text: "SU(3)" }, { text: "L", shift: "sub" }, { text: " dip" }]);
    expect(entry.data?.["legend-entry"]).toBe("SU(3)_L dip");
  });

  test("a file-name label is drawn as one plain run, as before", () => {
    const p = fixtureProject();
    p.curves[0].label = "my_curve.csv";
    const entry = textNodes(buildScene(p), "legend").find((t) => t.data?.["curve-id"] === "dip")!;
    expect(entry.runs).toEqual([{ text: "my_curve.csv" }]);
  });
});
