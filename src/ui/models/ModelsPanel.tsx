// The Models section of the sidebar: typed E/N, the catalogue, the model list, and the anomaly calculator in a
// dialog (loaded on first opening, then kept mounted so its table survives closing).
import { lazy, Suspense, useState } from "react";
import { Dialog } from "./Dialog";
import { AddModel } from "./AddModel";
import { ModelList } from "./ModelList";
import { useCalculatorRequest } from "./calculator-draft";

// The catalogue (its table of models with their anomaly sums) loads right after the first figure, apart from it.
const Catalogue = lazy(() => import("./Catalogue").then((m) => ({ default: m.Catalogue })));
// Both load on first opening, apart from the first figure.
const AnomalyCalculator = lazy(() => import("./AnomalyCalculator").then((m) => ({ default: m.AnomalyCalculator })));
const EnsemblePanel = lazy(() => import("./ensemble/EnsemblePanel").then((m) => ({ default: m.EnsemblePanel })));

function CalculatorDialog({ open, onClose }: { open: boolean; onClose: () => void }) {
  // Mounted from the first opening on (closing only hides it).
  const [opened, setOpened] = useState(open);
  if (open && !opened) setOpened(true);
  return (
    <Dialog
      open={open}
      onClose={onClose}
      titleId="calculator-title"
      title="Anomaly calculator"
      closeLabel="Close the anomaly calculator"
    >
      <p className="note">
        Left-handed Weyl fermions (a right-handed field enters with its PQ charge 𝒳 negated): N = Σ 𝒳·T(R)·n_w, E = Σ
        𝒳·d(R)·Σ Q², N_DW = |2N/𝒳_S|.
      </p>
      {opened ? (
        <Suspense fallback={<p className="note loading">Loading the anomaly calculator…</p>}>
          <AnomalyCalculator />
        </Suspense>
      ) : null}
    </Dialog>
  );
}

export function ModelsPanel() {
  const calcOpen = useCalculatorRequest((s) => s.open);
  const setCalcOpen = useCalculatorRequest((s) => s.setOpen);
  const [ensembleOpen, setEnsembleOpen] = useState(false);
  return (
    <div className="models-panel">
      <AddModel />
      <div className="inline-row">
        <Suspense
          fallback={
            <details className="catalogue">
              <summary>Catalogue</summary>
              <p className="note loading">Loading the catalogue…</p>
            </details>
          }
        >
          <Catalogue />
        </Suspense>
      </div>
      <button
        type="button"
        className="calc-open"
        data-testid="ensemble-open"
        onClick={() => setEnsembleOpen(true)}
        aria-haspopup="dialog"
      >
        Heavy-quark ensemble…
      </button>
      {ensembleOpen ? (
        <Suspense fallback={<p className="note loading">Loading the ensemble panel…</p>}>
          <EnsemblePanel open onClose={() => setEnsembleOpen(false)} />
        </Suspense>
      ) : null}
      <button type="button" className="calc-open" onClick={() => setCalcOpen(true)} aria-haspopup="dialog">
        Anomaly calculator…
      </button>
      <ModelList />
      <CalculatorDialog open={calcOpen} onClose={() => setCalcOpen(false)} />
    </div>
  );
}
