// Two tabs on one browser storage (two stores sharing one in-memory localStorage, curve store and broadcast
// channel): a tab never saves over newer work of another tab without asking, and a curve removed in one tab
// does not vanish from the other without a word. BroadcastChannel semantics per the WHATWG HTML standard,
// §9.5 Broadcasting to other browsing contexts (a message reaches every other channel of the same name, not
// the sender); the storage event fallback is covered by the save-time check on the stored revision.
import { afterEach, beforeEach, expect, test, vi } from "vitest";
import { createAxbandStore, type AxbandStore } from "../../src/ui/store";
import { emptyProject } from "../../src/project/defaults";
import { type Revision, initProject, startAutosave } from "../../src/ui/store/autosave";
import { MemoryCurves, MemoryStorage, curve } from "./autosave-fakes";

/** An in-memory broadcast hub: every tab's channel delivers to all the others, asynchronously. */
class Hub {
  listeners = new Set<(rev: Revision) => void>();
  channel() {
    const own = new Set<(rev: Revision) => void>();
    return {
      post: (rev: Revision) => {
        for (const l of this.listeners) if (!own.has(l)) setTimeout(() => l(rev), 0);
      },
      listen: (l: (rev: Revision) => void) => {
        own.add(l);
        this.listeners.add(l);
        return () => this.listeners.delete(l);
      },
    };
  }
}

let local: MemoryStorage;
let curves: MemoryCurves;
let hub: Hub;
beforeEach(() => {
  vi.useFakeTimers();
  local = new MemoryStorage();
  curves = new MemoryCurves();
  hub = new Hub();
});
afterEach(() => {
  vi.useRealTimers();
});

/** A tab: a store restored from the shared storage, with its autosave running. */
async function openTab(withChannel = true) {
  const opts = { local, curves, spare: null, session: null, channel: withChannel ? hub.channel() : null };
  const store: AxbandStore = createAxbandStore(emptyProject());
  await initProject(store, { ...opts, fragment: "" });
  return { store, auto: startAutosave(store, opts) };
}

const savedText = () => local.getItem("axband:project") ?? "";

async function twoTabsWithTwoCurves() {
  const first = await openTab();
  // Nothing saved yet, so the first tab starts from the demo project: start it empty instead.
  first.store.getState().resetProject(emptyProject());
  first.store.getState().addCurves([curve("c1"), curve("c2")]);
  await first.auto.flush();
  const a = first;
  const b = await openTab();
  return { a, b };
}

test("a tab that hears of newer work elsewhere stops saving and asks; 'Load it' names what it loses", async () => {
  const { a, b } = await twoTabsWithTwoCurves();
  a.store.getState().removeCurve("c2");
  await a.auto.flush();
  await vi.advanceTimersByTimeAsync(1);
  expect(b.store.getState().ui.tabConflict).toEqual(expect.objectContaining({ choice: null }));

  b.store.getState().setFigure({ title: "B's title" });
  await vi.advanceTimersByTimeAsync(1000);
  await b.auto.flush();
  expect(savedText()).not.toContain("B's title");

  b.store.getState().chooseTabConflict("load");
  await vi.waitFor(() => expect(b.store.getState().ui.tabConflict).toBeNull(), { timeout: 15_000 });
  expect(b.store.getState().project.curves.map((c) => c.id)).toEqual(["c1"]);
  const status = b.store
    .getState()
    .ui.messages.map((m) => m.text)
    .join(" ");
  expect(status).toContain('curve "Demo c2 (invented)"');
  // Undo brings this tab's own work back, and it then saves normally (it builds on the newest now).
  b.store.getState().undo();
  await b.auto.flush();
  expect(savedText()).toContain("B's title");
  a.auto.stop();
  b.auto.stop();
});

test("'Keep mine and save' writes this tab's work, curve data included, over the other tab's", async () => {
  const { a, b } = await twoTabsWithTwoCurves();
  a.store.getState().removeCurve("c2");
  await a.auto.flush();
  expect(curves.items.has("c2")).toBe(false);
  await vi.advanceTimersByTimeAsync(1);
  b.store.getState().chooseTabConflict("keep");
  await vi.waitFor(() => expect(b.store.getState().ui.tabConflict).toBeNull(), { timeout: 15_000 });
  await b.auto.flush();
  expect(curves.items.has("c2")).toBe(true);

  const reloaded = await openTab();
  expect(reloaded.store.getState().project.curves.map((c) => c.id)).toEqual(["c1", "c2"]);
  // Tab A now holds older work: its next save asks instead of overwriting.
  a.store.getState().setFigure({ title: "A again" });
  await a.auto.flush();
  expect(a.store.getState().ui.tabConflict).not.toBeNull();
  expect(savedText()).not.toContain("A again");
  for (const t of [a, b, reloaded]) t.auto.stop();
});

test("without any channel, the save-time check on the stored revision still asks", async () => {
  const a = await openTab(false);
  const b = await openTab(false);
  a.store.getState().addModel({ eOverNMin: "8/3", label: "from A" });
  await a.auto.flush();
  b.store.getState().addModel({ eOverNMin: "5/3", label: "from B" });
  await b.auto.flush();
  expect(b.store.getState().ui.tabConflict).not.toBeNull();
  expect(savedText()).toContain("from A");
  expect(savedText()).not.toContain("from B");
  a.auto.stop();
  b.auto.stop();
});
