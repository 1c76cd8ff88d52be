// The one table of mass units (energies and photon frequencies) and their conversions to and from eV, shared by
// the CSV reader and writer (src/formats/units.ts), the figure's axes (src/plot) and the typed axis ranges.
import { PLANCK_EV_S } from "./constants";
import { POW10 } from "./pow10";

/** Mass units: energies, or photon frequencies converted with ν = m_a / h. */
export type MassUnit =
  "eV" | "meV" | "ueV" | "neV" | "peV" | "keV" | "MeV" | "GeV" | "Hz" | "kHz" | "MHz" | "GHz" | "THz";

/** Units the mass axis of a figure can be labelled in (its values stay in eV). */
export type AxisMassUnit = Extract<MassUnit, "eV" | "meV" | "ueV" | "neV">;
/** Fixed units of the frequency top axis. */
export type FrequencyAxisUnit = Extract<MassUnit, "Hz" | "kHz" | "MHz" | "GHz" | "THz">;

export const AXIS_MASS_UNITS: readonly AxisMassUnit[] = ["eV", "meV", "ueV", "neV"];
export const FREQUENCY_AXIS_UNITS: readonly FrequencyAxisUnit[] = ["Hz", "kHz", "MHz", "GHz", "THz"];

export interface MassUnitInfo {
  id: MassUnit;
  /** Label for menus and axis titles (with the Greek μ). */
  label: string;
  kind: "energy" | "frequency";
  /** The unit is 10^pow10 eV (energy) or 10^pow10 Hz (frequency). */
  pow10: number;
}

/** Every mass unit, in the order menus show them. */
export const MASS_UNITS: readonly MassUnitInfo[] = [
  { id: "eV", label: "eV", kind: "energy", pow10: 0 },
  { id: "meV", label: "meV", kind: "energy", pow10: -3 },
  { id: "ueV", label: "μeV", kind: "energy", pow10: -6 },
  { id: "neV", label: "neV", kind: "energy", pow10: -9 },
  { id: "peV", label: "peV", kind: "energy", pow10: -12 },
  { id: "keV", label: "keV", kind: "energy", pow10: 3 },
  { id: "MeV", label: "MeV", kind: "energy", pow10: 6 },
  { id: "GeV", label: "GeV", kind: "energy", pow10: 9 },
  { id: "Hz", label: "Hz", kind: "frequency", pow10: 0 },
  { id: "kHz", label: "kHz", kind: "frequency", pow10: 3 },
  { id: "MHz", label: "MHz", kind: "frequency", pow10: 6 },
  { id: "GHz", label: "GHz", kind: "frequency", pow10: 9 },
  { id: "THz", label: "THz", kind: "frequency", pow10: 12 },
];

const MASS_BY_ID = new Map(MASS_UNITS.map((u) => [u.id, u]));

/** Facts about a mass unit. */
export function massUnitInfo(unit: MassUnit): MassUnitInfo {
  return MASS_BY_ID.get(unit) as MassUnitInfo;
}

/** Mass in eV of a value in a mass unit (frequencies via m = h·ν, CODATA 2018 h). */
export function massToEv(value: number, unit: MassUnit): number {
  const u = massUnitInfo(unit);
  const scaled = scalePow10(value, u.pow10);
  return u.kind === "frequency" ? scaled * PLANCK_EV_S : scaled;
}

/** A mass in eV expressed in a mass unit (inverse of {@link massToEv}). */
export function massFromEv(massEv: number, unit: MassUnit): number {
  const u = massUnitInfo(unit);
  const base = u.kind === "frequency" ? massEv / PLANCK_EV_S : massEv;
  return scalePow10(base, -u.pow10);
}

// Multiplying by 10^-k with k > 0 would round 10^-k first; dividing by the exact 10^k rounds once. (Unit
// powers stay within the table: ±12 at most.)
function scalePow10(value: number, pow10: number): number {
  if (pow10 === 0) return value;
  return pow10 > 0 ? value * POW10[pow10] : value / POW10[-pow10];
}
