// Autosave: the project goes to (fake) localStorage without curve data, curve arrays to a (fake) IndexedDB
// only when their arrays change, a reload restores it, and a full storage gives one alert and nothing else.
// Storage behaviour follows the WHATWG HTML standard, §12 Web storage: setItem throws a "QuotaExceededError"
// DOMException when the new value does not fit.
import { afterEach, beforeEach, describe, expect, test, vi } from "vitest";
import { createAxbandStore, type AxbandStore } from "../../src/ui/store";
import { emptyProject } from "../../src/project/defaults";
import {
  STORAGE_KEY,
  STORAGE_PROBLEM,
  initProject,
  restoreAutosave,
  startAutosave,
  type CurveArrays,
  type CurveDataStore,
  type KeyValueStorage,
  splitChunks,
  joinChunks,
  chunkKey,
} from "../../src/ui/store/autosave";
import type { Curve } from "../../src/project/types";

class MemoryStorage implements KeyValueStorage {
  items = new Map<string, string>();
  writes = 0;
  full = false;
  getItem(k: string) {
    return this.items.get(k) ?? null;
  }
  setItem(k: string, v: string) {
    this.writes += 1;
    if (this.full) throw new DOMException("The quota has been exceeded.", "QuotaExceededError");
    this.items.set(k, v);
  }
}

class MemoryCurves implements CurveDataStore {
  items = new Map<string, CurveArrays>();
  puts: string[] = [];
  deletes: string[] = [];
  full = false;
  async put(id: string, d: CurveArrays) {
    this.puts.push(id);
    if (this.full) throw new DOMException("The quota has been exceeded.", "QuotaExceededError");
    this.items.set(id, d);
  }
  async get(id: string) {
    return this.items.get(id);
  }
  async delete(id: string) {
    this.deletes.push(id);
    this.items.delete(id);
  }
}

function curve(id: string, n = 5): Curve {
  const massEv = new Float64Array(n).map((_, i) => 1e-6 * 10 ** (i / 2));
  const gInvGeV = new Float64Array(n).map((_, i) => 1e-13 * (1 + i));
  return {
    id,
    label: `Demo ${id} (invented)`,
    role: "exclusion",
    massEv,
    gInvGeV,
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

let store: AxbandStore;
let local: MemoryStorage;
let curves: MemoryCurves;
beforeEach(() => {
  vi.useFakeTimers();
  store = createAxbandStore(emptyProject());
  local = new MemoryStorage();
  curves = new MemoryCurves();
});
afterEach(() => {
  vi.useRealTimers();
});

describe("saving", () => {
  test("a change is saved after the debounce, without curve data in localStorage", async () => {
    const auto = startAutosave(store, { local, curves, debounceMs: 300 });
    store.getState().addModel({ eOverNMin: "8/3", label: "E/N = 8/3" });
    store.getState().addCurves([curve("c1", 1000)]);
    expect(local.writes).toBe(0);
    await vi.advanceTimersByTimeAsync(299);
    expect(local.writes).toBe(0);
    await vi.advanceTimersByTimeAsync(2);
    // The writer module loads on the first change: wait for the write itself (the margin covers its first
    // transform, seconds on a busy machine).
    await vi.waitFor(() => expect(local.writes).toBe(1), { timeout: 15_000 });
    const text = local.getItem(STORAGE_KEY)!;
    expect(text).toContain("E/N = 8/3");
    // 1000 doubles as JSON would be many kB; the saved text stays small because arrays go to IndexedDB.
    expect(text.length).toBeLessThan(20_000);
    expect(curves.items.get("c1")?.massEv).toBe(store.getState().project.curves[0].massEv);
    auto.stop();
  });

  test("curve arrays are written only when they change (reference comparison)", async () => {
    const auto = startAutosave(store, { local, curves });
    store.getState().addCurves([curve("c1"), curve("c2")]);
    await auto.flush();
    expect(curves.puts.sort()).toEqual(["c1", "c2"]);
    store.getState().updateCurve("c1", { label: "Renamed" });
    await auto.flush();
    expect(curves.puts.length).toBe(2);
    const fresh = curve("c1", 7);
    store.getState().updateCurve("c1", { massEv: fresh.massEv, gInvGeV: fresh.gInvGeV });
    await auto.flush();
    expect(curves.puts.filter((id) => id === "c1").length).toBe(2);
    store.getState().removeCurve("c2");
    await auto.flush();
    expect(curves.deletes).toEqual(["c2"]);
    auto.stop();
  });

  test("a burst of changes is one write", async () => {
    const auto = startAutosave(store, { local, curves, debounceMs: 300 });
    for (let i = 0; i < 20; i++) {
      store.getState().setView([1e-6 * (1 + i / 100), 1e-2], [1e-16, 1e-10]);
      await vi.advanceTimersByTimeAsync(50);
    }
    await vi.advanceTimersByTimeAsync(300);
    expect(local.writes).toBe(1);
    auto.stop();
  });
});

describe("restoring", () => {
  test("a new session restores models, figure and curve data", async () => {
    const auto = startAutosave(store, { local, curves });
    store.getState().addModel({ eOverNMin: "5/3", eOverNMax: "44/3", label: "E/N = 5/3..44/3" });
    store.getState().addCurves([curve("c1")]);
    store.getState().setView([1e-5, 1e-3], [1e-15, 1e-11]);
    await auto.flush();
    auto.stop();
    const saved = store.getState().project;

    const next = createAxbandStore();
    await initProject(next, { local, curves, fragment: "" });
    const p = next.getState().project;
    expect(p.models.map((m) => m.label)).toEqual(saved.models.map((m) => m.label));
    expect(p.figure).toEqual(saved.figure);
    expect(Array.from(p.curves[0].massEv)).toEqual(Array.from(saved.curves[0].massEv));
    expect(p.curves[0].gInvGeV).toBeInstanceOf(Float64Array);
    expect(next.getState().canUndo()).toBe(false);
    expect(next.getState().ui.messages).toEqual([]);
  });

  test("nothing saved: restore gives null and the start project is the default one", async () => {
    expect(await restoreAutosave(store, { local, curves })).toBeNull();
    const next = createAxbandStore();
    const defaults = next.getState().project;
    await initProject(next, { local, curves, fragment: "" });
    expect(next.getState().project).toEqual(defaults);
  });

  test("a curve whose data is gone is dropped with an alert that names it", async () => {
    const auto = startAutosave(store, { local, curves });
    store.getState().addCurves([curve("c1"), curve("c2")]);
    await auto.flush();
    auto.stop();
    curves.items.delete("c2");
    const next = createAxbandStore();
    await initProject(next, { local, curves, fragment: "" });
    expect(next.getState().project.curves.map((c) => c.id)).toEqual(["c1"]);
    const alerts = next.getState().ui.messages.filter((m) => m.kind === "alert");
    expect(alerts).toHaveLength(1);
    expect(alerts[0].text).toContain("Demo c2 (invented)");
  });

  test("a blocked IndexedDB does not keep the app from starting: the curve is left out after a wait", async () => {
    const auto = startAutosave(store, { local, curves });
    store.getState().addModel({ eOverNMin: "2/3", label: "kept" });
    store.getState().addCurves([curve("c1")]);
    await auto.flush();
    auto.stop();
    const blocked: CurveDataStore = { put: async () => {}, get: () => new Promise(() => {}), delete: async () => {} };
    const next = createAxbandStore();
    let done = false;
    const started = initProject(next, { local, curves: blocked, fragment: "" }).then(() => (done = true));
    await vi.advanceTimersByTimeAsync(1000);
    expect(done).toBe(false);
    await vi.advanceTimersByTimeAsync(5000);
    await started;
    expect(next.getState().project.models.some((m) => m.label === "kept")).toBe(true);
    expect(next.getState().project.curves).toEqual([]);
    expect(next.getState().ui.messages.filter((m) => m.kind === "alert")).toHaveLength(1);
  });

  test("unreadable saved text gives one alert and the default project", async () => {
    local.items.set(STORAGE_KEY, "{not json");
    const next = createAxbandStore();
    const defaults = next.getState().project;
    await initProject(next, { local, curves, fragment: "" });
    expect(next.getState().project).toEqual(defaults);
    expect(next.getState().ui.messages.filter((m) => m.kind === "alert")).toHaveLength(1);
  });

  test("a bad link gives an alert and keeps the restored project", async () => {
    const auto = startAutosave(store, { local, curves });
    store.getState().addModel({ eOverNMin: "2/3", label: "mine" });
    await auto.flush();
    auto.stop();
    const next = createAxbandStore();
    let cleared = false;
    await initProject(next, {
      local,
      curves,
      fragment: "v1.this-is-not-a-valid-link",
      clearFragment: () => (cleared = true),
    });
    expect(next.getState().project.models.some((m) => m.label === "mine")).toBe(true);
    const alerts = next.getState().ui.messages.filter((m) => m.kind === "alert");
    expect(alerts).toHaveLength(1);
    expect(alerts[0].text).toMatch(/link/i);
    expect(cleared).toBe(true);
  });
});

describe("full or missing storage", () => {
  test("quota exceeded: one alert over many changes, the store keeps working", async () => {
    local.full = true;
    const auto = startAutosave(store, { local, curves });
    for (let i = 0; i < 5; i++) {
      store.getState().addModel({ eOverNMin: String(i) });
      await auto.flush();
    }
    const alerts = store.getState().ui.messages.filter((m) => m.kind === "alert");
    expect(alerts).toEqual([expect.objectContaining({ text: STORAGE_PROBLEM })]);
    expect(local.writes).toBe(5); // it keeps trying: space may free up
    store.getState().undo();
    expect(store.getState().project.models.some((m) => m.eOverNMin === "4")).toBe(false);
    auto.stop();
  });

  test("IndexedDB quota exceeded for curve data: one alert, and the write is retried on the next change", async () => {
    curves.full = true;
    const auto = startAutosave(store, { local, curves });
    store.getState().addCurves([curve("c1")]);
    await auto.flush();
    store.getState().setFigure({ title: "t" });
    await auto.flush();
    expect(curves.puts).toEqual(["c1", "c1"]);
    expect(store.getState().ui.messages.filter((m) => m.kind === "alert")).toHaveLength(1);
    auto.stop();
  });

  test("no storage at all (private mode): one alert, no exception", async () => {
    const auto = startAutosave(store, { local: null, curves: null });
    store.getState().addModel({ eOverNMin: "1" });
    store.getState().addCurves([curve("c1")]);
    await auto.flush();
    store.getState().addModel({ eOverNMin: "2" });
    await auto.flush();
    expect(store.getState().ui.messages.filter((m) => m.kind === "alert")).toHaveLength(1);
    auto.stop();
  });
});

describe("chunked curve records (IndexedDB layout)", () => {
  test("split and join give back the same numbers, for sizes around the chunk size", () => {
    for (const n of [0, 1, 9, 10, 11, 35]) {
      const data = {
        massEv: Float64Array.from({ length: n }, (_, i) => 1e-6 * (1 + i)),
        gInvGeV: Float64Array.from({ length: n }, (_, i) => 1e-13 / (1 + i)),
      };
      const { head, chunks } = splitChunks(data, 10);
      expect(head).toEqual({ v: 1, length: n, chunks: Math.ceil(n / 10) });
      expect(chunks.every((c) => c.massEv.length <= 10 && c.massEv.buffer !== data.massEv.buffer)).toBe(true);
      const back = joinChunks(head, chunks)!;
      expect(Array.from(back.massEv)).toEqual(Array.from(data.massEv));
      expect(Array.from(back.gInvGeV)).toEqual(Array.from(data.gInvGeV));
    }
  });

  test("a missing or damaged chunk reads as missing, never as wrong data", () => {
    const data = {
      massEv: Float64Array.from({ length: 25 }, (_, i) => i + 1),
      gInvGeV: Float64Array.from({ length: 25 }, (_, i) => i + 2),
    };
    const { head, chunks } = splitChunks(data, 10);
    expect(joinChunks(head, chunks.slice(0, 2))).toBeUndefined();
    expect(joinChunks(head, [chunks[0], undefined, chunks[2]])).toBeUndefined();
    expect(joinChunks({ ...head, length: 24 }, chunks)).toBeUndefined();
    expect(
      joinChunks(head, [chunks[0], { massEv: chunks[1].massEv, gInvGeV: new Float64Array(3) }, chunks[2]]),
    ).toBeUndefined();
  });

  test("chunk keys sort in chunk order after the curve's own key and before any other id", () => {
    const keys = [chunkKey("c1", 10), chunkKey("c1", 2), "c1", "c10", chunkKey("c1", 0)].sort();
    expect(keys).toEqual(["c1", chunkKey("c1", 0), chunkKey("c1", 2), chunkKey("c1", 10), "c10"]);
  });
});
