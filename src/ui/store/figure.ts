// Figure slice: figure settings, the visible ranges (zoom/pan) and the constants (physics settings).
import type { FigureSlice, SliceCreator } from "./types";
import { defaultView } from "./view";

export const createFigureSlice: SliceCreator<FigureSlice> = (_set, get) => ({
  setFigure(patch, opts) {
    get().commit((p) => {
      const figure = { ...p.figure, ...patch };
      // A y range is in the units of its view: switching the view without a new range takes that view's default.
      if (patch.yView && patch.yView !== p.figure.yView && !patch.yRange)
        figure.yRange = defaultView(patch.yView).yRange;
      return { ...p, figure };
    }, opts);
  },
  setView(massRangeEv, yRange) {
    get().commit(
      (p) => {
        const f = p.figure;
        if (
          f.massRangeEv[0] === massRangeEv[0] &&
          f.massRangeEv[1] === massRangeEv[1] &&
          f.yRange[0] === yRange[0] &&
          f.yRange[1] === yRange[1]
        )
          return p;
        return {
          ...p,
          figure: { ...f, massRangeEv: [massRangeEv[0], massRangeEv[1]], yRange: [yRange[0], yRange[1]] },
        };
      },
      { coalesceKey: "view" },
    );
  },
  resetView() {
    const v = defaultView(get().project.figure.yView);
    get().setView(v.massRangeEv, v.yRange);
  },
  setPhysics(patch, opts) {
    get().commit(
      (p) => ({
        ...p,
        physics: { ...p.physics, ...patch, custom: { ...p.physics.custom, ...(patch.custom ?? {}) } },
      }),
      opts,
    );
  },
});
