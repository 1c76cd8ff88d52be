// The anomaly calculator's result: E, N, E/N, N_DW as exact fractions, the notes, and the per-field breakdown,
// all from the one result the calculator computed for this edit (or the last valid one, marked stale).
import type { AnomalyResult } from "../../physics/anomaly";
import { toFractionString, type Rational } from "../../physics/rational";
import { minus } from "../format";

export const frac = (r: Rational) => minus(toFractionString(r));

function Breakdown({ result }: { result: AnomalyResult }) {
  return (
    <details className="breakdown">
      <summary>Per-field breakdown</summary>
      <table>
        <thead>
          <tr>
            <th scope="col">Field</th>
            <th scope="col">d(R)</th>
            <th scope="col">T(R)</th>
            <th scope="col">Q</th>
            <th scope="col" title="Number of electroweak components">
              n_w
            </th>
            <th scope="col" title="PQ charge 𝒳 of the field as a left-handed field">
              𝒳 (as L)
            </th>
            <th scope="col" title="Copies">
              ×
            </th>
            <th scope="col">ΔE</th>
            <th scope="col">ΔN</th>
          </tr>
        </thead>
        <tbody>
          {result.contributions.map((c) => (
            <tr key={c.index}>
              <td>{c.name}</td>
              <td>{c.colourDim}</td>
              <td>{frac(c.colourIndex)}</td>
              <td>{c.charges.map(frac).join(", ")}</td>
              <td>{c.charges.length}</td>
              <td>{frac(c.pqLeft)}</td>
              <td>{c.copies}</td>
              <td>{frac(c.dE)}</td>
              <td>{frac(c.dN)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </details>
  );
}

export function CalculatorResult({ shown, stale }: { shown: AnomalyResult | null; stale: boolean }) {
  return (
    <div className={`calc-result${stale ? " stale" : ""}`} aria-live="polite">
      {shown ? (
        <>
          <dl>
            <div>
              <dt>E</dt>
              <dd data-testid="calc-e">{frac(shown.E)}</dd>
            </div>
            <div>
              <dt>N</dt>
              <dd data-testid="calc-n">{frac(shown.N)}</dd>
            </div>
            <div>
              <dt>E/N</dt>
              <dd data-testid="calc-eovern">{shown.eOverN ? frac(shown.eOverN) : "undefined"}</dd>
            </div>
            <div>
              <dt>
                N<sub>DW</sub>
              </dt>
              <dd data-testid="calc-ndw">{shown.domainWallExact ? frac(shown.domainWallExact) : "—"}</dd>
            </div>
          </dl>
          {stale ? <p className="note">Showing the last valid result; fix the entries above to update it.</p> : null}
          {shown.notes.map((n, k) => (
            <p key={k} className="note">
              {n}
            </p>
          ))}
          <Breakdown result={shown} />
        </>
      ) : (
        <p className="note">Enter the fermions to see E, N and E/N.</p>
      )}
    </div>
  );
}
