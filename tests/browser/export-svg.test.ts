// SVG and PNG export in real Chromium: the downloaded SVG is valid, self-contained XML at a physical size
// with its text as text, and an injection corpus in a model label, a CSV header and a file name stays
// inert both in the page and in the file. Checks follow SVG 1.1 (W3C Recommendation, 2011: namespace
// http://www.w3.org/2000/svg, viewBox, width/height with units) and the PNG specification (ISO/IEC
// 15948:2004, pHYs chunk in pixels per metre); 1 in = 25.4 mm exactly (international inch, 1959).
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { DOMParser } from "@xmldom/xmldom";
import type { Browser } from "playwright-core";
import { launchChromium, watchPage } from "./chromium";
import { reusedContext } from "./fresh-context";
import { download, exportSvg } from "./export-helpers";
import { readPngDpi, readPngSize } from "../../src/formats/png-meta";

const SVG_NS = "http://www.w3.org/2000/svg";
const SCRIPT = "<script>alert(1)</script>";
const IMG = `"><img src=x onerror=alert(1)>`;

let browser: Browser;
let dir: string;
beforeAll(async () => {
  browser = await launchChromium();
  dir = mkdtempSync(join(tmpdir(), "axband-export-"));
});
afterAll(async () => {
  await browser?.close();
  rmSync(dir, { recursive: true, force: true });
});

const contexts = reusedContext(() => browser, { acceptDownloads: true, viewport: { width: 1400, height: 950 } });

interface XmlEl {
  nodeType: number;
  localName: string;
  namespaceURI: string | null;
  attributes: { length: number; item(i: number): { name: string; value: string } | null };
  childNodes: { length: number; item(i: number): XmlEl | null };
  textContent: string | null;
}

function allElements(root: XmlEl): XmlEl[] {
  const out: XmlEl[] = [];
  const walk = (n: XmlEl) => {
    if (n.nodeType === 1) out.push(n);
    for (let i = 0; i < n.childNodes.length; i++) walk(n.childNodes.item(i) as XmlEl);
  };
  walk(root);
  return out;
}

function attrs(el: XmlEl): { name: string; value: string }[] {
  const out: { name: string; value: string }[] = [];
  for (let i = 0; i < el.attributes.length; i++) out.push(el.attributes.item(i)!);
  return out;
}

test("the SVG download is self-contained, valid XML at a physical size, and labels stay inert", async () => {
  const page = await (await contexts.fresh()).newPage();
  const watched = watchPage(page);
  const dialogs: string[] = [];
  page.on("dialog", (d) => {
    dialogs.push(d.message());
    void d.dismiss();
  });
  await page.goto(inject("baseUrl"), { waitUntil: "networkidle" });
  const count = () =>
    page.evaluate(() => ({
      img: document.querySelectorAll("img").length,
      script: document.querySelectorAll("script").length,
    }));
  const before = await count();

  // The corpus in a model label (typed), in a CSV header and in a file name (imported as a curve label).
  await page.locator('[aria-label="Model label"]').first().fill(SCRIPT);
  const csv = join(dir, `${IMG}.csv`);
  writeFileSync(csv, `# invented\nm_a [eV],${SCRIPT} ${IMG} [GeV^-1]\n1e-6,1e-12\n1e-5,2e-12\n1e-4,3e-12\n`);
  await page.setInputFiles('[data-testid="import-files"]', csv);
  await page.waitForSelector('[data-testid="import-detected"]');
  expect(await page.textContent('[data-testid="import-detected"]')).toContain(SCRIPT);
  await page.click('[data-testid="import-confirm"]');
  await page.waitForSelector(`[data-testid="curve-item"] >> nth=-1`);
  // Wait for the figure to draw the new curve (the export is made from the same project).
  const curveId = await page.locator('[data-testid="curve-item"]').last().getAttribute("data-curve-id");
  await page.waitForSelector(`[data-testid="plot"] path[data-curve-id="${curveId}"]`);

  const { name, text } = await exportSvg(page);
  expect(name).toMatch(/\.svg$/);
  await page.screenshot({ path: "/tmp/axband-ui-b-export-injection.png" });

  // Inert in the page: no dialog, no new <img> or <script> element.
  expect(dialogs).toEqual([]);
  expect(await count()).toEqual(before);

  // Valid XML in the SVG namespace, with viewBox and a physical size (slide preset: 254 mm wide).
  const errors: string[] = [];
  const doc = new DOMParser({
    onError: (level, msg) => void (level !== "warning" && errors.push(msg)),
  }).parseFromString(text, "image/svg+xml");
  expect(errors).toEqual([]);
  const root = doc.documentElement as unknown as XmlEl;
  expect(root.localName).toBe("svg");
  expect(root.namespaceURI).toBe(SVG_NS);
  const rootAttrs = Object.fromEntries(attrs(root).map((a) => [a.name, a.value]));
  expect(
    rootAttrs.viewBox
      .trim()
      .split(/[\s,]+/)
      .map(Number),
  ).toHaveLength(4);
  expect(rootAttrs.width).toMatch(/^[\d.]+(cm|mm|in)$/);
  expect(rootAttrs.height).toMatch(/^[\d.]+(cm|mm|in)$/);
  expect(parseFloat(rootAttrs.width)).toBeCloseTo(25.4, 1);

  // Axis titles and legend labels are text (the corpus appears as literal characters).
  const allText = root.textContent ?? "";
  expect(allText).toContain("[eV]");
  expect(allText).toMatch(/GeV/);
  expect(allText).toContain(SCRIPT);
  expect(allText).toContain(`"><img`);
  expect(allText).toContain("DFSZ-type");

  // Self-contained and script-free: no <script>, <img>, <foreignObject>; no on… attribute; every href a
  // fragment; no url() other than #fragment references.
  const els = allElements(root);
  expect(els.filter((e) => ["script", "img", "foreignObject", "iframe"].includes(e.localName))).toEqual([]);
  for (const el of els) {
    for (const a of attrs(el)) {
      expect(a.name.toLowerCase().startsWith("on"), `${el.localName} ${a.name}`).toBe(false);
      if (/(^|:)href$/i.test(a.name)) expect(a.value.startsWith("#"), a.value).toBe(true);
      for (const m of a.value.matchAll(/url\(\s*([^)]*)\)/g))
        expect(m[1].trim().replace(/^['"]/, "").startsWith("#"), m[0]).toBe(true);
    }
  }
  expect(text).not.toMatch(/url\(\s*['"]?(https?:|data:|\/\/)/i);
  expect(text).not.toMatch(/<script/i);
  expect(watched.consoleErrors).toEqual([]);
  expect(watched.foreignRequests).toEqual([]);
});

test("PNG at 300 dpi for the single-column preset has the pixel size and dpi of 8.6 cm at 300 dpi", async () => {
  const page = await (await contexts.fresh()).newPage();
  const watched = watchPage(page);
  await page.goto(inject("baseUrl"), { waitUntil: "networkidle" });
  await page.click('[data-testid="export-menu"]');
  await page.selectOption('[aria-label="Figure size preset"]', "single-column");
  await page.selectOption('[aria-label="PNG resolution"]', "300dpi");
  await page.screenshot({ path: "/tmp/axband-ui-b-export-menu.png", clip: { x: 700, y: 0, width: 700, height: 450 } });
  const { name, bytes } = await download(page, () => page.click('[data-testid="export-png"]'));
  expect(name).toMatch(/\.png$/);
  const png = new Uint8Array(bytes);
  const size = readPngSize(png);
  // 86 mm / 25.4 mm per inch × 300 dpi = 1015.7 → 1016 px.
  expect(size.widthPx).toBe(Math.round((86 / 25.4) * 300));
  const dpi = readPngDpi(png);
  expect(dpi?.unit).toBe("metre");
  // pHYs stores whole pixels per metre: 300 dpi = 11811 px/m (300 / 0.0254 = 11811.02).
  expect(dpi?.pxPerUnitX).toBe(11811);
  expect(dpi?.dpiX).toBeCloseTo(300, 0);
  // The exported SVG at this preset says 8.6 cm.
  const svg = await exportSvg(page);
  expect(svg.text).toMatch(/<svg[^>]*\swidth="8\.6cm"/);
  expect(watched.consoleErrors).toEqual([]);
});
