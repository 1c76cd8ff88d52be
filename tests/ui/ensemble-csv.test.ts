// The heavy-quark ensemble's CSV export: a negative E/N such as "-64/3" (the fraction's own form) starts with "-",
// which spreadsheets run as a formula (OWASP "CSV Injection", common practice): it is written as text with a
// leading ', while the decimal column stays a number and comment lines stay comments.
import { expect, test } from "vitest";
import { csvParseRows } from "d3-dsv";
import { nDWText, spectrumCsv } from "../../src/ui/models/ensemble/ensemble-csv";

test("a negative E/N cell is neutralised; numbers stay numbers", () => {
  const text = spectrumCsv(
    [
      { eOverN: "-64/3", count: 2, nDWMin: 1, nDWMax: 3 },
      { eOverN: "8/3", count: 5, nDWMin: 6, nDWMax: 6 },
    ],
    ["R1 R2", "7 models"],
  );
  const rows = csvParseRows(
    text
      .split("\n")
      .filter((l) => l !== "" && !l.startsWith("#"))
      .join("\n"),
  );
  expect(rows[0]).toEqual(["E/N", "E/N (decimal)", "count", "N_DW min", "N_DW max"]);
  expect(rows[1]).toEqual(["'-64/3", "-21.333333", "2", "1", "3"]);
  expect(rows[2]).toEqual(["8/3", "2.6666667", "5", "6", "6"]);
  for (const r of rows.slice(1))
    for (const c of r) expect(Number.isFinite(Number(c)) || !/^[=+\-@\t\r]/.test(c), c).toBe(true);
});

test("N_DW text: integers as they are, a scan's fractional N_DW (2N/𝒳_S = 2/3) to four digits", () => {
  expect(nDWText({ nDWMin: 3, nDWMax: 3 })).toBe("3");
  expect(nDWText({ nDWMin: 1, nDWMax: 6 })).toBe("1–6");
  expect(nDWText({ nDWMin: 2 / 3, nDWMax: 1.5 })).toBe("0.6667–1.5");
});
