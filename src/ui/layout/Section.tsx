// A collapsible sidebar section (native <details>, so it is keyboard- and screen-reader-friendly). A section with
// an id remembers whether the user left it open or closed, across reloads (localStorage).
import { useState, type ReactNode } from "react";

const KEY = "axband:section-open:";

function storedOpen(id: string | undefined): boolean | null {
  if (!id) return null;
  try {
    const v = localStorage.getItem(KEY + id);
    return v === "1" ? true : v === "0" ? false : null;
  } catch {
    return null;
  }
}

function storeOpen(id: string, open: boolean): void {
  try {
    localStorage.setItem(KEY + id, open ? "1" : "0");
  } catch {
    // Storage full or unavailable: the section simply starts as its default next time.
  }
}

export function Section({
  title,
  children,
  open = true,
  id,
}: {
  title: string;
  children: ReactNode;
  open?: boolean;
  id?: string;
}) {
  const [isOpen, setOpen] = useState(() => storedOpen(id) ?? open);
  return (
    <details
      className="section"
      open={isOpen}
      id={id}
      onToggle={(e) => {
        const now = e.currentTarget.open;
        if (now === isOpen) return;
        setOpen(now);
        if (id) storeOpen(id, now);
      }}
    >
      <summary className="section-title">
        <h2>{title}</h2>
      </summary>
      <div className="section-body">{children}</div>
    </details>
  );
}
