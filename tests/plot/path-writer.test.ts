// The byte-level path writer (src/plot/path-writer.ts): numbers written as SVG path data read back exactly as
// q/100 (SVG 1.1 path grammar, W3C 2011, §8.3.9: fractions may drop the leading zero), and path data a scene
// node holds as written lets the SVG writer skip rescanning it only while it is unchanged.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { beginPath, finishPath, writeAscii, writeHundredths } from "../../src/plot/path-writer";
import { isSafePathData, nodeAttributes } from "../../src/plot/svg";

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
      // A boolean property (fast-check reports the failing q): an expect per run would cost more than the writer.
      fc.property(fc.integer({ min: -1e12, max: 1e12 }), (q) => {
        const s = written(q);
        return s === reference(q) && Number(s) === q / 100;
      }),
      { numRuns: 20000 },
    );
    // Around the digit-count boundaries of the fast paths; every mismatch is listed.
    const wrong: string[] = [];
    for (let q = -200_100; q <= 200_100; q += 7) if (written(q) !== reference(q)) wrong.push(`${q}: ${written(q)}`);
    expect(wrong).toEqual([]);
  });
});

describe("path data marked as written", () => {
  test("a node whose d is the writer's own string is written as is; a d changed afterwards is checked again", () => {
    beginPath();
    for (let i = 0; i < 200; i++) {
      writeAscii("l");
      writeHundredths(i * 37);
      writeAscii(" ");
      writeHundredths(-i);
    }
    const d = finishPath();
    expect(d.length).toBeGreaterThan(256);
    const node = { kind: "path" as const, d, writtenD: d, stroke: "#000" };
    expect(nodeAttributes(node)).toContainEqual(["d", d]);
    expect(isSafePathData(d)).toBe(true);
    const tampered = d.slice(0, 100) + '"/><script>' + d.slice(111);
    expect(tampered.length).toBe(d.length);
    expect(isSafePathData(tampered)).toBe(false);
    expect(nodeAttributes({ ...node, d: tampered }).find((a) => a[0] === "d")).toBeUndefined();
  });
});
