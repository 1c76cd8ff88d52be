// UI slice: transient state that is never saved or undone (messages, highlight, hover point).
import type { SliceCreator, UiSlice } from "./types";

let messageCounter = 0;

export const createUiSlice: SliceCreator<UiSlice> = (set, get) => ({
  ui: { messages: [], tabConflict: null, highlight: null, hover: null },
  pushMessage(kind, text) {
    messageCounter += 1;
    const id = `msg-${messageCounter}`;
    set({ ui: { ...get().ui, messages: [...get().ui.messages, { id, kind, text }] } });
    return id;
  },
  dismissMessage(id) {
    const { ui } = get();
    if (!ui.messages.some((m) => m.id === id)) return;
    set({ ui: { ...ui, messages: ui.messages.filter((m) => m.id !== id) } });
  },
  setTabConflict(tabConflict) {
    set({ ui: { ...get().ui, tabConflict } });
  },
  chooseTabConflict(choice) {
    const { ui } = get();
    if (ui.tabConflict && !ui.tabConflict.choice) set({ ui: { ...ui, tabConflict: { ...ui.tabConflict, choice } } });
  },
  setHighlight(highlight) {
    set({ ui: { ...get().ui, highlight } });
  },
  setHover(hover) {
    const { ui } = get();
    if (ui.hover === hover || (ui.hover && hover && ui.hover.massEv === hover.massEv && ui.hover.y === hover.y)) return;
    set({ ui: { ...ui, hover } });
  },
});
