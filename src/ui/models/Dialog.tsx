// The page-covering dialog of the Models section (anomaly calculator, heavy-quark ensemble): it takes the focus
// on opening, and Escape or a click beside it closes it; closing only hides it, so its content keeps its state.
import { useEffect, useRef, type ReactNode } from "react";
import { createPortal } from "react-dom";

export function Dialog(props: {
  open: boolean;
  onClose: () => void;
  titleId: string;
  title: string;
  closeLabel: string;
  children: ReactNode;
}) {
  const { open, onClose, titleId, title, closeLabel, children } = props;
  const panel = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (!open) return;
    panel.current?.focus();
    const onKey = (e: KeyboardEvent) => {
      if (e.key === "Escape") onClose();
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [open, onClose]);
  // A portal: the sidebar is a sticky stacking context, and the dialog must cover the whole page.
  return createPortal(
    <div className="dialog-backdrop" hidden={!open} onMouseDown={(e) => e.target === e.currentTarget && onClose()}>
      <div className="dialog" role="dialog" aria-modal="true" aria-labelledby={titleId} ref={panel} tabIndex={-1}>
        <div className="dialog-head">
          <h2 id={titleId}>{title}</h2>
          <button type="button" className="icon" aria-label={closeLabel} onClick={onClose}>
            ✕
          </button>
        </div>
        {children}
      </div>
    </div>,
    document.body,
  );
}
