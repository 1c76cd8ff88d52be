// A spectrum as a table: every distinct E/N with its count and the domain-wall numbers N_DW met among them. The
// ensemble panel folds it away (its CSV holds the same rows); the calculator's charge scan shows it with marks.
import type { CSSProperties, ReactNode } from "react";
import type { EnsembleValue } from "../../../physics/ensemble";
import { minus } from "../../format";
import { nDWText } from "./ensemble-csv";

/** The table of `values`; `countHeading` names what is counted, `mark` adds a note to a row's N_DW cell. */
export function SpectrumGrid<V extends EnsembleValue>(props: {
  values: readonly V[];
  countHeading: string;
  mark?: (v: V) => ReactNode;
  style?: CSSProperties;
}) {
  const { values, countHeading, mark, style } = props;
  return (
    <div className="table-scroll" style={style}>
      <table>
        <thead>
          <tr>
            <th scope="col">E/N</th>
            <th scope="col">{countHeading}</th>
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
              <td>
                {nDWText(v)}
                {mark?.(v)}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export function SpectrumTable({ values }: { values: readonly EnsembleValue[] }) {
  return (
    <details data-testid="ensemble-spectrum">
      <summary>Each distinct E/N with its models and N_DW ({values.length} rows)</summary>
      {/* Up to 820 rows: the table scrolls inside the panel. */}
      <SpectrumGrid values={values} countHeading="models" style={{ maxHeight: "18em", overflowY: "auto" }} />
    </details>
  );
}
