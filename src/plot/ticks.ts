// Tick values and labels of log axes: a tick at every decade, labels thinned on wide ranges, 2 and 5 added
// on narrow ones, minor ticks at 2…9; the top axes (f_a decreasing to the right, frequency with SI prefix).
import { scaleLog } from "d3-scale";
import { PLANCK_EV_S, type AxionConstants } from "../physics/constants";
import type { TextRun } from "./scene-types";
import { plainOrScientificRuns, scientificRuns } from "./format";

/** One tick: its value in axis units, whether it is a major tick, and its label (null = unlabelled). */
export interface LogTick {
  value: number;
  major: boolean;
  label: TextRun[] | null;
}

export interface LogTickOpts {
  /** Length of one decade along the axis, px (> 0). */
  pxPerDecade: number;
  /** Space one label needs along the axis, px (its width on a horizontal axis, its height on a vertical one). */
  labelExtentPx: (runs: TextRun[]) => number;
  /** Free space between neighbouring labels, px. @default 4 */
  labelGapPx?: number;
  /** Label text of a value. @default scientificRuns (10⁻⁶, 2×10⁻⁶) */
  format?: (value: number) => TextRun[];
  /** Minor ticks are dropped when 9 and 10 would be closer than this, px. @default 2 */
  minorMinSpacingPx?: number;
}

const EPS = 1e-9;
const STEPS = [1, 2, 3, 4, 5, 6, 8, 10, 12, 15, 20, 25, 30, 40, 50, 100];

function decade(e: number): number {
  return Number(`1e${e}`);
}

/** Label every `step`-th decade: 1 up to 8 decades, then 2, 3 (> 16), and ~8 labels beyond 24 (common practice). */
export function decadeLabelStep(spanDecades: number): number {
  if (spanDecades > 24) return Math.ceil(spanDecades / 8);
  if (spanDecades > 16) return 3;
  if (spanDecades > 8) return 2;
  return 1;
}

/**
 * Ticks of a log axis over [lo, hi] (ascending, > 0). Major ticks at every decade; a decade is labelled when
 * its exponent is a multiple of the label step (so labels stay put while panning). With fewer than two
 * labelled decades, labels at 2× and 5× are added when they fit, and for a very narrow range D3's log ticks
 * (linear inside the decade) are used.
 */
export function logTicks(lo: number, hi: number, opts: LogTickOpts): LogTick[] {
  if (!(lo > 0 && hi > lo && Number.isFinite(hi))) return [];
  const format = opts.format ?? scientificRuns;
  const gap = opts.labelGapPx ?? 4;
  const minorMin = opts.minorMinSpacingPx ?? 2;
  const ppd = opts.pxPerDecade;
  const l0 = Math.log10(lo);
  const l1 = Math.log10(hi);
  const span = l1 - l0;
  const inRange = (v: number) => v >= lo * (1 - EPS) && v <= hi * (1 + EPS);

  const eLo = Math.ceil(l0 - EPS);
  const eHi = Math.floor(l1 + EPS);
  const ticks: LogTick[] = [];
  const decades: number[] = [];
  for (let e = eLo; e <= eHi; e++) decades.push(e);

  let maxExtent = 0;
  for (const e of decades) maxExtent = Math.max(maxExtent, opts.labelExtentPx(format(decade(e))));
  const needPx = maxExtent + gap;
  const minStep = Math.max(decadeLabelStep(span), ppd > 0 ? needPx / ppd : 1);
  const step = STEPS.find((s) => s >= minStep - EPS) ?? Math.ceil(minStep);
  const labelled = (e: number) => ((e % step) + step) % step === 0;
  for (const e of decades) {
    const v = decade(e);
    ticks.push({ value: v, major: true, label: labelled(e) ? format(v) : null });
  }
  const labelCount = ticks.filter((t) => t.label).length;

  // Minor ticks at 2…9 × 10^e, and on narrow ranges labels at some of them.
  const minorsFit = ppd * Math.log10(10 / 9) >= minorMin;
  let extra = new Set<number>();
  if (labelCount < 2) {
    for (const set of [[2, 5], [2, 3, 4, 5, 6, 7, 8, 9], [3], [2], [5]]) {
      const values: number[] = [];
      for (let e = Math.floor(l0) - 1; e <= eHi; e++) for (const k of [1, ...set]) values.push(k * decade(e));
      const shown = values.filter(inRange).sort((a, b) => a - b);
      if (shown.length < 2) continue;
      let fits = true;
      for (let i = 1; i < shown.length && fits; i++) {
        const dist = ppd * Math.log10(shown[i] / shown[i - 1]);
        const need = (opts.labelExtentPx(format(shown[i])) + opts.labelExtentPx(format(shown[i - 1]))) / 2 + gap;
        if (dist < need) fits = false;
      }
      if (fits) {
        extra = new Set(set);
        break;
      }
    }
  }
  if (minorsFit || extra.size) {
    for (let e = Math.floor(l0); e <= eHi; e++) {
      for (let k = 2; k <= 9; k++) {
        const v = k * decade(e);
        if (!inRange(v)) continue;
        const lab = extra.has(k);
        if (lab || minorsFit) ticks.push({ value: v, major: false, label: lab ? format(v) : null });
      }
    }
  }
  if (ticks.filter((t) => t.label).length < 2) {
    // Very narrow range: D3's log ticks (linear inside the decade) for a few tick counts, each labelled
    // greedily left to right where a label does not run into the previous one; the count that gives the
    // most labels wins.
    const greedy = (values: number[]) => {
      const chosen = new Map<number, TextRun[]>();
      let prevPx = -Infinity;
      let prevHalf = 0;
      for (const v of values) {
        const runs = format(v);
        const half = opts.labelExtentPx(runs) / 2;
        const px = ppd * Math.log10(v / lo);
        if (px - prevPx >= prevHalf + half + gap) {
          chosen.set(v, runs);
          prevPx = px;
          prevHalf = half;
        }
      }
      return chosen;
    };
    let best = new Map<number, TextRun[]>();
    let bestValues: number[] = [];
    for (const n of [2, 3, 4, 6, 8, 12, 16, 24]) {
      const values = scaleLog().domain([lo, hi]).ticks(n).filter(inRange);
      const chosen = greedy(values);
      if (chosen.size > best.size) {
        best = chosen;
        bestValues = values;
      }
    }
    if (best.size >= 2) {
      const taken = new Map(ticks.map((t) => [t.value, t]));
      for (const t of ticks) t.label = null;
      for (const v of bestValues) {
        let tick = taken.get(v);
        if (!tick) {
          tick = { value: v, major: false, label: null };
          ticks.push(tick);
          taken.set(v, tick);
        }
        tick.label = best.get(v) ?? null;
      }
    }
  }
  return ticks.sort((a, b) => a.value - b.value);
}

/** f_a range in GeV over a mass range in eV: f_a = K·10⁶/m, so the ends swap. */
export function faDomain(massDomainEv: readonly [number, number], c: AxionConstants): [number, number] {
  return [(c.kMuEv * 1e6) / massDomainEv[1], (c.kMuEv * 1e6) / massDomainEv[0]];
}

/** Ticks of the f_a [GeV] top axis (values in GeV, labels as powers of ten). */
export function faTicks(
  massDomainEv: readonly [number, number],
  c: AxionConstants,
  opts: Omit<LogTickOpts, "format">,
): LogTick[] {
  const [lo, hi] = faDomain(massDomainEv, c);
  return logTicks(lo, hi, { ...opts, format: scientificRuns });
}

const PREFIXES = ["", "k", "M", "G", "T", "P"] as const;
export type SiPrefix = (typeof PREFIXES)[number];

/** Unit of the frequency axis: an SI prefix with plain labels, or Hz with powers of ten on wide ranges. */
export interface FrequencyUnit {
  prefix: SiPrefix;
  /** Hz per label unit (10^(3·prefix index)). */
  hzPerUnit: number;
  /** Plain labels ("1", "10", "100") when true, powers of ten when false. */
  plain: boolean;
  /** "GHz", "Hz", … */
  unit: string;
}

/**
 * The SI prefix for a visible frequency range: over ≤ 5 decades the prefix that puts the middle of the range
 * near 10–100 units (labels "1", "10", "100"); wider ranges or ones beyond Hz…PHz use Hz with powers of ten.
 */
export function frequencyUnit(loHz: number, hiHz: number): FrequencyUnit {
  const l0 = Math.log10(loHz);
  const l1 = Math.log10(hiHz);
  const p = Math.round(((l0 + l1) / 2 - 1.5) / 3);
  if (!(l1 - l0 <= 5) || p < 0 || p >= PREFIXES.length) return { prefix: "", hzPerUnit: 1, plain: false, unit: "Hz" };
  return { prefix: PREFIXES[p], hzPerUnit: decade(3 * p), plain: true, unit: `${PREFIXES[p]}Hz` };
}

/** Frequency range ν = m/h in Hz over a mass range in eV. */
export function frequencyDomain(massDomainEv: readonly [number, number]): [number, number] {
  return [massDomainEv[0] / PLANCK_EV_S, massDomainEv[1] / PLANCK_EV_S];
}

/** Ticks of the frequency top axis: values in Hz, labels in the chosen unit. */
export function frequencyTicks(
  massDomainEv: readonly [number, number],
  opts: Omit<LogTickOpts, "format">,
): { unit: FrequencyUnit; ticks: LogTick[] } {
  const [lo, hi] = frequencyDomain(massDomainEv);
  const unit = frequencyUnit(lo, hi);
  const format = unit.plain
    ? (v: number) => plainOrScientificRuns(v / unit.hzPerUnit)
    : (v: number) => scientificRuns(v);
  return { unit, ticks: logTicks(lo, hi, { ...opts, format }) };
}
