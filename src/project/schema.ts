// The project schema (zod) and the restore step shared by links, files and browser storage: it validates
// untrusted input, migrates old versions, fills defaults, repairs or drops what is broken, and says what it did.
import { z } from "zod";
import {
  defaultCurveLineStyle,
  defaultFigure,
  defaultPhysics,
  defaultYRange,
  CURVE_COLOURS,
  MODEL_COLOURS,
  newCurve,
  newModel,
} from "./defaults";
import { newId, uniqueId } from "./ids";
import { settleModelKind } from "./model-kind";
import { migrate } from "./migrate";
import { MAX_RATIONAL_CHARS, isRationalText, rationalValue } from "./rational-text";
import { PROJECT_VERSION, type Curve, type Figure, type Model, type PhysicsSettings, type Project } from "./types";

export { isRationalText, rationalValue };

/** Size limits of a project; anything beyond is refused (or, for text, cut) rather than trusted. */
export const PROJECT_LIMITS = {
  models: 500,
  curves: 500,
  /** Points per curve. */
  points: 5_000_000,
  fermions: 200,
  id: 100,
  label: 500,
  citation: 100_000,
  fileName: 1_000,
  rational: MAX_RATIONAL_CHARS,
  /** Members of a model set or between-lines band (distinct E/N values). */
  members: 20_000,
} as const;

// ---------------------------------------------------------------------------------------------- building blocks

// C0 controls other than tab, LF and CR (and DEL) are invalid in the XML of an exported SVG.
// eslint-disable-next-line no-control-regex
const CONTROL_RE = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/g;

const hexColour = z
  .string()
  .regex(/^#(?:[0-9a-fA-F]{3,4}|[0-9a-fA-F]{6}|[0-9a-fA-F]{8})$/, "expected a colour such as #117A8B");
const lineStyle = z.enum(["solid", "dashed", "dotted", "dashdot"]);
const curveRole = z.enum(["exclusion", "projection", "region"]);
// "auto" joined in schema version 1 without a bump: every older file still validates, and an older build
// reading "auto" repairs it to its default legend place (a noted repair), so no migration is needed.
const legendPlace = z.enum(["auto", "top-left", "top-right", "bottom-left", "bottom-right", "outside-right", "hidden"]);
const sizePreset = z.enum(["slide", "single-column", "double-column", "custom"]);
const topAxis = z.enum(["none", "fa", "frequency"]);
const yView = z.enum(["coupling", "normalized", "g-gamma"]);
const physicsRef = z.enum(["2016", "2019", "custom"]);
const modelKind = z.enum(["line", "interval", "between", "set"]);
const setDraw = z.enum(["lines", "extremes", "central"]);

const eOverNText = z
  .string()
  .max(PROJECT_LIMITS.rational)
  .refine(isRationalText, "expected a number or fraction such as 8/3");

/** What the anomaly calculator stores per fermion; values are checked by the calculator, not here. */
const rationalInput = z.union([z.string().max(PROJECT_LIMITS.rational), z.number()]);
const fermionInput = z.object({
  colour: z.union([z.object({ p: z.int().min(0).max(100), q: z.int().min(0).max(100) }), z.string().max(32)]),
  ew: z.discriminatedUnion("kind", [
    z.object({ kind: z.literal("sm"), dim: z.int().min(1).max(100), y: rationalInput }),
    z.object({ kind: z.literal("su3l"), rep: z.enum(["1", "3", "3bar"]), x: rationalInput, b: rationalInput }),
    z.object({ kind: z.literal("explicit"), charges: z.array(rationalInput).max(100) }),
  ]),
  chirality: z.enum(["L", "R"]),
  pq: rationalInput,
  copies: z.int().min(1).max(1000).optional(),
  name: z.string().max(PROJECT_LIMITS.label).optional(),
});
const modelSource = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("typed") }),
  z.object({ kind: z.literal("catalogue"), catalogueId: z.string().max(PROJECT_LIMITS.id) }),
  z.object({
    kind: z.literal("calculator"),
    fermions: z.array(fermionInput).max(PROJECT_LIMITS.fermions),
    scalarCharge: rationalInput.transform(String),
  }),
  z.object({ kind: z.literal("ensemble"), settings: z.record(z.string().max(PROJECT_LIMITS.id), z.unknown()) }),
  z.object({ kind: z.literal("scan") }),
]);

function isFiniteNumberArray(v: unknown, max: number): v is ArrayLike<number> {
  if (!(Array.isArray(v) || v instanceof Float64Array) || v.length > max) return false;
  for (let i = 0; i < v.length; i++) {
    const x = v[i];
    if (typeof x !== "number" || !Number.isFinite(x)) return false;
  }
  return true;
}

/** Curve data: an array (JSON) or Float64Array (memory, storage) of finite numbers, always copied to a Float64Array. */
const curveData = z.unknown().transform((v, ctx) => {
  if (!isFiniteNumberArray(v, PROJECT_LIMITS.points)) {
    const why =
      Array.isArray(v) || v instanceof Float64Array
        ? v.length > PROJECT_LIMITS.points
          ? `more than ${PROJECT_LIMITS.points} points`
          : "contains a value that is not a finite number"
        : "expected an array of numbers";
    ctx.addIssue({ code: "custom", message: why });
    return z.NEVER;
  }
  return Float64Array.from(v);
});

const positiveRange = z
  .tuple([z.number().positive(), z.number().positive()])
  .refine(([lo, hi]) => lo < hi, "expected [low, high] with low < high");

// ----------------------------------------------------------------------------------------------- strict schema

/**
 * The current project schema in its JSON form, strict: every field present and in range, curve data as
 * number arrays (Float64Array accepted too). It documents the file format; `restoreProject` is the lenient
 * reader that repairs input, and its output always passes this schema.
 */
export const ProjectSchema = z.object({
  version: z.literal(PROJECT_VERSION),
  name: z.string().max(PROJECT_LIMITS.label),
  physics: z.object({
    ref: physicsRef,
    custom: z.object({
      cGamma: z.number(),
      cGammaSigma: z.number().min(0),
      kMuEv: z.number().positive(),
      kMuEvSigma: z.number().min(0),
      label: z.string().max(PROJECT_LIMITS.label),
    }),
  }),
  models: z
    .array(
      z.object({
        id: z.string().min(1).max(PROJECT_LIMITS.id),
        label: z.string().max(PROJECT_LIMITS.label),
        kind: modelKind,
        eOverNMin: eOverNText,
        eOverNMax: eOverNText,
        members: z
          .array(
            z.object({
              eOverN: eOverNText,
              count: z.int().min(1),
              nDW: z.string().max(PROJECT_LIMITS.rational).optional(),
            }),
          )
          .max(PROJECT_LIMITS.members),
        setDraw,
        setShare: z.number().gt(0).max(1),
        source: modelSource,
        colour: hexColour,
        lineStyle,
        fillOpacity: z.number().min(0).max(1),
        visible: z.boolean(),
        sigmas: z.number().min(0).max(10),
      }),
    )
    .max(PROJECT_LIMITS.models),
  curves: z
    .array(
      z
        .object({
          id: z.string().min(1).max(PROJECT_LIMITS.id),
          label: z.string().max(PROJECT_LIMITS.label),
          role: curveRole,
          massEv: curveData,
          gInvGeV: curveData,
          keepOrder: z.boolean(),
          colour: hexColour,
          lineStyle,
          fillOpacity: z.number().min(0).max(1),
          visible: z.boolean(),
          rescale: z.object({
            rhoAssumed: z.number().positive(),
            rhoShown: z.number().positive(),
            fraction: z.number().positive().max(1),
          }),
          citation: z.string().max(PROJECT_LIMITS.citation),
          fileName: z.string().max(PROJECT_LIMITS.fileName),
        })
        .refine((c) => c.massEv.length === c.gInvGeV.length, "massEv and gInvGeV must have the same length"),
    )
    .max(PROJECT_LIMITS.curves),
  figure: z.object({
    preset: sizePreset,
    customWidthMm: z.number().min(20).max(2000),
    customHeightMm: z.number().min(20).max(2000),
    massRangeEv: positiveRange,
    yRange: positiveRange,
    yView,
    topAxis,
    grid: z.boolean(),
    legend: legendPlace,
    fontPt: z.number().min(4).max(72),
    title: z.string().max(PROJECT_LIMITS.label),
  }),
});

// ----------------------------------------------------------------------------------------------- lenient reader

// Repairs noted while one restoreProject call parses; the parse is synchronous, so a module variable is safe.
let repairLog: string[] = [];
let repairWhere = "";

function show(v: unknown): string {
  if (typeof v === "string") return JSON.stringify(v.length > 40 ? `${v.slice(0, 40)}…` : v);
  if (typeof v === "number" || typeof v === "boolean" || v === null) return String(v);
  if (Array.isArray(v)) return "a list";
  return typeof v === "object" ? "an object" : typeof v;
}

function note(what: string, msg: string): void {
  repairLog.push(`${repairWhere}${what}: ${msg}`);
}

/** A field that falls back to `undefined` (filled with a default later) when missing, noting when it was invalid. */
function lenient<T extends z.ZodType>(schema: T, what: string) {
  return schema.optional().catch((ctx) => {
    note(what, `${show(ctx.input)} is not valid; the default is used`);
    return undefined;
  });
}

/** A number clamped into [lo, hi] (noted); not a finite number → default. */
function clamped(lo: number, hi: number, what: string) {
  return lenient(
    z.number().transform((v) => {
      const c = Math.min(hi, Math.max(lo, v));
      if (c !== v) note(what, `${v} is out of range; set to ${c}`);
      return c;
    }),
    what,
  );
}

/** A positive finite number; anything else → default. */
function positive(what: string) {
  return lenient(z.number().positive(), what);
}

/** Text without control characters, cut to `max` characters (both noted). */
function text(max: number, what: string) {
  return lenient(
    z.string().transform((s) => {
      let t = s.replace(CONTROL_RE, "");
      if (t !== s) note(what, "control characters were removed");
      if (t.length > max) {
        note(what, `cut to ${max} characters`);
        t = t.slice(0, max);
      }
      return t;
    }),
    what,
  );
}

/** A [low, high] pair of positive finite numbers; a reversed pair is swapped, anything else → default. */
function range(what: string) {
  return lenient(
    z.tuple([z.number().positive(), z.number().positive()]).transform(([a, b], ctx) => {
      if (a === b) {
        ctx.addIssue({ code: "custom", message: "empty range" });
        return z.NEVER;
      }
      if (a > b) note(what, "low and high were swapped");
      return (a < b ? [a, b] : [b, a]) as [number, number];
    }),
    what,
  );
}

const lenientPhysics = z.object({
  ref: lenient(physicsRef, "reference"),
  custom: lenient(
    z.object({
      cGamma: lenient(z.number(), "custom c_γ"),
      cGammaSigma: lenient(z.number().min(0), "custom σ(c_γ)"),
      kMuEv: positive("custom K"),
      kMuEvSigma: lenient(z.number().min(0), "custom σ(K)"),
      label: text(PROJECT_LIMITS.label, "custom label"),
    }),
    "custom constants",
  ),
});

const lenientFigure = z.object({
  preset: lenient(sizePreset, "size preset"),
  customWidthMm: clamped(20, 2000, "custom width"),
  customHeightMm: clamped(20, 2000, "custom height"),
  massRangeEv: range("mass range"),
  yRange: range("y range"),
  yView: lenient(yView, "y view"),
  topAxis: lenient(topAxis, "top axis"),
  grid: lenient(z.boolean(), "grid"),
  legend: lenient(legendPlace, "legend"),
  fontPt: clamped(4, 72, "font size"),
  title: text(PROJECT_LIMITS.label, "title"),
});

/** E/N as stored (a string); a finite number from a hand-edited file is accepted and turned into text. */
const eOverNLenient = z.unknown().transform((v, ctx) => {
  const s = typeof v === "number" && Number.isFinite(v) ? String(v) : v;
  if (typeof s === "string" && isRationalText(s)) return s;
  ctx.addIssue({
    code: "custom",
    message: `E/N ${v === undefined ? "is missing" : `${show(v)} is not a number or fraction such as 8/3`}`,
  });
  return z.NEVER;
});

const lenientModel = z.object({
  id: lenient(z.string().min(1).max(PROJECT_LIMITS.id), "id"),
  label: text(PROJECT_LIMITS.label, "label"),
  kind: lenient(modelKind, "kind"),
  eOverNMin: eOverNLenient.optional(),
  eOverNMax: eOverNLenient.optional(),
  members: lenient(
    z
      .array(
        z.object({
          eOverN: eOverNLenient,
          count: z.int().min(1).max(Number.MAX_SAFE_INTEGER).optional(),
          nDW: z.string().max(PROJECT_LIMITS.rational).optional(),
        }),
      )
      .max(PROJECT_LIMITS.members),
    "members",
  ),
  setDraw: lenient(setDraw, "set drawing"),
  setShare: lenient(z.number().gt(0).max(1), "set share"),
  source: lenient(modelSource, "source"),
  colour: lenient(hexColour, "colour"),
  lineStyle: lenient(lineStyle, "line style"),
  fillOpacity: clamped(0, 1, "fill opacity"),
  visible: lenient(z.boolean(), "visible"),
  sigmas: clamped(0, 10, "theory spread"),
});

const lenientCurve = z.object({
  id: lenient(z.string().min(1).max(PROJECT_LIMITS.id), "id"),
  label: text(PROJECT_LIMITS.label, "label"),
  role: lenient(curveRole, "role"),
  massEv: curveData,
  gInvGeV: curveData,
  keepOrder: lenient(z.boolean(), "keep order"),
  colour: lenient(hexColour, "colour"),
  lineStyle: lenient(lineStyle, "line style"),
  fillOpacity: clamped(0, 1, "fill opacity"),
  visible: lenient(z.boolean(), "visible"),
  rescale: lenient(
    z.object({
      rhoAssumed: positive("assumed ρ"),
      rhoShown: positive("shown ρ"),
      fraction: lenient(
        z
          .number()
          .positive()
          .transform((f) => {
            if (f > 1) note("dark-matter fraction", `${f} is above 1; set to 1`);
            return Math.min(f, 1);
          }),
        "dark-matter fraction",
      ),
    }),
    "rescaling",
  ),
  citation: text(PROJECT_LIMITS.citation, "citation"),
  fileName: text(PROJECT_LIMITS.fileName, "file name"),
});

const physicsOrDefault = lenient(lenientPhysics, "constants");
const figureOrDefault = lenient(lenientFigure, "figure");
const projectName = text(PROJECT_LIMITS.label, "project name");

function firstIssue(error: z.ZodError): string {
  const issue = error.issues[0];
  const path = issue.path
    .map((p) => (typeof p === "number" ? `[${p}]` : `.${String(p)}`))
    .join("")
    .replace(/^\./, "");
  return path ? `${path}: ${issue.message}` : issue.message;
}

function isPlainObject(x: unknown): x is Record<string, unknown> {
  return typeof x === "object" && x !== null && !Array.isArray(x);
}

function labelOf(x: unknown): string {
  return isPlainObject(x) && typeof x.label === "string" ? ` "${x.label.slice(0, 40)}"` : "";
}

/** Result of {@link restoreProject}: the repaired project and a note per repair, or why it was refused. */
export type RestoreResult =
  { ok: true; project: Project; repairs: string[] } | { ok: false; error: string; futureVersion?: number };

function restoreModels(raw: unknown[], repairs: string[]): Model[] {
  const out: Model[] = [];
  const taken = new Set<string>();
  raw.forEach((item, i) => {
    repairWhere = `model ${i + 1}${labelOf(item)}, `;
    const r = lenientModel.safeParse(item);
    if (!r.success) {
      repairs.push(`model ${i + 1}${labelOf(item)} was left out: ${firstIssue(r.error)}`);
      return;
    }
    const m = r.data;
    const settled = settleModelKind({
      kind: m.kind,
      eOverNMin: m.eOverNMin,
      eOverNMax: m.eOverNMax,
      members: m.members?.map((x) => ({ ...x, count: x.count ?? 1 })),
    });
    if (!settled.ok) {
      repairs.push(`model ${i + 1}${labelOf(item)} was left out: ${settled.error}`);
      return;
    }
    for (const msg of settled.notes) note("E/N", msg);
    const { kind, eOverNMin: min, eOverNMax: max, members } = settled;
    const d = newModel({
      id: "",
      kind,
      eOverNMin: min,
      eOverNMax: max,
      members,
      colour: MODEL_COLOURS[out.length % MODEL_COLOURS.length],
    });
    const id = uniqueId(m.id ?? `m-${out.length + 1}`, taken);
    if (m.id !== undefined && id !== m.id) note("id", `${show(m.id)} was used twice; renamed to ${show(id)}`);
    taken.add(id);
    out.push({
      id,
      label: m.label ?? d.label,
      kind,
      eOverNMin: min,
      eOverNMax: max,
      members,
      setDraw: m.setDraw ?? d.setDraw,
      setShare: m.setShare ?? d.setShare,
      source: m.source ?? d.source,
      colour: m.colour ?? d.colour,
      lineStyle: m.lineStyle ?? d.lineStyle,
      fillOpacity: m.fillOpacity ?? d.fillOpacity,
      visible: m.visible ?? d.visible,
      sigmas: m.sigmas ?? d.sigmas,
    });
  });
  return out;
}

function restoreCurves(raw: unknown[], repairs: string[]): Curve[] {
  const out: Curve[] = [];
  const taken = new Set<string>();
  raw.forEach((item, i) => {
    repairWhere = `curve ${i + 1}${labelOf(item)}, `;
    const r = lenientCurve.safeParse(item);
    if (!r.success) {
      repairs.push(`curve ${i + 1}${labelOf(item)} was left out: ${firstIssue(r.error)}`);
      return;
    }
    const c = r.data;
    if (c.massEv.length !== c.gInvGeV.length) {
      repairs.push(
        `curve ${i + 1}${labelOf(item)} was left out: it has ${c.massEv.length} masses but ${c.gInvGeV.length} couplings`,
      );
      return;
    }
    const role = c.role ?? "exclusion";
    const d = newCurve({ role, colour: CURVE_COLOURS[out.length % CURVE_COLOURS.length], id: "" });
    const id = uniqueId(c.id ?? `c-${out.length + 1}`, taken);
    if (c.id !== undefined && id !== c.id) note("id", `${show(c.id)} was used twice; renamed to ${show(id)}`);
    taken.add(id);
    out.push({
      id,
      label: c.label ?? `Curve ${out.length + 1}`,
      role,
      massEv: c.massEv,
      gInvGeV: c.gInvGeV,
      keepOrder: c.keepOrder ?? d.keepOrder,
      colour: c.colour ?? d.colour,
      lineStyle: c.lineStyle ?? defaultCurveLineStyle(role),
      fillOpacity: c.fillOpacity ?? d.fillOpacity,
      visible: c.visible ?? d.visible,
      rescale: {
        rhoAssumed: c.rescale?.rhoAssumed ?? d.rescale.rhoAssumed,
        rhoShown: c.rescale?.rhoShown ?? d.rescale.rhoShown,
        fraction: c.rescale?.fraction ?? d.rescale.fraction,
      },
      citation: c.citation ?? d.citation,
      fileName: c.fileName ?? d.fileName,
    });
  });
  return out;
}

function restorePhysics(raw: unknown): PhysicsSettings {
  repairWhere = "constants, ";
  const d = defaultPhysics();
  const r = physicsOrDefault.parse(raw);
  const c = r?.custom;
  return {
    ref: r?.ref ?? d.ref,
    custom: {
      cGamma: c?.cGamma ?? d.custom.cGamma,
      cGammaSigma: c?.cGammaSigma ?? d.custom.cGammaSigma,
      kMuEv: c?.kMuEv ?? d.custom.kMuEv,
      kMuEvSigma: c?.kMuEvSigma ?? d.custom.kMuEvSigma,
      label: c?.label ?? d.custom.label,
    },
  };
}

function restoreFigure(raw: unknown): Figure {
  repairWhere = "figure, ";
  const d = defaultFigure();
  const f = figureOrDefault.parse(raw);
  const view = f?.yView ?? d.yView;
  return {
    preset: f?.preset ?? d.preset,
    customWidthMm: f?.customWidthMm ?? d.customWidthMm,
    customHeightMm: f?.customHeightMm ?? d.customHeightMm,
    massRangeEv: f?.massRangeEv ?? d.massRangeEv,
    yRange: f?.yRange ?? defaultYRange(view),
    yView: view,
    topAxis: f?.topAxis ?? d.topAxis,
    grid: f?.grid ?? d.grid,
    legend: f?.legend ?? d.legend,
    fontPt: f?.fontPt ?? d.fontPt,
    title: f?.title ?? d.title,
  };
}

/**
 * The repair step every reader shares (link, file, browser storage). Migrates an older version, validates
 * against the schema, fills defaults for missing fields, clamps out-of-range numbers, replaces invalid
 * values by defaults, leaves out models or curves that cannot be repaired (bad E/N, bad data), renames
 * clashing ids, and converts curve data to Float64Array. Each repair is described in `repairs`.
 * Refuses input that is not a project, has no valid version, is from a future version, or is too large.
 * Never throws.
 * @param untrusted parsed JSON (or an in-memory project) of any schema version
 */
export function restoreProject(untrusted: unknown): RestoreResult {
  try {
    const m = migrate(untrusted);
    if (!m.ok) return { ok: false, error: m.error, ...(m.reason === "future" ? { futureVersion: m.version } : {}) };
    const raw = m.value;
    for (const key of ["models", "curves"] as const) {
      const list = raw[key];
      if (list !== undefined && !Array.isArray(list)) return { ok: false, error: `"${key}" must be a list` };
      const max = PROJECT_LIMITS[key];
      if (Array.isArray(list) && list.length > max)
        return { ok: false, error: `it has ${list.length} ${key}; at most ${max} are allowed` };
    }
    repairLog = [];
    const repairs = repairLog;
    repairWhere = "";
    const nameParsed = projectName.parse(raw.name);
    const project: Project = {
      version: PROJECT_VERSION,
      name: nameParsed ?? "Untitled",
      physics: restorePhysics(raw.physics),
      models: restoreModels((raw.models as unknown[] | undefined) ?? [], repairs),
      curves: restoreCurves((raw.curves as unknown[] | undefined) ?? [], repairs),
      figure: restoreFigure(raw.figure),
    };
    return { ok: true, project, repairs };
  } catch (e) {
    return { ok: false, error: `it could not be read (${e instanceof Error ? e.message : String(e)})` };
  } finally {
    repairLog = [];
    repairWhere = "";
  }
}

// ------------------------------------------------------------------------------------------------- JSON helpers

const FORBIDDEN_KEYS = new Set(["__proto__", "constructor", "prototype"]);

/**
 * JSON.parse that drops the keys `__proto__`, `constructor` and `prototype` wherever they occur, so parsed
 * input can never reach an object's prototype through later copying.
 * @throws SyntaxError on invalid JSON (callers turn it into a message)
 */
export function parseJsonSafely(text: string): unknown {
  // The reviver costs a call per value; text that cannot hold such a key (not even "\u"-escaped) skips it.
  if (!/__proto__|constructor|prototype|\\u/.test(text)) return JSON.parse(text);
  return JSON.parse(text, (key, value) => (FORBIDDEN_KEYS.has(key) ? undefined : value));
}

/** The project as plain JSON-ready data: curve data as number arrays, everything else as is. */
export function projectToJsonValue(project: Project): Record<string, unknown> {
  return {
    version: project.version,
    name: project.name,
    physics: project.physics,
    models: project.models,
    curves: project.curves.map((c) => ({ ...c, massEv: Array.from(c.massEv), gInvGeV: Array.from(c.gInvGeV) })),
    figure: project.figure,
  };
}

/**
 * Deep equality of two projects (or any plain data): Float64Arrays are compared element by element, a
 * missing key equals a key holding `undefined`, and +0 equals −0.
 */
export function projectsEqual(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (typeof a === "number" && typeof b === "number") return Number.isNaN(a) && Number.isNaN(b);
  if (typeof a !== "object" || typeof b !== "object" || a === null || b === null) return false;
  if (a instanceof Float64Array || b instanceof Float64Array) {
    if (!(a instanceof Float64Array && b instanceof Float64Array) || a.length !== b.length) return false;
    for (let i = 0; i < a.length; i++) if (a[i] !== b[i] && !(Number.isNaN(a[i]) && Number.isNaN(b[i]))) return false;
    return true;
  }
  if (Array.isArray(a) !== Array.isArray(b)) return false;
  if (Array.isArray(a) && Array.isArray(b)) {
    if (a.length !== b.length) return false;
    for (let i = 0; i < a.length; i++) if (!projectsEqual(a[i], b[i])) return false;
    return true;
  }
  const ao = a as Record<string, unknown>;
  const bo = b as Record<string, unknown>;
  const keys = new Set([...Object.keys(ao), ...Object.keys(bo)]);
  for (const k of keys) if (!projectsEqual(ao[k], bo[k])) return false;
  return true;
}

/** A fresh id for a model or curve that does not clash with the project's ids. */
export function freshIdFor(project: Pick<Project, "models" | "curves">, prefix: "m" | "c"): string {
  const taken = new Set([...project.models.map((m) => m.id), ...project.curves.map((c) => c.id)]);
  let id = newId(prefix);
  while (taken.has(id)) id = newId(prefix);
  return id;
}
