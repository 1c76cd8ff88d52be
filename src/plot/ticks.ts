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

/** What the tick helpers share: the range, its logs and the label measures. */
interface TickAxis {
  lo: number;
  hi: number;
  l0: number;
  eHi: number;
  ppd: number;
  gap: number;
  format: (value: number) => TextRun[];
  extent: (runs: TextRun[]) => number;
  inRange: (v: number) => boolean;
}

/** A major tick at every decade in range, labelled at multiples of a step chosen so labels do not collide. */
function decadeTicks(ax: TickAxis, eLo: number): LogTick[] {
  const { format, ppd } = ax;
  const decades: number[] = [];
  for (let e = eLo; e <= ax.eHi; e++) decades.push(e);
  let maxExtent = 0;
  for (const e of decades) maxExtent = Math.max(maxExtent, ax.extent(format(decade(e))));
  const needPx = maxExtent + ax.gap;
  const minStep = Math.max(decadeLabelStep(Math.log10(ax.hi) - ax.l0), ppd > 0 ? needPx / ppd : 1);
  const step = STEPS.find((s) => s >= minStep - EPS) ?? Math.ceil(minStep);
  const labelled = (e: number) => ((e % step) + step) % step === 0;
  return decades.map((e) => {
    const v = decade(e);
    return { value: v, major: true, label: labelled(e) ? format(v) : null };
  });
}

/** The first set of multipliers (2 and 5, all of 2…9, …) whose labels in range all fit; empty when none does. */
function extraLabelSet(ax: TickAxis): Set<number> {
  const { format, ppd } = ax;
  for (const set of [[2, 5], [2, 3, 4, 5, 6, 7, 8, 9], [3], [2], [5]]) {
    const values: number[] = [];
    for (let e = Math.floor(ax.l0) - 1; e <= ax.eHi; e++) for (const k of [1, ...set]) values.push(k * decade(e));
    const shown = values.filter(ax.inRange).sort((a, b) => a - b);
    if (shown.length < 2) continue;
    let fits = true;
    for (let i = 1; i < shown.length && fits; i++) {
      const dist = ppd * Math.log10(shown[i] / shown[i - 1]);
      const need = (ax.extent(format(shown[i])) + ax.extent(format(shown[i - 1]))) / 2 + ax.gap;
      if (dist < need) fits = false;
    }
    if (fits) return new Set(set);
  }
  return new Set<number>();
}

/** Minor ticks at 2…9 × 10^e (when they fit), labelled at the multipliers in `extra`. */
function addMinorTicks(ticks: LogTick[], ax: TickAxis, minorsFit: boolean, extra: Set<number>): void {
  for (let e = Math.floor(ax.l0); e <= ax.eHi; e++) {
    for (let k = 2; k <= 9; k++) {
      const v = k * decade(e);
      if (!ax.inRange(v)) continue;
      const lab = extra.has(k);
      if (lab || minorsFit) ticks.push({ value: v, major: false, label: lab ? ax.format(v) : null });
    }
  }
}

/** Labels `values` left to right, each where it does not run into the previous one. */
function greedyLabels(ax: TickAxis, values: number[]): Map<number, TextRun[]> {
  const chosen = new Map<number, TextRun[]>();
  let prevPx = -Infinity;
  let prevHalf = 0;
  for (const v of values) {
    const runs = ax.format(v);
    const half = ax.extent(runs) / 2;
    const px = ax.ppd * Math.log10(v / ax.lo);
    if (px - prevPx >= prevHalf + half + ax.gap) {
      chosen.set(v, runs);
      prevPx = px;
      prevHalf = half;
    }
  }
  return chosen;
}

/**
 * Very narrow range: D3's log ticks (linear inside the decade) for a few tick counts, each labelled greedily;
 * the count that gives the most labels wins and, with at least two, replaces the labels of `ticks`.
 */
function relabelNarrowRange(ticks: LogTick[], ax: TickAxis): void {
  let best = new Map<number, TextRun[]>();
  let bestValues: number[] = [];
  for (const n of [2, 3, 4, 6, 8, 12, 16, 24]) {
    const values = scaleLog().domain([ax.lo, ax.hi]).ticks(n).filter(ax.inRange);
    const chosen = greedyLabels(ax, values);
    if (chosen.size > best.size) {
      best = chosen;
      bestValues = values;
    }
  }
  if (best.size < 2) return;
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

/**
 * Ticks of a log axis over [lo, hi] (ascending, > 0). Major ticks at every decade; a decade is labelled when
 * its exponent is a multiple of the label step (so labels stay put while panning). With fewer than two
 * labelled decades, labels at 2× and 5× are added when they fit, and for a very narrow range D3's log ticks
 * (linear inside the decade) are used.
 */
export function logTicks(lo: number, hi: number, opts: LogTickOpts): LogTick[] {
  if (!(lo > 0 && hi > lo && Number.isFinite(hi))) return [];
  const l0 = Math.log10(lo);
  const l1 = Math.log10(hi);
  const ax: TickAxis = {
    lo,
    hi,
    l0,
    eHi: Math.floor(l1 + EPS),
    ppd: opts.pxPerDecade,
    gap: opts.labelGapPx ?? 4,
    format: opts.format ?? scientificRuns,
    extent: opts.labelExtentPx,
    inRange: (v: number) => v >= lo * (1 - EPS) && v <= hi * (1 + EPS),
  };
  const ticks = decadeTicks(ax, Math.ceil(l0 - EPS));
  const labelCount = ticks.filter((t) => t.label).length;
  // Minor ticks at 2…9 × 10^e, and on narrow ranges labels at some of them.
  const minorsFit = ax.ppd * Math.log10(10 / 9) >= (opts.minorMinSpacingPx ?? 2);
  const extra = labelCount < 2 ? extraLabelSet(ax) : new Set<number>();
  if (minorsFit || extra.size) addMinorTicks(ticks, ax, minorsFit, extra);
  if (ticks.filter((t) => t.label).length < 2) relabelNarrowRange(ticks, ax);
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
