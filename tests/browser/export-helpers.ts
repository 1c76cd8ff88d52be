// Helpers for the export, share and overlap browser tests: catch a download the page starts and read it.
import { buffer } from "node:stream/consumers";
import type { Page } from "playwright-core";
import type { ReusedContext } from "./fresh-context";

/** Runs `action`, waits for the download it starts, and returns the file's name and bytes. */
export async function download(page: Page, action: () => Promise<unknown>): Promise<{ name: string; bytes: Buffer }> {
  const [d] = await Promise.all([page.waitForEvent("download", { timeout: 60_000 }), action()]);
  // Read through a stream: the browser is shared and connected to (global-setup.ts), where path() is not offered.
  const failure = await d.failure();
  if (failure) throw new Error(`download ${d.suggestedFilename()} failed: ${failure}`);
  return { name: d.suggestedFilename(), bytes: await buffer(await d.createReadStream()) };
}

/** Clicks the export-svg control and returns the SVG text. */
export async function exportSvg(page: Page): Promise<{ name: string; text: string }> {
  const { name, bytes } = await download(page, () => page.click('[data-testid="export-svg"]'));
  return { name, text: bytes.toString("utf8") };
}

/**
 * The file's context emptied (every page closed, no storage: as a new context) with the app loaded in a new page.
 * Make `contexts` with downloads accepted and a desktop-sized window.
 */
export async function openFreshPage(contexts: ReusedContext, baseUrl: string): Promise<Page> {
  const page = await (await contexts.fresh()).newPage();
  await page.goto(baseUrl, { waitUntil: "networkidle" });
  return page;
}
