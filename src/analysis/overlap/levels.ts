// The model band as two horizontal levels in the sheared plane v = ln g − ln m, and the way back from a level to E/N.
import { ALPHA, type AxionConstants } from "../../physics/constants";
import { normalizedRange } from "../../physics/coupling";
import type { OverlapModel } from "./types";

export interface Levels {
  /** ln(g_low/m) of the band's lower edge, −∞ when it cancels. */
  lo: number;
  /** ln(g_high/m) of the upper edge (+∞ when a huge spread makes K − kσ ≤ 0). */
  hi: number;
  cGamma: number;
  /** Spread of c_γ (kσ). */
  dc: number;
  kLow: number;
  kHigh: number;
  eMin: number;
  eMax: number;
  /** Smallest |E/N − c_γ| inside the band (c_γ-side floor of a between-lines band; 0 otherwise). */
  nFloor: number;
}

/** ln of α/(2π K·10⁶) · n: the sheared level of |E/N − c_γ| = n with K in μeV (see gFromNormalized). */
function levelOf(n: number, kMuEv: number): number {
  if (!(kMuEv > 0)) return Infinity;
  return n > 0 ? Math.log((ALPHA * n) / (2 * Math.PI * kMuEv * 1e6)) : -Infinity;
}

/** |E/N − c_γ| whose line has sheared level v, for K in μeV (inverse of levelOf). */
export function normalizedOfLevel(v: number, kMuEv: number): number {
  return (Math.exp(v) * 2 * Math.PI * kMuEv * 1e6) / ALPHA;
}

export function modelLevels(model: OverlapModel, c: AxionConstants, lnFactor: number): Levels {
  const k = model.sigmas ?? 0;
  const eMin = Math.min(model.eOverNMin, model.eOverNMax);
  const eMax = Math.max(model.eOverNMin, model.eOverNMax);
  const [nMin, nMax] = model.between ? betweenRange(model.between, c, k) : normalizedRange(eMin, eMax, c, k);
  const kHigh = c.kMuEv + k * c.kMuEvSigma;
  const kLow = c.kMuEv - k * c.kMuEvSigma;
  // Scaling the curve by f is the same as lowering the model levels by ln f.
  return {
    lo: levelOf(nMin, kHigh) - lnFactor,
    hi: levelOf(nMax, kLow) - lnFactor,
    cGamma: c.cGamma,
    dc: k * c.cGammaSigma,
    kLow,
    kHigh,
    eMin,
    eMax,
    nFloor: model.between ? betweenRange(model.between, c, 0)[0] : 0,
  };
}

/** |E/N − c_γ| range of the band between the lines of `values`: each line widened by its own spread. */
function betweenRange(values: number[], c: AxionConstants, k: number): [number, number] {
  let lo = Infinity;
  let hi = 0;
  for (const e of values) {
    const [a, b] = normalizedRange(e, e, c, k);
    lo = Math.min(lo, a);
    hi = Math.max(hi, b);
  }
  return values.length > 0 ? [lo, hi] : [0, 0];
}

/**
 * E/N values of [eMin, eMax] with |E/N − c_γ| in [nA, nB] (nB may be ∞), as ascending intervals.
 */
export function eOverNWithAbsIn(L: Levels, nA: number, nB: number): [number, number][] {
  const out: [number, number][] = [];
  const add = (lo: number, hi: number): void => {
    const a = Math.max(lo, L.eMin);
    const b = Math.min(hi, L.eMax);
    if (!(a <= b)) return;
    const last = out[out.length - 1];
    if (last && a <= last[1]) last[1] = Math.max(last[1], b);
    else out.push([a, b]);
  };
  const c = L.cGamma;
  const a = Math.max(0, L.nFloor, nA);
  if (!(a <= nB)) return out;
  add(c - nB, c - a);
  add(c + a, c + nB);
  return out;
}
