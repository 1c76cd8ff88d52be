// Helpers for the export, share and overlap browser tests: catch a download the page starts and read it.
import { buffer } from "node:stream/consumers";
import type { Browser, BrowserContext, Page } from "playwright-core";

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

/** A new context (downloads accepted, a desktop-sized window) with the app loaded. */
export async function openFreshPage(
  browser: Browser,
  baseUrl: string,
): Promise<{ page: Page; context: BrowserContext }> {
  const context = await browser.newContext({ acceptDownloads: true, viewport: { width: 1400, height: 950 } });
  const page = await context.newPage();
  await page.goto(baseUrl, { waitUntil: "networkidle" });
  return { page, context };
}
