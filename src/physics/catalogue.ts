// The catalogue: ready-made KSVZ-type and DFSZ-type models given by their field content only; E/N and N_DW
// always come from the anomaly calculator, never from typed-in numbers.
import type { ElectroweakInput, FermionInput } from "./anomaly-types";
import type { ScalarInput } from "./charges/types";

/** One ready-made model. */
export interface CatalogueEntry {
  id: string;
  label: string;
  fermions: FermionInput[];
  /** PQ charge X_S of the scalar whose VEV sets f_a (for N_DW = |2N/X_S|). */
  scalarCharge: string | number;
  note?: string;
  group: "ksvz" | "dfsz";
  /** The scalars and the kept and forbidden terms (term syntax of ./charges/syntax.ts) the charges follow from. */
  lagrangian: { scalars: ScalarInput[]; terms: string[]; forbidden: string[]; normalize: string };
}

const SINGLET: ElectroweakInput = { kind: "sm", dim: 1, y: "0" };
const PHI: ScalarInput = { name: "Phi", ew: SINGLET };

/** A heavy quark representation (colour, SU(2)_L dimension, hypercharge) as in the heavy-quark tables. */
export interface HeavyQuarkRep {
  tag: string;
  colour: string;
  dim: number;
  y: string;
}

// Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801, Table I: the fifteen single representations R1…R15.
export const DLMN_REPS: HeavyQuarkRep[] = [
  { tag: "R1", colour: "3", dim: 1, y: "-1/3" },
  { tag: "R2", colour: "3", dim: 1, y: "2/3" },
  { tag: "R3", colour: "3", dim: 2, y: "1/6" },
  { tag: "R4", colour: "3", dim: 2, y: "-5/6" },
  { tag: "R5", colour: "3", dim: 2, y: "7/6" },
  { tag: "R6", colour: "3", dim: 3, y: "-1/3" },
  { tag: "R7", colour: "3", dim: 3, y: "2/3" },
  { tag: "R8", colour: "3", dim: 3, y: "-4/3" },
  { tag: "R9", colour: "6bar", dim: 1, y: "-1/3" },
  { tag: "R10", colour: "6bar", dim: 1, y: "2/3" },
  { tag: "R11", colour: "6bar", dim: 2, y: "1/6" },
  { tag: "R12", colour: "8", dim: 1, y: "-1" },
  { tag: "R13", colour: "8", dim: 2, y: "-1/2" },
  { tag: "R14", colour: "15", dim: 1, y: "-1/3" },
  { tag: "R15", colour: "15", dim: 1, y: "2/3" },
];

const COLOUR_LABEL: Record<string, string> = { "3": "3", "6bar": "6̄", "8": "8", "15": "15" };

function repLabel(r: HeavyQuarkRep): string {
  return `(${COLOUR_LABEL[r.colour] ?? r.colour}, ${r.dim}, ${r.y.replace("-", "−")})`;
}

/**
 * KSVZ-type: one vector-like heavy quark Q = Q_L + Q_R with the Yukawa coupling Φ Q̄_L Q_R, so
 * X_L − X_R = X_Φ. With X_Φ = X_S = 1 we take X_L = 1, X_R = 0; N_DW = 2·T(R_c)·n_w.
 */
function heavyQuark(r: HeavyQuarkRep, id: string, label: string): CatalogueEntry {
  const ew = { kind: "sm" as const, dim: r.dim, y: r.y };
  return {
    id,
    label,
    group: "ksvz",
    scalarCharge: 1,
    fermions: [
      { name: "Q_L", colour: r.colour, ew, chirality: "L", pq: 1 },
      { name: "Q_R", colour: r.colour, ew, chirality: "R", pq: 0 },
    ],
    note: `Heavy quark ${repLabel(r)}: Q_L with 𝒳 = 1, Q_R with 𝒳 = 0, scalar Φ with 𝒳_S = 1 (Yukawa Φ Q̄_L Q_R).`,
    // The Yukawa fixes X_L − X_R = X_Φ; the bare mass Q̄_L Q_R is what the PQ symmetry must forbid.
    lagrangian: { scalars: [PHI], terms: ["Qbar_L Phi Q_R"], forbidden: ["Qbar_L Q_R"], normalize: "Phi" },
  };
}

/**
 * DFSZ-type: SM fermions (three generations) and two Higgs doublets H_1 (gives down-quark masses through
 * q̄ H_1 d_R) and H_2 (up-quark masses through q̄ H̃_2 u_R), both of hypercharge 1/2, and a singlet Φ with the
 * coupling H_2† H_1 Φ†². Taking X_q = X_l = 0, the Yukawas fix X(u_R) = −X_u and X(d_R) = −X_d with
 * X_u = −X(H_2), X_d = X(H_1), and the Φ†² term gives X_u + X_d = 2 X_Φ. We use X_u = X_d = 1, X_S = X_Φ = 1;
 * E/N does not depend on the split. Leptons either couple like down quarks (l̄ H_1 e_R: X(e_R) = −X_d) or
 * through H_2 as down quarks do through H_1 (l̄ H_2 e_R: X(e_R) = X_u).
 */
function dfsz(id: string, label: string, leptonsLike: "down" | "up"): CatalogueEntry {
  const xu = 1;
  const xd = 1;
  const xeR = leptonsLike === "down" ? -xd : xu;
  const fermions: FermionInput[] = [
    { name: "q_L", colour: "3", ew: { kind: "sm", dim: 2, y: "1/6" }, chirality: "L", pq: 0, copies: 3 },
    { name: "u_R", colour: "3", ew: { kind: "sm", dim: 1, y: "2/3" }, chirality: "R", pq: -xu, copies: 3 },
    { name: "d_R", colour: "3", ew: { kind: "sm", dim: 1, y: "-1/3" }, chirality: "R", pq: -xd, copies: 3 },
    { name: "l_L", colour: "1", ew: { kind: "sm", dim: 2, y: "-1/2" }, chirality: "L", pq: 0, copies: 3 },
    { name: "e_R", colour: "1", ew: { kind: "sm", dim: 1, y: "-1" }, chirality: "R", pq: xeR, copies: 3 },
  ];
  const lepton =
    leptonsLike === "down"
      ? "leptons couple to H_1 like down quarks (l̄ H_1 e_R), 𝒳(e_R) = −1"
      : "leptons couple to H_2, the doublet of the up quarks (l̄ H_2 e_R), 𝒳(e_R) = +1";
  return {
    id,
    label,
    group: "dfsz",
    scalarCharge: 1,
    fermions,
    note:
      "Three SM generations, two Higgs doublets and a singlet Φ (𝒳_S = 1) coupled as H_2† H_1 Φ†²; " +
      `𝒳(q_L) = 𝒳(l_L) = 0, 𝒳(u_R) = 𝒳(d_R) = −1; ${lepton}.`,
    lagrangian: {
      scalars: [
        { name: "H1", ew: { kind: "sm", dim: 2, y: "1/2" } },
        { name: "H2", ew: { kind: "sm", dim: 2, y: "1/2" } },
        PHI,
      ],
      // H̃₂ = iσ₂H₂* carries the charges of H₂†; the portal with Φ†² (not Φ†) gives N_DW = 6.
      terms: [
        "qbar_L H1 d_R",
        "qbar_L H2^† u_R",
        leptonsLike === "down" ? "lbar_L H1 e_R" : "lbar_L H2 e_R",
        "H2^† H1 Phi^†2",
      ],
      forbidden: ["H2^† H1", "H2^† H1 Phi^†"],
      normalize: "Phi",
    },
  };
}

/** Every ready-made model, in display order: the neutral heavy quark, R1…R15, then the two DFSZ-type models. */
export function catalogue(): CatalogueEntry[] {
  return [
    heavyQuark({ tag: "R0", colour: "3", dim: 1, y: "0" }, "ksvz-3-1-0", "KSVZ-type heavy quark (3, 1, 0)"),
    ...DLMN_REPS.map((r) =>
      heavyQuark(r, `ksvz-${r.tag.toLowerCase()}`, `KSVZ-type ${r.tag}: heavy quark ${repLabel(r)}`),
    ),
    dfsz("dfsz-i", "DFSZ-type I (leptons like down quarks)", "down"),
    dfsz("dfsz-ii", "DFSZ-type II (leptons like up quarks)", "up"),
  ];
}
