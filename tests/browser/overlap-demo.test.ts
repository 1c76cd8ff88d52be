// The overlap table on the demo scenario in real Chromium: it has rows, its CSV export lists the same rows
// in the same order with the same numbers as the table shows, and a click on a row highlights its
// interval on the figure. CSV reading follows RFC 4180 (quoted fields, doubled quotes).
import { afterAll, beforeAll, expect, inject, test } from "vitest";
import type { Browser } from "playwright-core";
import { launchChromium, watchPage } from "./chromium";
import { download } from "./export-helpers";
import { siFormat } from "../../src/ui/format";
import { verdictText } from "../../src/ui/overlap/table-logic";
import type { OverlapKind } from "../../src/data";

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
    const shown = cells[i];
    expect(shown[0]).toBe(r[col("model")]);
    expect(shown[1]).toBe(r[col("curve")]);
    expect(shown[2]).toBe(r[col("role")]);
    expect(shown[3]).toBe(verdictText(r[col("kind")] as OverlapKind));
    expect(shown[4]).toBe(
      `${siFormat(Number(r[col("m_a_min_eV")]), "eV")} – ${siFormat(Number(r[col("m_a_max_eV")]), "eV")}`,
    );
    expect(shown[6]).toBe(
      `${siFormat(Number(r[col("freq_min_Hz")]), "Hz")} – ${siFormat(Number(r[col("freq_max_Hz")]), "Hz")}`,
    );
  });
  // At least one model is excluded or within reach somewhere in the invented demo.
  expect(rows.some((r) => r[col("kind")] !== "none")).toBe(true);

  // A click on a row highlights its mass interval on the figure.
  expect(await page.locator('[data-highlight="mass"]').count()).toBe(0);
  const hit = rows.findIndex((r) => r[col("kind")] !== "none");
  await table.locator("tbody tr").nth(hit).click();
  await page.locator('[data-highlight="mass"]').first().waitFor();
  expect(await table.locator("tbody tr").nth(hit).getAttribute("aria-selected")).toBe("true");
  await page.locator('[data-testid="overlap-table"]').scrollIntoViewIfNeeded();
  await page.screenshot({ path: "/tmp/axband-ui-b-overlap-demo.png", fullPage: false });

  // Sorting by the m_a column orders the rows by their lower mass.
  await table.locator("th button", { hasText: "m_a range" }).click();
  const sorted = await table.locator("tbody tr td:nth-child(5)").allTextContents();
  const lows = rows.map((r) => Number(r[col("m_a_min_eV")])).sort((x, y) => x - y);
  expect(sorted[0]).toBe(`${siFormat(lows[0], "eV")} – ${sorted[0].split(" – ")[1]}`);
  expect(watched.consoleErrors).toEqual([]);
  await context.close();
});
