// The runs client (src/worker/runs-client.ts) with a stand-in Worker that runs the real job handler: a figure
// built with deferral, then again once the answers are in, is the figure an export builds (same SVG), and
// chunks already asked for are not asked for twice. A failing worker makes the figure thin at once.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { buildScene } from "../../src/plot/scene";
import { writeSvg } from "../../src/plot/svg";
import type { RunDeferral } from "../../src/plot/thinning/deferred-runs";
import { emptyProject, newCurve } from "../../src/project/defaults";
import type { Project } from "../../src/project/types";
import { createRunsHandler, type RunsRequest } from "../../src/worker/run-jobs";
import { requestRuns, runsWorkerAvailable } from "../../src/worker/runs-client";
import { rng } from "../plot/fixture";

/** Messages the fake worker was sent, and whether it should fail on the next job. */
const sent: RunsRequest[] = [];
let failNext = false;

/** A Worker stand-in that runs the worker's handler on this thread, answering asynchronously like a worker. */
class FakeWorker {
  onmessage: ((ev: { data: unknown }) => void) | null = null;
  onerror: ((ev: { preventDefault(): void }) => void) | null = null;
  private handle = createRunsHandler((msg) => setTimeout(() => this.onmessage?.({ data: msg }), 1));
  postMessage(msg: RunsRequest) {
    sent.push(msg);
    if (failNext && msg.type === "runs") setTimeout(() => this.onerror?.({ preventDefault() {} }), 1);
    else setTimeout(() => this.handle(msg), 1);
  }
  terminate() {}
}

const g = globalThis as unknown as { Worker?: unknown };
const original = g.Worker;
beforeAll(() => {
  g.Worker = FakeWorker;
});
afterAll(() => {
  g.Worker = original;
});

/** An invented wobbly, noisy closed region of 150,000 points drawn in file order, zoomed so it is run-thinned. */
function regionProject(seed: number): Project {
  const r = rng(seed);
  const n = 150_000;
  const massEv = new Float64Array(n);
  const gInvGeV = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = (2 * Math.PI * i) / (n - 1);
    const w = 1 + 0.05 * Math.sin(17 * t) + 0.01 * (r() - 0.5);
    massEv[i] = 10 ** (-5 + 0.75 * w * Math.cos(t));
    gInvGeV[i] = 10 ** (-12 + w * Math.sin(t));
  }
  const p = emptyProject("deferred runs (invented)");
  p.curves = [newCurve({ id: "region", label: "Invented region", role: "region", massEv, gInvGeV })];
  p.figure.massRangeEv = [10 ** -6, 10 ** -4];
  p.figure.yRange = [10 ** -13.4, 10 ** -10.6];
  p.figure.legend = "top-right";
  return p;
}

const copyOf = (p: Project): Project => ({
  ...p,
  curves: p.curves.map((c) => ({ ...c, massEv: c.massEv.slice(), gInvGeV: c.gInvGeV.slice() })),
});

describe("runs client", () => {
  test("after the worker's answers the figure equals the synchronous one; nothing is asked twice", async () => {
    expect(runsWorkerAvailable()).toBe(true);
    const project = regionProject(11);
    const opts = { resolution: 2, envelope: true, physical: false };
    const defer: RunDeferral = { jobs: [] };
    const standIn = buildScene(project, { ...opts, deferRuns: defer });
    expect(defer.jobs.length).toBe(1);
    const installed = new Promise<void>((resolve) => requestRuns(defer.jobs, resolve));
    // A second frame before the answer lists the same chunks; the client does not send them again.
    const again: RunDeferral = { jobs: [] };
    buildScene(project, { ...opts, deferRuns: again });
    requestRuns(again.jobs, () => {});
    await installed;
    expect(sent.filter((m) => m.type === "data")).toHaveLength(1);
    expect(sent.filter((m) => m.type === "runs")).toHaveLength(1);
    const after: RunDeferral = { jobs: [] };
    const final = buildScene(project, { ...opts, deferRuns: after });
    expect(after.jobs).toEqual([]);
    const synchronous = buildScene(copyOf(project), opts);
    expect(writeSvg(final)).toBe(writeSvg(synchronous));
    expect(writeSvg(standIn)).not.toBe(writeSvg(synchronous));
  });

  test("a worker that fails gives the figure a redraw, and later figures thin at once", async () => {
    failNext = true;
    const project = regionProject(12);
    const defer: RunDeferral = { jobs: [] };
    buildScene(project, { resolution: 2, deferRuns: defer });
    expect(defer.jobs.length).toBe(1);
    await new Promise<void>((resolve) => requestRuns(defer.jobs, resolve));
    expect(runsWorkerAvailable()).toBe(false);
    expect(writeSvg(buildScene(project, { resolution: 2 }))).toBe(
      writeSvg(buildScene(copyOf(project), { resolution: 2 })),
    );
  });
});
