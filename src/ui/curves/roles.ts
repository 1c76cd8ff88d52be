// Choices shared by the import step and the curves panel: curve roles, line styles, exclusion marks.
import type { CurveRole, ExclusionMark, LineStyle } from "../../project/types";

export const ROLES: { value: CurveRole; label: string }[] = [
  { value: "exclusion", label: "exclusion (excluded above)" },
  { value: "projection", label: "projection (line)" },
  { value: "region", label: "region (closed contour)" },
];

export const LINE_STYLES: { value: LineStyle; label: string }[] = (
  ["solid", "dashed", "dotted", "dashdot"] as const
).map((s) => ({ value: s, label: s }));

/** How an exclusion marks its excluded side; hatches are the house style (readable in greyscale print). */
export const EXCLUSION_MARKS: { value: ExclusionMark; label: string }[] = [
  { value: "hatch", label: "hatches" },
  { value: "fill", label: "fill" },
  { value: "hatch-fill", label: "hatches and fill" },
];
