// Property tests of the overlap core against a brute-force classification at many random masses, on random
// invented curves and regions: the exact intervals must agree with direct evaluation away from boundaries.
//
// The brute force is written independently here: it interpolates the curve linearly in log-log space at
// the sampled mass, takes the band edges from bandEdges (g_aγγ = α/(2π f_a)|E/N − c_γ| with the theory
// spread, Grilli di Cortona et al., JHEP 01 (2016) 034; Gorghetto & Villadoro, JHEP 03 (2019) 033), and
// applies the definitions directly: whole where g_low ≥ G (g_low > 0), part where g_high ≥ G otherwise;
// for a region, it cuts the polygon with the vertical line at m and compares the band's segment with the
// cross-section's intervals.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { bandEdges } from "../../src/physics";
import { overlapDetail, type Interval, type OverlapDetail } from "../../src/analysis/overlap";

type Cls = "whole" | "part" | "none";

/** A fixed seed keeps the suite reproducible; FC_SEED=n explores other cases (the merging property passed 30,000
 *  runs with seed 12345 once its ends were read in the curve's own ln m). */
const SEED = Number(process.env.FC_SEED ?? 0x5eed0017);

/** ln-mass tolerance: samples this close to a reported boundary are not compared (10⁻⁹ of a decade ≈ 2.3·10⁻⁹). */
const TOL = 1e-9 * Math.LN10;

function nearBoundary(x: number, d: OverlapDetail): boolean {
  const ends = [...d.whole, ...d.part].flat();
  return ends.some((e) => Math.abs(Math.log(e) - x) < TOL);
}

function inList(m: number, list: Interval[]): boolean {
  return list.some(([lo, hi]) => m >= lo && m <= hi);
}

function reported(m: number, d: OverlapDetail): Cls {
  return inList(m, d.whole) ? "whole" : inList(m, d.part) ? "part" : "none";
}

interface ModelArb {
  eOverNMin: number;
  eOverNMax: number;
  sigmas: number;
  ref: "2016" | "2019";
}

const modelArb: fc.Arbitrary<ModelArb> = fc
  .record({
    a: fc.double({ min: -6, max: 20, noNaN: true }),
    width: fc.oneof(fc.constant(0), fc.double({ min: 0, max: 12, noNaN: true })),
    sigmas: fc.constantFrom(0, 0, 0.5, 1, 2),
    ref: fc.constantFrom("2016" as const, "2019" as const),
  })
  .map(({ a, width, sigmas, ref }) => ({ eOverNMin: a, eOverNMax: a + width, sigmas, ref }));

/** Band edges in the sheared plane: ln(g/m) of the lower (−∞ when it cancels) and upper edge. */
function levels(model: ModelArb): [number, number] {
  const { lowInvGeV, highInvGeV } = bandEdges(1, model.eOverNMin, model.eOverNMax, model);
  return [lowInvGeV > 0 ? Math.log(lowInvGeV) : -Infinity, Math.log(highInvGeV)];
}

describe("exclusion curves: exact intervals = brute-force classification", () => {
  const curveArb = fc.record({
    logMasses: fc.uniqueArray(fc.double({ min: -7, max: -3, noNaN: true }), { minLength: 2, maxLength: 30 }),
    // Offsets of exactly 0 would put the curve on the model line itself, where g ≥ G is decided by
    // round-off; the property is about masses away from boundaries, so keep the curve off the levels.
    offsets: fc.array(
      fc.double({ min: -2.5, max: 2.5, noNaN: true }).filter((o) => Math.abs(o) > 1e-3),
      { minLength: 30, maxLength: 30 },
    ),
    factor: fc.oneof(fc.constant(1), fc.double({ min: 0.3, max: 3, noNaN: true })),
    role: fc.constantFrom("exclusion" as const, "projection" as const),
    shuffle: fc.boolean(),
  });

  test("random curves and bands, 400 random masses each", () => {
    fc.assert(
      fc.property(
        modelArb,
        curveArb,
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 400, maxLength: 400 }),
        (model, c, us) => {
          const xs = [...c.logMasses].sort((p, q) => p - q).map((l) => l * Math.LN10);
          if (xs[xs.length - 1] - xs[0] < 1e-3) return;
          // Two samples at (numerically) the same mass make a vertical step whose order in the file decides
          // which value the next segment starts from; the brute force cannot know it, so keep masses apart.
          if (xs.some((x, i) => i > 0 && x - xs[i - 1] < 1e-9)) return;
          const [lo, hi] = levels(model);
          const mid = Number.isFinite(lo) ? (lo + hi) / 2 : hi;
          // Curve values scattered around the band in the sheared plane (ln g − ln m).
          const vs = xs.map((_, i) => mid + c.offsets[i]);
          const idx = xs.map((_, i) => i);
          if (c.shuffle) idx.reverse();
          const curve = {
            massEv: Float64Array.from(idx, (i) => Math.exp(xs[i])),
            gInvGeV: Float64Array.from(idx, (i) => Math.exp(xs[i] + vs[i])),
            role: c.role,
            gFactor: c.factor,
          };
          const d = overlapDetail(model, curve, { mergeGaps: false });
          const masses = Array.from(xs, Math.exp);
          const gs = xs.map((x, i) => Math.exp(x + vs[i]));
          for (const u of us) {
            const x = xs[0] + u * (xs[xs.length - 1] - xs[0]);
            if (nearBoundary(x, d) || x - xs[0] < TOL || xs[xs.length - 1] - x < TOL) continue;
            const m = Math.exp(x);
            if (m < masses[0] || m > masses[masses.length - 1]) continue;
            // Brute force: linear interpolation of ln g in ln m, then the definitions.
            let j = 0;
            while (j + 2 < xs.length && xs[j + 1] < x) j++;
            const t = (x - xs[j]) / (xs[j + 1] - xs[j]);
            const G = c.factor * Math.exp(Math.log(gs[j]) + t * (Math.log(gs[j + 1]) - Math.log(gs[j])));
            const { lowInvGeV, highInvGeV } = bandEdges(m, model.eOverNMin, model.eOverNMax, model);
            const expected: Cls = lowInvGeV > 0 && lowInvGeV >= G ? "whole" : highInvGeV >= G ? "part" : "none";
            expect(reported(m, d)).toBe(expected);
          }
          // Structure: ascending, disjoint, inside the mass range, whole ∪ part ∪ none covers it.
          const all = [...d.whole, ...d.part, ...d.none].sort((p, q) => p[0] - q[0]);
          for (let i = 1; i < all.length; i++) expect(all[i][0]).toBeGreaterThanOrEqual(all[i - 1][1]);
          const covered = all.reduce((s, [a, b]) => s + Math.log(b / a), 0);
          expect(covered).toBeCloseTo(xs[xs.length - 1] - xs[0], 9);
          if (model.eOverNMin === model.eOverNMax && model.sigmas === 0) expect(d.part).toEqual([]);
          if (d.cancels) expect(d.whole).toEqual([]);
        },
      ),
      { numRuns: 300, seed: SEED },
    );
  });

  test("merging only bridges gaps narrower than the curve segments at their ends", () => {
    fc.assert(
      fc.property(modelArb, curveArb, (model, c) => {
        const xs = [...c.logMasses].sort((p, q) => p - q).map((l) => l * Math.LN10);
        if (xs[xs.length - 1] - xs[0] < 1e-3) return;
        const [lo, hi] = levels(model);
        const mid = Number.isFinite(lo) ? (lo + hi) / 2 : hi;
        const curve = {
          massEv: Float64Array.from(xs, Math.exp),
          gInvGeV: Float64Array.from(xs, (x, i) => Math.exp(x + mid + c.offsets[i])),
          role: c.role,
        };
        const raw = overlapDetail(model, curve, { mergeGaps: false });
        const merged = overlapDetail(model, curve, { mergeGaps: true });
        // Everything raw reports is still reported, as the same or a stronger kind.
        for (const [a, b] of raw.whole) expect(inList((a + b) / 2, merged.whole)).toBe(true);
        for (const [a, b] of raw.part)
          expect(inList((a + b) / 2, merged.whole) || inList((a + b) / 2, merged.part)).toBe(true);
        // Segments in the curve's own ln m (the logs of its masses, as the core reads them). A gap's start lies in
        // x_j ≤ lo < x_j+1, its end in x_k < hi ≤ x_k+1; an end within TOL of a sample may fall on either side of
        // it after the exp/log round trip of the reported masses, so either neighbouring segment may hold it.
        const px = Array.from(curve.massEv, Math.log);
        const endWidth = (x: number, start: boolean): number => {
          let i = 0;
          while (i + 2 < px.length && (start ? px[i + 1] <= x : px[i + 1] < x)) i++;
          let w = px[i + 1] - px[i];
          if (i > 0 && Math.abs(x - px[i]) < TOL) w = Math.max(w, px[i] - px[i - 1]);
          if (i + 2 < px.length && Math.abs(x - px[i + 1]) < TOL) w = Math.max(w, px[i + 2] - px[i + 1]);
          return w;
        };
        for (const [a, b] of merged.bridgedGapsEv) {
          const la = Math.log(a);
          const lb = Math.log(b);
          expect(lb - la).toBeLessThan(Math.min(endWidth(la, true), endWidth(lb, false)) + 1e-12);
        }
        // What merging added lies inside bridged gaps.
        for (const [a, b] of merged.whole) {
          for (const u of [0.1, 0.3, 0.5, 0.7, 0.9]) {
            const m = a * (b / a) ** u;
            if (!inList(m, raw.whole)) expect(inList(m, merged.bridgedGapsEv)).toBe(true);
          }
        }
      }),
      { numRuns: 300, seed: SEED },
    );
  });
});

describe("regions: exact intervals = brute-force cross-sections", () => {
  const regionArb = fc.record({
    // Angular steps (normalised to a full turn), so vertices are distinct and the polygon has an area.
    steps: fc.array(fc.double({ min: 0.1, max: 1, noNaN: true }), { minLength: 3, maxLength: 24 }),
    radii: fc.array(fc.double({ min: 0.2, max: 1, noNaN: true }), { minLength: 24, maxLength: 24 }),
    rx: fc.double({ min: 0.5, max: 4, noNaN: true }),
    rv: fc.double({ min: 0.2, max: 4, noNaN: true }),
    dv: fc.double({ min: -2, max: 2, noNaN: true }),
  });

  test("random star-shaped polygons and bands, 300 random masses each", () => {
    fc.assert(
      fc.property(
        modelArb,
        regionArb,
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 300, maxLength: 300 }),
        (model, r, us) => {
          const [lo, hi] = levels(model);
          const mid = Number.isFinite(lo) ? (lo + hi) / 2 : hi;
          const cx = Math.log(1e-5);
          const total = r.steps.reduce((a, b) => a + b, 0);
          let acc = 0;
          const angles = r.steps.map((st) => ((acc += st) / total) * 2 * Math.PI);
          const px = angles.map((a, i) => cx + r.rx * r.radii[i] * Math.cos(a));
          const pv = angles.map((a, i) => mid + r.dv + r.rv * r.radii[i] * Math.sin(a));
          const region = {
            massEv: Float64Array.from(px, Math.exp),
            gInvGeV: Float64Array.from(px, (x, i) => Math.exp(x + pv[i])),
            role: "region" as const,
          };
          const d = overlapDetail(model, region, { mergeGaps: false });
          const xMin = Math.min(...px);
          const xMax = Math.max(...px);
          if (!(xMax - xMin > 1e-6)) return;
          for (const u of us) {
            const x = xMin + u * (xMax - xMin);
            if (nearBoundary(x, d) || x - xMin < TOL || xMax - x < TOL) continue;
            // Brute force: the vertical line at x cuts the polygon in pairs of crossings.
            const cuts: number[] = [];
            for (let i = 0; i < px.length; i++) {
              const j = (i + 1) % px.length;
              if (px[i] > x !== px[j] > x) cuts.push(pv[i] + ((x - px[i]) / (px[j] - px[i])) * (pv[j] - pv[i]));
            }
            cuts.sort((p, q) => p - q);
            let expected: Cls = "none";
            for (let k = 0; k + 1 < cuts.length; k += 2) {
              const [a, b] = [cuts[k], cuts[k + 1]];
              if (Number.isFinite(lo) && a <= lo && hi <= b) expected = "whole";
              else if (expected === "none" && a <= hi && b >= lo) expected = "part";
            }
            if (lo === hi && expected === "part") expected = "whole";
            expect(reported(Math.exp(x), d)).toBe(expected);
          }
          if (d.cancels) expect(d.whole).toEqual([]);
        },
      ),
      { numRuns: 300, seed: SEED },
    );
  });
});
