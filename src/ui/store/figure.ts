// Figure slice: figure settings, the visible ranges (zoom/pan) and the constants (physics settings).
import type { FigureSlice, SliceCreator } from "./types";
import { saneRange } from "../../project/view-range";
import { defaultView } from "./view";

export const createFigureSlice: SliceCreator<FigureSlice> = (_set, get) => ({
  setFigure(patch, opts) {
    get().commit((p) => {
      const figure = { ...p.figure, ...patch };
      if (patch.massRangeEv) figure.massRangeEv = saneRange(patch.massRangeEv) ?? p.figure.massRangeEv;
      if (patch.yRange) figure.yRange = saneRange(patch.yRange) ?? p.figure.yRange;
      // A y range is in the units of its view: switching the view without a new range takes that view's default.
      if (patch.yView && patch.yView !== p.figure.yView && !patch.yRange)
        figure.yRange = defaultView(patch.yView).yRange;
      return { ...p, figure };
    }, opts);
  },
  setView(massIn, yIn) {
    get().commit(
      (p) => {
        const f = p.figure;
        // The one gate for ranges from gestures and fields: nothing degenerate or non-finite reaches the state.
        const massRangeEv = saneRange(massIn) ?? f.massRangeEv;
        const yRange = saneRange(yIn) ?? f.yRange;
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
