// Module Web Worker that computes the overlap table off the main thread (a million-point curve takes a
// good fraction of a second per model). Curve arrays arrive once per array and are kept by id, so later
// requests (a model edited, a curve restyled) send only ids.
import { overlapTable } from "../../analysis/overlap-table";
import type { OverlapRequest, OverlapResponse } from "./overlap-client";
import type { Project } from "../../project/types";

const scope = self as unknown as {
  onmessage: ((ev: MessageEvent<OverlapRequest>) => void) | null;
  postMessage(message: OverlapResponse): void;
};

const arrays = new Map<number, Float64Array>();

scope.onmessage = (ev) => {
  const msg = ev.data;
  try {
    for (const [id, data] of msg.arrays) arrays.set(id, data);
    const keep = new Set(msg.keep);
    for (const id of arrays.keys()) if (!keep.has(id)) arrays.delete(id);
    const curves = msg.project.curves.map((c) => {
      const massEv = arrays.get(c.massRef);
      const gInvGeV = arrays.get(c.gRef);
      if (!massEv || !gInvGeV) throw new Error("curve data missing in the overlap worker");
      return { ...c.meta, massEv, gInvGeV };
    });
    const project = { ...msg.project, curves } as unknown as Project;
    scope.postMessage({ id: msg.id, ok: true, rows: overlapTable(project) });
  } catch (e) {
    scope.postMessage({ id: msg.id, ok: false, error: e instanceof Error ? e.message : String(e) });
  }
};
