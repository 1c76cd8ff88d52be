// Curves slice: add imported curves, edit their style/role/rescaling, remove and reorder them.
// Curve data arrays are never mutated; a change of data replaces the arrays (autosave compares references).
import type { CurvesSlice, SliceCreator } from "./types";
import { moveItem } from "./move";

export const createCurvesSlice: SliceCreator<CurvesSlice> = (_set, get) => ({
  addCurves(curves) {
    if (curves.length === 0) return;
    get().commit((p) => ({ ...p, curves: [...p.curves, ...curves] }));
  },
  updateCurve(id, patch, opts) {
    get().commit((p) => {
      const i = p.curves.findIndex((c) => c.id === id);
      if (i < 0) return p;
      const curves = p.curves.slice();
      curves[i] = { ...curves[i], ...patch, id };
      return { ...p, curves };
    }, opts);
  },
  removeCurve(id) {
    get().commit((p) =>
      p.curves.some((c) => c.id === id) ? { ...p, curves: p.curves.filter((c) => c.id !== id) } : p,
    );
  },
  moveCurve(id, delta) {
    get().commit((p) => {
      const curves = moveItem(p.curves, id, delta);
      return curves === p.curves ? p : { ...p, curves };
    });
  },
});
