// One custom figure size limit: the schema accepts, restore keeps and the plot draws the same 20–1000 mm, so a
// stored size is the size drawn (they once disagreed: the schema took 2000 mm, the drawing stopped at 1000 mm).
import { describe, expect, it } from "vitest";
import { presetOf } from "../../src/plot/layout";
import { CUSTOM_MM_LIMITS } from "../../src/project/limits";
import { defaultProject } from "../../src/project/demo";
import { restoreProject } from "../../src/project/restore";
import { ProjectSchema } from "../../src/project/schema";
import { projectToJsonValue } from "../../src/project/json";

function withSize(widthMm: number, heightMm: number) {
  const p = defaultProject();
  return { ...p, figure: { ...p.figure, preset: "custom" as const, customWidthMm: widthMm, customHeightMm: heightMm } };
}

describe("custom figure size limits", () => {
  it("the schema accepts exactly the sizes the plot draws as given", () => {
    const [lo, hi] = CUSTOM_MM_LIMITS;
    for (const [w, h] of [
      [lo, hi],
      [hi, lo],
    ]) {
      expect(ProjectSchema.safeParse(projectToJsonValue(withSize(w, h))).success).toBe(true);
      const drawn = presetOf(withSize(w, h).figure);
      expect([drawn.widthMm, drawn.heightMm]).toEqual([w, h]);
    }
    for (const [w, h] of [
      [lo - 1, 100],
      [100, hi + 1],
    ])
      expect(ProjectSchema.safeParse(projectToJsonValue(withSize(w, h))).success).toBe(false);
  });

  it("restore clamps a stored size beyond the limits to the size the plot draws, and says so", () => {
    const r = restoreProject(projectToJsonValue(withSize(1500, 10)));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect([r.project.figure.customWidthMm, r.project.figure.customHeightMm]).toEqual([1000, 20]);
    const drawnBefore = presetOf(withSize(1500, 10).figure);
    expect([drawnBefore.widthMm, drawnBefore.heightMm]).toEqual([1000, 20]);
    expect(r.repairs.join("\n")).toMatch(/figure, custom width: 1500 is out of range; set to 1000/);
    expect(r.repairs.join("\n")).toMatch(/figure, custom height: 10 is out of range; set to 20/);
  });
});
