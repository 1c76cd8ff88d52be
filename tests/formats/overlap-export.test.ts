// Exports of the overlap summary: LaTeX that compiles in principle (balanced braces, escaped % & _ #, one line
// per row, a golden file), CSV and Markdown, the caption, and numbers that keep intervals apart.
// LaTeX rules: the ten special characters # $ % & \ ^ _ { } ~ must be escaped (Lamport, "LaTeX: A Document
// Preparation System", 2nd ed. 1994, §2.2.1, from memory); booktabs rules \toprule \midrule \bottomrule
// (booktabs package documentation, Fear 2020); siunitx \num, \SI, \SIrange (siunitx manual, Wright).
import { readFileSync, writeFileSync, existsSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, test } from "vitest";
import { gAgg, REF_2019 } from "../../src/physics";
import { emptyProject, newCurve, newModel } from "../../src/project/defaults";
import { overlapSummary } from "../../src/analysis/overlap-summary";
import { summaryToLatex, latexEscape } from "../../src/formats/overlap/latex";
import { intervalsToCsv, summaryCaption, summaryToCsv, summaryToMarkdown } from "../../src/formats/overlap/exports";
import { distinctDigits, massUnitFor, withUncertainty } from "../../src/formats/overlap/numbers";

const GOLDEN = fileURLToPath(new URL("./golden/overlap-summary.tex", import.meta.url));

/** Two models × two curves; labels carry every character LaTeX treats specially. */
function project() {
  const p = emptyProject("export test");
  const k = gAgg(1, 0, { ref: "2019" });
  p.models = [
    newModel({ id: "ksvz", label: "KSVZ_like #1 (50% & more)", eOverNMin: "0" }),
    newModel({ id: "band", label: "band {a} ~ $x^2$ \\ μ", eOverNMin: "3", eOverNMax: "10" }),
  ];
  // A stepped curve: the E/N = 0 line is excluded on [2, 3] μeV and [5, 6] μeV (curve e below the line there).
  const m = [1e-6, 2e-6, 2e-6, 3e-6, 3e-6, 5e-6, 5e-6, 6e-6, 6e-6, 1e-5];
  const s = [1, 1, -1, -1, 1, 1, -1, -1, 1, 1];
  p.curves = [
    newCurve({
      id: "scan",
      label: "Scan_A 100% #2",
      massEv: Float64Array.from(m),
      gInvGeV: Float64Array.from(m.map((x, i) => k * x * Math.exp(s[i]))),
    }),
    newCurve({ id: "far", label: "far", massEv: Float64Array.from([1, 2]), gInvGeV: Float64Array.from([1, 1]) }),
  ];
  return p;
}

function braceBalance(tex: string): number {
  let depth = 0;
  for (let i = 0; i < tex.length; i++) {
    if (tex[i] === "\\") {
      i++; // an escaped character (\{, \}, \%) is not a group
      continue;
    }
    if (tex[i] === "{") depth++;
    if (tex[i] === "}") depth--;
    if (depth < 0) return -1;
  }
  return depth;
}

describe("LaTeX export", () => {
  const rows = overlapSummary(project()).filter((r) => r.verdict !== "none");

  test("one line per summary row between \\midrule and \\bottomrule, braces balanced, specials escaped", () => {
    expect(rows.length).toBe(2);
    for (const numbers of ["siunitx", "plain"] as const) {
      const tex = summaryToLatex(rows, { numbers });
      expect(braceBalance(tex)).toBe(0);
      const body = tex
        .slice(tex.indexOf("\\midrule") + 8, tex.indexOf("\\bottomrule"))
        .trim()
        .split("\n");
      expect(body.length).toBe(rows.length);
      for (const line of body) {
        // No unescaped % & _ # $ inside labels: every & is a column separator (7 per line).
        expect(line.match(/(?<!\\)&/g)?.length).toBe(7);
        expect(line).not.toMatch(/(?<!\\)[%_#]/);
      }
      expect(tex).toContain("KSVZ\\_like \\#1 (50\\% \\& more)");
      expect(tex).toContain("\\toprule");
    }
  });

  test("escaping of every special character", () => {
    expect(latexEscape("a_b%c&d#e$f{g}h~i^j\\k")).toBe(
      "a\\_b\\%c\\&d\\#e\\$f\\{g\\}h\\textasciitilde{}i\\textasciicircum{}j\\textbackslash{}k",
    );
    expect(latexEscape("μeV <b>")).toBe("\\ensuremath{\\mu}eV \\textless{}b\\textgreater{}");
  });

  test("golden file (siunitx)", () => {
    const tex = summaryToLatex(rows);
    if (!existsSync(GOLDEN)) writeFileSync(GOLDEN, tex);
    expect(tex).toBe(readFileSync(GOLDEN, "utf8"));
  });
});

describe("CSV, Markdown, caption", () => {
  const all = overlapSummary(project());

  test("summary CSV: header and one line per row; intervals CSV: one line per interval", () => {
    const csv = summaryToCsv(all).trimEnd().split("\n");
    expect(csv.length).toBe(1 + all.length);
    const iv = intervalsToCsv(all).trimEnd().split("\n");
    expect(iv.length).toBe(1 + all.reduce((s, r) => s + r.intervals.count, 0));
    // The E/N = 0 line over the scan: the two hand-made windows [2, 3] μeV and [5, 6] μeV.
    const line = all.find((r) => r.modelId === "ksvz" && r.curveId === "scan")!;
    expect(line.intervalCount).toBe(2);
    expect(line.shareAny).toBeCloseTo((Math.log(3 / 2) + Math.log(6 / 5)) / Math.log(10), 12);
  });

  test("Markdown: one table line per row, pipes escaped", () => {
    const mdLines = summaryToMarkdown(all).trimEnd().split("\n");
    expect(mdLines.length).toBe(2 + all.length);
    expect(mdLines.every((l) => l.startsWith("| ") && l.endsWith(" |"))).toBe(true);
  });

  test("caption: constants with uncertainties as published, share, range and count", () => {
    // c_γ = 1.92(4) (Grilli di Cortona et al., JHEP 01 (2016) 034); K = 5.691(51) μeV (Gorghetto & Villadoro 2019).
    expect(withUncertainty(REF_2019.cGamma, REF_2019.cGammaSigma)).toBe("1.92(4)");
    expect(withUncertainty(REF_2019.kMuEv, REF_2019.kMuEvSigma)).toBe("5.691(51)");
    const text = summaryCaption(all, REF_2019);
    expect(text.startsWith("With c_γ = 1.92(4) and K = 5.691(51) μeV, ")).toBe(true);
    // 2 windows, share (ln 1.5 + ln 1.2)/ln 10 = 25.5 % → "26 %", over 1–10 μeV.
    expect(text).toContain(
      "Scan_A 100% #2 excludes the KSVZ_like #1 (50% & more) model over 26 % of 1–10 μeV in 2 intervals",
    );
    expect(text.includes("\n")).toBe(false);
  });
});

describe("numbers", () => {
  test("digits grow until no two intervals print the same", () => {
    // 21.9012 and 21.9034 μeV agree to three figures (21.9) and differ at five (21.901 vs 21.903).
    const lo = [21.9012e-6, 21.9034e-6];
    const hi = [21.9021e-6, 21.9046e-6];
    expect(distinctDigits(lo, hi, 1e-6)).toBe(5);
    expect(distinctDigits([1e-6], [2e-6], 1e-6)).toBe(3);
  });

  test("mass unit by the range's middle", () => {
    expect(massUnitFor(1.5e-6, 3.6e-6).name).toBe("μeV");
    expect(massUnitFor(2e-9, 8e-9).name).toBe("neV");
    expect(massUnitFor(2e-3, 9e-3).name).toBe("meV");
  });
});
