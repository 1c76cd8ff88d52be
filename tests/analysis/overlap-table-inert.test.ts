// The overlap table's CSV and Markdown exports with the script and formula payloads of the repro file
// links/xss.txt in every label: spreadsheet formulas are neutralised (OWASP "CSV Injection", common practice)
// and HTML is escaped, while numbers stay numbers.
import { describe, expect, test } from "vitest";
import { csvParseRows } from "d3-dsv";
import { overlapTableToCsv, overlapTableToMarkdown, type OverlapRow } from "../../src/analysis/overlap-table";

function row(modelLabel: string, curveLabel: string, note: string): OverlapRow {
  return {
    modelId: "m-1",
    modelLabel,
    curveId: "c-1",
    curveLabel,
    role: "exclusion",
    kind: "excluded-whole",
    massMinEv: 1e-6,
    massMaxEv: 2e-6,
    faMinGeV: 3e12,
    faMaxGeV: 6e12,
    freqMinHz: 2.4e8,
    freqMaxHz: 4.8e8,
    eOverNSub: [-3.2, 1.5],
    eOverNSubs: [[-3.2, 1.5]],
    note,
  };
}

const rows = [
  row('=HYPERLINK("http://x","y")', "+cmd|' /C calc'!A0", "@SUM(A1:A2)"),
  row("<script>alert(1)</script>", "<img src=x onerror=alert(2)>", "-1+1"),
];

describe("overlap CSV", () => {
  const table = csvParseRows(overlapTableToCsv(rows));
  test("no text cell starts with = + - @ (each label and note is prefixed with ')", () => {
    for (const r of table.slice(1)) for (const i of [1, 3, 14]) expect(r[i]).toMatch(/^(?![=+\-@\t\r])/);
    expect(table[1][1]).toBe(`'=HYPERLINK("http://x","y")`);
    expect(table[2][14]).toBe("'-1+1");
  });
  test("a negative number stays a number", () => {
    expect(table[1][12]).toBe("-3.2");
  });
});

describe("overlap Markdown", () => {
  const md = overlapTableToMarkdown(rows);
  test("HTML in labels is escaped, so a Markdown viewer shows it as text", () => {
    expect(md).not.toMatch(/<script|<img/);
    expect(md).toContain("&lt;script&gt;alert(1)&lt;/script&gt;");
    expect(md).toContain("&lt;img src=x onerror=alert(2)&gt;");
  });
});
