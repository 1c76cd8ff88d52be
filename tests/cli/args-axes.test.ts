// The renderer's axis options: --axis-unit (eV, meV, ueV or µeV, neV), --top-axis, --frequency-unit, --ticks,
// --mass-range with units (m = hν for frequencies, h = 4.135667696×10⁻¹⁵ eV·s, CODATA 2018, exact), their
// refusals and help text, and a render that writes the chosen axis titles.
import { describe, expect, it } from "vitest";
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { parseArgs, USAGE } from "../../src/cli/args";
import { applyFigureOptions } from "../../src/cli/inputs";
import { projectFileText, runRender, smallProject, tempDir } from "./fixtures";

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

describe("axis options", () => {
  it("reads the unit in its spellings, the top axis, the frequency unit and the tick sides", () => {
    for (const u of ["ueV", "µeV", "μeV"])
      expect(ok(["p.axband.json", "-o", "f.svg", "--axis-unit", u]).axisUnit).toBe("ueV");
    const o = ok(
      ["p.axband.json", "-o", "f.svg", "--axis-unit=neV", "--top-axis", "frequency"].concat([
        "--frequency-unit",
        "GHz",
        "--ticks",
        "all",
      ]),
    );
    expect([o.axisUnit, o.topAxis, o.frequencyUnit, o.ticks]).toEqual(["neV", "frequency", "GHz", "all"]);
    const f = applyFigureOptions(smallProject(), o).figure;
    expect([f.massUnit, f.topAxis, f.frequencyUnit, f.ticks]).toEqual(["neV", "frequency", "GHz", "all"]);
    // Options not given leave the project's own settings.
    expect(applyFigureOptions(smallProject(), ok(["p.axband.json", "-o", "f.svg"])).figure).toEqual(
      smallProject().figure,
    );
  });

  it("refuses values outside the lists, naming the option", () => {
    expect(err(["p.axband.json", "-o", "f.svg", "--axis-unit", "GeV"])).toMatch(/--axis-unit: expected one of eV/);
    expect(err(["p.axband.json", "-o", "f.svg", "--top-axis", "ghz"])).toMatch(/--top-axis: expected one of none/);
    expect(err(["p.axband.json", "-o", "f.svg", "--frequency-unit", "PHz"])).toMatch(/--frequency-unit/);
    expect(err(["p.axband.json", "-o", "f.svg", "--ticks", "in"])).toMatch(/--ticks: expected one of out, all/);
  });

  it("--mass-range takes units on each end: 5ueV:1.2GHz is 5×10⁻⁶ eV to 1.2×10⁹·h eV; bare numbers stay eV", () => {
    const r = ok(["a.csv", "-o", "x.svg", "--mass-range", "1ueV:1.2GHz"]).massRangeEv!;
    expect(r[0] / 1e-6).toBeCloseTo(1, 12);
    expect(r[1] / (1.2e9 * 4.135667696e-15)).toBeCloseTo(1, 12);
    expect(ok(["a.csv", "-o", "x.svg", "--mass-range", "1e-7:1e-2"]).massRangeEv).toEqual([1e-7, 1e-2]);
    expect(err(["a.csv", "-o", "x.svg", "--mass-range", "1 parsec:2"])).toMatch(/--mass-range: “parsec”/);
  });

  it("--help lists the options", () => {
    for (const flag of ["--axis-unit", "--top-axis none|fa|frequency", "--frequency-unit", "--ticks out|all"])
      expect(USAGE).toContain(flag);
  });

  it("renders the axis titles in the chosen units", async () => {
    const dir = tempDir();
    const projectPath = join(dir, "p.axband.json");
    const svgPath = join(dir, "f.svg");
    writeFileSync(projectPath, projectFileText(smallProject()));
    const argv = [projectPath, "-o", svgPath, "--axis-unit", "µeV", "--top-axis", "frequency", "--frequency-unit"];
    const run = await runRender([...argv, "GHz", "--no-embed"]);
    expect(run.status).toBe(0);
    const svg = readFileSync(svgPath, "utf8");
    expect(svg).toMatch(/ \[μeV\]/);
    expect(svg).toMatch(/ \[GHz\]/);
  });
});
