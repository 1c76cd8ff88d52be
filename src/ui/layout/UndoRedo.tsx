// Undo/redo buttons for the header, and the keyboard shortcuts (Ctrl/Cmd+Z, Shift+Ctrl/Cmd+Z, Ctrl+Y).
import { useEffect } from "react";
import { selectCanRedo, selectCanUndo, useAxband } from "../store";

const isMac = typeof navigator !== "undefined" && /Mac|iPhone|iPad/.test(navigator.platform || navigator.userAgent);
const MOD = isMac ? "⌘" : "Ctrl+";

/** True when the key goes to a text field, whose own undo must keep working. */
function typingTarget(t: EventTarget | null): boolean {
  if (!(t instanceof HTMLElement)) return false;
  if (t.isContentEditable) return true;
  if (t instanceof HTMLTextAreaElement || t instanceof HTMLSelectElement) return true;
  if (t instanceof HTMLInputElement)
    return !["checkbox", "radio", "button", "submit", "range", "color"].includes(t.type);
  return false;
}

/** Installs the undo/redo shortcuts on the window while mounted. */
export function useUndoKeys() {
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (!(e.ctrlKey || e.metaKey) || e.altKey || typingTarget(e.target)) return;
      const k = e.key.toLowerCase();
      const s = useAxband.getState();
      if (k === "z" && !e.shiftKey) s.undo();
      else if ((k === "z" && e.shiftKey) || (k === "y" && !e.shiftKey)) s.redo();
      else return;
      e.preventDefault();
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, []);
}

export function UndoRedo() {
  const canUndo = useAxband(selectCanUndo);
  const canRedo = useAxband(selectCanRedo);
  const undo = useAxband((s) => s.undo);
  const redo = useAxband((s) => s.redo);
  return (
    <div className="undo-redo" role="group" aria-label="History">
      <button type="button" onClick={undo} disabled={!canUndo} title={`Undo (${MOD}Z)`} data-testid="undo">
        ↶ Undo
      </button>
      <button
        type="button"
        onClick={redo}
        disabled={!canRedo}
        title={`Redo (${isMac ? "⇧⌘Z" : "Ctrl+Y"})`}
        data-testid="redo"
      >
        ↷ Redo
      </button>
    </div>
  );
}
