// The sort behind prepareCurve's mass order (src/analysis/stable-order.ts) against the comparator sort it
// replaces, on random keys with many ties (a stable sort keeps equal keys in input order: common practice).
import { describe, expect, test } from "vitest";
import { prepareCurve } from "../../src/analysis/prepared-curve";
import { stableOrder } from "../../src/analysis/stable-order";
import { mulberry32 } from "../../src/project/demo";

/** Deterministic random numbers (the demo's mulberry32), so a failure reproduces. */
const rng = mulberry32;

const byComparator = (keys: Float64Array) =>
  Array.from({ length: keys.length }, (_, i) => i).sort((a, b) => keys[a] - keys[b] || a - b);

describe("stableOrder", () => {
  test("random keys with ties, nearly sorted and reversed runs, the empty and one-element arrays", () => {
    const r = rng(17);
    const cases: Float64Array[] = [new Float64Array(0), Float64Array.of(3)];
    for (const n of [2, 17, 1000, 5000]) {
      cases.push(Float64Array.from({ length: n }, () => Math.floor(r() * 50) * 1e-6));
      cases.push(Float64Array.from({ length: n }, (_, i) => (i + (r() < 0.1 ? 5 : 0)) * 1e-7));
      cases.push(Float64Array.from({ length: n }, (_, i) => (n - i) * 1.5 + r()));
      cases.push(Float64Array.from({ length: n }, () => -1e300 + r() * 2e300));
    }
    for (const keys of cases) expect(Array.from(stableOrder(keys))).toEqual(byComparator(keys));
  });

  test("positive keys equal but for their lowest bits, subnormals, and more points than 2^17", () => {
    const r = rng(23);
    const eps = Number.EPSILON;
    const cases: Float64Array[] = [];
    for (const n of [40, 3000]) {
      // Keys that differ only in the bits the positions are packed into: small groups and groups over 32.
      cases.push(Float64Array.from({ length: n }, () => 1 + Math.floor(r() * 8) * eps));
      cases.push(Float64Array.from({ length: n }, () => 1 + Math.floor(r() * (n / 2)) * eps));
      cases.push(Float64Array.from({ length: n }, (_, i) => 1 + i * eps));
      cases.push(Float64Array.from({ length: n }, () => Number.MIN_VALUE * (1 + Math.floor(r() * 100))));
    }
    cases.push(Float64Array.from({ length: 140_000 }, () => 1e-6 * (1 + Math.floor(r() * 90_000) / 90_000)));
    for (const keys of cases) {
      const order = stableOrder(keys);
      const expected = byComparator(keys);
      // Compared as bytes: deep equality of 140,000 numbers is slow.
      expect(Buffer.from(order.buffer).equals(Buffer.from(Uint32Array.from(expected).buffer))).toBe(true);
    }
  });
});

describe("prepareCurve in mass order", () => {
  test("out-of-order masses with ties and unusable points: the comparator's order, log10 of each point", () => {
    const r = rng(5);
    const n = 3000;
    const massEv = Float64Array.from({ length: n }, (_, i) =>
      i % 97 === 0 ? -1 : i % 89 === 0 ? NaN : Math.floor(r() * 400) * 1e-8,
    );
    const gInvGeV = Float64Array.from({ length: n }, (_, i) => (i % 83 === 0 ? 0 : 1e-12 * (1 + r())));
    const p = prepareCurve(massEv, gInvGeV, true);
    const usable = Array.from({ length: n }, (_, i) => i).filter(
      (i) => massEv[i] > 0 && gInvGeV[i] > 0 && massEv[i] < Infinity && gInvGeV[i] < Infinity,
    );
    const order = usable.sort((a, b) => massEv[a] - massEv[b] || a - b);
    expect(Array.from(p.index)).toEqual(order);
    expect(Array.from(p.lm)).toEqual(order.map((i) => Math.log10(massEv[i])));
    expect(Array.from(p.lg)).toEqual(order.map((i) => Math.log10(gInvGeV[i])));
    expect(p.skipped).toBe(n - order.length);
    const file = prepareCurve(massEv, gInvGeV, false);
    expect(Array.from(file.index)).toEqual(order.slice().sort((a, b) => a - b));
  });
});
