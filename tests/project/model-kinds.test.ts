// Tests of the model kinds in the project: the v1 → v2 migration (a v1 model draws what it drew), the rules
// that keep kind, E/N range and members consistent, the model-set factory, and the repairs of hand-edited input.
import { describe, expect, it } from "vitest";
import {
  MIGRATIONS,
  ProjectSchema,
  decodeLink,
  encodeLink,
  newModel,
  newModelSet,
  projectToJsonValue,
  projectsEqual,
  restoreProject,
} from "../../src/data/index";
import { defaultProject } from "../../src/project/demo";
import type { Model } from "../../src/project/types";

function restoredModels(models: unknown[], version = 2) {
  const r = restoreProject({ version, models });
  if (!r.ok) throw new Error(r.error);
  return r;
}

describe("v1 → v2 migration", () => {
  it("a v1 model with equal ends becomes a line, with different ends an interval, with nothing else changed", () => {
    const v1 = {
      version: 1,
      models: [
        { id: "a", eOverNMin: "8/3", eOverNMax: "8/3", label: "x" },
        { id: "b", eOverNMin: "5/3", eOverNMax: "44/3", label: "y" },
        // Same value written two ways: v1 drew the interval [0.5, 0.5], i.e. one line.
        { id: "c", eOverNMin: "1/2", eOverNMax: "0.5", label: "z" },
      ],
    };
    const out = MIGRATIONS[1](v1);
    expect(out.version).toBe(2);
    const ms = out.models as Record<string, unknown>[];
    expect(ms.map((m) => m.kind)).toEqual(["line", "interval", "line"]);
    for (const m of ms) expect(m.members).toEqual([]);
    expect(ms[1]).toMatchObject({ id: "b", eOverNMin: "5/3", eOverNMax: "44/3", label: "y" });
    // The input is not mutated.
    expect(Object.hasOwn(v1.models[0], "kind")).toBe(false);
  });

  it("leaves unreadable models for the restore step, which reports them", () => {
    const r = restoredModels(
      [
        { id: "bad", eOverNMin: "eight thirds" },
        { id: "ok", eOverNMin: "0" },
      ],
      1,
    );
    expect(r.project.models.map((m) => m.id)).toEqual(["ok"]);
    expect(r.repairs.join("\n")).toMatch(/model 1 was left out/);
  });

  it("a v1 model with max below min is swapped into an interval, as v1 did", () => {
    const r = restoredModels([{ eOverNMin: "44/3", eOverNMax: "5/3" }], 1);
    expect(r.project.models[0]).toMatchObject({ kind: "interval", eOverNMin: "5/3", eOverNMax: "44/3" });
    expect(r.repairs.join("\n")).toMatch(/swapped/);
  });
});

describe("kinds, members and their repairs", () => {
  it("newModelSet sorts by value, merges equal values and takes its E/N range from the members", () => {
    const m = newModelSet(
      "set",
      [
        { eOverN: "8/3", count: 2 },
        { eOverN: "-64/3", count: 1 },
        { eOverN: "16/6", count: 3 },
      ],
      { kind: "scan" },
    );
    expect(m.kind).toBe("set");
    expect(m.setDraw).toBe("extremes");
    expect(m.setShare).toBe(0.68);
    expect(m.members).toEqual([
      { eOverN: "-64/3", count: 1 },
      { eOverN: "8/3", count: 5 },
    ]);
    expect([m.eOverNMin, m.eOverNMax]).toEqual(["-64/3", "8/3"]);
    expect(() => newModelSet("empty", [], { kind: "scan" })).toThrow(/at least one member/);
  });

  it("between-lines counts each value once and is labelled with its values", () => {
    const m = newModel({
      kind: "between",
      members: [
        { eOverN: "44/3", count: 4 },
        { eOverN: "5/3", count: 1 },
      ],
    });
    expect(m.members).toEqual([
      { eOverN: "5/3", count: 1 },
      { eOverN: "44/3", count: 1 },
    ]);
    expect(m.label).toBe("E/N = 5/3 | 44/3");
    expect(ProjectSchema.safeParse(projectToJsonValue({ ...defaultProject(), models: [m] })).success).toBe(true);
  });

  it("repairs hand-edited kinds and says so", () => {
    const r = restoredModels([
      { id: "l", kind: "line", eOverNMin: "1", eOverNMax: "2" },
      { id: "i", kind: "interval", eOverNMin: "1", eOverNMax: "2", members: [{ eOverN: "3" }] },
      { id: "b", kind: "between", eOverNMin: "0", eOverNMax: "1" },
      { id: "s", members: [{ eOverN: "3", count: 2 }, { eOverN: "-1" }] },
      { id: "x", kind: "set" },
      { id: "d", kind: "set", members: [{ eOverN: "1" }], setDraw: "swirl", setShare: 7 },
    ]);
    const byId = Object.fromEntries(r.project.models.map((m) => [m.id, m])) as Record<string, Model>;
    expect(byId.l).toMatchObject({ kind: "line", eOverNMin: "1", eOverNMax: "1" });
    expect(byId.i).toMatchObject({ kind: "interval", members: [] });
    expect(byId.b).toMatchObject({ kind: "interval", members: [] });
    expect(byId.s).toMatchObject({ kind: "set", eOverNMin: "-1", eOverNMax: "3" });
    expect(byId.s.members).toEqual([
      { eOverN: "-1", count: 1 },
      { eOverN: "3", count: 2 },
    ]);
    expect(byId.x).toBeUndefined();
    expect(byId.d).toMatchObject({ setDraw: "extremes", setShare: 0.68 });
    const text = r.repairs.join("\n");
    expect(text).toMatch(/a line has one E\/N; 2 was dropped/);
    expect(text).toMatch(/members.*dropped/);
    expect(text).toMatch(/"between" has no members/);
    expect(text).toMatch(/model 5 was left out: (eOverNMin: )?E\/N is missing/);
    expect(text).toMatch(/set drawing/);
    expect(text).toMatch(/set share/);
  });

  it("every kind survives a link and keeps N_DW", () => {
    const p = defaultProject();
    p.models.push(
      newModelSet(
        "s",
        [
          { eOverN: "-64/3", count: 2, nDW: "6" },
          { eOverN: "2", count: 9 },
        ],
        { kind: "ensemble", settings: { maxQuarks: 3 } },
        "central",
      ),
    );
    const r = decodeLink(encodeLink(p));
    if (!r.ok) throw new Error(r.error);
    expect(r.repairs).toEqual([]);
    expect(projectsEqual(r.project, p)).toBe(true);
  });
});
