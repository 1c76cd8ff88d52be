// Two-loop running of the three SM gauge couplings with vector-like heavy quarks entering at one mass, to tell
// whether any coupling meets a Landau pole below a chosen scale (the selection criterion of the heavy-quark papers).
import { su3Casimir, su3Dimension, su3Index, parseColour } from "../su3";
import { parseRational } from "../rational";

/** Settings of the Landau-pole criterion. */
export interface LandauPoleOpts {
  /** Mass at which all heavy quarks enter the running (GeV). @default 5e11 */
  heavyMassGeV?: number;
  /** No coupling may reach its pole below this scale (GeV). @default 1e18 */
  poleScaleGeV?: number;
}

/**
 * Defaults of Plakkot & Hoof, Phys. Rev. D 104 (2021) 075017 (arXiv:2107.12378), as set in their public
 * catalogue code (ksvz_axion_catalogue, model_building.py, find_LP: mQ = 5e11 GeV, lp_threshold = 1e18 GeV);
 * Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801 require no pole below the Planck scale ~10^18 GeV, with the
 * heavy quarks at 5×10^11 GeV (from memory).
 */
export const LANDAU_DEFAULTS: Required<LandauPoleOpts> = { heavyMassGeV: 5e11, poleScaleGeV: 1e18 };

/** Z mass (GeV), PDG (Particle Data Group, Review of Particle Physics 2020): 91.1876(21). */
const MZ_GEV = 91.1876;

/**
 * α_i(M_Z) for U(1)_Y in GUT normalisation (α₁ = 5/3 α_Y), SU(2)_L and SU(3)_c, as used by Plakkot & Hoof
 * (arXiv:2107.12378, their catalogue code, find_LP: 0.016923, 0.03374, 0.1173); MS-bar values of that era.
 */
const ALPHA_MZ = [0.016923, 0.03374, 0.1173] as const;

/** SM one-loop coefficients b_i (GUT-normalised U(1)): 41/10, −19/6, −7 (three generations, one Higgs). */
const A_SM = [41 / 10, -19 / 6, -7];

/**
 * SM two-loop gauge coefficients b_ij (no Yukawas), Machacek & Vaughn, Nucl. Phys. B222 (1983) 83, with the
 * SM content (the paper from memory; checked against Plakkot & Hoof's code, model_building.py, where
 * b_SM = (−b1 + b2 + b3)ᵀ with n_g = 3 gives this matrix, and a_SM these b_i): dα_i⁻¹/dt ∋ −b_ij α_j/(4π).
 */
const B_SM = [
  [199 / 50, 27 / 10, 44 / 5],
  [9 / 10, 35 / 6, 12],
  [11 / 10, 9 / 2, -26],
];

/** What one vector-like (Dirac) heavy quark adds to the one- and two-loop coefficients. */
export interface RunningShare {
  a: number[];
  /** Row-major 3×3. */
  b: number[];
}

/**
 * Shares of one Dirac heavy quark (colour, SU(2) dimension, hypercharge), Machacek & Vaughn (1983):
 * Δb_i = (4/3)κ S_i Π_{k≠i} d_k, Δb_ij = κ [4 C_j + (20/3) δ_ij C₂(G_i)] S_i Π_{k≠i} d_k, κ = 1 for Dirac,
 * C₂(G) = 0, 2, 3; for U(1) in GUT normalisation S₁ = C₁ = (3/5) Y².
 */
export function runningShare(colour: string, dim: number, y: string): RunningShare {
  const c = parseColour(colour);
  const yr = parseRational(y);
  if (!c.ok || !yr.ok) throw new Error(`heavy quark (${colour}, ${dim}, ${y}): bad representation`);
  const { p, q } = c.irrep;
  const d3 = su3Dimension(p, q);
  const s3 = su3Index(p, q).valueOf();
  const c3 = su3Casimir(p, q).valueOf();
  const d2 = dim;
  const s2 = (dim * (dim * dim - 1)) / 12;
  const c2 = (dim * dim - 1) / 4;
  const y2 = yr.value.valueOf() ** 2;
  const s1 = 0.6 * y2;
  const c1 = 0.6 * y2;
  const S = [s1 * d2 * d3, s2 * d3, s3 * d2];
  const C = [c1, c2, c3];
  const G = [0, 2, 3];
  const b: number[] = [];
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) b.push(S[i] * (4 * C[j] + (i === j ? (20 / 3) * G[i] : 0)));
  return { a: S.map((s) => (4 / 3) * s), b };
}

const FOUR_PI = 4 * Math.PI;

/** dy/dt for y = α⁻¹, t = ln(μ)/(2π). */
function deriv(y0: number, y1: number, y2: number, a: Float64Array, b: Float64Array, out: Float64Array): void {
  const r0 = 1 / Math.abs(y0);
  const r1 = 1 / Math.abs(y1);
  const r2 = 1 / Math.abs(y2);
  out[0] = -a[0] - (b[0] * r0 + b[1] * r1 + b[2] * r2) / FOUR_PI;
  out[1] = -a[1] - (b[3] * r0 + b[4] * r1 + b[5] * r2) / FOUR_PI;
  out[2] = -a[2] - (b[6] * r0 + b[7] * r1 + b[8] * r2) / FOUR_PI;
}

const k1 = new Float64Array(3);
const k2 = new Float64Array(3);
const k3 = new Float64Array(3);
const k4 = new Float64Array(3);
const bounded = [false, false, false];

/**
 * Hot loop (runs for every candidate model): RK4 with the step also kept below `shrink`·y/|y'| near a pole.
 * Returns the smallest α⁻¹ at the end, or −(t_pole) (≤ 0) when a coupling reaches its pole at t_pole, or −∞
 * when a pole before the end is certain.
 */
function run(y: Float64Array, tSpan: number, a: Float64Array, b: Float64Array, hMax: number, shrink: number): number {
  for (let i = 0; i < 3; i++) bounded[i] = a[i] > 0 && b[3 * i] >= 0 && b[3 * i + 1] >= 0 && b[3 * i + 2] >= 0;
  let t = 0;
  while (t < tSpan) {
    deriv(y[0], y[1], y[2], a, b, k1);
    let h = Math.min(hMax, tSpan - t);
    for (let i = 0; i < 3; i++) if (k1[i] < 0) h = Math.min(h, (shrink * y[i]) / -k1[i]);
    deriv(y[0] + 0.5 * h * k1[0], y[1] + 0.5 * h * k1[1], y[2] + 0.5 * h * k1[2], a, b, k2);
    deriv(y[0] + 0.5 * h * k2[0], y[1] + 0.5 * h * k2[1], y[2] + 0.5 * h * k2[2], a, b, k3);
    deriv(y[0] + h * k3[0], y[1] + h * k3[1], y[2] + h * k3[2], a, b, k4);
    for (let i = 0; i < 3; i++) y[i] += (h / 6) * (k1[i] + 2 * k2[i] + 2 * k3[i] + k4[i]);
    t += h;
    // α⁻¹ this close to 0 is at the pole for practical purposes (the rest of the way is a scale factor ~1.0001).
    if (y[0] < 1e-4 || y[1] < 1e-4 || y[2] < 1e-4) return -t;
    // Where b_i > 0 and every b_ij ≥ 0, α_i⁻¹ falls at least as fast as b_i·t: its pole comes within y_i/b_i.
    // The margin covers the coarse pass's error in α⁻¹ (below 0.01 away from the pole).
    for (let i = 0; i < 3; i++) if (bounded[i] && t + (y[i] + 0.05) / a[i] <= tSpan) return -Infinity;
  }
  return Math.min(y[0], y[1], y[2]);
}

/** Steps in t = ln μ/(2π): the coarse pass decides clear cases, the fine one the rest (converged: see tests). */
const COARSE_STEP = 0.25;
const FINE_STEP = 0.01;

/** A prepared criterion: `passes(a, b)` for the heavy quarks' summed shares. */
export interface LandauCheck {
  passes(a: Float64Array, b: Float64Array): boolean;
  opts: Required<LandauPoleOpts>;
}

/** Prepare the criterion: the SM running from M_Z up to the heavy-quark mass is done once here. */
export function landauCheck(opts: LandauPoleOpts = {}, fineStep = FINE_STEP): LandauCheck {
  const o = { ...LANDAU_DEFAULTS, ...opts };
  if (!(o.heavyMassGeV > MZ_GEV) || !(o.poleScaleGeV > o.heavyMassGeV))
    throw new Error(
      `Landau-pole criterion needs M_Z < heavy-quark mass < pole scale, got ${o.heavyMassGeV}, ${o.poleScaleGeV}`,
    );
  const aSm = Float64Array.from(A_SM);
  const bSm = Float64Array.from(B_SM.flat());
  const yQ = Float64Array.from(ALPHA_MZ, (x) => 1 / x);
  if (run(yQ, Math.log(o.heavyMassGeV / MZ_GEV) / (2 * Math.PI), aSm, bSm, FINE_STEP, 0.1) <= 0)
    throw new Error("the SM couplings alone meet a pole below the heavy-quark mass");
  const tSpan = Math.log(o.poleScaleGeV / o.heavyMassGeV) / (2 * Math.PI);
  const aTot = new Float64Array(3);
  const bTot = new Float64Array(9);
  const y = new Float64Array(3);
  return {
    opts: o,
    passes(a, b) {
      for (let i = 0; i < 3; i++) aTot[i] = aSm[i] + a[i];
      for (let i = 0; i < 9; i++) bTot[i] = bSm[i] + b[i];
      // One-loop screen, exact for U(1)_Y and SU(2)_L: their two-loop terms are all positive and only hasten the pole.
      if (yQ[0] <= aTot[0] * tSpan || yQ[1] <= aTot[1] * tSpan) return false;
      y.set(yQ);
      const coarse = run(y, tSpan, aTot, bTot, COARSE_STEP, 0.3);
      // A coarse verdict near the edge (coupling large at the end, or pole close to the end) is redone finely.
      if (coarse > 0.5 || (coarse <= 0 && -coarse < 0.9 * tSpan) || coarse === -Infinity) return coarse > 0;
      y.set(yQ);
      return run(y, tSpan, aTot, bTot, fineStep, 0.02) > 0;
    },
  };
}
