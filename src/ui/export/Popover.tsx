// A small drop-down panel under a header button (export options, project actions). Closes on Escape and on
// a click outside; the opener can also open it from code (e.g. to show a freshly made share link).
import { useEffect, useId, useRef, type ReactNode } from "react";

export interface PopoverProps {
  label: ReactNode;
  open: boolean;
  onOpenChange: (open: boolean) => void;
  children: ReactNode;
  /** Accessible name of the opener when `label` is only a symbol. */
  ariaLabel?: string;
  testId?: string;
  align?: "left" | "right";
}

export function Popover({ label, open, onOpenChange, children, ariaLabel, testId, align = "right" }: PopoverProps) {
  const root = useRef<HTMLSpanElement>(null);
  const id = useId();
  useEffect(() => {
    if (!open) return;
    const onDown = (e: PointerEvent) => {
      if (root.current && !root.current.contains(e.target as Node)) onOpenChange(false);
    };
    const onKey = (e: KeyboardEvent) => {
      if (e.key === "Escape") onOpenChange(false);
    };
    document.addEventListener("pointerdown", onDown);
    document.addEventListener("keydown", onKey);
    return () => {
      document.removeEventListener("pointerdown", onDown);
      document.removeEventListener("keydown", onKey);
    };
  }, [open, onOpenChange]);
  return (
    <span className="ax-popover" ref={root}>
      <button
        type="button"
        aria-expanded={open}
        aria-controls={id}
        aria-label={ariaLabel}
        data-testid={testId}
        onClick={() => onOpenChange(!open)}
      >
        {label}
      </button>
      {open ? (
        <div id={id} className={`ax-popover-panel ax-popover-${align}`}>
          {children}
        </div>
      ) : null}
    </span>
  );
}
