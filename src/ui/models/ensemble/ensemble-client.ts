// Main-thread side of the ensemble enumeration: one Web Worker per run (terminated to cancel), or the calling
// thread, a tick later, where Workers do not exist (jsdom).
import { heavyQuarkEnsemble, type EnsembleOpts, type EnsembleResult } from "../../../physics/ensemble";

export type EnsembleRequest = Omit<EnsembleOpts, "onProgress">;
export type EnsembleResponse =
  | { kind: "progress"; multisets: number }
  | { kind: "done"; result: EnsembleResult }
  | { kind: "error"; message: string };

export interface EnsembleRun {
  result: Promise<EnsembleResult>;
  cancel: () => void;
}

/** Start an enumeration; `result` rejects with the physics core's message, or with "cancelled". */
export function runEnsemble(req: EnsembleRequest, onProgress: (multisets: number) => void): EnsembleRun {
  if (typeof Worker !== "function") {
    let cancelled = false;
    const result = new Promise<EnsembleResult>((resolve, reject) =>
      setTimeout(() => {
        if (cancelled) return reject(new Error("cancelled"));
        try {
          resolve(heavyQuarkEnsemble({ ...req, onProgress: () => cancelled }));
        } catch (e) {
          reject(e instanceof Error ? e : new Error(String(e)));
        }
      }, 0),
    );
    return { result, cancel: () => (cancelled = true) };
  }
  const worker = new Worker(new URL("./ensemble-worker.ts", import.meta.url), { type: "module" });
  let settle: { reject: (e: Error) => void } | null = null;
  const result = new Promise<EnsembleResult>((resolve, reject) => {
    settle = { reject };
    worker.onmessage = (ev: MessageEvent<EnsembleResponse>) => {
      const msg = ev.data;
      if (msg.kind === "progress") return onProgress(msg.multisets);
      worker.terminate();
      if (msg.kind === "done") resolve(msg.result);
      else reject(new Error(msg.message));
    };
    worker.onerror = (ev) => {
      ev.preventDefault?.();
      worker.terminate();
      reject(new Error(`the ensemble worker failed: ${ev.message || "unknown error"}`));
    };
  });
  worker.postMessage(req);
  return {
    result,
    cancel: () => {
      worker.terminate();
      settle?.reject(new Error("cancelled"));
    },
  };
}
