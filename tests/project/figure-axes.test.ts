// The axis settings of the figure (mass unit, frequency unit, tick sides) joined schema version 1 without a
// bump: files and links written before them open with eV, the automatic frequency unit and outward ticks and
// no repair note, and draw the mass axis as before (m_a [eV], powers of ten); bad values are repaired with a
// note; links carry chosen values.
import { describe, expect, it } from "vitest";
import { restoreProject } from "../../src/project/restore";
import { defaultProject } from "../../src/project/demo";
import { decodeLink, encodeLink } from "../../src/data/index";
import { buildScene } from "../../src/plot/scene";
import type { TextNode } from "../../src/plot/scene-types";

function oldFile() {
  const p = defaultProject();
  const { massUnit: _m, frequencyUnit: _f, ticks: _t, ...figure } = p.figure;
  return { ...JSON.parse(JSON.stringify({ ...p, curves: [] })), figure };
}

describe("figure axis settings in files and links", () => {
  it("a project without the keys opens with eV, auto and outward ticks, with no repair note", () => {
    const r = restoreProject(oldFile());
    if (!r.ok) throw new Error(r.error);
    expect(r.repairs).toEqual([]);
    expect([r.project.figure.massUnit, r.project.figure.frequencyUnit, r.project.figure.ticks]).toEqual([
      "eV",
      "auto",
      "out",
    ]);
    const texts = buildScene(r.project)
      .layers.find((l) => l.id === "axes")!
      .nodes.filter((n): n is TextNode => n.kind === "text");
    expect(
      texts
        .find((n) => n.id === "xtitle")!
        .runs.map((x) => x.text)
        .join(""),
    ).toBe("ma [eV]");
    expect(texts.find((n) => n.id === "xlabel-1e-6")!.runs).toEqual([
      { text: "10" },
      { text: "\u22126", shift: "sup" },
    ]);
  });

  it("unknown values are repaired to the defaults and each repair is named", () => {
    const raw = oldFile();
    Object.assign(raw.figure, { massUnit: "furlong", frequencyUnit: "PHz", ticks: "inside" });
    const r = restoreProject(raw);
    if (!r.ok) throw new Error(r.error);
    expect([r.project.figure.massUnit, r.project.figure.frequencyUnit, r.project.figure.ticks]).toEqual([
      "eV",
      "auto",
      "out",
    ]);
    const notes = r.repairs.join(" ");
    for (const what of ["mass axis unit", "frequency unit", "tick sides"]) expect(notes).toContain(what);
  });

  it("a link keeps µeV, GHz and ticks on all four sides", () => {
    const p = defaultProject();
    const chosen = { ...p, figure: { ...p.figure, massUnit: "ueV", frequencyUnit: "GHz", ticks: "all" } as const };
    const back = decodeLink(encodeLink(chosen, { includeCurves: false }));
    if (!back.ok) throw new Error(back.error);
    expect(back.project.figure).toMatchObject({ massUnit: "ueV", frequencyUnit: "GHz", ticks: "all" });
  });
});
