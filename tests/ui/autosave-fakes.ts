// In-memory stand-ins for the browser stores autosave uses (localStorage, sessionStorage, IndexedDB curve and
// spare stores, BroadcastChannel), shared by the autosave tests. Storage behaviour per the WHATWG HTML
// standard, §12 Web storage (setItem throws a "QuotaExceededError" DOMException when the value does not fit).
import type { CurveArrays, CurveDataStore, SpareRecord, SpareStore } from "../../src/ui/store/autosave";
import type { Curve } from "../../src/project/types";

const quota = () => new DOMException("The quota has been exceeded.", "QuotaExceededError");

export class MemoryStorage {
  items = new Map<string, string>();
  full = false;
  getItem(k: string) {
    return this.items.get(k) ?? null;
  }
  setItem(k: string, v: string) {
    if (this.full) throw quota();
    this.items.set(k, v);
  }
  removeItem(k: string) {
    this.items.delete(k);
  }
}

export class MemoryCurves implements CurveDataStore {
  items = new Map<string, CurveArrays>();
  async put(id: string, d: CurveArrays) {
    this.items.set(id, d);
  }
  async get(id: string) {
    return this.items.get(id);
  }
  async delete(id: string) {
    this.items.delete(id);
  }
}

export class MemorySpare implements SpareStore {
  rec: SpareRecord | undefined;
  full = false;
  async put(rec: SpareRecord) {
    if (this.full) throw quota();
    this.rec = rec;
  }
  async get() {
    return this.rec;
  }
}

/** An invented curve (not measured data). */
export function curve(id: string, n = 5): Curve {
  return {
    id,
    label: `Demo ${id} (invented)`,
    role: "exclusion",
    massEv: new Float64Array(n).map((_, i) => 1e-6 * 10 ** (i / 2)),
    gInvGeV: new Float64Array(n).map((_, i) => 1e-13 * (1 + i)),
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
