// The interactive figure in real Chromium: the demo figure renders with its legend, a typed model line sits
// where g_aγγ says (path points read back and the scales inverted), wheel and keyboard zoom, drag pan, hover.
// g_aγγ = α/(2π f_a)·|E/N − c_γ| with c_γ = 1.92 (Grilli di Cortona et al., JHEP 01 (2016) 034) and
// m_a·f_a = 5.691 μeV·10¹² GeV (Gorghetto & Villadoro, JHEP 03 (2019) 033), computed by src/physics.
import { afterAll, beforeAll, describe, expect, inject, test } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchChromium, watchPage, type Watched } from "./chromium";
import { reusedContext } from "./fresh-context";
import { gAgg } from "../../src/physics/coupling";
import { rationalToNumber } from "../../src/physics/eovern-parse";

let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

interface Opened {
  page: Page;
  watched: Watched;
}

const contexts = reusedContext(() => browser, { viewport: { width: 1440, height: 900 }, deviceScaleFactor: 1 });

/** The file's context emptied (no storage), so each test starts from the demo project. */
async function open(): Promise<Opened> {
  const context = await contexts.fresh();
  const page = await context.newPage();
  const watched = watchPage(page);
  await page.goto(inject("baseUrl"), { waitUntil: "networkidle" });
  await page.locator('[data-testid="plot"] svg').waitFor();
  return { page, watched };
}

interface Frame {
  mass: [number, number];
  y: [number, number];
  box: { x: number; y: number; w: number; h: number };
}

async function frameOf(page: Page): Promise<Frame> {
  const attrs = await page.locator('[data-testid="plot"] svg').evaluate((svg) => ({
    mass: svg.getAttribute("data-mass-domain"),
    y: svg.getAttribute("data-y-domain"),
    box: svg.getAttribute("data-plot-box"),
  }));
  const nums = (s: string | null) => (s ?? "").split(",").map(Number);
  const [x, y, w, h] = nums(attrs.box);
  return { mass: nums(attrs.mass) as [number, number], y: nums(attrs.y) as [number, number], box: { x, y, w, h } };
}

/** Points of an "M x,y L x,y …" path (the plot core writes absolute M/L commands). */
function pathPoints(d: string): [number, number][] {
  const nums = d.match(/-?\d+(\.\d+)?(e-?\d+)?/g)?.map(Number) ?? [];
  const pts: [number, number][] = [];
  for (let i = 0; i + 1 < nums.length; i += 2) pts.push([nums[i], nums[i + 1]]);
  return pts;
}

async function tickLabels(page: Page): Promise<string[]> {
  return page.locator('[data-testid="plot"] svg g[id$="axes"] text').allTextContents();
}

describe("the demo figure", () => {
  test("renders its legend entries, curves and model paths with no console errors", async () => {
    const { page, watched } = await open();
    const entries = page.locator('[data-testid="plot"] [data-testid="legend"] [data-legend-entry]');
    // The demo project: three models and four invented curves, all visible.
    expect(await entries.count()).toBe(7);
    const texts = await entries.evaluateAll((els) => els.map((e) => e.getAttribute("data-legend-entry") ?? ""));
    expect(texts.some((t) => t.includes("E/N = 8/3"))).toBe(true);
    expect(texts.filter((t) => t.includes("(invented)"))).toHaveLength(4);
    // The heavy-quark window is the region between the 5/3 and 44/3 lines: it says so and does not cancel.
    expect(texts.some((t) => t.includes("between lines 5/3 | 44/3"))).toBe(true);
    expect(texts.some((t) => t.includes("cancellation"))).toBe(false);
    expect(await page.locator('[data-testid="plot"] path[data-model-id]').count()).toBeGreaterThanOrEqual(3);
    expect(await page.locator('[data-testid="plot"] path[data-curve-id]').count()).toBeGreaterThanOrEqual(4);
    // Decade labels with real superscripts: "10" then a raised "−7" in a tspan.
    expect(await page.locator('[data-testid="plot"] g[id$="axes"] tspan').count()).toBeGreaterThan(5);
    await page.screenshot({ path: "/tmp/axband-demo.png" });
    expect(watched.consoleErrors).toEqual([]);
    expect(watched.foreignRequests).toEqual([]);
  });

  test('adding "8/3" adds a legend entry and a line whose pixels sit where g_aγγ says (within 0.5 px)', async () => {
    const { page, watched } = await open();
    const legend = page.locator('[data-testid="legend"] [data-legend-entry]');
    const before = await legend.count();
    await page.getByTestId("model-eovern").fill("8/3");
    await page.getByTestId("add-model").click();
    await expect.poll(() => legend.count()).toBe(before + 1);
    const entry = page.locator('[data-testid="legend"] [data-legend-entry="E/N = 8/3"]');
    expect(await entry.count()).toBe(1);
    const modelId = await entry.getAttribute("data-model-id");
    expect(modelId).toBeTruthy();
    const d = await page
      .locator(`[data-testid="plot"] path[data-model-id="${modelId}"][data-eovern]`)
      .getAttribute("d");
    const pts = pathPoints(d ?? "");
    expect(pts.length).toBeGreaterThanOrEqual(2);
    const f = await frameOf(page);
    const [lm0, lm1] = f.mass.map(Math.log10);
    const [ly0, ly1] = f.y.map(Math.log10);
    const eOverN = rationalToNumber("8/3");
    let checked = 0;
    for (const [x, y] of pts) {
      const massEv = 10 ** (lm0 + ((x - f.box.x) / f.box.w) * (lm1 - lm0));
      const g = gAgg(massEv, eOverN, { ref: "2019" });
      const yExpected = f.box.y + f.box.h - ((Math.log10(g) - ly0) / (ly1 - ly0)) * f.box.h;
      expect(Math.abs(y - yExpected)).toBeLessThan(0.5);
      checked++;
    }
    expect(checked).toBe(pts.length);
    await page.screenshot({ path: "/tmp/axband-added-8-3.png" });
    expect(watched.consoleErrors).toEqual([]);
  });
});

describe("the heavy-quark window (Di Luzio, Mescia, Nardi, PRL 118 (2017) 031801)", () => {
  test("has a lower edge above the plot bottom, on the E/N = 5/3 line (within 0.5 px)", async () => {
    const { page, watched } = await open();
    const band = page.locator('[data-testid="plot"] path[data-model-kind="between"]');
    expect(await band.count()).toBe(1);
    expect(await band.getAttribute("data-cancels")).toBe("false");
    const pts = pathPoints((await band.getAttribute("d")) ?? "");
    const f = await frameOf(page);
    const bottom = f.box.y + f.box.h;
    // The polygon runs upper-left, upper-right, lower-right, lower-left; its lower-right corner is inside the plot.
    const right = pts.filter(([x]) => Math.abs(x - (f.box.x + f.box.w)) < 0.01);
    expect(right.length).toBeGreaterThanOrEqual(2);
    const yLow = Math.max(...right.map(([, y]) => y));
    expect(yLow).toBeLessThan(bottom - 20);
    const [ly0, ly1] = f.y.map(Math.log10);
    const g = gAgg(f.mass[1], rationalToNumber("5/3"), { ref: "2019" });
    const yLine = bottom - ((Math.log10(g) - ly0) / (ly1 - ly0)) * f.box.h;
    expect(Math.abs(yLow - yLine)).toBeLessThan(0.5);
    expect(watched.consoleErrors).toEqual([]);
  });
});

describe("zoom and pan", () => {
  test("the wheel zooms about the cursor and changes the tick labels", async () => {
    const { page, watched } = await open();
    const before = await tickLabels(page);
    const f0 = await frameOf(page);
    const svgBox = (await page.locator('[data-testid="plot"] svg').boundingBox())!;
    await page.mouse.move(svgBox.x + svgBox.width * 0.55, svgBox.y + svgBox.height * 0.5);
    // The store joins steps within 500 ms by Date.now(): the page's clock stands still during the burst, so a busy
    // machine's slow wheel events cannot split its one undo step (timers and frames run as usual).
    await page.evaluate(() => {
      const t = Date.now();
      Date.now = () => t;
    });
    for (let i = 0; i < 6; i++) await page.mouse.wheel(0, -200);
    // All six steps, however the frames batch them: each narrows the span by exp(−200 px · 0.002 per px)
    // (the figure's wheel rate), six of them by exp(−2.4).
    const span0 = Math.log10(f0.mass[1] / f0.mass[0]);
    await expect
      .poll(async () => {
        const f = await frameOf(page);
        return Math.log10(f.mass[1] / f.mass[0]) / span0;
      })
      .toBeCloseTo(Math.exp(-2.4), 6);
    const f1 = await frameOf(page);
    expect(Math.log10(f1.mass[1] / f1.mass[0])).toBeLessThan(Math.log10(f0.mass[1] / f0.mass[0]) * 0.5);
    expect(Math.log10(f1.y[1] / f1.y[0])).toBeLessThan(Math.log10(f0.y[1] / f0.y[0]) * 0.5);
    const after = await tickLabels(page);
    expect(after.join("|")).not.toBe(before.join("|"));
    await page.screenshot({ path: "/tmp/axband-zoomed.png" });
    // The whole burst is one undo step.
    await page.getByTestId("undo").click();
    expect((await frameOf(page)).mass).toEqual(f0.mass);
    expect(watched.consoleErrors).toEqual([]);
  });

  test("keyboard: + zooms in by 1.25 about the centre, arrows pan, 0 resets to the default view", async () => {
    const { page, watched } = await open();
    const f0 = await frameOf(page);
    const svg = page.locator('[data-testid="plot"] svg');
    await svg.focus();
    await page.keyboard.press("+");
    await expect.poll(async () => (await frameOf(page)).mass[0]).toBeGreaterThan(f0.mass[0]);
    const f1 = await frameOf(page);
    const span = (r: [number, number]) => Math.log10(r[1] / r[0]);
    expect(span(f1.mass)).toBeCloseTo(span(f0.mass) / 1.25, 6);
    expect(Math.log10(f1.mass[0] * f1.mass[1])).toBeCloseTo(Math.log10(f0.mass[0] * f0.mass[1]), 6);
    await page.keyboard.press("ArrowRight");
    await expect.poll(async () => (await frameOf(page)).mass[0]).toBeGreaterThan(f1.mass[0]);
    const f2 = await frameOf(page);
    expect(Math.log10(f2.mass[0] / f1.mass[0])).toBeCloseTo(0.1 * span(f1.mass), 6);
    await page.keyboard.press("-");
    await page.keyboard.press("0");
    await expect.poll(async () => (await frameOf(page)).mass).toEqual(f0.mass);
    expect((await frameOf(page)).y).toEqual(f0.y);
    expect(watched.consoleErrors).toEqual([]);
  });

  test("dragging pans by the dragged distance; double-click resets", async () => {
    const { page, watched } = await open();
    const f0 = await frameOf(page);
    const svgBox = (await page.locator('[data-testid="plot"] svg').boundingBox())!;
    const scale = svgBox.width / 960; // slide preset: 960 scene px wide
    const x = svgBox.x + svgBox.width * 0.5;
    const y = svgBox.y + svgBox.height * 0.5;
    await page.mouse.move(x, y);
    await page.mouse.down();
    await page.mouse.move(x - 50, y, { steps: 5 });
    await page.mouse.move(x - 100, y, { steps: 5 });
    await page.mouse.up();
    await expect.poll(async () => (await frameOf(page)).mass[0]).toBeGreaterThan(f0.mass[0]);
    const f1 = await frameOf(page);
    const spanDec = Math.log10(f0.mass[1] / f0.mass[0]);
    const expectedShift = (100 / scale / f0.box.w) * spanDec;
    expect(Math.log10(f1.mass[0] / f0.mass[0])).toBeCloseTo(expectedShift, 2);
    expect(f1.y[0]).toBeCloseTo(f0.y[0], 25);
    await page.mouse.dblclick(x, y);
    await expect.poll(async () => (await frameOf(page)).mass).toEqual(f0.mass);
    expect(watched.consoleErrors).toEqual([]);
  });

  test("hovering a point shows m_a, g_aγγ, f_a, frequency and E/N there", async () => {
    const { page, watched } = await open();
    const f = await frameOf(page);
    const svgBox = (await page.locator('[data-testid="plot"] svg').boundingBox())!;
    const scale = svgBox.width / 960;
    // The centre of the plot box: m = 10^(mean of the log range).
    const sx = f.box.x + f.box.w / 2;
    const sy = f.box.y + f.box.h / 2;
    await page.mouse.move(svgBox.x + sx * scale, svgBox.y + sy * scale);
    await expect.poll(() => page.getByTestId("hover-mass").textContent()).toContain("eV");
    const massText = (await page.getByTestId("hover-mass").textContent()) ?? "";
    const centreEv = Math.sqrt(f.mass[0] * f.mass[1]);
    const shown = Number(/([\d.]+)\s*([mμnpk]?)eV/.exec(massText)?.[1]);
    const prefix = /([\d.]+)\s*([mμnpk]?)eV/.exec(massText)?.[2] ?? "";
    const factor = { "": 1, m: 1e-3, μ: 1e-6, n: 1e-9, p: 1e-12, k: 1e3 }[prefix] ?? Number.NaN;
    // One screen pixel is ~0.006 decades here; allow two.
    expect(Math.abs(Math.log10((shown * factor) / centreEv))).toBeLessThan(0.012);
    expect(await page.getByTestId("hover-fa").textContent()).toContain("GeV");
    expect(await page.getByTestId("hover-freq").textContent()).toMatch(/Hz/);
    expect(await page.getByTestId("hover-eovern").textContent()).toMatch(/or/);
    expect(watched.consoleErrors).toEqual([]);
  });
});
