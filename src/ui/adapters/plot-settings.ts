// TEMPORARY adapter: stands in for src/plot/physics-settings (constantsOf, physicsOptsOf, eOverNValue) until
// that module is committed; replaced by the real import as soon as it lands.
import { referenceConstants, type AxionConstants, type PhysicsOpts } from "../../physics/constants";
import { rationalToNumber } from "../../physics/eovern-parse";
import type { PhysicsSettings } from "../../data/types";

/** Constants of a project's physics settings (custom values taken as typed). */
export function constantsOf(physics?: PhysicsSettings): AxionConstants {
  if (!physics || physics.ref !== "custom") return referenceConstants(physics?.ref === "2016" ? "2016" : "2019");
  return { ...physics.custom, label: physics.custom.label || "custom" };
}

export function physicsOptsOf(physics?: PhysicsSettings): PhysicsOpts {
  return { constants: constantsOf(physics) };
}

export function eOverNValue(text: string | number): number {
  return rationalToNumber(text);
}
