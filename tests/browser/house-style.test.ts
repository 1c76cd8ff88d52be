// The house style in the app: the demo's exclusions hatched on their excluded side, the curve card's
// "Excluded side" choice, a long title with math markup wrapped with a note under the figure, and axe-core finding
// no serious or critical violation (WCAG 2.1 rules as axe-core implements them).
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import type { Browser, Page } from "playwright-core";
import { createRequire } from "node:module";
import { readFileSync } from "node:fs";
import { launchChromium, watchPage } from "./chromium";

const AXE_SOURCE = readFileSync(createRequire(import.meta.url).resolve("axe-core/axe.min.js"), "utf8");

async function seriousViolations(page: Page): Promise<string[]> {
  await page.addScriptTag({ content: AXE_SOURCE });
  return page.evaluate(async () => {
    const axe = (
      window as unknown as {
        axe: {
          run: (
            ctx: Document,
          ) => Promise<{ violations: { id: string; impact: string; nodes: { target: string[] }[] }[] }>;
        };
      }
    ).axe;
    const r = await axe.run(document);
    return r.violations
      .filter((v) => v.impact === "serious" || v.impact === "critical")
      .map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
  });
}

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

test("demo exclusions are hatched; a curve set to fill loses its hatches; a long title wraps with a note", async () => {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 }, deviceScaleFactor: 1 });
  const page = await context.newPage();
  const watched = watchPage(page);
  await page.goto(inject("baseUrl"), { waitUntil: "networkidle" });
  await page.locator('[data-testid="plot"] svg').waitFor();
  const hatches = page.locator('[data-testid="plot"] path[data-curve-part="hatch"]');
  // The demo has two exclusion curves (invented), both hatched by default.
  await expect.poll(() => hatches.count()).toBe(2);
  const select = page.getByTestId("curve-exclusion-mark").first();
  await select.selectOption("fill");
  await expect.poll(() => hatches.count()).toBe(1);

  await page.locator("#section-figure > summary").click();
  await page
    .getByLabel("Title")
    .fill(
      "Invented heavy-quark windows, demo haloscope limits and a demo dish antenna bound on g_{aγγ}, all at one local dark-matter density",
    );
  const note = page.getByTestId("figure-notes");
  await expect.poll(() => note.textContent()).toMatch(/title wrapped onto two lines/);
  const titles = page.locator(
    '[data-testid="plot"] text[id$="figure-title"], [data-testid="plot"] text[id$="figure-title-2"]',
  );
  expect(await titles.count()).toBe(2);
  // The markup's subscript is a shifted tspan of the title's second line.
  expect(await titles.nth(1).locator("tspan", { hasText: "aγγ" }).count()).toBe(1);
  expect(await seriousViolations(page)).toEqual([]);
  expect(watched.consoleErrors).toEqual([]);
  await page.screenshot({ path: "/tmp/axband-house-style.png" });
  await context.close();
});
