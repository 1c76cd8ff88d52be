// A curve's "Export as CSV" section: the units to write (with the model line's E/N), whether to apply the
// rescaling, and the download.
import { useState } from "react";
import type { Curve } from "../../project/types";
import { useAxband } from "../store";
import { rescaleCurve } from "../../data";
import { downloadText } from "../export/download";
import type { CouplingUnit, MassUnit } from "../importer/unit-options";
import { UnitFields } from "../importer/UnitFields";
import { isRescaled, physicsOptsOf } from "../../plot/physics-settings";

export function CurveCsvExport({ curve }: { curve: Curve }) {
  const pushMessage = useAxband((s) => s.pushMessage);
  const physics = useAxband((s) => s.project.physics);
  const [massUnit, setMassUnit] = useState<MassUnit>("eV");
  const [couplingUnit, setCouplingUnit] = useState<CouplingUnit>("GeV^-1");
  const [eOverN, setEOverN] = useState("0");
  const [rescaled, setRescaled] = useState(true);

  const download = async () => {
    try {
      // The CSV writer loads on the first export, apart from the first figure.
      const { curveCsvFileName, curveToCsv } = await import("../../formats/curve-export");
      const gInvGeV =
        isRescaled(curve.rescale) && rescaled ? rescaleCurve(curve.gInvGeV, curve.rescale) : curve.gInvGeV;
      const text = curveToCsv(
        { massEv: curve.massEv, gInvGeV, label: curve.label, citation: curve.citation },
        {
          massUnit,
          couplingUnit,
          modelEOverN: couplingUnit === "model-line" ? eOverN : undefined,
          physics: physicsOptsOf(physics),
        },
      );
      const name = curveCsvFileName(curve.label);
      downloadText(name, text, "text/csv");
      pushMessage("status", `Saved ${name}.`);
    } catch (e) {
      pushMessage("alert", `The CSV was not written: ${e instanceof Error ? e.message : String(e)}.`);
    }
  };

  return (
    <details className="ax-curve-more">
      <summary>Export as CSV</summary>
      <div className="ax-curve-row">
        <UnitFields
          units={{ massUnit, couplingUnit, eOverN }}
          onChange={(p) => {
            if (p.massUnit) setMassUnit(p.massUnit);
            if (p.couplingUnit) setCouplingUnit(p.couplingUnit);
            if (p.eOverN !== undefined) setEOverN(p.eOverN);
          }}
          ariaLabels={{ massUnit: "CSV mass unit", couplingUnit: "CSV coupling unit", eOverN: "CSV model line E/N" }}
        />
        {isRescaled(curve.rescale) ? (
          <label className="ax-check">
            <input type="checkbox" checked={rescaled} onChange={(e) => setRescaled(e.target.checked)} />
            with the rescaling
          </label>
        ) : null}
        <button type="button" onClick={() => void download()}>
          Download CSV
        </button>
      </div>
    </details>
  );
}
