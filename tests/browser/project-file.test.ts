// Project files and exported figures in real Chromium: a saved NAME.axband.json opened in a fresh context
// gives the same exported SVG, and an exported SVG dropped on a fresh page reopens its project (issue 5:
// "dropping an exported figure onto axband reopens it for editing"; issue 6: project files).
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import type { Browser } from "playwright-core";
import { launchChromium, watchPage } from "./chromium";
import { reusedContext } from "./fresh-context";
import { download, exportSvg, openFreshPage } from "./export-helpers";

let browser: Browser;
let dir: string;
beforeAll(async () => {
  browser = await launchChromium();
  dir = mkdtempSync(join(tmpdir(), "axband-project-"));
});
afterAll(async () => {
  await browser?.close();
  rmSync(dir, { recursive: true, force: true });
});

const contexts = reusedContext(() => browser, { acceptDownloads: true, viewport: { width: 1400, height: 950 } });
/** The app in a new page of the file's context, emptied first: the pages before it close. */
const freshPage = () => openFreshPage(contexts, inject("baseUrl"));

test("a saved project file and a dropped SVG both reopen the same figure", async () => {
  const a = await freshPage();
  const watched = watchPage(a);
  await a.fill('[data-testid="model-eovern"]', "-4/3");
  await a.click('[data-testid="add-model"]');
  await a.click('[data-testid="project-menu"]');
  await a.fill('[aria-label="Project name"]', "Round trip (invented)");
  const saved = await download(a, () => a.click('[data-testid="save-project"]'));
  expect(saved.name).toBe("Round trip (invented).axband.json");
  await a.keyboard.press("Escape");
  const svgA = await exportSvg(a);

  // Open the project file in a fresh context (its own storage: nothing to restore from).
  const b = await freshPage();
  const file = join(dir, saved.name);
  writeFileSync(file, saved.bytes);
  await b.click('[data-testid="project-menu"]');
  await b.setInputFiles('[data-testid="open-project"]', file);
  await b.waitForSelector('[role="status"]:has-text("Opened")');
  expect((await exportSvg(b)).text).toBe(svgA.text);

  // Drop the exported SVG on a third page, once the import step (which listens for drops) is in it.
  const c = await freshPage();
  await c.locator('[data-testid="import-files"]').waitFor({ state: "attached" });
  await c.evaluate(
    ({ text, name }) => {
      const dt = new DataTransfer();
      dt.items.add(new File([text], name, { type: "image/svg+xml" }));
      for (const type of ["dragenter", "dragover", "drop"]) {
        document.body.dispatchEvent(new DragEvent(type, { bubbles: true, cancelable: true, dataTransfer: dt }));
      }
    },
    { text: svgA.text, name: svgA.name },
  );
  await c.waitForSelector('[role="status"]:has-text("Opened the project embedded in")');
  expect((await exportSvg(c)).text).toBe(svgA.text);
  expect(watched.consoleErrors).toEqual([]);
});
