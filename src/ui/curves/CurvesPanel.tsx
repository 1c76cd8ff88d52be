// Placeholder for the curves list (import, style, rescale); owned and filled in by the second UI engineer (App places it in the layout).
export function CurvesPanel() {
  return null;
}
