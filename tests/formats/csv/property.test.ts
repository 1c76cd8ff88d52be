// Property tests (fast-check) of the curve CSV importer: garbage never throws and keeps its bookkeeping
// straight, the chunked parser equals the one-shot parser for any chunk boundaries, numbers read exactly as
// the engine's correctly rounded Number() reads them, and tables parse as d3-dsv's csvParseRows (a reference
// RFC 4180 parser, https://github.com/d3/d3-dsv) splits them.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { csvParseRows } from "d3-dsv";
import {
  createCurveParser,
  parseCurveText,
  readNumberText,
  type CurveParseOptions,
  type CurveParseResult,
} from "../../../src/data";

function chunked(text: string, cuts: number[], opts: CurveParseOptions = {}): CurveParseResult {
  const p = createCurveParser(opts);
  const points = [...new Set(cuts.map((c) => Math.min(text.length, c)))].sort((a, b) => a - b);
  let prev = 0;
  for (const c of points) {
    p.push(text.slice(prev, c));
    prev = c;
  }
  p.push(text.slice(prev));
  return p.finish();
}

/** Everything a result holds, with typed arrays as plain arrays (Object.is keeps −0 apart). */
function plain(r: CurveParseResult) {
  return {
    ...r,
    massEv: Array.from(r.massEv, (x) => (Object.is(x, -0) ? "-0" : x)),
    gInvGeV: Array.from(r.gInvGeV, (x) => (Object.is(x, -0) ? "-0" : x)),
  };
}

// Lines that look like the files users bring: numbers in various spellings, comments, headers, junk.
const number = fc.oneof(
  fc.double({ noNaN: true, noDefaultInfinity: true }).map(String),
  fc.double({ min: 1e-12, max: 1e3, noNaN: true }).map((x) => x.toExponential(6)),
  fc.integer({ min: -5, max: 1000 }).map(String),
  fc.constantFrom("1,5", "2,5e-12", "-0", "abc", "", "1e400", "NaN", '"1.0"', '"2e-10"', "1.2.3"),
);
const sep = fc.constantFrom(",", ";", "\t", " ", "  ", ", ");
const line = fc.oneof(
  { weight: 6, arbitrary: fc.tuple(number, sep, number).map(([a, s, b]) => a + s + b) },
  { weight: 1, arbitrary: fc.tuple(number, sep, number, sep, number).map((x) => x.join("")) },
  {
    weight: 1,
    arbitrary: fc.constantFrom("# comment", "", "   ", "m_a [ueV],g [1/GeV]", "mass (GHz);g", ",,", "\u0000"),
  },
  { weight: 1, arbitrary: fc.string({ maxLength: 20 }) },
);
const eol = fc.constantFrom("\n", "\r\n", "\r");
const csvText = fc
  .tuple(fc.boolean(), fc.array(line, { maxLength: 30 }), eol, fc.boolean())
  .map(([bom, lines, nl, last]) => (bom ? "\uFEFF" : "") + lines.join(nl) + (last ? nl : ""));

describe("garbage never throws (it returns rejections)", () => {
  test("random strings of any code units, and CSV-like junk", () => {
    fc.assert(
      fc.property(
        fc.oneof(
          fc.string({ unit: "binary", maxLength: 400 }),
          fc.string({ unit: "grapheme", maxLength: 400 }),
          csvText,
        ),
        (text) => {
          const r = parseCurveText(text);
          expect(r.massEv.length).toBe(r.gInvGeV.length);
          if (r.fatal === null) {
            // Every data row is either kept or rejected, nothing silently lost.
            expect(r.massEv.length + r.rejectedCount).toBe(r.dataRows);
            expect(r.rejected.length).toBe(r.rejectedCount);
          } else {
            expect(r.massEv.length).toBe(0);
            expect(r.fatal.message.length).toBeGreaterThan(0);
          }
          for (const j of r.rejected) {
            expect(j.row).toBeGreaterThanOrEqual(1);
            expect(j.row).toBeLessThanOrEqual(r.lineCount);
            expect(j.column).toBeGreaterThanOrEqual(1);
            expect(j.reason.length).toBeGreaterThan(0);
          }
          let np = 0;
          for (let i = 0; i < r.massEv.length; i++) if (!(r.massEv[i] > 0) || !(r.gInvGeV[i] > 0)) np++;
          expect(r.nonPositive).toBe(np);
        },
      ),
      { numRuns: 500 },
    );
  });
});

describe("chunked parsing equals one-shot parsing", () => {
  test("random texts, random chunk boundaries (including inside CRLF pairs and before the BOM's successor)", () => {
    fc.assert(
      fc.property(csvText, fc.array(fc.nat({ max: 2000 }), { maxLength: 12 }), (text, cuts) => {
        expect(plain(chunked(text, cuts))).toEqual(plain(parseCurveText(text)));
      }),
      { numRuns: 400 },
    );
  });
  test("one character at a time, with options", () => {
    const text = "# c\r\nm_a [ueV];g [1/GeV]\r\n1,5;2,5e-12\r\nx;1\r\n3;4e-12";
    const opts = { fileName: "a.csv", log10Coupling: false };
    expect(
      plain(
        chunked(
          text,
          [...text].map((_, i) => i),
          opts,
        ),
      ),
    ).toEqual(plain(parseCurveText(text, opts)));
  });
  test("detection sees the same lines however the text is cut: a header after 64 comment-free lines", () => {
    const text = Array.from({ length: 200 }, (_, i) => `${i + 1}\t${(i + 1) * 1e-13}`).join("\n");
    const one = parseCurveText(text);
    expect(one.delimiter).toBe("\t");
    expect(plain(chunked(text, [5, 100, 101, 1000, 1001]))).toEqual(plain(one));
  });
});

describe("numbers read exactly like ECMAScript Number() (correctly rounded)", () => {
  const digits = fc.string({ unit: fc.constantFrom(..."0123456789"), minLength: 1, maxLength: 25 });
  const decimal = fc
    .tuple(fc.constantFrom("", "-", "+"), digits, fc.option(digits), fc.option(fc.integer({ min: -330, max: 310 })))
    .map(([s, a, b, e]) => `${s}${a}${b === null ? "" : "." + b}${e === null ? "" : "e" + e}`);
  test("random decimal strings of up to 25 digits", () => {
    fc.assert(
      fc.property(decimal, (s) => {
        const ref = Number(s);
        const got = readNumberText(s);
        if (Number.isFinite(ref)) expect(Object.is(got, ref)).toBe(true);
        else expect(got).toBeNaN();
      }),
      { numRuns: 2000 },
    );
  });
  test("a unit prefix shifts the exponent exactly: x μeV reads as Number(x + 'e-6') eV", () => {
    fc.assert(
      fc.property(fc.tuple(digits, digits, fc.integer({ min: -40, max: 40 })), ([a, b, e]) => {
        const s = `${a}.${b}e${e}`;
        const r = parseCurveText(`m [ueV],g\n${s},1\n`);
        expect(Object.is(r.massEv[0], Number(`${a}.${b}e${e - 6}`))).toBe(true);
      }),
      { numRuns: 500 },
    );
  });
});

describe("agrees with d3-dsv's csvParseRows on quoted and unquoted numeric tables", () => {
  test("random tables, random quoting and padding", () => {
    const cell = fc
      .tuple(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.boolean())
      .map(([x, q]) => (q ? `"${x}"` : String(x)));
    fc.assert(
      fc.property(fc.array(fc.tuple(cell, cell, fc.option(cell)), { minLength: 1, maxLength: 30 }), (rows) => {
        const text = rows.map((r) => r.filter((c) => c !== null).join(",")).join("\r\n");
        const ref = csvParseRows(text);
        const r = parseCurveText(text, { delimiter: "," });
        expect(r.rejected).toEqual([]);
        expect(Array.from(r.massEv)).toEqual(ref.map((row) => Number(row[0])));
        expect(Array.from(r.gInvGeV)).toEqual(ref.map((row) => Number(row[1])));
        expect(r.columnCount).toBe(Math.max(...ref.map((row) => row.length)));
      }),
      { numRuns: 300 },
    );
  });
});
