// Main-thread side of the runs worker: sends the run-thinning jobs a figure deferred (plot/thinning/deferred-runs.ts)
// with each curve view's arrays once, puts the answers into the plot cache and asks the figure to draw again.
import { installRunChunks, type RunJob } from "../plot/thinning/deferred-runs";
import type { LevelSelection, ViewArrays } from "../plot/thinning/prepared";
import type { RunsRequest, RunsResponse } from "./run-jobs";

interface Pending {
  level: LevelSelection;
  chunks: Int32Array;
  onInstalled: () => void;
}

let worker: Worker | null = null;
let workerBroken = false;
let nextId = 1;
let nextKey = 1;
const pending = new Map<number, Pending>();
/** Chunks of a level already asked for, so the frames drawn before the answer do not ask again. */
const inFlight = new WeakMap<LevelSelection, Set<number>>();
/** The worker's key of each view whose arrays it has. */
const sentKeys = new WeakMap<ViewArrays, number>();
// A view dropped from the plot cache (its curve gone) is dropped from the worker too.
const dropped =
  typeof FinalizationRegistry === "function"
    ? new FinalizationRegistry<number>((key) => worker?.postMessage({ type: "drop", key } satisfies RunsRequest))
    : null;
/** Figures to draw again, called once per animation frame however many answers arrived in it. */
const redraws = new Set<() => void>();
let redrawScheduled = false;

/** True when deferred run thinning can go to a worker here (otherwise the figure thins at once). */
export function runsWorkerAvailable(): boolean {
  return !workerBroken && typeof Worker === "function";
}

function scheduleRedraw(cb: () => void): void {
  redraws.add(cb);
  if (redrawScheduled) return;
  redrawScheduled = true;
  const run = () => {
    redrawScheduled = false;
    const cbs = [...redraws];
    redraws.clear();
    for (const f of cbs) f();
  };
  if (typeof requestAnimationFrame === "function") requestAnimationFrame(run);
  else setTimeout(run, 0);
}

function release(p: Pending): void {
  const set = inFlight.get(p.level);
  if (set) for (const c of p.chunks) set.delete(c);
}

/** Gives up on the worker: every job waiting is released and its figure drawn again, thinning at once. */
function fail(): void {
  workerBroken = true;
  worker?.terminate();
  worker = null;
  for (const p of pending.values()) {
    release(p);
    scheduleRedraw(p.onInstalled);
  }
  pending.clear();
}

function onMessage(ev: MessageEvent<RunsResponse>): void {
  const msg = ev.data;
  const p = pending.get(msg.id);
  if (!p) return;
  if (msg.type === "error") return fail();
  pending.delete(msg.id);
  installRunChunks(p.level, p.chunks, msg.offsets, msg.indices);
  release(p);
  scheduleRedraw(p.onInstalled);
}

function getWorker(): Worker | null {
  if (!runsWorkerAvailable()) return null;
  if (worker) return worker;
  try {
    worker = new Worker(new URL("./runs-worker.ts", import.meta.url), { type: "module" });
  } catch {
    workerBroken = true;
    return null;
  }
  worker.onmessage = onMessage;
  worker.onerror = (ev) => {
    ev.preventDefault?.();
    fail();
  };
  return worker;
}

/** The worker's key for a view's arrays, sending copies of them (transferred) the first time. */
function keyOf(w: Worker, job: RunJob): number {
  const known = sentKeys.get(job.va);
  if (known !== undefined) return known;
  const key = nextKey++;
  const lm = job.prep.lm.slice();
  const v = job.va.v.slice();
  w.postMessage({ type: "data", key, lm, v } satisfies RunsRequest, [lm.buffer, v.buffer]);
  sentKeys.set(job.va, key);
  dropped?.register(job.va, key);
  return key;
}

/**
 * Sends the jobs a scene build deferred (BuildSceneOpts.deferRuns), leaving out chunks already asked for; calls
 * `onInstalled` (at most once per animation frame) when answers are in the plot cache and the figure should be
 * built again. Without a worker, or when it fails, `onInstalled` is called so the figure thins at once.
 */
export function requestRuns(jobs: readonly RunJob[], onInstalled: () => void): void {
  const w = getWorker();
  if (!w) {
    if (jobs.length) scheduleRedraw(onInstalled);
    return;
  }
  for (const job of jobs) {
    let set = inFlight.get(job.level);
    if (!set) inFlight.set(job.level, (set = new Set()));
    const chunks = Int32Array.from(job.chunks.filter((c) => !set.has(c)));
    if (chunks.length === 0) continue;
    for (const c of chunks) set.add(c);
    const id = nextId++;
    pending.set(id, { level: job.level, chunks, onInstalled });
    const { tx, ty } = job.level;
    w.postMessage({ type: "runs", id, key: keyOf(w, job), tx, ty, chunks } satisfies RunsRequest);
  }
}
