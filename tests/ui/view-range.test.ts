// A tiny axis range (links/tiny_range, issue 16: mass 1 … 1.0000000000000002 eV) followed by one wheel step must
// never put NaN into the range fields or null into the autosave: ranges are made drawable where they enter the
// state (restore step, store), not where they are drawn.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { decodeLink } from "../../src/formats/codec";
import { serializeForStorage } from "../../src/formats/project-file";
import { defaultProject } from "../../src/project/demo";
import { MIN_RANGE_DECADES, saneRange } from "../../src/project/view-range";
import { zoomRange } from "../../src/ui/figure/view-math";
import { createAxbandStore } from "../../src/ui/store";

const tinyLink = readFileSync(join(import.meta.dirname, "..", "formats", "repro", "links", "tiny_range.txt"), "utf8");
const decades = (r: readonly [number, number]) => Math.log10(r[1]) - Math.log10(r[0]);

describe("tiny axis ranges", () => {
  it("saneRange widens about the logarithmic centre (hand-derived: 10^±0.01 = 1.023293 and 0.977237)", () => {
    const r = saneRange([1, 1.0000000000000002]);
    expect(r?.[0]).toBeCloseTo(0.977237, 6);
    expect(r?.[1]).toBeCloseTo(1.023293, 6);
    expect(saneRange([1e-7, 1e-2])).toEqual([1e-7, 1e-2]);
    expect(saneRange([Number.NaN, 1])).toBeNull();
    expect(saneRange([0, 1])).toBeNull();
  });

  it("the link opens with drawable ranges and says it widened them", () => {
    const r = decodeLink(tinyLink);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(decades(r.project.figure.massRangeEv)).toBeGreaterThanOrEqual(MIN_RANGE_DECADES - 1e-12);
    expect(decades(r.project.figure.yRange)).toBeGreaterThanOrEqual(MIN_RANGE_DECADES - 1e-12);
    expect(r.repairs.some((m) => m.startsWith("figure, mass range: [1, 1.0000000000000002] cannot be drawn"))).toBe(
      true,
    );
    expect(r.repairs.some((m) => m.startsWith("figure, y range:"))).toBe(true);
  });

  it("a wheel step over a tiny range held in the store leaves finite ranges and an autosave without null", () => {
    const store = createAxbandStore();
    const p = defaultProject();
    // The ranges as the link carries them, put into the store as a whole project (no restore step in between).
    store.getState().resetProject({
      ...p,
      figure: { ...p.figure, massRangeEv: [1, 1.0000000000000002], yRange: [1e-14, 1.0000000000000002e-14] },
    });
    for (const factor of [1.1, 1 / 1.1]) {
      const f = store.getState().project.figure;
      const anchorMass = Math.log10(f.massRangeEv[0]);
      const anchorY = Math.log10(f.yRange[1]);
      store.getState().setView(zoomRange(f.massRangeEv, factor, anchorMass), zoomRange(f.yRange, factor, anchorY));
      const g = store.getState().project.figure;
      for (const v of [...g.massRangeEv, ...g.yRange]) expect(Number.isFinite(v) && v > 0).toBe(true);
      expect(serializeForStorage(store.getState().project).meta).not.toContain("null");
    }
  });

  it("the store keeps its range when handed a non-finite one", () => {
    const store = createAxbandStore();
    const before = store.getState().project.figure;
    store.getState().setView([Number.NaN, Number.NaN], [0, Number.POSITIVE_INFINITY]);
    store.getState().setFigure({ yRange: [Number.NaN, 1] });
    expect(store.getState().project.figure.massRangeEv).toEqual(before.massRangeEv);
    expect(store.getState().project.figure.yRange).toEqual(before.yRange);
  });
});
