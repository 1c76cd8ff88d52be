// The import step as a dialog: sources from the file picker, the paste box or a drop anywhere on the page
// are parsed in the Web Worker (progress bar, cancel), shown with their first rows, detected delimiter,
// header and units, the settings to change and the unreadable rows; one click on Import adds them all.
// Dropped project files and exported SVG figures reopen the project instead (see import-store).
import { useEffect, useId, useState } from "react";
import type { CurveRole } from "../../project/types";
import { delimiterName, MAX_IMPORT_BYTES } from "../../data";
import {
  DELIMITERS,
  formatBytes,
  importable,
  rejectionLines,
  type ImportItem,
  type ImportSettings,
} from "./import-items";
import { useImport } from "./import-store";
import { COUPLING_UNIT_OPTIONS, MASS_UNIT_OPTIONS } from "./unit-options";
import { ChoiceField } from "../layout/ChoiceField";
import { useWindowDrop } from "./useWindowDrop";
import { ROLES } from "../curves/roles";
import "./importer.css";

const ACCEPT = ".csv,.tsv,.txt,.dat,.tab,.svg,.json,text/csv,text/plain,text/tab-separated-values";

/** The import buttons (file picker with data-testid="import-files", and "Paste data"). */
export function ImportControls() {
  const addFiles = useImport((s) => s.addFiles);
  const setPasteOpen = useImport((s) => s.setPasteOpen);
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
            if (files.length > 0) void addFiles(files);
          }}
        />
      </label>
      <button type="button" onClick={() => setPasteOpen(true)}>
        Paste data
      </button>
      <span className="ax-hint">or drop files on the page</span>
    </div>
  );
}

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

/** The import dialog and the page-wide drop target; render once in the app. */
export function ImportDialog() {
  const items = useImport((s) => s.items);
  const pasteOpen = useImport((s) => s.pasteOpen);
  const notice = useImport((s) => s.notice);
  const busy = useImport((s) => s.busy);
  const { addFiles, changeSettings, removeItem, cancelAll, confirm } = useImport.getState();
  const dragging = useWindowDrop((files) => void addFiles(files));
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

  const parsing = items.filter((it) => it.status === "parsing");
  const totalBytes = parsing.reduce((n, it) => n + Math.max(1, it.sizeBytes), 0);
  const overall =
    parsing.length === 0 ? 1 : parsing.reduce((n, it) => n + it.progress * Math.max(1, it.sizeBytes), 0) / totalBytes;
  const readyCount = items.filter(importable).length;
  const rejectedTotal = items.filter(importable).reduce((n, it) => n + (it.result?.rejectedCount ?? 0), 0);
  const curvesWord = readyCount + parsing.length > 1 ? `${readyCount + parsing.length} curves` : "curve";

  return (
    <>
      {dragging ? (
        <div className="ax-drop-overlay" aria-hidden="true">
          <div>Drop CSV files to import them as curves, or an axband project or exported SVG to open it.</div>
        </div>
      ) : null}
      {open ? (
        <div className="ax-modal-backdrop">
          <div className="ax-modal ax-panel" role="dialog" aria-modal="true" aria-labelledby={titleId}>
            <header className="ax-modal-head">
              <h2 id={titleId}>Import curves</h2>
              <span className="ax-hint">up to {formatBytes(MAX_IMPORT_BYTES)} per file</span>
            </header>
            <div className="ax-modal-body">
              {pasteOpen ? <PasteBox /> : null}
              {items.map((it) => (
                <ItemCard
                  key={it.key}
                  item={it}
                  onChange={(p) => changeSettings(it.key, p)}
                  onRemove={() => removeItem(it.key)}
                />
              ))}
            </div>
            <footer className="ax-modal-foot">
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
                    Reading {parsing.length === 1 ? "1 file" : `${parsing.length} files`} · {Math.round(overall * 100)}{" "}
                    %
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
            </footer>
          </div>
        </div>
      ) : null}
    </>
  );
}

function unitNote(source: string | undefined): string {
  return source === "header" ? " (from the header)" : source === "default" ? " (assumed)" : "";
}

function ItemCard({
  item,
  onChange,
  onRemove,
}: {
  item: ImportItem;
  onChange: (p: Partial<ImportSettings>) => void;
  onRemove: () => void;
}) {
  const s = item.settings;
  const r = item.result;
  const rej = r ? rejectionLines(item.fileName, r) : { lines: [], more: 0 };
  const header = r?.header ?? null;
  const columns = Math.max(2, r?.columnCount ?? 2);
  const columnChoices = Array.from({ length: columns }, (_, i) => ({
    value: i + 1,
    label: `column ${i + 1}${header?.[i] ? ` · ${header[i]}` : ""}`,
  }));
  const preview = r ? r.preview.slice(0, 6) : [];
  const canEdit = r !== null && !(r.fatal && r.fatal.code !== "single-column" && r.fatal.code !== "no-data");
  // The parser's own sentences about delimiter, units, unreadable rows and values ≤ 0 are shown above in
  // the step's own words; any other warning (e.g. a guess it made) is passed on as it is.
  const notes = r
    ? r.messages.filter((m) => m.level === "warning" && !/cannot be read|could not be read|≤ 0|<= 0/.test(m.text))
    : [];

  return (
    <article className="ax-import-item" data-testid="import-item" aria-label={`Import ${item.fileName}`}>
      <header className="ax-import-item-head">
        <strong>{item.fileName}</strong>
        <span className="ax-hint">{formatBytes(item.sizeBytes)}</span>
        {item.status === "parsing" ? (
          <span className="ax-hint">reading… {Math.round(item.progress * 100)} %</span>
        ) : null}
        <button
          type="button"
          className="icon danger ax-small"
          aria-label={`Leave out ${item.fileName}`}
          onClick={onRemove}
        >
          ×
        </button>
      </header>
      {item.problem ? (
        <p className="ax-import-problem" role="alert">
          {item.problem}
        </p>
      ) : null}
      {preview.length > 0 || header ? (
        <table className="ax-preview" aria-label={`First rows of ${item.fileName}`}>
          <tbody>
            {header && r?.headerRow ? (
              <tr className="ax-preview-header">
                <th scope="row">{r.headerRow}</th>
                {header.slice(0, 6).map((c, i) => (
                  <td key={i}>{c}</td>
                ))}
              </tr>
            ) : null}
            {preview.map((row) => (
              <tr key={row.row} className={row.problem ? "ax-preview-bad" : undefined} title={row.problem ?? undefined}>
                <th scope="row">{row.row}</th>
                {row.fields.slice(0, 6).map((c, i) => (
                  <td
                    key={i}
                    className={i + 1 === s.massColumn || i + 1 === s.couplingColumn ? "ax-preview-used" : undefined}
                  >
                    {c}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      {r && canEdit ? (
        <>
          <p className="ax-import-detected" data-testid="import-detected">
            Delimiter: <b>{delimiterName(r.delimiter)}</b>
            {s.delimiter === "auto" ? " (detected)" : " (chosen)"}
            {r.decimalComma ? ", decimal comma" : ""} · Header: {header ? <b>{header.join(" | ")}</b> : "none"} · Mass:{" "}
            <b>{MASS_UNIT_OPTIONS.find((u) => u.value === r.massUnit)?.label ?? r.massUnit}</b>
            {unitNote(r.massUnitSource)} · Coupling:{" "}
            <b>{COUPLING_UNIT_OPTIONS.find((u) => u.value === r.couplingUnit)?.label ?? r.couplingUnit}</b>
            {unitNote(r.couplingUnitSource)} · <b>{r.massEv.length.toLocaleString("en")}</b> points
          </p>
          <div className="ax-import-settings">
            <ChoiceField
              label="Delimiter"
              value={s.delimiter}
              choices={DELIMITERS}
              onChange={(v) => onChange({ delimiter: v })}
            />
            <ChoiceField
              label="Mass unit"
              value={s.massUnit ?? r.massUnit}
              choices={MASS_UNIT_OPTIONS}
              onChange={(v) => onChange({ massUnit: v as ImportSettings["massUnit"] })}
            />
            <ChoiceField
              label="Coupling"
              value={s.couplingUnit ?? r.couplingUnit}
              choices={COUPLING_UNIT_OPTIONS}
              onChange={(v) => onChange({ couplingUnit: v as ImportSettings["couplingUnit"] })}
            />
            {(s.couplingUnit ?? r.couplingUnit) === "model-line" ? (
              <label className="ax-field">
                <span>of the line E/N =</span>
                <input
                  type="text"
                  size={6}
                  aria-label="E/N of the model line"
                  value={s.modelEOverN}
                  onChange={(e) => onChange({ modelEOverN: e.target.value })}
                />
              </label>
            ) : null}
            <label className="ax-check">
              <input
                type="checkbox"
                checked={s.log10Mass}
                onChange={(e) => onChange({ log10Mass: e.target.checked })}
              />
              mass as log10
            </label>
            <label className="ax-check">
              <input
                type="checkbox"
                checked={s.log10Coupling}
                onChange={(e) => onChange({ log10Coupling: e.target.checked })}
              />
              coupling as log10
            </label>
          </div>
          {columns > 2 ? (
            <div className="ax-import-settings">
              <ChoiceField
                label="Mass from"
                value={s.massColumn ?? r.massColumn}
                choices={columnChoices}
                onChange={(v) => onChange({ massColumn: Number(v) })}
              />
              <ChoiceField
                label="Coupling from"
                value={s.couplingColumn ?? r.couplingColumn}
                choices={columnChoices}
                onChange={(v) => onChange({ couplingColumn: Number(v) })}
              />
            </div>
          ) : null}
          <div className="ax-import-settings">
            <label className="ax-field">
              <span>Label</span>
              <input
                type="text"
                aria-label="Label"
                value={s.label}
                onChange={(e) => onChange({ label: e.target.value })}
              />
            </label>
            <label className="ax-field">
              <span>Role</span>
              <select
                aria-label="Role"
                value={s.role}
                onChange={(e) => onChange({ role: e.target.value as CurveRole })}
              >
                {ROLES.map((ro) => (
                  <option key={ro.value} value={ro.value}>
                    {ro.label}
                  </option>
                ))}
              </select>
            </label>
            <label
              className="ax-check"
              title="Regions always keep the file order (the contour is closed in that order)."
            >
              <input
                type="checkbox"
                checked={!s.keepOrder}
                disabled={s.role === "region"}
                onChange={(e) => onChange({ keepOrder: !e.target.checked })}
              />
              sort by mass
            </label>
          </div>
          <label className="ax-field ax-citation">
            <span>Citation</span>
            <textarea
              rows={2}
              aria-label="Citation"
              placeholder="Publication the data came from: free text or a BibTeX entry"
              value={s.citation}
              onChange={(e) => onChange({ citation: e.target.value })}
            />
          </label>
        </>
      ) : null}
      {r && r.massEv.length > 0 ? (
        <p className="ax-hint" data-testid="import-first-point">
          First point read: m_a = {r.massEv[0].toExponential(3)} eV, g_aγγ = {r.gInvGeV[0].toExponential(3)} GeV⁻¹
        </p>
      ) : null}
      {notes.length > 0 ? (
        <ul className="ax-import-notes">
          {notes.map((m, i) => (
            <li key={i} className={m.level === "warning" ? "ax-import-warn" : "ax-hint"}>
              {m.text}
            </li>
          ))}
        </ul>
      ) : null}
      {r && r.nonPositive > 0 ? (
        <p className="ax-import-warn" data-testid="import-nonpositive">
          {r.nonPositive.toLocaleString("en")} row{r.nonPositive === 1 ? " has" : "s have"} a value ≤ 0: kept in the
          data, but not drawn on the log axes
          {r.nonPositiveRows.length > 0
            ? ` (rows ${r.nonPositiveRows.slice(0, 5).join(", ")}${r.nonPositive > 5 ? ", …" : ""})`
            : ""}
          .
        </p>
      ) : null}
      {rej.lines.length > 0 ? (
        <div className="ax-import-rejected" data-testid="import-rejected">
          <p>
            {r?.rejectedCount.toLocaleString("en")} row{r?.rejectedCount === 1 ? "" : "s"} could not be read. Import
            skips {r?.rejectedCount === 1 ? "it" : "them"}; Cancel imports nothing.
          </p>
          <pre>{rej.lines.join("\n") + (rej.more > 0 ? `\n… and ${rej.more.toLocaleString("en")} more` : "")}</pre>
        </div>
      ) : null}
    </article>
  );
}
