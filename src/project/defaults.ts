// Defaults in one place: colour palettes, the default figure and constants, and the factories that build a
// complete Model or Curve from a partial one. The UI, the demo and the restore step all take defaults from here.
import { REF_2019 } from "../physics/constants";
import type {
  Curve,
  CurveRole,
  ExclusionMark,
  Figure,
  LineStyle,
  Model,
  ModelKind,
  ModelMember,
  ModelSource,
  PhysicsSettings,
  Project,
  SetDraw,
  YView,
} from "./types";
import { PROJECT_VERSION } from "./types";
import { newId } from "./ids";
import { settleModelKind } from "./model-kind";

/**
 * The Okabe–Ito colour-blind-safe palette by name (Okabe & Ito, "Color Universal Design", 2008).
 */
export const OKABE_ITO_BY_NAME = {
  orange: "#E69F00",
  skyBlue: "#56B4E9",
  bluishGreen: "#009E73",
  yellow: "#F0E442",
  blue: "#0072B2",
  vermillion: "#D55E00",
  reddishPurple: "#CC79A7",
  black: "#000000",
} as const;

/** The Okabe–Ito palette in its published order: orange, sky blue, bluish green, yellow, blue, vermillion, reddish purple, black. */
export const OKABE_ITO: readonly string[] = Object.values(OKABE_ITO_BY_NAME);

/**
 * Order in which new curves take Okabe–Ito colours: the warm and dark ones first so they stand apart from the
 * teal/blue model lines; yellow last because it is faint on white.
 */
export const CURVE_COLOURS: readonly string[] = [
  OKABE_ITO_BY_NAME.vermillion,
  OKABE_ITO_BY_NAME.reddishPurple,
  OKABE_ITO_BY_NAME.orange,
  OKABE_ITO_BY_NAME.bluishGreen,
  OKABE_ITO_BY_NAME.black,
  OKABE_ITO_BY_NAME.skyBlue,
  OKABE_ITO_BY_NAME.blue,
  OKABE_ITO_BY_NAME.yellow,
];

/** Model lines and bands: a teal/blue family (never yellow or orange, which belong to curves). */
export const MODEL_COLOURS: readonly string[] = ["#117A8B", "#1F4E8C", "#2A9D8F", "#4062BB", "#0B5563", "#5B8DB8"];

/**
 * Share of a model set's models its central band holds by default: 68 %, the share within ±1σ of a Gaussian
 * (common practice for "central" bands).
 */
export const DEFAULT_SET_SHARE = 0.68;
/** How a new model set is drawn: the band between its extreme lines. */
export const DEFAULT_SET_DRAW: SetDraw = "extremes";

/** Band fill opacity of a new model. @default 0.25 */
export const DEFAULT_MODEL_FILL_OPACITY = 0.25;
/** Fill opacity of a new exclusion or region curve. @default 0.3 */
export const DEFAULT_CURVE_FILL_OPACITY = 0.3;
/** Exclusions are hatched on their excluded side by default (the house style, DEVELOPERS.md). */
export const DEFAULT_EXCLUSION_MARK: ExclusionMark = "hatch";

/**
 * The mark of a stored curve written before `exclusionMark` existed: the new default, hatches, unless the file
 * set a fill opacity of its own (neither the old default 0.3 nor 0), which keeps the fill it was drawn with.
 */
export function legacyExclusionMark(fillOpacity: unknown): ExclusionMark {
  return typeof fillOpacity === "number" && fillOpacity > 0 && Math.abs(fillOpacity - 0.3) > 1e-9 ? "fill" : "hatch";
}
/**
 * Local dark-matter density in GeV/cm³ that a new curve assumes and shows (equal, so no rescaling):
 * 0.45 GeV/cm³ is the value most haloscope publications assume (common practice).
 */
export const DEFAULT_RHO_GEV_CM3 = 0.45;

/** Mass axis of the default figure in eV: the span of haloscope-like searches and beyond. */
export const DEFAULT_MASS_RANGE_EV: readonly [number, number] = [1e-7, 1e-2];

/**
 * Default y range for a y view: g_aγγ in GeV⁻¹ (KSVZ-type lines run from ~4·10⁻¹⁷ at 10⁻⁷ eV to ~4·10⁻¹² at
 * 10⁻² eV), or the dimensionless |E/N − c_γ| and |g_γ| (the preferred window reaches |E/N − c_γ| ≈ 12.7).
 */
export function defaultYRange(view: YView): [number, number] {
  if (view === "normalized") return [1e-2, 1e2];
  if (view === "g-gamma") return [5e-3, 50];
  return [1e-17, 1e-9];
}

/** Line style a new curve of this role gets: projections are future reach, drawn dashed. */
export function defaultCurveLineStyle(role: CurveRole): LineStyle {
  return role === "projection" ? "dashed" : "solid";
}

/** Constants of a new project: the 2019 reference, with the custom set seeded from it. */
export function defaultPhysics(): PhysicsSettings {
  return {
    ref: "2019",
    custom: {
      cGamma: REF_2019.cGamma,
      cGammaSigma: REF_2019.cGammaSigma,
      kMuEv: REF_2019.kMuEv,
      kMuEvSigma: REF_2019.kMuEvSigma,
      label: "custom",
    },
  };
}

/**
 * Figure of a new project: a 16:9 slide, f_a on the top axis, grid on, the legend in the inner corner where
 * it covers the least of the curves and models ("auto"). Share links keep their own frozen base value for the
 * legend ("bottom-right", src/formats/codec/v1.ts), so links written before "auto" existed decode as they did.
 */
export function defaultFigure(): Figure {
  return {
    preset: "slide",
    customWidthMm: 160,
    customHeightMm: 90,
    massRangeEv: [DEFAULT_MASS_RANGE_EV[0], DEFAULT_MASS_RANGE_EV[1]],
    yRange: defaultYRange("coupling"),
    yView: "coupling",
    topAxis: "fa",
    grid: true,
    legend: "auto",
    legendScale: 1,
    fontPt: 12,
    font: "sans",
    title: "",
    massUnit: "eV",
    frequencyUnit: "auto",
    ticks: "out",
  };
}

/** The label a model gets when none is typed: "E/N = 8/3" for a line, "E/N = 5/3..44/3" for a band. */
export function autoModelLabel(eOverNMin: string, eOverNMax: string = eOverNMin): string {
  return eOverNMin === eOverNMax ? `E/N = ${eOverNMin}` : `E/N = ${eOverNMin}..${eOverNMax}`;
}

/**
 * The label of a model of any kind when none is typed: as {@link autoModelLabel} for lines and intervals,
 * "E/N = 5/3 | 44/3" between lines, "Model set: 820 models" for a set (counted with multiplicities).
 */
export function autoLabelOfKind(
  kind: ModelKind,
  eOverNMin: string,
  eOverNMax: string,
  members: readonly ModelMember[],
): string {
  if (kind === "between") return `E/N = ${members.map((m) => m.eOverN).join(" | ")}`;
  if (kind === "set") return `Model set: ${members.reduce((n, m) => n + m.count, 0)} models`;
  return autoModelLabel(eOverNMin, eOverNMax);
}

function firstUnused(palette: readonly string[], used: readonly string[]): string {
  const taken = new Set(used.map((c) => c.toLowerCase()));
  return palette.find((c) => !taken.has(c.toLowerCase())) ?? palette[used.length % palette.length];
}

/** Colour for the next model: the first of MODEL_COLOURS no model uses yet, cycling when all are taken. */
export function nextModelColour(project: { models: readonly Pick<Model, "colour">[] }): string {
  return firstUnused(
    MODEL_COLOURS,
    project.models.map((m) => m.colour),
  );
}

/** Colour for the next curve: the first of CURVE_COLOURS (Okabe–Ito) no curve uses yet, cycling when all are taken. */
export function nextCurveColour(project: { curves: readonly Pick<Curve, "colour">[] }): string {
  return firstUnused(
    CURVE_COLOURS,
    project.curves.map((c) => c.colour),
  );
}

/**
 * A complete model from a partial one. Missing E/N gives the KSVZ-type line E/N = 0; missing max = min (a line);
 * members make a model set unless `kind` says "between"; the E/N range of "between" and "set" follows the
 * members; missing label is derived from E/N; missing colour is the next free model colour of `context`.
 * @param partial fields to set. @default {}
 * @param context the project (or its models) the model will join, for the colour. @default no models
 */
export function newModel(
  partial: Partial<Model> = {},
  context: { models: readonly Pick<Model, "colour">[] } = { models: [] },
): Model {
  const hasMembers = (partial.members?.length ?? 0) > 0;
  const settled = settleModelKind({
    kind: partial.kind,
    eOverNMin: partial.eOverNMin ?? (hasMembers ? undefined : "0"),
    eOverNMax: partial.eOverNMax,
    members: partial.members,
  });
  if (!settled.ok) throw new Error(settled.error);
  const { kind, eOverNMin, eOverNMax, members } = settled;
  return {
    id: partial.id ?? newId("m"),
    label: partial.label ?? autoLabelOfKind(kind, eOverNMin, eOverNMax, members),
    kind,
    eOverNMin,
    eOverNMax,
    members,
    setDraw: partial.setDraw ?? DEFAULT_SET_DRAW,
    setShare: partial.setShare ?? DEFAULT_SET_SHARE,
    source: partial.source ?? { kind: "typed" },
    colour: partial.colour ?? nextModelColour(context),
    lineStyle: partial.lineStyle ?? "solid",
    fillOpacity: partial.fillOpacity ?? DEFAULT_MODEL_FILL_OPACITY,
    visible: partial.visible ?? true,
    sigmas: partial.sigmas ?? 0,
  };
}

/**
 * A model set: discrete E/N values with multiplicities (from the catalogue, an ensemble or a scan), sorted by
 * value with equal values merged.
 * @param draw how the set is drawn. @default "extremes"
 * @param context the project (or its models) the set will join, for the colour. @default no models
 * @throws Error when `members` is empty
 */
export function newModelSet(
  label: string,
  members: readonly ModelMember[],
  source: ModelSource,
  draw: SetDraw = DEFAULT_SET_DRAW,
  context: { models: readonly Pick<Model, "colour">[] } = { models: [] },
): Model {
  if (members.length === 0) throw new Error("a model set needs at least one member");
  return newModel({ kind: "set", label, members: [...members], source, setDraw: draw }, context);
}

/**
 * A complete curve from a partial one: role exclusion, no data, no rescaling (ρ shown = ρ assumed, all of
 * the dark matter), line style by role, the next free Okabe–Ito colour of `context`.
 * @param partial fields to set; `rescale` may be partial. @default {}
 * @param context the project (or its curves) the curve will join, for the colour. @default no curves
 */
export function newCurve(
  partial: Omit<Partial<Curve>, "rescale"> & { rescale?: Partial<Curve["rescale"]> } = {},
  context: { curves: readonly Pick<Curve, "colour">[] } = { curves: [] },
): Curve {
  const role = partial.role ?? "exclusion";
  return {
    id: partial.id ?? newId("c"),
    label: partial.label ?? "Curve",
    role,
    massEv: partial.massEv ?? new Float64Array(0),
    gInvGeV: partial.gInvGeV ?? new Float64Array(0),
    keepOrder: partial.keepOrder ?? false,
    colour: partial.colour ?? nextCurveColour(context),
    lineStyle: partial.lineStyle ?? defaultCurveLineStyle(role),
    fillOpacity: partial.fillOpacity ?? DEFAULT_CURVE_FILL_OPACITY,
    exclusionMark: partial.exclusionMark ?? DEFAULT_EXCLUSION_MARK,
    visible: partial.visible ?? true,
    rescale: {
      rhoAssumed: partial.rescale?.rhoAssumed ?? DEFAULT_RHO_GEV_CM3,
      rhoShown: partial.rescale?.rhoShown ?? DEFAULT_RHO_GEV_CM3,
      fraction: partial.rescale?.fraction ?? 1,
    },
    citation: partial.citation ?? "",
    fileName: partial.fileName ?? "",
  };
}

/**
 * A project with no models and no curves (the "new project" state), default figure and constants.
 * @param name project name. @default "Untitled"
 */
export function emptyProject(name = "Untitled"): Project {
  return { version: PROJECT_VERSION, name, physics: defaultPhysics(), models: [], curves: [], figure: defaultFigure() };
}
