// Tests for the model-line/band CSV export: values against the PDG closed form of g_aγγ(m_a), column layout,
// log-uniform sampling, cancellation (g_low = 0), theory spread, and labels that cannot break the format.
import { describe, expect, it } from "vitest";
import { MODEL_CSV_HEADER, logMasses, modelCsvBlocks, modelsToCsv } from "../../src/formats/model-csv";
import type { Model, Project } from "../../src/project/types";

function model(id: string, label: string, min: string, max = min, extra: Partial<Model> = {}): Model {
  return {
    id,
    label,
    kind: min === max ? "line" : "interval",
    eOverNMin: min,
    eOverNMax: max,
    members: [],
    setDraw: "extremes",
    setShare: 0.68,
    source: { kind: "typed" },
    colour: "#1f6f8b",
    lineStyle: "solid",
    fillOpacity: 0.25,
    visible: true,
    sigmas: 0,
    ...extra,
  };
}

function project(models: Model[], massRangeEv: [number, number] = [1e-6, 1e-3]): Project {
  return {
    version: 2,
    name: "test",
    physics: { ref: "2019", custom: { cGamma: 1.92, cGammaSigma: 0.04, kMuEv: 5.691, kMuEvSigma: 0.051, label: "x" } },
    models,
    curves: [],
    figure: {
      preset: "single-column",
      customWidthMm: 86,
      customHeightMm: 60,
      massRangeEv,
      yRange: [1e-17, 1e-10],
      yView: "coupling",
      topAxis: "none",
      grid: false,
      legend: "top-left",
      legendScale: 1,
      fontPt: 8,
      font: "sans",
      title: "",
      massUnit: "eV",
      frequencyUnit: "auto",
      ticks: "out",
    },
  };
}

/** Data rows of one block: numbers per column, comments and the header skipped. */
function rows(text: string): number[][] {
  return text
    .split("\n")
    .filter((l) => l !== "" && !l.startsWith("#") && l !== MODEL_CSV_HEADER)
    .map((l) => l.split(",").map(Number));
}

/**
 * PDG review "Axions and other similar particles" (Workman et al., PTEP 2022 083C01), closed form
 * g_aγγ = (0.203(3) E/N − 0.39(1)) m_a / GeV², from memory; the 1.5% and 2.6% uncertainties of the two
 * coefficients set the tolerance below.
 */
function pdgG(massEv: number, eOverN: number): number {
  return Math.abs(0.203 * eOverN - 0.39) * (massEv * 1e-9);
}

describe("modelCsvBlocks", () => {
  const p = project([
    model("a", "KSVZ-type", "0"),
    model("b", "DFSZ-type", "8/3"),
    model("c", "window", "5/3", "44/3"),
    model("d", "low band", "0", "1"),
  ]);
  const { blocks, skipped } = modelCsvBlocks(p, { points: 31 });

  it("writes one block per model with the four columns and the requested number of rows", () => {
    expect(skipped).toEqual([]);
    expect(blocks.map((b) => b.label)).toEqual(["KSVZ-type", "DFSZ-type", "window", "low band"]);
    for (const b of blocks) {
      expect(b.text.split("\n")).toContain("m_a [eV],f_a [GeV],g_low [GeV^-1],g_high [GeV^-1]");
      expect(rows(b.text)).toHaveLength(31);
      expect(rows(b.text).every((r) => r.length === 4 && r.every(Number.isFinite))).toBe(true);
      expect(b.fileName).toMatch(/^model-\d\d-[\w.-]+\.csv$/);
    }
    expect(blocks[1].text).toContain("# E/N = 8/3 (model line)");
    expect(blocks[2].text).toContain("# E/N = 5/3..44/3 (model band)");
  });

  it("matches the PDG closed form for E/N = 0 and 8/3 within its quoted uncertainties", () => {
    for (const [i, en] of [
      [0, 0],
      [1, 8 / 3],
    ] as const) {
      for (const [m, , lo, hi] of rows(blocks[i].text)) {
        expect(lo).toBe(hi); // a model line without theory spread
        expect(Math.abs(lo / pdgG(m, en) - 1)).toBeLessThan(0.03);
      }
    }
  });

  it("gives f_a from m_a·f_a = 5.691 μeV·10¹² GeV (Gorghetto & Villadoro, JHEP 03 (2019) 033)", () => {
    for (const [m, fa] of rows(blocks[0].text)) expect((m * fa) / 5.691e6).toBeCloseTo(1, 5);
  });

  it("has g_low = 0 for a band containing c_γ = 1.92 and the edge lines otherwise", () => {
    // c_γ = 1.92(4) (Grilli di Cortona et al., JHEP 01 (2016) 034) lies inside [5/3, 44/3] but not in [0, 1].
    for (const [m, , lo, hi] of rows(blocks[2].text)) {
      expect(lo).toBe(0);
      expect(Math.abs(hi / pdgG(m, 44 / 3) - 1)).toBeLessThan(0.03);
    }
    for (const [m, , lo, hi] of rows(blocks[3].text)) {
      expect(Math.abs(lo / pdgG(m, 1) - 1)).toBeLessThan(0.03);
      expect(Math.abs(hi / pdgG(m, 0) - 1)).toBeLessThan(0.03);
    }
  });

  it("between lines 5/3 | 44/3 (PRL 118 (2017) 031801) has the 5/3 line as g_low, never 0", () => {
    const between = model("w", "window", "5/3", "44/3", {
      kind: "between",
      members: [
        { eOverN: "5/3", count: 1 },
        { eOverN: "44/3", count: 1 },
      ],
    });
    const text = modelCsvBlocks(project([between])).blocks[0].text;
    expect(text).toContain("# E/N lines = 5/3 | 44/3 (between lines 5/3 | 44/3)");
    for (const [m, , lo, hi] of rows(text)) {
      expect(lo).toBeGreaterThan(0);
      expect(Math.abs(lo / pdgG(m, 5 / 3) - 1)).toBeLessThan(0.03);
      expect(Math.abs(hi / pdgG(m, 44 / 3) - 1)).toBeLessThan(0.03);
    }
  });

  it("samples log-uniformly over the figure's mass range, ends included", () => {
    const ms = rows(blocks[0].text).map((r) => r[0]);
    expect(ms[0]).toBeCloseTo(1e-6, 12);
    expect(ms.at(-1)).toBeCloseTo(1e-3, 9);
    const ratios = ms.slice(1).map((m, i) => m / ms[i]);
    for (const r of ratios) expect(r).toBeCloseTo(10 ** (3 / 30), 4);
    const exact = logMasses(1e-6, 1e-3, 4);
    expect(Array.from(exact)).toEqual([1e-6, expect.closeTo(1e-5, 15), expect.closeTo(1e-4, 14), 1e-3]);
  });

  it("widens a line by its theory spread on both sides", () => {
    const spread = modelCsvBlocks(project([model("s", "spread", "8/3", "8/3", { sigmas: 2 })]), { points: 5 })
      .blocks[0];
    for (const [m, , lo, hi] of rows(spread.text)) {
      const central = pdgG(m, 8 / 3);
      expect(lo).toBeLessThan(central);
      expect(hi).toBeGreaterThan(central);
    }
    expect(spread.text).toContain("theory spread");
  });

  it("uses the project's custom constants", () => {
    // c_γ = 1.95, the older coefficient behind the often quoted g_γ = −0.97 for E/N = 0 (PDG
    // review "Axions and other similar particles", earlier editions, from memory); K = 5.70 μeV (JHEP 01 (2016) 034).
    const q = project([model("k", "KSVZ-type", "0")]);
    q.physics = {
      ref: "custom",
      custom: { cGamma: 1.95, cGammaSigma: 0.08, kMuEv: 5.7, kMuEvSigma: 0.07, label: "older" },
    };
    const b = modelCsvBlocks(q, { points: 3 }).blocks[0];
    expect(b.text).toContain("c_gamma = 1.95");
    for (const [m, fa, lo] of rows(b.text)) {
      expect(m * fa).toBeCloseTo(5.7e6, 0);
      // α/(2π f_a)·|0 − 1.95| with α from CODATA 2018; the file keeps 7 significant digits.
      expect(lo / ((7.2973525693e-3 / (2 * Math.PI * fa)) * 1.95)).toBeCloseTo(1, 6);
    }
  });

  it("skips hidden models unless asked and reports unreadable E/N", () => {
    const q = project([model("h", "hidden", "1", "1", { visible: false }), model("x", "broken", "eight thirds")]);
    const r = modelCsvBlocks(q);
    expect(r.blocks).toEqual([]);
    expect(r.skipped.map((s) => s.modelId)).toEqual(["x"]);
    expect(modelCsvBlocks(q, { includeHidden: true }).blocks.map((b) => b.modelId)).toEqual(["h"]);
  });

  it("keeps a hostile label on its comment line", () => {
    const label = 'evil\n1,2,3,4\r\n<script>alert(1)</script>"><img src=x onerror=alert(1)>';
    const text = modelsToCsv(project([model("e", label, "8/3")]), { points: 3 });
    expect(rows(text)).toHaveLength(3);
    const labelLines = text.split("\n").filter((l) => l.includes("<script>"));
    expect(labelLines.length).toBeGreaterThan(0);
    expect(labelLines.every((l) => l.startsWith("#"))).toBe(true);
  });

  it("puts every block in one text, separated by blank lines", () => {
    const text = modelsToCsv(p, { points: 3 });
    expect(text.split("\n").filter((l) => l === MODEL_CSV_HEADER)).toHaveLength(4);
    expect(text).toContain('# axband model lines and bands of project "test"');
    expect(text.split("\n\n").length).toBeGreaterThanOrEqual(4);
  });
});
