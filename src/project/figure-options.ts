// The choices of a curve's and a figure's enumerated settings, listed once: the project types, the schema and the
// command line's options all read them (a plain module without zod, so the command line loads no validator).
import { AXIS_MASS_UNITS, FREQUENCY_AXIS_UNITS } from "../physics/units";

export { AXIS_MASS_UNITS };

export const CURVE_ROLES = ["exclusion", "projection", "region"] as const;
/** How an exclusion curve marks its excluded side: short hatches along the edge, the translucent fill, or both. */
export const EXCLUSION_MARKS = ["hatch", "fill", "hatch-fill"] as const;
// "auto", "below", "above" and "on-plot" joined schema version 1 without a bump: every older file still validates, and an
// older build reading one repairs it to its default legend place (a noted repair), so no migration is needed.
export const LEGEND_PLACES = [
  "auto",
  "top-left",
  "top-right",
  "bottom-left",
  "bottom-right",
  "outside-right",
  "below",
  "above",
  // Direct labels on the plot (each label beside its own line), joined in the same way.
  "on-plot",
  "hidden",
] as const;
export const SIZE_PRESETS = ["slide", "single-column", "double-column", "custom"] as const;
export const TOP_AXES = ["none", "fa", "frequency"] as const;
// The font, axis units and tick sides joined schema version 1 without a bump: the keys are optional on reading
// (missing = the default, as files were drawn before), and an older build ignores them.
export const FIGURE_FONTS = ["sans", "serif"] as const;
export const FREQUENCY_UNIT_SETTINGS = ["auto", ...FREQUENCY_AXIS_UNITS] as const;
export const TICK_SIDES = ["out", "all"] as const;
