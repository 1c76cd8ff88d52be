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
  if (!process.env.AXBAND_SKIP_BUILD) await build({ logLevel: "warn" });
  server = await preview({ preview: { port: 0, host: "127.0.0.1", strictPort: false }, logLevel: "warn" });
  const address = server.httpServer.address();
  const port = typeof address === "object" && address ? address.port : 4173;
  project.provide("baseUrl", `http://127.0.0.1:${port}/`);
  return async () => {
    await new Promise<void>((resolve) => server?.httpServer.close(() => resolve()));
  };
}
