// Placeholder for the overlap table; owned and filled in by the second UI engineer (App places it in the layout).
export function OverlapPanel() {
  return null;
}
