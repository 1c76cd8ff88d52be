// Module Web Worker for the run thinning of big file-order curves at new zoom levels (run-jobs.ts), so that a
// zoom step does not wait for it on the main thread.
import { createRunsHandler, type RunsRequest, type RunsResponse } from "./run-jobs";

// The tsconfig mixes DOM and WebWorker libs; inside this file `self` is the dedicated worker scope.
const scope = self as unknown as {
  onmessage: ((ev: MessageEvent<RunsRequest>) => void) | null;
  postMessage(message: RunsResponse, transfer?: Transferable[]): void;
};

const handle = createRunsHandler((msg, transfer) => scope.postMessage(msg, transfer));
scope.onmessage = (ev) => handle(ev.data);
