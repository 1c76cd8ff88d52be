// Module Web Worker that enumerates a heavy-quark ensemble off the main thread (the signed default takes
// seconds), posting the number of multisets kept now and then; the page cancels by terminating it.
import { heavyQuarkEnsemble } from "../../../physics/ensemble";
import type { EnsembleRequest, EnsembleResponse } from "./ensemble-client";

const scope = self as unknown as {
  onmessage: ((ev: MessageEvent<EnsembleRequest>) => void) | null;
  postMessage(message: EnsembleResponse): void;
};

scope.onmessage = (ev) => {
  try {
    const result = heavyQuarkEnsemble({
      ...ev.data,
      onProgress: (multisets) => scope.postMessage({ kind: "progress", multisets }),
    });
    scope.postMessage({ kind: "done", result });
  } catch (e) {
    scope.postMessage({ kind: "error", message: e instanceof Error ? e.message : String(e) });
  }
};
