// Where autosave keeps the project text (localStorage) and the lazily loaded codec both saving and
// restoring use; shared by autosave.ts and autosave-restore.ts.
import type { Project } from "../../project/types";
import { type CurveDataStore, indexedDbCurveStore, indexedDbSpareStore } from "./curve-store";
import type { SpareStore } from "./autosave-revision";
import { type TabChannel, browserTabChannel } from "./autosave-tabs";

/** localStorage key of the saved project (without curve data). */
export const STORAGE_KEY = "axband:project";

/** The part of the Storage interface autosave uses. */
export type KeyValueStorage = Pick<Storage, "getItem" | "setItem">;

/** The part of sessionStorage autosave uses. */
export type SessionStorage = Pick<Storage, "getItem" | "setItem" | "removeItem">;

export interface AutosaveOpts {
  /** @default window.localStorage when reachable, else null (storage unavailable) */
  local?: KeyValueStorage | null;
  /** @default an IndexedDB store when indexedDB exists, else null */
  curves?: CurveDataStore | null;
  /** Where the project text goes when localStorage is full. @default IndexedDB, when `curves` is defaulted too */
  spare?: SpareStore | null;
  /** Where a note of unsaved work survives a reload. @default sessionStorage, when `local` is defaulted too */
  session?: SessionStorage | null;
  /** How tabs hear of each other's saves. @default BroadcastChannel (or storage events), when `local` is defaulted too */
  channel?: TabChannel | null;
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

/** The stores of `opts` with their defaults (the browser's own stores only when the test-facing ones are defaulted). */
export function storesOf(opts: AutosaveOpts) {
  const session = () => {
    try {
      return globalThis.sessionStorage ?? null;
    } catch {
      return null;
    }
  };
  return {
    local: opts.local === undefined ? browserLocalStorage() : opts.local,
    curves: opts.curves === undefined ? indexedDbCurveStore() : opts.curves,
    spare: opts.spare === undefined ? (opts.curves === undefined ? indexedDbSpareStore() : null) : opts.spare,
    session: opts.session === undefined ? (opts.local === undefined ? session() : null) : opts.session,
    channel:
      opts.channel === undefined ? (opts.local === undefined ? browserTabChannel(STORAGE_KEY) : null) : opts.channel,
  };
}

const NO_DATA = new Float64Array(0);

// The project codec and schema load on demand, apart from the first figure: only a stored project, a link
// or a save needs them. `fileModule` is the loaded module, so that a save on pagehide stays synchronous.
type FileModule = typeof import("../../formats/project-file");
let fileModule: FileModule | null = null;
export function loadFileModule(): Promise<FileModule> {
  return import("../../formats/project-file").then((m) => (fileModule = m));
}

/** The codec module when already loaded (a save on pagehide must not wait for an import). */
export const loadedFileModule = (): FileModule | null => fileModule;

/**
 * The localStorage text of a project. The curve arrays are left out before serialising: they are not part of
 * the text anyway, and converting millions of numbers on every save would stall zooming.
 */
export function metaOf({ serializeForStorage }: FileModule, project: Project): string {
  return serializeForStorage({
    ...project,
    curves: project.curves.map((c) => ({ ...c, massEv: NO_DATA, gInvGeV: NO_DATA })),
  }).meta;
}
