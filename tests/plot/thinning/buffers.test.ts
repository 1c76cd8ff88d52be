// The thinning's reused working buffers (src/plot/thinning/): a frame that needs more room than they have
// grows them without losing the points already written, so the first frame of a big curve is the same as
// every later one. In a file of its own, so that the buffers start at their initial size.
import { describe, expect, test } from "vitest";
import { curvePixels, prepareCurve, type PixelParams } from "../../../src/plot/index";
import { rng } from "../fixture";

/**
 * A closed outline in log space like the shared benchmark's regions (an ellipse with a slow wobble and a
 * little noise on the radius), 150,000 points: zoomed in as below its noise is several px wide, so the
 * frame keeps more run-thinned points than the initial buffers hold (and run thinning beats
 * Douglas–Peucker there).
 */
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
// 700 px over half a decade of mass (10^-6 … 10^-5.5 eV), 460 px over 0.6 decades of g (10^-13.25 … 10^-12.65).
const bx = plot.w / 0.5;
const by = -plot.h / 0.6;
const params = (reuse: boolean): PixelParams => ({
  ax: plot.x - bx * -6,
  bx,
  ay: plot.y + plot.h - by * -13.25,
  by,
  slope: 0,
  yOffset: 0,
  plot,
  resolution: 1,
  reuse,
});

describe("working buffers", () => {
  test("the first frame of a curve that outgrows the buffers equals the later frames and a fresh copy's", () => {
    const { massEv, gInvGeV } = noisyRegion(150_000, 5);
    const first = curvePixels(prepareCurve(massEv, gInvGeV, false), true, params(true));
    // A polyline's arrays may be longer than its n points (clipping sizes them for the worst case).
    const points = (pl: { xs: Float64Array; ys: Float64Array; n: number }) => [
      Array.from(pl.xs.subarray(0, pl.n)),
      Array.from(pl.ys.subarray(0, pl.n)),
    ];
    const [firstXs, firstYs] = points(first);
    // More points than the initial 4,096-point buffers hold, so this frame grew them while writing.
    expect(first.n).toBeGreaterThan(4096);
    const again = curvePixels(prepareCurve(massEv, gInvGeV, false), true, params(false));
    const copy = curvePixels(prepareCurve(massEv.slice(), gInvGeV.slice(), false), true, params(false));
    for (const other of [again, copy]) {
      expect(other.n).toBe(first.n);
      const [xs, ys] = points(other);
      expect(xs).toEqual(firstXs);
      expect(ys).toEqual(firstYs);
    }
    // And the outline is closed and on the plot's scale (nothing left at 0 from a lost write).
    expect(first.closed).toBe(true);
    expect(firstXs.reduce((a, b) => Math.min(a, b), Infinity)).toBeGreaterThan(plot.x - 3 * plot.w);
  });
});
