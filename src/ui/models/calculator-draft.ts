// The calculator's draft kept in browser storage, so a reload does not lose a half-built model; and the
// request channel by which the model list reopens a calculator model for editing.
import { create } from "zustand";
import type { Model } from "../../project/types";
import { blankRow, initialCalcState, type CalcState, type FermionDraft } from "./calculator-state";

const KEY = "axband.calculator-draft.v1";

function storage(): Storage | null {
  try {
    return globalThis.localStorage ?? null;
  } catch {
    return null;
  }
}

/** The saved draft (row keys renewed), or the start table when there is none or it cannot be read. */
export function loadDraft(): CalcState {
  const start = initialCalcState();
  try {
    const raw = storage()?.getItem(KEY);
    if (!raw) return start;
    const v = JSON.parse(raw) as Partial<CalcState>;
    const rows = (list: unknown): FermionDraft[] | null =>
      Array.isArray(list) ? list.map((r: Partial<FermionDraft>) => blankRow({ ...r, key: undefined })) : null;
    const str = (x: unknown, d: string) => (typeof x === "string" ? x : d);
    return {
      rows: rows(v.rows) ?? start.rows,
      scalars: rows(v.scalars) ?? start.scalars,
      scalarCharge: str(v.scalarCharge, start.scalarCharge),
      name: str(v.name, ""),
      terms: str(v.terms, ""),
      forbidden: str(v.forbidden, ""),
      normalize: str(v.normalize, start.normalize),
      editingId: typeof v.editingId === "string" ? v.editingId : null,
      dirty: v.dirty === true,
    };
  } catch {
    return start;
  }
}

/** Keep the draft; storage that is full or unavailable only loses the draft, never the project. */
export function saveDraft(s: CalcState): void {
  try {
    storage()?.setItem(KEY, JSON.stringify(s));
  } catch {
    /* storage full or blocked: the draft is a convenience */
  }
}

interface CalculatorRequest {
  open: boolean;
  /** A calculator model to load for editing; taken by the calculator once. */
  edit: Model | null;
  setOpen: (open: boolean) => void;
  requestEdit: (m: Model) => void;
  takeEdit: () => void;
}

export const useCalculatorRequest = create<CalculatorRequest>((set) => ({
  open: false,
  edit: null,
  setOpen: (open) => set({ open }),
  requestEdit: (m) => set({ edit: m, open: true }),
  takeEdit: () => set({ edit: null }),
}));
