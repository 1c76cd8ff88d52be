// The store draft of a model set from a spectrum of E/N values with counts (a heavy-quark ensemble or a charge scan),
// each value a member with its count and N_DW.
import type { EnsembleValue } from "../../../physics/ensemble";
import type { ModelSource } from "../../../project/types";
import type { ModelDraft } from "../../store/types";
import { nDWText } from "./ensemble-csv";

export type SetSource = Extract<ModelSource, { kind: "ensemble" | "scan" }>;
export type SetDrawChoice = "lines" | "extremes" | "central";

export function modelSetDraft(
  label: string,
  values: readonly EnsembleValue[],
  source: SetSource,
  setDraw: SetDrawChoice = "lines",
): ModelDraft {
  if (values.length === 0) throw new Error("a model set needs at least one E/N");
  return {
    label,
    kind: "set",
    eOverNMin: values[0].eOverN,
    eOverNMax: values[values.length - 1].eOverN,
    members: values.map((v) => ({ eOverN: v.eOverN, count: v.count, nDW: nDWText(v) })),
    setDraw,
    setShare: 0.68,
    source,
  };
}
