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
  /**
   * The band between the lines of the two E/N values (a "between lines" model) instead of every E/N of the
   * interval: its lower edge is the lower line, so it reaches 0 only where one of the lines does. @default false
   */
  between?: boolean;
}

/**
 * Range [min, max] of |E/N_i − c| over the lines E/N_i and c ∈ [cLo, cHi]: the band between the lines, each
 * widened outward by the spread of c. The minimum is 0 only when some E/N_i lies in [cLo, cHi], i.e. when one
 * line itself reaches g = 0. [0, 0] for no values.
 */
export function linesRange(values: readonly number[], cLo: number, cHi: number): [number, number] {
  if (values.length === 0) return [0, 0];
  let lo = Infinity;
  let hi = 0;
  for (const e of values) {
    const [a, b] = absDifferenceRange(e, e, cLo, cHi);
    if (a < lo) lo = a;
    if (b > hi) hi = b;
  }
  return [lo, hi];
}

/** |E/N − c_γ| range [min, max] of the band between the lines of `values`, with theory spread in c_γ. */
export function normalizedLinesRange(values: readonly number[], c: AxionConstants, sigmas = 0): [number, number] {
  const dc = sigmas * c.cGammaSigma;
  return linesRange(values, c.cGamma - dc, c.cGamma + dc);
}

/**
 * Lower and upper g_aγγ (GeV⁻¹) at one mass of the band between the lines of discrete E/N values (a
 * between-lines band, or a model set drawn between its extreme lines): lower edge the line with the smallest
 * |E/N − c_γ|, upper edge the one with the largest; the theory spread widens each line outward (c_γ ± kσ,
 * and K ± kσ as in {@link bandEdges}).
 */
export function linesBandEdges(
  massEv: number,
  values: readonly number[],
  opts: Omit<BandOpts, "between"> = {},
): { lowInvGeV: number; highInvGeV: number } {
  const c = resolveConstants(opts);
  const k = opts.sigmas ?? 0;
  return edgesOf(massEv, normalizedLinesRange(values, c, k), c, k);
}

function edgesOf(
  massEv: number,
  [nMin, nMax]: [number, number],
  c: AxionConstants,
  k: number,
): { lowInvGeV: number; highInvGeV: number } {
  const kHigh = c.kMuEv + k * c.kMuEvSigma;
  const kLow = c.kMuEv - k * c.kMuEvSigma;
  return {
    lowInvGeV: nMin === 0 ? 0 : gFromNormalized(massEv, nMin, kHigh),
    highInvGeV: gFromNormalized(massEv, nMax, kLow),
  };
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
 * With `between: true` it is the band between the E/N = min and E/N = max lines instead
 * ({@link linesBandEdges}): lower edge min |E/N_i − c_γ|, 0 only where one of the two lines reaches 0.
 */
export function bandEdges(
  massEv: number,
  eOverNMin: number,
  eOverNMax: number,
  opts: BandOpts = {},
): { lowInvGeV: number; highInvGeV: number } {
  const c = resolveConstants(opts);
  const k = opts.sigmas ?? 0;
  const range = opts.between
    ? normalizedLinesRange([eOverNMin, eOverNMax], c, k)
    : normalizedRange(eOverNMin, eOverNMax, c, k);
  return edgesOf(massEv, range, c, k);
}

/**
 * True when the band reaches g = 0: the interval (widened by the spread) contains c_γ, or with `between: true`
 * one of the two lines does.
 */
export function bandCancels(eOverNMin: number, eOverNMax: number, opts: BandOpts = {}): boolean {
  const c = resolveConstants(opts);
  const k = opts.sigmas ?? 0;
  const range = opts.between
    ? normalizedLinesRange([eOverNMin, eOverNMax], c, k)
    : normalizedRange(eOverNMin, eOverNMax, c, k);
  return range[0] === 0;
}

/** The two E/N values (ascending) whose model lines pass through (m_a, g): c_γ ∓ 2π f_a g/α. */
export function eOverNAt(massEv: number, gInvGeV: number, opts: PhysicsOpts = {}): [number, number] {
  const c = resolveConstants(opts);
  const d = normalizedFromG(massEv, gInvGeV, opts);
  return [c.cGamma - d, c.cGamma + d];
}
