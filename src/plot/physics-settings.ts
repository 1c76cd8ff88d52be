// The one place the plot core turns a project's physics settings into constants, E/N strings into numbers
// and a curve's rescale settings into a factor, so every layer of the figure uses the same numbers.
import { rationalToNumber } from "../physics/eovern-parse";
import { referenceConstants, type AxionConstants, type PhysicsOpts } from "../physics/constants";
import type { CurveRescale, PhysicsSettings } from "../data/types";
import { isRescaled as dataIsRescaled, rescaleFactor as dataRescaleFactor, rescaleLegendSuffix, validateRescale } from "../data/rescale";

function positive(v: unknown, fallback: number): number {
  return typeof v === "number" && Number.isFinite(v) && v > 0 ? v : fallback;
}
function nonNegative(v: unknown, fallback: number): number {
  return typeof v === "number" && Number.isFinite(v) && v >= 0 ? v : fallback;
}

/**
 * Constants of a project: the published set for "2016"/"2019", or the user's custom values (a missing or
 * non-physical custom number falls back to the 2019 set's, so a half-typed form never breaks the figure).
 * @param physics the project's physics settings. @default the 2019 reference
 */
export function constantsOf(physics?: PhysicsSettings): AxionConstants {
  if (!physics || physics.ref !== "custom") return referenceConstants(physics?.ref === "2016" ? "2016" : "2019");
  const base = referenceConstants("2019");
  const c = physics.custom ?? base;
  return {
    cGamma: typeof c.cGamma === "number" && Number.isFinite(c.cGamma) ? c.cGamma : base.cGamma,
    cGammaSigma: nonNegative(c.cGammaSigma, base.cGammaSigma),
    kMuEv: positive(c.kMuEv, base.kMuEv),
    kMuEvSigma: nonNegative(c.kMuEvSigma, base.kMuEvSigma),
    label: typeof c.label === "string" && c.label ? c.label : "custom",
  };
}

/** PhysicsOpts for the physics core with the project's constants. */
export function physicsOptsOf(physics?: PhysicsSettings): PhysicsOpts {
  return { constants: constantsOf(physics) };
}

/** Value of an E/N string ("8/3", "-1/3", "0.5", U+2212 minus accepted); NaN when unreadable. */
export function eOverNValue(text: string | number): number {
  return rationalToNumber(text);
}

/**
 * Factor the curve's couplings are multiplied by, √(ρ_assumed/ρ_shown)/√f (src/data/rescale.ts; common
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
