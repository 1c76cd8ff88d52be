// Lets browser test files run two at a time while the files that time the page's main thread run alone: a shared /
// alone lock served from global-setup.ts, taken for each whole file by setup.ts (alone files call runsAlone()).
import { createServer, type Server } from "node:http";

interface Waiter {
  alone: boolean;
  grant: () => void;
}

/** Starts the lock server on 127.0.0.1; its URL goes to the test files through Vitest's provide/inject. */
export async function startRunLock(): Promise<{ url: string; close: () => Promise<void> }> {
  let shared = 0;
  let aloneHeld = false;
  const queue: Waiter[] = [];
  const holders = new Map<string, boolean>();
  let nextToken = 0;
  // First come, first served: a file waiting to run alone holds back the shared files behind it (no starving).
  const grantWaiting = () => {
    while (queue.length > 0) {
      const head = queue[0];
      if (aloneHeld || (head.alone && shared > 0)) return;
      queue.shift();
      if (head.alone) aloneHeld = true;
      else shared++;
      head.grant();
    }
  };
  const server: Server = createServer((req, res) => {
    const url = new URL(req.url ?? "/", "http://127.0.0.1");
    if (url.pathname === "/acquire") {
      const alone = url.searchParams.get("mode") === "alone";
      const token = String(nextToken++);
      queue.push({
        alone,
        grant: () => {
          holders.set(token, alone);
          res.end(token);
        },
      });
      grantWaiting();
    } else if (url.pathname === "/release") {
      const token = url.searchParams.get("token") ?? "";
      const alone = holders.get(token);
      if (alone !== undefined) {
        holders.delete(token);
        if (alone) aloneHeld = false;
        else shared--;
        grantWaiting();
      }
      res.end();
    } else {
      res.statusCode = 404;
      res.end();
    }
  });
  // A file may wait minutes for the alone files before it (the hook timeout is the limit, not the server).
  server.requestTimeout = 0;
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const address = server.address();
  const port = typeof address === "object" && address ? address.port : 0;
  return {
    url: `http://127.0.0.1:${port}/`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

const ALONE = Symbol.for("axband.browserTestRunsAlone");

/**
 * Marks the calling test file to run with no other browser test file at the same time (call it at the top level):
 * for files that check how long the page's main-thread tasks take, which a second file's page would stretch.
 */
export function runsAlone(): void {
  (globalThis as Record<symbol, boolean>)[ALONE] = true;
}

/** Whether this file called runsAlone(), cleared for the next file a worker runs (setup.ts, once it is collected). */
export function takeAloneMark(): boolean {
  const g = globalThis as Record<symbol, boolean>;
  const alone = g[ALONE] === true;
  delete g[ALONE];
  return alone;
}
