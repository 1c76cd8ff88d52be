// PDF export in real Chromium: the export menu's PDF item downloads NAME.pdf (pdf-lib, fontkit and the font
// files loaded on demand), a one-page PDF, and opening it through the project menu's file input restores the
// project. Sources: a PDF file starts with "%PDF-" (ISO 32000-1:2008, §7.5.2); one page = page tree /Count 1
// (same, §7.7.3.2).
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { PDFDocument } from "pdf-lib";
import type { Browser } from "playwright-core";
import { launchChromium, watchPage } from "./chromium";
import { download, exportSvg, openFreshPage } from "./export-helpers";

let browser: Browser;
let dir: string;
beforeAll(async () => {
  browser = await launchChromium();
  dir = mkdtempSync(join(tmpdir(), "axband-pdf-"));
});
afterAll(async () => {
  await browser?.close();
  rmSync(dir, { recursive: true, force: true });
});

const freshPage = () => openFreshPage(browser, inject("baseUrl"));

test("the PDF download is one page and reopens the project", async () => {
  const a = await freshPage();
  const watched = watchPage(a.page);
  await a.page.fill('[data-testid="model-eovern"]', "-4/3");
  await a.page.click('[data-testid="add-model"]');
  await a.page.click('[data-testid="project-menu"]');
  await a.page.fill('[aria-label="Project name"]', "PDF round trip (invented)");
  await a.page.keyboard.press("Escape");
  const svgA = await exportSvg(a.page);

  await a.page.click('[data-testid="export-menu"]');
  const pdf = await download(a.page, () => a.page.click('[data-testid="export-pdf"]'));
  expect(pdf.name).toBe("PDF round trip (invented).pdf");
  expect(pdf.bytes.subarray(0, 5).toString("latin1")).toBe("%PDF-");
  const doc = await PDFDocument.load(new Uint8Array(pdf.bytes), { updateMetadata: false });
  expect(doc.getPageCount()).toBe(1);
  expect(doc.getCreator()).toMatch(/^axband \d+\.\d+\.\d+/);
  await a.page.waitForSelector('[role="status"]:has-text("Saved PDF round trip (invented).pdf")');

  const b = await freshPage();
  const file = join(dir, pdf.name);
  writeFileSync(file, pdf.bytes);
  await b.page.click('[data-testid="project-menu"]');
  await b.page.setInputFiles('[data-testid="open-project"]', file);
  await b.page.waitForSelector('[role="status"]:has-text("Opened the project attached to")');
  await b.page.keyboard.press("Escape");
  expect((await exportSvg(b.page)).text).toBe(svgA.text);
  expect(watched.consoleErrors).toEqual([]);
  await Promise.all([a.context.close(), b.context.close()]);
});
