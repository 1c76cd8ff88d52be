// History slice: holds the project and is the only place that changes it (commit), with bounded undo/redo
// and coalescing of rapid steps that share a key (zoom/pan, typing in one field).
import type { Project } from "../../project/types";
import { COALESCE_MS, HISTORY_LIMIT, type HistorySlice, type SliceCreator } from "./types";

function pushBounded(past: Project[], p: Project): Project[] {
  const next = past.length >= HISTORY_LIMIT ? past.slice(past.length - HISTORY_LIMIT + 1) : past.slice();
  next.push(p);
  return next;
}

export function createHistorySlice(initial: Project): SliceCreator<HistorySlice> {
  return (set, get) => {
    // Per-store coalescing memory; not state because nothing renders from it.
    let last: { key: string; at: number } | null = null;

    return {
      project: initial,
      history: { past: [], future: [] },

      commit(updater, opts) {
        const { project, history } = get();
        const next = updater(project);
        if (next === project) return;
        const now = Date.now();
        const key = opts?.coalesceKey;
        const merge =
          key !== undefined &&
          last !== null &&
          last.key === key &&
          now - last.at <= COALESCE_MS &&
          history.past.length > 0;
        last = key !== undefined ? { key, at: now } : null;
        set({
          project: next,
          history: { past: merge ? history.past : pushBounded(history.past, project), future: [] },
        });
      },

      undo() {
        const { project, history } = get();
        if (history.past.length === 0) return;
        last = null;
        const past = history.past.slice(0, -1);
        set({
          project: history.past[history.past.length - 1],
          history: { past, future: [project, ...history.future] },
        });
      },

      redo() {
        const { project, history } = get();
        if (history.future.length === 0) return;
        last = null;
        const [next, ...future] = history.future;
        set({ project: next, history: { past: pushBounded(history.past, project), future } });
      },

      canUndo: () => get().history.past.length > 0,
      canRedo: () => get().history.future.length > 0,

      replaceProject(project, message) {
        last = null;
        get().commit(() => project);
        if (message) get().pushMessage("status", message);
      },

      resetProject(project) {
        last = null;
        set({ project, history: { past: [], future: [] } });
      },
    };
  };
}
