// The heavy-quark ensemble panel: choose representations, N_Q, charges and the Landau-pole criterion, enumerate in a
// Web Worker (progress, cancel), show the spectrum as histograms, export it as CSV, add it to the figure as a set.
import { useEffect, useRef, useState } from "react";
import { Dialog } from "../Dialog";
import { HEAVY_QUARK_TAGS, LANDAU_DEFAULTS, type EnsembleResult } from "../../../physics/ensemble";
import { DLMN_REPS } from "../../../physics/catalogue";
import { constantsOf } from "../../../project/physics-constants";
import { downloadText } from "../../export/download";
import { selectPhysics, useAxband } from "../../store";
import { runEnsemble, type EnsembleRequest, type EnsembleRun } from "./ensemble-client";
import { spectrumCsv } from "./ensemble-csv";
import { Histogram } from "./Histogram";
import { modelSetDraft, type SetDrawChoice } from "./model-set";

const repText = (tag: string) => {
  const r = DLMN_REPS.find((x) => x.tag === tag);
  return r ? `${tag} (${r.colour.replace("bar", "̄")}, ${r.dim}, ${r.y.replace("-", "−")})` : tag;
};

function settingsText(req: EnsembleRequest): string {
  const lp =
    req.landauPole === false
      ? "no Landau-pole criterion"
      : `no Landau pole below ${LANDAU_DEFAULTS.poleScaleGeV.toExponential(0)} GeV, m_Q = ${LANDAU_DEFAULTS.heavyMassGeV.toExponential(0)} GeV`;
  const reps = req.reps && req.reps.length < HEAVY_QUARK_TAGS.length ? req.reps.join(" ") : "R1–R15";
  return `${reps}, N_Q ≤ ${req.maxQuarks}, ${req.charges ?? "additive"} charges, ${lp}`;
}

function EnsembleForm({ onRun, busy }: { onRun: (req: EnsembleRequest) => void; busy: boolean }) {
  const [reps, setReps] = useState<string[]>(HEAVY_QUARK_TAGS.slice());
  const [maxQ, setMaxQ] = useState("28");
  const [landau, setLandau] = useState(true);
  const [charges, setCharges] = useState<"additive" | "signed">("additive");
  const n = Number(maxQ);
  const bad = !Number.isSafeInteger(n) || n < 1 || n > 200 || reps.length === 0;
  return (
    <form
      className="ensemble-form"
      onSubmit={(e) => {
        e.preventDefault();
        if (!bad) onRun({ reps, maxQuarks: n, charges, landauPole: landau });
      }}
    >
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
      <label>
        Largest number of heavy quarks N_Q{" "}
        <input
          type="number"
          min={1}
          max={200}
          value={maxQ}
          data-testid="ensemble-max-quarks"
          aria-invalid={bad}
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
      <label>
        <input
          type="checkbox"
          data-testid="ensemble-landau-pole"
          checked={landau}
          onChange={(e) => setLandau(e.target.checked)}
        />{" "}
        No Landau pole below 10¹⁸ GeV (heavy quarks at 5×10¹¹ GeV)
      </label>
      <p className="note">
        Two-loop running of the three gauge couplings (no Yukawas), SM coefficients (Machacek &amp; Vaughn 1983) and the
        heavy quarks from their mass on; α₁(M_Z) = 0.016923 (GUT normalisation), α₂ = 0.03374, α₃ = 0.1173, as used by
        Plakkot &amp; Hoof, Phys. Rev. D 104 (2021) 075017. Signed models with N = 0 are dropped and counted.
      </p>
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
