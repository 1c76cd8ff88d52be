// The overlap table on the demo scenario in real Chromium: one summary row per overlapping model × curve, its
// CSV export lists the same rows in the same order, a click on a row highlights its intervals on the figure, and
// axe-core finds no serious or critical violation on the page with the table expanded. CSV reading follows RFC 4180.
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import type { Browser } from "playwright-core";
import { launchChromium, watchPage } from "./chromium";
import { download } from "./export-helpers";
import { seriousViolations } from "./axe";
let browser: Browser;
beforeAll(async () => {
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
});

/** RFC 4180 rows. */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = "";
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        field += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else field += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ",") {
      row.push(field);
      field = "";
    } else if (ch === "\n") {
      row.push(field);
      rows.push(row);
      row = [];
      field = "";
    } else if (ch !== "\r") field += ch;
  }
  if (field !== "" || row.length > 0) rows.push([...row, field]);
  return rows;
}

test("the demo shows a non-empty overlap table and its CSV export matches it", async () => {
  const context = await browser.newContext({ acceptDownloads: true, viewport: { width: 1400, height: 950 } });
  const page = await context.newPage();
  const watched = watchPage(page);
  await page.goto(inject("baseUrl"), { waitUntil: "networkidle" });
  const table = page.locator('[data-testid="overlap-table"]');
  await table.locator("tbody tr").first().waitFor();
  const cells = await table
    .locator("tbody tr")
    .evaluateAll((trs) => trs.map((tr) => Array.from(tr.querySelectorAll("td")).map((td) => td.textContent ?? "")));
  expect(cells.length).toBeGreaterThan(0);

  const { name, bytes } = await download(page, () => page.click('[data-testid="overlap-csv"]'));
  expect(name).toMatch(/\.csv$/);
  const [header, ...rows] = parseCsv(bytes.toString("utf8"));
  const col = (n: string) => header.indexOf(n);
  expect(col("m_a_min_eV")).toBeGreaterThan(-1);
  expect(rows).toHaveLength(cells.length);
  rows.forEach((r, i) => {
    expect(cells[i][1]).toBe(r[col("model")]);
    expect(cells[i][2]).toBe(r[col("curve")]);
  });
  // At most one row per model × curve, each with a verdict other than "none".
  expect(new Set(rows.map((r) => `${r[col("model_id")]}|${r[col("curve_id")]}`)).size).toBe(rows.length);
  expect(rows.every((r) => r[col("verdict")] !== "none")).toBe(true);

  // A click on a row highlights its intervals on the figure.
  expect(await page.locator('[data-highlight="mass"]').count()).toBe(0);
  await table.locator("tbody tr").first().click();
  await page.locator('[data-highlight="mass"]').first().waitFor();
  expect(await table.locator("tbody tr").first().getAttribute("aria-selected")).toBe("true");

  // Expanding a row lists its intervals; axe finds nothing serious or critical on the page then.
  await table.locator('[data-testid="overlap-expand"]').first().click();
  await page.locator('[data-testid="overlap-intervals"]').waitFor();
  expect(await seriousViolations(page)).toEqual([]);
  expect(watched.consoleErrors).toEqual([]);
  await context.close();
});
