// Rescaling of haloscope-type limits to another local dark-matter density or axion fraction, and its legend text.
import type { CurveRescale } from "../project/types";

export interface RescaleOpts {
  /** Local dark-matter density the limit was computed for, GeV/cm³. @default rhoShown (no change) */
  rhoAssumed?: number;
  /** Local dark-matter density to show the limit for, GeV/cm³. @default rhoAssumed (no change) */
  rhoShown?: number;
  /** Fraction f of the dark matter made of axions, 0 < f ≤ 1. @default 1 */
  fraction?: number;
}

/** The reason a rescaling cannot be applied, or null when it can. */
export function validateRescale(opts: RescaleOpts): string | null {
  const { rhoAssumed, rhoShown, fraction } = opts;
  if (rhoAssumed !== undefined && !(rhoAssumed > 0 && Number.isFinite(rhoAssumed)))
    return "the assumed density must be a positive number (GeV/cm³)";
  if (rhoShown !== undefined && !(rhoShown > 0 && Number.isFinite(rhoShown)))
    return "the shown density must be a positive number (GeV/cm³)";
  if (fraction !== undefined && !(fraction > 0 && fraction <= 1)) return "the axion fraction must lie in (0, 1]";
  return null;
}

// A haloscope's signal power grows as g² · ρ_a, with ρ_a = f · ρ the local axion density; a limit on the
// power therefore moves as g ∝ 1/√(f ρ): g_shown = g · √(ρ₀/ρ) / √f (common practice).
/** The factor √(ρ₀/ρ)/√f that multiplies g; throws a RangeError for parameters {@link validateRescale} rejects. */
export function rescaleFactor(opts: RescaleOpts): number {
  const problem = validateRescale(opts);
  if (problem) throw new RangeError(problem);
  const rho0 = opts.rhoAssumed ?? opts.rhoShown ?? 1;
  const rho = opts.rhoShown ?? rho0;
  const f = opts.fraction ?? 1;
  // One square root of the whole ratio: exactly 1 when nothing changes.
  return Math.sqrt(rho0 / (rho * f));
}

/**
 * g_aγγ of a limit shown for density ρ = rhoShown and fraction f, from one computed for ρ₀ = rhoAssumed:
 * g · √(ρ₀/ρ) / √f (common practice). Returns a new array; the input is never changed.
 */
export function rescaleCurve(gInvGeV: Float64Array, opts: RescaleOpts): Float64Array {
  const k = rescaleFactor(opts);
  const out = new Float64Array(gInvGeV.length);
  if (k === 1) {
    out.set(gInvGeV);
    return out;
  }
  for (let i = 0; i < gInvGeV.length; i++) out[i] = gInvGeV[i] * k;
  return out;
}

/** True when a curve's rescaling changes its values (a density different from the assumed one, or f < 1). */
export function isRescaled(rescale: RescaleOpts | CurveRescale): boolean {
  const rho0 = rescale.rhoAssumed;
  const rho = rescale.rhoShown;
  const densityChanged = rho0 !== undefined && rho !== undefined && rho0 !== rho;
  return densityChanged || (rescale.fraction !== undefined && rescale.fraction !== 1);
}

function shortNumber(x: number): string {
  return String(Number(x.toPrecision(4)));
}

/**
 * Legend suffix for a rescaled curve, e.g. "rescaled: ρ = 0.3 GeV/cm³, f = 0.5"; "" when not rescaled.
 * The density appears when it differs from the assumed one, the fraction when it is below 1.
 */
export function rescaleLegendSuffix(rescale: RescaleOpts | CurveRescale): string {
  if (!isRescaled(rescale)) return "";
  const parts: string[] = [];
  if (rescale.rhoShown !== undefined && rescale.rhoAssumed !== undefined && rescale.rhoShown !== rescale.rhoAssumed) {
    parts.push(`ρ = ${shortNumber(rescale.rhoShown)} GeV/cm³`);
  }
  if (rescale.fraction !== undefined && rescale.fraction !== 1) parts.push(`f = ${shortNumber(rescale.fraction)}`);
  return `rescaled: ${parts.join(", ")}`;
}
