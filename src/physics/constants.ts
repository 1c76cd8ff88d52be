// Physical constants and the QCD-axion reference sets (c_γ, K = m_a·f_a) that every prediction uses.
// Each number carries its source; the reference set is chosen per project and travels with it.

/** Fine-structure constant α (CODATA 2018 recommended value, 7.2973525693(11)×10⁻³). */
export const ALPHA = 7.2973525693e-3;

/** Planck constant h in eV·s (CODATA 2018, exact since the 2019 SI redefinition). */
export const PLANCK_EV_S = 4.135667696e-15;

/** Identifier of a published reference set. */
export type RefId = "2016" | "2019";

/** A complete set of the numbers that turn E/N into g_aγγ(m_a). */
export interface AxionConstants {
  /** Model-independent photon coefficient c_γ in g_aγγ = α/(2π f_a)·(E/N − c_γ). */
  cGamma: number;
  /** One standard deviation of c_γ. */
  cGammaSigma: number;
  /** K in m_a = K μeV · (10¹² GeV / f_a). */
  kMuEv: number;
  /** One standard deviation of K (μeV). */
  kMuEvSigma: number;
  /** Short human-readable origin, shown in the sources panel. */
  label: string;
}

/**
 * Grilli di Cortona, Hardy, Pardo Vega, Villadoro, "The QCD axion, precisely", JHEP 01 (2016) 034,
 * arXiv:1511.02867: c_γ = 1.92(4), m_a = 5.70(6)(4) μeV·(10¹² GeV/f_a). The two errors of K are added
 * in quadrature: √(0.06² + 0.04²) = √0.0052 = 0.0721 → 0.072.
 */
export const REF_2016: AxionConstants = {
  cGamma: 1.92,
  cGammaSigma: 0.04,
  kMuEv: 5.7,
  kMuEvSigma: 0.072,
  label: "Grilli di Cortona et al., JHEP 01 (2016) 034",
};

/**
 * Gorghetto & Villadoro, "Topological susceptibility and QCD axion mass: QED and NNLO corrections",
 * JHEP 03 (2019) 033, arXiv:1812.01008: m_a = 5.691(51) μeV·(10¹² GeV/f_a); c_γ is kept at 1.92(4)
 * from the 2016 paper.
 */
export const REF_2019: AxionConstants = {
  cGamma: 1.92,
  cGammaSigma: 0.04,
  kMuEv: 5.691,
  kMuEvSigma: 0.051,
  label: "Gorghetto & Villadoro, JHEP 03 (2019) 033 (K); Grilli di Cortona et al., JHEP 01 (2016) 034 (c_γ)",
};

/** The newer reference is the default. @default "2019" */
export const DEFAULT_REF: RefId = "2019";

/** The published set for a reference id. */
export function referenceConstants(ref: RefId = DEFAULT_REF): AxionConstants {
  return ref === "2016" ? REF_2016 : REF_2019;
}

/** Options every physics function accepts: a published reference, or a full user-entered set. */
export interface PhysicsOpts {
  /** Published reference set. @default "2019" */
  ref?: RefId;
  /** Override c_γ only (keeps K of `ref`). */
  cGamma?: number;
  /** A complete user-entered set; wins over `ref` and `cGamma`. */
  constants?: AxionConstants;
}

/** The constants an options object stands for. */
export function resolveConstants(opts: PhysicsOpts = {}): AxionConstants {
  const base = opts.constants ?? referenceConstants(opts.ref);
  return opts.cGamma !== undefined && !opts.constants ? { ...base, cGamma: opts.cGamma } : base;
}
