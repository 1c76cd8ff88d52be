// Big curves that come back without the import worker (autosave restore, undo, a role change) are prepared
// for drawing in the worker, never on the main thread: the figure leaves them out with a note until the
// reply is seeded into the plot cache, then draws them exactly as a same-thread preparation would.
// The worker client is mocked (jsdom has no Worker); the mock does what the real client does with the
// worker's reply (seedPreparedCurve on a transfer computed from copies, as structured cloning gives the
// worker: HTML Standard, "Safe passing of structured data", §2.7).
import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import { act, render, screen } from "@testing-library/react";
import type { PrepareSpec, PreparedTransfer } from "../../src/plot/prepare-transfer";

type PrepareFn = (m: Float64Array, g: Float64Array, spec: PrepareSpec) => Promise<boolean>;
const worker = vi.hoisted(() => ({
  available: true,
  calls: [] as {
    massEv: Float64Array;
    gInvGeV: Float64Array;
    spec: PrepareSpec;
    reply: (t: PreparedTransfer | null) => void;
  }[],
  /** prepareCurve calls that computed (no cached entry) for arrays of at least 50,000 points. */
  computed: [] as { massEv: Float64Array; sorted: boolean }[],
}));

vi.mock("../../src/plot/thinning/index", async (importOriginal) => {
  const actual = await importOriginal<typeof import("../../src/plot/thinning/index")>();
  return {
    ...actual,
    prepareCurve: vi.fn((m: Float64Array, g: Float64Array, sorted: boolean) => {
      if (m.length >= 50_000 && !actual.cachedPrepared(m, g, sorted)) worker.computed.push({ massEv: m, sorted });
      return actual.prepareCurve(m, g, sorted);
    }),
  };
});

vi.mock("../../src/worker/import-client", async (importOriginal) => {
  const actual = await importOriginal<typeof import("../../src/worker/import-client")>();
  const { seedPreparedCurve } = await import("../../src/plot/prepare-transfer");
  const prepareInWorker: PrepareFn = (massEv, gInvGeV, spec) =>
    new Promise<boolean>((resolve) => {
      worker.calls.push({
        massEv,
        gInvGeV,
        spec,
        reply: (t) => resolve(!!t && seedPreparedCurve(massEv, gInvGeV, spec.sorted, t)),
      });
    });
  return { ...actual, importWorkerAvailable: () => worker.available, prepareInWorker };
});

// Imported after the mocks are declared (vi.mock is hoisted above these).
import { computePrepared } from "../../src/plot/prepare-transfer";
import { buildScene } from "../../src/plot/scene";
import { emptyProject, newCurve, serializeForStorage } from "../../src/data";
import type { Curve, Project } from "../../src/project/types";
import { FigureView } from "../../src/ui/figure/FigureView";
import { HoverReadout } from "../../src/ui/figure/HoverReadout";
import { useAxband } from "../../src/ui/store";
import { OFF_THREAD_PREPARE_POINTS } from "../../src/ui/store/preparation";
import { initProject, STORAGE_KEY, type CurveArrays, type CurveDataStore } from "../../src/ui/store/autosave";
import { resetStore } from "./helpers";

const N = 200_000;

/** Invented data: a wiggly limit over three decades of mass, in mass order. */
function bigCurve(id: string, role: Curve["role"] = "exclusion"): Curve {
  const massEv = new Float64Array(N);
  const gInvGeV = new Float64Array(N);
  for (let i = 0; i < N; i++) {
    massEv[i] = 1e-6 * 10 ** ((3 * i) / (N - 1));
    gInvGeV[i] = 1e-13 * (1.5 + Math.sin(i / 997));
  }
  return newCurve({ id, label: `Demo big ${id} (invented)`, role, massEv, gInvGeV });
}

/** The autosave of a project in memory (localStorage text and the curve arrays as IndexedDB would hold them). */
function savedProject(project: Project) {
  const { meta } = serializeForStorage(project);
  const items = new Map(project.curves.map((c) => [c.id, { massEv: c.massEv.slice(), gInvGeV: c.gInvGeV.slice() }]));
  const local = { getItem: (k: string) => (k === STORAGE_KEY ? meta : null), setItem: () => undefined };
  const curves: CurveDataStore = {
    put: async () => undefined,
    get: async (id: string): Promise<CurveArrays | undefined> => items.get(id),
    delete: async () => undefined,
  };
  return { local, curves };
}

/** What the worker sends back: the same preparation, built from copies of the arrays. */
function workerReply(c: Curve, spec: PrepareSpec): PreparedTransfer {
  return computePrepared(c.massEv.slice(), c.gInvGeV.slice(), spec.sorted, { slopes: spec.slopes });
}

const curvePaths = (id: string) => screen.getByTestId("plot").querySelectorAll(`path[data-curve-id="${id}"]`);

beforeEach(() => {
  worker.available = true;
  worker.calls.length = 0;
  resetStore(emptyProject("preparing test"));
  worker.computed.length = 0;
});
afterEach(() => {
  worker.available = true;
});

describe("a big curve restored from autosave", () => {
  test("is prepared in the worker, not on the main thread, and drawn once the reply is seeded", async () => {
    const project = emptyProject("restored");
    project.curves = [bigCurve("big")];
    await initProject(useAxband, { ...savedProject(project), fragment: "" });
    const restored = useAxband.getState().project.curves[0];
    expect(restored.massEv).toHaveLength(N);

    // Sent at once, with the arrays the page keeps (the client copies them) and the figure's y view.
    expect(worker.calls).toHaveLength(1);
    expect(worker.calls[0].massEv).toBe(restored.massEv);
    expect(worker.calls[0].gInvGeV).toBe(restored.gInvGeV);
    expect(worker.calls[0].spec).toEqual({ sorted: true, slopes: [0] });

    render(<FigureView />);
    // Not drawn yet, and the figure says why; the store keeps the whole curve for exports and the table.
    expect(curvePaths("big")).toHaveLength(0);
    expect(screen.getByTestId("figure-preparing")).toHaveTextContent(
      "Preparing curve “Demo big big (invented)” for drawing",
    );
    expect(useAxband.getState().project.curves[0].massEv).toBe(restored.massEv);
    expect(worker.computed.filter((c) => c.massEv === restored.massEv)).toEqual([]);

    const reply = workerReply(restored, worker.calls[0].spec);
    worker.computed.length = 0; // the copies above were prepared by the stand-in worker, not the page
    await act(async () => worker.calls[0].reply(reply));

    expect(screen.queryByTestId("figure-preparing")).toBeNull();
    const paths = curvePaths("big");
    expect(paths.length).toBeGreaterThan(0);
    // The page never computed a preparation of the big arrays; it drew from the seeded one.
    expect(worker.computed).toEqual([]);
    // Drawn exactly as a same-thread preparation of the same data would be (prepare-transfer.ts contract).
    const fresh = {
      ...useAxband.getState().project,
      curves: [{ ...restored, massEv: restored.massEv.slice(), gInvGeV: restored.gInvGeV.slice() }],
    };
    const svg = screen.getByTestId("plot").querySelector("svg")!;
    const size = svg.getAttribute("data-scene-size")!.split(",").map(Number);
    const expected = buildScene(fresh, {
      widthPx: size[0],
      heightPx: size[1],
      resolution: 1,
      physical: false,
      envelope: true,
    });
    const d = JSON.stringify(
      expected.layers
        .flatMap((l) => l.nodes)
        .filter((n) => n.kind === "path" && n.data?.["curve-id"] === "big")
        .map((n) => (n.kind === "path" ? n.d : "")),
    );
    expect(JSON.stringify(Array.from(paths).map((p) => p.getAttribute("d")))).toBe(d);
  });

  test("undo bringing back a removed, already prepared curve draws it at once; a role change waits for the worker", async () => {
    const project = emptyProject("restored");
    project.curves = [bigCurve("big")];
    await initProject(useAxband, { ...savedProject(project), fragment: "" });
    const restored = useAxband.getState().project.curves[0];
    render(<FigureView />);
    await act(async () => worker.calls[0].reply(workerReply(restored, worker.calls[0].spec)));
    worker.computed.length = 0;

    await act(async () => useAxband.getState().removeCurve("big"));
    expect(curvePaths("big")).toHaveLength(0);
    await act(async () => useAxband.getState().undo());
    expect(worker.calls).toHaveLength(1);
    expect(curvePaths("big").length).toBeGreaterThan(0);
    expect(screen.queryByTestId("figure-preparing")).toBeNull();

    // A region is drawn in file order: another preparation, again built in the worker.
    await act(async () => useAxband.getState().updateCurve("big", { role: "region" }));
    expect(worker.calls).toHaveLength(2);
    expect(worker.calls[1].spec).toEqual({ sorted: false, slopes: [0] });
    expect(curvePaths("big")).toHaveLength(0);
    expect(screen.getByTestId("figure-preparing")).toBeInTheDocument();
    const reply = workerReply(restored, worker.calls[1].spec);
    worker.computed.length = 0;
    await act(async () => worker.calls[1].reply(reply));
    expect(curvePaths("big").length).toBeGreaterThan(0);
    expect(worker.computed).toEqual([]);
  });

  test("a failed worker job, or no worker at all, still draws the curve (prepared on the page)", async () => {
    const project = emptyProject("restored");
    project.curves = [bigCurve("big")];
    await initProject(useAxband, { ...savedProject(project), fragment: "" });
    render(<FigureView />);
    expect(curvePaths("big")).toHaveLength(0);
    await act(async () => worker.calls[0].reply(null));
    expect(curvePaths("big").length).toBeGreaterThan(0);
    expect(screen.queryByTestId("figure-preparing")).toBeNull();
    // Sent once per arrays and order: later changes (a zoom) do not hide it again.
    await act(async () => useAxband.getState().setView([1e-6, 1e-3], [1e-15, 1e-10]));
    expect(worker.calls).toHaveLength(1);
    expect(curvePaths("big").length).toBeGreaterThan(0);

    // Below the threshold a curve is prepared on the page (≤ ~35 ms, under the 50 ms of a long task: W3C
    // Long Tasks API, https://w3c.github.io/longtasks/; the per-point cost is measured, see preparation.ts).
    const small = bigCurve("small");
    const cut = {
      ...small,
      massEv: small.massEv.slice(0, OFF_THREAD_PREPARE_POINTS - 1),
      gInvGeV: small.gInvGeV.slice(0, OFF_THREAD_PREPARE_POINTS - 1),
    };
    await act(async () => useAxband.getState().addCurves([cut]));
    expect(worker.calls).toHaveLength(1);
    expect(curvePaths("small").length).toBeGreaterThan(0);

    worker.available = false;
    worker.calls.length = 0;
    await act(async () => useAxband.getState().addCurves([bigCurve("other")]));
    expect(worker.calls).toHaveLength(0);
    expect(curvePaths("other").length).toBeGreaterThan(0);
  });

  test("the hover readout leaves a curve being prepared out (testing it would prepare it on the page), then names it", async () => {
    const project = emptyProject("restored");
    project.curves = [bigCurve("big")];
    await initProject(useAxband, { ...savedProject(project), fragment: "" });
    const restored = useAxband.getState().project.curves[0];
    render(<HoverReadout />);
    // A point well below the invented limit (~1e-13 GeV⁻¹ at 1e-5 eV): excluded once the curve counts.
    await act(async () => useAxband.getState().setHover({ massEv: 1e-5, y: 1e-12 }));
    expect(screen.getByTestId("hover-readout")).not.toHaveTextContent("Demo big big (invented)");
    expect(worker.computed.filter((c) => c.massEv === restored.massEv)).toEqual([]);
    const reply = workerReply(restored, worker.calls[0].spec);
    worker.computed.length = 0;
    await act(async () => worker.calls[0].reply(reply));
    expect(screen.getByTestId("hover-readout")).toHaveTextContent("excluded by");
    expect(screen.getByTestId("hover-readout")).toHaveTextContent("Demo big big (invented)");
  });
});
