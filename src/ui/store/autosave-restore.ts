// Restoring the autosaved project at start-up, then opening a share link from the URL fragment over it.
import type { StoreApi } from "zustand";
import type { Project } from "../../project/types";
import { defaultProject } from "../../project/demo";
import { UNVERIFIED_LINK_NOTE, linkRefusedNote, repairsNote } from "./open-notes";
import type { AxbandState } from "./types";
import { CHUNK_POINTS, type CurveArrays, nextTask } from "./autosave-chunks";
import type { DeserializeResult } from "../../formats/project-file";
import { type Revision, type SpareRecord, newer, splitRevision } from "./autosave-revision";
import { tellLost } from "./autosave-lost";
import { type AutosaveOpts, STORAGE_KEY, loadFileModule, loadedFileModule, storesOf } from "./autosave-storage";

/** How long start-up waits for one curve's data (a blocked IndexedDB must not keep the app from starting). */
const CURVE_READ_TIMEOUT_MS = 4000;

function withTimeout<T>(p: Promise<T>, ms: number): Promise<T | undefined> {
  return new Promise((resolve, reject) => {
    const t = setTimeout(() => resolve(undefined), ms);
    p.then(
      (v) => {
        clearTimeout(t);
        resolve(v);
      },
      (e) => {
        clearTimeout(t);
        reject(e);
      },
    );
  });
}

/** The newest saved project text (localStorage or the spare copy) with its revision; null when there is none. */
export async function readNewest(opts: AutosaveOpts): Promise<{ meta: string; rev: Revision } | null> {
  const { local, spare } = storesOf(opts);
  let text: string | null;
  try {
    text = local ? local.getItem(STORAGE_KEY) : null;
  } catch {
    text = null;
  }
  let kept: SpareRecord | undefined;
  try {
    kept = spare ? await withTimeout(spare.get(), CURVE_READ_TIMEOUT_MS) : undefined;
  } catch {
    kept = undefined;
  }
  const fromLocal = text ? splitRevision(text) : null;
  if (!kept) return fromLocal;
  if (!fromLocal) return { meta: kept.text, rev: kept.rev };
  return newer(fromLocal.rev, kept.rev) === kept.rev ? { meta: kept.text, rev: kept.rev } : fromLocal;
}

/** The project of saved text with its curve data read back from the curve store. */
export async function loadSaved(meta: string, opts: AutosaveOpts): Promise<DeserializeResult> {
  const { curves } = storesOf(opts);
  const ids = new Set<string>();
  try {
    const raw = JSON.parse(meta) as { curves?: { id?: unknown }[] };
    for (const c of Array.isArray(raw?.curves) ? raw.curves : []) if (typeof c?.id === "string") ids.add(c.id);
  } catch {
    // deserializeFromStorage reports unreadable text below.
  }
  const data: (CurveArrays & { id: string })[] = [];
  if (curves) {
    await Promise.all(
      [...ids].map(async (id) => {
        try {
          const d = await withTimeout(curves.get(id), CURVE_READ_TIMEOUT_MS);
          if (d && d.massEv instanceof Float64Array && d.gInvGeV instanceof Float64Array)
            data.push({ id, massEv: d.massEv, gInvGeV: d.gInvGeV });
        } catch {
          // A curve that cannot be read is reported as missing.
        }
      }),
    );
  }
  // Validating (and copying) the curve data is O(points): for big curves in a task of its own, not after the
  // last read (a chunk's worth of points takes a few ms, not worth a task).
  if (data.reduce((n, d) => n + d.massEv.length, 0) > CHUNK_POINTS) await nextTask();
  const { deserializeFromStorage } = loadedFileModule() ?? (await loadFileModule());
  return deserializeFromStorage(meta, data);
}

/** The revision each store was restored from: its autosave continues from there. */
export const restoredRevisions = new WeakMap<StoreApi<AxbandState>, Revision>();

/** The autosaved project, or null when there is none; problems with it become messages. */
export async function restoreAutosave(store: StoreApi<AxbandState>, opts: AutosaveOpts = {}): Promise<Project | null> {
  const newest = await readNewest(opts);
  const r = newest ? await loadSaved(newest.meta, opts) : null;
  tellLost(store, storesOf(opts).session, newest?.rev ?? null, r?.ok ? r.project : null);
  if (!newest || !r) return null;
  restoredRevisions.set(store, newest.rev);
  if (!r.ok) {
    store.getState().pushMessage("alert", `${sentence(r.error)} Starting from the demo project.`);
    return null;
  }
  if (r.repairs.length > 0) {
    store.getState().pushMessage("alert", `The autosaved project was restored with changes: ${r.repairs.join("; ")}.`);
  }
  return r.project;
}

/** Text ending with exactly one full stop. */
function sentence(text: string): string {
  const t = text.trim();
  return /[.!?]$/.test(t) ? t : `${t}.`;
}

export interface StartOpts extends AutosaveOpts {
  /** The page's URL fragment without "#" (a share link). @default location.hash */
  fragment?: string;
  /** Called after a link was opened, to drop the fragment (so a reload does not reopen it over later edits). */
  clearFragment?: () => void;
}

/**
 * Sets the store's start project: the autosave (or the demo project), then a link in the fragment on top
 * of it (undoable, so the user can go back to their own project). A bad link leaves the restored project.
 */
export async function initProject(store: StoreApi<AxbandState>, opts: StartOpts = {}): Promise<void> {
  const restored = await restoreAutosave(store, opts);
  store.getState().resetProject(restored ?? defaultProject());
  const loc = (globalThis as { location?: Location }).location;
  const fragment = (opts.fragment ?? loc?.hash ?? "").replace(/^#/, "");
  if (!fragment) return;
  const { decodeLink } = await import("../../formats/codec");
  const r = decodeLink(fragment);
  if (r.ok) {
    const left = r.omittedCurveCount;
    const note =
      left > 0
        ? ` The link leaves out the data of ${left === 1 ? "one curve" : `${left} curves`}; ask the sender for the project file to see ${left === 1 ? "it" : "them"}.`
        : "";
    store
      .getState()
      .replaceProject(
        r.project,
        `Opened the project from the link. Undo returns to your previous project.${note}${repairsNote(r.repairs, "The link")}${r.verified ? "" : UNVERIFIED_LINK_NOTE}`,
      );
  } else {
    store.getState().pushMessage("alert", linkRefusedNote(r.error));
  }
  (opts.clearFragment ?? (() => loc && history.replaceState(null, "", loc.pathname + loc.search)))();
}
