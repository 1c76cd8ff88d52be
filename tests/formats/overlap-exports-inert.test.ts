// The overlap summary exports the app and the command line write (CSV, Markdown file and clipboard, the CLI's
// Markdown caption and interval headings) with the script and formula payloads of the repro link links/xss.txt
// (issue 16) in every label: HTML is escaped so a Markdown viewer shows it as text, and CSV cells that would
// start a spreadsheet formula are prefixed with ' (OWASP "CSV Injection", common practice).
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, test } from "vitest";
import { csvParseRows } from "d3-dsv";
import { decodeLink } from "../../src/formats/codec";
import { overlapSummary } from "../../src/analysis/overlap-summary";
import {
  intervalsToCsv,
  intervalsToMarkdown,
  summaryToCsv,
  summaryToMarkdown,
} from "../../src/formats/overlap/exports";
import { overlapOutputs } from "../../src/cli/overlap-out";

const link = readFileSync(join(import.meta.dirname, "repro", "links", "xss.txt"), "utf8").trim();
const opened = decodeLink(link);
if (!opened.ok) throw new Error(opened.error);
const project = opened.project;
const rows = overlapSummary(project).filter((r) => r.verdict !== "none");

/** Raw HTML a Markdown renderer would pass through: a tag opening with a letter or "/". */
const RAW_HTML = /<\/?[a-z]/i;

describe("overlap Markdown with script payloads in the labels (links/xss.txt)", () => {
  test("the repro project overlaps, and its labels carry <script>, <img onerror> and <svg onload>", () => {
    expect(rows.length).toBeGreaterThan(0);
    const labels = [...project.models, ...project.curves].map((x) => x.label).join(" ");
    expect(labels).toMatch(/<script>/);
    expect(labels).toMatch(/<img src=x onerror/);
  });
  test("the summary table escapes HTML in every cell", () => {
    const md = summaryToMarkdown(rows);
    expect(md).not.toMatch(RAW_HTML);
    expect(md).toContain("&lt;script&gt;");
    expect(md).toContain("&lt;img src=x onerror=");
  });
  test("the interval tables too", () => {
    for (const r of rows) expect(intervalsToMarkdown(r)).not.toMatch(RAW_HTML);
  });
  test("the command line's Markdown files: caption paragraph and interval headings escaped as well", () => {
    for (const out of overlapOutputs(project, "summary.md", "intervals.md")) {
      expect(out.data, out.path).not.toMatch(RAW_HTML);
    }
  });
});

describe("overlap CSV with formula payloads in the labels (links/xss.txt)", () => {
  for (const [name, text] of [
    ["summary", () => summaryToCsv(rows)],
    ["intervals", () => intervalsToCsv(rows)],
  ] as const) {
    test(`${name}: no cell starts a formula unless it is a number`, () => {
      const table = csvParseRows(text());
      expect(table.length).toBeGreaterThan(1);
      for (const r of table)
        for (const c of r) expect(Number.isFinite(Number(c)) || !/^[=+\-@\t\r]/.test(c), c).toBe(true);
      expect(table.flat()).toContain(`'=HYPERLINK("http://127.0.0.1:9/x","click")`);
    });
  }
});
