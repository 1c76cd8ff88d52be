// A collapsible sidebar section (native <details>, so it is keyboard- and screen-reader-friendly).
import type { ReactNode } from "react";

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
  return (
    <details className="section" open={open} id={id}>
      <summary className="section-title">
        <h2>{title}</h2>
      </summary>
      <div className="section-body">{children}</div>
    </details>
  );
}
