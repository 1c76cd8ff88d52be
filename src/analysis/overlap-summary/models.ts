// A project model read for the overlap summary: its kind (line, interval, between lines, set of lines, from the
// model-kinds fields when present) and its E/N values as numbers.
import { parseEOverN } from "../../physics/eovern-parse";
import type { Model } from "../../project/types";
import type { SummaryModelKind } from "./types";

/** The fields of model kinds (issue 12); optional here so that models without them read as lines or intervals. */
interface KindFields {
  kind?: string;
  members?: { eOverN: string; count: number }[];
}

export interface ModelSpec {
  kind: SummaryModelKind;
  eMin: number;
  eMax: number;
  /** "between" and "set": the discrete E/N values with their multiplicities. */
  members: { value: number; count: number }[];
}

function readMembers(model: KindFields): { value: number; count: number }[] | null {
  const out: { value: number; count: number }[] = [];
  for (const m of model.members ?? []) {
    const p = parseEOverN(m.eOverN);
    if (!p.ok) return null;
    out.push({ value: p.minValue, count: Number.isFinite(m.count) && m.count > 0 ? m.count : 1 });
  }
  return out;
}

/** The model as the summary reads it, or null when its E/N cannot be read. */
export function modelSpec(model: Model): ModelSpec | null {
  const k = model as Model & KindFields;
  if ((k.kind === "between" || k.kind === "set") && (k.members?.length ?? 0) > 0) {
    const members = readMembers(k);
    if (!members || members.length === 0) return null;
    const values = members.map((m) => m.value);
    return { kind: k.kind, eMin: Math.min(...values), eMax: Math.max(...values), members };
  }
  const min = parseEOverN(model.eOverNMin);
  const max = parseEOverN(model.eOverNMax);
  if (!min.ok || !max.ok) return null;
  const eMin = Math.min(min.minValue, max.minValue);
  const eMax = Math.max(min.maxValue, max.maxValue);
  return { kind: eMin === eMax ? "line" : "interval", eMin, eMax, members: [] };
}
