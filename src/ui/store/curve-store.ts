// The IndexedDB store of curve arrays (database "axband", object store "curves"), written in chunks so a
// million-point curve never blocks the page for long.
import { PROJECT_LIMITS } from "../../project/limits";
import {
  type ChunkedHead,
  type CurveArrays,
  chunkHead,
  chunkJoiner,
  chunkKey,
  chunkOf,
  nextTask,
} from "./autosave-chunks";
import { type SpareRecord, type SpareStore, isRevision } from "./autosave-revision";

/** Where curve arrays go: IndexedDB in the browser, a map in tests. */
export interface CurveDataStore {
  put(id: string, data: CurveArrays): Promise<void>;
  get(id: string): Promise<CurveArrays | undefined>;
  delete(id: string): Promise<void>;
}

function request<T>(r: IDBRequest<T>): Promise<T> {
  return new Promise((resolve, reject) => {
    r.onsuccess = () => resolve(r.result);
    r.onerror = () => reject(r.error);
  });
}

type Tx = <T>(mode: IDBTransactionMode, run: (s: IDBObjectStore) => IDBRequest<T>) => Promise<T>;

/** One transaction on the "curves" object store of `dbName`, opening the database once; null without IndexedDB. */
function curvesTx(dbName: string): Tx | null {
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
  return async (mode, run) => {
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
}

/**
 * Curve arrays in IndexedDB (database "axband", object store "curves"); null when IndexedDB is missing.
 * A curve is written as ~1 MiB chunks, one per task, so a million-point curve never blocks the page for
 * long; its head record is written last, so an interrupted write reads back as missing, never as wrong.
 * @param dbName @default "axband"
 */
export function indexedDbCurveStore(dbName = "axband"): CurveDataStore | null {
  const tx = curvesTx(dbName);
  if (!tx) return null;
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

/** The spare copy of the project text in IndexedDB, under a key no curve id can take (ids never start with "\u0001"). */
const SPARE_KEY = "\u0001project";

/**
 * The spare copy of the project text for when localStorage is full (IndexedDB has far more room); same
 * database and object store as the curve data. Null when IndexedDB is missing.
 */
export function indexedDbSpareStore(dbName = "axband"): SpareStore | null {
  const tx = curvesTx(dbName);
  if (!tx) return null;
  return {
    put: async (rec) => void (await tx("readwrite", (s) => s.put(rec, SPARE_KEY))),
    get: async () => {
      const r = (await tx("readonly", (s) => s.get(SPARE_KEY))) as Partial<SpareRecord> | undefined;
      return r && typeof r.text === "string" && isRevision(r.rev) ? { text: r.text, rev: r.rev } : undefined;
    },
  };
}
