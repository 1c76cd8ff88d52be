// The figure on screen draws dense columns as a min–max envelope (buildScene's `envelope`); it must look as the
// plain thinned zig-zag does. Each figure of the golden set, and an invented benchmark-like figure of dense
// noisy scans at 1 and 2 device px per scene px, is rendered both ways by resvg (the renderer of the PNG
// export) at its device size and compared on greyscale (ITU-R BT.601 luma weights 0.299/0.587/0.114): the
// mean absolute difference per pixel and the share of pixels differing by more than 64/255, unaveraged.
// Measured when written (resvg 2.6): golden figures 0 to 0.04/255 and ≤ 0.001 %; the dense figure 0.24/255
// and 0.016 % at resolution 1, 0.11/255 and 0.003 % at 2. Thresholds: mean ≤ 1/255 and share ≤ 0.2 %.
// Against the unthinned drawing of the dense figure, the zig-zag is off by 0.38/255 (0.077 %), the envelope
// by 0.48/255 (0.068 %). A control (the envelope left out, the thin line alone: 12/255, 9.3 %) must fail
// both thresholds, so the measure sees a missing envelope.
import { describe, expect, test } from "vitest";
import { buildScene, writeSvg, type Scene } from "../../src/plot/index";
import type { Curve, Project } from "../../src/project/types";
import { rasterise } from "../../src/cli/png";
import { curve, fixtureProject, goldenVariants, rng } from "./fixture";

const MEAN_MAX = 1;
const SHARE_MAX = 0.002;

function grey(scene: Scene, resolution: number): { w: number; h: number; px: Float64Array } {
  const img = rasterise(writeSvg(scene), Math.round(scene.widthPx * resolution));
  const px = new Float64Array(img.width * img.height);
  const rgba = img.pixels;
  for (let i = 0; i < px.length; i++) px[i] = 0.299 * rgba[4 * i] + 0.587 * rgba[4 * i + 1] + 0.114 * rgba[4 * i + 2];
  return { w: img.width, h: img.height, px };
}

function compare(a: ReturnType<typeof grey>, b: ReturnType<typeof grey>): { mean: number; share: number } {
  expect([a.w, a.h]).toEqual([b.w, b.h]);
  let sum = 0;
  let big = 0;
  for (let i = 0; i < a.px.length; i++) {
    const d = Math.abs(a.px[i] - b.px[i]);
    sum += d;
    if (d > 64) big++;
  }
  return { mean: sum / a.px.length, share: big / a.px.length };
}

/** Invented noisy scans (±0.2 decades of noise, 1 % spikes of 1.5 decades): exclusions and a solid projection. */
function denseProject(): Project {
  const r = rng(11);
  const scan = (id: string, lo: number, level: number, role: Curve["role"], colour: string): Curve => {
    const n = 40000;
    const m = new Float64Array(n);
    const g = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const x = lo + (1.5 * i) / (n - 1);
      m[i] = 10 ** x;
      g[i] = 10 ** (level + 0.15 * Math.sin(40 * x) + 0.4 * (r() - 0.5) + (r() < 0.01 ? 1.5 : 0));
    }
    return curve({ id, role, massEv: m, gInvGeV: g, colour });
  };
  const p = fixtureProject();
  p.curves = [
    scan("scan-a", -6.8, -12, "exclusion", "#D55E00"),
    scan("scan-b", -5.6, -13, "exclusion", "#0072B2"),
    scan("reach", -4.5, -14.5, "projection", "#000000"),
  ];
  return p;
}

function pair(p: Project, resolution: number) {
  const plain = buildScene(p, { resolution });
  const enveloped = buildScene(p, { resolution, envelope: true });
  return { plain, enveloped };
}

/** The dense figure at resolution 1, both ways, with its greyscale renderings: built once, read by three tests. */
let denseAt1: (ReturnType<typeof pair> & { p: Project; greyPlain: ReturnType<typeof grey> }) | undefined;
let denseAt1Enveloped: ReturnType<typeof grey> | undefined;
function dense1() {
  if (!denseAt1) {
    const p = denseProject();
    const scenes = pair(p, 1);
    denseAt1 = { p, ...scenes, greyPlain: grey(scenes.plain, 1) };
  }
  return denseAt1;
}
function dense1Enveloped(): ReturnType<typeof grey> {
  denseAt1Enveloped ??= grey(dense1().enveloped, 1);
  return denseAt1Enveloped;
}

describe("min–max envelope: no visible change against the zig-zag (resvg, greyscale)", () => {
  for (const [name, p] of goldenVariants())
    test(`golden figure ${name}: mean ≤ 1/255, ≤ 0.2 % of pixels off by > 64/255`, () => {
      const { plain, enveloped } = pair(p, 1);
      const d = compare(grey(plain, 1), grey(enveloped, 1));
      expect(d.mean).toBeLessThanOrEqual(MEAN_MAX);
      expect(d.share).toBeLessThanOrEqual(SHARE_MAX);
    });

  for (const resolution of [1, 2])
    test(`dense noisy scans at resolution ${resolution}: the envelope is drawn, mean ≤ 1/255, ≤ 0.2 % off`, () => {
      const { plain, enveloped } = resolution === 1 ? dense1() : pair(denseProject(), resolution);
      const bands = enveloped.layers.flatMap((l) => l.nodes).filter((n) => n.id?.endsWith("-envelope"));
      expect(bands.map((n) => n.id)).toEqual(["curve-1-envelope", "curve-2-envelope", "curve-3-envelope"]);
      const d =
        resolution === 1
          ? compare(dense1().greyPlain, dense1Enveloped())
          : compare(grey(plain, resolution), grey(enveloped, resolution));
      expect(d.mean).toBeLessThanOrEqual(MEAN_MAX);
      expect(d.share).toBeLessThanOrEqual(SHARE_MAX);
    });

  test("dense noisy scans: against the unthinned drawing, the envelope is off by ≤ 1/255 more than the zig-zag", () => {
    const { p, greyPlain } = dense1();
    const full = grey(buildScene(p, { resolution: 1, thin: false }), 1);
    const zigzag = compare(full, greyPlain);
    const envelope = compare(full, dense1Enveloped());
    expect(envelope.mean).toBeLessThanOrEqual(zigzag.mean + MEAN_MAX);
    expect(envelope.share).toBeLessThanOrEqual(zigzag.share + SHARE_MAX);
  });

  test("exports (no envelope option) and dashed curves keep the zig-zag; an exclusion's envelope follows its fill", () => {
    const p = denseProject();
    const ids = (scene: Scene) => scene.layers.flatMap((l) => l.nodes).map((n) => n.id ?? "");
    expect(ids(buildScene(p)).filter((id) => id.endsWith("-envelope"))).toEqual([]);
    p.curves[2].lineStyle = "dashed";
    const drawn = ids(buildScene(p, { envelope: true })).filter((id) => id.startsWith("curve-"));
    expect(drawn).toEqual([
      "curve-1-exclusion",
      "curve-1-envelope",
      "curve-2-exclusion",
      "curve-2-envelope",
      "curve-1-hatch",
      "curve-2-hatch",
      "curve-3-line",
    ]);
  });

  test("the measure sees a missing envelope: the thin line alone fails both thresholds", () => {
    // A scene of its own (its layers are edited), against the shared rendering of the zig-zag.
    const enveloped = buildScene(dense1().p, { resolution: 1, envelope: true });
    for (const l of enveloped.layers) l.nodes = l.nodes.filter((n) => !n.id?.endsWith("-envelope"));
    const d = compare(dense1().greyPlain, grey(enveloped, 1));
    expect(d.mean).toBeGreaterThan(MEAN_MAX);
    expect(d.share).toBeGreaterThan(SHARE_MAX);
  });
});
