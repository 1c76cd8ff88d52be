// The one place the plot core turns a project's physics settings into constants, E/N strings into numbers
// and a curve's rescale settings into a factor, so every layer of the figure uses the same numbers.
import { rationalToNumber } from "../physics/eovern-parse";
import type { PhysicsOpts } from "../physics/constants";
import { constantsOf } from "../project/physics-constants";
import type { CurveRescale, PhysicsSettings } from "../project/types";
import {
  isRescaled as dataIsRescaled,
  rescaleFactor as dataRescaleFactor,
  rescaleLegendSuffix,
  validateRescale,
} from "../analysis/rescale";

export { constantsOf };

/** PhysicsOpts for the physics core with the project's constants. */
export function physicsOptsOf(physics?: PhysicsSettings): PhysicsOpts {
  return { constants: constantsOf(physics) };
}

/** Value of an E/N string ("8/3", "-1/3", "0.5", U+2212 minus accepted); NaN when unreadable. */
export function eOverNValue(text: string | number): number {
  if (typeof text === "number") return text;
  // Every frame reads the same model strings (a model set may hold thousands): parse each once (bounded).
  let v = eOverNValues.get(text);
  if (v === undefined) {
    if (eOverNValues.size > 50_000) eOverNValues.clear();
    v = rationalToNumber(text);
    eOverNValues.set(text, v);
  }
  return v;
}
const eOverNValues = new Map<string, number>();

/**
 * Factor the curve's couplings are multiplied by, √(ρ_assumed/ρ_shown)/√f (src/analysis/rescale.ts; common
 * practice); 1 when the settings are missing or invalid, so a half-typed form never breaks the figure.
 */
export function rescaleFactor(rescale: CurveRescale | undefined): number {
  if (!rescale || validateRescale(rescale) !== null) return 1;
  return dataRescaleFactor(rescale);
}

/** True when the rescale settings change the curve (and are valid, so they are applied). */
export function isRescaled(rescale: CurveRescale | undefined): boolean {
  return !!rescale && validateRescale(rescale) === null && dataIsRescaled(rescale);
}

/** Legend note of a rescaled curve ("rescaled: ρ = 0.3 GeV/cm³, f = 0.5"), "" when not rescaled. */
export function rescaleNote(rescale: CurveRescale | undefined): string {
  return isRescaled(rescale) ? rescaleLegendSuffix(rescale as CurveRescale) : "";
}
