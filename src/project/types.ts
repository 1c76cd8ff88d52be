// The project: the whole user state as plain data (models, curves with their data, figure, constants).
// Everything else (lines, bands, scenes, overlap tables) is derived from it and never stored.
import type { FermionInput } from "../physics/anomaly-types";
import type { ScalarInput } from "../physics/charges/types";
import type { AxisMassUnit } from "../physics/units";
import type {
  CURVE_ROLES,
  EXCLUSION_MARKS,
  FIGURE_FONTS,
  FREQUENCY_UNIT_SETTINGS,
  LEGEND_PLACES,
  SIZE_PRESETS,
  TICK_SIDES,
  TOP_AXES,
} from "./figure-options";

export const PROJECT_VERSION = 2 as const;

export type LineStyle = "solid" | "dashed" | "dotted" | "dashdot";
export type CurveRole = (typeof CURVE_ROLES)[number];
/** How an exclusion curve marks its excluded side: short hatches along the edge, the translucent fill, or both. */
export type ExclusionMark = (typeof EXCLUSION_MARKS)[number];
/**
 * Where the legend goes; "auto" is a free inner corner, else below or outside right (src/plot/legend-place.ts);
 * "below" sits under the x-axis title, "above" between the figure title and the plot, both in columns;
 * "on-plot" writes no legend box but each label beside its own line (direct labels, src/plot/direct-labels.ts).
 */
export type LegendPlace = (typeof LEGEND_PLACES)[number];
/**
 * Where the user put a direct label (legend "on-plot"): the centre of its text as a point of the data, mass in eV
 * and g_aγγ in GeV⁻¹ (whatever the y view), so it stays by the same feature of the data when the figure is
 * resized, zoomed or set at another preset. Absent: placed automatically. Added without a bump.
 */
export type LabelAt = [massEv: number, gInvGeV: number];
export type SizePreset = (typeof SIZE_PRESETS)[number];
export type TopAxis = (typeof TOP_AXES)[number];
export type { AxisMassUnit };
/** Unit of the frequency top axis: chosen to suit the visible range ("auto"), or fixed. */
export type FrequencyUnitSetting = (typeof FREQUENCY_UNIT_SETTINGS)[number];
/** Ticks outward on the left and bottom axes (and a top axis), or on all four sides. */
export type TickSides = (typeof TICK_SIDES)[number];
/** The figure's font family: Computer Modern Sans or Serif (LaTeX's own look). */
export type FigureFont = (typeof FIGURE_FONTS)[number];
/** y axis: g_aγγ itself, |E/N − c_γ|, or |g_γ| = |E/N − c_γ|/2 (model lines horizontal in the last two). */
export type YView = "coupling" | "normalized" | "g-gamma";

/** Which constants the project uses: a published set, or the user's own values. */
export interface PhysicsSettings {
  ref: "2016" | "2019" | "custom";
  /** Used when ref = "custom" (kept otherwise so a switch back restores them). */
  custom: { cGamma: number; cGammaSigma: number; kMuEv: number; kMuEvSigma: number; label: string };
}

/** Where a model's E/N came from. */
export type ModelSource =
  | { kind: "typed" }
  | { kind: "catalogue"; catalogueId: string }
  | {
      kind: "calculator";
      fermions: FermionInput[];
      scalarCharge: string;
      /** Scalars and kept/forbidden terms (term syntax) the charges were solved from; absent in older files. */
      scalars?: ScalarInput[];
      terms?: string[];
      forbidden?: string[];
      /** The scalar whose PQ charge the solver set to 1. */
      normalize?: string;
    }
  | { kind: "ensemble"; settings: Record<string, unknown> }
  | { kind: "scan" };

/**
 * What a model draws: one E/N ("line"), every E/N in [min, max] ("interval"), the region between the lines of
 * discrete E/N values ("between"), or a set of discrete E/N values with multiplicities ("set").
 */
export type ModelKind = "line" | "interval" | "between" | "set";
/** One discrete member of a model set or a between-lines band: an exact E/N ("-64/3") and how many models share it. */
export interface ModelMember {
  eOverN: string;
  count: number;
  /** Domain-wall number of these models, when known ("6"). */
  nDW?: string;
}
/** How a model set is drawn: its lines, the band between its extreme lines, or the central band holding `setShare`. */
export type SetDraw = "lines" | "extremes" | "central";

export interface Model {
  id: string;
  label: string;
  kind: ModelKind;
  /**
   * Smallest and largest E/N of the model as exact rational or decimal strings ("8/3", "0.5"): min = max for a
   * line, the ends for an interval, the extreme members for "between" and "set".
   */
  eOverNMin: string;
  eOverNMax: string;
  /** "between" and "set": the discrete E/N values, sorted by value (count 1 each for "between"); [] otherwise. */
  members: ModelMember[];
  /** "set" only: drawn as its lines, as the band between its extreme lines, or as the central band. */
  setDraw: SetDraw;
  /** "set" with setDraw "central": share of the models the band holds, 0 < share ≤ 1. */
  setShare: number;
  source: ModelSource;
  colour: string;
  lineStyle: LineStyle;
  /** Opacity of the band fill (0..1). */
  fillOpacity: number;
  visible: boolean;
  /** Theory spread k in ±kσ (0 = none). */
  sigmas: number;
  /** Where its direct label was dragged to; absent: placed automatically. */
  labelAt?: LabelAt;
}

export interface CurveRescale {
  /** Local dark-matter density the publication assumed, GeV/cm³. */
  rhoAssumed: number;
  /** Local dark-matter density to show, GeV/cm³. */
  rhoShown: number;
  /** Fraction of the dark matter made of axions (0 < f ≤ 1). */
  fraction: number;
}

export interface Curve {
  id: string;
  label: string;
  role: CurveRole;
  /** Data in internal units, as imported (before rescaling). Never mutated: replaced as a whole. */
  massEv: Float64Array;
  gInvGeV: Float64Array;
  /** Keep file order instead of sorting by mass (regions always keep file order). */
  keepOrder: boolean;
  colour: string;
  lineStyle: LineStyle;
  fillOpacity: number;
  /**
   * Exclusions only: hatches on the excluded side (the house style), the fill, or both. Added without a bump:
   * files and links without it read as "hatch", or "fill" when they set a fill opacity of their own.
   */
  exclusionMark: ExclusionMark;
  visible: boolean;
  rescale: CurveRescale;
  /** Publication the data came from (free text or a BibTeX entry), shown in the sources list. */
  citation: string;
  fileName: string;
  /** Where its direct label was dragged to; absent: placed automatically. */
  labelAt?: LabelAt;
}

export interface Figure {
  preset: SizePreset;
  /** Used when preset = "custom". */
  customWidthMm: number;
  customHeightMm: number;
  /** Visible ranges (the last zoom), in eV and in the units of the y view. */
  massRangeEv: [number, number];
  yRange: [number, number];
  yView: YView;
  topAxis: TopAxis;
  grid: boolean;
  legend: LegendPlace;
  /**
   * Legend text size as a factor of its default (0.88 of the tick labels), 0.7–1.5; added without a bump:
   * files and links without it read as 1, the size they were drawn with.
   */
  legendScale: number;
  /** Base font size in pt at the physical size. */
  fontPt: number;
  /** Added in version 1 without a bump: files and links without it read as "sans". */
  font: FigureFont;
  title: string;
  /** Added without a bump: the unit the mass axis is labelled in (values stay in eV); missing reads as "eV". */
  massUnit: AxisMassUnit;
  /** Added without a bump: missing reads as "auto". */
  frequencyUnit: FrequencyUnitSetting;
  /** Added without a bump: missing reads as "out" (the house style). */
  ticks: TickSides;
}

export interface Project {
  version: typeof PROJECT_VERSION;
  name: string;
  physics: PhysicsSettings;
  models: Model[];
  curves: Curve[];
  figure: Figure;
}
