// A curve's drawing preparation (log10 arrays, thinning pyramid or Douglas–Peucker order) as plain typed arrays,
// built in the import worker and moved without copying, so the first scene of a big curve does not block the page.
import type { Curve, Figure, PhysicsSettings, YView } from "../project/types";
import {
  cachedPrepared,
  installPrepared,
  prepareCurve,
  viewArrays,
  viewsOf,
  type PreparedCurve,
  type ViewArrays,
} from "./thinning/index";
import { drawsSorted } from "./curves";
import { constantsOf } from "./physics-settings";
import { viewTransform } from "./scales";

/** The arrays of one y view, as built by viewArrays. */
export interface ViewTransfer {
  /** y-view slope (0: g_aγγ; −1: the normalized views). */
  slope: number;
  /** lg + slope·lm; null for slope 0, where the view is lg itself. */
  v: Float64Array | null;
  /** Sorted curves: the block argmin/argmax pyramid, level by level. */
  pyramidMin: Int32Array[] | null;
  pyramidMax: Int32Array[] | null;
  /** Unsorted curves and regions: importance, culling boxes, importance order and the sorted importances. */
  importance: Float64Array | null;
  boxes: Float64Array | null;
  order: Int32Array | null;
  impDesc: Float64Array | null;
}

/** Everything {@link seedPreparedCurve} needs; structured-cloneable, its buffers listed by {@link preparedTransferables}. */
export interface PreparedTransfer {
  n: number;
  skipped: number;
  sorted: boolean;
  index: Uint32Array;
  lm: Float64Array;
  lg: Float64Array;
  views: ViewTransfer[];
}

export interface ComputePreparedOpts {
  /** y-view slopes to build the view arrays of (the figure's current view is enough). @default [0] */
  slopes?: readonly number[];
}

/** What to prepare for one curve: its drawing order and the y views it will be drawn in first. */
export interface PrepareSpec {
  sorted: boolean;
  slopes: number[];
}

/**
 * The preparation a curve with this role and order needs for the figure's y view (as buildScene draws it).
 * @param physics the project's constants (the slope does not depend on them, the view factor does).
 */
export function prepareSpecOf(
  curve: Pick<Curve, "role" | "keepOrder">,
  yView: Figure["yView"],
  physics?: PhysicsSettings,
): PrepareSpec {
  const view: YView = yView === "normalized" || yView === "g-gamma" ? yView : "coupling";
  return {
    sorted: drawsSorted(curve),
    slopes: [viewTransform(view, constantsOf(physics)).slope],
  };
}

/**
 * The preparation prepareCurve and viewArrays would build for these arrays, as plain typed arrays. Runs the
 * same code (so the result is identical by construction); it leaves the curve in this thread's cache too,
 * which is harmless in a worker whose arrays are then transferred away.
 * @param massEv masses (eV) as imported. @param gInvGeV couplings (GeV⁻¹) as imported.
 * @param sorted drawn in mass order (see drawsSorted: exclusions and projections unless keepOrder).
 */
export function computePrepared(
  massEv: Float64Array,
  gInvGeV: Float64Array,
  sorted: boolean,
  opts: ComputePreparedOpts = {},
): PreparedTransfer {
  const prep = prepareCurve(massEv, gInvGeV, sorted);
  const views: ViewTransfer[] = [];
  for (const slope of new Set(opts.slopes ?? [0])) {
    if (!Number.isFinite(slope)) continue;
    const va = viewArrays(prep, slope);
    views.push({
      slope,
      v: va.v === prep.lg ? null : va.v,
      pyramidMin: va.pyramid ? va.pyramid.levels.map((l) => l.min) : null,
      pyramidMax: va.pyramid ? va.pyramid.levels.map((l) => l.max) : null,
      importance: va.importance,
      boxes: va.boxes,
      order: va.order,
      impDesc: va.impDesc,
    });
  }
  return { n: prep.n, skipped: prep.skipped, sorted, index: prep.index, lm: prep.lm, lg: prep.lg, views };
}

/** The distinct buffers of a transfer, for postMessage's transfer list (a buffer listed twice would throw). */
export function preparedTransferables(t: PreparedTransfer): ArrayBuffer[] {
  const seen = new Set<ArrayBuffer>();
  const add = (a: ArrayBufferView | null) => {
    if (a && a.buffer instanceof ArrayBuffer) seen.add(a.buffer);
  };
  add(t.index);
  add(t.lm);
  add(t.lg);
  for (const v of t.views) {
    add(v.v);
    v.pyramidMin?.forEach(add);
    v.pyramidMax?.forEach(add);
    add(v.importance);
    add(v.boxes);
    add(v.order);
    add(v.impDesc);
  }
  return [...seen];
}

function viewOk(t: PreparedTransfer, v: ViewTransfer): boolean {
  const n = t.n;
  if (v.v && v.v.length !== n) return false;
  if (t.sorted) return !!v.pyramidMin && !!v.pyramidMax && v.pyramidMin.length === v.pyramidMax.length;
  return v.importance?.length === n && v.order?.length === n && v.impDesc?.length === n && !!v.boxes;
}

/**
 * Installs a transfer from {@link computePrepared} in this thread's plot cache under the given arrays (the
 * ones the curve will be drawn from), so buildScene finds it. A transfer that does not fit the arrays
 * (other length or order, detached buffers) is ignored and the curve is prepared here when first drawn.
 * When the curve is already cached (prepared here meanwhile, e.g. by an export or the hover readout), the
 * transfer's y views that the entry lacks are added to it, so a later switch to that view builds nothing here.
 * @returns whether it was installed or merged (or an entry was already cached).
 */
export function seedPreparedCurve(
  massEv: Float64Array,
  gInvGeV: Float64Array,
  sorted: boolean,
  t: PreparedTransfer,
): boolean {
  const len = Math.max(massEv.length, gInvGeV.length);
  const fits =
    t.sorted === sorted &&
    t.n + t.skipped === len &&
    t.index?.length === t.n &&
    t.lm.length === t.n &&
    t.lg.length === t.n;
  const cached = cachedPrepared(massEv, gInvGeV, sorted);
  if (cached) {
    // The same arrays give the same preparation (computePrepared runs the same code), so the views fit it.
    const views = viewsOf(cached);
    if (fits && cached.n === t.n)
      for (const v of t.views) if (!views.has(v.slope) && viewOk(t, v)) views.set(v.slope, viewOf(v, cached.lg));
    return true;
  }
  if (!fits) return false;
  const prep: PreparedCurve = { n: t.n, skipped: t.skipped, index: t.index, lm: t.lm, lg: t.lg, sorted };
  const views = viewsOf(prep);
  for (const v of t.views) if (viewOk(t, v)) views.set(v.slope, viewOf(v, t.lg));
  installPrepared(massEv, gInvGeV, prep);
  return true;
}

/** The plot cache's form of one transferred y view; `lg` stands in for the view values of the g_aγγ view. */
function viewOf(v: ViewTransfer, lg: Float64Array): ViewArrays {
  const pyramid =
    v.pyramidMin && v.pyramidMax
      ? { levels: v.pyramidMin.map((min, i) => ({ min, max: (v.pyramidMax as Int32Array[])[i] })) }
      : null;
  return {
    v: v.v ?? lg,
    pyramid,
    importance: v.importance,
    boxes: v.boxes,
    levels: new Map(),
    order: v.order,
    impDesc: v.impDesc,
  };
}

/** Whether the curve's preparation for the spec's order and y views is already cached (nothing to build). */
export function hasPrepared(massEv: Float64Array, gInvGeV: Float64Array, spec: PrepareSpec): boolean {
  const prep = cachedPrepared(massEv, gInvGeV, spec.sorted);
  return !!prep && spec.slopes.every((s) => viewsOf(prep).has(s));
}
