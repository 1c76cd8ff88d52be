// The import step: files from the picker, dropped on the page, or pasted text become curves. Each source is
// looked at (first rows, delimiter, header, units), parsed in the Web Worker with a progress bar, and shown
// with its settings and unreadable rows; one click on "Import" adds every ready source as a curve.
// Dropped project files and exported SVG figures reopen the project instead.
import { useCallback, useEffect, useId, useRef, useState } from "react";
import type { Curve, CurveRole } from "../../data/types";
import { delimiterName, labelFromFileName, MAX_IMPORT_BYTES, newCurve, type CurveParseResult } from "../../data";
import { useAxband } from "../store";
import { startParse, type ParseJob } from "./parse-runner";
import {
  DELIMITERS,
  formatBytes,
  importable,
  initialSettings,
  PARSE_KEYS,
  parseOptsOf,
  problemOf,
  rejectionLines,
  settingsAfterParse,
  type ImportItem,
  type ImportSettings,
} from "./import-items";
import { COUPLING_UNIT_OPTIONS, MASS_UNIT_OPTIONS } from "./unit-options";
import { useWindowDrop } from "./useWindowDrop";
import { isProjectFileName, openProjectFile } from "../share/open-project";
import { ROLES } from "../curves/CurvesPanel";
import "../curves/curves.css";
import "./importer.css";

let keyCounter = 0;
const nextKey = () => `imp-${++keyCounter}`;

function isAbort(e: unknown): boolean {
  return e instanceof DOMException ? e.name === "AbortError" : e instanceof Error && /cancel|abort/i.test(e.message);
}

/** Opens dropped or picked project files (reopen the project) and returns the rest (curve data). */
function useProjectOpener() {
  const replaceProject = useAxband((s) => s.replaceProject);
  const pushMessage = useAxband((s) => s.pushMessage);
  return useCallback(
    async (files: File[]): Promise<File[]> => {
      const projectFiles = files.filter((f) => isProjectFileName(f.name));
      const rest = files.filter((f) => !isProjectFileName(f.name));
      // Only one project can be open: the last one wins, the others are mentioned.
      for (const f of projectFiles) {
        const r = await openProjectFile(f);
        if (r.ok) replaceProject(r.project, r.message);
        else pushMessage("alert", r.error);
      }
      return rest;
    },
    [replaceProject, pushMessage],
  );
}

/** The import controls (file input, paste box, page-wide drop) and the import step. */
export function ImportDialog() {
  const physics = useAxband((s) => s.project.physics);
  const addCurves = useAxband((s) => s.addCurves);
  const pushMessage = useAxband((s) => s.pushMessage);
  const openProjects = useProjectOpener();
  const [items, setItems] = useState<ImportItem[]>([]);
  const [pasteOpen, setPasteOpen] = useState(false);
  const [pasteText, setPasteText] = useState("");
  const [notice, setNotice] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const itemsRef = useRef(items);
  const jobs = useRef(new Map<string, { id: number; job: ParseJob }>());
  const jobCounter = useRef(0);
  const physicsRef = useRef(physics);
  const fileInput = useRef<HTMLInputElement>(null);
  const pasteId = useId();

  useEffect(() => {
    itemsRef.current = items;
    physicsRef.current = physics;
  });

  const patchItem = useCallback((key: string, patch: Partial<ImportItem> | ((it: ImportItem) => Partial<ImportItem>)) => {
    setItems((list) => list.map((it) => (it.key === key ? { ...it, ...(typeof patch === "function" ? patch(it) : patch) } : it)));
  }, []);

  const runParse = useCallback(
    (item: ImportItem) => {
      jobs.current.get(item.key)?.job.cancel();
      const id = ++jobCounter.current;
      const job = startParse(item.source, parseOptsOf(item, physicsRef.current), (fraction) => {
        if (jobs.current.get(item.key)?.id === id) patchItem(item.key, { progress: fraction });
      });
      jobs.current.set(item.key, { id, job });
      patchItem(item.key, { status: "parsing", progress: 0 });
      job.promise.then(
        (result: CurveParseResult) => {
          if (jobs.current.get(item.key)?.id !== id) return;
          jobs.current.delete(item.key);
          patchItem(item.key, (it) => ({
            status: "ready",
            progress: 1,
            result,
            settings: settingsAfterParse(it.settings, result),
            problem: problemOf(it.fileName, result),
          }));
        },
        (e: unknown) => {
          if (jobs.current.get(item.key)?.id !== id) return;
          jobs.current.delete(item.key);
          if (isAbort(e)) return;
          patchItem(item.key, { status: "failed", problem: `${item.fileName} could not be read: ${e instanceof Error ? e.message : String(e)}` });
        },
      );
    },
    [patchItem],
  );

  const addSources = useCallback(
    (sources: { name: string; blob: Blob; label?: string }[]) => {
      setNotice(null);
      for (const src of sources) {
        const item: ImportItem = {
          key: nextKey(),
          fileName: src.name,
          source: src.blob,
          sizeBytes: src.blob.size,
          problem: null,
          settings: initialSettings(src.label ?? labelFromFileName(src.name)),
          labelEdited: false,
          status: "parsing",
          progress: 0,
          result: null,
        };
        setItems((list) => [...list, item]);
        runParse(item);
      }
    },
    [runParse],
  );

  const addFiles = useCallback(
    async (files: File[]) => {
      const rest = await openProjects(files);
      if (rest.length > 0) addSources(rest.map((f) => ({ name: f.name, blob: f })));
    },
    [openProjects, addSources],
  );

  const dragging = useWindowDrop((files) => void addFiles(files));

  const changeSettings = (item: ImportItem, patch: Partial<ImportSettings>) => {
    const settings = { ...item.settings, ...patch };
    if (patch.role === "region") settings.keepOrder = true;
    const next: ImportItem = { ...item, settings, labelEdited: item.labelEdited || "label" in patch };
    patchItem(item.key, { settings, labelEdited: next.labelEdited });
    if (PARSE_KEYS.some((k) => k in patch && patch[k] !== item.settings[k])) runParse(next);
  };

  const removeItem = (key: string) => {
    jobs.current.get(key)?.job.cancel();
    jobs.current.delete(key);
    setItems((list) => list.filter((it) => it.key !== key));
  };

  const cancelAll = () => {
    for (const { job } of jobs.current.values()) job.cancel();
    jobs.current.clear();
    setItems([]);
    setNotice(null);
    setBusy(false);
  };

  const confirm = async () => {
    setBusy(true);
    const unseen = itemsRef.current.some((it) => it.status === "parsing");
    // Wait for parses still running; their results arrive through state, read back from the ref.
    await Promise.allSettled([...jobs.current.values()].map((j) => j.job.promise));
    await new Promise((r) => setTimeout(r, 0));
    const list = itemsRef.current;
    const ready = list.filter(importable);
    const rejectedTotal = ready.reduce((n, it) => n + (it.result?.rejectedCount ?? 0), 0);
    if (unseen && rejectedTotal > 0) {
      setBusy(false);
      setNotice(`Some rows could not be read (listed below). Import again to skip them, or cancel.`);
      return;
    }
    if (ready.length === 0) {
      setBusy(false);
      setNotice("Nothing to import: every source has a problem (see above).");
      return;
    }
    const existing = useAxband.getState().project.curves;
    const context: { curves: Pick<Curve, "colour">[] } = { curves: [...existing] };
    const curves: Curve[] = [];
    for (const it of ready) {
      const r = it.result as CurveParseResult;
      const s = it.settings;
      const curve = newCurve(
        {
          label: s.label.trim() || labelFromFileName(it.fileName),
          role: s.role,
          massEv: r.massEv,
          gInvGeV: r.gInvGeV,
          keepOrder: s.role === "region" ? true : s.keepOrder,
          citation: s.citation.trim(),
          fileName: it.fileName,
        },
        context,
      );
      context.curves.push(curve);
      curves.push(curve);
    }
    addCurves(curves);
    const nonPositive = ready.reduce((n, it) => n + (it.result?.nonPositive ?? 0), 0);
    const parts = [`Imported ${curves.length} curve${curves.length === 1 ? "" : "s"}: ${curves.map((c) => c.label).join(", ")}.`];
    if (rejectedTotal > 0) parts.push(`${rejectedTotal} unreadable row${rejectedTotal === 1 ? "" : "s"} skipped.`);
    if (nonPositive > 0) parts.push(`${nonPositive} value${nonPositive === 1 ? "" : "s"} ≤ 0 cannot be shown on the log axes.`);
    const skipped = list.length - ready.length;
    if (skipped > 0) parts.push(`${skipped} source${skipped === 1 ? "" : "s"} not imported.`);
    pushMessage("status", parts.join(" "));
    jobs.current.clear();
    setItems([]);
    setNotice(null);
    setBusy(false);
  };

  useEffect(
    () => () => {
      for (const { job } of jobs.current.values()) job.cancel();
    },
    [],
  );

  const parsing = items.filter((it) => it.status === "parsing");
  const totalBytes = parsing.reduce((n, it) => n + Math.max(1, it.sizeBytes), 0);
  const overall = parsing.length === 0 ? 1 : parsing.reduce((n, it) => n + it.progress * Math.max(1, it.sizeBytes), 0) / totalBytes;
  const readyCount = items.filter(importable).length;
  const rejectedTotal = items.filter(importable).reduce((n, it) => n + (it.result?.rejectedCount ?? 0), 0);

  return (
    <section className="ax-panel ax-import" aria-labelledby="ax-import-title">
      <h2 id="ax-import-title">Import curves</h2>
      <div className="ax-import-bar">
        <label className="ax-button-like">
          Choose files…
          <input
            ref={fileInput}
            className="ax-visually-hidden"
            type="file"
            multiple
            data-testid="import-files"
            accept=".csv,.tsv,.txt,.dat,.tab,.svg,.json,text/csv,text/plain,text/tab-separated-values"
            onChange={(e) => {
              const files = Array.from(e.currentTarget.files ?? []);
              e.currentTarget.value = "";
              if (files.length > 0) void addFiles(files);
            }}
          />
        </label>
        <button type="button" aria-expanded={pasteOpen} onClick={() => setPasteOpen((o) => !o)}>
          Paste data
        </button>
        <span className="ax-hint">or drop files anywhere on the page · up to {formatBytes(MAX_IMPORT_BYTES)} per file</span>
      </div>
      {pasteOpen ? (
        <div className="ax-paste">
          <label htmlFor={pasteId}>Paste data</label>
          <textarea
            id={pasteId}
            rows={5}
            spellCheck={false}
            placeholder={"m_a [ueV], g [1/GeV]\n1.0, 3e-14\n2.0, 2.5e-14"}
            value={pasteText}
            onChange={(e) => setPasteText(e.target.value)}
          />
          <div>
            <button
              type="button"
              disabled={pasteText.trim() === ""}
              onClick={() => {
                addSources([{ name: "paste", blob: new Blob([pasteText], { type: "text/plain" }), label: "Pasted data" }]);
                setPasteText("");
                setPasteOpen(false);
              }}
            >
              Preview pasted data
            </button>
          </div>
        </div>
      ) : null}
      {dragging ? (
        <div className="ax-drop-overlay" aria-hidden="true">
          <div>Drop CSV files to import them as curves, or an axband project / exported SVG to open it.</div>
        </div>
      ) : null}
      {items.length > 0 ? (
        <div className="ax-import-step" role="group" aria-label="Import step">
          {items.map((it) => (
            <ItemCard key={it.key} item={it} onChange={(p) => changeSettings(it, p)} onRemove={() => removeItem(it.key)} />
          ))}
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
                Reading {parsing.length} file{parsing.length === 1 ? "" : "s"} · {Math.round(overall * 100)} %
              </span>
            </div>
          ) : null}
          {notice ? (
            <p className="ax-import-notice" role="alert">
              {notice}
            </p>
          ) : null}
          <div className="ax-import-actions">
            <button type="button" className="ax-primary" data-testid="import-confirm" disabled={busy || (readyCount === 0 && parsing.length === 0)} onClick={() => void confirm()}>
              {busy
                ? "Importing…"
                : `Import ${readyCount > 1 || parsing.length > 0 ? `${readyCount + parsing.length} curves` : "curve"}${rejectedTotal > 0 ? `, skipping ${rejectedTotal} unreadable row${rejectedTotal === 1 ? "" : "s"}` : ""}`}
            </button>
            <button type="button" onClick={cancelAll}>
              Cancel
            </button>
          </div>
        </div>
      ) : null}
    </section>
  );
}

function unitNote(source: string | undefined): string {
  return source === "header" ? " (from the header)" : source === "default" ? " (assumed)" : "";
}

function ItemCard({ item, onChange, onRemove }: { item: ImportItem; onChange: (p: Partial<ImportSettings>) => void; onRemove: () => void }) {
  const s = item.settings;
  const r = item.result;
  const rej = r ? rejectionLines(item.fileName, r) : { lines: [], more: 0 };
  const header = r?.header ?? null;
  const columns = Math.max(2, r?.columnCount ?? 2);
  const columnChoices = Array.from({ length: columns }, (_, i) => i + 1);
  const preview = r ? r.preview.slice(0, 6) : [];
  const canEdit = r !== null && !(r.fatal && r.fatal.code !== "single-column" && r.fatal.code !== "no-data");
  const notes = r ? r.messages.filter((m) => m.level !== "error") : [];
  const columnLabel = (c: number) => `column ${c}${header?.[c - 1] ? ` · ${header[c - 1]}` : ""}`;

  return (
    <article className="ax-import-item" data-testid="import-item" aria-label={`Import ${item.fileName}`}>
      <header className="ax-import-item-head">
        <strong>{item.fileName}</strong>
        <span className="ax-hint">{formatBytes(item.sizeBytes)}</span>
        {item.status === "parsing" ? <span className="ax-hint">reading… {Math.round(item.progress * 100)} %</span> : null}
        <button type="button" className="ax-danger ax-small" aria-label={`Leave out ${item.fileName}`} onClick={onRemove}>
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
                  <td key={i} className={i + 1 === s.massColumn || i + 1 === s.couplingColumn ? "ax-preview-used" : undefined}>
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
            {unitNote(r.massUnitSource)} · Coupling: <b>{COUPLING_UNIT_OPTIONS.find((u) => u.value === r.couplingUnit)?.label ?? r.couplingUnit}</b>
            {unitNote(r.couplingUnitSource)} · <b>{r.massEv.length.toLocaleString("en")}</b> points
          </p>
          <div className="ax-import-settings">
            <label className="ax-field">
              <span>Delimiter</span>
              <select value={s.delimiter} onChange={(e) => onChange({ delimiter: e.target.value })}>
                {DELIMITERS.map((d) => (
                  <option key={d.label} value={d.value}>
                    {d.label}
                  </option>
                ))}
              </select>
            </label>
            <label className="ax-field">
              <span>Mass unit</span>
              <select value={s.massUnit ?? r.massUnit} onChange={(e) => onChange({ massUnit: e.target.value as ImportSettings["massUnit"] })}>
                {MASS_UNIT_OPTIONS.map((u) => (
                  <option key={u.value} value={u.value}>
                    {u.label}
                  </option>
                ))}
              </select>
            </label>
            <label className="ax-field">
              <span>Coupling</span>
              <select
                value={s.couplingUnit ?? r.couplingUnit}
                onChange={(e) => onChange({ couplingUnit: e.target.value as ImportSettings["couplingUnit"] })}
              >
                {COUPLING_UNIT_OPTIONS.map((u) => (
                  <option key={u.value} value={u.value}>
                    {u.label}
                  </option>
                ))}
              </select>
            </label>
            {(s.couplingUnit ?? r.couplingUnit) === "model-line" ? (
              <label className="ax-field">
                <span>of the line E/N =</span>
                <input type="text" size={6} aria-label="E/N of the model line" value={s.modelEOverN} onChange={(e) => onChange({ modelEOverN: e.target.value })} />
              </label>
            ) : null}
            <label className="ax-check">
              <input type="checkbox" checked={s.log10Mass} onChange={(e) => onChange({ log10Mass: e.target.checked })} />
              mass as log10
            </label>
            <label className="ax-check">
              <input type="checkbox" checked={s.log10Coupling} onChange={(e) => onChange({ log10Coupling: e.target.checked })} />
              coupling as log10
            </label>
          </div>
          {columns > 2 ? (
            <div className="ax-import-settings">
              <label className="ax-field">
                <span>Mass from</span>
                <select value={s.massColumn ?? r.massColumn} onChange={(e) => onChange({ massColumn: Number(e.target.value) })}>
                  {columnChoices.map((c) => (
                    <option key={c} value={c}>
                      {columnLabel(c)}
                    </option>
                  ))}
                </select>
              </label>
              <label className="ax-field">
                <span>Coupling from</span>
                <select value={s.couplingColumn ?? r.couplingColumn} onChange={(e) => onChange({ couplingColumn: Number(e.target.value) })}>
                  {columnChoices.map((c) => (
                    <option key={c} value={c}>
                      {columnLabel(c)}
                    </option>
                  ))}
                </select>
              </label>
            </div>
          ) : null}
          <div className="ax-import-settings">
            <label className="ax-field">
              <span>Label</span>
              <input type="text" aria-label="Label" value={s.label} onChange={(e) => onChange({ label: e.target.value })} />
            </label>
            <label className="ax-field">
              <span>Role</span>
              <select aria-label="Role" value={s.role} onChange={(e) => onChange({ role: e.target.value as CurveRole })}>
                {ROLES.map((ro) => (
                  <option key={ro.value} value={ro.value}>
                    {ro.label}
                  </option>
                ))}
              </select>
            </label>
            <label className="ax-check" title="Regions always keep the file order (the contour is closed in that order).">
              <input type="checkbox" checked={!s.keepOrder} disabled={s.role === "region"} onChange={(e) => onChange({ keepOrder: !e.target.checked })} />
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
          {r.nonPositive.toLocaleString("en")} row{r.nonPositive === 1 ? " has" : "s have"} a value ≤ 0: kept in the data, but not drawn on the log axes
          {r.nonPositiveRows.length > 0 ? ` (rows ${r.nonPositiveRows.slice(0, 5).join(", ")}${r.nonPositive > 5 ? ", …" : ""})` : ""}.
        </p>
      ) : null}
      {rej.lines.length > 0 ? (
        <div className="ax-import-rejected" data-testid="import-rejected">
          <p>
            {r?.rejectedCount.toLocaleString("en")} row{r?.rejectedCount === 1 ? "" : "s"} could not be read. Import skips {r?.rejectedCount === 1 ? "it" : "them"}; Cancel
            imports nothing.
          </p>
          <pre>{rej.lines.join("\n") + (rej.more > 0 ? `\n… and ${rej.more.toLocaleString("en")} more` : "")}</pre>
        </div>
      ) : null}
    </article>
  );
}
