// The heavy-quark representations an ensemble is built from, with E and N from the anomaly calculator (never typed
// in) scaled to integers over a common denominator, and their shares of the gauge running.
import { anomaly } from "../anomaly";
import { DLMN_REPS, type HeavyQuarkRep } from "../catalogue";
import { runningShare, type RunningShare } from "./running";

/** One representation ready for enumeration. */
export interface EnsembleRep {
  tag: string;
  rep: HeavyQuarkRep;
  /** E·eScale and N·nScale, exact integers (N > 0 for X_L − X_R = +1). */
  e: number;
  n: number;
  share: RunningShare;
}

/** The representations and the common scales: E = e/eScale, N = n/nScale. */
export interface EnsembleReps {
  reps: EnsembleRep[];
  eScale: number;
  nScale: number;
}

/** The tags "R1"…"R15" of Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801, Table I. */
export const HEAVY_QUARK_TAGS: readonly string[] = DLMN_REPS.map((r) => r.tag);

function gcd(a: number, b: number): number {
  a = Math.abs(a);
  b = Math.abs(b);
  while (b) [a, b] = [b, a % b];
  return a;
}

/** One Dirac heavy quark Q_L (X = 1), Q_R (X = 0) as two Weyl multiplets for the anomaly calculator. */
export function heavyQuarkFermions(r: HeavyQuarkRep) {
  const ew = { kind: "sm" as const, dim: r.dim, y: r.y };
  return [
    { name: "Q_L", colour: r.colour, ew, chirality: "L" as const, pq: 1 },
    { name: "Q_R", colour: r.colour, ew, chirality: "R" as const, pq: 0 },
  ];
}

/** Resolve tags (default all fifteen) into integer E, N and running shares. @throws on an unknown or repeated tag. */
export function ensembleReps(tags: readonly string[] = HEAVY_QUARK_TAGS): EnsembleReps {
  if (tags.length === 0) throw new Error("heavy-quark ensemble: choose at least one representation");
  const seen = new Set<string>();
  const chosen = tags.map((t) => {
    const tag = t.trim().toUpperCase();
    const rep = DLMN_REPS.find((r) => r.tag === tag);
    if (!rep) throw new Error(`heavy-quark ensemble: unknown representation "${t}" (expected R1 … R15)`);
    if (seen.has(tag)) throw new Error(`heavy-quark ensemble: representation ${tag} is listed twice`);
    seen.add(tag);
    const res = anomaly(heavyQuarkFermions(rep));
    return { tag, rep, E: res.E, N: res.N };
  });
  let eScale = 1;
  let nScale = 1;
  for (const c of chosen) {
    eScale = (eScale / gcd(eScale, Number(c.E.d))) * Number(c.E.d);
    nScale = (nScale / gcd(nScale, Number(c.N.d))) * Number(c.N.d);
  }
  return {
    eScale,
    nScale,
    reps: chosen.map((c) => ({
      tag: c.tag,
      rep: c.rep,
      e: c.E.mul(eScale).valueOf(),
      n: c.N.mul(nScale).valueOf(),
      share: runningShare(c.rep.colour, c.rep.dim, c.rep.y),
    })),
  };
}

export { gcd };
