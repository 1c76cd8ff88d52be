// Tests of the project schema and the restore step: defaults, repairs, refusals, prototype keys, migrations,
// projectsEqual and the state table.
import { describe, expect, it } from "vitest";
import {
  CURRENT_VERSION,
  CURVE_STATE,
  MIGRATIONS,
  MODEL_STATE,
  PROJECT_LIMITS,
  PROJECT_STATE,
  ProjectSchema,
  defaultFigure,
  defaultPhysics,
  defaultProject,
  defaultYRange,
  isRationalText,
  keysFor,
  migrate,
  newCurve,
  newModel,
  parseJsonSafely,
  projectToJsonValue,
  projectsEqual,
  rationalValue,
  restoreProject,
  type Migration,
} from "../../src/data/index";
import { PROJECT_VERSION, type Project } from "../../src/project/types";

function small(): Project {
  return {
    version: PROJECT_VERSION,
    name: "test",
    physics: defaultPhysics(),
    models: [newModel({ id: "a", eOverNMin: "8/3" })],
    curves: [
      newCurve({ id: "c", label: "C", massEv: Float64Array.of(1e-6, 2e-6), gInvGeV: Float64Array.of(1e-14, 2e-14) }),
    ],
    figure: defaultFigure(),
  };
}

function restored(x: unknown) {
  const r = restoreProject(x);
  if (!r.ok) throw new Error(`expected ok, got: ${r.error}`);
  return r;
}

describe("rational text (E/N as typed)", () => {
  // Values: the E/N of the standard KSVZ-type (0) and DFSZ-type (8/3, 2/3) models and the window 5/3..44/3,
  // Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801; a decimal and a signed fraction as a user may type them.
  it.each([
    ["0", 0],
    ["8/3", 8 / 3],
    ["2/3", 2 / 3],
    ["44/3", 44 / 3],
    ["-1/3", -1 / 3],
    ["0.5", 0.5],
    ["1e-1", 0.1],
    [" 5 / 3 ", 5 / 3],
    ["\u22121/3", -1 / 3],
  ])("accepts %j = %d", (s, v) => {
    expect(isRationalText(s)).toBe(true);
    expect(rationalValue(s)).toBeCloseTo(v, 14);
  });
  it.each(["", "abc", "1/0", "3/-0", "1/", "/2", "1e999", "NaN", "Infinity", "1..2", "8/3/2", "0x10"])(
    "refuses %j",
    (s) => {
      expect(isRationalText(s)).toBe(false);
      expect(rationalValue(s)).toBeNaN();
    },
  );
});

describe("restoreProject", () => {
  it("keeps a valid project exactly, with no repairs, and converts number arrays to Float64Array", () => {
    const p = defaultProject();
    const json = JSON.parse(JSON.stringify(projectToJsonValue(p)));
    const r = restored(json);
    expect(r.repairs).toEqual([]);
    expect(projectsEqual(r.project, p)).toBe(true);
    expect(r.project.curves[0].massEv).toBeInstanceOf(Float64Array);
    // The output satisfies the strict schema.
    expect(ProjectSchema.safeParse(projectToJsonValue(r.project)).success).toBe(true);
  });

  it("fills defaults for every missing optional field", () => {
    const r = restored({
      version: 1,
      models: [{ eOverNMin: "8/3" }],
      curves: [{ massEv: [1, 2], gInvGeV: [3, 4], role: "projection" }],
    });
    expect(r.repairs).toEqual([]);
    const p = r.project;
    expect(p.name).toBe("Untitled");
    expect(p.physics).toEqual(defaultPhysics());
    expect(p.figure).toEqual(defaultFigure());
    expect(p.models[0]).toMatchObject({
      eOverNMin: "8/3",
      eOverNMax: "8/3",
      label: "E/N = 8/3",
      source: { kind: "typed" },
      visible: true,
      sigmas: 0,
    });
    expect(p.models[0].id).not.toBe("");
    expect(p.curves[0]).toMatchObject({
      role: "projection",
      lineStyle: "dashed",
      keepOrder: false,
      visible: true,
      citation: "",
    });
    expect(Array.from(p.curves[0].gInvGeV)).toEqual([3, 4]);
    expect(ProjectSchema.safeParse(projectToJsonValue(p)).success).toBe(true);
  });

  it("clamps out-of-range numbers and notes each repair", () => {
    const json = projectToJsonValue(small()) as Record<string, unknown> & {
      models: Record<string, unknown>[];
      curves: Record<string, unknown>[];
      figure: Record<string, unknown>;
    };
    json.models[0].fillOpacity = -0.5;
    json.models[0].sigmas = 99;
    json.curves[0].fillOpacity = 7;
    json.curves[0].rescale = { rhoAssumed: 0.3, rhoShown: -1, fraction: 3 };
    json.figure.fontPt = 1000;
    const r = restored(json);
    expect(r.project.models[0].fillOpacity).toBe(0);
    expect(r.project.models[0].sigmas).toBe(10);
    expect(r.project.curves[0].fillOpacity).toBe(1);
    expect(r.project.curves[0].rescale).toEqual({ rhoAssumed: 0.3, rhoShown: 0.45, fraction: 1 });
    expect(r.project.figure.fontPt).toBe(72);
    expect(r.repairs.length).toBe(6);
    for (const msg of r.repairs) expect(msg.length).toBeGreaterThan(10);
  });

  it("repairs bad ranges: non-finite or empty reset to the default, reversed swapped", () => {
    const a = restored({ version: 1, figure: { massRangeEv: [1e-3, 1e-6], yRange: [0, 1], yView: "normalized" } });
    expect(a.project.figure.massRangeEv).toEqual([1e-6, 1e-3]);
    expect(a.project.figure.yRange).toEqual(defaultYRange("normalized"));
    expect(a.repairs.some((m) => m.includes("swapped"))).toBe(true);
    // JSON reads 1e999 as Infinity.
    const b = restored(parseJsonSafely('{"version":1,"figure":{"massRangeEv":[1e-9,1e999],"yRange":[5,5]}}'));
    expect(b.project.figure.massRangeEv).toEqual(defaultFigure().massRangeEv);
    expect(b.project.figure.yRange).toEqual(defaultFigure().yRange);
    expect(b.repairs.length).toBe(2);
  });

  it("replaces invalid enums and colours by defaults, removes control characters, cuts long text", () => {
    const json = projectToJsonValue(small()) as {
      models: Record<string, unknown>[];
      curves: Record<string, unknown>[];
      name: unknown;
    };
    json.models[0].lineStyle = "wavy";
    json.models[0].colour = "red; stroke: url(javascript:x)";
    json.curves[0].role = "exclude";
    json.curves[0].label = "bad\u0000label\u0007";
    json.name = "x".repeat(PROJECT_LIMITS.label + 50);
    const r = restored(json);
    expect(r.project.models[0].lineStyle).toBe("solid");
    expect(r.project.models[0].colour).toMatch(/^#[0-9A-Fa-f]{6}$/);
    expect(r.project.curves[0].role).toBe("exclusion");
    expect(r.project.curves[0].label).toBe("badlabel");
    expect(r.project.name.length).toBe(PROJECT_LIMITS.label);
    expect(r.repairs.length).toBe(5);
  });

  it("leaves out models and curves that cannot be repaired, and says which", () => {
    const json = projectToJsonValue(small()) as { models: unknown[]; curves: unknown[] };
    json.models.push({ id: "bad", label: "Broken", eOverNMin: "eight thirds" }, 42);
    json.curves.push(
      { id: "nan", label: "Has null", massEv: [1, null], gInvGeV: [1, 2] },
      { id: "len", label: "Lengths", massEv: [1, 2, 3], gInvGeV: [1, 2] },
      { id: "none", label: "No data" },
    );
    const r = restored(json);
    expect(r.project.models.map((m) => m.id)).toEqual(["a"]);
    expect(r.project.curves.map((c) => c.id)).toEqual(["c"]);
    expect(r.repairs).toHaveLength(5);
    expect(r.repairs[0]).toContain('"Broken"');
    expect(r.repairs[0]).toContain("not a number or fraction");
    expect(r.repairs.some((m) => m.includes('"Lengths"') && m.includes("3 masses"))).toBe(true);
  });

  it("swaps E/N ends given in the wrong order and renames clashing ids", () => {
    const r = restored({
      version: 1,
      models: [
        { id: "x", eOverNMin: "44/3", eOverNMax: "5/3" },
        { id: "x", eOverNMin: 0 },
      ],
    });
    expect(r.project.models[0]).toMatchObject({ eOverNMin: "5/3", eOverNMax: "44/3", label: "E/N = 5/3..44/3" });
    expect(r.project.models[1]).toMatchObject({ id: "x-2", eOverNMin: "0" });
    expect(r.repairs.length).toBe(2);
  });

  it("returns each call's repairs with its project: a later call neither adds to nor empties an earlier list", () => {
    const first = restored({ version: 1, figure: { fontPt: 1000 } });
    const firstRepairs = [...first.repairs];
    expect(firstRepairs).toEqual(["figure, font size: 1000 is out of range; set to 72"]);
    const second = restored({ version: 1, models: [{ eOverNMin: "1", colour: "red" }] });
    expect(second.repairs).toEqual(['model 1, colour: "red" is not valid; the default is used']);
    expect(first.repairs).toEqual(firstRepairs);
    // A refused input in between leaves both lists as they were.
    expect(restoreProject({ version: 1, models: 3 }).ok).toBe(false);
    expect(first.repairs).toEqual(firstRepairs);
    expect(second.repairs).toHaveLength(1);
  });

  it("refuses what is not a project, with a message", () => {
    for (const bad of [
      null,
      3,
      "x",
      [],
      {},
      { version: "1" },
      { version: 0 },
      { version: 1.5 },
      { version: 1, models: {} },
      { version: 1, curves: "no" },
    ]) {
      const r = restoreProject(bad);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error.length).toBeGreaterThan(10);
    }
    const many = restoreProject({
      version: 1,
      models: Array.from({ length: PROJECT_LIMITS.models + 1 }, () => ({ eOverNMin: "1" })),
    });
    expect(many.ok).toBe(false);
  });

  it("refuses a future version with a message naming it", () => {
    const r = restoreProject({ ...projectToJsonValue(small()), version: 7 });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.futureVersion).toBe(7);
      expect(r.error).toContain("newer version of axband (format v7)");
    }
  });

  it("never lets prototype keys through or pollutes Object.prototype", () => {
    const text =
      '{"version":1,"__proto__":{"polluted":1},"constructor":{"prototype":{"polluted":2}},"models":[{"eOverNMin":"1","__proto__":{"admin":true}}]}';
    const parsed = parseJsonSafely(text) as Record<string, unknown>;
    expect(Object.hasOwn(parsed, "__proto__")).toBe(false);
    expect(Object.hasOwn(parsed, "constructor")).toBe(false);
    const r = restored(parsed);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect((r.project.models[0] as unknown as Record<string, unknown>).admin).toBeUndefined();
    expect(Object.getPrototypeOf(r.project.models[0])).toBe(Object.prototype);
    // Even without the safe parser (own "__proto__" key from plain JSON.parse), zod's output has no such key.
    // A key spelled with JSON escapes is the same key.
    const escaped = parseJsonSafely('{"\\u005f_proto__":{"polluted":1},"constructo\\u0072":1}') as Record<
      string,
      unknown
    >;
    expect(Object.keys(escaped)).toEqual([]);
    const r2 = restored(JSON.parse(text));
    expect(Object.keys(r2.project)).toEqual(["version", "name", "physics", "models", "curves", "figure"]);
    expect(({} as Record<string, unknown>).admin).toBeUndefined();
  });
});

describe("migrations", () => {
  it("the registry has a step for every version below the current one", () => {
    for (let v = 1; v < CURRENT_VERSION; v++) expect(typeof MIGRATIONS[v]).toBe("function");
    expect(CURRENT_VERSION).toBe(PROJECT_VERSION);
  });

  it("runs a chain of steps n → n+1 in order (test registry)", () => {
    const registry: Record<number, Migration> = {
      1: (o) => ({ ...o, version: 2, renamed: o.old }),
      2: (o) => ({ ...o, version: 3, doubled: (o.renamed as number) * 2 }),
    };
    const r = migrate({ version: 1, old: 21 }, { registry, target: 3 });
    expect(r).toEqual({ ok: true, value: { version: 3, old: 21, renamed: 21, doubled: 42 }, fromVersion: 1 });
    const from2 = migrate({ version: 2, renamed: 5 }, { registry, target: 3 });
    expect(from2.ok && from2.value.doubled).toBe(10);
  });

  it("reports a missing step, a step that throws and a step with the wrong output version", () => {
    const gap = migrate({ version: 1 }, { registry: {}, target: 2 });
    expect(gap.ok).toBe(false);
    const throws = migrate(
      { version: 1 },
      {
        registry: {
          1: () => {
            throw new Error("boom");
          },
        },
        target: 2,
      },
    );
    expect(!throws.ok && throws.error).toContain("boom");
    const wrong = migrate({ version: 1 }, { registry: { 1: (o) => ({ ...o }) }, target: 2 });
    expect(!wrong.ok && wrong.reason).toBe("failed");
  });
});

describe("projectsEqual", () => {
  it("compares Float64Arrays by value and notices any change", () => {
    const a = small();
    const b = small();
    expect(projectsEqual(a, b)).toBe(true);
    b.curves[0] = { ...b.curves[0], gInvGeV: Float64Array.of(1e-14, 2e-14 * (1 + Number.EPSILON)) };
    expect(projectsEqual(a, b)).toBe(false);
    const c = small();
    c.figure = { ...c.figure, grid: false };
    expect(projectsEqual(a, c)).toBe(false);
    expect(projectsEqual(Float64Array.of(1), [1])).toBe(false);
    expect(projectsEqual({ x: undefined }, {})).toBe(true);
  });
});

describe("state table", () => {
  it("covers every key of the types (the compiler checks; this checks the running objects)", () => {
    const p = small();
    expect(Object.keys(PROJECT_STATE).sort()).toEqual(Object.keys(p).sort());
    // Optional keys (a dragged direct label's place) are absent from the running objects until set.
    const optional = ["labelAt"];
    expect(Object.keys(MODEL_STATE).sort()).toEqual([...Object.keys(p.models[0]), ...optional].sort());
    expect(Object.keys(CURVE_STATE).sort()).toEqual([...Object.keys(p.curves[0]), ...optional].sort());
  });

  it("keeps curves out of curve-less links and curve data in separate storage records", () => {
    expect(keysFor(PROJECT_STATE, { kind: "link", includeCurves: false })).not.toContain("curves");
    expect(keysFor(PROJECT_STATE, { kind: "link", includeCurves: true })).toContain("curves");
    expect(keysFor(CURVE_STATE, { kind: "storage-separate" }).sort()).toEqual(["gInvGeV", "massEv"]);
    expect(keysFor(CURVE_STATE, { kind: "file" })).toHaveLength(Object.keys(CURVE_STATE).length);
  });
});
