// Where message toasts sit (issue 16: "a message toast covers the figure's title"): an alert shown while the
// figure has a long title never overlaps the title's text, at desktop and laptop window sizes.
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import type { Browser } from "playwright-core";
import { launchChromium, watchPage } from "./chromium";
import { reusedContext } from "./fresh-context";

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

const contexts = reusedContext(() => browser, {});

type Box = { x: number; y: number; width: number; height: number };
const overlaps = (a: Box, b: Box) =>
  a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;

test.each([
  [1440, 900],
  [1280, 720],
  [1024, 768],
])("at %i × %i px an alert leaves the figure's title uncovered", async (width, height) => {
  const page = await (await contexts.fresh()).newPage();
  await page.setViewportSize({ width, height });
  const watched = watchPage(page);
  await page.goto(inject("baseUrl"), { waitUntil: "networkidle" });
  await page.locator('[data-testid="plot"] svg').waitFor();
  await page.locator("#section-figure > summary").click();
  await page.getByLabel("Title").fill("Invented model bands over demo haloscope limits at one dark-matter density");
  const title = page.locator('[data-testid="plot"] text[id$="figure-title"]');
  await expect.poll(() => title.count()).toBe(1);
  // A link that cannot be opened gives an alert, as at start-up.
  await page.evaluate(() => {
    location.hash = "v1.AAAA-not-a-project";
  });
  const alert = page.getByRole("alert");
  await expect.poll(() => alert.count()).toBe(1);
  await page.evaluate(() => window.scrollTo(0, 0));
  const titleBox = await title.boundingBox();
  const alertBox = await alert.boundingBox();
  expect(titleBox && alertBox).toBeTruthy();
  expect(overlaps(titleBox!, alertBox!), JSON.stringify({ titleBox, alertBox })).toBe(false);
  expect(watched.consoleErrors).toEqual([]);
});
