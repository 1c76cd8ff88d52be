// Direct-label places (Curve.labelAt, Model.labelAt) and the legend place "on-plot" in files, links and storage:
// projects without them read unchanged (no key added, no repair note), a bad value is repaired with a note, and
// a link or file carries them.
import { describe, expect, it } from "vitest";
import { restoreProject } from "../../src/project/restore";
import { defaultProject } from "../../src/project/demo";
import { decodeLink, encodeLink } from "../../src/data/index";
import { projectFromFile, projectToFile } from "../../src/formats/project-file";
import { ProjectSchema } from "../../src/project/schema";
import type { Project } from "../../src/project/types";

function moved(): Project {
  const p = defaultProject();
  p.figure.legend = "on-plot";
  p.curves[1].labelAt = [2e-4, 3e-11];
  p.models[0].labelAt = [1e-5, 4e-14];
  return p;
}

describe("labelAt and legend on-plot", () => {
  it("a project without them restores as written: no labelAt key, no repair", () => {
    const raw = JSON.parse(projectToFile(defaultProject()));
    const r = restoreProject(raw);
    expect(r.ok && r.repairs).toEqual([]);
    expect(r.ok && r.project.curves.some((c) => "labelAt" in c)).toBe(false);
    expect(r.ok && r.project.models.some((m) => "labelAt" in m)).toBe(false);
  });

  it("the schema accepts both, and refuses a non-positive place", () => {
    const p = moved();
    expect(ProjectSchema.safeParse(p).success).toBe(true);
    p.curves[0].labelAt = [0, 1e-12];
    expect(ProjectSchema.safeParse(p).success).toBe(false);
  });

  it("a bad place is dropped (automatic) with a note naming it", () => {
    const raw = JSON.parse(projectToFile(moved()));
    raw.curves[1].labelAt = ["left", 1];
    const r = restoreProject(raw);
    expect(r.ok && r.project.curves[1].labelAt).toBeUndefined();
    expect(r.ok && r.repairs.join(" ")).toMatch(/label position/);
  });

  it("a project file keeps them", () => {
    const back = projectFromFile(projectToFile(moved()));
    expect(back.ok && back.project.curves[1].labelAt).toEqual([2e-4, 3e-11]);
    expect(back.ok && back.project.models[0].labelAt).toEqual([1e-5, 4e-14]);
    expect(back.ok && back.project.figure.legend).toBe("on-plot");
  });

  it("a link keeps them, and a link without them is as long as before and decodes without them", () => {
    const back = decodeLink(encodeLink(moved(), { includeCurves: true }));
    expect(back.ok && back.project.curves[1].labelAt).toEqual([2e-4, 3e-11]);
    expect(back.ok && back.project.models[0].labelAt).toEqual([1e-5, 4e-14]);
    expect(back.ok && back.project.figure.legend).toBe("on-plot");
    const plain = defaultProject();
    const link = encodeLink(plain, { includeCurves: false });
    const again = decodeLink(link);
    expect(again.ok && again.project.models.every((m) => m.labelAt === undefined)).toBe(true);
    expect(link).not.toMatch(/la/);
  });
});
