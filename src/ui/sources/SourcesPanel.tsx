// Placeholder for the sources list; owned and filled in by the second UI engineer (App places it in the layout).
export function SourcesPanel() {
  return null;
}
