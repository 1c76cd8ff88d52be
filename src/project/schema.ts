// The project schema (zod): the strict form of the current version, and the field rules the restore step
// (./restore.ts) reads untrusted input with.
import { z } from "zod";
import { CUSTOM_MM_LIMITS, LEGEND_SCALE_LIMITS, PROJECT_LIMITS } from "./limits";
import {
  AXIS_MASS_UNITS,
  CURVE_ROLES,
  EXCLUSION_MARKS,
  FIGURE_FONTS,
  FREQUENCY_UNIT_SETTINGS,
  LEGEND_PLACES,
  SIZE_PRESETS,
  TICK_SIDES,
  TOP_AXES,
} from "./figure-options";
import { isRationalText, rationalValue } from "./rational-text";
import { PROJECT_VERSION } from "./types";
import { MIN_RANGE_DECADES, saneRange } from "./view-range";

export { PROJECT_LIMITS, isRationalText, rationalValue };

// ---------------------------------------------------------------------------------------------- building blocks

// C0 controls other than tab, LF and CR (and DEL) are invalid in the XML of an exported SVG.
// eslint-disable-next-line no-control-regex
export const CONTROL_RE = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/g;

export const hexColour = z
  .string()
  .regex(/^#(?:[0-9a-fA-F]{3,4}|[0-9a-fA-F]{6}|[0-9a-fA-F]{8})$/, "expected a colour such as #117A8B");
export const lineStyle = z.enum(["solid", "dashed", "dotted", "dashdot"]);
export const curveRole = z.enum(CURVE_ROLES);
export const exclusionMark = z.enum(EXCLUSION_MARKS);
export const legendPlace = z.enum(LEGEND_PLACES);
export const sizePreset = z.enum(SIZE_PRESETS);
export const topAxis = z.enum(TOP_AXES);
export const figureFont = z.enum(FIGURE_FONTS);
export const yView = z.enum(["coupling", "normalized", "g-gamma"]);
export const axisMassUnit = z.enum(AXIS_MASS_UNITS);
export const frequencyUnitSetting = z.enum(FREQUENCY_UNIT_SETTINGS);
export const tickSides = z.enum(TICK_SIDES);
export const physicsRef = z.enum(["2016", "2019", "custom"]);
export const modelKind = z.enum(["line", "interval", "between", "set"]);
export const setDraw = z.enum(["lines", "extremes", "central"]);
export const setShare = z.number().gt(0).max(1);
// Where a direct label was dragged to ([mass eV, g_aγγ GeV⁻¹]); joined without a bump, optional (absent: automatic).
export const labelAt = z.tuple([z.number().positive().finite(), z.number().positive().finite()]);

const eOverNText = z
  .string()
  .max(PROJECT_LIMITS.rational)
  .refine(isRationalText, "expected a number or fraction such as 8/3");

/** What the anomaly calculator stores per fermion; values are checked by the calculator, not here. */
const rationalInput = z.union([z.string().max(PROJECT_LIMITS.rational), z.number()]);
const colourInput = z.union([z.object({ p: z.int().min(0).max(100), q: z.int().min(0).max(100) }), z.string().max(32)]);
const ewInput = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("sm"), dim: z.int().min(1).max(100), y: rationalInput }),
  z.object({ kind: z.literal("su3l"), rep: z.enum(["1", "3", "3bar"]), x: rationalInput, b: rationalInput }),
  z.object({ kind: z.literal("explicit"), charges: z.array(rationalInput).max(100) }),
]);
const scalarInput = z.object({
  name: z.string().max(PROJECT_LIMITS.label),
  colour: colourInput.optional(),
  ew: ewInput,
});
const termText = z.string().max(PROJECT_LIMITS.label);
const fermionInput = z.object({
  colour: colourInput,
  ew: ewInput,
  chirality: z.enum(["L", "R"]),
  pq: rationalInput,
  copies: z.int().min(1).max(1000).optional(),
  name: z.string().max(PROJECT_LIMITS.label).optional(),
});
export const modelSource = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("typed") }),
  z.object({ kind: z.literal("catalogue"), catalogueId: z.string().max(PROJECT_LIMITS.id) }),
  z.object({
    kind: z.literal("calculator"),
    fermions: z.array(fermionInput).max(PROJECT_LIMITS.fermions),
    scalarCharge: rationalInput.transform(String),
    scalars: z.array(scalarInput).max(PROJECT_LIMITS.fermions).optional(),
    terms: z.array(termText).max(PROJECT_LIMITS.fermions).optional(),
    forbidden: z.array(termText).max(PROJECT_LIMITS.fermions).optional(),
    normalize: z.string().max(PROJECT_LIMITS.label).optional(),
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
export const curveData = z.unknown().transform((v, ctx) => {
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
  .refine(([lo, hi]) => lo < hi, "expected [low, high] with low < high")
  .refine((r) => sameRange(saneRange(r), r), `expected at least ${MIN_RANGE_DECADES} decades within 10^±300`);

function sameRange(a: readonly [number, number] | null, b: readonly [number, number]): boolean {
  return a !== null && a[0] === b[0] && a[1] === b[1];
}

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
        setShare,
        source: modelSource,
        colour: hexColour,
        lineStyle,
        fillOpacity: z.number().min(0).max(1),
        visible: z.boolean(),
        sigmas: z.number().min(0).max(10),
        labelAt: labelAt.optional(),
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
          exclusionMark,
          visible: z.boolean(),
          rescale: z.object({
            rhoAssumed: z.number().positive(),
            rhoShown: z.number().positive(),
            fraction: z.number().positive().max(1),
          }),
          citation: z.string().max(PROJECT_LIMITS.citation),
          fileName: z.string().max(PROJECT_LIMITS.fileName),
          labelAt: labelAt.optional(),
        })
        .refine((c) => c.massEv.length === c.gInvGeV.length, "massEv and gInvGeV must have the same length"),
    )
    .max(PROJECT_LIMITS.curves),
  figure: z.object({
    preset: sizePreset,
    customWidthMm: z.number().min(CUSTOM_MM_LIMITS[0]).max(CUSTOM_MM_LIMITS[1]),
    customHeightMm: z.number().min(CUSTOM_MM_LIMITS[0]).max(CUSTOM_MM_LIMITS[1]),
    massRangeEv: positiveRange,
    yRange: positiveRange,
    yView,
    topAxis,
    grid: z.boolean(),
    legend: legendPlace,
    legendScale: z.number().min(LEGEND_SCALE_LIMITS[0]).max(LEGEND_SCALE_LIMITS[1]),
    fontPt: z.number().min(4).max(72),
    font: figureFont,
    title: z.string().max(PROJECT_LIMITS.label),
    massUnit: axisMassUnit,
    frequencyUnit: frequencyUnitSetting,
    ticks: tickSides,
  }),
});
