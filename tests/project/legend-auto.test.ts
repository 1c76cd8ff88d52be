// The "auto" legend place in the project data: the default of new projects, valid in the schema, kept by
// links, project files and browser storage, while links that leave the legend out still mean "bottom-right"
// (the frozen v1 base value of the link format, src/formats/codec/v1.ts) and older files keep their value.
// Links are unpacked here by hand: base64url (RFC 4648 §5) of raw DEFLATE (RFC 1951) of the compact JSON.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { inflateSync } from "fflate";
import { describe, expect, it } from "vitest";
import { linkPayload } from "../formats/link-parts";
import {
  ProjectSchema,
  base64UrlDecode,
  decodeLink,
  defaultFigure,
  defaultProject,
  deserializeFromStorage,
  encodeLink,
  projectFromFile,
  projectToFile,
  projectToJsonValue,
  restoreProject,
  serializeForStorage,
} from "../../src/data/index";
import type { LegendPlace, Project } from "../../src/project/types";

const GOLDEN = join(import.meta.dirname, "golden", "v1");

/** The compact JSON object inside a link (formats v2 and v3 keep the v1 figure keys). */
function compactOf(link: string): { f?: Record<string, unknown> } {
  const bytes = base64UrlDecode(linkPayload(link));
  if (!bytes) throw new Error("not base64url");
  return JSON.parse(new TextDecoder().decode(inflateSync(bytes)));
}

function withLegend(legend: LegendPlace): Project {
  const p = defaultProject();
  p.figure = { ...p.figure, legend };
  return p;
}

describe('legend "auto"', () => {
  it("is the default of new projects and of the demo", () => {
    expect(defaultFigure().legend).toBe("auto");
    expect(defaultProject().figure.legend).toBe("auto");
  });

  it("passes the strict schema, and so does every other place", () => {
    for (const legend of [
      "auto",
      "top-left",
      "top-right",
      "bottom-left",
      "bottom-right",
      "outside-right",
      "hidden",
    ] as const) {
      expect(ProjectSchema.safeParse(projectToJsonValue(withLegend(legend))).success, legend).toBe(true);
    }
    expect(
      ProjectSchema.safeParse({
        ...projectToJsonValue(defaultProject()),
        figure: { ...defaultFigure(), legend: "middle" },
      }).success,
    ).toBe(false);
  });

  it("round-trips through a link (with and without curves), written out because it differs from the link's base", () => {
    for (const includeCurves of [true, false]) {
      const link = encodeLink(withLegend("auto"), { includeCurves });
      expect(compactOf(link).f?.l).toBe("auto");
      const r = decodeLink(link);
      if (!r.ok) throw new Error(r.error);
      expect(r.repairs).toEqual([]);
      expect(r.project.figure.legend).toBe("auto");
    }
  });

  it('a link that leaves the legend out still decodes to "bottom-right", not to today\'s default', () => {
    const link = encodeLink(withLegend("bottom-right"), { includeCurves: false });
    const f = compactOf(link).f ?? {};
    expect(Object.hasOwn(f, "l")).toBe(false);
    const r = decodeLink(link);
    if (!r.ok) throw new Error(r.error);
    expect(r.project.figure.legend).toBe("bottom-right");
    // The golden demo link, written before "auto" existed, has no legend key either.
    const golden = readFileSync(join(GOLDEN, "demo.link.txt"), "utf8").trim();
    expect(Object.hasOwn(compactOf(golden).f ?? {}, "l")).toBe(false);
    const g = decodeLink(golden);
    expect(g.ok && g.project.figure.legend).toBe("bottom-right");
  });

  it("round-trips through a project file and the browser-storage form", () => {
    const p = withLegend("auto");
    const file = projectFromFile(projectToFile(p), "x.axband.json");
    if (!file.ok) throw new Error(file.error);
    expect(file.repairs).toEqual([]);
    expect(file.project.figure.legend).toBe("auto");
    const stored = serializeForStorage(p);
    const back = deserializeFromStorage(stored.meta, stored.curves);
    if (!back.ok) throw new Error(back.error);
    expect(back.project.figure.legend).toBe("auto");
  });

  it("older files keep their legend place (golden v1 files)", () => {
    const expected: Record<string, LegendPlace> = {
      "demo.axband.json": "bottom-right",
      "kitchen.axband.json": "outside-right",
    };
    for (const [name, legend] of Object.entries(expected)) {
      const r = projectFromFile(readFileSync(join(GOLDEN, name), "utf8"), name);
      if (!r.ok) throw new Error(r.error);
      expect(r.repairs).toEqual([]);
      expect(r.project.figure.legend).toBe(legend);
    }
  });

  it("an unknown place (what an older build meets in a newer file) is repaired to the default, with a note", () => {
    const raw = { ...projectToJsonValue(defaultProject()), figure: { ...defaultFigure(), legend: "centre" } };
    const r = restoreProject(raw);
    if (!r.ok) throw new Error(r.error);
    expect(r.project.figure.legend).toBe(defaultFigure().legend);
    expect(r.repairs.some((m) => /legend/.test(m))).toBe(true);
  });

  it('"below" and "above" and the legend text size are kept by links and files; older files open unchanged (size 1)', () => {
    for (const legend of ["below", "above"] as const) {
      const p = { ...withLegend(legend), figure: { ...withLegend(legend).figure, legendScale: 0.85 } };
      const file = projectFromFile(projectToFile(p), "x.axband.json");
      if (!file.ok) throw new Error(file.error);
      expect([file.project.figure.legend, file.project.figure.legendScale]).toEqual([legend, 0.85]);
    }
    // The golden v1 files were written before legendScale existed: no repair, the default size, their place.
    for (const name of ["demo.axband.json", "kitchen.axband.json"]) {
      const text = readFileSync(join(GOLDEN, name), "utf8");
      expect(text).not.toMatch(/legendScale/);
      const r = projectFromFile(text, name);
      if (!r.ok) throw new Error(r.error);
      expect(r.repairs).toEqual([]);
      expect(r.project.figure.legendScale).toBe(1);
    }
    // Out of range: clamped to 0.7–1.5 with a note.
    const raw = { ...projectToJsonValue(defaultProject()), figure: { ...defaultFigure(), legendScale: 9 } };
    const r = restoreProject(raw);
    if (!r.ok) throw new Error(r.error);
    expect(r.project.figure.legendScale).toBe(1.5);
    expect(r.repairs.some((m) => /legend text size/.test(m))).toBe(true);
  });
});
