// The Models section of the sidebar: typed E/N, the catalogue, the model list and the anomaly calculator.
import { AddModel } from "./AddModel";
import { Catalogue } from "./Catalogue";
import { ModelList } from "./ModelList";
import { AnomalyCalculator } from "./AnomalyCalculator";

export function ModelsPanel() {
  return (
    <div className="models-panel">
      <AddModel />
      <Catalogue />
      <ModelList />
      <details className="calculator-box">
        <summary>Anomaly calculator</summary>
        <AnomalyCalculator />
      </details>
    </div>
  );
}
