// The overlap table's filters: by model and by curve (choices from the summary's rows), pairs without overlap
// shown or not, and the opt-in bridging of one-sample gaps.
import { useMemo } from "react";
import type { OverlapSummaryRow } from "../../analysis/overlap-summary";
import { ChoiceField, type Choice } from "../layout/ChoiceField";

export interface Filters {
  modelId: string | null;
  curveId: string | null;
  showNone: boolean;
  mergeGaps: boolean;
}

function withAll(entries: [string, string][]): Choice[] {
  return [{ value: "", label: "all" }, ...entries.map(([value, label]) => ({ value, label }))];
}

export function OverlapFilters(props: {
  rows: OverlapSummaryRow[];
  filters: Filters;
  onChange: (change: Partial<Filters>) => void;
}) {
  const { rows, filters: f, onChange } = props;
  const models = useMemo(() => withAll([...new Map(rows.map((r) => [r.modelId, r.modelLabel]))]), [rows]);
  const curves = useMemo(() => withAll([...new Map(rows.map((r) => [r.curveId, r.curveLabel]))]), [rows]);
  return (
    <div className="ax-overlap-tools">
      <ChoiceField
        label="Model"
        ariaLabel="Filter by model"
        value={f.modelId ?? ""}
        choices={models}
        onChange={(v) => onChange({ modelId: v || null })}
      />
      <ChoiceField
        label="Curve"
        ariaLabel="Filter by curve"
        value={f.curveId ?? ""}
        choices={curves}
        onChange={(v) => onChange({ curveId: v || null })}
      />
      <label className="ax-field ax-check">
        <input type="checkbox" checked={f.showNone} onChange={(e) => onChange({ showNone: e.target.checked })} />
        <span>also pairs without overlap</span>
      </label>
      <label
        className="ax-field ax-check"
        title="Gaps narrower than one curve sample are listed as bridged, never counted as excluded"
      >
        <input type="checkbox" checked={f.mergeGaps} onChange={(e) => onChange({ mergeGaps: e.target.checked })} />
        <span>mark one-sample gaps as bridged</span>
      </label>
    </div>
  );
}
