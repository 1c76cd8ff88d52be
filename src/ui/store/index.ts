// The axband store: one zustand store built from slices (history, models, curves, figure, ui, preparation) with
// subscribeWithSelector applied once to the combined store. Components select small pieces.
import { create } from "zustand";
import { createStore } from "zustand/vanilla";
import { subscribeWithSelector } from "zustand/middleware";
import type { StateCreator } from "zustand";
import type { Project } from "../../project/types";
import { defaultProject } from "../../project/demo";
import { createHistorySlice } from "./history";
import { createModelsSlice } from "./models";
import { createCurvesSlice } from "./curves";
import { createFigureSlice } from "./figure";
import { createUiSlice } from "./ui";
import { createPreparationSlice, watchCurvePreparation } from "./preparation";
import type { AxbandMiddleware, AxbandState } from "./types";

export * from "./types";

// The store's shape and API.
// State
//   project: Project                 plain data (src/project/types); curve arrays are never mutated, only replaced
//   history: { past, future }        bounded to HISTORY_LIMIT (100) projects each way
//   ui: { messages, highlight, hover }  transient: never saved, never undone
//   preparing: PreparingCurve[]      big curves whose drawing preparation is being built off the main thread
//                                    (preparation.ts; the app store watches its project, fresh stores do not)
// Changing the project: everything goes through commit(updater, { coalesceKey? }). Steps with the same key
// within COALESCE_MS (500 ms) of each other form one undo step (setView uses "view"; text fields should pass
// e.g. `model:${id}:label`). An updater that returns the same object records nothing.
// Actions
//   addModel(draft) → id · updateModel(id, patch, opts?) · removeModel(id) · moveModel(id, delta)
//   addCurves(curves) · updateCurve(id, patch, opts?) · removeCurve(id) · moveCurve(id, delta)
//   setFigure(patch, opts?) (changing yView without a yRange resets the y range) · setView(massRangeEv, yRange)
//   resetView() · setPhysics(patch, opts?) (patch.custom may be partial)
//   replaceProject(project, message?) (undoable; link/file open) · resetProject(project) (clears history)
//   undo() · redo() · canUndo() · canRedo()
//   pushMessage(kind: "alert" | "status", text) → id · dismissMessage(id) · setHighlight(h | null) · setHover(p | null)
// Use: `const curves = useAxband(selectCurves)`; outside React: `useAxband.getState().addModel({ eOverNMin: "8/3" })`.
// For derived arrays select with useShallow (zustand/react/shallow). Fresh stores for tests: createAxbandStore().
function combined(initial: Project): StateCreator<AxbandState, [], AxbandMiddleware> {
  return subscribeWithSelector((...a) => ({
    ...createHistorySlice(initial)(...a),
    ...createModelsSlice(...a),
    ...createCurvesSlice(...a),
    ...createFigureSlice(...a),
    ...createUiSlice(...a),
    ...createPreparationSlice(...a),
  }));
}

/**
 * A fresh vanilla store (tests, or a second app instance).
 * @param initial the start project. @default defaultProject()
 */
export function createAxbandStore(initial: Project = defaultProject()) {
  return createStore<AxbandState>()(combined(initial));
}

export type AxbandStore = ReturnType<typeof createAxbandStore>;

/** The app's store as a React hook (with getState/setState/subscribe for use outside components). */
export const useAxband = create<AxbandState>()(combined(defaultProject()));
// Subscribed before any component, so a restored big curve is listed as preparing before the first render.
watchCurvePreparation(useAxband);

// Selectors: return store references only (no new objects), so they are safe without useShallow.
export const selectProject = (s: AxbandState) => s.project;
export const selectCurves = (s: AxbandState) => s.project.curves;
export const selectPhysics = (s: AxbandState) => s.project.physics;
export const selectYView = (s: AxbandState) => s.project.figure.yView;
export const selectMessages = (s: AxbandState) => s.ui.messages;
export const selectHighlight = (s: AxbandState) => s.ui.highlight;
export const selectHover = (s: AxbandState) => s.ui.hover;
export const selectPreparing = (s: AxbandState) => s.preparing;
export const selectCanUndo = (s: AxbandState) => s.history.past.length > 0;
export const selectCanRedo = (s: AxbandState) => s.history.future.length > 0;
export const selectCurve = (id: string) => (s: AxbandState) => s.project.curves.find((c) => c.id === id);
/** Ids in order (select with useShallow): a list re-renders on add/remove/reorder, not on each edit. */
export const selectModelIds = (s: AxbandState) => s.project.models.map((m) => m.id);
export const selectCurveIds = (s: AxbandState) => s.project.curves.map((c) => c.id);
