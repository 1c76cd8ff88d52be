// Model sets (discrete E/N values with multiplicities): the band between their extreme lines and the central
// band holding a chosen share of the models, both in |E/N − c_γ|, the quantity g_aγγ is proportional to.
import { resolveConstants, type PhysicsOpts } from "./constants";

/** One E/N value of a set and how many models share it. */
export interface SetMemberValue {
  eOverN: number;
  count: number;
}

/** The central band of a set: its |E/N − c_γ| range, the members it holds and how many models that is. */
export interface CentralBand {
  /** Smallest and largest |E/N − c_γ| (at the central c_γ) of the members held. */
  nMin: number;
  nMax: number;
  /** E/N of the members held, ascending in |E/N − c_γ| (to draw as a between-lines band, with any spread). */
  values: number[];
  /** Models held and models in the set, counted with multiplicities. */
  held: number;
  total: number;
}

/**
 * The central band of a model set: the narrowest window in x = |E/N − c_γ| (at the central c_γ, width
 * x_max − x_min) that holds at least ⌈share · total⌉ of the models, counted with multiplicities. Among windows
 * of equal width the one nearest c_γ wins. Windows are taken over the sorted x of the members, so a band
 * holds every member whose x lies inside it; members on both sides of c_γ with similar |E/N − c_γ| fall in
 * one window, as their lines coincide on the figure. Members with a count ≤ 0 or a non-finite E/N are ignored.
 * Linear in the number of members after the sort. Returns null when no member remains.
 * @param share 0 < share ≤ 1 (clamped into that range)
 */
export function centralBand(
  members: readonly SetMemberValue[],
  share: number,
  opts: PhysicsOpts = {},
): CentralBand | null {
  const cGamma = resolveConstants(opts).cGamma;
  const xs = members
    .filter((m) => Number.isFinite(m.eOverN) && m.count > 0)
    .map((m) => ({ x: Math.abs(m.eOverN - cGamma), e: m.eOverN, n: m.count }))
    .sort((a, b) => a.x - b.x);
  if (xs.length === 0) return null;
  const total = xs.reduce((s, m) => s + m.n, 0);
  const s = Math.min(1, Math.max(share, Number.MIN_VALUE));
  // The relative guard keeps 0.68 · 100 = 68.00000000000001 from asking for 69 models.
  const need = Math.max(1, Math.ceil(s * total * (1 - 1e-12)));
  let best = { j: 0, k: xs.length - 1, width: Infinity, held: total };
  let held = 0;
  let k = -1;
  for (let j = 0; j < xs.length; j++) {
    while (held < need && k < xs.length - 1) held += xs[++k].n;
    if (held < need) break;
    const width = xs[k].x - xs[j].x;
    if (width < best.width) best = { j, k, width, held };
    held -= xs[j].n;
  }
  const inside = xs.slice(best.j, best.k + 1);
  return {
    nMin: inside[0].x,
    nMax: inside[inside.length - 1].x,
    values: inside.map((m) => m.e),
    held: best.held,
    total,
  };
}
