// A full localStorage must not lose the newest work: the text goes to the spare store (IndexedDB) and a reload
// restores the newer of the two copies; when nothing could be saved, the reload says what was lost.
// Quota behaviour per the WHATWG HTML standard, §12 Web storage ("QuotaExceededError" from setItem).
import { afterEach, beforeEach, expect, test, vi } from "vitest";
import { createAxbandStore, type AxbandStore } from "../../src/ui/store";
import { emptyProject } from "../../src/project/defaults";
import { initProject, startAutosave } from "../../src/ui/store/autosave";
import { MemoryCurves, MemorySpare, MemoryStorage, curve } from "./autosave-fakes";

let store: AxbandStore;
let local: MemoryStorage;
let session: MemoryStorage;
let curves: MemoryCurves;
let spare: MemorySpare;
beforeEach(() => {
  vi.useFakeTimers();
  store = createAxbandStore(emptyProject());
  local = new MemoryStorage();
  session = new MemoryStorage();
  curves = new MemoryCurves();
  spare = new MemorySpare();
});
afterEach(() => {
  vi.useRealTimers();
});

const stores = () => ({ local, curves, spare, session });
const labels = (s: AxbandStore) => s.getState().project.models.map((m) => m.label);

test("localStorage full: the last edit is kept in the spare store and a reload restores it", async () => {
  const auto = startAutosave(store, stores());
  store.getState().addModel({ eOverNMin: "8/3", label: "saved normally" });
  await vi.advanceTimersByTimeAsync(400);
  await auto.flush();
  local.full = true;
  store.getState().addModel({ eOverNMin: "2/3", label: "after storage filled" });
  store.getState().addCurves([curve("c1")]);
  await vi.advanceTimersByTimeAsync(400);
  await auto.flush();
  auto.stop();
  expect(store.getState().ui.messages.filter((m) => m.kind === "alert")).toHaveLength(1);

  const next = createAxbandStore();
  await initProject(next, { ...stores(), fragment: "" });
  expect(labels(next)).toEqual(["saved normally", "after storage filled"]);
  expect(next.getState().project.curves.map((c) => c.id)).toEqual(["c1"]);
  expect(next.getState().ui.messages).toEqual([]);
});

test("an older spare copy does not win over a newer localStorage save", async () => {
  const auto = startAutosave(store, stores());
  local.full = true;
  store.getState().addModel({ eOverNMin: "1", label: "old" });
  await auto.flush();
  local.full = false;
  store.getState().updateModel(store.getState().project.models[0].id, { label: "new" });
  await auto.flush();
  auto.stop();
  expect(spare.rec).toBeDefined();
  const next = createAxbandStore();
  await initProject(next, { ...stores(), fragment: "" });
  expect(labels(next)).toEqual(["new"]);
});

test("nothing could be saved: the reload names what was lost", async () => {
  const auto = startAutosave(store, stores());
  store.getState().addModel({ eOverNMin: "8/3", label: "kept" });
  await auto.flush();
  local.full = true;
  spare.full = true;
  store.getState().addModel({ eOverNMin: "5/3", label: "unsaved model" });
  store.getState().addCurves([curve("c9")]);
  await auto.flush();
  auto.stop();

  const next = createAxbandStore();
  await initProject(next, { ...stores(), fragment: "" });
  expect(labels(next)).toEqual(["kept"]);
  const alerts = next.getState().ui.messages.filter((m) => m.kind === "alert");
  expect(alerts).toHaveLength(1);
  expect(alerts[0].text).toContain('model "unsaved model"');
  expect(alerts[0].text).toContain('curve "Demo c9 (invented)"');
  expect(alerts[0].text).toMatch(/lost/);
  // Said once: a second reload is quiet.
  const again = createAxbandStore();
  await initProject(again, { ...stores(), fragment: "" });
  expect(again.getState().ui.messages).toEqual([]);
});
