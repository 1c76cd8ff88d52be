// The import step loads on first use (a pick, a paste or a drop), apart from the first figure: this light module
// starts the load, runs the asked action once the step's store is there, and tells the page the step is wanted.
import { useSyncExternalStore } from "react";
import type { ImportState } from "./import-store";

let loading: Promise<typeof import("./import-store")> | null = null;
let requested = false;
const listeners = new Set<() => void>();

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** Loads the import step (once) and runs `action` on its store. */
export function withImport(action: (s: ImportState) => unknown): void {
  if (!requested) {
    requested = true;
    for (const l of listeners) l();
  }
  loading ??= import("./import-store");
  void loading.then((m) => action(m.useImport.getState()));
}

/** True once the import step has been asked for (its dialog is then mounted, and shows itself when it has work). */
export function useImportRequested(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => requested,
    () => false,
  );
}
