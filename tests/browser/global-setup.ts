// Builds the app once and serves it in-process on 127.0.0.1 for the browser tests (no orphan servers), starts the
// one headless Chromium all test files connect to, and serves the run lock that lets files run two at a time.
import type { TestProject } from "vitest/node";
import { build, preview, type PreviewServer } from "vite";
import type { BrowserServer } from "playwright-core";
import { startChromiumServer } from "./chromium";
import { startRunLock } from "./run-lock";

let server: PreviewServer | undefined;
let chromiumServer: BrowserServer | undefined;
let runLock: Awaited<ReturnType<typeof startRunLock>> | undefined;

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    chromiumWs: string;
    runLockUrl: string;
  }
}

export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  // Started first (it fails early with a plain sentence when no browser is installed) and while the app builds.
  const chromiumStarting = startChromiumServer();
  const teardown = async () => {
    await (chromiumServer ?? (await chromiumStarting.catch(() => undefined)))?.close();
    await new Promise<void>((resolve) => (server ? server.httpServer.close(() => resolve()) : resolve()));
    await runLock?.close();
  };
  try {
    // Set by tests/run-all.mjs for its second browser run: the first one built dist/ from the same sources.
    if (!process.env.AXBAND_SKIP_BUILD) await buildApp();
    server = await preview({ preview: { port: 0, host: "127.0.0.1", strictPort: false }, logLevel: "warn" });
    const address = server.httpServer.address();
    const port = typeof address === "object" && address ? address.port : 4173;
    project.provide("baseUrl", `http://127.0.0.1:${port}/`);
    chromiumServer = await chromiumStarting;
    project.provide("chromiumWs", chromiumServer.wsEndpoint());
    runLock = await startRunLock();
    project.provide("runLockUrl", runLock.url);
  } catch (e) {
    await teardown();
    throw e;
  }
  return teardown;
}

async function buildApp(): Promise<void> {
  // The bundle `npm run build` ships: Vitest sets NODE_ENV=test, and Vite keeps a NODE_ENV it finds, which
  // would bundle React's development build (StrictMode double renders, per-element stack capture) and the
  // timing checks would measure that instead of the app.
  const nodeEnv = process.env.NODE_ENV;
  process.env.NODE_ENV = "production";
  try {
    await build({ mode: "production", logLevel: "warn" });
  } finally {
    if (nodeEnv === undefined) delete process.env.NODE_ENV;
    else process.env.NODE_ENV = nodeEnv;
  }
}
