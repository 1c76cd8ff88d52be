// A project's physics settings turned into the constants every derived number uses (figure, overlap table,
// model CSV): one function, so the figure and the tables can never disagree about c_γ or K.
import { referenceConstants, type AxionConstants } from "../physics/constants";
import type { PhysicsSettings } from "./types";

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
