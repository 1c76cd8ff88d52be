// Round trips over random valid projects (fast-check): project → link → project, → file → project and
// → browser-storage form → project are equal; a link without curves keeps everything but the curves.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  ProjectSchema,
  decodeLink,
  deserializeFromStorage,
  encodeLink,
  projectFromFile,
  projectToFile,
  projectToJsonValue,
  projectsEqual,
  serializeForStorage,
} from "../../src/data/index";
import type { Curve, Figure, Model, PhysicsSettings, Project } from "../../src/project/types";
import { CUSTOM_MM_LIMITS } from "../../src/project/limits";

// eslint-disable-next-line no-control-regex
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/;
const text = (maxLength: number) =>
  fc.string({ unit: "grapheme", maxLength }).filter((s) => !CONTROL.test(s) && s.length <= maxLength);
const id = fc.stringMatching(/^[a-z0-9-]{1,12}$/);
const colour = fc.oneof(
  fc.integer({ min: 0, max: 0xffffff }).map((n) => `#${n.toString(16).padStart(6, "0")}`),
  fc.integer({ min: 0, max: 0xfff }).map((n) => `#${n.toString(16).padStart(3, "0").toUpperCase()}`),
);
const lineStyle = fc.constantFrom("solid", "dashed", "dotted", "dashdot") as fc.Arbitrary<Model["lineStyle"]>;
const unit = fc.double({ min: 0, max: 1, noNaN: true });
const positive = fc.double({ min: Number.MIN_VALUE, max: 1e300, noNaN: true });

/** E/N as a user types it: a fraction or a decimal, with its numeric value for ordering. */
const rational = fc.oneof(
  fc
    .tuple(fc.integer({ min: -200, max: 200 }), fc.integer({ min: 1, max: 60 }))
    .map(([n, d]) => ({ s: `${n}/${d}`, v: n / d })),
  fc.double({ min: -1e6, max: 1e6, noNaN: true }).map((x) => ({ s: String(x), v: x })),
);
const rationalInput = fc.oneof(
  rational.map((r) => r.s),
  fc.integer({ min: -9, max: 9 }),
);

const fermion = fc.record(
  {
    colour: fc.oneof(fc.constantFrom("1", "3", "3bar", "6", "8"), fc.record({ p: fc.nat(4), q: fc.nat(4) })),
    ew: fc.oneof(
      fc.record({ kind: fc.constant("sm" as const), dim: fc.integer({ min: 1, max: 4 }), y: rationalInput }),
      fc.record({
        kind: fc.constant("su3l" as const),
        rep: fc.constantFrom("1" as const, "3" as const, "3bar" as const),
        x: rationalInput,
        b: rationalInput,
      }),
      fc.record({ kind: fc.constant("explicit" as const), charges: fc.array(rationalInput, { maxLength: 3 }) }),
    ),
    chirality: fc.constantFrom("L" as const, "R" as const),
    pq: rationalInput,
    copies: fc.integer({ min: 1, max: 3 }),
    name: text(10),
  },
  { requiredKeys: ["colour", "ew", "chirality", "pq"] },
);

const source: fc.Arbitrary<Model["source"]> = fc.oneof(
  fc.constant({ kind: "typed" as const }),
  fc.record({ kind: fc.constant("catalogue" as const), catalogueId: id }),
  fc.record({
    kind: fc.constant("calculator" as const),
    fermions: fc.array(fermion, { maxLength: 3 }),
    scalarCharge: rational.map((r) => r.s),
  }),
);

/** Members of a between-lines band or model set: distinct values, sorted, as a valid project holds them. */
const members = fc
  .uniqueArray(fc.tuple(rational, fc.integer({ min: 1, max: 5000 })), {
    minLength: 1,
    maxLength: 6,
    selector: (t) => t[0].v,
    comparator: "SameValueZero", // "0" and a rational reading −0 are the same E/N
  })
  .map((list) => list.sort((x, y) => x[0].v - y[0].v));

const model: fc.Arbitrary<Omit<Model, "id">> = fc
  .record({
    a: rational,
    b: rational,
    kind: fc.constantFrom("line", "interval", "between", "set") as fc.Arbitrary<Model["kind"]>,
    members,
    setDraw: fc.constantFrom("lines", "extremes", "central") as fc.Arbitrary<Model["setDraw"]>,
    setShare: fc.double({ min: 0.01, max: 1, noNaN: true }),
    label: text(30),
    source,
    colour,
    lineStyle,
    fillOpacity: unit,
    visible: fc.boolean(),
    sigmas: fc.double({ min: 0, max: 10, noNaN: true }),
  })
  .map(({ a, b, kind, members: list, ...rest }) => {
    if (kind === "between" || kind === "set") {
      const ms = list.map(([r, n]) => ({ eOverN: r.s, count: kind === "between" ? 1 : n }));
      return { ...rest, kind, members: ms, eOverNMin: ms[0].eOverN, eOverNMax: ms[ms.length - 1].eOverN };
    }
    const [lo, hi] = kind === "line" ? [a, a] : a.v <= b.v ? [a, b] : [b, a];
    return { ...rest, kind, members: [], eOverNMin: lo.s, eOverNMax: hi.s };
  });

/** Curve data: full-precision doubles, or values with few digits (the link's decimal delta form). */
const data = fc.oneof(
  fc.array(fc.tuple(positive, positive), { maxLength: 40 }),
  fc
    .array(
      fc.tuple(
        fc.integer({ min: 1, max: 9999 }),
        fc.integer({ min: -20, max: 5 }),
        fc.integer({ min: 1, max: 99999 }),
        fc.integer({ min: -40, max: -5 }),
      ),
      { maxLength: 40 },
    )
    .map((xs) => xs.map(([m, me, g, ge]) => [Number(`${m}e${me}`), Number(`${g}e${ge}`)] as [number, number])),
);

const curve: fc.Arbitrary<Omit<Curve, "id">> = fc
  .record({
    label: text(30),
    role: fc.constantFrom("exclusion", "projection", "region") as fc.Arbitrary<Curve["role"]>,
    points: data,
    keepOrder: fc.boolean(),
    colour,
    lineStyle,
    fillOpacity: unit,
    exclusionMark: fc.constantFrom("hatch", "fill", "hatch-fill") as fc.Arbitrary<Curve["exclusionMark"]>,
    visible: fc.boolean(),
    rescale: fc.record({
      rhoAssumed: positive,
      rhoShown: positive,
      fraction: fc.double({ min: Number.MIN_VALUE, max: 1, noNaN: true }),
    }),
    citation: text(60),
    fileName: text(20),
  })
  .map(({ points, ...rest }) => ({
    ...rest,
    massEv: Float64Array.from(points, (p) => p[0]),
    gInvGeV: Float64Array.from(points, (p) => p[1]),
  }));

// A range the figure can draw (the schema's rule): ends at least 0.02 decades apart, within 10^±300.
const range = fc
  .tuple(positive, positive)
  .filter(([a, b]) => Math.abs(Math.log10(a) - Math.log10(b)) >= 0.02 && Math.min(a, b) >= 1e-300)
  .map(([a, b]) => (a < b ? [a, b] : [b, a]) as [number, number]);

const figure: fc.Arbitrary<Figure> = fc.record({
  preset: fc.constantFrom("slide", "single-column", "double-column", "custom") as fc.Arbitrary<Figure["preset"]>,
  customWidthMm: fc.double({ min: CUSTOM_MM_LIMITS[0], max: CUSTOM_MM_LIMITS[1], noNaN: true }),
  customHeightMm: fc.double({ min: CUSTOM_MM_LIMITS[0], max: CUSTOM_MM_LIMITS[1], noNaN: true }),
  massRangeEv: range,
  yRange: range,
  yView: fc.constantFrom("coupling", "normalized", "g-gamma") as fc.Arbitrary<Figure["yView"]>,
  topAxis: fc.constantFrom("none", "fa", "frequency") as fc.Arbitrary<Figure["topAxis"]>,
  grid: fc.boolean(),
  legend: fc.constantFrom(
    "auto",
    "top-left",
    "top-right",
    "bottom-left",
    "bottom-right",
    "outside-right",
    "below",
    "above",
    "hidden",
  ) as fc.Arbitrary<Figure["legend"]>,
  legendScale: fc.double({ min: 0.7, max: 1.5, noNaN: true }),
  fontPt: fc.double({ min: 4, max: 72, noNaN: true }),
  font: fc.constantFrom("sans", "serif") as fc.Arbitrary<Figure["font"]>,
  title: text(40),
  massUnit: fc.constantFrom("eV", "meV", "ueV", "neV") as fc.Arbitrary<Figure["massUnit"]>,
  frequencyUnit: fc.constantFrom("auto", "Hz", "kHz", "MHz", "GHz", "THz") as fc.Arbitrary<Figure["frequencyUnit"]>,
  ticks: fc.constantFrom("out", "all") as fc.Arbitrary<Figure["ticks"]>,
});

const physics: fc.Arbitrary<PhysicsSettings> = fc.record({
  ref: fc.constantFrom("2016", "2019", "custom") as fc.Arbitrary<PhysicsSettings["ref"]>,
  custom: fc.record({
    cGamma: fc.double({ min: -1e6, max: 1e6, noNaN: true }),
    cGammaSigma: fc.double({ min: 0, max: 1e3, noNaN: true }),
    kMuEv: positive,
    kMuEvSigma: fc.double({ min: 0, max: 1e3, noNaN: true }),
    label: text(20),
  }),
});

const project: fc.Arbitrary<Project> = fc
  .record({
    name: text(40),
    physics,
    models: fc.uniqueArray(fc.tuple(id, model), { maxLength: 5, selector: (t) => t[0] }),
    curves: fc.uniqueArray(fc.tuple(id, curve), { maxLength: 4, selector: (t) => t[0] }),
    figure,
  })
  .map(({ models, curves, ...rest }) => ({
    version: 2 as const,
    ...rest,
    models: models.map(([i, m]) => ({ id: i, ...m })),
    curves: curves.map(([i, c]) => ({ id: i, ...c })),
  }));

const RUNS = { numRuns: 300 };

describe("round trips of random valid projects", () => {
  it("the arbitraries make projects the strict schema accepts", () => {
    fc.assert(
      fc.property(project, (p) => ProjectSchema.safeParse(projectToJsonValue(p)).success),
      { numRuns: 100 },
    );
  });

  it("project → link (with curves) → project is the same project", () => {
    fc.assert(
      fc.property(project, (p) => {
        const r = decodeLink(encodeLink(p, { includeCurves: true }));
        expect(r.ok).toBe(true);
        if (!r.ok) return;
        expect(r.repairs).toEqual([]);
        expect(projectsEqual(r.project, p)).toBe(true);
      }),
      RUNS,
    );
  });

  it("project → link without curves → project has the same name, constants, figure and models, no curves", () => {
    fc.assert(
      fc.property(project, (p) => {
        const r = decodeLink(encodeLink(p, { includeCurves: false }));
        expect(r.ok).toBe(true);
        if (!r.ok) return;
        expect(r.project.curves).toEqual([]);
        expect(r.omittedCurveCount).toBe(p.curves.length);
        expect(projectsEqual({ ...r.project, curves: p.curves }, p)).toBe(true);
      }),
      RUNS,
    );
  });

  it("project → file → project is the same project", () => {
    fc.assert(
      fc.property(project, (p) => {
        const r = projectFromFile(projectToFile(p), "x.axband.json");
        expect(r.ok).toBe(true);
        if (!r.ok) return;
        expect(r.repairs).toEqual([]);
        expect(projectsEqual(r.project, p)).toBe(true);
      }),
      RUNS,
    );
  });

  it("project → storage form (meta text + curve records) → project is the same project", () => {
    fc.assert(
      fc.property(project, (p) => {
        const s = serializeForStorage(p);
        // As IndexedDB would hand the records back: structured clones.
        const r = deserializeFromStorage(s.meta, structuredClone(s.curves));
        expect(r.ok).toBe(true);
        if (!r.ok) return;
        expect(r.repairs).toEqual([]);
        expect(projectsEqual(r.project, p)).toBe(true);
        expect(s.meta).not.toContain('"massEv"');
      }),
      RUNS,
    );
  });
});
