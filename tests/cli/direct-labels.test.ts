// The command line's --legend on-plot: parsed like every legend place, listed in the usage, and the figure it
// draws carries each curve's and model's label on the plot instead of a legend box.
import { describe, expect, it } from "vitest";
import { parseArgs, USAGE } from "../../src/cli/args";
import { applyFigureOptions } from "../../src/cli/inputs";
import { buildScene } from "../../src/plot/scene";
import { writeSvg } from "../../src/plot/svg";
import { defaultProject } from "../../src/project/demo";

describe("--legend on-plot", () => {
  it("is read as the legend place and documented in the usage", () => {
    const r = parseArgs(["p.axband.json", "-o", "f.svg", "--legend", "on-plot"]);
    expect(r.ok && r.options.legend).toBe("on-plot");
    expect(USAGE).toMatch(/on-plot \(each label beside/);
  });

  it("draws the labels on the plot and no legend box", () => {
    const r = parseArgs(["p.axband.json", "-o", "f.svg", "--legend=on-plot", "--preset", "single-column"]);
    if (!r.ok) throw new Error(r.error);
    const p = applyFigureOptions(defaultProject(), r.options);
    const svg = writeSvg(buildScene(p));
    for (const c of p.curves) expect(svg).toContain(`data-curve-id="${c.id}" data-direct-label="auto"`);
    expect(svg).toContain('id="label-model-1"');
    expect(svg).not.toContain("data-legend-entry");
  });
});
