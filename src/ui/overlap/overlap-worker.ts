// Module Web Worker that computes the overlap summary off the main thread. Curve arrays arrive once per array and
// are kept by id, so later requests (a model edited, a curve restyled) send only ids; intervals go back transferred.
import { overlapSummary } from "../../analysis/overlap-summary";
import type { OverlapRequest, OverlapResponse } from "./overlap-client";
import type { Project } from "../../project/types";

const scope = self as unknown as {
  onmessage: ((ev: MessageEvent<OverlapRequest>) => void) | null;
  postMessage(message: OverlapResponse, transfer: Transferable[]): void;
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
    const rows = overlapSummary(project, { mergeGaps: msg.mergeGaps });
    const transfer = rows.flatMap((r) => {
      const l = r.intervals;
      return [l.lo.buffer, l.hi.buffer, l.whole.buffer, l.eOverN.buffer, l.members.buffer, l.bridged.buffer];
    });
    scope.postMessage({ id: msg.id, ok: true, rows }, transfer);
  } catch (e) {
    scope.postMessage({ id: msg.id, ok: false, error: e instanceof Error ? e.message : String(e) }, []);
  }
};
