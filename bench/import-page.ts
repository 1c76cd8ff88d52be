// Page driven by bench/import-browser.mjs: imports the bench files through the import worker (end to end:
// File → worker stream read → parse → transferred Float64Arrays) and, for comparison, on the main thread.
import { parseCurveText } from "../src/formats/csv";
import {
  disposeImportWorker,
  importInWorker,
  importWorkerAvailable,
  setImportWorkerEnabled,
} from "../src/worker/import-client";

export interface BenchFile {
  name: string;
  url: string;
}

export interface BenchSetResult {
  bytes: number;
  rows: number;
  worker: boolean;
  /** Seconds per run for all files of the set. */
  workerEndToEnd: number[];
  mainThreadFromFile: number[];
  mainThreadParserAlone: number[];
  /** Long tasks (> 50 ms) on the main thread during the worker runs. */
  longTasks: { count: number; maxMs: number };
  progressMessages: number;
}

async function timeRuns(runs: number, fn: () => Promise<unknown>): Promise<number[]> {
  await fn(); // warm-up
  const out: number[] = [];
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now();
    await fn();
    out.push((performance.now() - t0) / 1000);
  }
  return out;
}

async function runSet(files: BenchFile[], runs: number): Promise<BenchSetResult> {
  const blobs = await Promise.all(
    files.map(async (f) => new File([await (await fetch(f.url)).blob()], f.name, { type: "text/csv" })),
  );
  const texts = await Promise.all(blobs.map((b) => b.text()));
  const bytes = blobs.reduce((s, b) => s + b.size, 0);
  let rows = 0;
  let progressMessages = 0;

  // Long tasks are matched to the worker runs by their start time (entries arrive asynchronously).
  const entries: { start: number; duration: number }[] = [];
  const windows: [number, number][] = [];
  const observer = new PerformanceObserver((list) => {
    for (const e of list.getEntries()) entries.push({ start: e.startTime, duration: e.duration });
  });
  observer.observe({ type: "longtask", buffered: false });

  setImportWorkerEnabled(true);
  const worker = importWorkerAvailable();
  const workerEndToEnd = await timeRuns(runs, async () => {
    const from = performance.now();
    rows = 0;
    for (const file of blobs) {
      const r = await importInWorker(file, {}, () => progressMessages++).promise;
      rows += r.massEv.length;
    }
    windows.push([from, performance.now()]);
  });
  await new Promise((resolve) => setTimeout(resolve, 200));
  observer.disconnect();
  const longTasks = entries
    .filter((e) => windows.some(([a, b]) => e.start >= a && e.start <= b))
    .map((e) => e.duration);

  setImportWorkerEnabled(false);
  const mainThreadFromFile = await timeRuns(runs, async () => {
    for (const file of blobs) await importInWorker(file, {}).promise;
  });
  setImportWorkerEnabled(true);
  const mainThreadParserAlone = await timeRuns(runs, async () => {
    for (const t of texts) parseCurveText(t);
  });
  return {
    bytes,
    rows,
    worker,
    workerEndToEnd,
    mainThreadFromFile,
    mainThreadParserAlone,
    longTasks: { count: longTasks.length, maxMs: longTasks.length ? Math.max(...longTasks) : 0 },
    progressMessages,
  };
}

declare global {
  interface Window {
    axbandImportBench?: (files: BenchFile[], runs: number) => Promise<BenchSetResult>;
  }
}

window.axbandImportBench = async (files, runs) => {
  try {
    return await runSet(files, runs);
  } finally {
    disposeImportWorker();
  }
};
const status = document.getElementById("status");
if (status) status.textContent = "ready";
