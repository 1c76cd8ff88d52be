// Module Web Worker that computes the overlap summary off the main thread. Curve arrays arrive once per array and
// are kept by id, so later requests (a model edited, a curve restyled) send only ids; intervals go back transferred.
import { overlapSummary } from "../../analysis/overlap-summary";
import { installPrepared, type PreparedCurve } from "../../analysis/prepared-curve";
import type { OverlapRequest, OverlapResponse } from "./overlap-client";
import type { Project } from "../../project/types";

const scope = self as unknown as {
  onmessage: ((ev: MessageEvent<OverlapRequest>) => void) | null;
  postMessage(message: OverlapResponse, transfer: Transferable[]): void;
};

const arrays = new Map<number, Float64Array>();

/** Whether a preparation sent along fits its arrays (as prepareCurve would have built it for them). */
function fits(massEv: Float64Array, gInvGeV: Float64Array, p: PreparedCurve): boolean {
  const len = Math.max(massEv.length, gInvGeV.length);
  return p.n + p.skipped === len && p.index.length === p.n && p.lm.length === p.n && p.lg.length === p.n;
}

scope.onmessage = (ev) => {
  const msg = ev.data;
  try {
    for (const [id, data] of msg.arrays) arrays.set(id, data);
    const keep = new Set(msg.keep);
    for (const id of arrays.keys()) if (!keep.has(id)) arrays.delete(id);
    for (const { massRef, gRef, prep } of msg.prepared) {
      const massEv = arrays.get(massRef);
      const gInvGeV = arrays.get(gRef);
      if (massEv && gInvGeV && fits(massEv, gInvGeV, prep)) installPrepared(massEv, gInvGeV, prep);
    }
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
