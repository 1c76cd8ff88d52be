// The units of a curve file, as the import step reads them and the curve CSV export writes them: mass unit,
// coupling unit and, for couplings relative to a model line, that line's E/N.
import { ChoiceField } from "../layout/ChoiceField";
import { COUPLING_UNIT_OPTIONS, MASS_UNIT_OPTIONS, type CouplingUnit, type MassUnit } from "./unit-options";

export interface Units {
  massUnit: MassUnit;
  couplingUnit: CouplingUnit;
  eOverN: string;
}

export function UnitFields(props: {
  units: Units;
  onChange: (patch: Partial<Units>) => void;
  /** Accessible names where they differ from the visible labels. */
  ariaLabels: { massUnit?: string; couplingUnit?: string; eOverN: string };
}) {
  const { units, onChange, ariaLabels } = props;
  return (
    <>
      <ChoiceField
        label="Mass unit"
        ariaLabel={ariaLabels.massUnit}
        value={units.massUnit}
        choices={MASS_UNIT_OPTIONS}
        onChange={(v) => onChange({ massUnit: v as MassUnit })}
      />
      <ChoiceField
        label="Coupling"
        ariaLabel={ariaLabels.couplingUnit}
        value={units.couplingUnit}
        choices={COUPLING_UNIT_OPTIONS}
        onChange={(v) => onChange({ couplingUnit: v as CouplingUnit })}
      />
      {units.couplingUnit === "model-line" ? (
        <label className="ax-field">
          <span>of the line E/N =</span>
          <input
            type="text"
            size={6}
            aria-label={ariaLabels.eOverN}
            value={units.eOverN}
            onChange={(e) => onChange({ eOverN: e.target.value })}
          />
        </label>
      ) : null}
    </>
  );
}
