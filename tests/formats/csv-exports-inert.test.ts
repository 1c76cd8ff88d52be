// The curve and model-line CSV exports write labels, citations and project names only inside `#` comment
// lines, so no cell a spreadsheet reads can start a formula (OWASP "CSV Injection", common practice): every
// cell outside a comment is a number or starts with no formula character (read with d3-dsv's csvParseRows).
import { describe, expect, test } from "vitest";
import { csvParseRows } from "d3-dsv";
import { curveToCsv } from "../../src/formats/curve-export";
import { modelsToCsv } from "../../src/formats/model-csv";
import { emptyProject, newModel } from "../../src/project/defaults";

const EVIL = '=HYPERLINK("http://x")\n+cmd|calc\r@SUM(A1)\t-1+1 <script>';

function expectInert(text: string) {
  for (const line of text.split("\n").filter((l) => l !== "")) {
    if (line.startsWith("#")) continue;
    const cells = csvParseRows(line)[0];
    for (const c of cells) expect(Number.isFinite(Number(c)) || !/^[=+\-@\t\r]/.test(c), line).toBe(true);
  }
}

describe("CSV exports keep text out of cells", () => {
  test("curve CSV with a formula label and citation", () => {
    const text = curveToCsv(
      { massEv: Float64Array.of(1e-6, 2e-6), gInvGeV: Float64Array.of(1e-13, 2e-13), label: EVIL, citation: EVIL },
      { massUnit: "ueV", couplingUnit: "normalized", comments: [EVIL] },
    );
    expectInert(text);
  });
  test("model-line CSV with a formula model label and project name", () => {
    const p = { ...emptyProject(EVIL), models: [newModel({ id: "m-1", eOverNMin: "8/3", label: EVIL })] };
    expectInert(modelsToCsv(p));
  });
});
