// The application shell: header (name, undo/redo, project and export menus), the sidebar with collapsible
// sections (models, curves, figure settings, constants), and the main area (figure, readout, overlap, sources).
import { lazy, Suspense } from "react";
import { CurvesPanel } from "./curves/CurvesPanel";
import { ImportDialog } from "./importer/ImportDialog";
import { ExportMenu } from "./export/ExportMenu";
import { ProjectMenu } from "./share/ProjectMenu";
import { Messages } from "./layout/Messages";
import { Section } from "./layout/Section";
import { UndoRedo, useUndoKeys } from "./layout/UndoRedo";
import { ModelsPanel } from "./models/ModelsPanel";
import { FigureSettings } from "./settings/FigureSettings";
import { ConstantsPanel } from "./settings/ConstantsPanel";
import { FigureView } from "./figure/FigureView";
import { FigureBoundary } from "./figure/FigureBoundary";
import { selectProject, useAxband } from "./store";
import { HoverReadout } from "./figure/HoverReadout";

// Below the figure and not needed to draw it: loaded after the first figure, each with a loading note.
const OverlapPanel = lazy(() => import("./overlap/OverlapPanel").then((m) => ({ default: m.OverlapPanel })));
const SourcesPanel = lazy(() => import("./sources/SourcesPanel").then((m) => ({ default: m.SourcesPanel })));

function Loading({ what }: { what: string }) {
  return (
    <p className="note loading" role="status">
      Loading {what}…
    </p>
  );
}

/** The figure inside its error boundary (a new project retries after a drawing failure). */
function Figure() {
  const project = useAxband(selectProject);
  return (
    <FigureBoundary resetKey={project}>
      <FigureView />
    </FigureBoundary>
  );
}

export function App() {
  useUndoKeys();
  return (
    <div className="app">
      <header className="app-header">
        <div className="brand">
          <h1>axband</h1>
          <span className="tagline">QCD-axion model bands over your own sensitivity curves</span>
        </div>
        <div className="header-actions">
          <UndoRedo />
          <ProjectMenu />
          <ExportMenu />
        </div>
      </header>
      <Messages />
      <div className="app-body">
        <aside className="sidebar" aria-label="Settings">
          <Section title="Models" id="section-models">
            <ModelsPanel />
          </Section>
          <Section title="Curves" id="section-curves">
            <CurvesPanel />
          </Section>
          <Section title="Figure settings" id="section-figure" open={false}>
            <FigureSettings />
          </Section>
          <Section title="Constants" id="section-constants" open={false}>
            <ConstantsPanel />
          </Section>
        </aside>
        <main className="main">
          <Figure />
          <HoverReadout />
          <p className="caution" role="note">
            Predictions depend on the model assumptions (field content, charges, the constants chosen under Constants)
            and on the curves you import. Take experimental curves from their original publications and credit those
            publications when you show a figure.
          </p>
          <Suspense fallback={<Loading what="the overlap table" />}>
            <OverlapPanel />
          </Suspense>
          <Suspense fallback={<Loading what="the sources" />}>
            <SourcesPanel />
          </Suspense>
        </main>
      </div>
      <ImportDialog />
    </div>
  );
}
