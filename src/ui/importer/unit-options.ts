// The unit choices the import step and the curve CSV export offer. The units themselves (ids, labels,
// recognition in headers, conversions) belong to the data core; this only picks what the menus show.
import { COUPLING_UNITS, MASS_UNITS, type CouplingUnit, type MassUnit } from "../../data";

export type { CouplingUnit, MassUnit };

/** Mass units in menu order, with their labels (μeV shown with the Greek μ). */
export const MASS_UNIT_OPTIONS: { value: MassUnit; label: string }[] = MASS_UNITS.map((u) => ({
  value: u.id,
  label: u.label,
}));

/** Coupling column meanings in menu order. */
export const COUPLING_UNIT_OPTIONS: { value: CouplingUnit; label: string }[] = COUPLING_UNITS.map((u) => ({
  value: u.id,
  label: u.label,
}));
