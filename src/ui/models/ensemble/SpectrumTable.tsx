// An ensemble's spectrum as a table, folded away by default: every distinct E/N with its number of models and the
// domain-wall numbers N_DW met among them (the CSV export holds the same rows).
import type { EnsembleValue } from "../../../physics/ensemble";
import { minus } from "../../format";
import { nDWText } from "./ensemble-csv";

export function SpectrumTable({ values }: { values: readonly EnsembleValue[] }) {
  return (
    <details data-testid="ensemble-spectrum">
      <summary>Each distinct E/N with its models and N_DW ({values.length} rows)</summary>
      {/* Up to 820 rows: the table scrolls inside the panel. */}
      <div className="table-scroll" style={{ maxHeight: "18em", overflowY: "auto" }}>
        <table>
          <thead>
            <tr>
              <th scope="col">E/N</th>
              <th scope="col">models</th>
              <th scope="col">
                N<sub>DW</sub>
              </th>
            </tr>
          </thead>
          <tbody>
            {values.map((v) => (
              <tr key={v.eOverN}>
                <td>{minus(v.eOverN)}</td>
                <td>{v.count.toLocaleString("en")}</td>
                <td>{nDWText(v)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}
