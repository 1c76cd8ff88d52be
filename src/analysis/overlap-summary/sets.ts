// A model set against one curve: each member line is compared on its own; the set is wholly covered where all
// its members are, partly where some are, and each stretch says how many (with multiplicity) and which E/N.
import { overlapDetail, type Interval, type OverlapCurve, type OverlapModel, type OverlapOptions } from "../overlap";
import { intersectFlat, unionUnsorted, type Flat } from "../overlap/intervals";
import type { Group } from "./intervals";

function flat(list: Interval[]): Flat {
  return list.flatMap(([a, b]) => [a, b]);
}

export interface SetResult {
  groups: Group[];
  massRangeEv: Interval | null;
  skippedPoints: number;
}

/**
 * Covered stretches of a set of member lines (each with the model's theory spread) over one curve.
 * Cost: one overlap per distinct member, so a set of hundreds of E/N values costs hundreds of line overlaps.
 */
export function setGroups(
  members: { value: number; count: number }[],
  base: Omit<OverlapModel, "eOverNMin" | "eOverNMax">,
  curve: OverlapCurve,
  opts: OverlapOptions,
): SetResult {
  let whole: Flat | null = null;
  const anyPerMember: { value: number; count: number; any: Flat }[] = [];
  let massRangeEv: Interval | null = null;
  let skippedPoints = 0;
  for (const m of members) {
    const d = overlapDetail({ ...base, eOverNMin: m.value, eOverNMax: m.value }, curve, opts);
    massRangeEv = d.massRangeEv;
    skippedPoints = d.skippedPoints;
    whole = whole === null ? flat(d.whole) : intersectFlat(whole, flat(d.whole));
    anyPerMember.push({ value: m.value, count: m.count, any: unionUnsorted([...flat(d.whole), ...flat(d.part)]) });
  }
  const all = unionUnsorted(anyPerMember.flatMap((m) => m.any));
  const groups: Group[] = [];
  for (let i = 0; i < all.length; i += 2) {
    groups.push({ lo: all[i], hi: all[i + 1], wholeLn: 0, eOverN: [], members: 0, bridged: false });
  }
  // Every member's stretches and the common whole lie inside the union's stretches: one forward walk each.
  const eRange = groups.map(() => [Infinity, -Infinity]);
  for (const m of anyPerMember) {
    let j = 0;
    groups.forEach((g, i) => {
      while (j < m.any.length && m.any[j + 1] <= g.lo) j += 2;
      if (j < m.any.length && m.any[j] < g.hi) {
        g.members += m.count;
        eRange[i][0] = Math.min(eRange[i][0], m.value);
        eRange[i][1] = Math.max(eRange[i][1], m.value);
      }
    });
  }
  let j = 0;
  const w = whole ?? [];
  groups.forEach((g, i) => {
    if (g.members > 0) g.eOverN = [[eRange[i][0], eRange[i][1]]];
    while (j < w.length && w[j + 1] <= g.lo) j += 2;
    for (let q = j; q < w.length && w[q] < g.hi; q += 2) g.wholeLn += Math.log(w[q + 1] / w[q]);
  });
  return { groups, massRangeEv, skippedPoints };
}
