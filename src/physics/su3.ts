// SU(3) irreps for the anomaly calculator: Dynkin labels (p, q), dimension, quadratic Casimir and Dynkin index,
// and the parser that turns what a user types for a colour representation ("3bar", "15'", "(2,1)") into labels.
import Fraction from "fraction.js";

/** An SU(3) irrep by Dynkin labels: p fundamental and q antifundamental indices. */
export interface Su3Irrep {
  p: number;
  q: number;
}

/** Outcome of reading a colour representation. */
export type ColourParse = { ok: true; irrep: Su3Irrep; name: string } | { ok: false; reason: string };

function assertLabels(p: number, q: number): void {
  if (!Number.isSafeInteger(p) || !Number.isSafeInteger(q) || p < 0 || q < 0) {
    throw new RangeError(`SU(3) Dynkin labels must be non-negative integers, got (${p},${q})`);
  }
}

/** Dimension d(p,q) = (p+1)(q+1)(p+q+2)/2 of the SU(3) irrep with Dynkin labels (p, q). */
export function su3Dimension(p: number, q: number): number {
  assertLabels(p, q);
  return ((p + 1) * (q + 1) * (p + q + 2)) / 2;
}

/** Quadratic Casimir C₂(p,q) = (p² + q² + pq + 3p + 3q)/3, exact (C₂(3) = 4/3, C₂(8) = 3). */
export function su3Casimir(p: number, q: number): Fraction {
  assertLabels(p, q);
  return new Fraction(p * p + q * q + p * q + 3 * p + 3 * q, 3);
}

/**
 * Dynkin index T(p,q) = d·C₂/8 in the normalisation T(3) = 1/2 (8 = dimension of the adjoint), exact.
 * Slansky, Phys. Rept. 79 (1981) 1 tabulates ℓ = 2T.
 */
export function su3Index(p: number, q: number): Fraction {
  return su3Casimir(p, q).mul(su3Dimension(p, q)).div(8);
}

// Names in the usual dimension notation; conjugates carry "bar". The primed 15 is (4,0), the unprimed (2,1).
const NAMED: Record<string, Su3Irrep> = {
  "1": { p: 0, q: 0 },
  "3": { p: 1, q: 0 },
  "3bar": { p: 0, q: 1 },
  "6": { p: 2, q: 0 },
  "6bar": { p: 0, q: 2 },
  "8": { p: 1, q: 1 },
  "10": { p: 3, q: 0 },
  "10bar": { p: 0, q: 3 },
  "15": { p: 2, q: 1 },
  "15bar": { p: 1, q: 2 },
  "15'": { p: 4, q: 0 },
  "15'bar": { p: 0, q: 4 },
  "27": { p: 2, q: 2 },
};

/** The shortcut names parseColour understands, in display order (Object.keys would put "1", "3"… first). */
export const COLOUR_NAMES: readonly string[] = [
  "1",
  "3",
  "3bar",
  "6",
  "6bar",
  "8",
  "10",
  "10bar",
  "15",
  "15bar",
  "15'",
  "15'bar",
  "27",
];

/** Largest Dynkin label accepted: keeps d(p,q)·C₂ far inside the exact range of doubles. */
const MAX_LABEL = 1000;

/** Display name of an irrep: its shortcut name when it has one, else "(p,q)". */
export function colourName(irrep: Su3Irrep): string {
  for (const [name, r] of Object.entries(NAMED)) if (r.p === irrep.p && r.q === irrep.q) return name;
  return `(${irrep.p},${irrep.q})`;
}

/**
 * Read a colour representation: Dynkin labels {p, q}, a name ("1", "3", "3bar", "6", "6bar", "8", "10",
 * "10bar", "15", "15bar", "15'", "15'bar", "27"), a label string "(2,1)" or "2,1", or a name with an
 * overline ("3̄", "6̄") or "*" for the conjugate.
 */
export function parseColour(input: unknown): ColourParse {
  if (typeof input === "object" && input !== null) {
    const { p, q } = input as { p?: unknown; q?: unknown };
    if (
      typeof p !== "number" ||
      typeof q !== "number" ||
      !Number.isSafeInteger(p) ||
      !Number.isSafeInteger(q) ||
      p < 0 ||
      q < 0
    ) {
      return { ok: false, reason: `(${String(p)},${String(q)}) is not a pair of non-negative integer Dynkin labels` };
    }
    if (p > MAX_LABEL || q > MAX_LABEL)
      return { ok: false, reason: `(${p},${q}) has a Dynkin label above ${MAX_LABEL}` };
    return { ok: true, irrep: { p, q }, name: colourName({ p, q }) };
  }
  if (typeof input === "number") return parseColour(String(input));
  if (typeof input !== "string") return { ok: false, reason: "is missing" };
  if (input.trim() === "") return { ok: false, reason: "is empty" };
  // Combining overline/macron (3̄) and a trailing "*" both mean the conjugate; ’ and ′ stand for the prime.
  const text = input
    .trim()
    .replace(/\s+/g, "")
    .replace(/[\u2019\u2032]/g, "'")
    .replace(/[\u0304\u0305]/g, "bar")
    .replace(/\*$/, "bar")
    .toLowerCase();
  const labels = /^\(?(\d+),(\d+)\)?$/.exec(text);
  if (labels) return parseColour({ p: Number(labels[1]), q: Number(labels[2]) });
  // "3bar'" and "15bar'" are the same as "15'bar".
  const named = NAMED[text] ?? NAMED[text.replace(/^(\d+)bar'$/, "$1'bar")];
  if (named) return { ok: true, irrep: { ...named }, name: colourName(named) };
  return {
    ok: false,
    reason: `"${input}" is not a known SU(3) representation (use ${COLOUR_NAMES.join(", ")} or Dynkin labels "(p,q)")`,
  };
}
