// Project files (NAME.axband.json) and the autosave form: layout, messages for files that are not ours or are
// from a newer version, hand-edited files, file names, and storage with curve data kept apart.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import {
  PROJECT_FILE_FORMAT,
  STORAGE_FORMAT,
  defaultProject,
  deserializeFromStorage,
  projectFileName,
  projectFromFile,
  projectToFile,
  projectsEqual,
  serializeForStorage,
} from "../../src/data/index";
import { demoFileText } from "../../src/cli/write-demo";

const ROOT = join(import.meta.dirname, "..", "..");

describe("projectToFile", () => {
  it("writes pretty JSON with the format tag, the version and the curve data", () => {
    const p = defaultProject();
    const text = projectToFile(p);
    const obj = JSON.parse(text) as Record<string, unknown> & { curves: { massEv: number[] }[] };
    expect(Object.keys(obj).slice(0, 2)).toEqual(["format", "version"]);
    expect(obj.format).toBe(PROJECT_FILE_FORMAT);
    expect(obj.version).toBe(2);
    expect(obj.curves[0].massEv).toEqual(Array.from(p.curves[0].massEv));
    // Indented, and long number arrays wrapped at 10 numbers per line.
    expect(text).toMatch(/^\{\n {2}"format": "axband-project",\n {2}"version": 2,\n/);
    const numberLines = text.split("\n").filter((l) => /^\s+[-0-9.e]+(, [-0-9.e+]+)*,?$/.test(l));
    expect(numberLines.length).toBeGreaterThan(100);
    for (const l of numberLines) expect(l.split(",").filter((x) => x.trim() !== "").length).toBeLessThanOrEqual(10);
    expect(text.endsWith("}\n")).toBe(true);
  });

  it("public/demo.axband.json is exactly the generator's output (npx tsx src/cli/write-demo.ts public/demo.axband.json)", () => {
    expect(readFileSync(join(ROOT, "public", "demo.axband.json"), "utf8")).toBe(demoFileText());
  });
});

describe("projectFromFile", () => {
  it("opens what projectToFile wrote, also with a byte-order mark", () => {
    const p = defaultProject();
    const r = projectFromFile(`\uFEFF${projectToFile(p)}`, "demo.axband.json");
    expect(r.ok && projectsEqual(r.project, p)).toBe(true);
  });

  it.each([
    ["not json at all", /The file "x.axband.json" is not an axband project file \(it is not valid JSON/],
    ["[1, 2, 3]", /is not an axband project file \(it has no "format": "axband-project"\)/],
    ['{"version": 1, "models": []}', /no "format"/],
    ['{"format": "something-else", "version": 1}', /no "format"/],
    ['{"format": "axband-project"}', /no valid version number/],
    [
      '{"format": "axband-project", "version": 9, "models": "whatever"}',
      /newer version of axband \(format v9\); this version reads files up to format v2/,
    ],
    ['{"format": "axband-project", "version": 1, "models": 3}', /could not be opened: "models" must be a list/],
  ])("refuses %j with a message", (text, message) => {
    const r = projectFromFile(text, "x.axband.json");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toMatch(message);
  });

  it("never throws on non-string input", () => {
    const r = projectFromFile(undefined as unknown as string);
    expect(!r.ok && r.error).toMatch(/^This file could not be read/);
  });

  it("opens a short hand-written file, filling every default", () => {
    const r = projectFromFile(
      '{"format":"axband-project","version":1,"models":[{"eOverNMin":"8/3"}],"curves":[{"label":"mine","massEv":[1e-6,2e-6],"gInvGeV":[1e-13,2e-13]}]}',
    );
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.repairs).toEqual([]);
      expect(r.project.models[0].label).toBe("E/N = 8/3");
      expect(r.project.curves[0].label).toBe("mine");
      expect(r.project.curves[0].massEv).toBeInstanceOf(Float64Array);
    }
  });
});

describe("projectFileName", () => {
  it.each([
    ["axband demo", "axband demo.axband.json"],
    ["a/b:c*d?", "a-b-c-d.axband.json"],
    ["", "project.axband.json"],
    ["...", "project.axband.json"],
  ])("%j → %j", (name, file) => {
    expect(projectFileName({ name })).toBe(file);
  });
});

describe("browser storage form", () => {
  it("keeps curve data out of the meta text, in one record per curve", () => {
    const p = defaultProject();
    const s = serializeForStorage(p);
    const meta = JSON.parse(s.meta) as { format: string; curves: Record<string, unknown>[] };
    expect(meta.format).toBe(STORAGE_FORMAT);
    expect(meta.curves[0]).not.toHaveProperty("massEv");
    expect(meta.curves[0].label).toBe(p.curves[0].label);
    expect(s.meta.length).toBeLessThan(5000);
    expect(s.curves.map((c) => c.id)).toEqual(p.curves.map((c) => c.id));
    expect(s.curves[0].massEv).toBeInstanceOf(Float64Array);
    const back = deserializeFromStorage(s.meta, s.curves);
    expect(back.ok && projectsEqual(back.project, p)).toBe(true);
  });

  it("accepts plain number arrays for the records (e.g. after JSON)", () => {
    const p = defaultProject();
    const s = serializeForStorage(p);
    const back = deserializeFromStorage(
      s.meta,
      JSON.parse(
        JSON.stringify(s.curves.map((c) => ({ ...c, massEv: Array.from(c.massEv), gInvGeV: Array.from(c.gInvGeV) }))),
      ),
    );
    expect(back.ok && projectsEqual(back.project, p)).toBe(true);
  });

  it("leaves out a curve whose record is missing and says so; the rest restores", () => {
    const p = defaultProject();
    const s = serializeForStorage(p);
    const back = deserializeFromStorage(s.meta, s.curves.slice(1));
    expect(back.ok).toBe(true);
    if (back.ok) {
      expect(back.project.curves.map((c) => c.id)).toEqual(p.curves.slice(1).map((c) => c.id));
      expect(back.repairs).toEqual([
        `curve "${p.curves[0].label}" was left out: its data were not found in browser storage`,
      ]);
    }
  });

  it.each([
    ["{oops", /damaged/],
    ['{"format":"axband-project","version":1}', /not in the expected form/],
    ['{"format":"axband-storage","version":99}', /newer version/],
  ])("refuses %j with a message", (meta, message) => {
    const r = deserializeFromStorage(meta);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toMatch(message);
  });
});
