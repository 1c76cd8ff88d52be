// Tick values and labels of log axes: a tick at every decade, labels thinned on wide ranges, 1-2-5, 1…9 or
// linear steps on narrow ones, minor ticks at 2…9; the top axes (f_a decreasing to the right, frequency in Hz…THz).
import { ticks as d3ticks } from "d3-array";
import { scaleLog } from "d3-scale";
import type { AxionConstants } from "../physics/constants";
import {
  FREQUENCY_AXIS_UNITS,
  massFromEv,
  massUnitInfo,
  type AxisMassUnit,
  type FrequencyAxisUnit,
} from "../physics/units";
import { pow10Of } from "../physics/pow10";
import type { FrequencyUnitSetting } from "../project/types";
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
  for (const e of decades) maxExtent = Math.max(maxExtent, ax.extent(format(pow10Of(e))));
  const needPx = maxExtent + ax.gap;
  const minStep = Math.max(decadeLabelStep(Math.log10(ax.hi) - ax.l0), ppd > 0 ? needPx / ppd : 1);
  const step = STEPS.find((s) => s >= minStep - EPS) ?? Math.ceil(minStep);
  const labelled = (e: number) => ((e % step) + step) % step === 0;
  return decades.map((e) => {
    const v = pow10Of(e);
    return { value: v, major: true, label: labelled(e) ? format(v) : null };
  });
}

/** Minor ticks at 2…9 × 10^e, unlabelled. */
function addMinorTicks(ticks: LogTick[], ax: TickAxis): void {
  for (let e = Math.floor(ax.l0); e <= ax.eHi; e++)
    for (let k = 2; k <= 9; k++) {
      const v = k * pow10Of(e);
      if (ax.inRange(v)) ticks.push({ value: v, major: false, label: null });
    }
}

/** Whether labels at `values` (ascending) all fit side by side with the gap between them. */
function allFit(ax: TickAxis, values: readonly number[]): boolean {
  for (let i = 1; i < values.length; i++) {
    const dist = ax.ppd * Math.log10(values[i] / values[i - 1]);
    if (dist < (ax.extent(ax.format(values[i])) + ax.extent(ax.format(values[i - 1]))) / 2 + ax.gap) return false;
  }
  return true;
}

/** Multipliers of 10^k labelled on a range under about two decades, sparse to dense (common practice). */
const LABEL_SETS = [
  [1, 2, 5],
  [1, 2, 3, 5],
  [1, 2, 3, 4, 5, 6, 7, 8, 9],
];
/** Enough labels to read a zoomed axis: stop densifying here. */
const WANT_LABELS = 4;

/** k·10^e in range for the multipliers k of `set`, ascending. */
function multiplesInRange(ax: TickAxis, set: readonly number[]): number[] {
  const values: number[] = [];
  for (let e = Math.floor(ax.l0); e <= ax.eHi; e++) for (const k of set) values.push(k * pow10Of(e));
  return values.filter(ax.inRange);
}

/**
 * Label values for a narrow range: the sparsest of 1-2-5, 1-2-3-5 and 1…9 that gives {@link WANT_LABELS}
 * labels which all fit (else the one giving most); under three on a range of at most a decade, linear nice
 * steps (d3-array's ticks) with at most 7 labels, all fitting; still under three, those candidates together
 * labelled left to right where each fits.
 */
function denseLabelValues(ax: TickAxis): number[] {
  let best: number[] = [];
  for (const set of LABEL_SETS) {
    const values = multiplesInRange(ax, set);
    if (values.length > best.length && allFit(ax, values)) best = values;
    if (best.length >= WANT_LABELS) return best;
  }
  // Linear steps only inside about a decade, where they read as even steps; never on a wide, short axis.
  if (best.length >= 3 || Math.log10(ax.hi / ax.lo) > 1) return best;
  for (const n of [2, 3, 4, 5, 6, 8, 10]) {
    const values = d3ticks(ax.lo, ax.hi, n).filter(ax.inRange);
    if (values.length > best.length && values.length <= 7 && allFit(ax, values)) best = values;
  }
  if (best.length >= 3) return best;
  // Still under three: the 1…9 and linear candidates together, taken left to right where each fits.
  const pool = [...multiplesInRange(ax, LABEL_SETS[2]), ...d3ticks(ax.lo, ax.hi, 10).filter(ax.inRange)];
  const greedy = [
    ...greedyLabels(
      ax,
      pool.sort((a, b) => a - b),
    ).keys(),
  ];
  return greedy.length > best.length ? greedy : best;
}

/** Puts labels on `values` only (adding unlabelled-before minor ticks where none is), clearing the others. */
function setLabels(ticks: LogTick[], ax: TickAxis, values: readonly number[]): void {
  for (const t of ticks) t.label = null;
  for (const v of values) {
    // Linear steps (3/10⁶) and minor ticks (3·10⁻⁶) may differ in the last bit: the same tick.
    let tick = ticks.find((t) => Math.abs(t.value / v - 1) < EPS);
    if (!tick) ticks.push((tick = { value: v, major: false, label: null }));
    tick.label = ax.format(v);
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
 * Last resort when no label set fits whole: D3's log ticks for a few tick counts, each labelled greedily; the
 * count that gives the most labels wins and, with at least two, replaces the labels of `ticks`.
 */
function relabelGreedy(ticks: LogTick[], ax: TickAxis): void {
  let best = new Map<number, TextRun[]>();
  for (const n of [2, 3, 4, 6, 8, 12, 16, 24]) {
    const chosen = greedyLabels(ax, scaleLog().domain([ax.lo, ax.hi]).ticks(n).filter(ax.inRange));
    if (chosen.size > best.size) best = chosen;
  }
  if (best.size >= 2) setLabels(ticks, ax, [...best.keys()]);
}

/**
 * Ticks of a log axis over [lo, hi] (ascending, > 0). Major ticks at every decade; a decade is labelled when
 * its exponent is a multiple of the label step (so labels stay put while panning). With fewer than three
 * labelled decades, labels go at 1-2-5, 1-2-3-5 or 1…9 × 10^k, or at linear nice steps on a very narrow
 * range, whichever first gives four labels that all fit; labels never overlap.
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
  if (ax.ppd * Math.log10(10 / 9) >= (opts.minorMinSpacingPx ?? 2)) addMinorTicks(ticks, ax);
  // A zoomed axis (under about two decades) gets 1-2-5, 1…9 or linear labels: at least three when they fit.
  const count = () => ticks.filter((t) => t.label).length;
  if (count() < 3) {
    const dense = denseLabelValues(ax);
    if (dense.length > count()) setLabels(ticks, ax, dense);
  }
  if (count() < 2) relabelGreedy(ticks, ax);
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

/**
 * Labels for an axis in a chosen unit: plain decimals ("0.5", "20") when the whole range lies within
 * 10⁻³…10⁵ of the unit, else powers of ten for every label, so one axis never mixes the two.
 */
function unitFormat(lo: number, hi: number): (v: number) => TextRun[] {
  return lo >= 1e-3 * (1 - EPS) && hi < 1e5 ? plainOrScientificRuns : scientificRuns;
}

/** Ticks of the mass axis: values in `unit`; eV keeps powers of ten, the other units plain labels where short. */
export function massTicks(
  massDomainEv: readonly [number, number],
  unit: AxisMassUnit,
  opts: Omit<LogTickOpts, "format">,
): LogTick[] {
  const lo = massFromEv(massDomainEv[0], unit);
  const hi = massFromEv(massDomainEv[1], unit);
  return logTicks(lo, hi, { ...opts, format: unit === "eV" ? scientificRuns : unitFormat(lo, hi) });
}

/** Unit of the frequency axis: Hz…THz with plain labels where short, or Hz with powers of ten on wide ranges. */
export interface FrequencyUnit {
  /** Hz per label unit. */
  hzPerUnit: number;
  /** Plain labels ("1", "10", "100") when true, powers of ten when false. */
  plain: boolean;
  /** "GHz", "Hz", … */
  unit: FrequencyAxisUnit;
}

/**
 * The unit for a visible frequency range: a fixed one, or ("auto") over ≤ 5 decades the prefix that puts the
 * middle of the range near 10–100 units (labels "1", "10", "100"); wider ranges or ones beyond Hz…THz use Hz
 * with powers of ten.
 */
export function frequencyUnit(loHz: number, hiHz: number, fixed: FrequencyUnitSetting = "auto"): FrequencyUnit {
  if (fixed !== "auto") {
    const hzPerUnit = pow10Of(massUnitInfo(fixed).pow10);
    return { hzPerUnit, plain: unitFormat(loHz / hzPerUnit, hiHz / hzPerUnit) !== scientificRuns, unit: fixed };
  }
  const l0 = Math.log10(loHz);
  const l1 = Math.log10(hiHz);
  const p = Math.round(((l0 + l1) / 2 - 1.5) / 3);
  const unit = FREQUENCY_AXIS_UNITS[p];
  if (!(l1 - l0 <= 5) || !unit) return { hzPerUnit: 1, plain: false, unit: "Hz" };
  return { hzPerUnit: pow10Of(3 * p), plain: true, unit };
}

/** Frequency range ν = m/h in Hz over a mass range in eV. */
export function frequencyDomain(massDomainEv: readonly [number, number]): [number, number] {
  return [massFromEv(massDomainEv[0], "Hz"), massFromEv(massDomainEv[1], "Hz")];
}

/** Ticks of the frequency top axis: values in Hz, labels in the chosen unit. */
export function frequencyTicks(
  massDomainEv: readonly [number, number],
  opts: Omit<LogTickOpts, "format">,
  fixed: FrequencyUnitSetting = "auto",
): { unit: FrequencyUnit; ticks: LogTick[] } {
  const [lo, hi] = frequencyDomain(massDomainEv);
  const unit = frequencyUnit(lo, hi, fixed);
  const format = unit.plain
    ? (v: number) => plainOrScientificRuns(v / unit.hzPerUnit)
    : (v: number) => scientificRuns(v / unit.hzPerUnit);
  return { unit, ticks: logTicks(lo, hi, { ...opts, format }) };
}
