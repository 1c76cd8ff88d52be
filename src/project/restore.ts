// The restore step shared by links, files and browser storage: it migrates old versions, fills defaults, repairs
// or drops what is broken, and returns what it did beside the project (no state is kept between calls).
import type { z } from "zod";
import {
  defaultCurveLineStyle,
  defaultFigure,
  defaultPhysics,
  defaultYRange,
  legacyExclusionMark,
  CURVE_COLOURS,
  MODEL_COLOURS,
  newCurve,
  newModel,
} from "./defaults";
import { uniqueId } from "./ids";
import { CUSTOM_MM_LIMITS, LEGEND_SCALE_LIMITS } from "./limits";
import { isPlainObject } from "./json";
import { migrate } from "./migrate";
import { settleModelKind } from "./model-kind";
import {
  CONTROL_RE,
  PROJECT_LIMITS,
  curveData,
  curveRole,
  exclusionMark,
  hexColour,
  isRationalText,
  labelAt,
  legendPlace,
  lineStyle,
  modelKind,
  modelSource,
  physicsRef,
  setDraw,
  setShare,
  sizePreset,
  topAxis,
  figureFont,
  yView,
  axisMassUnit,
  frequencyUnitSetting,
  tickSides,
} from "./schema";
import { MIN_RANGE_DECADES, saneRange } from "./view-range";
import {
  PROJECT_VERSION,
  type Curve,
  type Figure,
  type Model,
  type ModelMember,
  type PhysicsSettings,
  type Project,
} from "./types";

/** Result of {@link restoreProject}: the repaired project and a note per repair, or why it was refused. */
export type RestoreResult =
  { ok: true; project: Project; repairs: string[] } | { ok: false; error: string; futureVersion?: number };

/** Where a repair is noted: `note(field, message)` adds one line to the repairs of the current call. */
type Note = (what: string, msg: string) => void;
type Rec = Record<string, unknown>;

function show(v: unknown): string {
  if (typeof v === "string") return JSON.stringify(v.length > 40 ? `${v.slice(0, 40)}…` : v);
  if (typeof v === "number" || typeof v === "boolean" || v === null) return String(v);
  if (Array.isArray(v)) return "a list";
  return typeof v === "object" ? "an object" : typeof v;
}

const invalid = (note: Note, what: string, v: unknown): undefined => {
  note(what, `${show(v)} is not valid; the default is used`);
  return undefined;
};

/** An own field of a record (never an inherited one such as "constructor"). */
const own = (o: Rec, key: string): unknown => (Object.hasOwn(o, key) ? o[key] : undefined);

// Field readers: the value, or undefined (the caller's default) when missing or invalid, noting the latter.

function valid<T>(schema: z.ZodType<T>, v: unknown, note: Note, what: string): T | undefined {
  if (v === undefined) return undefined;
  const r = schema.safeParse(v);
  return r.success ? r.data : invalid(note, what, v);
}

function record(v: unknown, note: Note, what: string): Rec | undefined {
  if (v === undefined) return undefined;
  return isPlainObject(v) ? v : invalid(note, what, v);
}

const isFiniteNumber = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v);

/** A number clamped into [lo, hi] (noted). */
function clamped(v: unknown, lo: number, hi: number, note: Note, what: string): number | undefined {
  if (v === undefined) return undefined;
  if (!isFiniteNumber(v)) return invalid(note, what, v);
  const c = Math.min(hi, Math.max(lo, v));
  if (c !== v) note(what, `${v} is out of range; set to ${c}`);
  return c;
}

function positive(v: unknown, note: Note, what: string): number | undefined {
  if (v === undefined) return undefined;
  return isFiniteNumber(v) && v > 0 ? v : invalid(note, what, v);
}

function finite(v: unknown, min: number, note: Note, what: string): number | undefined {
  if (v === undefined) return undefined;
  return isFiniteNumber(v) && v >= min ? v : invalid(note, what, v);
}

function idText(v: unknown, note: Note): string | undefined {
  if (v === undefined) return undefined;
  return typeof v === "string" && v.length >= 1 && v.length <= PROJECT_LIMITS.id ? v : invalid(note, "id", v);
}

function bool(v: unknown, note: Note, what: string): boolean | undefined {
  if (v === undefined) return undefined;
  return typeof v === "boolean" ? v : invalid(note, what, v);
}

/** Text without control characters, cut to `max` characters (both noted). */
function text(v: unknown, max: number, note: Note, what: string): string | undefined {
  if (v === undefined) return undefined;
  if (typeof v !== "string") return invalid(note, what, v);
  let t = v.replace(CONTROL_RE, "");
  if (t !== v) note(what, "control characters were removed");
  if (t.length > max) {
    note(what, `cut to ${max} characters`);
    t = t.slice(0, max);
  }
  return t;
}

/**
 * A [low, high] pair of positive finite numbers; a reversed pair is swapped, one too narrow to draw (or beyond
 * 10^±300) is widened (both noted), an empty one is invalid.
 */
function range(v: unknown, note: Note, what: string): [number, number] | undefined {
  if (v === undefined) return undefined;
  if (!Array.isArray(v) || v.length !== 2) return invalid(note, what, v);
  const [a, b] = v as unknown[];
  if (!isFiniteNumber(a) || !isFiniteNumber(b) || a <= 0 || b <= 0 || a === b) return invalid(note, what, v);
  if (a > b) note(what, "low and high were swapped");
  const sane = saneRange([a, b]) ?? [Math.min(a, b), Math.max(a, b)];
  if (sane[0] !== Math.min(a, b) || sane[1] !== Math.max(a, b))
    note(
      what,
      `[${a}, ${b}] cannot be drawn (narrower than ${MIN_RANGE_DECADES} decades or beyond 10^±300); set to [${sane[0]}, ${sane[1]}]`,
    );
  return sane;
}

/** E/N as stored (a string); a finite number from a hand-edited file is turned into text. Error text when bad. */
function eOverN(v: unknown): { ok: true; value: string } | { ok: false; error: string } {
  const s = isFiniteNumber(v) ? String(v) : v;
  if (typeof s === "string" && isRationalText(s)) return { ok: true, value: s };
  return {
    ok: false,
    error: `E/N ${v === undefined ? "is missing" : `${show(v)} is not a number or fraction such as 8/3`}`,
  };
}

function labelOf(x: unknown): string {
  return isPlainObject(x) && typeof x.label === "string" ? ` "${x.label.slice(0, 40)}"` : "";
}

/** Members of a between-lines band or model set; unreadable members are left out (noted). */
function members(v: unknown, note: Note): ModelMember[] | undefined {
  if (v === undefined) return undefined;
  if (!Array.isArray(v) || v.length > PROJECT_LIMITS.members) return invalid(note, "members", v);
  const out: ModelMember[] = [];
  v.forEach((item: unknown, i) => {
    const e = isPlainObject(item) ? eOverN(own(item, "eOverN")) : null;
    const count = isPlainObject(item) ? (own(item, "count") ?? 1) : null;
    const nDW = isPlainObject(item) ? own(item, "nDW") : undefined;
    if (!e?.ok || !Number.isSafeInteger(count) || (count as number) < 1) {
      note("members", `member ${i + 1} (${show(item)}) was left out: ${e && !e.ok ? e.error : "expected a count ≥ 1"}`);
      return;
    }
    const m: ModelMember = { eOverN: e.value, count: count as number };
    if (typeof nDW === "string" && nDW.length <= PROJECT_LIMITS.rational) m.nDW = nDW;
    out.push(m);
  });
  return out;
}

/** A model, or why it was left out (no E/N that can be read). */
function restoreModel(raw: Rec, index: number, taken: Set<string>, note: Note): Model | string {
  const lo = own(raw, "eOverNMin") === undefined ? undefined : eOverN(own(raw, "eOverNMin"));
  if (lo && !lo.ok) return `eOverNMin: ${lo.error}`;
  const hi = own(raw, "eOverNMax") === undefined ? undefined : eOverN(own(raw, "eOverNMax"));
  if (hi && !hi.ok) return `eOverNMax: ${hi.error}`;
  const settled = settleModelKind({
    kind: valid(modelKind, own(raw, "kind"), note, "kind"),
    eOverNMin: lo?.value,
    eOverNMax: hi?.value,
    members: members(own(raw, "members"), note),
  });
  if (!settled.ok) return `eOverNMin: ${settled.error}`;
  for (const msg of settled.notes) note("E/N", msg);
  const { kind, eOverNMin: min, eOverNMax: max } = settled;
  const rawId = idText(own(raw, "id"), note);
  const label = text(own(raw, "label"), PROJECT_LIMITS.label, note, "label");
  const d = newModel({
    id: "",
    kind,
    eOverNMin: min,
    eOverNMax: max,
    members: settled.members,
    colour: MODEL_COLOURS[index % MODEL_COLOURS.length],
  });
  const source = valid(modelSource, own(raw, "source"), note, "source");
  const colour = valid(hexColour, own(raw, "colour"), note, "colour");
  const style = valid(lineStyle, own(raw, "lineStyle"), note, "line style");
  const fillOpacity = clamped(own(raw, "fillOpacity"), 0, 1, note, "fill opacity");
  const visible = bool(own(raw, "visible"), note, "visible");
  const sigmas = clamped(own(raw, "sigmas"), 0, 10, note, "theory spread");
  const at = valid(labelAt, own(raw, "labelAt"), note, "label position");
  const draw = valid(setDraw, own(raw, "setDraw"), note, "set drawing");
  const share = valid(setShare, own(raw, "setShare"), note, "set share");
  const id = uniqueId(rawId ?? `m-${index + 1}`, taken);
  if (rawId !== undefined && id !== rawId) note("id", `${show(rawId)} was used twice; renamed to ${show(id)}`);
  taken.add(id);
  return {
    id,
    label: label ?? d.label,
    kind,
    eOverNMin: min,
    eOverNMax: max,
    members: settled.members,
    setDraw: draw ?? d.setDraw,
    setShare: share ?? d.setShare,
    source: source ?? d.source,
    colour: colour ?? d.colour,
    lineStyle: style ?? d.lineStyle,
    fillOpacity: fillOpacity ?? d.fillOpacity,
    visible: visible ?? d.visible,
    sigmas: sigmas ?? d.sigmas,
    // Only when set: projects without a dragged label restore exactly as they were written.
    ...(at ? { labelAt: at } : {}),
  };
}

/** Curve data as a Float64Array, or why not. */
function data(v: unknown, what: string): Float64Array | string {
  const r = curveData.safeParse(v);
  return r.success ? r.data : `${what}: ${r.error.issues[0].message}`;
}

function restoreRescale(v: unknown, d: Curve["rescale"], note: Note): Curve["rescale"] {
  const r = record(v, note, "rescaling") ?? {};
  let fraction = positive(own(r, "fraction"), note, "dark-matter fraction");
  if (fraction !== undefined && fraction > 1) {
    note("dark-matter fraction", `${fraction} is above 1; set to 1`);
    fraction = 1;
  }
  return {
    rhoAssumed: positive(own(r, "rhoAssumed"), note, "assumed ρ") ?? d.rhoAssumed,
    rhoShown: positive(own(r, "rhoShown"), note, "shown ρ") ?? d.rhoShown,
    fraction: fraction ?? d.fraction,
  };
}

/** A curve, or why it was left out (no readable data, or masses and couplings of different lengths). */
function restoreCurve(raw: Rec, index: number, taken: Set<string>, note: Note): Curve | string {
  const massEv = data(own(raw, "massEv"), "massEv");
  if (typeof massEv === "string") return massEv;
  const gInvGeV = data(own(raw, "gInvGeV"), "gInvGeV");
  if (typeof gInvGeV === "string") return gInvGeV;
  if (massEv.length !== gInvGeV.length) return `it has ${massEv.length} masses but ${gInvGeV.length} couplings`;
  const rawId = idText(own(raw, "id"), note);
  const label = text(own(raw, "label"), PROJECT_LIMITS.label, note, "label");
  const role = valid(curveRole, own(raw, "role"), note, "role") ?? "exclusion";
  const d = newCurve({ role, colour: CURVE_COLOURS[index % CURVE_COLOURS.length], id: "" });
  const keepOrder = bool(own(raw, "keepOrder"), note, "keep order");
  const colour = valid(hexColour, own(raw, "colour"), note, "colour");
  const style = valid(lineStyle, own(raw, "lineStyle"), note, "line style");
  const fillOpacity = clamped(own(raw, "fillOpacity"), 0, 1, note, "fill opacity");
  const mark = valid(exclusionMark, own(raw, "exclusionMark"), note, "exclusion mark");
  const visible = bool(own(raw, "visible"), note, "visible");
  const rescale = restoreRescale(own(raw, "rescale"), d.rescale, note);
  const citation = text(own(raw, "citation"), PROJECT_LIMITS.citation, note, "citation");
  const fileName = text(own(raw, "fileName"), PROJECT_LIMITS.fileName, note, "file name");
  const at = valid(labelAt, own(raw, "labelAt"), note, "label position");
  const id = uniqueId(rawId ?? `c-${index + 1}`, taken);
  if (rawId !== undefined && id !== rawId) note("id", `${show(rawId)} was used twice; renamed to ${show(id)}`);
  taken.add(id);
  return {
    id,
    label: label ?? `Curve ${index + 1}`,
    role,
    massEv,
    gInvGeV,
    keepOrder: keepOrder ?? d.keepOrder,
    colour: colour ?? d.colour,
    lineStyle: style ?? defaultCurveLineStyle(role),
    fillOpacity: fillOpacity ?? d.fillOpacity,
    exclusionMark: mark ?? legacyExclusionMark(fillOpacity),
    visible: visible ?? d.visible,
    rescale,
    citation: citation ?? d.citation,
    fileName: fileName ?? d.fileName,
    ...(at ? { labelAt: at } : {}),
  };
}

/**
 * The items of a model or curve list that can be restored, in order; each one left out or repaired is noted
 * with its place and label ("model 2 \"Bad\", colour: …").
 */
function restoreList<T>(
  raw: unknown[],
  kind: "model" | "curve",
  one: (item: Rec, index: number, taken: Set<string>, note: Note) => T | string,
  repairs: string[],
): T[] {
  const out: T[] = [];
  const taken = new Set<string>();
  raw.forEach((item, i) => {
    const where = `${kind} ${i + 1}${labelOf(item)}`;
    const r = isPlainObject(item)
      ? one(item, out.length, taken, (what, msg) => repairs.push(`${where}, ${what}: ${msg}`))
      : "it is not an object";
    if (typeof r === "string") repairs.push(`${where} was left out: ${r}`);
    else out.push(r);
  });
  return out;
}

function restorePhysics(raw: unknown, note: Note): PhysicsSettings {
  const d = defaultPhysics();
  const r = record(raw, note, "constants") ?? {};
  const ref = valid(physicsRef, own(r, "ref"), note, "reference");
  const c = record(own(r, "custom"), note, "custom constants") ?? {};
  return {
    ref: ref ?? d.ref,
    custom: {
      cGamma: finite(own(c, "cGamma"), -Infinity, note, "custom c_γ") ?? d.custom.cGamma,
      cGammaSigma: finite(own(c, "cGammaSigma"), 0, note, "custom σ(c_γ)") ?? d.custom.cGammaSigma,
      kMuEv: positive(own(c, "kMuEv"), note, "custom K") ?? d.custom.kMuEv,
      kMuEvSigma: finite(own(c, "kMuEvSigma"), 0, note, "custom σ(K)") ?? d.custom.kMuEvSigma,
      label: text(own(c, "label"), PROJECT_LIMITS.label, note, "custom label") ?? d.custom.label,
    },
  };
}

function restoreFigure(raw: unknown, note: Note): Figure {
  const d = defaultFigure();
  const f = record(raw, note, "figure") ?? {};
  const preset = valid(sizePreset, own(f, "preset"), note, "size preset");
  const [minMm, maxMm] = CUSTOM_MM_LIMITS;
  const customWidthMm = clamped(own(f, "customWidthMm"), minMm, maxMm, note, "custom width");
  const customHeightMm = clamped(own(f, "customHeightMm"), minMm, maxMm, note, "custom height");
  const massRangeEv = range(own(f, "massRangeEv"), note, "mass range");
  const yRange = range(own(f, "yRange"), note, "y range");
  const view = valid(yView, own(f, "yView"), note, "y view") ?? d.yView;
  return {
    preset: preset ?? d.preset,
    customWidthMm: customWidthMm ?? d.customWidthMm,
    customHeightMm: customHeightMm ?? d.customHeightMm,
    massRangeEv: massRangeEv ?? d.massRangeEv,
    yRange: yRange ?? defaultYRange(view),
    yView: view,
    topAxis: valid(topAxis, own(f, "topAxis"), note, "top axis") ?? d.topAxis,
    grid: bool(own(f, "grid"), note, "grid") ?? d.grid,
    legend: valid(legendPlace, own(f, "legend"), note, "legend") ?? d.legend,
    legendScale: clamped(own(f, "legendScale"), ...LEGEND_SCALE_LIMITS, note, "legend text size") ?? d.legendScale,
    fontPt: clamped(own(f, "fontPt"), 4, 72, note, "font size") ?? d.fontPt,
    font: valid(figureFont, own(f, "font"), note, "figure font") ?? d.font,
    title: text(own(f, "title"), PROJECT_LIMITS.label, note, "title") ?? d.title,
    massUnit: valid(axisMassUnit, own(f, "massUnit"), note, "mass axis unit") ?? d.massUnit,
    frequencyUnit: valid(frequencyUnitSetting, own(f, "frequencyUnit"), note, "frequency unit") ?? d.frequencyUnit,
    ticks: valid(tickSides, own(f, "ticks"), note, "tick sides") ?? d.ticks,
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
    const repairs: string[] = [];
    const at =
      (where: string): Note =>
      (what, msg) =>
        repairs.push(`${where}${what}: ${msg}`);
    const project: Project = {
      version: PROJECT_VERSION,
      name: text(raw.name, PROJECT_LIMITS.label, at(""), "project name") ?? "Untitled",
      physics: restorePhysics(raw.physics, at("constants, ")),
      models: restoreList((raw.models as unknown[] | undefined) ?? [], "model", restoreModel, repairs),
      curves: restoreList((raw.curves as unknown[] | undefined) ?? [], "curve", restoreCurve, repairs),
      figure: restoreFigure(raw.figure, at("figure, ")),
    };
    return { ok: true, project, repairs };
  } catch (e) {
    return { ok: false, error: `it could not be read (${e instanceof Error ? e.message : String(e)})` };
  }
}
