// Default visible ranges per y view (what "reset view", the 0 key and double-click return to).
import type { YView } from "../../project/types";
import { DEFAULT_MASS_RANGE_EV, defaultYRange } from "../../project/defaults";

/** Default [mass range eV, y range] for a y view (the ranges of a new project's figure). */
export function defaultView(yView: YView): { massRangeEv: [number, number]; yRange: [number, number] } {
  return { massRangeEv: [DEFAULT_MASS_RANGE_EV[0], DEFAULT_MASS_RANGE_EV[1]], yRange: defaultYRange(yView) };
}
