// Default visible ranges per y view (what "reset view", the 0 key and double-click return to).
import type { YView } from "../../data/types";
import { defaultProject } from "../adapters/data";

/** Default [mass range eV, y range] for a y view: the start project's ranges for g_aγγ, fixed ones otherwise. */
export function defaultView(yView: YView): { massRangeEv: [number, number]; yRange: [number, number] } {
  const f = defaultProject().figure;
  const massRangeEv: [number, number] = [f.massRangeEv[0], f.massRangeEv[1]];
  if (yView === "coupling") return { massRangeEv, yRange: f.yView === "coupling" ? [f.yRange[0], f.yRange[1]] : [1e-17, 1e-9] };
  // |E/N − c_γ| of common models lies between ~0.01 (near cancellation) and ~50; g_γ is half of it.
  return { massRangeEv, yRange: yView === "normalized" ? [1e-2, 1e2] : [5e-3, 5e1] };
}
