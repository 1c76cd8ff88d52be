// Autosave: keeps the project in browser storage (project without curve data in localStorage, curve arrays
// in IndexedDB keyed by curve id) and restores it on start; a link in the URL fragment wins over it.
// Storage that is full or missing is reported once (role="alert") and never stops the app.
import type { StoreApi } from "zustand";
import type { Project } from "../../project/types";
import { defaultProject } from "../../project/demo";
import { UNVERIFIED_LINK_NOTE, repairsNote } from "./open-notes";
import { PROJECT_LIMITS } from "../../project/limits";
import type { AxbandState } from "./types";

/** localStorage key of the saved project (without curve data). */
export const STORAGE_KEY = "axband:project";

export interface CurveArrays {
  massEv: Float64Array;
  gInvGeV: Float64Array;
}

/** Where curve arrays go: IndexedDB in the browser, a map in tests. */
export interface CurveDataStore {
  put(id: string, data: CurveArrays): Promise<void>;
  get(id: string): Promise<CurveArrays | undefined>;
  delete(id: string): Promise<void>;
}

/** The part of the Storage interface autosave uses. */
export type KeyValueStorage = Pick<Storage, "getItem" | "setItem">;

export interface AutosaveOpts {
  /** @default window.localStorage when reachable, else null (storage unavailable) */
  local?: KeyValueStorage | null;
  /** @default an IndexedDB store when indexedDB exists, else null */
  curves?: CurveDataStore | null;
  /** Quiet time after the last change before saving, in ms. @default 300 */
  debounceMs?: number;
}

export const STORAGE_PROBLEM =
  "Browser storage is full or unavailable, so changes are no longer saved in this browser. Your work is still open: save a project file to keep it.";

/** localStorage, or null where touching it throws (some private modes, sandboxed frames). */
export function browserLocalStorage(): KeyValueStorage | null {
  try {
    const s = globalThis.localStorage;
    return s ?? null;
  } catch {
    return null;
  }
}

function request<T>(r: IDBRequest<T>): Promise<T> {
  return new Promise((resolve, reject) => {
    r.onsuccess = () => resolve(r.result);
    r.onerror = () => reject(r.error);
  });
}

/** Points per stored chunk: 2 × 8 bytes × 65,536 = 1 MiB, a few ms of structured cloning per put. */
export const CHUNK_POINTS = 65_536;

/** The record stored under a curve's id; its data follow in `chunks` records keyed by {@link chunkKey}. */
export interface ChunkedHead {
  v: 1;
  length: number;
  chunks: number;
}

/** Key of chunk k of a curve ("\u0000" cannot appear in ids the app makes, and sorts first). */
export function chunkKey(id: string, k: number): string {
  return `${id}\u0000${String(k).padStart(6, "0")}`;
}

/** The head record of a curve's arrays cut into chunks of at most `size` points. */
export function chunkHead(data: CurveArrays, size = CHUNK_POINTS): ChunkedHead {
  const n = Math.min(data.massEv.length, data.gInvGeV.length);
  return { v: 1, length: n, chunks: Math.ceil(n / size) };
}

/** Chunk k of a curve's arrays: a copy, so it clones only its own bytes. */
export function chunkOf(data: CurveArrays, k: number, size = CHUNK_POINTS): CurveArrays {
  const n = Math.min(data.massEv.length, data.gInvGeV.length);
  const i = k * size;
  const j = Math.min(n, i + size);
  return { massEv: data.massEv.slice(i, j), gInvGeV: data.gInvGeV.slice(i, j) };
}

/** A curve's arrays cut into copies of at most `size` points (copies, so each clones only its own bytes). */
export function splitChunks(data: CurveArrays, size = CHUNK_POINTS): { head: ChunkedHead; chunks: CurveArrays[] } {
  const head = chunkHead(data, size);
  return { head, chunks: Array.from({ length: head.chunks }, (_, k) => chunkOf(data, k, size)) };
}

/** Puts a curve's arrays back together one chunk at a time (so each chunk can be read in its own task). */
export interface ChunkJoiner {
  /** Appends the next chunk; false (and the joiner is spoilt) when it is missing, malformed or too long. */
  add(chunk: CurveArrays | undefined): boolean;
  /** The arrays, or undefined when a chunk was bad or the count or total length disagrees with the head. */
  finish(): CurveArrays | undefined;
}

/** A {@link ChunkJoiner} for the chunks of `head`, in order. */
export function chunkJoiner(head: ChunkedHead): ChunkJoiner {
  const massEv = new Float64Array(head.length);
  const gInvGeV = new Float64Array(head.length);
  let o = 0;
  let count = 0;
  let ok = true;
  return {
    add(c) {
      if (!ok) return false;
      count++;
      if (
        count > head.chunks ||
        !c ||
        !(c.massEv instanceof Float64Array) ||
        !(c.gInvGeV instanceof Float64Array) ||
        c.massEv.length !== c.gInvGeV.length ||
        o + c.massEv.length > head.length
      ) {
        ok = false;
        return false;
      }
      massEv.set(c.massEv, o);
      gInvGeV.set(c.gInvGeV, o);
      o += c.massEv.length;
      return true;
    },
    finish: () => (ok && count === head.chunks && o === head.length ? { massEv, gInvGeV } : undefined),
  };
}

/** The arrays back from their chunks; undefined when a chunk is missing or the sizes disagree. */
export function joinChunks(head: ChunkedHead, chunks: (CurveArrays | undefined)[]): CurveArrays | undefined {
  if (chunks.length !== head.chunks) return undefined;
  const j = chunkJoiner(head);
  for (const c of chunks) if (!j.add(c)) return undefined;
  return j.finish();
}

/** Lets other work run between two chunk writes (structured cloning happens synchronously in put). */
const nextTask = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

/**
 * Curve arrays in IndexedDB (database "axband", object store "curves"); null when IndexedDB is missing.
 * A curve is written as ~1 MiB chunks, one per task, so a million-point curve never blocks the page for
 * long; its head record is written last, so an interrupted write reads back as missing, never as wrong.
 * @param dbName @default "axband"
 */
export function indexedDbCurveStore(dbName = "axband"): CurveDataStore | null {
  const idb = (globalThis as { indexedDB?: IDBFactory }).indexedDB;
  if (!idb) return null;
  let db: Promise<IDBDatabase> | null = null;
  const open = () => {
    if (!db) {
      const req = idb.open(dbName, 1);
      req.onupgradeneeded = () => req.result.createObjectStore("curves");
      db = request(req);
      db.catch(() => (db = null));
    }
    return db;
  };
  const tx = async <T>(mode: IDBTransactionMode, run: (s: IDBObjectStore) => IDBRequest<T>): Promise<T> => {
    const d = await open();
    const t = d.transaction("curves", mode);
    const result = request(run(t.objectStore("curves")));
    await new Promise<void>((resolve, reject) => {
      t.oncomplete = () => resolve();
      t.onerror = () => reject(t.error);
      t.onabort = () => reject(t.error ?? new Error("IndexedDB transaction aborted"));
    });
    return result;
  };
  const chunkRange = (id: string) => IDBKeyRange.bound(`${id}\u0000`, `${id}\u0001`, false, true);
  const remove = async (id: string) => {
    await tx("readwrite", (s) => s.delete(id));
    await tx("readwrite", (s) => s.delete(chunkRange(id)));
  };
  return {
    put: async (id, data) => {
      const head = chunkHead(data);
      await remove(id);
      for (let k = 0; k < head.chunks; k++) {
        if (k > 0) await nextTask();
        // Copied chunk by chunk in its own task: copying a million-point curve at once took 50–90 ms.
        const c = chunkOf(data, k);
        await tx("readwrite", (s) => s.put({ massEv: c.massEv, gInvGeV: c.gInvGeV }, chunkKey(id, k)));
      }
      await tx("readwrite", (s) => s.put(head, id));
    },
    get: async (id) => {
      const head = (await tx("readonly", (s) => s.get(id))) as Partial<ChunkedHead> | undefined;
      if (!head || head.v !== 1 || typeof head.length !== "number" || typeof head.chunks !== "number") return undefined;
      if (!(head.length >= 0 && head.length <= PROJECT_LIMITS.points)) return undefined;
      // One chunk per task: reading all at once (getAll) cloned 16 MB in one callback, and joining them in
      // the same task made a start-up task of a few hundred ms for a million points.
      const joiner = chunkJoiner(head as ChunkedHead);
      for (let k = 0; k < head.chunks; k++) {
        await nextTask();
        const c = (await tx("readonly", (s) => s.get(chunkKey(id, k)))) as CurveArrays | undefined;
        if (!joiner.add(c)) return undefined;
      }
      return joiner.finish();
    },
    delete: remove,
  };
}

const NO_DATA = new Float64Array(0);

// The project codec and schema load on demand, apart from the first figure: only a stored project, a link
// or a save needs them. `fileModule` is the loaded module, so that a save on pagehide stays synchronous.
type FileModule = typeof import("../../formats/project-file");
let fileModule: FileModule | null = null;
function loadFileModule(): Promise<FileModule> {
  return import("../../formats/project-file").then((m) => (fileModule = m));
}

/**
 * The localStorage text of a project. The curve arrays are left out before serialising: they are not part of
 * the text anyway, and converting millions of numbers on every save would stall zooming.
 */
function metaOf({ serializeForStorage }: FileModule, project: Project): string {
  return serializeForStorage({
    ...project,
    curves: project.curves.map((c) => ({ ...c, massEv: NO_DATA, gInvGeV: NO_DATA })),
  }).meta;
}

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
    const file = fileModule ?? (await loadFileModule());
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
    if (!fileModule) void loadFileModule();
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

/** The autosaved project, or null when there is none; problems with it become messages. */
export async function restoreAutosave(store: StoreApi<AxbandState>, opts: AutosaveOpts = {}): Promise<Project | null> {
  const local = opts.local === undefined ? browserLocalStorage() : opts.local;
  const curves = opts.curves === undefined ? indexedDbCurveStore() : opts.curves;
  let text: string | null;
  try {
    text = local ? local.getItem(STORAGE_KEY) : null;
  } catch {
    text = null;
  }
  if (!text) return null;
  const ids = new Set<string>();
  try {
    const raw = JSON.parse(text) as { curves?: { id?: unknown }[] };
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
  const { deserializeFromStorage } = fileModule ?? (await loadFileModule());
  const r = deserializeFromStorage(text, data);
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
    store
      .getState()
      .pushMessage("alert", `This link could not be opened: ${sentence(r.error)} Your previous project is unchanged.`);
  }
  (opts.clearFragment ?? (() => loc && history.replaceState(null, "", loc.pathname + loc.search)))();
}
