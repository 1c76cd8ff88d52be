// The store: undo/redo over every project change, coalescing of rapid steps, bounded history, messages.
// Expected behaviour is the usual editor undo model (common practice): a new change after an undo drops
// the redo stack; one undo reverts one user step; a burst of zoom steps is one step.
import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import { createAxbandStore, HISTORY_LIMIT, COALESCE_MS, type AxbandStore } from "../../src/ui/store";
import { DEFAULT_MASS_RANGE_EV, defaultYRange, emptyProject } from "../../src/project/defaults";
import type { Curve } from "../../src/project/types";

let store: AxbandStore;
beforeEach(() => {
  store = createAxbandStore(emptyProject());
  store.getState().addModel({ eOverNMin: "0", label: "KSVZ-type" });
  store.getState().resetProject(store.getState().project);
});
afterEach(() => {
  vi.useRealTimers();
});

function curve(id: string): Curve {
  return {
    id,
    label: `Demo curve ${id} (invented)`,
    role: "exclusion",
    massEv: new Float64Array([1e-6, 1e-5]),
    gInvGeV: new Float64Array([1e-13, 1e-12]),
    keepOrder: false,
    colour: "#0072B2",
    lineStyle: "solid",
    fillOpacity: 0.3,
    exclusionMark: "hatch",
    visible: true,
    rescale: { rhoAssumed: 0.45, rhoShown: 0.45, fraction: 1 },
    citation: "",
    fileName: `${id}.csv`,
  };
}

describe("undo and redo", () => {
  test("adding a model is undone and redone", () => {
    const before = store.getState().project;
    const id = store.getState().addModel({ eOverNMin: "8/3" });
    const after = store.getState().project;
    expect(after.models.map((m) => m.id)).toContain(id);
    expect(store.getState().canUndo()).toBe(true);
    store.getState().undo();
    expect(store.getState().project).toBe(before);
    expect(store.getState().canRedo()).toBe(true);
    store.getState().redo();
    expect(store.getState().project).toBe(after);
    expect(store.getState().canRedo()).toBe(false);
  });

  test("a new change after an undo drops the redo stack", () => {
    store.getState().addModel({ eOverNMin: "1" });
    store.getState().undo();
    store.getState().addModel({ eOverNMin: "2" });
    expect(store.getState().canRedo()).toBe(false);
    expect(store.getState().project.models.map((m) => m.eOverNMin)).not.toContain("1");
  });

  test("an updater that changes nothing records no step", () => {
    const pastBefore = store.getState().history.past.length;
    store.getState().commit((p) => p);
    store.getState().updateModel("no-such-id", { label: "x" });
    store.getState().moveModel(store.getState().project.models[0].id, -5);
    expect(store.getState().history.past.length).toBe(pastBefore);
  });

  test("undo with an empty history does nothing", () => {
    const p = store.getState().project;
    store.getState().undo();
    store.getState().redo();
    expect(store.getState().project).toBe(p);
  });

  test("replaceProject is undoable and says so in a status message", () => {
    const original = store.getState().project;
    const other = { ...original, name: "Opened from a link", models: [] };
    store.getState().replaceProject(other, "Project opened from the link.");
    expect(store.getState().project).toBe(other);
    expect(store.getState().ui.messages).toEqual([
      expect.objectContaining({ kind: "status", text: "Project opened from the link." }),
    ]);
    store.getState().undo();
    expect(store.getState().project).toBe(original);
  });

  test("resetProject starts over with an empty history", () => {
    store.getState().addModel({ eOverNMin: "3" });
    const fresh = { ...store.getState().project, name: "Fresh" };
    store.getState().resetProject(fresh);
    expect(store.getState().canUndo()).toBe(false);
    expect(store.getState().canRedo()).toBe(false);
    expect(store.getState().project.name).toBe("Fresh");
  });
});

describe("coalescing", () => {
  test("zoom steps within the window form one undo step", () => {
    vi.useFakeTimers();
    const start = store.getState().project.figure;
    const s = store.getState();
    s.setView([1e-6, 1e-2], [1e-16, 1e-10]);
    vi.advanceTimersByTime(COALESCE_MS / 2);
    s.setView([1e-6, 1e-3], [1e-15, 1e-10]);
    vi.advanceTimersByTime(COALESCE_MS / 2);
    s.setView([1e-5, 1e-3], [1e-15, 1e-11]);
    expect(store.getState().project.figure.massRangeEv).toEqual([1e-5, 1e-3]);
    store.getState().undo();
    expect(store.getState().project.figure.massRangeEv).toEqual(start.massRangeEv);
    expect(store.getState().project.figure.yRange).toEqual(start.yRange);
    expect(store.getState().canUndo()).toBe(false);
  });

  test("a pause longer than the window starts a new step", () => {
    vi.useFakeTimers();
    const s = store.getState();
    s.setView([1e-6, 1e-2], [1e-16, 1e-10]);
    vi.advanceTimersByTime(COALESCE_MS + 100);
    s.setView([1e-6, 1e-3], [1e-15, 1e-10]);
    store.getState().undo();
    expect(store.getState().project.figure.massRangeEv).toEqual([1e-6, 1e-2]);
  });

  test("different keys do not merge; typing in one field does", () => {
    vi.useFakeTimers();
    const id = store.getState().project.models[0].id;
    const label0 = store.getState().project.models[0].label;
    const s = store.getState();
    s.updateModel(id, { label: "K" }, { coalesceKey: `model:${id}:label` });
    s.updateModel(id, { label: "KS" }, { coalesceKey: `model:${id}:label` });
    s.updateModel(id, { label: "KSVZ" }, { coalesceKey: `model:${id}:label` });
    s.setView([1e-6, 1e-2], [1e-16, 1e-10]);
    store.getState().undo(); // the view step
    expect(store.getState().project.models[0].label).toBe("KSVZ");
    store.getState().undo(); // the whole typing burst
    expect(store.getState().project.models[0].label).toBe(label0);
  });

  test("a step without a key ends a burst", () => {
    vi.useFakeTimers();
    const s = store.getState();
    s.setView([1e-6, 1e-2], [1e-16, 1e-10]);
    s.addModel({ eOverNMin: "5/3" });
    s.setView([1e-6, 1e-3], [1e-15, 1e-10]);
    store.getState().undo();
    expect(store.getState().project.figure.massRangeEv).toEqual([1e-6, 1e-2]);
    expect(store.getState().project.models.some((m) => m.eOverNMin === "5/3")).toBe(true);
  });
});

describe("bounded history", () => {
  test(`keeps at most ${HISTORY_LIMIT} steps and undoes the newest ones`, () => {
    const total = HISTORY_LIMIT + 50;
    for (let i = 0; i < total; i++) store.getState().setFigure({ title: `t${i}` });
    expect(store.getState().history.past.length).toBe(HISTORY_LIMIT);
    for (let i = 0; i < HISTORY_LIMIT; i++) store.getState().undo();
    expect(store.getState().canUndo()).toBe(false);
    // HISTORY_LIMIT undos from title t(total−1) reach t(total−1−HISTORY_LIMIT).
    expect(store.getState().project.figure.title).toBe(`t${total - 1 - HISTORY_LIMIT}`);
    for (let i = 0; i < HISTORY_LIMIT; i++) store.getState().redo();
    expect(store.getState().project.figure.title).toBe(`t${total - 1}`);
  });
});

describe("actions", () => {
  test("models: update, move, remove", () => {
    const s = store.getState();
    const a = s.addModel({ eOverNMin: "2/3", label: "A" });
    const b = s.addModel({ eOverNMin: "5/3", eOverNMax: "44/3", label: "B" });
    store.getState().moveModel(b, -1);
    const ids = store.getState().project.models.map((m) => m.id);
    expect(ids.indexOf(b)).toBe(ids.indexOf(a) - 1);
    store.getState().updateModel(a, { visible: false, sigmas: 2 });
    const ma = store.getState().project.models.find((m) => m.id === a)!;
    expect(ma).toMatchObject({ visible: false, sigmas: 2, label: "A", eOverNMin: "2/3" });
    store.getState().removeModel(a);
    expect(store.getState().project.models.some((m) => m.id === a)).toBe(false);
  });

  test("curves: editing a label keeps the very same data arrays", () => {
    store.getState().addCurves([curve("c1"), curve("c2")]);
    const before = store.getState().project.curves[0];
    store.getState().updateCurve("c1", { label: "Renamed" });
    const after = store.getState().project.curves.find((c) => c.id === "c1")!;
    expect(after.label).toBe("Renamed");
    expect(after.massEv).toBe(before.massEv);
    expect(after.gInvGeV).toBe(before.gInvGeV);
    store.getState().moveCurve("c2", -1);
    expect(store.getState().project.curves.map((c) => c.id)).toEqual(["c2", "c1"]);
    store.getState().removeCurve("c2");
    expect(store.getState().project.curves.map((c) => c.id)).toEqual(["c1"]);
  });

  test("switching the y view takes that view's y range; resetView restores the defaults", () => {
    store.getState().setView([1e-3, 1e-2], [1e-12, 1e-11]);
    store.getState().setFigure({ yView: "normalized" });
    const f = store.getState().project.figure;
    expect(f.yView).toBe("normalized");
    expect(f.yRange[1]).toBeLessThan(1e4); // |E/N − c_γ| units, not GeV⁻¹
    expect(f.yRange[0]).toBeGreaterThan(1e-4);
    store.getState().setFigure({ yView: "coupling" });
    store.getState().resetView();
    const g = store.getState().project.figure;
    // The start view: 0.1 μeV – 10 meV and 10⁻¹⁷ – 10⁻⁹ GeV⁻¹ (src/project/defaults.ts).
    expect(g.massRangeEv).toEqual([...DEFAULT_MASS_RANGE_EV]);
    expect(g.massRangeEv).toEqual([1e-7, 1e-2]);
    expect(g.yRange).toEqual(defaultYRange("coupling"));
    expect(g.yRange).toEqual([1e-17, 1e-9]);
  });

  test("setPhysics merges a partial custom set", () => {
    store.getState().setPhysics({ ref: "custom", custom: { cGamma: 1.95 } });
    const ph = store.getState().project.physics;
    expect(ph.ref).toBe("custom");
    expect(ph.custom.cGamma).toBe(1.95);
    // The untouched fields keep the 2019 values: K = 5.691(51) (Gorghetto & Villadoro, JHEP 03 (2019) 033).
    expect(ph.custom.kMuEv).toBe(5.691);
    expect(ph.custom.kMuEvSigma).toBe(0.051);
  });

  test("messages are transient: not part of the project, not undone", () => {
    const s = store.getState();
    const id = s.pushMessage("alert", "Storage is full");
    s.pushMessage("status", "Saved");
    expect(store.getState().ui.messages.map((m) => m.kind)).toEqual(["alert", "status"]);
    expect(store.getState().canUndo()).toBe(false);
    store.getState().dismissMessage(id);
    expect(store.getState().ui.messages.map((m) => m.text)).toEqual(["Saved"]);
    store.getState().setHighlight({ massMinEv: 1e-6, massMaxEv: 1e-5, modelId: "m1" });
    expect(store.getState().ui.highlight).toEqual({ massMinEv: 1e-6, massMaxEv: 1e-5, modelId: "m1" });
    expect(store.getState().canUndo()).toBe(false);
  });
});
