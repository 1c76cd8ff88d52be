// Checks of the inert table cells against OWASP "CSV Injection" (cells starting with = + - @ tab CR are
// prefixed with ' and quoted; common practice), RFC 4180 §2.6–2.7 quoting, and HTML's five predefined
// entities (HTML Living Standard, "named character references") for Markdown cells, using the repro payloads
// of links/xss.txt.
import { describe, expect, test } from "vitest";
import { csvParseRows } from "d3-dsv";
import { csvTextCell, markdownTextCell } from "../../src/analysis/table-cells";

const PAYLOADS = ['=HYPERLINK("http://x","y")', "+cmd|' /C calc'!A0", "-2+3", "@SUM(A1:A2)", "\t=1", "\r=1"];

describe("csvTextCell", () => {
  test.each(PAYLOADS)("%j is written as text: starts with a quote after CSV parsing", (p) => {
    const cell = csvTextCell(p);
    // d3-dsv's csvParseRows (an independent RFC 4180 reader) gives the text back with the leading '.
    expect(csvParseRows(`${cell},x`)[0][0]).toBe(`'${p}`);
  });
  test("plain text stays as it is; commas and quotes are quoted (RFC 4180)", () => {
    expect(csvTextCell("KSVZ line")).toBe("KSVZ line");
    expect(csvTextCell('a "b", c')).toBe('"a ""b"", c"');
  });
});

describe("markdownTextCell", () => {
  test("HTML is shown, not run: <script> and <img onerror> become entities", () => {
    expect(markdownTextCell('<script>alert("x")</script>')).toBe('&lt;script&gt;alert("x")&lt;/script&gt;');
    expect(markdownTextCell("<img src=x onerror=alert(1)>")).toBe("&lt;img src=x onerror=alert(1)&gt;");
    expect(markdownTextCell("A & B")).toBe("A &amp; B");
  });
  test("a pipe cannot open a new column and a line break cannot end the row", () => {
    expect(markdownTextCell("a|b\nc")).toBe("a\\|b c");
  });
});
