// One curve in the curves list: label, colour, visibility, order, role, line style, fill, the rescaling of
// haloscope-type limits and the CSV export. Every edit goes through the store (undoable, autosaved).
import type { Curve, CurveRole, ExclusionMark, LineStyle } from "../../project/types";
import { EXCLUSION_MARKS, LINE_STYLES, ROLES } from "./roles";
import { selectCurve, useAxband } from "../store";
import { NumberField } from "./NumberField";
import { isRescaled } from "../../plot/physics-settings";
import { CurveCsvExport } from "./CurveCsvExport";
import { ChoiceField } from "../layout/ChoiceField";
import { OrderButtons } from "../layout/OrderButtons";

const positive = (n: number) => (n > 0 ? null : "Must be above 0.");
const fractionRule = (n: number) => (n > 0 && n <= 1 ? null : "Between 0 (excluded) and 1.");

type Update = (patch: Partial<Curve>, key?: string) => void;

function CurveHead({ curve, update, index, count }: { curve: Curve; update: Update; index: number; count: number }) {
  const removeCurve = useAxband((s) => s.removeCurve);
  const moveCurve = useAxband((s) => s.moveCurve);
  const id = curve.id;
  return (
    <div className="ax-curve-head">
      <input
        type="color"
        className="swatch"
        aria-label={`Colour of ${curve.label}`}
        value={/^#[0-9a-f]{6}$/i.test(curve.colour) ? curve.colour : "#000000"}
        onChange={(e) => update({ colour: e.target.value }, "colour")}
      />
      <input
        className="ax-curve-label"
        type="text"
        aria-label="Curve label"
        value={curve.label}
        onChange={(e) => update({ label: e.target.value }, "label")}
      />
      <input
        type="checkbox"
        title="Show on the figure"
        aria-label={`Show ${curve.label}`}
        checked={curve.visible}
        onChange={(e) => update({ visible: e.target.checked })}
      />
      <span className="ax-curve-order">
        <OrderButtons
          label={curve.label}
          index={index}
          count={count}
          move={(d) => moveCurve(id, d)}
          remove={() => removeCurve(id)}
        />
      </span>
    </div>
  );
}

function CurveStyle({ curve, update }: { curve: Curve; update: Update }) {
  return (
    <div className="ax-curve-row">
      <ChoiceField
        label="Role"
        ariaLabel="Curve role"
        value={curve.role}
        choices={ROLES}
        onChange={(v) => update({ role: v as CurveRole })}
      />
      <ChoiceField
        label="Line"
        ariaLabel="Line style"
        value={curve.lineStyle}
        choices={LINE_STYLES}
        onChange={(v) => update({ lineStyle: v as LineStyle })}
      />
      {curve.role === "exclusion" && (
        <ChoiceField
          label="Excluded side"
          ariaLabel="Excluded side"
          testId="curve-exclusion-mark"
          value={curve.exclusionMark}
          choices={EXCLUSION_MARKS}
          onChange={(v) => update({ exclusionMark: v as ExclusionMark })}
        />
      )}
      <label className="ax-field">
        <span>Fill</span>
        <input
          type="range"
          min={0}
          max={1}
          step={0.05}
          aria-label="Fill opacity"
          value={curve.fillOpacity}
          disabled={curve.role === "projection" || (curve.role === "exclusion" && curve.exclusionMark === "hatch")}
          onChange={(e) => update({ fillOpacity: Number(e.target.value) }, "fill")}
        />
      </label>
    </div>
  );
}

function CurveRescale({ curve, update }: { curve: Curve; update: Update }) {
  const rs = curve.rescale;
  const setRescale = (patch: Partial<Curve["rescale"]>) => update({ rescale: { ...rs, ...patch } }, "rescale");
  return (
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
  );
}

export function CurveCard({ id, index, count }: { id: string; index: number; count: number }) {
  const curve = useAxband(selectCurve(id));
  const updateCurve = useAxband((s) => s.updateCurve);
  if (!curve) return null;
  // Edits of one field in a row (typing, dragging a slider) coalesce into one undo step.
  const update: Update = (patch, key) =>
    updateCurve(id, patch, key === undefined ? undefined : { coalesceKey: `curve:${id}:${key}` });
  return (
    <li className="ax-curve" data-testid="curve-item" data-curve-id={id}>
      <CurveHead curve={curve} update={update} index={index} count={count} />
      <CurveStyle curve={curve} update={update} />
      <p className="ax-curve-meta">
        {curve.massEv.length.toLocaleString("en")} points{curve.fileName ? ` · ${curve.fileName}` : ""}
        {isRescaled(curve.rescale) ? " · rescaled" : ""}
      </p>
      <CurveRescale curve={curve} update={update} />
      <CurveCsvExport curve={curve} />
    </li>
  );
}
