// The store draft of a model set (issue 12's model-kinds contract) from a spectrum of E/N values with counts.
// The set fields ride along the draft; the project's newModel keeps them once the model kinds are on main.
import type { EnsembleValue } from "../../../physics/ensemble";
import type { ModelDraft } from "../../store/types";
import { nDWText } from "./ensemble-csv";

export type SetSource = { kind: "ensemble"; settings: Record<string, unknown> } | { kind: "scan" };
export type SetDrawChoice = "lines" | "extremes" | "central";

export function modelSetDraft(
  label: string,
  values: readonly EnsembleValue[],
  source: SetSource,
  setDraw: SetDrawChoice = "lines",
): ModelDraft {
  if (values.length === 0) throw new Error("a model set needs at least one E/N");
  const draft = {
    label,
    kind: "set",
    eOverNMin: values[0].eOverN,
    eOverNMax: values[values.length - 1].eOverN,
    members: values.map((v) => ({ eOverN: v.eOverN, count: v.count, nDW: nDWText(v) })),
    setDraw,
    setShare: 0.68,
    source,
  };
  return draft as unknown as ModelDraft;
}
