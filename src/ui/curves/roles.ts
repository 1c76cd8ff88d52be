// Choices shared by the import step and the curves panel: curve roles and line styles.
import type { CurveRole, LineStyle } from "../../project/types";

export const ROLES: { value: CurveRole; label: string }[] = [
  { value: "exclusion", label: "exclusion (filled above)" },
  { value: "projection", label: "projection (line)" },
  { value: "region", label: "region (closed contour)" },
];

export const LINE_STYLES: { value: LineStyle; label: string }[] = (
  ["solid", "dashed", "dotted", "dashdot"] as const
).map((s) => ({ value: s, label: s }));
