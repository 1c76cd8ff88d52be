// Finds a locally installed Chromium for the browser tests and launches it headless; never downloads one.
// One Chromium serves the whole run (started in global-setup.ts); each test file connects to it.
import { existsSync } from "node:fs";
import { inject } from "vitest";
import { chromium, type Browser, type BrowserServer, type Page } from "playwright-core";

// Debian's headless shell first: the same Chromium build (source package chromium) without the browser's own UI
// layer, "more performant for automation tasks" (Puppeteer's guide, Headless mode); here it halved the browser tests'
// Chromium CPU time (229 → 127 s over the browser tests on two cores). The full browser is the fallback, and what the benchmarks measure.
const CANDIDATES = [
  "/usr/bin/chromium-headless-shell",
  "/usr/bin/chromium",
  "/usr/bin/chromium-browser",
  "/usr/bin/google-chrome",
  "/usr/bin/google-chrome-stable",
  "/opt/google/chrome/chrome",
  "/Applications/Google Chrome.app/Contents/MacOS/Google Chrome",
  "/Applications/Chromium.app/Contents/MacOS/Chromium",
];

/** Path of the Chromium to use: $CHROMIUM_PATH, then the usual install locations. Throws a plain sentence. */
export function findChromium(): string {
  const fromEnv = process.env.CHROMIUM_PATH;
  if (fromEnv) {
    if (existsSync(fromEnv)) return fromEnv;
    throw new Error(
      `CHROMIUM_PATH is set to ${fromEnv}, but no file is there. Point it at a Chromium or Chrome binary.`,
    );
  }
  const found = CANDIDATES.find((p) => existsSync(p));
  if (!found) {
    throw new Error(
      "No Chromium found for the browser tests. Install one (Debian: apt-get install chromium) or set CHROMIUM_PATH to a Chromium or Chrome binary; the tests never download a browser.",
    );
  }
  return found;
}

export const CHROMIUM_ARGS = [
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];

/** Starts the run's one headless Chromium (global-setup.ts); files connect to it with launchChromium(). */
export function startChromiumServer(): Promise<BrowserServer> {
  return chromium.launchServer({ executablePath: findChromium(), headless: true, args: CHROMIUM_ARGS });
}

/**
 * The run's Chromium, connected to (launching one per file cost about a second each on two cores). A test file
 * works in its own contexts; close() drops the connection and those contexts, never the shared browser.
 */
export function launchChromium(): Promise<Browser> {
  return chromium.connect(inject("chromiumWs"));
}

export interface Watched {
  consoleErrors: string[];
  foreignRequests: string[];
}

/** Records console errors, page errors and every request that would leave 127.0.0.1. */
export function watchPage(page: Page): Watched {
  const w: Watched = { consoleErrors: [], foreignRequests: [] };
  page.on("console", (m) => {
    if (m.type() === "error") w.consoleErrors.push(m.text());
  });
  page.on("pageerror", (e) => w.consoleErrors.push(String(e)));
  page.on("request", (r) => {
    const url = r.url();
    if (url.startsWith("data:") || url.startsWith("blob:")) return;
    const host = new URL(url).hostname;
    if (host !== "127.0.0.1") w.foreignRequests.push(url);
  });
  return w;
}
