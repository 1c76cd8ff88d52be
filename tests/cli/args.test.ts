// Tests for the renderer's argument parser and helpers: roles per CSV file, ranges, presets, conflicting or
// unknown options, fitted axis ranges, PNG pixel sizes and the all-or-nothing writer.
import { describe, expect, it } from "vitest";
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { parseArgs, USAGE } from "../../src/cli/args";
import { fitRanges } from "../../src/cli/fit-ranges";
import { prepareCurve } from "../../src/analysis/prepared-curve";
import { computePrepared } from "../../src/plot/prepare-transfer";
import { pngPixelSize, renderPng } from "../../src/cli/png";
import { FIGURE_FONT_CSS } from "../../src/plot/scene";
import { writeAllOrNothing } from "../../src/cli/write-atomic";
import { applyFigureOptions, undrawablePointNotes } from "../../src/cli/inputs";
import { smallProject, tempDir } from "./fixtures";

function ok(argv: string[]) {
  const r = parseArgs(argv);
  if (!r.ok) throw new Error(r.error);
  return r.options;
}
function err(argv: string[]): string {
  const r = parseArgs(argv);
  if (r.ok) throw new Error(`expected an error for ${argv.join(" ")}`);
  return r.error;
}

describe("parseArgs", () => {
  it("--exclusions takes hatch, fill or hatch-fill and sets every exclusion curve, nothing else", () => {
    expect(ok(["p.axband.json", "-o", "f.svg", "--exclusions", "fill"]).exclusions).toBe("fill");
    expect(ok(["p.axband.json", "-o", "f.svg"]).exclusions).toBeUndefined();
    expect(err(["p.axband.json", "-o", "f.svg", "--exclusions", "stripes"])).toMatch(/--exclusions: expected hatch/);
    const p = smallProject();
    const opts = ok(["p.axband.json", "-o", "f.svg", "--exclusions", "hatch-fill"]);
    const q = applyFigureOptions(p, opts);
    for (const [i, c] of q.curves.entries())
      expect(c.exclusionMark).toBe(c.role === "exclusion" ? "hatch-fill" : p.curves[i].exclusionMark);
    expect(q.curves.some((c) => c.role === "exclusion")).toBe(true);
  });

  it("reads a project file with SVG and PNG outputs, dpi and preset", () => {
    const o = ok(["p.axband.json", "-o", "f.svg", "--png=f.png", "--dpi", "600", "--preset", "single-column"]);
    expect(o.inputs).toEqual([{ path: "p.axband.json", kind: "project", role: "exclusion" }]);
    expect([o.out, o.png, o.dpi, o.preset, o.embed]).toEqual(["f.svg", "f.png", 600, "single-column", true]);
  });

  it("defaults to 300 dpi and recognises exported SVG input", () => {
    const o = ok(["figure.svg", "--png", "f.png"]);
    expect(o.dpi).toBe(300);
    expect(o.inputs[0].kind).toBe("svg");
  });

  it("gives each CSV file the --role before it; files before any --role are exclusions", () => {
    const o = ok(["a.csv", "--role", "projection", "b.csv", "c.txt", "--role", "region", "d.dat", "-o", "x.svg"]);
    expect(o.inputs.map((f) => [f.path, f.kind, f.role])).toEqual([
      ["a.csv", "csv", "exclusion"],
      ["b.csv", "csv", "projection"],
      ["c.txt", "csv", "projection"],
      ["d.dat", "csv", "region"],
    ]);
    // A --role after the last file must not reach back to earlier files (issue 16); it is refused, not dropped.
    expect(err(["a.csv", "b.csv", "--role", "region", "-o", "x.svg"])).toMatch(/--role region .*no CSV file/);
    expect(ok(["a.csv", "-o", "x.svg"]).inputs[0].role).toBe("exclusion");
  });

  it("says in --help that --role applies to the files after it", () => {
    expect(USAGE).toMatch(/files after it/);
    expect(USAGE).toMatch(/before any --role are exclusions/);
    expect(USAGE).not.toMatch(/take the first one given/);
  });

  it("collects repeated --model values and reads ranges", () => {
    const o = ok([
      "a.csv",
      "--model",
      "8/3",
      "--model",
      "0..44/3",
      "--mass-range",
      "1e-10:1e-1",
      "--g-range=1e-17,1e-7",
      "-o",
      "x.svg",
    ]);
    expect(o.models).toEqual(["8/3", "0..44/3"]);
    expect(o.massRangeEv).toEqual([1e-10, 1e-1]);
    expect(o.gRange).toEqual([1e-17, 1e-7]);
  });

  it("treats everything after -- as files", () => {
    expect(ok(["-o", "x.svg", "--", "--weird.csv"]).inputs[0].path).toBe("--weird.csv");
  });

  it("refuses unknown options, missing values, bad numbers and conflicting inputs", () => {
    expect(err(["a.csv", "-o", "x.svg", "--frobnicate"])).toMatch(/unknown option --frobnicate/);
    expect(err(["a.csv", "-o"])).toMatch(/-o needs a value/);
    expect(err(["a.csv", "-o", "x.svg", "--dpi", "-3"])).toMatch(/--dpi/);
    expect(err(["a.csv", "-o", "x.svg", "--preset", "poster"])).toMatch(/--preset/);
    expect(err(["a.csv", "-o", "x.svg", "--role", "limit"])).toMatch(/--role/);
    expect(err(["a.csv", "-o", "x.svg", "--mass-range", "1e-3:1e-6"])).toMatch(/below/);
    expect(err(["a.csv", "-o", "x.svg", "--g-range", "0:1"])).toMatch(/positive/);
    expect(err(["p.json", "a.csv", "-o", "x.svg"])).toMatch(/either one project/);
    expect(err(["p.json", "-o", "x.svg", "--model", "1"])).toMatch(/CSV input only/);
    expect(err(["a.csv"])).toMatch(/nothing to write/);
    expect(err(["-o", "x.svg"])).toMatch(/no input/);
    expect(err(["a.csv", "-o", "a.csv"])).toMatch(/also an input/);
    expect(err(["a.csv", "-o", "x.svg", "--png", "x.svg"])).toMatch(/same path/);
    expect(err(["a.csv", "--png", "x.png", "--dpi", "300", "--scale", "2"])).toMatch(/not both/);
    expect(err(["a.csv", "-o", "x.svg", "--width-mm", "100"])).toMatch(/--preset custom/);
    expect(err(["a.csv", "-o", "x.svg", "--no-embed=1"])).toMatch(/no value/);
  });

  it("reads --legend PLACE and --legend-scale K, refusing unknown places and sizes out of 0.7–1.5", () => {
    const o = ok(["p.axband.json", "-o", "f.svg", "--legend", "below", "--legend-scale=0.85"]);
    expect([o.legend, o.legendScale]).toEqual(["below", 0.85]);
    for (const place of ["auto", "top-left", "outside-right", "above", "hidden"])
      expect(ok(["p.axband.json", "-o", "f.svg", `--legend=${place}`]).legend).toBe(place);
    expect(err(["p.axband.json", "-o", "f.svg", "--legend", "middle"])).toMatch(/--legend: expected one of .*below/);
    expect(err(["p.axband.json", "-o", "f.svg", "--legend-scale", "2"])).toMatch(/--legend-scale: .*0\.7 to 1\.5/);
    expect(USAGE).toMatch(/--legend PLACE/);
    expect(USAGE).toMatch(/--legend-scale K/);
  });

  it("accepts --help without inputs", () => {
    expect(ok(["--help"]).help).toBe(true);
  });
});

describe("fitRanges", () => {
  it("encloses the positive data in whole decades", () => {
    const r = fitRanges([{ massEv: Float64Array.of(3e-6, 2e-4), gInvGeV: Float64Array.of(5e-14, 7e-12) }]);
    expect(r).toEqual({ massRangeEv: [1e-6, 1e-3], gRange: [1e-14, 1e-11] });
  });

  it("ignores non-positive and non-finite points and widens a single point to a decade", () => {
    const r = fitRanges([
      { massEv: Float64Array.of(-1, 0, 1e-5, Number.NaN), gInvGeV: Float64Array.of(1, 1, 1e-13, 1) },
    ]);
    expect(r).toBeDefined();
    const [lo, hi] = r?.massRangeEv ?? [1, 1];
    expect(hi / lo).toBeCloseTo(10, 9);
    expect(lo).toBeLessThanOrEqual(1e-5);
    expect(hi).toBeGreaterThanOrEqual(1e-5);
    expect(fitRanges([{ massEv: Float64Array.of(0), gInvGeV: Float64Array.of(1) }])).toBeUndefined();
    expect(fitRanges([])).toBeUndefined();
  });

  it("reads curves prepared for drawing (sorted with a pyramid, or in file order) as it reads raw arrays", () => {
    const curves = [0, 1, 2].map((k) => {
      const n = 5000;
      const massEv = Float64Array.from({ length: n }, (_, i) => (i % 7 === 3 ? -1 : 1e-7 * (1 + ((i * 7919) % n) + k)));
      const gInvGeV = Float64Array.from({ length: n }, (_, i) =>
        i % 11 === 5 ? 0 : 1e-13 * (1 + ((i * 104729) % 997)),
      );
      return { massEv, gInvGeV };
    });
    const raw = curves.map((c) => ({ massEv: c.massEv.slice(), gInvGeV: c.gInvGeV.slice() }));
    computePrepared(curves[0].massEv, curves[0].gInvGeV, true, { slopes: [0] });
    prepareCurve(curves[1].massEv, curves[1].gInvGeV, true);
    prepareCurve(curves[2].massEv, curves[2].gInvGeV, false);
    expect(fitRanges(curves)).toEqual(fitRanges(raw));
    expect(fitRanges(curves)).toEqual({ massRangeEv: [1e-7, 0.001], gRange: [1e-13, 1e-10] });
  });

  it("spans several curves", () => {
    const r = fitRanges([
      { massEv: Float64Array.of(1.5e-9), gInvGeV: Float64Array.of(2e-16) },
      { massEv: Float64Array.of(0.05), gInvGeV: Float64Array.of(3e-8) },
    ]);
    expect(r).toEqual({ massRangeEv: [1e-9, 0.1], gRange: [1e-16, 1e-7] });
  });
});

describe("PNG sizing and fonts", () => {
  it("makes 8.6 cm at 300 dpi 1016 px and 17.8 cm at 300 dpi 2102 px", () => {
    // 1 in = 2.54 cm exactly: 8.6/2.54·300 = 1015.7, 17.8/2.54·300 = 2102.4.
    expect(pngPixelSize(8.6 / 2.54, 6.45 / 2.54, 300)).toEqual({ widthPx: 1016, heightPx: 762 });
    expect(pngPixelSize(17.8 / 2.54, 10.68 / 2.54, 300).widthPx).toBe(2102);
  });

  it("draws text with the figure font's own files (no system font needed): serif and sans differ", () => {
    const svg = (family: string) =>
      `<svg xmlns="http://www.w3.org/2000/svg" width="200" height="40" viewBox="0 0 200 40"><text x="4" y="30" font-size="24" font-family="${family}">Rag 10 μeV</text></svg>`;
    const sans = renderPng(svg(FIGURE_FONT_CSS.sans), 200, 96, "sans");
    const serif = renderPng(svg(FIGURE_FONT_CSS.serif), 200, 96, "serif");
    const blank = renderPng(svg(FIGURE_FONT_CSS.sans).replace(/>Rag 10 μeV</, "><"), 200, 96, "sans");
    expect(Buffer.from(sans).equals(Buffer.from(blank))).toBe(false);
    expect(Buffer.from(sans).equals(Buffer.from(serif))).toBe(false);
  });
});

describe("writeAllOrNothing", () => {
  it("writes every file and leaves no temporary file", () => {
    const dir = tempDir();
    writeAllOrNothing([
      { path: join(dir, "a.svg"), data: "<svg/>" },
      { path: join(dir, "b.png"), data: Uint8Array.of(1, 2, 3) },
    ]);
    expect(readdirSync(dir).sort()).toEqual(["a.svg", "b.png"]);
    expect(readFileSync(join(dir, "a.svg"), "utf8")).toBe("<svg/>");
  });

  it("writes nothing when one target cannot be written", () => {
    const dir = tempDir();
    // The second target's directory does not exist: its temporary file fails after the first one was written.
    expect(() =>
      writeAllOrNothing([
        { path: join(dir, "first.svg"), data: "x" },
        { path: join(dir, "missing-dir", "second.svg"), data: "y" },
      ]),
    ).toThrow();
    expect(existsSync(join(dir, "first.svg"))).toBe(false);
    expect(readdirSync(dir)).toEqual([]);
  });
});

describe("undrawablePointNotes", () => {
  it("names curves with points a log axis cannot show and counts them", () => {
    const p = smallProject();
    const bad = {
      ...p.curves[0],
      massEv: Float64Array.of(1e-6, 0, 2e-6, 3e-6),
      gInvGeV: Float64Array.of(1e-13, 1e-13, -1, Number.NaN),
    };
    const notes = undrawablePointNotes({ ...p, curves: [bad, p.curves[1]] }, "x.axband.json");
    expect(notes).toHaveLength(1);
    expect(notes[0]).toMatch(/x\.axband\.json: curve "Demo scan \(invented\)" has 3 point\(s\)/);
    expect(undrawablePointNotes(p, "ok.json")).toEqual([]);
  });
});
