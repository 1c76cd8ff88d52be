// Heavy-quark ensembles: every multiset of chosen representations with up to N_Q heavy quarks, optionally kept
// only if no gauge coupling meets a Landau pole below a scale, and the spectrum of E/N they give.
import { ensembleReps, gcd, HEAVY_QUARK_TAGS, type EnsembleRep } from "./heavy-quarks";
import { landauCheck, type LandauPoleOpts } from "./running";

/** One distinct E/N of an ensemble. */
export interface EnsembleValue {
  /** Exact reduced fraction, "-64/3". */
  eOverN: string;
  count: number;
  /** Domain-wall numbers N_DW = |2N/X_S| (X_S = 1) met among the models with this E/N. */
  nDWMin: number;
  nDWMax: number;
}

export interface EnsembleOpts {
  /** Tags "R1"…"R15". @default all fifteen */
  reps?: string[];
  /** Largest number of heavy quarks N_Q. */
  maxQuarks: number;
  /** additive: X_L − X_R = +1 for every quark; signed: ±1 (couples to Φ or Φ*). @default "additive" */
  charges?: "additive" | "signed";
  /** The Landau-pole criterion: on (defaults), off (false), or its settings. @default true */
  landauPole?: boolean | LandauPoleOpts;
  /** Called now and then with the number of multisets kept so far; return true to stop early. */
  onProgress?: (multisets: number) => boolean | void;
}

export interface EnsembleResult {
  /** Models kept: multisets (additive) or charge assignments with N ≠ 0 (signed, X → −X identified). */
  models: number;
  /** Multisets of representations kept (before charge assignments). */
  multisets: number;
  distinct: EnsembleValue[];
  /** Signed only: charge assignments dropped because N = 0 (no QCD anomaly, no solution of strong CP). */
  zeroN: number;
  /** Largest number of heavy quarks met in a kept multiset. */
  largestNQ: number;
  /** True when onProgress asked to stop: the result covers part of the ensemble. */
  stopped: boolean;
}

/** Beyond this many multisets without a Landau-pole criterion the enumeration is refused. */
export const MAX_MULTISETS = 5e7;

/** Number of multisets of size k from n kinds, C(n + k − 1, k) (as a double; exact below 2^53). */
export function multisetCount(n: number, k: number): number {
  let c = 1;
  for (let i = 1; i <= k; i++) c = (c * (n - 1 + i)) / i;
  return Math.round(c);
}

/** Integer keys for raw (e, n) sums: small (fast Map keys) when the sums stay in range, which the caller checks. */
class Keys {
  readonly width: number;
  constructor(
    readonly eMax: number,
    readonly nMax: number,
  ) {
    this.width = 2 * nMax + 1;
  }
  key(e: number, n: number): number {
    return (e + this.eMax) * this.width + (n + this.nMax);
  }
}

/** Signed charge splits of the chosen prefix: raw (e, n) sums with their number of ordered splits. */
class Splits {
  e: number[] = [0];
  n: number[] = [0];
  c: number[] = [1];
  private readonly idx = new Map<number, number>();
  constructor(private readonly keys: Keys) {}
  /** Each of `count` quarks of a representation goes with +1 or −1: sums k·(e, n), k = −count, −count+2, … count. */
  extend(parent: Splits, r: EnsembleRep, count: number): void {
    const idx = this.idx;
    idx.clear();
    this.e.length = this.n.length = this.c.length = 0;
    for (let s = 0; s < parent.e.length; s++) {
      for (let k = -count; k <= count; k += 2) {
        const e = parent.e[s] + k * r.e;
        const n = parent.n[s] + k * r.n;
        const kk = this.keys.key(e, n);
        const at = idx.get(kk);
        if (at === undefined) {
          idx.set(kk, this.e.length);
          this.e.push(e);
          this.n.push(n);
          this.c.push(parent.c[s]);
        } else this.c[at] += parent.c[s];
      }
    }
  }
}

/** The kept multisets: raw (e, n) sums with their counts, and how many multisets of which kind were met. */
class Collector {
  readonly raw = new Map<number, { e: number; n: number; c: number }>();
  multisets = 0;
  evenMultisets = 0;
  largestNQ = 0;
  stopped = false;
  constructor(
    private readonly keys: Keys,
    private readonly signed: boolean,
    /** The count of each representation in the multiset being recorded. */
    private readonly counts: Int32Array,
    /** The split tables by prefix; the last one is the whole multiset's (signed charges). */
    private readonly splits: Splits[],
    private readonly onProgress: EnsembleOpts["onProgress"],
  ) {}
  record(used: number, e: number, n: number): void {
    this.multisets++;
    if (used > this.largestNQ) this.largestNQ = used;
    if (!this.signed) this.add(e, n, 1);
    else {
      const s = this.splits[this.counts.length];
      for (let j = 0; j < s.e.length; j++) this.add(s.e[j], s.n[j], s.c[j]);
      let even = true;
      for (let i = 0; i < this.counts.length; i++) if (this.counts[i] % 2) even = false;
      if (even) this.evenMultisets++;
    }
    if (this.onProgress && this.multisets % 20000 === 0 && this.onProgress(this.multisets)) this.stopped = true;
  }
  private add(e: number, n: number, c: number): void {
    const kk = this.keys.key(e, n);
    const v = this.raw.get(kk);
    if (v) v.c += c;
    else this.raw.set(kk, { e, n, c });
  }
}

/** @throws when the ensemble without a Landau-pole criterion has more than {@link MAX_MULTISETS} multisets. */
function refuseTooMany(reps: number, maxQuarks: number): void {
  let total = 0;
  for (let k = 1; k <= maxQuarks; k++) total += multisetCount(reps, k);
  if (total > MAX_MULTISETS)
    throw new Error(
      `heavy-quark ensemble: ${total.toExponential(2)} multisets without the Landau-pole criterion is more than ` +
        `${MAX_MULTISETS.toExponential(0)}; lower the number of heavy quarks or turn the criterion on`,
    );
}

function validate(opts: EnsembleOpts): void {
  const k = opts.maxQuarks;
  if (!Number.isSafeInteger(k) || k < 1 || k > 200)
    throw new Error(
      `heavy-quark ensemble: largest number of heavy quarks ${String(k)} must be an integer from 1 to 200`,
    );
  if (opts.charges !== undefined && opts.charges !== "additive" && opts.charges !== "signed")
    throw new Error(`heavy-quark ensemble: charges ${JSON.stringify(opts.charges)} must be "additive" or "signed"`);
}

/**
 * Enumerate the ensemble. Multisets are built rep by rep (counts n_1, n_2, …); the Landau-pole criterion is
 * monotone in added matter, so a count that fails ends its loop and everything built on it.
 * @throws for bad options, or past {@link MAX_MULTISETS} multisets without a Landau-pole criterion.
 */
export function heavyQuarkEnsemble(opts: EnsembleOpts): EnsembleResult {
  validate(opts);
  const { reps, eScale, nScale } = ensembleReps(opts.reps ?? HEAVY_QUARK_TAGS);
  const signed = opts.charges === "signed";
  const lp = opts.landauPole ?? true;
  const check = lp === false ? null : landauCheck(lp === true ? {} : lp);
  const K = reps.length;
  const maxQ = opts.maxQuarks;
  if (!check) refuseTooMany(K, maxQ);
  const aAcc = Array.from({ length: K + 1 }, () => new Float64Array(3));
  const bAcc = Array.from({ length: K + 1 }, () => new Float64Array(9));
  const keys = new Keys(
    maxQ * Math.max(...reps.map((r) => Math.abs(r.e))),
    maxQ * Math.max(...reps.map((r) => Math.abs(r.n))),
  );
  const own = Array.from({ length: K + 1 }, () => new Splits(keys));
  // splits[i] is the prefix's split table: its own table, or the parent's when this rep's count is 0.
  const splits = own.slice();
  const counts = new Int32Array(K);
  const tally = new Collector(keys, signed, counts, splits, opts.onProgress);

  // Depth i chooses the count of reps[i]; the accumulators at i + 1 hold the prefix's shares. `mask` marks reps
  // whose one more copy already failed the criterion on a subset of this prefix (monotone: they fail here too);
  // the returned mask holds for the prefix visit was called with.
  const visit = (i: number, used: number, e: number, n: number, maskIn: number): number => {
    if (tally.stopped) return maskIn;
    if (i === K) {
      if (used > 0) tally.record(used, e, n);
      return maskIn;
    }
    const r = reps[i];
    const bit = 2 ** i;
    const a0 = aAcc[i];
    const b0 = bAcc[i];
    const a1 = aAcc[i + 1];
    const b1 = bAcc[i + 1];
    let mask = maskIn;
    let ret = maskIn;
    for (let c = 0; c <= maxQ - used; c++) {
      if (c > 0 && Math.floor(mask / bit) % 2 === 1) break;
      for (let j = 0; j < 3; j++) a1[j] = a0[j] + c * r.share.a[j];
      for (let j = 0; j < 9; j++) b1[j] = b0[j] + c * r.share.b[j];
      if (c > 0 && check && !check.passes(a1, b1)) {
        mask += bit;
        if (c === 1) ret = mask;
        break;
      }
      counts[i] = c;
      if (signed) {
        if (c === 0) splits[i + 1] = splits[i];
        else (splits[i + 1] = own[i + 1]).extend(splits[i], r, c);
      }
      mask = visit(i + 1, used + c, e + c * r.e, n + c * r.n, mask);
      if (c === 0) ret = mask;
      if (tally.stopped) break;
    }
    counts[i] = 0;
    return ret;
  };
  visit(0, 0, 0, 0, 0);
  const { multisets, evenMultisets, largestNQ, stopped } = tally;
  return summarise(tally.raw, { eScale, nScale, signed, multisets, evenMultisets, largestNQ, stopped });
}

interface Tally {
  eScale: number;
  nScale: number;
  signed: boolean;
  multisets: number;
  evenMultisets: number;
  largestNQ: number;
  stopped: boolean;
}

/** Raw (e, n) sums → reduced E/N with counts; signed splits were counted ordered (X and −X), so halve. */
function summarise(raw: Map<number, { e: number; n: number; c: number }>, t: Tally): EnsembleResult {
  const byRatio = new Map<string, { num: number; den: number; count: number; lo: number; hi: number }>();
  let zeroOrdered = 0;
  for (const { e, n, c } of raw.values()) {
    if (n === 0) {
      zeroOrdered += c;
      continue;
    }
    // E/N = (e/eScale)/(n/nScale) = e·nScale / (n·eScale)
    let num = e * t.nScale;
    let den = n * t.eScale;
    if (den < 0) [num, den] = [-num, -den];
    const g = gcd(num, den) || 1;
    num /= g;
    den /= g;
    const k = den === 1 ? String(num) : `${num}/${den}`;
    const nDW = (2 * Math.abs(n)) / t.nScale;
    const v = byRatio.get(k);
    if (v) {
      v.count += c;
      v.lo = Math.min(v.lo, nDW);
      v.hi = Math.max(v.hi, nDW);
    } else byRatio.set(k, { num, den, count: c, lo: nDW, hi: nDW });
  }
  const half = t.signed ? 2 : 1;
  const distinct = [...byRatio.entries()]
    .sort((x, y) => x[1].num * y[1].den - y[1].num * x[1].den)
    .map(([eOverN, v]) => ({ eOverN, count: v.count / half, nDWMin: v.lo, nDWMax: v.hi }));
  const models = distinct.reduce((s, d) => s + d.count, 0);
  return {
    models,
    multisets: t.multisets,
    distinct,
    zeroN: t.signed ? (zeroOrdered + t.evenMultisets) / 2 : 0,
    largestNQ: t.largestNQ,
    stopped: t.stopped,
  };
}
