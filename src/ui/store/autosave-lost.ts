// Work that could not be saved anywhere (localStorage and IndexedDB both full): a short note of it is kept in
// sessionStorage (its own quota, and it survives a reload), so that the reload says what was lost.
import type { StoreApi } from "zustand";
import type { Project } from "../../project/types";
import type { AxbandState } from "./types";
import { UNSAVED_KEY, type Revision } from "./autosave-revision";
import type { SessionStorage } from "./autosave-storage";

/** What the note keeps: the failed save's counter and time, and the labels of the unsaved project's items. */
interface LostNote {
  seq: number;
  at: number;
  models: string[];
  curves: string[];
}

/** Most labels of each kind kept in the note (it must stay small). */
const NOTE_LABELS = 20;

/** Notes that the project of revision `rev` could not be saved (the first failure's time is kept). */
export function noteLost(session: SessionStorage | null, project: Project, rev: Revision): void {
  if (!session) return;
  try {
    const before = readNote(session);
    const note: LostNote = {
      seq: rev.seq,
      at: before?.at ?? rev.at,
      models: project.models.slice(0, NOTE_LABELS).map((m) => m.label || `E/N = ${m.eOverNMin}`),
      curves: project.curves.slice(0, NOTE_LABELS).map((c) => c.label),
    };
    session.setItem(UNSAVED_KEY, JSON.stringify(note));
  } catch {
    // Nowhere left to write: nothing more can be done.
  }
}

/** Drops the note after a save succeeded. */
export function clearLost(session: SessionStorage | null): void {
  try {
    session?.removeItem(UNSAVED_KEY);
  } catch {
    // A note that cannot be removed is ignored on reload once a newer save exists (it compares counters).
  }
}

function readNote(session: SessionStorage): LostNote | null {
  try {
    const n = JSON.parse(session.getItem(UNSAVED_KEY) ?? "null") as Partial<LostNote> | null;
    if (!n || typeof n.seq !== "number" || typeof n.at !== "number") return null;
    const strings = (a: unknown) => (Array.isArray(a) ? a.filter((x): x is string => typeof x === "string") : []);
    return { seq: n.seq, at: n.at, models: strings(n.models), curves: strings(n.curves) };
  } catch {
    return null;
  }
}

/**
 * At start-up: when the note is newer than what was restored, an alert says since when changes were lost
 * and names the models and curves that the lost state had and the restored one has not. The note is dropped.
 */
export function tellLost(
  store: StoreApi<AxbandState>,
  session: SessionStorage | null,
  restored: Revision | null,
  project: Project | null,
): void {
  const note = session ? readNote(session) : null;
  if (!note) return;
  clearLost(session);
  if (restored && restored.seq >= note.seq) return;
  const models = new Set(project?.models.map((m) => m.label || `E/N = ${m.eOverNMin}`));
  const curves = new Set(project?.curves.map((c) => c.label));
  const gone = [
    ...note.models.filter((l) => !models.has(l)).map((l) => `model "${l}"`),
    ...note.curves.filter((l) => !curves.has(l)).map((l) => `curve "${l}"`),
  ];
  const when = new Date(note.at).toLocaleString();
  const named = gone.length > 0 ? ` Not restored: ${gone.join(", ")}.` : "";
  store
    .getState()
    .pushMessage(
      "alert",
      `Changes made since ${when} were lost: browser storage was full, so they could not be saved.${named} Other edits since then (values, settings) are lost too.`,
    );
}
