// The one curve preparation (src/analysis/prepared-curve.ts) shared by the drawing, the hover readout and the
// overlap: every consumer skips the same points. Expected values are worked out by hand from the data below;
// linear interpolation in log-log space is the plain two-point formula (common practice).
import { describe, expect, test } from "vitest";
import { prepareCurve } from "../../src/analysis/prepared-curve";
import { overlapDetail } from "../../src/analysis/overlap/index";
import { curveGeometry } from "../../src/plot/curves";
import { REF_2019 } from "../../src/physics/constants";
import { curveGAt } from "../../src/ui/figure/hit";
import { curve } from "../plot/fixture";

// Invented data: masses out of order, one point with g = 0, one with a negative mass, one NaN, and a mass
// array two values longer than the coupling array (those two masses have no partner).
const massEv = Float64Array.from([4e-6, 1e-6, 2e-6, -1, 3e-6, NaN, 5e-6, 6e-6, 7e-6]);
const gInvGeV = Float64Array.from([4e-12, 1e-12, 0, 1e-12, 3e-12, 1e-12, 5e-12]);
// Kept: positions 0 (4e-6), 1 (1e-6), 4 (3e-6), 6 (5e-6); skipped: 2 (g = 0), 3 (m < 0), 5 (NaN), 7 and 8
// (no coupling).
const KEPT_BY_MASS = [1, 4, 0, 6];
const SKIPPED = 5;

describe("one preparation for drawing, hover and overlap", () => {
  test("the preparation keeps the usable points, orders them by mass and counts the rest", () => {
    const p = prepareCurve(massEv, gInvGeV, true);
    expect(Array.from(p.index)).toEqual(KEPT_BY_MASS);
    expect(p.skipped).toBe(SKIPPED);
    expect(Array.from(p.lm)).toEqual(KEPT_BY_MASS.map((i) => Math.log10(massEv[i])));
    const file = prepareCurve(massEv, gInvGeV, false);
    expect(Array.from(file.index)).toEqual([0, 1, 4, 6]);
    expect(file.skipped).toBe(SKIPPED);
  });

  test("the drawing and the overlap report the same skipped count, for lines and regions", () => {
    for (const role of ["exclusion", "projection", "region"] as const) {
      const c = curve({ id: role, role, massEv, gInvGeV });
      const frame = {
        constants: REF_2019,
        view: "coupling" as const,
        map: { ax: 0, bx: 100, ay: 0, by: -100 },
        plot: { x: 0, y: 0, w: 600, h: 400 },
        lineWidthPx: 1,
        resolution: 1,
      };
      const drawn = curveGeometry(c, frame, "c");
      const overlap = overlapDetail({ eOverNMin: 0, eOverNMax: 0 }, { massEv, gInvGeV, role });
      expect(drawn.skipped, role).toBe(SKIPPED);
      expect(overlap.skippedPoints, role).toBe(SKIPPED);
    }
  });

  test("the hover readout and the overlap read the curve through the same points", () => {
    const c = curve({ id: "x", role: "exclusion", massEv, gInvGeV });
    // At 2e-6 eV (the skipped g = 0 point) the readout interpolates between 1e-6 and 3e-6 in log-log space:
    // log g = −12 + (log 2 − log 1)/(log 3 − log 1) · log 3 = −12 + log 2, so g = 2e-12 exactly in real numbers.
    expect(curveGAt(c, 2e-6)).toBeCloseTo(2e-12, 24);
    // Beyond the last usable mass (5e-6) nothing is claimed, though the mass array runs to 7e-6.
    expect(curveGAt(c, 6e-6)).toBeNull();
    // The overlap's mass range is that of the same usable points: 1e-6 … 5e-6 eV.
    const d = overlapDetail({ eOverNMin: 0, eOverNMax: 0 }, { massEv, gInvGeV, role: "exclusion" });
    expect(d.massRangeEv).toEqual([1e-6, 5e-6]);
  });
});
