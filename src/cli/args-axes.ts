// The renderer's axis options (--axis-unit, --top-axis, --frequency-unit, --ticks): read apart from the main
// parser so the option list stays one line there, and applied to the figure like the size and font options.
import { AXIS_MASS_UNITS, FREQUENCY_UNIT_SETTINGS, TICK_SIDES, TOP_AXES } from "../project/figure-options";
import type { AxisMassUnit, Figure, FrequencyUnitSetting, TickSides, TopAxis } from "../project/types";
import { parseMassUnit } from "../formats/units";

/** Axis settings given on the command line (absent = the project's own). */
export interface AxesCliOptions {
  /** The unit the mass axis is labelled in. */
  axisUnit?: AxisMassUnit;
  topAxis?: TopAxis;
  frequencyUnit?: FrequencyUnitSetting;
  ticks?: TickSides;
}

/** The options this module reads; each takes a value. */
export const AXES_OPTIONS: readonly string[] = ["--axis-unit", "--top-axis", "--frequency-unit", "--ticks"];

export const AXES_USAGE = `axes:
  --axis-unit U             label the mass axis in eV | meV | ueV (or µeV) | neV (values and --mass-range stay
                            in eV unless written with a unit)
  --top-axis none|fa|frequency  the top axis: none, f_a [GeV], or the photon frequency ν = m_a c²/h
  --frequency-unit U        unit of the frequency axis: auto (default, suits the range) | Hz | kHz | MHz | GHz | THz
  --ticks out|all           ticks outward on the left and bottom (default), or on all four sides`;

function oneOf<T extends string>(flag: string, value: string, allowed: readonly T[]): T | string {
  return allowed.includes(value as T) ? (value as T) : `${flag}: expected one of ${allowed.join(", ")}, got "${value}"`;
}

/** Reads one axis option into `o`; returns an error message, or null when the value is good. */
export function readAxesOption(name: string, value: string, o: AxesCliOptions): string | null {
  let r: string;
  switch (name) {
    case "--axis-unit": {
      const unit = parseMassUnit(value);
      const axis = AXIS_MASS_UNITS.find((u) => u === unit);
      if (!axis) return `--axis-unit: expected one of eV, meV, ueV (µeV), neV, got "${value}"`;
      o.axisUnit = axis;
      return null;
    }
    case "--top-axis":
      if ((r = oneOf(name, value, TOP_AXES)) !== value) return r;
      o.topAxis = value as TopAxis;
      return null;
    case "--frequency-unit":
      if ((r = oneOf(name, value, FREQUENCY_UNIT_SETTINGS)) !== value) return r;
      o.frequencyUnit = value as FrequencyUnitSetting;
      return null;
    case "--ticks":
      if ((r = oneOf(name, value, TICK_SIDES)) !== value) return r;
      o.ticks = value as TickSides;
      return null;
    default:
      return `unknown option ${name}`;
  }
}

/** The figure with the axis options applied (a copy). */
export function applyAxesOptions(f: Figure, o: AxesCliOptions): Figure {
  return {
    ...f,
    ...(o.axisUnit ? { massUnit: o.axisUnit } : {}),
    ...(o.topAxis ? { topAxis: o.topAxis } : {}),
    ...(o.frequencyUnit ? { frequencyUnit: o.frequencyUnit } : {}),
    ...(o.ticks ? { ticks: o.ticks } : {}),
  };
}
