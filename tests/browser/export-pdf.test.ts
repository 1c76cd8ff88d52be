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
import { reusedContext } from "./fresh-context";
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

const contexts = reusedContext(() => browser, { acceptDownloads: true, viewport: { width: 1400, height: 950 } });
/** The app in a new page of the file's context, emptied first: the pages before it close. */
const freshPage = () => openFreshPage(contexts, inject("baseUrl"));

test("the PDF download is one page and reopens the project", async () => {
  const a = await freshPage();
  const watched = watchPage(a);
  await a.fill('[data-testid="model-eovern"]', "-4/3");
  await a.click('[data-testid="add-model"]');
  await a.click('[data-testid="project-menu"]');
  await a.fill('[aria-label="Project name"]', "PDF round trip (invented)");
  await a.keyboard.press("Escape");
  const svgA = await exportSvg(a);

  await a.click('[data-testid="export-menu"]');
  const pdf = await download(a, () => a.click('[data-testid="export-pdf"]'));
  expect(pdf.name).toBe("PDF round trip (invented).pdf");
  expect(pdf.bytes.subarray(0, 5).toString("latin1")).toBe("%PDF-");
  const doc = await PDFDocument.load(new Uint8Array(pdf.bytes), { updateMetadata: false });
  expect(doc.getPageCount()).toBe(1);
  expect(doc.getCreator()).toMatch(/^axband \d+\.\d+\.\d+/);
  await a.waitForSelector('[role="status"]:has-text("Saved PDF round trip (invented).pdf")');

  const b = await freshPage();
  const file = join(dir, pdf.name);
  writeFileSync(file, pdf.bytes);
  await b.click('[data-testid="project-menu"]');
  await b.setInputFiles('[data-testid="open-project"]', file);
  await b.waitForSelector('[role="status"]:has-text("Opened the project attached to")');
  await b.keyboard.press("Escape");
  expect((await exportSvg(b)).text).toBe(svgA.text);
  expect(watched.consoleErrors).toEqual([]);
});
