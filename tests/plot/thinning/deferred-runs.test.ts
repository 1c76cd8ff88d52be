// Deferred run thinning (src/plot/thinning/deferred-runs.ts): a big file-order curve's first thinning at a new
// level is listed for the worker with a stand-in drawn meanwhile; once the worker's answer is installed the frame
// is exactly the synchronous one, and a build without deferral (exports) never draws a stand-in.
import { describe, expect, test } from "vitest";
import { curvePixels, prepareCurve, type PixelParams } from "../../../src/plot/index";
import { DEFER_MIN_POINTS, installRunChunks, type RunDeferral } from "../../../src/plot/thinning/deferred-runs";
import { viewArrays } from "../../../src/plot/thinning/prepared";
import { thinRunChunks } from "../../../src/worker/run-jobs";
import { rng } from "../fixture";

/** An invented wobbly, noisy closed outline in log space (like the shared benchmark's regions). */
function noisyRegion(n: number, seed: number) {
  const r = rng(seed);
  const massEv = new Float64Array(n);
  const gInvGeV = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = (2 * Math.PI * i) / (n - 1);
    const w = 1 + 0.05 * Math.sin(17 * t) + 0.01 * (r() - 0.5);
    massEv[i] = 10 ** (-5 + 0.75 * w * Math.cos(t));
    gInvGeV[i] = 10 ** (-12 + w * Math.sin(t));
  }
  return { massEv, gInvGeV };
}

const plot = { x: 80, y: 20, w: 700, h: 460 };
/** 700 px over `decades` of mass from 10^-6 eV, 460 px over 1.2 × that of g from 10^-13.25. */
function params(decades: number, extra: Partial<PixelParams> = {}): PixelParams {
  const bx = plot.w / decades;
  const by = -plot.h / (1.2 * decades);
  return { ax: plot.x - bx * -6, bx, ay: plot.y + plot.h - by * -13.25, by, slope: 0, yOffset: 0, plot, ...extra };
}

const pointsOf = (pl: { xs: Float64Array; ys: Float64Array; n: number }) => [
  Array.from(pl.xs.subarray(0, pl.n)),
  Array.from(pl.ys.subarray(0, pl.n)),
];

/** What the worker does for each job: the run-jobs code on copies of the arrays, then installed. */
function answer(defer: RunDeferral): void {
  for (const job of defer.jobs.splice(0)) {
    const r = thinRunChunks(job.prep.lm.slice(), job.va.v.slice(), job.level.tx, job.level.ty, job.chunks);
    installRunChunks(job.level, job.chunks, r.offsets, r.indices);
  }
}

describe("deferred run thinning", () => {
  test("a big curve's new level is deferred with a stand-in; after the answer the frame equals the synchronous one", () => {
    const { massEv, gInvGeV } = noisyRegion(150_000, 7);
    const prep = prepareCurve(massEv, gInvGeV, false);
    const defer: RunDeferral = { jobs: [] };
    const standIn = curvePixels(prep, true, params(2, { deferRuns: defer }));
    expect(defer.jobs).toHaveLength(1);
    const job = defer.jobs[0];
    expect(job.chunks.length * 1024).toBeGreaterThanOrEqual(DEFER_MIN_POINTS);
    // Nothing was thinned here: the level is still empty, the stand-in is drawn (and closed).
    expect(job.level.perChunk.filter(Boolean)).toHaveLength(0);
    expect(standIn.n).toBeGreaterThan(100);
    expect(standIn.closed).toBe(true);
    // Drawn again before the answer: listed again (the client leaves out what is already asked for).
    const again: RunDeferral = { jobs: [] };
    curvePixels(prep, true, params(2, { deferRuns: again }));
    expect(again.jobs.map((j) => j.chunks)).toEqual([job.chunks]);
    answer(defer);
    const after: RunDeferral = { jobs: [] };
    const [xs, ys] = pointsOf(curvePixels(prep, true, params(2, { deferRuns: after })));
    expect(after.jobs).toEqual([]);
    const fresh = curvePixels(prepareCurve(massEv.slice(), gInvGeV.slice(), false), true, params(2));
    expect(xs).toEqual(pointsOf(fresh)[0]);
    expect(ys).toEqual(pointsOf(fresh)[1]);
  });

  test("a build without deferral thins at once, whatever was deferred before", () => {
    const { massEv, gInvGeV } = noisyRegion(150_000, 8);
    const prep = prepareCurve(massEv, gInvGeV, false);
    const defer: RunDeferral = { jobs: [] };
    curvePixels(prep, true, params(2, { deferRuns: defer }));
    expect(defer.jobs.length).toBe(1);
    const exported = curvePixels(prep, true, params(2));
    const fresh = curvePixels(prepareCurve(massEv.slice(), gInvGeV.slice(), false), true, params(2));
    expect(pointsOf(exported)).toEqual(pointsOf(fresh));
  });

  test("a level next to one already thinned draws that level's chunks meanwhile", () => {
    const { massEv, gInvGeV } = noisyRegion(150_000, 9);
    const prep = prepareCurve(massEv, gInvGeV, false);
    const first: RunDeferral = { jobs: [] };
    curvePixels(prep, true, params(2, { deferRuns: first }));
    answer(first);
    const va = viewArrays(prep, 0);
    const coarse = [...va.levels.values()][0];
    // Zoomed in by 2 on both axes: two √2 steps finer, a new level (the whole curve was visible before).
    const next: RunDeferral = { jobs: [] };
    const standIn = curvePixels(prep, true, params(1, { deferRuns: next }));
    expect(next.jobs).toHaveLength(1);
    const level = next.jobs[0].level;
    expect(level.tx).toBeCloseTo(coarse.tx / 2, 12);
    // The stand-in's points are the coarser level's kept points of the visible chunks, mapped by this frame.
    const p = params(1);
    const kept = new Set<string>();
    for (const c of next.jobs[0].chunks)
      for (const i of coarse.perChunk[c] ?? [])
        kept.add(`${(p.ax + p.bx * prep.lm[i]).toFixed(6)},${(p.ay + p.by * va.v[i]).toFixed(6)}`);
    const [xs, ys] = pointsOf(standIn);
    const inside = xs.filter((x, k) => x > plot.x && x < plot.x + plot.w && ys[k] > plot.y && ys[k] < plot.y + plot.h);
    expect(inside.length).toBeGreaterThan(100);
    let fromCoarse = 0;
    xs.forEach((x, k) => {
      if (kept.has(`${x.toFixed(6)},${ys[k].toFixed(6)}`)) fromCoarse++;
    });
    // Every visible chunk came from the coarser level (the rest of the points are the ends of far chunks).
    expect(fromCoarse).toBeGreaterThan(0.9 * standIn.n);
  });

  test("a curve whose missing chunks are few is thinned at once, not deferred", () => {
    const { massEv, gInvGeV } = noisyRegion(DEFER_MIN_POINTS - 1, 10);
    const prep = prepareCurve(massEv, gInvGeV, false);
    const defer: RunDeferral = { jobs: [] };
    const pl = curvePixels(prep, true, params(2, { deferRuns: defer, resolution: 4 }));
    expect(defer.jobs).toEqual([]);
    const fresh = curvePixels(prepareCurve(massEv.slice(), gInvGeV.slice(), false), true, params(2, { resolution: 4 }));
    expect(pointsOf(pl)).toEqual(pointsOf(fresh));
  });
});
