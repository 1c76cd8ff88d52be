// Curves prepared off the main thread (computePrepared, moved like a worker message, seedPreparedCurve) draw
// exactly as curves prepared where they are drawn: the reference is the plot core's own main-thread path
// (prepareCurve + viewArrays via buildScene), compared as whole SVG strings from writeSvg.
import { describe, expect, test } from "vitest";
import type { Curve, Project, YView } from "../../src/project/types";
import { buildScene, writeSvg } from "../../src/plot/index";
import { cachedPrepared } from "../../src/plot/thinning/index";
import {
  computePrepared,
  hasPrepared,
  preparedTransferables,
  prepareSpecOf,
  seedPreparedCurve,
} from "../../src/plot/prepare-transfer";
import { curve, fixtureProject, rng } from "./fixture";

/** Invented curves (formula plus seeded noise): a long exclusion in shuffled order with unusable points, a noisy projection kept in file order, a closed region. */
function bigCurves(): Curve[] {
  const r = rng(11);
  const n = 120_000;
  const m1 = new Float64Array(n);
  const g1 = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const x = -6.5 + (4 * i) / (n - 1);
    m1[i] = 10 ** x;
    g1[i] = 10 ** (-12.5 + 0.6 * Math.sin(7 * x) + 0.3 * (r() - 0.5));
  }
  // Shuffle (so the preparation sorts), with equal masses (the sort must be stable) and points a log axis cannot show.
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(r() * (i + 1));
    [m1[i], m1[j]] = [m1[j], m1[i]];
    [g1[i], g1[j]] = [g1[j], g1[i]];
  }
  for (let i = 0; i < 200; i++) m1[i * 7 + 1] = m1[i * 7];
  m1[5] = 0;
  g1[9] = -1;
  m1[13] = Number.NaN;
  g1[17] = Number.POSITIVE_INFINITY;
  const n2 = 60_000;
  const m2 = new Float64Array(n2);
  const g2 = new Float64Array(n2);
  for (let i = 0; i < n2; i++) {
    const x = -6 + (3 * i) / (n2 - 1) + 0.002 * (r() - 0.5);
    m2[i] = 10 ** x;
    g2[i] = 10 ** (-14 + 0.2 * x + 0.4 * (r() - 0.5));
  }
  const n3 = 40_000;
  const m3 = new Float64Array(n3);
  const g3 = new Float64Array(n3);
  for (let i = 0; i < n3; i++) {
    const t = (2 * Math.PI * i) / n3;
    m3[i] = 10 ** (-4 + 0.8 * Math.cos(t) + 0.01 * (r() - 0.5));
    g3[i] = 10 ** (-11.5 + 0.9 * Math.sin(t) + 0.01 * (r() - 0.5));
  }
  return [
    curve({ id: "long", role: "exclusion", massEv: m1, gInvGeV: g1 }),
    curve({
      id: "noisy",
      role: "projection",
      keepOrder: true,
      massEv: m2,
      gInvGeV: g2,
      rescale: { rhoAssumed: 0.45, rhoShown: 0.3, fraction: 1 },
    }),
    curve({ id: "closed", role: "region", keepOrder: true, massEv: m3, gInvGeV: g3 }),
  ];
}

function projectWith(curves: Curve[], yView: YView): Project {
  const p = fixtureProject();
  return { ...p, curves, figure: { ...p.figure, yView, yRange: yView === "coupling" ? [1e-16, 1e-9] : [1e-2, 1e3] } };
}

/** The same curves with fresh copies of their arrays (nothing cached for them yet). */
function copies(curves: Curve[]): Curve[] {
  return curves.map((c) => ({ ...c, massEv: c.massEv.slice(), gInvGeV: c.gInvGeV.slice() }));
}

// Generated once (a tenth of this file's time when each test made its own); every test takes fresh copies.
const BIG = bigCurves();

/** What the import worker does: prepare its own copy of the arrays and post it, transferring every buffer. */
function viaWorker(c: Curve, yView: YView) {
  const spec = prepareSpecOf(c, yView);
  const t = computePrepared(c.massEv.slice(), c.gInvGeV.slice(), spec.sorted, { slopes: spec.slopes });
  const buffers = preparedTransferables(t);
  // structuredClone with a transfer list follows postMessage's rules: a buffer listed twice would throw.
  const moved = structuredClone(t, { transfer: buffers });
  expect(buffers.every((b) => b.byteLength === 0)).toBe(true);
  return { spec, moved };
}

describe("seeding a curve prepared elsewhere", () => {
  for (const yView of ["coupling", "normalized", "g-gamma"] as const) {
    test(`gives the same SVG as preparing on the main thread (${yView} view; sorted, file-order and closed curves)`, () => {
      const base = copies(BIG);
      const reference = writeSvg(buildScene(projectWith(copies(base), yView), { resolution: 1.5 }));
      const seeded = copies(base);
      for (const c of seeded) {
        const { spec, moved } = viaWorker(c, yView);
        expect(hasPrepared(c.massEv, c.gInvGeV, spec)).toBe(false);
        expect(seedPreparedCurve(c.massEv, c.gInvGeV, spec.sorted, moved)).toBe(true);
        expect(hasPrepared(c.massEv, c.gInvGeV, spec)).toBe(true);
        // The scene really draws from the seeded arrays (not a fresh main-thread preparation).
        expect(cachedPrepared(c.massEv, c.gInvGeV, spec.sorted)?.lm).toBe(moved.lm);
      }
      const svg = writeSvg(buildScene(projectWith(seeded, yView), { resolution: 1.5 }));
      expect(svg.length).toBeGreaterThan(10_000);
      expect(svg).toBe(reference);
      // Zoomed in (other thinning levels, built lazily from the seeded arrays), and zoomed far out at a low
      // resolution, where a pixel column holds thousands of points and the thinning reads the pyramid.
      for (const [massRangeEv, resolution] of [
        [[2e-5, 3e-4], 2],
        [[1e-13, 1e3], 0.25],
      ] as const) {
        const at = (p: Project): Project => ({ ...p, figure: { ...p.figure, massRangeEv: [...massRangeEv] } });
        const fresh = copies(base);
        expect(writeSvg(buildScene(at(projectWith(seeded, yView)), { resolution }))).toBe(
          writeSvg(buildScene(at(projectWith(fresh, yView)), { resolution })),
        );
      }
    });
  }

  test("a reply for a curve prepared here meanwhile adds the views it lacks, and draws as before", () => {
    const base = copies(BIG);
    for (const c of copies(base)) {
      // Drawn here first in the g_aγγ view (e.g. an export before the worker replied).
      const spec0 = prepareSpecOf(c, "coupling");
      const specN = prepareSpecOf(c, "normalized");
      writeSvg(buildScene(projectWith([c], "coupling")));
      const cached = cachedPrepared(c.massEv, c.gInvGeV, spec0.sorted);
      expect(cached).toBeDefined();
      expect(hasPrepared(c.massEv, c.gInvGeV, specN)).toBe(false);
      // The worker's reply for the normalized view is merged into that entry, which stays the one drawn from.
      const t = computePrepared(c.massEv.slice(), c.gInvGeV.slice(), specN.sorted, { slopes: specN.slopes });
      expect(seedPreparedCurve(c.massEv, c.gInvGeV, specN.sorted, t)).toBe(true);
      expect(cachedPrepared(c.massEv, c.gInvGeV, spec0.sorted)).toBe(cached);
      expect(hasPrepared(c.massEv, c.gInvGeV, specN)).toBe(true);
      const fresh = copies([c]);
      expect(writeSvg(buildScene(projectWith([c], "normalized"), { resolution: 1.5 }))).toBe(
        writeSvg(buildScene(projectWith(fresh, "normalized"), { resolution: 1.5 })),
      );
    }
  });

  test("a transfer that does not fit the arrays is refused, and the curve is then prepared where it is drawn", () => {
    const [long] = copies(BIG);
    const { spec, moved } = viaWorker(long, "coupling");
    const target = copies([long])[0];
    // Wrong order: a sorted preparation for a file-order drawing.
    expect(seedPreparedCurve(target.massEv, target.gInvGeV, !spec.sorted, moved)).toBe(false);
    // Wrong length: arrays of another curve.
    const shorter = { massEv: target.massEv.subarray(1), gInvGeV: target.gInvGeV.subarray(1) };
    expect(seedPreparedCurve(shorter.massEv, shorter.gInvGeV, spec.sorted, moved)).toBe(false);
    expect(cachedPrepared(shorter.massEv, shorter.gInvGeV, spec.sorted)).toBeUndefined();
    const p = projectWith([{ ...long, massEv: shorter.massEv, gInvGeV: shorter.gInvGeV }], "coupling");
    const q = projectWith(copies([{ ...long, massEv: shorter.massEv, gInvGeV: shorter.gInvGeV }]), "coupling");
    expect(writeSvg(buildScene(p))).toBe(writeSvg(buildScene(q)));
  });

  test("the preparation counts the points a log axis cannot show (≤ 0, NaN, ±∞) as skipped", () => {
    const [long] = copies(BIG);
    const t = computePrepared(long.massEv.slice(), long.gInvGeV.slice(), true);
    expect(t.skipped).toBe(4);
    expect(t.n).toBe(long.massEv.length - 4);
    let descents = 0;
    for (let k = 1; k < t.n; k++) if (t.lm[k] < t.lm[k - 1]) descents++;
    expect(descents).toBe(0);
  });
});
