// Builds the app once and serves it in-process on 127.0.0.1 for the browser tests (no orphan servers).
import type { TestProject } from "vitest/node";
import { build, preview, type PreviewServer } from "vite";
import { findChromium } from "./chromium";

let server: PreviewServer | undefined;

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  findChromium(); // fail early with the plain sentence when no browser is installed
  if (!process.env.AXBAND_SKIP_BUILD) {
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
  server = await preview({ preview: { port: 0, host: "127.0.0.1", strictPort: false }, logLevel: "warn" });
  const address = server.httpServer.address();
  const port = typeof address === "object" && address ? address.port : 4173;
  project.provide("baseUrl", `http://127.0.0.1:${port}/`);
  return async () => {
    await new Promise<void>((resolve) => server?.httpServer.close(() => resolve()));
  };
}
