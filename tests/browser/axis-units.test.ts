// The axis settings in real Chromium: µeV relabels the mass axis and its range fields, a range typed with units
// ("2 µeV", "2.2 GHz" through m = hν, h = 4.135667696×10⁻¹⁵ eV·s, CODATA 2018) zooms to under one decade with
// at least three labels on the bottom axis, "all four sides" draws mirrored ticks, and axe-core finds no serious
// or critical violation with the settings open (axe-core rules, Deque Systems).
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchChromium, watchPage } from "./chromium";
import { createRequire } from "node:module";
import { readFileSync } from "node:fs";

const AXE_SOURCE = readFileSync(createRequire(import.meta.url).resolve("axe-core/axe.min.js"), "utf8");

async function seriousViolations(page: Page): Promise<string[]> {
  await page.addScriptTag({ content: AXE_SOURCE });
  return page.evaluate(async () => {
    type Result = { violations: { id: string; impact: string; nodes: { target: string[] }[] }[] };
    const axe = (window as unknown as { axe: { run: (ctx: Document) => Promise<Result> } }).axe;
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

const axisTexts = (page: Page, prefix: string) =>
  page.locator(`[data-testid="plot"] svg g[id$="axes"] text[id*="${prefix}"]`).allTextContents();

test("µeV axis, a range typed with units, mirrored ticks, no serious axe violations", async () => {
  const context = await browser.newContext({ viewport: { width: 1400, height: 950 } });
  const page = await context.newPage();
  const watched = watchPage(page);
  await page.goto(inject("baseUrl"), { waitUntil: "networkidle" });
  await page.locator("#section-figure > summary").click();
  await page.selectOption('[data-testid="figure-mass-unit"]', "ueV");
  await page.waitForFunction(() =>
    Array.from(document.querySelectorAll('[data-testid="plot"] text')).some((t) => t.textContent === "ma [μeV]"),
  );
  expect(await page.inputValue('[data-testid="range-mass-min"]')).toBe("0.1");

  await page.fill('[data-testid="range-mass-min"]', "2 µeV");
  await page.fill('[data-testid="range-mass-max"]', "2.2 GHz");
  await page.press('[data-testid="range-mass-max"]', "Enter");
  // 2.2 GHz · h = 9.098 µeV: under one decade, labelled 2…9 where they fit.
  await page.waitForFunction(() => !!document.querySelector('[data-testid="plot"] text[id$="xlabel-3e0"]'));
  const labels = await axisTexts(page, "xlabel-");
  expect(labels.length).toBeGreaterThanOrEqual(3);
  expect(await page.inputValue('[data-testid="range-mass-max"]')).toBe("9.098");

  // All four sides: major ticks leave the frame's right edge outward (x grows), mirroring the left ones.
  await page.selectOption('[data-testid="figure-ticks"]', "all");
  const frame = page.locator('[data-testid="plot"] svg rect[id$="frame"]');
  const right = Number(await frame.getAttribute("x")) + Number(await frame.getAttribute("width"));
  const d = (await page.locator('[data-testid="plot"] svg path[id$="ticks-major"]').getAttribute("d")) ?? "";
  const segs = [...d.matchAll(/M([\d.]+) ([\d.]+)L([\d.]+) ([\d.]+)/g)].map((m) => m.slice(1).map(Number));
  expect(segs.filter((s) => Math.abs(s[0] - right) < 0.02 && s[2] > s[0]).length).toBeGreaterThan(3);
  expect(await seriousViolations(page)).toEqual([]);
  expect(watched.consoleErrors).toEqual([]);
  await context.close();
});
