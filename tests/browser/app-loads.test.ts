// The built app loads in real headless Chromium with no console errors and no request leaving 127.0.0.1.
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import type { Browser } from "playwright-core";
import { launchChromium, watchPage } from "./chromium";

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

test("the app loads with no console errors and no foreign requests", async () => {
  const page = await browser.newPage();
  const watched = watchPage(page);
  await page.goto(inject("baseUrl"), { waitUntil: "networkidle" });
  expect(await page.locator("h1").first().textContent()).toContain("axband");
  expect(watched.consoleErrors).toEqual([]);
  expect(watched.foreignRequests).toEqual([]);
  await page.close();
});
