// The curves list: per imported curve its label, colour, line style, fill, visibility, order and role,
// the rescaling of haloscope-type limits (local dark-matter density, axion fraction) and a CSV export in
// chosen units. Every edit goes through the store, so it is undoable and autosaved.
import { useState } from "react";
import { useShallow } from "zustand/react/shallow";
import type { Curve, CurveRole, LineStyle } from "../../project/types";
import { LINE_STYLES, ROLES } from "./roles";
import { ImportControls } from "../importer/ImportDialog";
import { selectCurve, selectCurveIds, useAxband } from "../store";
import { curveCsvFileName, curveToCsv, rescaleCurve } from "../../data";
import { downloadText } from "../export/download";
import { COUPLING_UNIT_OPTIONS, MASS_UNIT_OPTIONS, type CouplingUnit, type MassUnit } from "../importer/unit-options";
import { ChoiceField } from "../layout/ChoiceField";
import { NumberField } from "./NumberField";
import { isRescaled, physicsOptsOf } from "../../plot/physics-settings";
import "./curves.css";

const positive = (n: number) => (n > 0 ? null : "Must be above 0.");
const fractionRule = (n: number) => (n > 0 && n <= 1 ? null : "Between 0 (excluded) and 1.");

function CurveCard({ id, index, count }: { id: string; index: number; count: number }) {
  const curve = useAxband(selectCurve(id));
  const updateCurve = useAxband((s) => s.updateCurve);
  const removeCurve = useAxband((s) => s.removeCurve);
  const moveCurve = useAxband((s) => s.moveCurve);
  const pushMessage = useAxband((s) => s.pushMessage);
  const physics = useAxband((s) => s.project.physics);
  const [csvMassUnit, setCsvMassUnit] = useState<MassUnit>("eV");
  const [csvCouplingUnit, setCsvCouplingUnit] = useState<CouplingUnit>("GeV^-1");
  const [csvEOverN, setCsvEOverN] = useState("0");
  const [csvRescaled, setCsvRescaled] = useState(true);
  if (!curve) return null;
  const rs = curve.rescale;
  const setRescale = (patch: Partial<Curve["rescale"]>) =>
    updateCurve(id, { rescale: { ...curve.rescale, ...patch } }, { coalesceKey: `curve:${id}:rescale` });
  const points = curve.massEv.length;

  return (
    <li className="ax-curve" data-testid="curve-item" data-curve-id={id}>
      <div className="ax-curve-head">
        <input
          type="color"
          className="swatch"
          aria-label={`Colour of ${curve.label}`}
          value={/^#[0-9a-f]{6}$/i.test(curve.colour) ? curve.colour : "#000000"}
          onChange={(e) => updateCurve(id, { colour: e.target.value }, { coalesceKey: `curve:${id}:colour` })}
        />
        <input
          className="ax-curve-label"
          type="text"
          aria-label="Curve label"
          value={curve.label}
          onChange={(e) => updateCurve(id, { label: e.target.value }, { coalesceKey: `curve:${id}:label` })}
        />
        <input
          type="checkbox"
          title="Show on the figure"
          aria-label={`Show ${curve.label}`}
          checked={curve.visible}
          onChange={(e) => updateCurve(id, { visible: e.target.checked })}
        />
        <span className="ax-curve-order">
          <button
            type="button"
            className="icon"
            aria-label={`Move ${curve.label} up`}
            disabled={index === 0}
            onClick={() => moveCurve(id, -1)}
          >
            ↑
          </button>
          <button
            type="button"
            className="icon"
            aria-label={`Move ${curve.label} down`}
            disabled={index === count - 1}
            onClick={() => moveCurve(id, 1)}
          >
            ↓
          </button>
          <button
            type="button"
            className="icon danger"
            aria-label={`Remove ${curve.label}`}
            onClick={() => removeCurve(id)}
          >
            ×
          </button>
        </span>
      </div>
      <div className="ax-curve-row">
        <label className="ax-field">
          <span>Role</span>
          <select
            aria-label="Curve role"
            value={curve.role}
            onChange={(e) => updateCurve(id, { role: e.target.value as CurveRole })}
          >
            {ROLES.map((r) => (
              <option key={r.value} value={r.value}>
                {r.label}
              </option>
            ))}
          </select>
        </label>
        <label className="ax-field">
          <span>Line</span>
          <select
            aria-label="Line style"
            value={curve.lineStyle}
            onChange={(e) => updateCurve(id, { lineStyle: e.target.value as LineStyle })}
          >
            {LINE_STYLES.map((s) => (
              <option key={s} value={s}>
                {s}
              </option>
            ))}
          </select>
        </label>
        <label className="ax-field">
          <span>Fill</span>
          <input
            type="range"
            min={0}
            max={1}
            step={0.05}
            aria-label="Fill opacity"
            value={curve.fillOpacity}
            disabled={curve.role === "projection"}
            onChange={(e) =>
              updateCurve(id, { fillOpacity: Number(e.target.value) }, { coalesceKey: `curve:${id}:fill` })
            }
          />
        </label>
      </div>
      <p className="ax-curve-meta">
        {points.toLocaleString("en")} points{curve.fileName ? ` · ${curve.fileName}` : ""}
        {isRescaled(curve.rescale) ? " · rescaled" : ""}
      </p>
      <details className="ax-curve-more">
        <summary>Rescale (haloscope limits)</summary>
        <p className="ax-hint">
          A limit that assumed a local dark-matter density ρ₀ becomes g·√(ρ₀/ρ) at density ρ, and g/√f when axions are a
          fraction f of the dark matter.
        </p>
        <div className="ax-curve-row">
          <NumberField
            label="ρ assumed"
            unit="GeV/cm³"
            value={rs.rhoAssumed}
            validate={positive}
            onCommit={(n) => setRescale({ rhoAssumed: n })}
          />
          <NumberField
            label="ρ shown"
            unit="GeV/cm³"
            value={rs.rhoShown}
            validate={positive}
            onCommit={(n) => setRescale({ rhoShown: n })}
          />
          <NumberField
            label="axion fraction f"
            value={rs.fraction}
            validate={fractionRule}
            onCommit={(n) => setRescale({ fraction: n })}
          />
        </div>
      </details>
      <details className="ax-curve-more">
        <summary>Export as CSV</summary>
        <div className="ax-curve-row">
          <ChoiceField
            label="Mass unit"
            ariaLabel="CSV mass unit"
            value={csvMassUnit}
            choices={MASS_UNIT_OPTIONS}
            onChange={(v) => setCsvMassUnit(v as MassUnit)}
          />
          <ChoiceField
            label="Coupling"
            ariaLabel="CSV coupling unit"
            value={csvCouplingUnit}
            choices={COUPLING_UNIT_OPTIONS}
            onChange={(v) => setCsvCouplingUnit(v as CouplingUnit)}
          />
          {csvCouplingUnit === "model-line" ? (
            <label className="ax-field">
              <span>of the line E/N =</span>
              <input
                type="text"
                size={6}
                aria-label="CSV model line E/N"
                value={csvEOverN}
                onChange={(e) => setCsvEOverN(e.target.value)}
              />
            </label>
          ) : null}
          {isRescaled(curve.rescale) ? (
            <label className="ax-check">
              <input type="checkbox" checked={csvRescaled} onChange={(e) => setCsvRescaled(e.target.checked)} />
              with the rescaling
            </label>
          ) : null}
          <button
            type="button"
            onClick={() => {
              try {
                const gInvGeV =
                  isRescaled(curve.rescale) && csvRescaled ? rescaleCurve(curve.gInvGeV, curve.rescale) : curve.gInvGeV;
                const text = curveToCsv(
                  { massEv: curve.massEv, gInvGeV, label: curve.label, citation: curve.citation },
                  {
                    massUnit: csvMassUnit,
                    couplingUnit: csvCouplingUnit,
                    modelEOverN: csvCouplingUnit === "model-line" ? csvEOverN : undefined,
                    physics: physicsOptsOf(physics),
                  },
                );
                const name = curveCsvFileName(curve.label);
                downloadText(name, text, "text/csv");
                pushMessage("status", `Saved ${name}.`);
              } catch (e) {
                pushMessage("alert", `The CSV was not written: ${e instanceof Error ? e.message : String(e)}.`);
              }
            }}
          >
            Download CSV
          </button>
        </div>
      </details>
    </li>
  );
}

/** The list of imported curves with their controls. */
export function CurvesPanel() {
  const ids = useAxband(useShallow(selectCurveIds));
  return (
    <section className="ax-panel ax-curves" aria-label="Curves">
      <ImportControls />
      {ids.length === 0 ? (
        <p className="ax-empty">No curves yet. Import a CSV file, drop one on the page, or paste data.</p>
      ) : (
        <ul className="ax-curve-list">
          {ids.map((id, i) => (
            <CurveCard key={id} id={id} index={i} count={ids.length} />
          ))}
        </ul>
      )}
    </section>
  );
}
