// Link format v1's compact object (frozen): short keys and base values of every field, and the conversion of a
// project to it and back to a project object of schema version 1.
import {
  CURVE_STATE,
  FIGURE_STATE,
  MODEL_STATE,
  PHYSICS_STATE,
  PROJECT_STATE,
  goesTo,
} from "../../project/state-table";
import type { PersistTarget } from "../../project/state-table";
import { isPlainObject } from "../../project/json";
import type { Project } from "../../project/types";
import {
  ShapeError,
  always,
  listOf,
  decodeWith,
  encodeWith,
  type Codec,
  type CompactLayout,
  type Rec,
} from "./compact";
import { decodeNumbers, encodeNumbers } from "./numbers";

// Link format v1 (frozen):
//   compact  = { n: name, p: physics, f: figure, m: [model…], c: [curve…], o: number of curves left out }
//   Every object uses the one- or two-letter keys of the tables below; a key is omitted when its value equals
//   the v1 base value (frozen here, independent of today's defaults): name "Untitled", the 2019 constants,
//   the default figure, a model's auto label "E/N = a" / "E/N = a..b", max E/N = min E/N, the i-th colour of
//   the v1 palettes, and so on. Curve data are written by the number codec (./numbers.ts).
//   Without curves ("c" absent), a link carries name, constants, figure and models only; "o" says how many
//   curves the sender had.

// Frozen v1 base values: copies of the defaults when format v1 was defined. Never edit; a new format gets new ones.
const V1_MODEL_COLOURS = ["#117A8B", "#1F4E8C", "#2A9D8F", "#4062BB", "#0B5563", "#5B8DB8"];
const V1_CURVE_COLOURS = ["#D55E00", "#CC79A7", "#E69F00", "#009E73", "#000000", "#56B4E9", "#0072B2", "#F0E442"];
const V1_RHO = 0.45;

const str = (x: unknown) => (typeof x === "string" ? x : "");

const PHYSICS_V1: Codec = {
  table: PHYSICS_STATE,
  fields: [
    { full: "ref", short: "r", base: () => "2019" },
    {
      full: "custom",
      short: "c",
      sub: {
        table: { cGamma: always, cGammaSigma: always, kMuEv: always, kMuEvSigma: always, label: always },
        fields: [
          { full: "cGamma", short: "g", base: () => 1.92 },
          { full: "cGammaSigma", short: "s", base: () => 0.04 },
          { full: "kMuEv", short: "k", base: () => 5.691 },
          { full: "kMuEvSigma", short: "e", base: () => 0.051 },
          { full: "label", short: "l", base: () => "custom" },
        ],
      },
    },
  ],
};

const FIGURE_V1: Codec = {
  table: FIGURE_STATE,
  fields: [
    { full: "preset", short: "p", base: () => "slide" },
    { full: "customWidthMm", short: "w", base: () => 160 },
    { full: "customHeightMm", short: "h", base: () => 90 },
    { full: "massRangeEv", short: "x", base: () => [1e-7, 1e-2] },
    { full: "yView", short: "v", base: () => "coupling" },
    {
      full: "yRange",
      short: "y",
      base: (f) => (f.yView === "normalized" ? [1e-2, 1e2] : f.yView === "g-gamma" ? [5e-3, 50] : [1e-17, 1e-9]),
    },
    { full: "topAxis", short: "t", base: () => "fa" },
    { full: "grid", short: "g", base: () => true },
    { full: "legend", short: "l", base: () => "bottom-right" },
    // Joined without a bump: links written before it decode to 1, the size they were drawn with.
    { full: "legendScale", short: "ls", base: () => 1 },
    { full: "fontPt", short: "s", base: () => 12 },
    // Joined without a bump: links written before it decode to "sans", the look they had.
    { full: "font", short: "f", base: () => "sans" },
    { full: "title", short: "n", base: () => "" },
    // Joined without a bump: links written before them decode to the eV axis, the automatic frequency unit and
    // outward ticks (the house style since then).
    { full: "massUnit", short: "mu", base: () => "eV" },
    { full: "frequencyUnit", short: "fu", base: () => "auto" },
    { full: "ticks", short: "tk", base: () => "out" },
  ],
};

const MODEL_V1: Codec = {
  table: MODEL_STATE,
  fields: [
    { full: "id", short: "i" },
    { full: "eOverNMin", short: "a" },
    { full: "eOverNMax", short: "b", base: (m) => m.eOverNMin },
    {
      full: "label",
      short: "l",
      base: (m) =>
        str(m.eOverNMin) === str(m.eOverNMax)
          ? `E/N = ${str(m.eOverNMin)}`
          : `E/N = ${str(m.eOverNMin)}..${str(m.eOverNMax)}`,
    },
    { full: "source", short: "s", base: () => ({ kind: "typed" }) },
    { full: "colour", short: "c", base: (_m, i) => V1_MODEL_COLOURS[i % V1_MODEL_COLOURS.length] },
    { full: "lineStyle", short: "y", base: () => "solid" },
    { full: "fillOpacity", short: "o", base: () => 0.25 },
    { full: "visible", short: "v", base: () => true },
    { full: "sigmas", short: "k", base: () => 0 },
    // Joined without a bump: absent (the automatic place) is the base, so older links decode unchanged.
    { full: "labelAt", short: "la", base: () => undefined },
  ],
};

const CURVE_V1: Codec = {
  table: CURVE_STATE,
  fields: [
    { full: "id", short: "i" },
    { full: "label", short: "l", base: () => "Curve" },
    { full: "role", short: "r", base: () => "exclusion" },
    { full: "massEv", short: "m", enc: encodeNumbers, dec: decodeNumbers },
    { full: "gInvGeV", short: "g", enc: encodeNumbers, dec: decodeNumbers },
    { full: "keepOrder", short: "k", base: () => false },
    { full: "colour", short: "c", base: (_c, i) => V1_CURVE_COLOURS[i % V1_CURVE_COLOURS.length] },
    { full: "lineStyle", short: "y", base: (c) => (c.role === "projection" ? "dashed" : "solid") },
    { full: "fillOpacity", short: "o", base: () => 0.3 },
    // Joined without a bump (after fillOpacity, which its base reads): links written before it decode to the
    // hatches of the house style, or to the fill when they set a fill opacity of their own. Frozen rule.
    {
      full: "exclusionMark",
      short: "e",
      base: (c) => (c.fillOpacity !== 0.3 && c.fillOpacity !== 0 ? "fill" : "hatch"),
    },
    { full: "visible", short: "v", base: () => true },
    {
      full: "rescale",
      short: "s",
      sub: {
        table: { rhoAssumed: always, rhoShown: always, fraction: always },
        fields: [
          { full: "rhoAssumed", short: "a", base: () => V1_RHO },
          { full: "rhoShown", short: "s", base: () => V1_RHO },
          { full: "fraction", short: "f", base: () => 1 },
        ],
      },
    },
    { full: "citation", short: "t", base: () => "" },
    { full: "fileName", short: "f", base: () => "" },
    // Joined without a bump, as the model's "la".
    { full: "labelAt", short: "la", base: () => undefined },
  ],
};

/** The codecs of one link format's objects. */
export interface LayoutCodecs {
  physics: Codec;
  figure: Codec;
  model: Codec;
  curve: Codec;
}

export const CODECS_V1: LayoutCodecs = { physics: PHYSICS_V1, figure: FIGURE_V1, model: MODEL_V1, curve: CURVE_V1 };

function toCompactWith(k: LayoutCodecs, project: Project, includeCurves: boolean): Rec {
  const target: PersistTarget = { kind: "link", includeCurves };
  const out: Rec = {};
  if (goesTo(PROJECT_STATE.name, target) && project.name !== "Untitled") out.n = project.name;
  if (goesTo(PROJECT_STATE.physics, target)) {
    const p = encodeWith(k.physics, project.physics as unknown as Rec, 0, target);
    if (Object.keys(p).length > 0) out.p = p;
  }
  if (goesTo(PROJECT_STATE.figure, target)) {
    const f = encodeWith(k.figure, project.figure as unknown as Rec, 0, target);
    if (Object.keys(f).length > 0) out.f = f;
  }
  if (goesTo(PROJECT_STATE.models, target) && project.models.length > 0) {
    out.m = project.models.map((m, i) => encodeWith(k.model, m as unknown as Rec, i, target));
  }
  if (goesTo(PROJECT_STATE.curves, target)) {
    if (project.curves.length > 0)
      out.c = project.curves.map((c, i) => encodeWith(k.curve, c as unknown as Rec, i, target));
  } else if (project.curves.length > 0) {
    out.o = project.curves.length;
  }
  return out;
}

function fromCompactWith(k: LayoutCodecs, version: number, compact: unknown): { project: Rec; omitted: number } {
  if (!isPlainObject(compact)) throw new ShapeError("the content is not an object");
  const models = listOf(compact, "m", "models");
  const curves = listOf(compact, "c", "curves");
  const omitted = Object.hasOwn(compact, "o") ? compact.o : 0;
  return {
    project: {
      version,
      name: Object.hasOwn(compact, "n") ? compact.n : "Untitled",
      physics: decodeWith(k.physics, compact.p, 0, "the constants"),
      figure: decodeWith(k.figure, compact.f, 0, "the figure"),
      models: models.map((m, i) => decodeWith(k.model, m, i, `model ${i + 1}`)),
      curves: curves.map((c, i) => decodeWith(k.curve, c, i, `curve ${i + 1}`)),
    },
    omitted: typeof omitted === "number" && Number.isInteger(omitted) && omitted >= 0 ? omitted : 0,
  };
}

/** The compact layout of a format built from v1's object shape with its own codecs; reads to schema `version`. */
export function layoutWith(codecs: LayoutCodecs, version: number): CompactLayout {
  return {
    toCompact: (project, includeCurves) => toCompactWith(codecs, project, includeCurves),
    fromCompact: (compact) => fromCompactWith(codecs, version, compact),
  };
}

/** The v1 compact layout: written by format v1 (and by every later format that keeps the same object). */
export const COMPACT_V1: CompactLayout = layoutWith(CODECS_V1, 1);
