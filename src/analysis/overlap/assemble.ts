// Turning the raw interval lists in ln m into the reported ones: optional gap bridging, conversion to eV.
import { bridgeGaps, subtractFlat, unionFlat, unionUnsorted, type Flat } from "./intervals";
import type { Interval, OverlapDetail } from "./types";

export interface Raw {
  whole: Flat;
  part: Flat;
  gaps: Flat;
}

export function finish(
  whole: Flat,
  touch: Flat,
  merge: boolean,
  bridge: (lo: number, hi: number) => boolean,
  lineOnly = false,
): Raw {
  if (!merge) return { whole, part: lineOnly ? [] : subtractFlat(touch, whole), gaps: [] };
  const w = bridgeGaps(whole, bridge);
  if (lineOnly) return { whole: w.merged, part: [], gaps: w.gaps };
  const t = bridgeGaps(touch, bridge);
  // A bridged gap of `whole` may hold a narrower gap of `touch` that was not bridged; whole must stay in touch.
  const touched = unionFlat(t.merged, w.merged);
  return { whole: w.merged, part: subtractFlat(touched, w.merged), gaps: unionUnsorted([...w.gaps, ...t.gaps]) };
}

function toIntervals(flat: Flat, toMass: (x: number) => number): Interval[] {
  const out: Interval[] = [];
  for (let i = 0; i < flat.length; i += 2) {
    const lo = toMass(flat[i]);
    const hi = toMass(flat[i + 1]);
    if (hi > lo) out.push([lo, hi]);
  }
  return out;
}

export function assemble(
  raw: Raw,
  range: [number, number],
  toMass: (x: number) => number,
  partEOverN: [number, number][][],
  throughout: [number, number][][] | null,
  cancels: boolean,
  line: boolean,
  skipped: number,
): OverlapDetail {
  const whole = toIntervals(raw.whole, toMass);
  // Keep partEOverN aligned with the intervals that survive the conversion to eV.
  const part: Interval[] = [];
  const partE: [number, number][][] = [];
  const partT: [number, number][][] = [];
  for (let i = 0; i < raw.part.length; i += 2) {
    const lo = toMass(raw.part[i]);
    const hi = toMass(raw.part[i + 1]);
    if (hi > lo) {
      part.push([lo, hi]);
      partE.push(partEOverN[i / 2]);
      if (throughout) partT.push(throughout[i / 2]);
    }
  }
  const none = subtractFlat([range[0], range[1]], unionFlat(raw.whole, raw.part));
  return {
    whole,
    part,
    partEOverN: partE,
    partEOverNThroughout: throughout ? partT : null,
    none: toIntervals(none, toMass),
    massRangeEv: [toMass(range[0]), toMass(range[1])],
    cancels,
    line,
    bridgedGapsEv: toIntervals(raw.gaps, toMass),
    skippedPoints: skipped,
  };
}
