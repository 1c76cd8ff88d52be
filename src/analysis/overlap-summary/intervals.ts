// Building a row's interval list from the overlap core's whole and partial intervals (eV), with the E/N covered
// in each, and the shares and counts read from it.
import type { Interval, OverlapDetail } from "../overlap";
import type { EOverNCover, IntervalList } from "./types";

/** One covered stretch while it is being built. */
export interface Group {
  lo: number;
  hi: number;
  /** log-length covered wholly. */
  wholeLn: number;
  eOverN: [number, number][];
  members: number;
  bridged: boolean;
}

function lnWidth(lo: number, hi: number): number {
  return Math.log(hi / lo);
}

/** Adds E/N pieces to an ascending list of at most two pieces (merging overlaps; a third joins the nearest). */
export function addPieces(list: [number, number][], pieces: readonly [number, number][]): void {
  for (const [a, b] of pieces) {
    list.push([a, b]);
    list.sort((p, q) => p[0] - q[0]);
    for (let i = 0; i + 1 < list.length;) {
      if (list[i + 1][0] <= list[i][1]) {
        list[i][1] = Math.max(list[i][1], list[i + 1][1]);
        list.splice(i + 1, 1);
      } else i++;
    }
    while (list.length > 2) {
      // Keep two pieces: join the closest neighbours (a band straddling c_γ has exactly two).
      let k = 0;
      for (let i = 1; i + 1 < list.length; i++) if (list[i + 1][0] - list[i][1] < list[k + 1][0] - list[k][1]) k = i;
      list[k][1] = list[k + 1][1];
      list.splice(k + 1, 1);
    }
  }
}

/** Groups touching whole and partial intervals into covered stretches (each with its whole share and E/N). */
export function groupDetail(d: OverlapDetail): Group[] {
  const items: { lo: number; hi: number; whole: boolean; e: [number, number][] }[] = [];
  for (const [lo, hi] of d.whole) items.push({ lo, hi, whole: true, e: [] });
  d.part.forEach(([lo, hi], q) => items.push({ lo, hi, whole: false, e: d.partEOverN[q] ?? [] }));
  items.sort((a, b) => a.lo - b.lo);
  const out: Group[] = [];
  for (const it of items) {
    let g = out[out.length - 1];
    if (!g || it.lo > g.hi) {
      g = { lo: it.lo, hi: it.hi, wholeLn: 0, eOverN: [], members: 0, bridged: false };
      out.push(g);
    }
    g.hi = Math.max(g.hi, it.hi);
    if (it.whole) g.wholeLn += lnWidth(it.lo, it.hi);
    else addPieces(g.eOverN, it.e);
  }
  return out;
}

/** Adds bridged gaps as their own stretches, in mass order. */
export function withBridged(groups: Group[], gaps: Interval[]): Group[] {
  if (gaps.length === 0) return groups;
  const extra = gaps.map(([lo, hi]) => ({ lo, hi, wholeLn: 0, eOverN: [], members: 0, bridged: true }));
  return [...groups, ...extra].sort((a, b) => a.lo - b.lo);
}

/** Packs the stretches into typed arrays. */
export function packGroups(groups: Group[]): IntervalList {
  const n = groups.length;
  const list: IntervalList = {
    count: n,
    lo: new Float64Array(n),
    hi: new Float64Array(n),
    whole: new Float64Array(n),
    eOverN: new Float64Array(4 * n).fill(NaN),
    members: new Float64Array(n),
    bridged: new Uint8Array(n),
  };
  groups.forEach((g, i) => {
    list.lo[i] = g.lo;
    list.hi[i] = g.hi;
    const w = lnWidth(g.lo, g.hi);
    list.whole[i] = w > 0 ? Math.min(1, g.wholeLn / w) : 0;
    g.eOverN.slice(0, 2).forEach(([a, b], k) => {
      list.eOverN[4 * i + 2 * k] = a;
      list.eOverN[4 * i + 2 * k + 1] = b;
    });
    list.members[i] = g.members;
    list.bridged[i] = g.bridged ? 1 : 0;
  });
  return list;
}

/** The E/N covered in interval i: "all" when the whole band is somewhere in it. */
export function intervalEOverN(list: IntervalList, i: number): EOverNCover {
  if (list.whole[i] > 0) return "all";
  const out: [number, number][] = [];
  for (let k = 0; k < 2; k++) {
    const a = list.eOverN[4 * i + 2 * k];
    if (!Number.isNaN(a)) out.push([a, list.eOverN[4 * i + 2 * k + 1]]);
  }
  return out;
}

/** Shares of the range (log m) and the widest stretch, over the stretches that are not bridged gaps. */
export function measure(groups: Group[], range: Interval) {
  const total = lnWidth(range[0], range[1]);
  let whole = 0;
  let any = 0;
  let count = 0;
  let widest: Group | null = null;
  for (const g of groups) {
    if (g.bridged) continue;
    count++;
    whole += g.wholeLn;
    any += lnWidth(g.lo, g.hi);
    if (!widest || lnWidth(g.lo, g.hi) > lnWidth(widest.lo, widest.hi)) widest = g;
  }
  return {
    shareWhole: total > 0 ? whole / total : 0,
    shareAny: total > 0 ? any / total : 0,
    count,
    widestEv: widest ? ([widest.lo, widest.hi] as [number, number]) : null,
  };
}
