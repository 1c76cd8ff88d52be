// Autosave: the project in browser storage (without curve data in localStorage, curve arrays in IndexedDB),
// restored on start unless the URL has a link; full or missing storage is reported once and never stops the app.
import type { StoreApi } from "zustand";
import type { Project } from "../../project/types";
import type { AxbandState } from "./types";
import type { CurveArrays } from "./autosave-chunks";
import type { CurveDataStore } from "./curve-store";
import {
  type AutosaveOpts,
  type KeyValueStorage,
  STORAGE_KEY,
  STORAGE_PROBLEM,
  loadFileModule,
  loadedFileModule,
  metaOf,
  storesOf,
} from "./autosave-storage";
import { type Revision, newTabId, newer, splitRevision, withRevision } from "./autosave-revision";
import { clearLost, noteLost } from "./autosave-lost";
import { loadSaved, readNewest, restoredRevisions } from "./autosave-restore";

/**
 * Replaces the project of `store` with the newest saved one (another tab's; undoable), naming the curves
 * and models of this tab that it does not have, so that nothing disappears without a word.
 */
async function loadNewest(store: StoreApi<AxbandState>, opts: AutosaveOpts) {
  const newest = await readNewest(opts);
  const r = newest ? await loadSaved(newest.meta, opts) : null;
  if (!newest || !r || !r.ok) {
    store.getState().pushMessage("alert", "The other tab's work could not be read; this tab's project is unchanged.");
    return null;
  }
  const mine = store.getState().project;
  const curveIds = new Set(r.project.curves.map((c) => c.id));
  const modelIds = new Set(r.project.models.map((m) => m.id));
  const gone = [
    ...mine.curves.filter((c) => !curveIds.has(c.id)).map((c) => `curve "${c.label}"`),
    ...mine.models.filter((m) => !modelIds.has(m.id)).map((m) => `model "${m.label || `E/N = ${m.eOverNMin}`}"`),
  ];
  const note = gone.length > 0 ? ` It does not have ${gone.join(", ")} from this tab.` : "";
  const repairs = r.repairs.length > 0 ? ` Changes on loading: ${r.repairs.join("; ")}.` : "";
  store
    .getState()
    .replaceProject(r.project, `Loaded the newer work of another tab. Undo returns to this tab's.${note}${repairs}`);
  return { project: store.getState().project, rev: newest.rev };
}

/** The revision of the text in localStorage (null when there is none or it cannot be read). */
function storedRevision(local: KeyValueStorage | null): Revision | null {
  try {
    const text = local?.getItem(STORAGE_KEY);
    return text ? splitRevision(text).rev : null;
  } catch {
    return null;
  }
}

export { CHUNK_POINTS, chunkKey, joinChunks, splitChunks, type CurveArrays } from "./autosave-chunks";
export { type CurveDataStore } from "./curve-store";
export { STORAGE_KEY, STORAGE_PROBLEM, type KeyValueStorage } from "./autosave-storage";
export type { Revision, SpareRecord, SpareStore } from "./autosave-revision";
export { initProject, restoreAutosave } from "./autosave-restore";

export interface Autosave {
  /** Saves now (cancels a pending debounce); resolves when the curve writes are done. */
  flush(): Promise<void>;
  stop(): void;
}

/** Writes curve arrays whose references changed since the last save and deletes those of removed curves. */
function curveWriter(curves: CurveDataStore | null, problem: () => void) {
  const saved = new Map<string, CurveArrays>();
  return {
    /** Starts the writes for `project`; the promises settle when they are done (failures become `problem`). */
    write(project: Project): Promise<void>[] {
      const writes: Promise<void>[] = [];
      if (project.curves.length > 0 && !curves) problem();
      if (!curves) return writes;
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
      return writes;
    },
    /** Treats the arrays of `project` as stored (restored or loaded ones), or forgets everything (null). */
    reset(project: Project | null): void {
      saved.clear();
      for (const c of project?.curves ?? []) saved.set(c.id, { massEv: c.massEv, gInvGeV: c.gInvGeV });
    },
  };
}

type Stores = ReturnType<typeof storesOf>;

/** Pushes `text` as an alert the first time the returned function is called, and never again. */
function alertOnce(store: StoreApi<AxbandState>, text: string): () => void {
  let told = false;
  return () => {
    if (told) return;
    told = true;
    store.getState().pushMessage("alert", text);
  };
}

/** This tab's view of the saved revisions: the one its work builds on, and the newest heard from other tabs. */
function revisionTracker(local: KeyValueStorage | null, start: Revision | null) {
  const tab = newTabId();
  let base = start;
  let heard: Revision | null = null;
  return {
    /** The newest revision another tab saved that this tab's work does not build on, if any. */
    otherNewer(): Revision | null {
      const latest = newer(storedRevision(local), heard);
      return latest && latest.tab !== tab && latest.seq > (base?.seq ?? 0) ? latest : null;
    },
    /** The revision for the next save. */
    next(): Revision {
      return { seq: (newer(base, storedRevision(local))?.seq ?? 0) + 1, tab, at: Date.now() };
    },
    builtOn(rev: Revision): void {
      base = newer(base, rev);
    },
    hear(rev: Revision): void {
      heard = newer(heard, rev);
    },
    /** This tab keeps its work over the other tab's: it now builds on everything saved so far. */
    takeOver(): void {
      base = newer(storedRevision(local), heard);
    },
  };
}

/**
 * Puts the project text into localStorage, or into the spare store when localStorage is full; returns the
 * spare store's pending write (null when there is none), which ends in `savedAs` or a note of what was lost.
 */
function storeText(
  { local, spare, session }: Stores,
  { text, rev, project }: { text: string; rev: Revision; project: Project },
  savedAs: (rev: Revision) => void,
  problem: () => void,
): Promise<void> | null {
  if (!local) {
    problem();
    return null;
  }
  try {
    local.setItem(STORAGE_KEY, text);
    savedAs(rev);
    return null;
  } catch {
    problem();
    const kept = spare
      ? spare.put({ text, rev }).then(
          () => true,
          () => false,
        )
      : Promise.resolve(false);
    return kept.then((ok) => (ok ? savedAs(rev) : noteLost(session, project, rev)));
  }
}

interface AutosaveEvents {
  /** The project changed. */
  change(): void;
  /** The user chose how to settle a conflict with another tab. */
  choice(choice: "load" | "keep"): void;
  /** Another tab saved `rev`. */
  heard(rev: Revision): void;
  pageHide(): void;
}

/** Connects the events to the store, the other tabs and pagehide; returns the function that disconnects them. */
function wire(store: StoreApi<AxbandState>, channel: Stores["channel"], on: AutosaveEvents): () => void {
  const unsubscribe = store.subscribe((s, prev) => {
    if (s.project !== prev.project) on.change();
    const choice = s.ui.tabConflict?.choice;
    if (choice && choice !== prev.ui.tabConflict?.choice) on.choice(choice);
  });
  const unlisten = channel?.listen(on.heard);
  const onPageHide = () => on.pageHide();
  const target = globalThis as {
    addEventListener?: typeof addEventListener;
    removeEventListener?: typeof removeEventListener;
  };
  target.addEventListener?.("pagehide", onPageHide);
  return () => {
    unsubscribe();
    unlisten?.();
    target.removeEventListener?.("pagehide", onPageHide);
  };
}

/**
 * Saves the store's project after every change (debounced) and on pagehide.
 * Curve arrays are written only when their references changed since the last save. The text goes to
 * localStorage with a revision; when localStorage is full it goes to the spare store (IndexedDB), and when
 * that fails too a note of what was not saved goes to sessionStorage for the next start.
 */
export function startAutosave(store: StoreApi<AxbandState>, opts: AutosaveOpts = {}): Autosave {
  const stores = storesOf(opts);
  const revs = revisionTracker(stores.local, restoredRevisions.get(store) ?? storedRevision(stores.local));
  let timer: ReturnType<typeof setTimeout> | null = null;
  let lastSaved: Project | null = null;
  const problem = alertOnce(store, STORAGE_PROBLEM);
  const curveData = curveWriter(stores.curves, problem);
  const savedAs = (rev: Revision) => {
    revs.builtOn(rev);
    clearLost(stores.session);
    stores.channel?.post(rev);
  };
  const conflict = (rev: Revision) => {
    if (timer !== null) clearTimeout(timer);
    timer = null;
    if (!store.getState().ui.tabConflict) store.getState().setTabConflict({ savedAt: rev.at, choice: null });
  };

  const save = async (): Promise<void> => {
    timer = null;
    const file = loadedFileModule() ?? (await loadFileModule());
    const project = store.getState().project;
    if (project === lastSaved || store.getState().ui.tabConflict) return;
    const other = revs.otherNewer();
    if (other) return conflict(other);
    lastSaved = project;
    // Curves first, so a saved project never names curves whose data is not stored yet.
    const writes = curveData.write(project);
    const rev = revs.next();
    const text = withRevision(metaOf(file, project), rev);
    const kept = storeText(stores, { text, rev, project }, savedAs, problem);
    if (kept) writes.push(kept);
    await Promise.all(writes);
  };
  const schedule = () => {
    // Loaded at the first change (not at start-up), so that a save on pagehide finds it.
    if (!loadedFileModule()) void loadFileModule();
    if (timer !== null) clearTimeout(timer);
    timer = setTimeout(() => void save(), opts.debounceMs ?? 300);
  };
  const resolve = async (choice: "load" | "keep") => {
    if (choice === "keep") {
      // The other tab may have deleted curve data this tab still shows: write every curve again.
      revs.takeOver();
      curveData.reset(null);
      lastSaved = null;
      store.getState().setTabConflict(null);
      return save();
    }
    const loaded = await loadNewest(store, opts);
    store.getState().setTabConflict(null);
    if (!loaded) return;
    revs.builtOn(loaded.rev);
    curveData.reset(loaded.project);
    lastSaved = loaded.project;
  };
  const unwire = wire(store, stores.channel, {
    change: schedule,
    choice: (choice) => void resolve(choice),
    heard(rev) {
      revs.hear(rev);
      const other = revs.otherNewer();
      if (other) conflict(other);
    },
    pageHide: () => void save(),
  });

  return {
    flush() {
      if (timer !== null) clearTimeout(timer);
      return save();
    },
    stop() {
      if (timer !== null) clearTimeout(timer);
      timer = null;
      unwire();
    },
  };
}
