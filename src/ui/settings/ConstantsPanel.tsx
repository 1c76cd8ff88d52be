// The Constants section: which c_γ and K = m_a·f_a the predictions use (2019 default, 2016, or the user's
// own values with uncertainties and a label), each published set shown with its source.
import { useState } from "react";
import { REF_2016, REF_2019, type AxionConstants } from "../../physics/constants";
import type { PhysicsSettings } from "../../project/types";
import { selectPhysics, useAxband } from "../store";

type CustomKey = "cGamma" | "cGammaSigma" | "kMuEv" | "kMuEvSigma";

function refSummary(c: AxionConstants): string {
  return `c_γ = ${c.cGamma} ± ${c.cGammaSigma}, K = ${c.kMuEv} ± ${c.kMuEvSigma} μeV`;
}

function CustomNumber({
  label,
  field,
  value,
  positive,
}: {
  label: string;
  field: CustomKey;
  value: number;
  positive: boolean;
}) {
  const setPhysics = useAxband((s) => s.setPhysics);
  const [draft, setDraft] = useState<string | null>(null);
  const v = Number((draft ?? "").trim());
  const bad =
    draft !== null && (draft.trim() === "" || !Number.isFinite(v) || (positive ? v <= 0 : v < 0 && field !== "cGamma"));
  return (
    <label className="setting">
      <span className="field-label">{label}</span>
      <input
        type="text"
        inputMode="decimal"
        className="narrow"
        value={draft ?? String(value)}
        aria-invalid={bad || undefined}
        onChange={(e) => {
          const t = e.target.value;
          setDraft(t);
          const n = Number(t.trim());
          const ok = t.trim() !== "" && Number.isFinite(n) && (positive ? n > 0 : n >= 0 || field === "cGamma");
          if (ok)
            setPhysics(
              { custom: { [field]: n } as Partial<PhysicsSettings["custom"]> },
              { coalesceKey: `physics:${field}` },
            );
        }}
        onBlur={() => setDraft(null)}
      />
      {bad ? (
        <span className="field-error">
          {positive ? "must be a positive number" : "must be a number ≥ 0"}; kept {value}
        </span>
      ) : null}
    </label>
  );
}

export function ConstantsPanel() {
  const physics = useAxband(selectPhysics);
  const setPhysics = useAxband((s) => s.setPhysics);
  const radio = (ref: PhysicsSettings["ref"], label: string, detail: string) => (
    <label className="radio">
      <input
        type="radio"
        name="physics-ref"
        value={ref}
        checked={physics.ref === ref}
        onChange={() => setPhysics({ ref })}
      />
      <span>
        <span className="radio-title">{label}</span>
        <span className="radio-detail">{detail}</span>
      </span>
    </label>
  );
  return (
    <div className="constants" role="radiogroup" aria-label="Reference constants">
      {radio("2019", "2019 (default)", `${refSummary(REF_2019)} — ${REF_2019.label}`)}
      {radio("2016", "2016", `${refSummary(REF_2016)} — ${REF_2016.label}`)}
      {radio("custom", "Custom", "your own values, e.g. a newer lattice or chiral perturbation theory result")}
      {physics.ref === "custom" ? (
        <div className="custom-constants">
          <div className="inline-row">
            <CustomNumber label="c_γ" field="cGamma" value={physics.custom.cGamma} positive={false} />
            <CustomNumber label="± σ" field="cGammaSigma" value={physics.custom.cGammaSigma} positive={false} />
          </div>
          <div className="inline-row">
            <CustomNumber label="K (μeV)" field="kMuEv" value={physics.custom.kMuEv} positive={true} />
            <CustomNumber label="± σ" field="kMuEvSigma" value={physics.custom.kMuEvSigma} positive={false} />
          </div>
          <label className="setting">
            <span className="field-label">Label (shown in the sources)</span>
            <input
              type="text"
              value={physics.custom.label}
              onChange={(e) => setPhysics({ custom: { label: e.target.value } }, { coalesceKey: "physics:label" })}
            />
          </label>
        </div>
      ) : null}
      <p className="note">g_aγγ = α/(2π f_a)·|E/N − c_γ|, m_a = K μeV·(10¹² GeV/f_a).</p>
    </div>
  );
}
