// The heavy-quark ensemble panel: choose representations, N_Q, charges and the Landau-pole criterion, enumerate in a
// Web Worker (progress, cancel), show the spectrum as histograms, export it as CSV, add it to the figure as a set.
import { useEffect, useRef, useState } from "react";
import { Dialog } from "../Dialog";
import { HEAVY_QUARK_TAGS, LANDAU_DEFAULTS, type EnsembleResult, type LandauPoleOpts } from "../../../physics/ensemble";
import { DLMN_REPS } from "../../../physics/catalogue";
import { constantsOf } from "../../../project/physics-constants";
import { downloadText } from "../../export/download";
import { selectPhysics, useAxband } from "../../store";
import { runEnsemble, type EnsembleRequest, type EnsembleRun } from "./ensemble-client";
import { spectrumCsv } from "./ensemble-csv";
import { Histogram } from "./Histogram";
import { SpectrumTable } from "./SpectrumTable";
import { modelSetDraft, type SetDrawChoice } from "./model-set";

const repText = (tag: string) => {
  const r = DLMN_REPS.find((x) => x.tag === tag);
  return r ? `${tag} (${r.colour.replace("bar", "̄")}, ${r.dim}, ${r.y.replace("-", "−")})` : tag;
};

/** 1e18 rather than 1e+18: how the fields show a scale and how the settings text names it. */
const expText = (x: number) => x.toExponential().replace("e+", "e");
const gev = (x: number) => `${expText(x)} GeV`;

function settingsText(req: EnsembleRequest): string {
  const o =
    req.landauPole === false ? null : { ...LANDAU_DEFAULTS, ...(req.landauPole === true ? {} : req.landauPole) };
  const lp = o
    ? `no Landau pole below ${gev(o.poleScaleGeV)}, m_Q = ${gev(o.heavyMassGeV)}`
    : "no Landau-pole criterion";
  const reps = req.reps && req.reps.length < HEAVY_QUARK_TAGS.length ? req.reps.join(" ") : "R1–R15";
  return `${reps}, N_Q ≤ ${req.maxQuarks}, ${req.charges ?? "additive"} charges, ${lp}`;
}

/** The Landau-pole criterion as typed: on or off, Λ and m_Q (GeV) as text; `opts` is what the core gets. */
function useLandauSettings() {
  const [on, setOn] = useState(true);
  const [poleScale, setPoleScale] = useState(expText(LANDAU_DEFAULTS.poleScaleGeV));
  const [heavyMass, setHeavyMass] = useState(expText(LANDAU_DEFAULTS.heavyMassGeV));
  const poleScaleGeV = Number(poleScale);
  const heavyMassGeV = Number(heavyMass);
  // The criterion needs M_Z < m_Q < Λ (the core refuses anything else with a message).
  const bad = on && !(heavyMassGeV > 91.1876 && poleScaleGeV > heavyMassGeV && Number.isFinite(poleScaleGeV));
  const opts: false | LandauPoleOpts = on && { poleScaleGeV, heavyMassGeV };
  return { on, setOn, poleScale, setPoleScale, heavyMass, setHeavyMass, bad, opts };
}

function LandauFields({ s }: { s: ReturnType<typeof useLandauSettings> }) {
  const field = (label: string, value: string, set: (v: string) => void, testId: string) => (
    <label>
      {label}{" "}
      <input
        type="text"
        inputMode="decimal"
        size={8}
        value={value}
        disabled={!s.on}
        aria-invalid={s.bad}
        data-testid={testId}
        onChange={(e) => set(e.target.value)}
      />
    </label>
  );
  return (
    <>
      <div className="inline-row">
        <label>
          <input
            type="checkbox"
            data-testid="ensemble-landau-pole"
            checked={s.on}
            onChange={(e) => s.setOn(e.target.checked)}
          />{" "}
          No Landau pole below Λ, with the heavy quarks entering the running at m_Q
        </label>
        {field("Λ (GeV)", s.poleScale, s.setPoleScale, "ensemble-pole-scale")}{" "}
        {field("m_Q (GeV)", s.heavyMass, s.setHeavyMass, "ensemble-heavy-mass")}
      </div>
      <p className="note">
        Two-loop running of the three gauge couplings (no Yukawas): the whole SM from M_Z = 91.1876 GeV (coefficients of
        Machacek &amp; Vaughn 1983), the heavy quarks from m_Q on, no other thresholds; α₁(M_Z) = 0.016923 (GUT
        normalisation), α₂ = 0.03374, α₃ = 0.1173, Λ = 10¹⁸ GeV and m_Q = 5×10¹¹ GeV by default, as in Plakkot &amp;
        Hoof, arXiv:2107.12378, and their catalogue code. Λ must lie above m_Q. Signed models with N = 0 are dropped and
        counted.
      </p>
    </>
  );
}

function RepChoice({ reps, setReps }: { reps: string[]; setReps: (r: string[]) => void }) {
  return (
    <fieldset>
      <legend>Representations (Di Luzio, Mescia, Nardi 2017)</legend>
      {HEAVY_QUARK_TAGS.map((t) => (
        <label key={t} className="ensemble-rep">
          <input
            type="checkbox"
            checked={reps.includes(t)}
            onChange={(e) =>
              setReps(
                e.target.checked
                  ? HEAVY_QUARK_TAGS.filter((x) => x === t || reps.includes(x))
                  : reps.filter((x) => x !== t),
              )
            }
          />
          {repText(t)}
        </label>
      ))}
    </fieldset>
  );
}

function EnsembleForm({ onRun, busy }: { onRun: (req: EnsembleRequest) => void; busy: boolean }) {
  const [reps, setReps] = useState<string[]>(HEAVY_QUARK_TAGS.slice());
  const [maxQ, setMaxQ] = useState("28");
  const landau = useLandauSettings();
  const [charges, setCharges] = useState<"additive" | "signed">("additive");
  const n = Number(maxQ);
  const badQ = !Number.isSafeInteger(n) || n < 1 || n > 200;
  const bad = badQ || reps.length === 0 || landau.bad;
  return (
    <form
      className="ensemble-form"
      onSubmit={(e) => {
        e.preventDefault();
        if (!bad) onRun({ reps, maxQuarks: n, charges, landauPole: landau.opts });
      }}
    >
      <RepChoice reps={reps} setReps={setReps} />
      <label>
        Largest number of heavy quarks N_Q{" "}
        <input
          type="number"
          min={1}
          max={200}
          value={maxQ}
          data-testid="ensemble-max-quarks"
          aria-invalid={badQ}
          onChange={(e) => setMaxQ(e.target.value)}
        />
      </label>
      <label>
        PQ charges{" "}
        <select
          data-testid="ensemble-charges"
          value={charges}
          onChange={(e) => setCharges(e.target.value === "signed" ? "signed" : "additive")}
        >
          <option value="additive">additive (every quark X_L − X_R = +1)</option>
          <option value="signed">signed (each quark couples to Φ or Φ*, X = ±1)</option>
        </select>
      </label>
      <LandauFields s={landau} />
      <button type="submit" data-testid="ensemble-run" disabled={busy || bad}>
        Enumerate
      </button>
    </form>
  );
}

function EnsembleResultView({ result, req }: { result: EnsembleResult; req: EnsembleRequest }) {
  const physics = useAxband(selectPhysics);
  const addModel = useAxband((s) => s.addModel);
  const [draw, setDraw] = useState<SetDrawChoice>("lines");
  const [added, setAdded] = useState(false);
  const cGamma = constantsOf(physics).cGamma;
  const settings = settingsText(req);
  const label = `Heavy-quark ensemble (${settings})`;
  return (
    <div className="ensemble-result">
      <p data-testid="ensemble-result" role="status">
        {result.models.toLocaleString("en")} models ({result.multisets.toLocaleString("en")} multisets, largest N_Q{" "}
        {result.largestNQ}), {result.distinct.length} distinct E/N
        {req.charges === "signed" ? `; ${result.zeroN.toLocaleString("en")} dropped for N = 0` : ""}
        {result.stopped ? " (stopped early: partial)" : ""}.
      </p>
      <Histogram values={result.distinct} cGamma={cGamma} />
      <Histogram values={result.distinct} cGamma={cGamma} log />
      <SpectrumTable values={result.distinct} />
      <div className="inline-row">
        <button
          type="button"
          onClick={() =>
            downloadText(
              "heavy-quark-ensemble.csv",
              spectrumCsv(result.distinct, [label, `${result.models} models`]),
              "text/csv",
            )
          }
        >
          Export CSV
        </button>
        <label>
          Draw as{" "}
          <select value={draw} onChange={(e) => setDraw(e.target.value as SetDrawChoice)}>
            <option value="lines">its lines</option>
            <option value="extremes">band between extreme lines</option>
            <option value="central">central 68 % of models</option>
          </select>
        </label>
        <button
          type="button"
          data-testid="ensemble-add"
          disabled={result.distinct.length === 0}
          onClick={() => {
            const source = { kind: "ensemble" as const, settings: { ...req } as Record<string, unknown> };
            addModel(modelSetDraft(label, result.distinct, source, draw));
            setAdded(true);
          }}
        >
          Add to figure as a model set
        </button>
        {added ? <span role="status">Added.</span> : null}
      </div>
    </div>
  );
}

export function EnsemblePanel({ open, onClose }: { open: boolean; onClose: () => void }) {
  const run = useRef<EnsembleRun | null>(null);
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<{ result: EnsembleResult; req: EnsembleRequest } | null>(null);
  useEffect(() => () => run.current?.cancel(), []);
  const start = (req: EnsembleRequest) => {
    run.current?.cancel();
    setError(null);
    setDone(null);
    setProgress(0);
    const r = runEnsemble(req, setProgress);
    run.current = r;
    r.result.then(
      (result) => run.current === r && (setDone({ result, req }), setProgress(null)),
      (e: Error) =>
        run.current === r && (setError(e.message === "cancelled" ? "Cancelled." : e.message), setProgress(null)),
    );
  };
  return (
    <Dialog
      open={open}
      onClose={onClose}
      titleId="ensemble-title"
      title="Heavy-quark ensemble"
      closeLabel="Close the heavy-quark ensemble"
    >
      <EnsembleForm onRun={start} busy={progress !== null} />
      {progress !== null ? (
        <p role="status">
          Enumerating… {progress.toLocaleString("en")} multisets so far{" "}
          <button type="button" onClick={() => run.current?.cancel()}>
            Cancel
          </button>
        </p>
      ) : null}
      {error ? <p role="alert">{error}</p> : null}
      {done ? <EnsembleResultView result={done.result} req={done.req} /> : null}
    </Dialog>
  );
}
