// Tabs of the app tell each other about their saves (BroadcastChannel, or the storage event where that is
// missing), so that a tab never saves over newer work of another tab without asking.
import { type Revision, isRevision, splitRevision } from "./autosave-revision";

/** How a tab announces its saves and hears those of the others. */
export interface TabChannel {
  post(rev: Revision): void;
  /** Calls `listener` with each revision another tab saved; returns the unsubscribe function. */
  listen(listener: (rev: Revision) => void): () => void;
}

/** BroadcastChannel "axband" where it exists, else the storage event of localStorage key `storageKey`. */
export function browserTabChannel(storageKey: string): TabChannel | null {
  const g = globalThis as {
    BroadcastChannel?: typeof BroadcastChannel;
    addEventListener?: typeof addEventListener;
    removeEventListener?: typeof removeEventListener;
  };
  if (g.BroadcastChannel) {
    const channel = new g.BroadcastChannel("axband");
    return {
      post: (rev) => channel.postMessage({ saved: rev }),
      listen(listener) {
        const on = (e: MessageEvent) => {
          const rev = (e.data as { saved?: unknown } | null)?.saved;
          if (isRevision(rev)) listener(rev);
        };
        channel.addEventListener("message", on);
        return () => channel.removeEventListener("message", on);
      },
    };
  }
  if (!g.addEventListener || !g.removeEventListener) return null;
  const remove = g.removeEventListener;
  return {
    // The storage event fires in the other tabs by itself when the text is written.
    post: () => undefined,
    listen(listener) {
      const on = (e: StorageEvent) => {
        if (e.key === storageKey && e.newValue) listener(splitRevision(e.newValue).rev);
      };
      g.addEventListener!("storage", on as EventListener);
      return () => remove("storage", on as EventListener);
    },
  };
}
