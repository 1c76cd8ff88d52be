// The import step's entry points that the page carries from the start: the import buttons, and the page-wide
// drop target with the dialog, which loads on first use (import-loader.ts) with a visible loading state.
import { lazy, Suspense } from "react";
import { useWindowDrop } from "./useWindowDrop";
import { useImportRequested, withImport } from "./import-loader";
import "./importer.css";

const ImportModal = lazy(() => import("./ImportModal").then((m) => ({ default: m.ImportModal })));

const ACCEPT = ".csv,.tsv,.txt,.dat,.tab,.svg,.pdf,.json,text/csv,text/plain,text/tab-separated-values";

/** The import buttons (file picker with data-testid="import-files", and "Paste data"). */
export function ImportControls() {
  return (
    <div className="ax-import-bar">
      <label className="ax-button-like">
        Import files…
        <input
          className="visually-hidden"
          type="file"
          multiple
          data-testid="import-files"
          accept={ACCEPT}
          onChange={(e) => {
            const files = Array.from(e.currentTarget.files ?? []);
            e.currentTarget.value = "";
            if (files.length > 0) withImport((s) => s.addFiles(files));
          }}
        />
      </label>
      <button type="button" onClick={() => withImport((s) => s.setPasteOpen(true))}>
        Paste data
      </button>
      <span className="ax-hint">or drop files on the page</span>
    </div>
  );
}

/** Shown in place of the dialog while its code loads. */
function Loading() {
  return (
    <div className="ax-modal-backdrop">
      <div className="ax-modal ax-panel" role="status">
        <p className="ax-hint">Loading the import step…</p>
      </div>
    </div>
  );
}

/** The import dialog and the page-wide drop target; render once in the app. */
export function ImportDialog() {
  const requested = useImportRequested();
  const dragging = useWindowDrop((files) => withImport((s) => s.addFiles(files)));
  return (
    <>
      {dragging ? (
        <div className="ax-drop-overlay" aria-hidden="true">
          <div>Drop CSV files to import them as curves, or an axband project or exported SVG to open it.</div>
        </div>
      ) : null}
      {requested ? (
        <Suspense fallback={<Loading />}>
          <ImportModal />
        </Suspense>
      ) : null}
    </>
  );
}
