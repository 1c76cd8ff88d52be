// The import dialog (loaded on first use): picked, pasted or dropped sources parsed in the worker, previewed with
// their detected settings and unreadable rows, imported in one click (project files reopen the project instead).
import { useEffect, useId, useState } from "react";
import { MAX_IMPORT_BYTES } from "../../data";
import { formatBytes, importable } from "./import-items";
import { useImport } from "./import-store";
import { ImportItemCard } from "./ImportItemCard";

function PasteBox() {
  const addSources = useImport((s) => s.addSources);
  const setPasteOpen = useImport((s) => s.setPasteOpen);
  const [text, setText] = useState("");
  const id = useId();
  return (
    <div className="ax-paste">
      <label htmlFor={id}>Paste data</label>
      <textarea
        id={id}
        rows={6}
        spellCheck={false}
        autoFocus
        placeholder={"m_a [ueV], g [1/GeV]\n1.0, 3e-14\n2.0, 2.5e-14"}
        value={text}
        onChange={(e) => setText(e.target.value)}
      />
      <div className="ax-import-actions">
        <button
          type="button"
          disabled={text.trim() === ""}
          onClick={() => {
            addSources([{ name: "paste", blob: new Blob([text], { type: "text/plain" }), label: "Pasted data" }]);
            setText("");
            setPasteOpen(false);
          }}
        >
          Preview pasted data
        </button>
      </div>
    </div>
  );
}

/** Overall progress, the notice, Cancel and Import. */
function ImportFooter() {
  const items = useImport((s) => s.items);
  const notice = useImport((s) => s.notice);
  const busy = useImport((s) => s.busy);
  const { cancelAll, confirm } = useImport.getState();
  const parsing = items.filter((it) => it.status === "parsing");
  const totalBytes = parsing.reduce((n, it) => n + Math.max(1, it.sizeBytes), 0);
  const overall =
    parsing.length === 0 ? 1 : parsing.reduce((n, it) => n + it.progress * Math.max(1, it.sizeBytes), 0) / totalBytes;
  const readyCount = items.filter(importable).length;
  const rejectedTotal = items.filter(importable).reduce((n, it) => n + (it.result?.rejectedCount ?? 0), 0);
  const curvesWord = readyCount + parsing.length > 1 ? `${readyCount + parsing.length} curves` : "curve";
  return (
    <div className="ax-modal-foot">
      {parsing.length > 0 ? (
        <div className="ax-progress-row">
          <div
            className="ax-progress"
            role="progressbar"
            aria-label="Reading files"
            aria-valuemin={0}
            aria-valuemax={100}
            aria-valuenow={Math.round(overall * 100)}
          >
            <div className="ax-progress-fill" style={{ width: `${(overall * 100).toFixed(1)}%` }} />
          </div>
          <span className="ax-hint">
            Reading {parsing.length === 1 ? "1 file" : `${parsing.length} files`} · {Math.round(overall * 100)} %
          </span>
        </div>
      ) : null}
      {notice ? (
        <p className="ax-import-notice" role="alert">
          {notice}
        </p>
      ) : null}
      <div className="ax-import-actions">
        <button type="button" onClick={cancelAll}>
          Cancel
        </button>
        {items.length > 0 ? (
          <button
            type="button"
            className="primary"
            data-testid="import-confirm"
            disabled={busy || (readyCount === 0 && parsing.length === 0)}
            onClick={() => void confirm()}
          >
            {busy
              ? "Importing…"
              : `Import ${curvesWord}${rejectedTotal > 0 ? `, skipping ${rejectedTotal.toLocaleString("en")} unreadable row${rejectedTotal === 1 ? "" : "s"}` : ""}`}
          </button>
        ) : null}
      </div>
    </div>
  );
}

/** The dialog, shown while the import step has sources or the paste box open. */
export function ImportModal() {
  const items = useImport((s) => s.items);
  const pasteOpen = useImport((s) => s.pasteOpen);
  const { changeSettings, removeItem, cancelAll } = useImport.getState();
  const titleId = useId();
  const open = items.length > 0 || pasteOpen;

  useEffect(() => {
    if (!open) return;
    const onKey = (e: KeyboardEvent) => {
      if (e.key === "Escape") cancelAll();
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [open, cancelAll]);

  if (!open) return null;
  return (
    <div className="ax-modal-backdrop">
      <div className="ax-modal ax-panel" role="dialog" aria-modal="true" aria-labelledby={titleId}>
        {/* Not <header>: outside a section it would be a second banner landmark beside the page's own. */}
        <div className="ax-modal-head">
          <h2 id={titleId}>Import curves</h2>
          <span className="ax-hint">up to {formatBytes(MAX_IMPORT_BYTES)} per file</span>
        </div>
        <div className="ax-modal-body">
          {pasteOpen ? <PasteBox /> : null}
          {items.map((it) => (
            <ImportItemCard
              key={it.key}
              item={it}
              onChange={(p) => changeSettings(it.key, p)}
              onRemove={() => removeItem(it.key)}
            />
          ))}
        </div>
        <ImportFooter />
      </div>
    </div>
  );
}
