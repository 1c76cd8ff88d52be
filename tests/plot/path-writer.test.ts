// The byte-level path writer (src/plot/path-writer.ts): numbers written as SVG path data read back exactly as
// q/100 (SVG 1.1 path grammar, W3C 2011, §8.3.9: fractions may drop the leading zero), and the memory of recent
// paths that lets the SVG writer skip rescanning them stays correct and bounded.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { beginPath, finishPath, isRecentPath, writeAscii, writeHundredths } from "../../src/plot/path-writer";
import { isSafePathData } from "../../src/plot/svg";

function written(q: number): string {
  beginPath();
  writeHundredths(q);
  return finishPath();
}

/** The reference text of q hundredths: the shortest round-trip decimal of q/100 (ECMA-262 Number::toString), leading "0" dropped. */
function reference(q: number): string {
  return String(q / 100).replace(/^(-?)0\./, "$1.");
}

describe("writeHundredths", () => {
  test("known values", () => {
    expect(written(12345)).toBe("123.45");
    expect(written(-50)).toBe("-.5");
    expect(written(300)).toBe("3");
    expect(written(5)).toBe(".05");
    expect(written(0)).toBe("0");
    expect(written(99999)).toBe("999.99");
    expect(written(100000)).toBe("1000");
    expect(written(Number.NaN)).toBe("0");
  });

  test("every integer up to 10¹² in magnitude reads back as q/100 and equals the shortest decimal", () => {
    fc.assert(
      fc.property(fc.integer({ min: -1e12, max: 1e12 }), (q) => {
        const s = written(q);
        expect(s).toBe(reference(q));
        expect(Number(s)).toBe(q / 100);
      }),
      { numRuns: 20000 },
    );
    // Around the digit-count boundaries of the fast paths.
    for (let q = -200_100; q <= 200_100; q += 7) expect(written(q)).toBe(reference(q));
  });
});

describe("recent paths", () => {
  test("a path just written is known, a changed copy is not, and unsafe text is still refused", () => {
    beginPath();
    for (let i = 0; i < 200; i++) {
      writeAscii("l");
      writeHundredths(i * 37);
      writeAscii(" ");
      writeHundredths(-i);
    }
    const d = finishPath();
    expect(d.length).toBeGreaterThan(256);
    expect(isRecentPath(d)).toBe(true);
    expect(isSafePathData(d)).toBe(true);
    const tampered = d.slice(0, 100) + '"/><script>' + d.slice(111);
    expect(tampered.length).toBe(d.length);
    expect(isRecentPath(tampered)).toBe(false);
    expect(isSafePathData(tampered)).toBe(false);
  });

  test("memory is bounded: old paths are forgotten (and still pass the full check)", () => {
    const write = (k: number, steps: number) => {
      beginPath();
      writeAscii(`M${k} 0`);
      for (let i = 0; i < steps; i++) writeAscii("h1");
      return finishPath();
    };
    const first = write(0, 600);
    expect(isRecentPath(first)).toBe(true);
    // By count: 300 more distinct paths (more than the 256 remembered).
    for (let k = 1; k <= 300; k++) write(k, 200);
    expect(isRecentPath(first)).toBe(false);
    expect(isSafePathData(first)).toBe(true);
    // By size: 10 distinct paths of 1,000,000 characters (more than the 8·10⁶ remembered).
    const big = write(-1, 499_998);
    expect(isRecentPath(big)).toBe(true);
    for (let k = 0; k < 10; k++) write(1000 + k, 499_998);
    expect(isRecentPath(big)).toBe(false);
    expect(isSafePathData(big)).toBe(true);
  });
});
