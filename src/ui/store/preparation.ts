// Off-thread drawing preparation for big curves that reach the store without the import worker (autosave, link,
// file, undo/redo, changed role or order): the figure leaves them out until their preparation is cached.
import type { StoreApi } from "zustand";
import type { Curve, Project } from "../../project/types";
import { cachedPrepared } from "../../plot/thinning/index";
import { drawsSorted } from "../../plot/curves";
import { prepareSpecOf, type PrepareSpec } from "../../plot/prepare-transfer";
import { importWorkerAvailable, prepareInWorker } from "../../worker/import-client";
import type { AxbandState, PreparationSlice, PreparingCurve, SliceCreator } from "./types";

/**
 * Points from which a curve's preparation goes to the worker. Measured on a 2-core machine in Node
 * (prepareCurve + viewArrays): a curve in mass order takes ~0.1 µs per point, one that must be sorted
 * ~0.5 µs, a region or file-order curve (Douglas–Peucker importance and its sort) ~0.7 µs, so 50,000 points
 * stay at or below ~35 ms, under the 50 ms of a long task; 100,000 would already give ~70 ms for a region.
 * Below it a round trip (copying the arrays, a figure drawn without the curve) costs more than it saves.
 * The same value as the import step's PREPARE_OFF_THREAD_POINTS (src/ui/importer/parse-runner.ts).
 */
export const OFF_THREAD_PREPARE_POINTS = 50_000;

/** Where preparations are built: the import worker (tests pass their own). */
export interface PreparationClient {
  /** True when a worker can take the job; otherwise the figure prepares the curve itself when drawing it. */
  available(): boolean;
  /** Builds the preparation off the main thread and seeds the plot cache under these arrays; false on failure. */
  prepare(massEv: Float64Array, gInvGeV: Float64Array, spec: PrepareSpec): Promise<boolean>;
}

const importWorkerClient: PreparationClient = { available: importWorkerAvailable, prepare: prepareInWorker };

export const createPreparationSlice: SliceCreator<PreparationSlice> = () => ({ preparing: [] });

/** Whether an entry stands for this curve's arrays in its drawing order. */
function isFor(p: PreparingCurve, c: Pick<Curve, "massEv" | "gInvGeV" | "role" | "keepOrder">): boolean {
  return p.massEv === c.massEv && p.gInvGeV === c.gInvGeV && p.sorted === drawsSorted(c);
}

/** True while the figure waits for this curve's preparation. */
export function isPreparing(
  preparing: readonly PreparingCurve[],
  c: Pick<Curve, "massEv" | "gInvGeV" | "role" | "keepOrder">,
): boolean {
  return preparing.length > 0 && preparing.some((p) => isFor(p, c));
}

/**
 * The project the figure draws now, without the curves still being prepared, and the visible ones left out
 * (for the note). The same project object when nothing is left out, so the scene is not rebuilt for nothing.
 */
export function withoutPreparing(
  project: Project,
  preparing: readonly PreparingCurve[],
): { project: Project; waiting: Curve[] } {
  if (preparing.length === 0) return { project, waiting: [] };
  const left = project.curves.filter((c) => isPreparing(preparing, c));
  if (left.length === 0) return { project, waiting: [] };
  return {
    project: { ...project, curves: project.curves.filter((c) => !left.includes(c)) },
    waiting: left.filter((c) => c.visible),
  };
}

/**
 * Watches the store's project: every curve of at least {@link OFF_THREAD_PREPARE_POINTS} points whose
 * preparation for its drawing order is not cached goes to the worker once (per arrays and order), is listed
 * in `preparing` meanwhile, and is taken off the list when the reply has been seeded (or failed: then the
 * figure prepares it when drawing). Imports are seeded before their curve is added, so they never wait.
 * Runs synchronously inside the store change, so the first render after a restore already leaves them out.
 * @param client @default the import worker (import-client.ts)
 * @returns a function that stops watching (jobs already sent still finish and update the store).
 */
export function watchCurvePreparation(
  store: StoreApi<AxbandState>,
  client: PreparationClient = importWorkerClient,
): () => void {
  // Arrays already sent, by mass array: each is sent once per coupling array and order, even if it fails.
  const sent = new WeakMap<Float64Array, { g: Float64Array; sorted: boolean }[]>();
  const finish = (entry: PreparingCurve) => {
    const list = store.getState().preparing;
    if (list.includes(entry)) store.setState({ preparing: list.filter((p) => p !== entry) });
  };
  const check = (project: Project) => {
    const fresh: PreparingCurve[] = [];
    for (const c of project.curves) {
      if (Math.min(c.massEv.length, c.gInvGeV.length) < OFF_THREAD_PREPARE_POINTS) continue;
      const sorted = drawsSorted(c);
      const tried = sent.get(c.massEv);
      if (tried?.some((t) => t.g === c.gInvGeV && t.sorted === sorted)) continue;
      if (cachedPrepared(c.massEv, c.gInvGeV, sorted) || !client.available()) continue;
      if (tried) tried.push({ g: c.gInvGeV, sorted });
      else sent.set(c.massEv, [{ g: c.gInvGeV, sorted }]);
      const entry: PreparingCurve = { massEv: c.massEv, gInvGeV: c.gInvGeV, sorted };
      fresh.push(entry);
      // The figure's current y view, as the import step asks for; another view is built when first drawn.
      client.prepare(c.massEv, c.gInvGeV, prepareSpecOf(c, project.figure.yView, project.physics)).then(
        () => finish(entry),
        () => finish(entry),
      );
    }
    if (fresh.length > 0) store.setState({ preparing: [...store.getState().preparing, ...fresh] });
  };
  check(store.getState().project);
  return store.subscribe((s, prev) => {
    if (s.project !== prev.project) check(s.project);
  });
}
