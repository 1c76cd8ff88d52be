// Input and output shapes of the PQ-charge solver: fields (fermions and scalars), terms of the Lagrangian as
// products of fields, and the solved charges with E/N, N_DW and what the terms leave open.
import type { ElectroweakInput, FermionInput } from "../anomaly-types";

/** A scalar field: colour (default singlet) and electroweak representation as for fermions. */
export interface ScalarInput {
  name: string;
  colour?: FermionInput["colour"];
  ew: ElectroweakInput;
}

/** One factor of a term: a field, possibly conjugated (Φ†, Q̄), to a positive integer power. */
export interface TermFactor {
  field: string;
  conj?: boolean;
  /** @default 1 */
  power?: number;
}

/** A term of the Lagrangian: the product of its factors (order does not matter for charges). */
export type Term = TermFactor[];

export interface ChargeProblem {
  /** Fermions by name; their `pq` is ignored (it is what gets solved). */
  fermions: FermionInput[];
  scalars: ScalarInput[];
  /** Kept terms: each must be invariant under the PQ symmetry. */
  terms: Term[];
  /** Terms the model means to forbid; reported when every solution leaves them invariant. */
  forbidden?: Term[];
  /** The scalar whose PQ charge is set to 1 (its VEV sets f_a; N_DW = |2N/X|). */
  normalize: string;
}

export interface ChargeSolved {
  ok: true;
  /** False when N = 0 for every solution: no colour anomaly, no QCD axion. */
  axion: boolean;
  /** True when E/N takes one value on the whole solution space. */
  determined: boolean;
  /** E/N of the representative charges when determined (exact "p/q"), else null. */
  eOverN: string | null;
  /** N_DW = |2N/X| when N is the same for every solution, else null. */
  nDW: string | null;
  /** Representative PQ charges by field name (fermions as typed for their chirality, and scalars). */
  charges: Record<string, string>;
  /** Indices of forbidden terms that every solution leaves invariant. */
  forbiddenAllowed: number[];
  /** E and N of the representative charges. */
  E: string;
  N: string;
  /** Fields whose charges the terms leave open, chosen as independent parameters (a charge scan). */
  free: string[];
  /**
   * True when the free fields' charges may be scanned alone (every other charge as solved) and give exactly the
   * E/N of the solutions; false when charges of other fermions follow from them (a table scan would break terms).
   */
  scanExact: boolean;
  /** Every field whose charge differs between solutions (the free ones and those that follow them). */
  undetermined: string[];
  /** Forbidden terms that are not gauge invariant (already forbidden by the gauge symmetry), by index. */
  forbiddenByGauge: number[];
}

export type ChargeSolution = ChargeSolved | { ok: false; errors: string[] };
