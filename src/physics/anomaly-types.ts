// Input shape of the anomaly calculator: one left- or right-handed Weyl multiplet per entry.
// Rationals are integers or strings such as "-1/3"; the calculator turns them into exact fractions.

export type RationalInput = string | number;

export type ElectroweakInput =
  /** SU(2)_L multiplet of dimension `dim` with hypercharge `y` (Q = T₃ + Y). */
  | { kind: "sm"; dim: number; y: RationalInput }
  /** SU(3)_L singlet, triplet or antitriplet: Q = T₃ + βT₈ + X with b = β/√3. */
  | { kind: "su3l"; rep: "1" | "3" | "3bar"; x: RationalInput; b: RationalInput }
  /** Explicit electric charges of the components. */
  | { kind: "explicit"; charges: RationalInput[] };

export interface FermionInput {
  /** SU(3)_c irrep: Dynkin labels, or a name ("1", "3", "3bar", "6", "6bar", "8", "10", "15", "27"…). */
  colour: { p: number; q: number } | string;
  ew: ElectroweakInput;
  chirality: "L" | "R";
  /** PQ charge X. */
  pq: RationalInput;
  /** Number of copies (generations). @default 1 */
  copies?: number;
  name?: string;
}
