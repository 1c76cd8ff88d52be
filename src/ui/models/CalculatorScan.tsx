// The anomaly calculator in scan mode: on request, every combination of the listed charges, copies and X_S,
// shown as the spectrum of distinct E/N with counts and N_DW (N = 0 flagged), addable as a model set.
import { useState } from "react";
import { useAxband, selectPhysics } from "../store";
import { constantsOf } from "../../project/physics-constants";
import { minus } from "../format";
import { scanFromState, type ScanOutcome } from "./calculator-scan";
import type { CalcState } from "./calculator-state";
import { Histogram } from "./ensemble/Histogram";
import { nDWText } from "./ensemble/ensemble-csv";
import { modelSetDraft } from "./ensemble/model-set";

export function CalculatorScan({ state }: { state: CalcState }) {
  const [out, setOut] = useState<{ for: CalcState; outcome: ScanOutcome } | null>(null);
  const addModel = useAxband((s) => s.addModel);
  const cGamma = constantsOf(useAxband(selectPhysics)).cGamma;
  const outcome = out && out.for === state ? out.outcome : null;
  const result = outcome?.ok ? outcome.result : null;
  return (
    <div className="calc-scan" data-testid="calc-scan">
      <button type="button" className="primary" onClick={() => setOut({ for: state, outcome: scanFromState(state) })}>
        Scan every combination
      </button>
      {outcome && !outcome.ok ? (
        <ul className="field-errors" aria-live="polite">
          {outcome.messages.map((m, k) => (
            <li key={k}>{m}</li>
          ))}
        </ul>
      ) : null}
      {result ? (
        <>
          <p role="status" data-testid="calc-scan-result">
            {result.combinations.toLocaleString("en")} combinations, {result.distinct.length} distinct E/N
            {result.zeroN > 0 ? `; ${result.zeroN.toLocaleString("en")} with N = 0 (no QCD axion) left out` : ""}.
          </p>
          <Histogram values={result.distinct} cGamma={cGamma} />
          <div className="table-scroll">
            <table>
              <thead>
                <tr>
                  <th scope="col">E/N</th>
                  <th scope="col">combinations</th>
                  <th scope="col">
                    N<sub>DW</sub>
                  </th>
                </tr>
              </thead>
              <tbody>
                {result.distinct.slice(0, 500).map((v) => (
                  <tr key={v.eOverN}>
                    <td>{minus(v.eOverN)}</td>
                    <td>{v.count}</td>
                    <td>{nDWText(v)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <button
            type="button"
            disabled={result.distinct.length === 0}
            onClick={() =>
              addModel(
                modelSetDraft(`Charge scan (${result.combinations} combinations)`, result.distinct, { kind: "scan" }),
              )
            }
          >
            Add the spectrum as a model set
          </button>
        </>
      ) : null}
    </div>
  );
}
