// Main-thread side of the overlap summary: runs it in a Web Worker (curve arrays sent once, then named by id),
// or on the calling thread without Workers; `useOverlapSummary` gives the rows.
import { useEffect, useMemo, useRef, useState } from "react";
import { overlapSummary, type OverlapSummaryRow } from "../../analysis/overlap-summary";
import { cachedPrepared, type PreparedCurve } from "../../analysis/prepared-curve";
import type { Curve, Model, PhysicsSettings, Project } from "../../project/types";
import { useAxband } from "../store";

type CurveMeta = Omit<Curve, "massEv" | "gInvGeV">;

export interface OverlapRequest {
  id: number;
  project: Omit<Project, "curves"> & { curves: { meta: CurveMeta; massRef: number; gRef: number }[] };
  /** Arrays the worker has not seen yet, by id. */
  arrays: [number, Float64Array][];
  /**
   * The curve preparations this thread already holds for arrays sent now (from the import worker), in the order
   * the overlap reads them, so the overlap worker does not sort and take logarithms again.
   */
  prepared: { massRef: number; gRef: number; prep: PreparedCurve }[];
  /** Every array id still in use (the worker forgets the others). */
  keep: number[];
  mergeGaps: boolean;
}

export type OverlapResponse =
  { id: number; ok: true; rows: OverlapSummaryRow[] } | { id: number; ok: false; error: string };

let worker: Worker | null = null;
let broken = false;
let nextJob = 1;
let nextArray = 1;
const arrayIds = new WeakMap<Float64Array, number>();
let workerHas = new Set<number>();
const waiting = new Map<number, { resolve: (rows: OverlapSummaryRow[]) => void; fallback: () => void }>();

/** True when the overlap table is computed in a Web Worker here. */
function overlapWorkerAvailable(): boolean {
  return !broken && typeof Worker === "function";
}

function getWorker(): Worker | null {
  if (!overlapWorkerAvailable()) return null;
  if (worker) return worker;
  try {
    worker = new Worker(new URL("./overlap-worker.ts", import.meta.url), { type: "module" });
  } catch {
    broken = true;
    return null;
  }
  worker.onmessage = (ev: MessageEvent<OverlapResponse>) => {
    const job = waiting.get(ev.data.id);
    if (!job) return;
    waiting.delete(ev.data.id);
    if (ev.data.ok) job.resolve(ev.data.rows);
    else job.fallback();
  };
  worker.onerror = (ev) => {
    ev.preventDefault?.();
    broken = true;
    worker?.terminate();
    worker = null;
    workerHas = new Set();
    const jobs = [...waiting.values()];
    waiting.clear();
    for (const j of jobs) j.fallback();
  };
  return worker;
}

function arrayId(a: Float64Array): number {
  let id = arrayIds.get(a);
  if (id === undefined) {
    id = nextArray++;
    arrayIds.set(a, id);
  }
  return id;
}

/** The overlap summary of a project, from the worker when there is one. Never rejects. */
function computeSummary(project: Project, mergeGaps: boolean): Promise<OverlapSummaryRow[]> {
  const local = () => Promise.resolve().then(() => overlapSummary(project, { mergeGaps }));
  const w = getWorker();
  if (!w) return local();
  const fresh: [number, Float64Array][] = [];
  const prepared: OverlapRequest["prepared"] = [];
  const keep: number[] = [];
  const curves = project.curves.map(({ massEv, gInvGeV, ...meta }) => {
    const massRef = arrayId(massEv);
    const gRef = arrayId(gInvGeV);
    const isNew = !workerHas.has(massRef) || !workerHas.has(gRef);
    for (const [id, a] of [
      [massRef, massEv],
      [gRef, gInvGeV],
    ] as const) {
      keep.push(id);
      if (!workerHas.has(id)) fresh.push([id, a]);
    }
    // The overlap reads exclusions and projections in mass order, regions in file order (as they are drawn).
    const prep = isNew ? cachedPrepared(massEv, gInvGeV, meta.role !== "region") : undefined;
    if (prep) prepared.push({ massRef, gRef, prep });
    return { meta, massRef, gRef };
  });
  const id = nextJob++;
  return new Promise<OverlapSummaryRow[]>((resolve) => {
    waiting.set(id, { resolve, fallback: () => resolve(overlapSummary(project, { mergeGaps })) });
    try {
      const msg: OverlapRequest = { id, project: { ...project, curves }, arrays: fresh, prepared, keep, mergeGaps };
      w.postMessage(msg);
      for (const [aid] of fresh) workerHas.add(aid);
      workerHas = new Set(keep.filter((k) => workerHas.has(k)));
    } catch {
      waiting.delete(id);
      resolve(overlapSummary(project, { mergeGaps }));
    }
  });
}

/**
 * The overlap summary for the current models, curves and constants (the figure does not change it), and whether a
 * newer computation is still running. Synchronous where there is no Worker.
 */
export function useOverlapSummary(
  models: Model[],
  curves: Curve[],
  physics: PhysicsSettings,
  mergeGaps: boolean,
): { rows: OverlapSummaryRow[]; pending: boolean } {
  const sync = !overlapWorkerAvailable();
  const syncRows = useMemo(
    () => (sync ? overlapSummary({ ...useAxband.getState().project, models, curves, physics }, { mergeGaps }) : null),
    [sync, models, curves, physics, mergeGaps],
  );
  const [state, setState] = useState<{ rows: OverlapSummaryRow[]; job: number }>({ rows: [], job: 0 });
  const latest = useRef(0);
  useEffect(() => {
    if (sync) return;
    const job = ++latest.current;
    void computeSummary({ ...useAxband.getState().project, models, curves, physics }, mergeGaps).then((rows) => {
      if (latest.current === job) setState({ rows, job });
    });
  }, [sync, models, curves, physics, mergeGaps]);
  if (syncRows) return { rows: syncRows, pending: false };
  return { rows: state.rows, pending: state.job !== latest.current };
}
