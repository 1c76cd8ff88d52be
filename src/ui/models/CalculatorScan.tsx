// The anomaly calculator in scan mode: on request, every combination of the listed charges, copies and X_S,
// shown as the spectrum of distinct E/N with counts and N_DW (N = 0 and fractional N_DW flagged), addable as a
// model set.
import { useState } from "react";
import { useAxband, selectPhysics } from "../store";
import { constantsOf } from "../../project/physics-constants";
import { scanFromState, type ScanOutcome } from "./calculator-scan";
import type { ScanResult } from "../../physics/ensemble";
import type { CalcState } from "./calculator-state";
import { Histogram } from "./ensemble/Histogram";
import { SpectrumGrid } from "./ensemble/SpectrumTable";
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
            {result.zeroN > 0 ? `; ${result.zeroN.toLocaleString("en")} with N = 0 (no QCD axion) left out` : ""}
            {result.nonIntegerNDW > 0
              ? `; ${result.nonIntegerNDW.toLocaleString("en")} with N_DW not an integer (${NO_YUKAWA})`
              : ""}
            .
          </p>
          <Histogram values={result.distinct} cGamma={cGamma} />
          <SpectrumRows result={result} />
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

/** Rows shown in the page; the model set (the scan's only output) gets every distinct E/N. */
const MAX_ROWS = 500;

const NO_YUKAWA = "no Yukawa term links these charges";

/** The spectrum table: at most MAX_ROWS rows, saying so when there are more; a fractional N_DW carries a mark. */
function SpectrumRows({ result }: { result: ScanResult }) {
  const shown = result.distinct.slice(0, MAX_ROWS);
  return (
    <>
      <SpectrumGrid
        values={shown}
        countHeading="combinations"
        mark={(v) =>
          v.nonIntegerNDW ? (
            <span title={`N_DW not an integer for ${v.nonIntegerNDW} combinations: ${NO_YUKAWA}`}> †</span>
          ) : null
        }
      />
      {result.distinct.length > shown.length ? (
        <p className="note" data-testid="calc-scan-truncated">
          Showing the first {MAX_ROWS} of {result.distinct.length.toLocaleString("en")} distinct E/N; the model set
          holds all.
        </p>
      ) : null}
      {shown.some((v) => v.nonIntegerNDW) ? (
        <p className="note">† N_DW not an integer for some combinations: {NO_YUKAWA}.</p>
      ) : null}
    </>
  );
}
