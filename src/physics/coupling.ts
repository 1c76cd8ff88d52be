// g_aγγ(m_a) for a model line or band, its theory spread, the normalized views and the inverse map.
// Internal units: eV for masses, GeV for f_a, GeV⁻¹ for couplings, Hz for frequencies.
import { ALPHA, PLANCK_EV_S, resolveConstants, type PhysicsOpts, type AxionConstants } from "./constants";

const TWO_PI = 2 * Math.PI;

/** f_a in GeV for an axion mass in eV: m_a = K μeV · 10¹² GeV / f_a ⇒ f_a = K·10⁶ eV·GeV / m_a. */
export function faFromMass(massEv: number, ref?: PhysicsOpts["ref"] | PhysicsOpts): number {
  const c = resolveConstants(typeof ref === "object" ? ref : { ref });
  return (c.kMuEv * 1e6) / massEv;
}

/** Axion mass in eV for f_a in GeV (inverse of {@link faFromMass}). */
export function massFromFa(faGeV: number, ref?: PhysicsOpts["ref"] | PhysicsOpts): number {
  const c = resolveConstants(typeof ref === "object" ? ref : { ref });
  return (c.kMuEv * 1e6) / faGeV;
}

/** Photon frequency ν = m_a / h in Hz for a mass in eV. */
export function frequencyFromMass(massEv: number): number {
  return massEv / PLANCK_EV_S;
}

/** Mass in eV of a photon of frequency ν in Hz. */
export function massFromFrequency(freqHz: number): number {
  return freqHz * PLANCK_EV_S;
}

/** |g_aγγ| in GeV⁻¹ of the model line with this E/N at this mass: α/(2π f_a)·|E/N − c_γ|. */
export function gAgg(massEv: number, eOverN: number, opts: PhysicsOpts = {}): number {
  const c = resolveConstants(opts);
  return (ALPHA / (TWO_PI * ((c.kMuEv * 1e6) / massEv))) * Math.abs(eOverN - c.cGamma);
}

/** g_aγγ in GeV⁻¹ for a given |E/N − c_γ| (the "normalized coupling") at a mass, with an explicit K. */
export function gFromNormalized(massEv: number, absCagamma: number, kMuEv: number): number {
  return (ALPHA * massEv * absCagamma) / (TWO_PI * kMuEv * 1e6);
}

/** |E/N − c_γ| that a coupling g at mass m corresponds to: 2π f_a g / α. */
export function normalizedFromG(massEv: number, gInvGeV: number, opts: PhysicsOpts = {}): number {
  const c = resolveConstants(opts);
  return (TWO_PI * ((c.kMuEv * 1e6) / massEv) * gInvGeV) / ALPHA;
}

/** Signed normalized coupling C_aγ = E/N − c_γ. */
export function cAgamma(eOverN: number, opts: PhysicsOpts = {}): number {
  return eOverN - resolveConstants(opts).cGamma;
}

/** Haloscope convention g_γ = (E/N − c_γ)/2, so that g_aγγ = (α/π)·g_γ/f_a. */
export function gGamma(eOverN: number, opts: PhysicsOpts = {}): number {
  return cAgamma(eOverN, opts) / 2;
}

/** Range of |E/N − c| over E/N ∈ [a, b] and c ∈ [cLo, cHi]; the minimum is 0 when the intervals meet. */
export function absDifferenceRange(a: number, b: number, cLo: number, cHi: number): [number, number] {
  const lo = Math.min(a, b);
  const hi = Math.max(a, b);
  const min = hi < cLo ? cLo - hi : lo > cHi ? lo - cHi : 0;
  const max = Math.max(Math.abs(lo - cLo), Math.abs(lo - cHi), Math.abs(hi - cLo), Math.abs(hi - cHi));
  return [min, max];
}

/** Options for band edges: the theory spread varies c_γ and K by ±k σ. */
export interface BandOpts extends PhysicsOpts {
  /** k in "±k σ" for the theory spread. @default 0 */
  sigmas?: number;
}

/** Normalized-coupling range [min, max] of |E/N − c_γ| for an E/N interval with theory spread in c_γ. */
export function normalizedRange(eOverNMin: number, eOverNMax: number, c: AxionConstants, sigmas = 0): [number, number] {
  const dc = sigmas * c.cGammaSigma;
  return absDifferenceRange(eOverNMin, eOverNMax, c.cGamma - dc, c.cGamma + dc);
}

/**
 * Lower and upper g_aγγ (GeV⁻¹) of the band for E/N ∈ [min, max] at one mass. The lower edge is exactly 0
 * when c_γ (or, with a theory spread, any c_γ in c_γ ± kσ) lies in the interval: the coupling cancels.
 * The spread also varies K by ±kσ, which moves f_a at fixed mass: the upper edge takes K − kσ.
 */
export function bandEdges(
  massEv: number,
  eOverNMin: number,
  eOverNMax: number,
  opts: BandOpts = {},
): { lowInvGeV: number; highInvGeV: number } {
  const c = resolveConstants(opts);
  const k = opts.sigmas ?? 0;
  const [nMin, nMax] = normalizedRange(eOverNMin, eOverNMax, c, k);
  const kHigh = c.kMuEv + k * c.kMuEvSigma;
  const kLow = c.kMuEv - k * c.kMuEvSigma;
  return {
    lowInvGeV: nMin === 0 ? 0 : gFromNormalized(massEv, nMin, kHigh),
    highInvGeV: gFromNormalized(massEv, nMax, kLow),
  };
}

/** True when the interval (widened by the spread) contains c_γ, so the band reaches g = 0. */
export function bandCancels(eOverNMin: number, eOverNMax: number, opts: BandOpts = {}): boolean {
  const c = resolveConstants(opts);
  return normalizedRange(eOverNMin, eOverNMax, c, opts.sigmas ?? 0)[0] === 0;
}

/** The two E/N values (ascending) whose model lines pass through (m_a, g): c_γ ∓ 2π f_a g/α. */
export function eOverNAt(massEv: number, gInvGeV: number, opts: PhysicsOpts = {}): [number, number] {
  const c = resolveConstants(opts);
  const d = normalizedFromG(massEv, gInvGeV, opts);
  return [c.cGamma - d, c.cGamma + d];
}
