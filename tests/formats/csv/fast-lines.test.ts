// The parser's fast paths (src/formats/csv/fast-lines.ts: clean `number,number` lines read inline, from the text
// or from the bytes) must give exactly what the full path gives: property checks on random files that mix clean
// lines with every kind the fast paths leave to the full path (comparing a fast path against the plain
// implementation on random inputs is common practice).
import { describe, expect, test } from "vitest";
import { createCurveParser, parseCurveBytes, parseCurveText, type CurveParseOptions } from "../../../src/formats/csv";
import { mulberry32 } from "../../../src/project/demo";

/** Deterministic random numbers (the demo's mulberry32), so a failure reproduces. */
const rng = mulberry32;

const pick = <T>(r: () => number, xs: readonly T[]): T => xs[Math.floor(r() * xs.length)];
const digits = (r: () => number, n: number) => Array.from({ length: n }, () => Math.floor(r() * 10)).join("");

/** A number as files write it: signs, leading zeros, long mantissas, exponents near and past the exact range. */
function numberText(r: () => number, mark: string, wide: boolean): string {
  const sign = pick(r, ["", "", "", "+", "-", "\u2212"]);
  const int = pick(r, ["0", "", digits(r, 1 + Math.floor(r() * 3)), "000" + digits(r, 2), digits(r, 17)]);
  const frac = pick(r, ["", mark, mark + digits(r, 1 + Math.floor(r() * 8)), mark + digits(r, 14), mark + "0000"]);
  const exp = pick(r, [
    "",
    "",
    "e-5",
    "E+3",
    "e",
    "e-17",
    "e-23",
    "e22",
    "e-400",
    "e+0",
    ...(wide ? ["e400", "e123456"] : []),
  ]);
  const text = sign + int + frac + exp;
  return text === "" || text === sign ? "1" : text;
}

/**
 * A clean line (what the fast paths read) or one of the lines they leave to the full path; `stopping`: also
 * lines that stop the whole file (a third field under a two-column header).
 */
function lineText(r: () => number, delim: string, mark: string, stopping: boolean): string {
  // Values beyond a double, lone fields and stray CRs can make a row of a ';' or tab file look split by another
  // delimiter, which stops the file: only in comma files and the stopping ones.
  const wide = stopping || delim === ",";
  const a = numberText(r, mark, wide);
  const b = numberText(r, mark, wide);
  const kind = r();
  if (kind < 0.6) return a + delim + b;
  return pick(r, [
    "",
    "   ",
    "# label: a comment line",
    "#" + delim + "x",
    ` ${a}${delim}${b}`,
    `${a} ${delim} ${b} `,
    `"${a}"${delim}${b}`,
    stopping ? `${a}${delim}${b}${delim}7` : `${a}${delim}${b}`,
    wide ? `${a}` : `${a}${delim}${b}`,
    `${a}${delim}`,
    `${a}${delim}${b}x`,
    `x${delim}${b}`,
    `${a}${delim}µ${b}`,
    delim + delim,
    `0${delim}${b}`,
    `-0${delim}-0`,
    wide ? `${a}${delim}${b}\r` : `${a}${delim}${b}`,
  ]);
}

/** A file: a header, clean lines (past the layout detection and the 64 KiB the byte path reads as text), then random ones. */
function fileText(seed: number, delim: string, mark: string, crlf: boolean, tail: boolean, stopping = false): string {
  const r = rng(seed);
  const lines = [`mass_eV${delim}g_GeV^-1`];
  for (let i = 0; i < 3000; i++) lines.push(`${(1 + i / 1000).toFixed(5).replace(".", mark)}e-6${delim}3${mark}25e-12`);
  for (let i = 0; i < 600; i++) lines.push(lineText(r, delim, mark, stopping));
  const nl = crlf ? "\r\n" : "\n";
  return lines.join(nl) + (tail ? nl : "");
}

/** The full path alone: a row limit turns the fast paths off and, far above the rows, changes nothing else. */
const FULL_PATH: CurveParseOptions = { maxDataRows: Number.MAX_SAFE_INTEGER };

function same(a: ReturnType<typeof parseCurveText>, b: ReturnType<typeof parseCurveText>) {
  // Bit for bit, −0 apart from +0.
  expect(Buffer.from(a.massEv.buffer).equals(Buffer.from(b.massEv.buffer))).toBe(true);
  expect(Buffer.from(a.gInvGeV.buffer).equals(Buffer.from(b.gInvGeV.buffer))).toBe(true);
  // The rest (notes, skipped rows, units, fatal error…) deeply; the arrays are compared above as bytes, which is
  // what they must match, and far cheaper than an element-wise deep equality of 3,600 numbers.
  const { massEv: _am, gInvGeV: _ag, ...restA } = a;
  const { massEv: _bm, gInvGeV: _bg, ...restB } = b;
  expect(a.massEv.length).toBe(b.massEv.length);
  expect(restA).toEqual(restB);
}

const LAYOUTS: [string, string][] = [
  [",", "."],
  [";", ","],
  ["\t", "."],
  [";", "."],
];

describe("fast paths read exactly what the full path reads", () => {
  test.each(LAYOUTS)("text, delimiter %j, decimal mark %j: random files, whole and in pieces", (delim, mark) => {
    let read = 0;
    for (let seed = 1; seed <= 12; seed++) {
      const stopping = seed === 12;
      const text = fileText(seed * 7 + delim.charCodeAt(0), delim, mark, seed % 3 === 0, seed % 2 === 0, stopping);
      const full = parseCurveText(text, FULL_PATH);
      if (stopping) expect(full.fatal).not.toBeNull();
      // Some random files stop at a row that reads better with another delimiter (mixed-delimiters): fine.
      else if (!full.fatal) {
        expect(full.massEv.length).toBeGreaterThan(3000);
        read++;
      }
      same(parseCurveText(text), full);
      // Pieces that split lines, numbers and CRLF pairs anywhere.
      const r = rng(seed);
      const p = createCurveParser({ sizeHint: text.length });
      for (let i = 0; i < text.length;) {
        const n = 1 + Math.floor(r() * 5000);
        p.push(text.slice(i, i + n));
        i += n;
      }
      same(p.finish(), full);
    }
    expect(read).toBeGreaterThanOrEqual(8);
  });

  test.each(LAYOUTS)("bytes, delimiter %j, decimal mark %j: random files", (delim, mark) => {
    for (let seed = 1; seed <= 12; seed++) {
      const text = fileText(seed * 11 + delim.charCodeAt(0), delim, mark, seed % 3 === 0, seed % 2 === 1, seed === 12);
      const fromBytes = parseCurveBytes(new TextEncoder().encode(text), { fileName: "f.csv" });
      expect(fromBytes).not.toBeNull();
      same(fromBytes!, parseCurveText(text, { fileName: "f.csv", encoding: "utf-8", ...FULL_PATH }));
    }
  });

  test("units and conversions: a mass prefix, log10 columns, a normalized coupling", () => {
    const text = fileText(5, ",", ".", false, true);
    for (const opts of [
      { massUnit: "ueV" },
      { massUnit: "GHz" },
      { log10Mass: true },
      { couplingUnit: "normalized" },
      { massColumn: 2, couplingColumn: 1 },
    ] as CurveParseOptions[]) {
      const full = parseCurveText(text, { ...opts, ...FULL_PATH });
      same(parseCurveText(text, opts), full);
      same(parseCurveBytes(new TextEncoder().encode(text), opts)!, { ...full });
    }
  });

  test("exact values: mantissas of 15 digits, the ends of the exact range, leading zeros", () => {
    const head = Array.from({ length: 100 }, () => "1,1").join("\n");
    const r = parseCurveText(
      `${head}\n123456789012345,1e-22\n0.000123456789012345e22,1e22\n1234567890123456,5.\n.5,+7e+0\n`,
    );
    expect(Array.from(r.massEv.slice(100))).toEqual([123456789012345, 1234567890123450000, 1234567890123456, 0.5]);
    expect(Array.from(r.gInvGeV.slice(100))).toEqual([1e-22, 1e22, 5, 7]);
  });
});

describe("bytes the byte path leaves to the text decoder", () => {
  test("a byte order mark, UTF-16 and invalid UTF-8 give null (decodeImportBytes reads those)", () => {
    expect(parseCurveBytes(new Uint8Array([0xef, 0xbb, 0xbf, 0x31, 0x2c, 0x32, 0x0a]))).toBeNull();
    expect(parseCurveBytes(new Uint8Array([0xff, 0xfe, 0x31, 0x00]))).toBeNull();
    const bad = new TextEncoder().encode(fileText(3, ",", ".", false, true) + "1,2 X\n");
    bad[bad.length - 2] = 0xff;
    expect(parseCurveBytes(bad)).toBeNull();
  });
  test("a small file and a file with no line feed", () => {
    const small = "# label: tiny\nm [eV],g [1/GeV]\n1e-6,2e-12\n3e-6,4e-12\n";
    same(parseCurveBytes(new TextEncoder().encode(small))!, parseCurveText(small, { encoding: "utf-8" }));
    const cr = small.replace(/\n/g, "\r");
    same(parseCurveBytes(new TextEncoder().encode(cr))!, parseCurveText(cr, { encoding: "utf-8" }));
  });
});
