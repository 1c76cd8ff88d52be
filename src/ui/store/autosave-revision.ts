// Revisions of autosaved work: every save carries one (a counter that only grows, the saving tab's id and
// the time), so that restoring can pick the newest copy and a tab can tell that another tab saved newer work.

/** One saved state: `seq` grows by one with every save of any tab (each tab continues from the newest it knows). */
export interface Revision {
  seq: number;
  tab: string;
  /** Time of the save, ms since 1970 (for messages only; order is by `seq`). */
  at: number;
}

/** The spare copy of the project text, kept where there is room when localStorage is full. */
export interface SpareRecord {
  text: string;
  rev: Revision;
}

/** Where the spare copy goes: IndexedDB in the browser, a variable in tests. */
export interface SpareStore {
  put(rec: SpareRecord): Promise<void>;
  get(): Promise<SpareRecord | undefined>;
}

/** sessionStorage key of a note that a save could not be stored anywhere (survives a reload of the tab). */
export const UNSAVED_KEY = "axband:unsaved";

// The revision rides at the end of the stored project text, so text and revision are written in one setItem.
const REVISION_FIELD = "axbandRevision";
const TAIL = new RegExp(`,"${REVISION_FIELD}":(\\{[^{}]*\\})\\}$`);

export function isRevision(r: unknown): r is Revision {
  const v = r as Partial<Revision> | null;
  return (
    typeof v === "object" &&
    v !== null &&
    Number.isSafeInteger(v.seq) &&
    typeof v.tab === "string" &&
    typeof v.at === "number"
  );
}

/** The stored text: the project's JSON object with the revision added as its last field. */
export function withRevision(meta: string, rev: Revision): string {
  return `${meta.slice(0, meta.lastIndexOf("}"))},"${REVISION_FIELD}":${JSON.stringify(rev)}}`;
}

/** The revision of stored text and the text without it; texts saved before revisions existed get seq 0. */
export function splitRevision(text: string): { meta: string; rev: Revision } {
  const m = TAIL.exec(text);
  if (m) {
    try {
      const rev: unknown = JSON.parse(m[1]);
      if (isRevision(rev)) return { meta: `${text.slice(0, m.index)}}`, rev };
    } catch {
      // Not a revision: the text is handed on as it is, and the codec reports what is wrong with it.
    }
  }
  return { meta: text, rev: { seq: 0, tab: "", at: 0 } };
}

/** The newer of two revisions (by counter; the tab id breaks ties so that every tab picks the same one). */
export function newer(a: Revision | null, b: Revision | null): Revision | null {
  if (!a || !b) return a ?? b;
  if (a.seq !== b.seq) return a.seq > b.seq ? a : b;
  return a.tab >= b.tab ? a : b;
}

/** A random id for this tab. */
export function newTabId(): string {
  const c = (globalThis as { crypto?: { randomUUID?: () => string } }).crypto;
  return c?.randomUUID?.() ?? `tab-${Math.random().toString(36).slice(2)}-${Date.now().toString(36)}`;
}
