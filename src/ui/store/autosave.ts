// Autosave: keeps the project in browser storage (project without curve data in localStorage, curve arrays
// in IndexedDB keyed by curve id) and restores it on start; a link in the URL fragment wins over it.
// Storage that is full or missing is reported once (role="alert") and never stops the app.
import type { StoreApi } from "zustand";
import type { Project } from "../../project/types";
import type { AxbandState } from "./types";
import type { CurveArrays } from "./autosave-chunks";
import { indexedDbCurveStore } from "./curve-store";
import {
  type AutosaveOpts,
  STORAGE_KEY,
  STORAGE_PROBLEM,
  browserLocalStorage,
  loadFileModule,
  loadedFileModule,
  metaOf,
} from "./autosave-storage";

export { CHUNK_POINTS, chunkKey, joinChunks, splitChunks, type CurveArrays } from "./autosave-chunks";
export { type CurveDataStore } from "./curve-store";
export { STORAGE_KEY, STORAGE_PROBLEM, type KeyValueStorage } from "./autosave-storage";
export { initProject, restoreAutosave } from "./autosave-restore";

export interface Autosave {
  /** Saves now (cancels a pending debounce); resolves when the curve writes are done. */
  flush(): Promise<void>;
  stop(): void;
}

/**
 * Saves the store's project after every change (debounced) and on pagehide.
 * Curve arrays are written only when their references changed since the last save.
 */
export function startAutosave(store: StoreApi<AxbandState>, opts: AutosaveOpts = {}): Autosave {
  const local = opts.local === undefined ? browserLocalStorage() : opts.local;
  const curves = opts.curves === undefined ? indexedDbCurveStore() : opts.curves;
  const debounceMs = opts.debounceMs ?? 300;
  const saved = new Map<string, CurveArrays>();
  let told = false;
  let timer: ReturnType<typeof setTimeout> | null = null;
  let lastSaved: Project | null = null;

  const problem = () => {
    if (told) return;
    told = true;
    store.getState().pushMessage("alert", STORAGE_PROBLEM);
  };

  const save = async (): Promise<void> => {
    timer = null;
    const file = loadedFileModule() ?? (await loadFileModule());
    const project = store.getState().project;
    if (project === lastSaved) return;
    lastSaved = project;
    // Curves first, so a saved project never names curves whose data is not stored yet.
    const writes: Promise<void>[] = [];
    if (project.curves.length > 0 && !curves) problem();
    if (curves) {
      const ids = new Set<string>();
      for (const c of project.curves) {
        ids.add(c.id);
        const prev = saved.get(c.id);
        if (prev && prev.massEv === c.massEv && prev.gInvGeV === c.gInvGeV) continue;
        const data = { massEv: c.massEv, gInvGeV: c.gInvGeV };
        saved.set(c.id, data);
        writes.push(
          curves.put(c.id, data).catch(() => {
            saved.delete(c.id);
            problem();
          }),
        );
      }
      for (const id of [...saved.keys()]) {
        if (ids.has(id)) continue;
        saved.delete(id);
        writes.push(curves.delete(id).catch(() => undefined));
      }
    }
    if (!local) problem();
    else {
      try {
        local.setItem(STORAGE_KEY, metaOf(file, project));
      } catch {
        problem();
      }
    }
    await Promise.all(writes);
  };

  const schedule = () => {
    // Loaded at the first change (not at start-up), so that a save on pagehide finds it.
    if (!loadedFileModule()) void loadFileModule();
    if (timer !== null) clearTimeout(timer);
    timer = setTimeout(() => void save(), debounceMs);
  };
  const unsubscribe = store.subscribe((s, prev) => {
    if (s.project !== prev.project) schedule();
  });
  const onPageHide = () => void save();
  const target = globalThis as {
    addEventListener?: typeof addEventListener;
    removeEventListener?: typeof removeEventListener;
  };
  target.addEventListener?.("pagehide", onPageHide);

  return {
    flush() {
      if (timer !== null) clearTimeout(timer);
      return save();
    },
    stop() {
      if (timer !== null) clearTimeout(timer);
      timer = null;
      unsubscribe();
      target.removeEventListener?.("pagehide", onPageHide);
    },
  };
}
