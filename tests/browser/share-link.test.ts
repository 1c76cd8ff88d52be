// Share links in real Chromium: the link from `share-link` opened in a fresh browser context (no autosave
// to fall back on) gives the same exported SVG byte for byte; a tampered link shows a role="alert"
// message and leaves the open project as it was (issue 6: "a malformed, truncated, tampered … link shows a
// clear message and leaves the current project untouched").
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchChromium, watchPage } from "./chromium";
import { reusedContext } from "./fresh-context";
import { exportSvg } from "./export-helpers";

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

const contexts = reusedContext(() => browser, { acceptDownloads: true, viewport: { width: 1400, height: 950 } });

/** A new page in the file's context, emptied first (the pages before it close: as a fresh context). */
async function freshPage(): Promise<{ page: Page }> {
  const context = await contexts.fresh();
  await context.grantPermissions(["clipboard-read", "clipboard-write"], { origin: new URL(inject("baseUrl")).origin });
  return { page: await context.newPage() };
}

test("a copied link reopens the same figure in a fresh context; a tampered link is refused", async () => {
  const a = await freshPage();
  const watchedA = watchPage(a.page);
  await a.page.goto(inject("baseUrl"), { waitUntil: "networkidle" });
  // Change something so the link carries more than the demo state: a model with a theory spread.
  await a.page.fill('[data-testid="model-eovern"]', "5/3..44/3");
  await a.page.click('[data-testid="add-model"]');
  await a.page.click('[data-testid="share-link"]');
  await a.page.waitForSelector('[role="status"]:has-text("Link copied")');
  const link = await a.page.inputValue('[data-testid="share-link-field"]');
  expect(link.startsWith(inject("baseUrl"))).toBe(true);
  expect(link).toMatch(/#v3\.[A-Za-z0-9_-]+\.[A-Za-z0-9_-]{6}$/);
  expect(await a.page.evaluate(() => navigator.clipboard.readText())).toBe(link);
  await a.page.screenshot({ path: "/tmp/axband-ui-b-share-link.png" });
  await a.page.keyboard.press("Escape");
  const svgA = await exportSvg(a.page);

  const b = await freshPage();
  const watchedB = watchPage(b.page);
  await b.page.goto(link, { waitUntil: "networkidle" });
  await b.page.waitForSelector('[role="status"]:has-text("Opened the project from the link")');
  const svgB = await exportSvg(b.page);
  expect(svgB.text).toBe(svgA.text);
  expect(svgB.name).toBe(svgA.name);

  // Tamper with the link (cut it and change a character) and open it in the same page.
  const fragment = link.slice(link.indexOf("#") + 1);
  const tampered = `${fragment.slice(0, Math.floor(fragment.length / 2))}Zz`;
  await b.page.evaluate((f) => {
    location.hash = f;
  }, tampered);
  const alert = b.page.locator('[role="alert"]').last();
  await alert.waitFor();
  expect(await alert.textContent()).toMatch(/^This link is damaged \(.*Your project is unchanged\./);
  const svgAfter = await exportSvg(b.page);
  expect(svgAfter.text).toBe(svgA.text);

  // The same tampered link opened as a new page is refused too and leaves the start project.
  const c = await freshPage();
  await c.page.goto(`${inject("baseUrl")}#${tampered}`, { waitUntil: "networkidle" });
  await c.page.locator('[role="alert"]').first().waitFor();
  expect(await c.page.locator('[role="alert"]').first().textContent()).toMatch(
    /^This link is damaged \(.*Your project is unchanged\./,
  );

  expect(watchedA.consoleErrors).toEqual([]);
  expect(watchedB.consoleErrors).toEqual([]);
});
